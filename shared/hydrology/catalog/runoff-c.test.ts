import { describe, expect, it } from "vitest";
import { RUNOFF_C, runoffCRow } from "./runoff-c";

describe("HEC-22 Table 3-1 runoff coefficients [from memory]", () => {
  it.each(RUNOFF_C)("$id: 0 < low ≤ high ≤ 1 and the design value inside", (row) => {
    expect(row.cLow).toBeGreaterThan(0);
    expect(row.cLow).toBeLessThanOrEqual(row.cHigh);
    expect(row.cHigh).toBeLessThanOrEqual(1);
    expect(row.cDesign).toBeGreaterThanOrEqual(row.cLow);
    expect(row.cDesign).toBeLessThanOrEqual(row.cHigh);
  });

  it("design value is the mid-range (common practice), to 3 decimals", () => {
    for (const row of RUNOFF_C) expect(row.cDesign).toBeCloseTo((row.cLow + row.cHigh) / 2, 12);
    expect(runoffCRow("business-downtown").cDesign).toBe(0.825);
  });

  it("holds the ranges METHODS.md lists", () => {
    const range = (id: Parameters<typeof runoffCRow>[0]) => {
      const r = runoffCRow(id);
      return [r.cLow, r.cHigh];
    };
    expect(range("business-downtown")).toEqual([0.7, 0.95]);
    expect(range("residential-single-family")).toEqual([0.3, 0.5]);
    expect(range("parks-cemeteries")).toEqual([0.1, 0.25]);
    expect(range("lawn-heavy-average")).toEqual([0.18, 0.22]);
    expect(range("street-asphalt")).toEqual([0.7, 0.95]);
    expect(range("roofs")).toEqual([0.75, 0.95]);
  });

  it("lawn C rises with slope for each soil, and heavy soil exceeds sandy at equal slope", () => {
    // A property of the printed lawn rows: steeper and tighter soils shed more water.
    const lo = (id: Parameters<typeof runoffCRow>[0]) => runoffCRow(id).cLow;
    expect(lo("lawn-sandy-flat")).toBeLessThan(lo("lawn-sandy-average"));
    expect(lo("lawn-sandy-average")).toBeLessThan(lo("lawn-sandy-steep"));
    expect(lo("lawn-heavy-flat")).toBeLessThan(lo("lawn-heavy-average"));
    expect(lo("lawn-heavy-average")).toBeLessThan(lo("lawn-heavy-steep"));
    expect(lo("lawn-heavy-flat")).toBeGreaterThan(lo("lawn-sandy-flat"));
  });

  it("ids are unique and every row names its source and design basis", () => {
    expect(new Set(RUNOFF_C.map((r) => r.id)).size).toBe(RUNOFF_C.length);
    for (const row of RUNOFF_C) {
      expect(row.source).toContain("HEC-22");
      expect(row.designSource).toContain("common practice");
    }
  });
});
