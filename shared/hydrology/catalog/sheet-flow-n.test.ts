import { describe, expect, it } from "vitest";
import { SHEET_FLOW_N, sheetFlowNRow } from "./sheet-flow-n";

describe("TR-55 (1986) Table 3-1 sheet-flow Manning's n [from memory]", () => {
  it("holds the published values (as listed in METHODS.md)", () => {
    expect(Object.fromEntries(SHEET_FLOW_N.map((r) => [r.id, r.n]))).toEqual({
      smooth: 0.011,
      fallow: 0.05,
      "cultivated-residue-le-20": 0.06,
      "cultivated-residue-gt-20": 0.17,
      "grass-short-prairie": 0.15,
      "grass-dense": 0.24,
      "grass-bermuda": 0.41,
      "range-natural": 0.13,
      "woods-light-underbrush": 0.4,
      "woods-dense-underbrush": 0.8,
    });
  });

  it("every n lies in (0, 1), the range the input validation accepts", () => {
    for (const row of SHEET_FLOW_N) {
      expect(row.n).toBeGreaterThan(0);
      expect(row.n).toBeLessThan(1);
    }
  });

  it("rougher cover of the same kind has the larger n (order of the printed table)", () => {
    const n = (id: Parameters<typeof sheetFlowNRow>[0]) => sheetFlowNRow(id).n;
    expect(n("cultivated-residue-gt-20")).toBeGreaterThan(n("cultivated-residue-le-20"));
    expect(n("grass-dense")).toBeGreaterThan(n("grass-short-prairie"));
    expect(n("grass-bermuda")).toBeGreaterThan(n("grass-dense"));
    expect(n("woods-dense-underbrush")).toBeGreaterThan(n("woods-light-underbrush"));
    expect(Math.min(...SHEET_FLOW_N.map((r) => r.n))).toBe(n("smooth"));
  });

  it("ids are unique and every row names its source", () => {
    expect(new Set(SHEET_FLOW_N.map((r) => r.id)).size).toBe(SHEET_FLOW_N.length);
    for (const row of SHEET_FLOW_N) expect(row.source).toContain("TR-55 (1986) Table 3-1");
  });
});
