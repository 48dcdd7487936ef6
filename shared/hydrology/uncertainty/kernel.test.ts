/**
 * The lean evaluator gives compute()'s totals at the entered values, for random valid cases and
 * for every rule it mirrors (tolerance 1e-9 relative: the same equations in a different order of
 * additions; the kinematic solve starts from the same point and meets the same iterates).
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { toInternalCase } from "../case";
import { compute } from "../compute";
import { intensityCurve } from "../idf";
import { parseComputeInput } from "../input-schema";
import { METHOD_IDS } from "../method-ids";
import { fixture, relDiff, usCaseArb, type Json } from "../test-support/cases";
import { outputUnits } from "../units";
import { ENTERED, evaluate, kernelModel } from "./kernel";

function agree(raw: unknown): boolean {
  const input = parseComputeInput(raw);
  const result = compute(input);
  const kase = toInternalCase(input);
  const curve = intensityCurve(kase.idf, kase.returnPeriodYears, {
    allowExtrapolation: kase.rules.allowIdfExtrapolation,
  });
  const e = evaluate(kernelModel(kase, outputUnits(kase.units), curve), ENTERED);
  for (const [i, id] of METHOD_IDS.entries()) {
    const m = result.methods[id];
    const v = e.tcMin[i] ?? Number.NaN;
    if (m.status !== "ok") {
      if (!Number.isNaN(v)) return false;
    } else if (relDiff(m.totalMin, v) > 1e-9) return false;
  }
  if (relDiff(result.governing.tcMin, e.governingMin) > 1e-9) return false;
  const q = result.peakFlow?.value;
  return q === undefined ? Number.isNaN(e.peak) : relDiff(q, e.peak) <= 1e-9;
}

const RULES = fc.record({
  overlandSeries: fc.constantFrom("cascade", "independent"),
  sheetFlowSeries: fc.constantFrom("cascade", "weighted-n", "independent"),
  sheetFlowPastCap: fc.constantFrom("shallow", "warn"),
  governing: fc.constantFrom("largest", "smallest", "kerby", "faa", "nrcs-lag", "kerby-kirpich"),
  lagCn: fc.constantFrom("watershed", "path-weighted"),
  lagUsesArc: fc.boolean(),
  arc: fc.constantFrom("I", "II", "III"),
  rationalUsFactor: fc.constantFrom("exact", "1.0"),
  kirpichAdjustment: fc.constantFrom("none", "paved-overland", "concrete-channel"),
  frequencyFactor: fc.boolean(),
  manningConstant: fc.constantFrom("1.49", "exact"),
});

describe("the evaluator at the entered values is compute() (property)", () => {
  it("for random cases under random rules", () => {
    fc.assert(
      fc.property(usCaseArb, RULES, (us, rules) =>
        agree({ ...us, rules: { ...(us.rules as Json), ...rules } }),
      ),
      { numRuns: 200 },
    );
  });
  it("for the example of the format, in both systems", () => {
    expect(agree(fixture("example-us"))).toBe(true);
    expect(agree(fixture("example-si"))).toBe(true);
  });
});
