/**
 * The design rules a checking engineer reads the core by: how several sheet segments combine,
 * sheet flow past the cap, the lag method's CN and ARC, the rational factor, and the checks.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computeFromJson } from "./compute";
import { type HydrologyError } from "./errors";
import { NEH630_TABLE_10_1 } from "./arc";
import { rationalFormula } from "./rational";
import type { ComputeResult, MethodOk, MethodResults } from "./result-types";
import { fixture, type CaseJson, type SegmentJson } from "./test-support/cases";

function ok<K extends keyof MethodResults>(r: ComputeResult, id: K) {
  const m = r.methods[id];
  if (m.status !== "ok") throw new Error(`${id} unavailable: ${m.reason}`);
  return m as Extract<MethodResults[K], MethodOk>;
}
const codes = (r: ComputeResult) => r.warnings.map((w) => w.code);

/** One uniform overland plane of 100 ft, cut at `cuts` (ft from the top), then the example's rest. */
function plane(cuts: number[], rules: Record<string, unknown> = {}): CaseJson {
  const base = fixture("example-us");
  const top = { regime: "sheet", slope: 0.02, n: 0.15, k: 6.962, cn: 74, kerbyN: 0.4 } as const;
  const ends = [...cuts, 100];
  const pieces: SegmentJson[] = ends.map((end, j) => ({
    ...top,
    length: end - (ends[j - 1] ?? 0),
  }));
  return {
    ...base,
    rules: { ...base.rules, minTcMin: 0, ...rules },
    segments: [...pieces, ...base.segments.slice(1)],
  };
}

describe("splitting a plane never changes its time (closed form: the uncut plane)", () => {
  const cutsArb = fc.uniqueArray(fc.integer({ min: 1, max: 99 }), { minLength: 1, maxLength: 12 });
  // 1e-9 relative: the kinematic solve meets its 1e-4 min tolerance on the same fixed point.
  it.each([
    ["kinematic-wave", { overlandSeries: "cascade" }],
    ["nrcs-segmental", { sheetFlowSeries: "cascade" }],
    ["nrcs-segmental", { sheetFlowSeries: "weighted-n" }],
  ] as const)("%s with %o (property)", (id, rules) => {
    const whole = ok(computeFromJson(plane([], rules)), id).computedMin;
    fc.assert(
      fc.property(cutsArb, (cuts) => {
        const cut = ok(
          computeFromJson(
            plane(
              [...cuts].sort((a, b) => a - b),
              rules,
            ),
          ),
          id,
        );
        return Math.abs(cut.computedMin - whole) <= 1e-9 * whole;
      }),
      { numRuns: 40 },
    );
  });
  it("independent pieces take longer, and the sheet says what the other rules give", () => {
    const r = computeFromJson(plane([25, 50, 75], { overlandSeries: "independent" }));
    const kw = ok(r, "kinematic-wave");
    const cascade = ok(computeFromJson(plane([])), "kinematic-wave").totalMin;
    expect(kw.totalMin).toBeGreaterThan(cascade);
    expect(kw.overlandSeries?.used).toBe("independent");
    const alt = kw.overlandSeries?.alternatives.find((a) => a.option === "cascade");
    // Two solves of one equation from different starts: the solver's 1e-4 min tolerance.
    expect(Math.abs((alt?.totalMin ?? 0) - cascade)).toBeLessThan(1e-4);
    expect(codes(r)).toContain("sheet-multi-surface");
  });
  it("one sheet segment carries no series note", () => {
    expect(ok(computeFromJson(plane([])), "nrcs-segmental").overlandSeries).toBeNull();
  });
});

describe("the four-surface worked case through compute(), i = 60/(t+10)^0.8 in/h (derived)", () => {
  // n 0.40, 0.13, 0.15, 0.012 over 30, 25, 20, 25 ft; slopes 0.02, 0.03, 0.015, 0.01; K 0.938.
  // Expected values from an independent fixed-point iteration of the two closed forms
  // (overland-series.ts header); 1e-4 relative.
  const input = (overlandSeries: string): CaseJson => ({
    units: "us",
    returnPeriodYears: 10,
    rules: { minTcMin: 0, overlandSeries, kinematicWaveK: "theory-1.49" },
    rainfall: { idf: { formula: { "10": { a: 60, b: 10, c: 0.8 } } } },
    segments: (
      [
        [0.4, 30, 0.02],
        [0.13, 25, 0.03],
        [0.15, 20, 0.015],
        [0.012, 25, 0.01],
      ] as const
    ).map(([n, length, slope]) => ({ regime: "sheet", n, length, slope })),
  });
  it.each([
    ["cascade", 9.6843],
    ["independent", 14.7184],
  ] as const)("%s: %f min", (rule, expected) => {
    const kw = ok(computeFromJson(input(rule)), "kinematic-wave");
    expect(Math.abs(kw.computedMin - expected) / expected).toBeLessThan(1e-4);
  });
});

describe("sheet flow past the cap (rules.sheetFlowPastCap)", () => {
  const long = () => plane([], { sheetFlowMaxLength: 60 });
  it('"shallow" (default): the excess takes V = k·s^0.5, on the same row', () => {
    const r = computeFromJson(long());
    const seg = ok(r, "nrcs-segmental");
    // Derived: 40 ft past a 60 ft cap at V = 6.962·√0.02 ft/s.
    const pastMin = 40 / (6.962 * Math.sqrt(0.02)) / 60;
    expect(seg.segments[0]?.pastCapMin).toBeCloseTo(pastMin, 12);
    expect(seg.segments).toHaveLength(3);
    expect(codes(r)).toContain("sheet-past-cap");
    expect(ok(r, "kerby").inputs.length).toBeCloseTo(60, 12);
  });
  it('"shallow" uses shallowK for the excess when given', () => {
    const input = long();
    input.segments[0] = { ...input.segments[0]!, shallowK: 16.1345 } as SegmentJson;
    const row = ok(computeFromJson(input), "velocity").segments[0];
    expect(row?.pastCapMin).toBeCloseTo(40 / (16.1345 * Math.sqrt(0.02)) / 60, 12);
  });
  it('"refuse" names the segment past the cap', () => {
    expect(() =>
      computeFromJson(plane([], { sheetFlowMaxLength: 60, sheetFlowPastCap: "refuse" })),
    ).toThrow(
      expect.objectContaining({
        code: "invalid-input",
        path: "segments[0].length",
      }) as HydrologyError,
    );
  });
  it('"warn" computes it as sheet flow and says so', () => {
    const r = computeFromJson(plane([], { sheetFlowMaxLength: 60, sheetFlowPastCap: "warn" }));
    expect(codes(r)).toContain("sheet-too-long");
    expect(ok(r, "kerby").inputs.length).toBe(100);
  });
  it('"shallow" without any k is refused with the field to fill in', () => {
    const input = long();
    delete input.segments[0]!.k;
    expect(() => computeFromJson(input)).toThrow(/segments\[0\]\.shallowK: is required/);
  });
});

describe("NRCS lag method", () => {
  const base = fixture("example-us");
  it("uses the subcatchment's area-weighted CN by default (TR-55 Worksheet 2 practice)", () => {
    const input = { ...base, watershed: { ...base.watershed, cn: 80 } };
    const lag = ok(computeFromJson(input), "nrcs-lag");
    expect([lag.cnSource, lag.cnArcII]).toEqual(["watershed", 80]);
  });
  it("falls back to the path's CN, with a warning, when no subcatchment CN is given", () => {
    const segments = base.segments.map((seg) => ({ ...seg, cn: 70 }));
    const r = computeFromJson({
      ...base,
      segments,
      watershed: { ...base.watershed, cn: undefined },
    });
    expect([ok(r, "nrcs-lag").cnSource, ok(r, "nrcs-lag").cnArcII]).toEqual(["path-weighted", 70]);
    expect(codes(r)).toContain("lag-cn-from-path");
  });
  it("labels the per-segment lag times as not additive (their sum is not the Tc)", () => {
    const lag = ok(computeFromJson(base), "nrcs-lag");
    expect(lag.segmentTimesAdditive).toBe(false);
    expect(lag.segmentSumMin).not.toBeCloseTo(lag.computedMin, 1);
  });
  it("ARC by NEH 630 Ch 10 Table 10-1 reads the row at CN 98: ARC I 94, not 95.6 [from memory]", () => {
    const rules = { ...base.rules, arc: "I", lagUsesArc: true };
    const lag = ok(
      computeFromJson({ ...base, rules, watershed: { ...base.watershed, cn: 98 } }),
      "nrcs-lag",
    );
    expect(lag.cn).toBe(94);
    expect(NEH630_TABLE_10_1.find((row) => row[0] === 98)).toEqual([98, 94, 99]);
  });
});

/** [the product of the printed factors, the printed result] of "… = a × b / 360 = Q unit". */
function multiplyOut(text: string): [number, number] {
  const parts = text.split(" = ");
  const expression = (parts[parts.length - 2] ?? "").replace(/\([^)]*\)/g, "");
  let product = 1;
  for (const [, op, num] of expression.matchAll(/(×|\/)?\s*(\d+(?:\.\d+)?(?:e[-+]?\d+)?)/g)) {
    product = op === "/" ? product / Number(num) : product * Number(num);
  }
  return [product, Number.parseFloat(parts[parts.length - 1] ?? "")];
}

describe("rational method factor (rules.rationalUsFactor), derived: 43,560/43,200", () => {
  const base = fixture("example-us");
  it('"exact" keeps US and SI identical and prints the factor', () => {
    const us = computeFromJson(base).peakFlow!;
    const si = computeFromJson(fixture("example-si")).peakFlow!;
    expect(us.unitFactor).toBeCloseTo(43_560 / 43_200, 15);
    expect(Math.abs(si.value / 0.3048 ** 3 - us.value) / us.value).toBeLessThan(1e-9);
    expect(rationalFormula(us, { intensity: "in/h", area: "ac" })).toMatch(/× 1\.00833 = /);
    expect(rationalFormula(si, { intensity: "mm/h", area: "ha" })).toMatch(/\/ 360 = /);
  });
  it('"1.0" is Q = Cf·C·i·A as manuals print it (0.83 % lower), with no factor printed', () => {
    const exact = computeFromJson(base).peakFlow!;
    const one = computeFromJson({
      ...base,
      rules: { ...base.rules, rationalUsFactor: "1.0" },
    }).peakFlow!;
    expect(one.value * (43_560 / 43_200)).toBeCloseTo(exact.value, 12);
    expect(rationalFormula(one, { intensity: "in/h", area: "ac" })).toMatch(
      /^Q = Cf·C·i·A = [\d.]+ × [\d.]+ × [\d.]+ in\/h × [\d.]+ ac = [\d.]+ cfs$/,
    );
  });
  it("every printed formula multiplies out to its printed figure (property)", () => {
    const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true });
    fc.assert(
      fc.property(
        dbl(0.05, 1),
        dbl(0.1, 12),
        dbl(0.01, 500),
        fc.constantFrom(1, 1.1, 1.25),
        fc.constantFrom(1, 43_560 / 43_200, 1 / 360),
        (c, i, area, cf, k) => {
          const cfTimesC = Math.min(1, cf * c);
          const value = cfTimesC * i * area * k;
          const text = rationalFormula(
            { value, unit: "cfs", cf, c, cfTimesC, intensity: i, area },
            { intensity: "in/h", area: "ac" },
          );
          const [product, printed] = multiplyOut(text);
          // The printed Q has 4 significant figures: half a unit of its last place, plus 1e-5.
          const halfUlp = 0.5 * Math.pow(10, Math.floor(Math.log10(Math.abs(printed))) - 3);
          return Math.abs(product - printed) <= halfUlp + 1e-5 * printed;
        },
      ),
    );
  });
});

describe("checks", () => {
  const base = fixture("example-us");
  it("Kerby and FAA estimate the overland part only and do not take the minimum Tc", () => {
    const r = computeFromJson({ ...base, rules: { ...base.rules, minTcMin: 30 } });
    for (const id of ["kerby", "faa"] as const) {
      const m = ok(r, id);
      expect([m.minimumApplied, m.totalMin]).toEqual([false, m.computedMin]);
      expect(m.validity.range).toMatch(/minimum Tc .* is not applied/);
    }
    expect(ok(r, "kirpich").totalMin).toBe(30);
  });
  it("a named overland check governs with the minimum Tc applied to the governing Tc", () => {
    const r = computeFromJson({
      ...base,
      rules: { ...base.rules, governing: "kerby", minTcMin: 30 },
    });
    expect(r.governing.tcMin).toBe(30);
    expect(r.governing.reason).toMatch(/overland part of the path only/);
  });
  it("Kirpich's adjustment factors, Chow, Maidment & Mays (1988) Table 15.1.2 [from memory]", () => {
    const plain = ok(computeFromJson(base), "kirpich").computedMin;
    for (const [rule, factor] of [
      ["paved-overland", 0.4],
      ["concrete-channel", 0.2],
    ] as const) {
      const r = computeFromJson({ ...base, rules: { ...base.rules, kirpichAdjustment: rule } });
      expect(ok(r, "kirpich").computedMin).toBeCloseTo(factor * plain, 12);
    }
  });
  it("Kerby–Kirpich adds Kerby over the sheet part and Kirpich over the rest (TxDOT form)", () => {
    const r = computeFromJson(base);
    const kk = ok(r, "kerby-kirpich");
    // Derived from the example: Kerby 80 ft, N 0.4, S 0.02; Kirpich 3,500 ft at its fall/length.
    const channelS = (900 * 0.03 + 2600 * 0.008) / 3500;
    const kerby = 0.828 * Math.pow(80 * 0.4, 0.467) * Math.pow(0.02, -0.235);
    const kirpich = 0.0078 * Math.pow(3500, 0.77) * Math.pow(channelS, -0.385);
    expect(kk.computedMin).toBeCloseTo(kerby + kirpich, 10);
    expect(kk.validity.outside.length).toBeGreaterThan(0);
  });
});
