import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { HydrologyError } from "./errors";
import { intensityCurve, shermanIntensity, type IdfData } from "./idf";

const durations = [5, 10, 15, 30, 60, 120, 360, 1440];
const periods = [2, 10, 25, 100];

/** A table built from Sherman curves (a table of the right shape; the values are arbitrary). */
function tableFrom(coeffs: ReadonlyArray<{ a: number; b: number; c: number }>): IdfData {
  return {
    kind: "table",
    durationsMin: durations,
    returnPeriodsYears: periods,
    intensityInPerHr: durations.map((t) => coeffs.map((k) => shermanIntensity(k, t))),
  };
}

const coeffArb = fc.tuple(
  fc.double({ min: 10, max: 100, noNaN: true }),
  fc.double({ min: 0, max: 20, noNaN: true }),
  fc.double({ min: 0.5, max: 1, noNaN: true }),
);

describe("IDF table interpolation (log i vs log t; i vs ln T: common practice)", () => {
  it("reproduces the table at its nodes exactly (property)", () => {
    fc.assert(
      fc.property(coeffArb, ([a, b, c]) => {
        const data = tableFrom(periods.map((_, j) => ({ a: a * (1 + j), b, c })));
        if (data.kind !== "table") return false;
        return periods.every((T, j) => {
          const curve = intensityCurve(data, T, { allowExtrapolation: false });
          return durations.every((t, r) => curve.at(t) === data.intensityInPerHr[r]?.[j]);
        });
      }),
    );
  });
  it("is exact for a power law between nodes (log–log linear, derived)", () => {
    const data = tableFrom(periods.map(() => ({ a: 50, b: 0, c: 0.7 })));
    const curve = intensityCurve(data, 25, { allowExtrapolation: false });
    for (const t of [7, 12.5, 45, 700]) {
      expect(curve.at(t)).toBeCloseTo(50 / Math.pow(t, 0.7), 10);
    }
  });
  it("stays between its neighbours and falls with duration (property)", () => {
    fc.assert(
      fc.property(coeffArb, fc.double({ min: 5, max: 1440, noNaN: true }), ([a, b, c], t) => {
        const data = tableFrom(periods.map((_, j) => ({ a: a * (1 + j), b, c })));
        const curve = intensityCurve(data, 10, { allowExtrapolation: false });
        return curve.at(t) >= curve.at(Math.min(t * 1.01, 1440)) - 1e-12;
      }),
    );
  });
  it("interpolates linearly in ln(T) between return periods, with the flag set", () => {
    const data = tableFrom([
      { a: 40, b: 10, c: 0.8 },
      { a: 60, b: 10, c: 0.8 },
      { a: 70, b: 10, c: 0.8 },
      { a: 90, b: 10, c: 0.8 },
    ]);
    const curve = intensityCurve(data, 50, { allowExtrapolation: false });
    const f = (Math.log(50) - Math.log(25)) / (Math.log(100) - Math.log(25));
    const i25 = shermanIntensity({ a: 70, b: 10, c: 0.8 }, 30);
    const i100 = shermanIntensity({ a: 90, b: 10, c: 0.8 }, 30);
    expect(curve.at(30)).toBeCloseTo(i25 + f * (i100 - i25), 12);
    expect(curve.returnPeriodInterpolated).toBe(true);
  });
  it("refuses a duration outside the table, naming the field", () => {
    const curve = intensityCurve(tableFrom(periods.map(() => ({ a: 50, b: 5, c: 0.8 }))), 10, {
      allowExtrapolation: false,
    });
    expect(() => curve.at(2)).toThrow(HydrologyError);
    try {
      curve.at(2000);
    } catch (error) {
      expect(error).toBeInstanceOf(HydrologyError);
      expect((error as HydrologyError).path).toBe("rainfall.idf.durationsMin");
      expect((error as HydrologyError).code).toBe("idf-out-of-range");
    }
  });
  it("extrapolates the end segment's power law when allowed, and records it", () => {
    const curve = intensityCurve(tableFrom(periods.map(() => ({ a: 50, b: 0, c: 0.7 }))), 10, {
      allowExtrapolation: true,
    });
    expect(curve.at(2)).toBeCloseTo(50 / Math.pow(2, 0.7), 10);
    expect(curve.extrapolatedMin).toEqual([2]);
  });
  it("refuses a return period outside the table", () => {
    const data = tableFrom(periods.map(() => ({ a: 50, b: 5, c: 0.8 })));
    expect(() => intensityCurve(data, 500, { allowExtrapolation: true })).toThrow(
      /not in the IDF table/,
    );
  });
});

describe("Sherman formula i = a/(t+b)^c", () => {
  it("needs a formula for the design return period", () => {
    const data: IdfData = { kind: "formula", curves: new Map([[25, { a: 60, b: 10, c: 0.8 }]]) };
    expect(intensityCurve(data, 25, { allowExtrapolation: false }).at(20)).toBeCloseTo(
      60 / Math.pow(30, 0.8),
      12,
    );
    expect(() => intensityCurve(data, 10, { allowExtrapolation: false })).toThrow(/no IDF formula/);
  });
});
