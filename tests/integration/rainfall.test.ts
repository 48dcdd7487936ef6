import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { rainfallTables } from "../../server/db/schema-geodata";
import {
  createTeam,
  signIn,
  startTestApp,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";
import { freshProject } from "../support/route-table";

let t: TestApp;
let team: TestTeam;
let engineer: Agent;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "rainfall");
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
});
afterAll(() => t.close());

// Invented demo numbers (a table shaped like a real IDF table, not taken from any atlas).
const table = {
  durationsMin: [5, 10, 15, 30, 60, 120],
  returnPeriodsYears: [2, 10, 100],
  intensity: [
    [120, 165, 230],
    [95, 132, 185],
    [80, 112, 158],
    [55, 78, 110],
    [35, 50, 72],
    [21, 30, 44],
  ],
};

describe("Rainfall tables (JSON)", () => {
  it("stores a table in the project's units with its source note and answers its Sherman fit", async () => {
    const projectId = await freshProject(t.db, team.id);
    const res = await engineer.post(`/api/projects/${projectId}/rainfall-tables`).send({
      name: "Invented IDF",
      sourceNote: "Invented for a test",
      p2_24h: 60,
      idf: table,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ name: "Invented IDF", units: "si", p2_24h: 60 });
    expect(res.body.fit).toHaveLength(3);
    for (const fit of res.body.fit) {
      expect(fit.rSquared).toBeGreaterThan(0.95);
      expect(fit.maxRelativeError).toBeGreaterThanOrEqual(0);
    }
    const list = await engineer.get(`/api/projects/${projectId}/rainfall-tables`);
    expect(list.body.map((x: { id: string }) => x.id)).toEqual([res.body.id]);
  });

  it("stores Sherman formulas and answers no fit for them", async () => {
    const projectId = await freshProject(t.db, team.id);
    const res = await engineer.post(`/api/projects/${projectId}/rainfall-tables`).send({
      name: "Formulas",
      idf: { formula: { "10": { a: 1800, b: 12, c: 0.8 } } },
    });
    expect(res.status).toBe(201);
    expect(res.body.fit).toBeNull();
  });

  it("refuses an intensity rising with duration, naming the cell, and stores nothing", async () => {
    const projectId = await freshProject(t.db, team.id);
    const bad = structuredClone(table);
    bad.intensity[2] = [99, 140, 190];
    const res = await engineer
      .post(`/api/projects/${projectId}/rainfall-tables`)
      .send({ name: "Bad", idf: bad });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["idf.intensity.2.0"]).toMatch(/must not rise with duration/);
    const rows = await t.db
      .select()
      .from(rainfallTables)
      .where(eq(rainfallTables.projectId, projectId));
    expect(rows).toEqual([]);
  });

  it("renames, then deletes a table", async () => {
    const projectId = await freshProject(t.db, team.id);
    const made = await engineer
      .post(`/api/projects/${projectId}/rainfall-tables`)
      .send({ name: "First", idf: table });
    const patched = await engineer
      .patch(`/api/rainfall-tables/${made.body.id}`)
      .send({ name: "Second", sourceNote: "checked" });
    expect(patched.body).toMatchObject({ name: "Second", sourceNote: "checked" });
    expect((await engineer.delete(`/api/rainfall-tables/${made.body.id}`)).status).toBe(204);
    expect((await engineer.get(`/api/rainfall-tables/${made.body.id}`)).status).toBe(404);
  });
});

describe("Rainfall tables (CSV upload)", () => {
  const usProject = async () =>
    (
      await engineer
        .post(`/api/teams/${team.id}/projects`)
        .send({ name: "CSV rainfall", units: "us", designReturnPeriodYears: 10 })
    ).body.id as string;
  const fixture = (name: string) => path.join(import.meta.dirname, "../fixtures/geo", name);

  it("reads an invented IDF table from CSV into the project's units", async () => {
    const projectId = await usProject();
    const res = await engineer
      .post(`/api/projects/${projectId}/rainfall-tables/upload`)
      .field("name", "From CSV")
      .field("sourceNote", "Invented for tests")
      .field("kind", "intensity")
      .field("p2_24h", "3.1")
      .attach("file", fixture("rainfall.csv"));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ units: "us", p2_24h: 3.1, originalFilename: "rainfall.csv" });
    // The cells of tests/fixtures/geo/scenario.ts RAINFALL_CSV (invented).
    expect(res.body.idf.durationsMin).toEqual([5, 10, 15, 30, 60]);
    expect(res.body.idf.returnPeriodsYears).toEqual([2, 10, 25, 100]);
    expect(res.body.idf.intensity[0]).toEqual([4.9, 6.6, 7.6, 9.2]);
    expect(res.body.fit).toHaveLength(4);
  });

  it("refuses a CSV with a missing cell naming row and column, and stores nothing", async () => {
    const projectId = await usProject();
    const res = await engineer
      .post(`/api/projects/${projectId}/rainfall-tables/upload`)
      .field("name", "Broken")
      .field("kind", "intensity")
      .attach("file", fixture("rainfall-missing-cell.csv"));
    expect(res.status).toBe(422);
    // Row 5 of the file (the comment and the header are rows 1 and 2), the 10-year column.
    expect(res.body.error.message).toContain('rainfall-missing-cell.csv, row 5, column "10-yr"');
    const rows = await t.db
      .select()
      .from(rainfallTables)
      .where(eq(rainfallTables.projectId, projectId));
    expect(rows).toEqual([]);
  });
});
