import { describe, expect, it } from "vitest";
import { catalog, compute, parseComputeInput } from "../hydrology";
import { surfaceValuesSchema } from "../schemas/catalog";
import { assembleSheet, rowProblems, type SheetFrame } from "./assemble";
import { buildRows, resolveHsg, type RowSource, type SurfaceParams } from "./rows";
import { sheetTable } from "./table";

function published(id: string): SurfaceParams {
  const cls = catalog.SURFACE_CLASSES.find((c) => c.id === id);
  if (!cls) throw new Error(`no published class ${id}`);
  const sourced = <V>(f: { value: V | null; source: string }) =>
    f.value === null ? null : { value: f.value, source: f.source, note: "", rowId: null };
  const vk = sourced(cls.velocityK);
  const sk = sourced(cls.shallowFlowK);
  return {
    id: `id-${id}`,
    key: id,
    name: cls.name,
    values: surfaceValuesSchema.parse({
      sheetFlowN: sourced(cls.sheetFlowN),
      velocityKFtPerS: vk && { ...vk, value: vk.value.kFtPerS },
      shallowKFtPerS: sk && { ...sk, value: sk.value.kFtPerS },
      kerbyN: sourced(cls.kerbyN),
      cn: { ...cls.curveNumber.value, source: cls.curveNumber.source },
      runoffC: null,
    }),
  };
}

const lawn = published("lawn-good");
const classes = new Map([[lawn.id, lawn]]);

const source = (over: Partial<RowSource>): RowSource => ({
  stationFromM: 0,
  stationToM: 30,
  lengthM: 30,
  regime: "sheet",
  surfaceClassId: lawn.id,
  hsg: "B",
  elevationUpM: 101,
  elevationDownM: 100,
  elevationSource: "terrain",
  slope: 1 / 30,
  slopeProblem: null,
  ...over,
});

describe("soil groups", () => {
  it("takes the first letter of a dual group when drained and D when not (NEH 630 Ch 7, 2009 [from memory])", () => {
    expect(resolveHsg("B/D", "drained")).toBe("B");
    expect(resolveHsg("B/D", "undrained")).toBe("D");
    expect(resolveHsg("C", "undrained")).toBe("C");
    expect(resolveHsg(null, "drained")).toBeNull();
  });
});

describe("segment rows", () => {
  it("reads n, k and CN of the row's class and soil group, k in m/s for SI", () => {
    const { rows, segments } = buildRows([source({})], {
      units: "si",
      classes,
      dualHsg: "drained",
      channel: null,
    });
    const row = rows[0];
    expect(row?.n).toBe(lawn.values.sheetFlowN?.value);
    expect(row?.cn).toBe(lawn.values.cn.B);
    // 1 ft = 0.3048 m exactly (international foot).
    expect(row?.k).toBeCloseTo((lawn.values.velocityKFtPerS?.value ?? 0) * 0.3048, 12);
    expect(segments?.[0]).toMatchObject({ regime: "sheet", length: 30, slope: 1 / 30 });
  });

  it("makes an adverse slope an error on its row and gives the core nothing to compute", () => {
    const { rows, segments } = buildRows(
      [
        source({}),
        source({
          stationFromM: 30,
          stationToM: 60,
          regime: "shallow",
          slope: null,
          slopeProblem: "adverse-slope",
        }),
      ],
      { units: "si", classes, dualHsg: "drained", channel: null },
    );
    expect(segments).toBeNull();
    expect(rows[1]?.error).toMatch(/adverse slope/);
    expect(rowProblems(rows)).toEqual([expect.stringMatching(/^Segment 2 \(shallow\): /)]);
  });

  it("asks for the subcatchment's channel fields when channel flow has none", () => {
    const { rows } = buildRows([source({ regime: "channel" })], {
      units: "us",
      classes,
      dualHsg: "drained",
      channel: null,
    });
    expect(rows[0]?.error).toMatch(/channel Manning's n and section/);
  });

  it("marks a stretch outside every cover polygon as unmapped, an error where n or k is needed", () => {
    const { rows } = buildRows([source({ surfaceClassId: null })], {
      units: "us",
      classes,
      dualHsg: "drained",
      channel: null,
    });
    expect(rows[0]?.surfaceClassName).toBeNull();
    expect(rows[0]?.error).toMatch(/No mapped surface class/);
  });

  it("says where each row's class came from, the cover layer unless the engineer overrode it", () => {
    const { rows } = buildRows(
      [source({}), source({ stationFromM: 30, stationToM: 60, surfaceSource: "override" })],
      { units: "us", classes, dualHsg: "drained", channel: null },
    );
    expect(rows.map((r) => r.surfaceSource)).toEqual(["cover-layer", "override"]);
    // An overridden row reads the overriding class's published values like any other row.
    expect(rows[1]?.n).toBe(lawn.values.sheetFlowN?.value);
  });
});

describe("sheet assembly", () => {
  const frame: SheetFrame = {
    project: { id: "p", name: "Invented" },
    subcatchment: { id: "s", name: "A", scenario: "existing" },
    flowPathVersion: 1,
    computedAt: "2026-12-02T00:00:00.000Z",
    units: "si",
    unitLabels: { length: "m", velocity: "m/s" },
    returnPeriodYears: 10,
    totalLength: 90,
    reversed: false,
    breaks: {
      sheetEnd: 30,
      sheetEndSource: "design-rule",
      channelStart: null,
      channelStartSource: "none",
    },
    figures: { area: null, cn: null, c: null, avgSlopePercent: null, notes: [] },
    profile: [],
    rainfall: null,
    split: { pieces: [], coverFeatureIds: [], soilFeatureIds: [] },
  };
  const built = buildRows(
    [
      source({}),
      source({ stationFromM: 30, stationToM: 90, lengthM: 60, regime: "shallow", slope: 0.02 }),
    ],
    { units: "si", classes, dualHsg: "drained", channel: null },
  );
  // Invented IDF (mm/h) for the assembly only; the core's own tests hold the published checks.
  const result = compute(
    parseComputeInput({
      units: "si",
      returnPeriodYears: 10,
      rainfall: {
        p2_24h: 75,
        idf: { durationsMin: [5, 60], returnPeriodsYears: [10], intensity: [[150], [45]] },
      },
      segments: built.segments,
    }),
  );
  const sheet = assembleSheet(frame, built.rows, result, []);

  it("gives each row the core's time by each method, and the totals add up", () => {
    const segmental = result.methods["nrcs-segmental"];
    if (segmental.status !== "ok") throw new Error(segmental.reason);
    const sum = sheet.segments.reduce((s, r) => s + (r.timesMin["nrcs-segmental"] ?? 0), 0);
    expect(sum).toBeCloseTo(segmental.computedMin, 12);
    expect(sheet.governing?.method).toBe(result.governing.method);
    expect(sheet.segments[1]?.velocity).toBeGreaterThan(0);
  });

  it("lays the table out with a units row and a totals row per method column", () => {
    const t = sheetTable(sheet);
    expect(t.units[t.titles.indexOf("Length")]).toBe("m");
    expect(t.rows).toHaveLength(2);
    expect(t.totals[0]).toBe("Total");
    expect(t.totals[t.titles.indexOf("Length")]).toBe(90);
    expect(t.header.find((h) => h[0] === "Caution")?.[1]).toMatch(/engineer of record govern/);
  });

  it("prints each row's surface source in the exported table", () => {
    const t = sheetTable({
      ...sheet,
      segments: sheet.segments.map((r, i) => ({
        ...r,
        surfaceSource: i === 1 ? ("override" as const) : r.surfaceSource,
      })),
    });
    const col = t.titles.indexOf("Surface source");
    expect(t.rows.map((r) => r[col])).toEqual(["cover layer", "override"]);
  });

  it("prints a method's validity range beside a result outside it", () => {
    const outside = sheet.methods.find((m) => (m.validity?.outside.length ?? 0) > 0);
    expect(outside, "a 90 m path on a tiny site lies outside some method's range").toBeDefined();
    const row = sheetTable(sheet).methodRows.find((r) => r[0] === outside?.label);
    // The notes column follows Tc (min), Tc (h) and the P10, P50, P90 of the band.
    expect(row?.[7]).toContain(`outside its range (${outside?.validity?.range})`);
  });

  it("carries each method's band and the how-sure rows into the table; no lag column", () => {
    const input = parseComputeInput({
      units: "si",
      returnPeriodYears: 10,
      rainfall: {
        p2_24h: 75,
        idf: { durationsMin: [5, 60], returnPeriodsYears: [10], intensity: [[150], [45]] },
      },
      segments: built.segments,
    });
    const banded = assembleSheet(frame, built.rows, compute(input, { uncertainty: true }), []);
    const table = sheetTable(banded);
    const segmental = banded.methods.find((m) => m.id === "nrcs-segmental");
    const row = table.methodRows.find((r) => r[0] === segmental?.label);
    expect(row?.slice(4, 7)).toEqual([
      segmental?.band?.p10,
      segmental?.band?.p50,
      segmental?.band?.p90,
    ]);
    expect(table.howSure.find((r) => r[0] === "Governing Tc (min)")?.slice(1)).toEqual([
      banded.uncertainty?.monteCarlo.governingTcMin?.p10,
      banded.uncertainty?.monteCarlo.governingTcMin?.p50,
      banded.uncertainty?.monteCarlo.governingTcMin?.p90,
    ]);
    expect(table.columns.map((c) => c.key)).not.toContain("time:nrcs-lag");
    expect(banded.segments.every((r) => r.timesMin["nrcs-lag"] === undefined)).toBe(true);
  });

  it("reports every method unavailable, with the reason, when a row blocks", () => {
    const blocked = assembleSheet(frame, built.rows, null, ["Segment 2 (shallow): adverse slope"]);
    expect(
      blocked.methods.every((m) => m.status === "unavailable" && m.reason?.includes("adverse")),
    ).toBe(true);
    expect(blocked.governing).toBeNull();
  });
});
