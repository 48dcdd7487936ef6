import { describe, expect, it } from "vitest";
import { kinematicKUsFromSi } from "./kinematic-wave";
import { MANNING_K_US_EXACT } from "./manning";
import { RULE_DEFAULTS, resolveRules, rulesSchema, rulesUnitProblems } from "./rules";

describe("design rules", () => {
  it("applies the documented defaults", () => {
    const r = resolveRules(undefined, "us", 25);
    expect(r.minTcMin).toBe(RULE_DEFAULTS.minTcMin);
    expect(r.sheetCap).toMatchObject({ kind: "length", lengthFt: 100 });
    expect(r.kinematicK.us).toBe(0.938);
    expect(r.arc).toBe("II");
    expect(r.governing).toBe("nrcs-segmental");
    expect(r.frequencyFactor).toBe(true);
    expect(r.allowIdfExtrapolation).toBe(false);
    expect(r.manningConstant.us).toBe(1.49);
    expect([r.overlandSeries, r.sheetFlowSeries, r.sheetPastCap]).toEqual([
      "cascade",
      "cascade",
      "shallow",
    ]);
    expect([r.lagCn, r.lagUsesArc, r.rationalUsFactor.label, r.kirpichAdjustment]).toEqual([
      "watershed",
      false,
      "exact",
      "none",
    ]);
  });
  it("reads a number K and a cap length in the declared system", () => {
    const r = resolveRules({ kinematicWaveK: 6.943, sheetFlowMaxLength: 30.48 }, "si", 10);
    expect(r.kinematicK.us).toBeCloseTo(kinematicKUsFromSi(6.943), 15);
    expect(r.kinematicK.declared).toBe(6.943);
    expect(r.sheetCap).toMatchObject({ kind: "length" });
    if (r.sheetCap.kind === "length") expect(r.sheetCap.lengthFt).toBeCloseTo(100, 12);
  });
  it("converts an SI preset for a US case", () => {
    expect(resolveRules({ kinematicWaveK: "hec22-si" }, "us", 10).kinematicK.us).toBeCloseTo(
      0.9333,
      4,
    );
  });
  it("refuses a K outside half to one and a half times the theory value of the system", () => {
    expect(rulesUnitProblems({ kinematicWaveK: 6.99 }, "us")[0]?.message).toMatch(/SI units/);
    expect(rulesUnitProblems({ kinematicWaveK: 0.94 }, "si")[0]?.message).toMatch(/US units/);
    expect(rulesUnitProblems({ kinematicWaveK: 0.933 }, "us")).toEqual([]);
    expect(rulesUnitProblems({ kinematicWaveK: 6.943 }, "si")).toEqual([]);
  });
  it("refuses two keys for the same return period", () => {
    const r = rulesSchema.safeParse({ arcByReturnPeriod: { "25": "III", "25.0": "II" } });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(["arcByReturnPeriod", "25.0"]);
  });
  it("picks the ARC per return period (ARC III for rare storms: common practice)", () => {
    const rules = { arc: "II" as const, arcByReturnPeriod: { "100": "III" as const } };
    expect(resolveRules(rules, "us", 100).arc).toBe("III");
    expect(resolveRules(rules, "us", 10).arc).toBe("II");
  });
  it("offers the exact Manning constant", () => {
    expect(resolveRules({ manningConstant: "exact" }, "us", 2).manningConstant.us).toBe(
      MANNING_K_US_EXACT,
    );
  });
  it("refuses unknown keys and values", () => {
    expect(rulesSchema.safeParse({ governing: "steepest" }).success).toBe(false);
    expect(rulesSchema.safeParse({ minTc: 5 }).success).toBe(false);
  });
});
