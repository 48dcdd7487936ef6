import { describe, expect, it } from "vitest";
import { computeFromJson } from "../compute";
import { fixture, relDiff, type CaseJson } from "../test-support/cases";
import { percentile, type UncertaintyResult } from "./analysis";

const ZERO = {
  roughnessPct: 0,
  velocityKPct: 0,
  slopePct: 0,
  p2Pct: 0,
  idfPct: 0,
  cnPoints: 0,
  runoffCPct: 0,
};

function band(input: CaseJson, uncertainty: Record<string, number> = {}): UncertaintyResult {
  const rules = { ...input.rules, uncertainty };
  const r = computeFromJson({ ...input, rules }, { uncertainty: true });
  if (r.uncertainty === undefined) throw new Error("no uncertainty in the result");
  return r.uncertainty;
}

describe("percentiles: Hyndman & Fan type 7 (NumPy's default 'linear', derived)", () => {
  it("of 1…10: P10 1.9, P50 5.5, P90 9.1", () => {
    const xs = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    expect([0.1, 0.5, 0.9].map((p) => percentile(xs, p))).toEqual([1.9, 5.5, 9.1]);
  });
});

describe("Monte Carlo band", () => {
  const us = fixture("example-us");
  it("is reproducible from its seed, and another seed gives other draws", () => {
    const a = band(us, { seed: 11, draws: 500 });
    const b = band(us, { seed: 11, draws: 500 });
    const c = band(us, { seed: 12, draws: 500 });
    expect(b.monteCarlo).toEqual(a.monteCarlo);
    expect(c.monteCarlo.governingTcMin).not.toEqual(a.monteCarlo.governingTcMin);
  });
  it("is the same for the SI twin of a case (1e-9 relative)", () => {
    const a = band(us, { draws: 500, terrainVerticalAccuracy: 0.5 });
    const b = band(fixture("example-si"), { draws: 500, terrainVerticalAccuracy: 0.5 * 0.3048 });
    const g = (r: UncertaintyResult) => r.monteCarlo.governingTcMin!;
    for (const k of ["p10", "p50", "p90"] as const) {
      expect(relDiff(g(a)[k], g(b)[k])).toBeLessThan(1e-9);
      expect(relDiff(a.monteCarlo.peak![k] * 0.3048 ** 3, b.monteCarlo.peak![k])).toBeLessThan(
        1e-9,
      );
    }
    expect(b.sensitivity.bars.map((x) => x.input)).toEqual(a.sensitivity.bars.map((x) => x.input));
  });
  it("collapses to the entered Tc and peak flow when every band is zero", () => {
    const r = band(us, ZERO);
    const g = r.monteCarlo.governingTcMin!;
    expect([g.p10, g.p50, g.p90].every((v) => v === r.sensitivity.entered.tcMin)).toBe(true);
    expect(r.monteCarlo.peak!.p50).toBe(r.sensitivity.entered.peak);
  });
  it("draws triangular shares: Kirpich's P90 is Tc at the slope share −1 + √0.2 (derived, ±1 %)", () => {
    // Kirpich alone moves with the slope only: tc ∝ S^−0.385 is monotone, so its quantiles are
    // the share's quantiles mapped through it; the triangular share's P10 is −1 + √(2·0.1).
    const input = { ...us, rules: { ...us.rules, governing: "kirpich" } };
    const r = band(input, { ...ZERO, slopePct: 50, draws: 20_000 });
    const entered = r.sensitivity.entered.tcMin!;
    const expected = entered * Math.pow(1 + 0.5 * (-1 + Math.sqrt(0.2)), -0.385);
    expect(Math.abs(r.monteCarlo.governingTcMin!.p90 / expected - 1)).toBeLessThan(0.01);
    expect(Math.abs(r.monteCarlo.governingTcMin!.p50 / entered - 1)).toBeLessThan(0.01);
  });
  it("gives every computed method its own band, around its Tc", () => {
    const r = computeFromJson(us, { uncertainty: true });
    for (const [id, m] of Object.entries(r.methods)) {
      const p = r.uncertainty?.monteCarlo.methods[id as keyof typeof r.methods];
      if (m.status !== "ok" || !p) throw new Error(`${id} has no band`);
      expect(p.p10).toBeLessThanOrEqual(p.p50);
      expect(p.p50).toBeLessThanOrEqual(p.p90);
      expect(p.draws).toBe(2000);
    }
  });
});

describe("sensitivity view (tornado)", () => {
  const us = fixture("example-us");
  it("moves each input to the ends of its band, largest swing of the governing Tc first", () => {
    const r = band(us);
    const swing = (b: (typeof r.sensitivity.bars)[number]) =>
      Math.abs((b.high.tcMin ?? 0) - (b.low.tcMin ?? 0));
    const swings = r.sensitivity.bars.map(swing);
    expect([...swings].sort((a, b) => b - a)).toEqual(swings);
    expect(r.sensitivity.bars).toHaveLength(7);
  });
  it("rougher surfaces lengthen Tc and lower the peak; C moves only the peak", () => {
    const r = band(us);
    const bar = (input: string) => r.sensitivity.bars.find((b) => b.input === input)!;
    const n = bar("roughness");
    expect(n.high.tcMin!).toBeGreaterThan(r.sensitivity.entered.tcMin!);
    expect(n.high.peak!).toBeLessThan(r.sensitivity.entered.peak!);
    const c = bar("runoffC");
    expect(c.high.tcMin).toBe(r.sensitivity.entered.tcMin);
    // Q ∝ C when Cf·C stays under 1 (Cf 1.1 × 0.35 × 1.1): +10 % exactly (derived).
    expect(c.high.peak! / r.sensitivity.entered.peak!).toBeCloseTo(1.1, 12);
    expect(bar("slope").band).toMatch(/±10 %/);
  });
});
