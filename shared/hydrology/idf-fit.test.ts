import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { HydrologyError } from "./errors";
import { fitIdfTable, fitSherman } from "./idf-fit";

const durations = [5, 10, 15, 30, 60, 120, 360, 1440];

describe("Sherman least-squares fit (ml-levenberg-marquardt)", () => {
  it("recovers a, b, c from exact Sherman intensities (property; 1e-6 relative error of the fit)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 500, noNaN: true }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 0.4, max: 1.1, noNaN: true }),
        (a, b, c) => {
          const intensities = durations.map((t) => a / Math.pow(t + b, c));
          const fit = fitSherman(durations, intensities);
          return fit.maxRelativeError < 1e-6 && fit.rSquared > 1 - 1e-9;
        },
      ),
      { numRuns: 60 },
    );
  });
  it("reports R² and the largest relative error of a noisy table", () => {
    const noise = [1.02, 0.98, 1.01, 0.99, 1.03, 0.97, 1.0, 1.02];
    const intensities = durations.map((t, k) => (60 / Math.pow(t + 10, 0.8)) * (noise[k] ?? 1));
    const fit = fitSherman(durations, intensities);
    expect(fit.rSquared).toBeGreaterThan(0.99);
    expect(fit.rSquared).toBeLessThan(1);
    expect(fit.maxRelativeError).toBeGreaterThan(0.005);
    expect(fit.maxRelativeError).toBeLessThan(0.05);
    expect(fit.points).toBe(8);
  });
  it("fits one curve per return period of a table", () => {
    const fits = fitIdfTable({
      durationsMin: durations,
      returnPeriodsYears: [2, 100],
      intensity: durations.map((t) => [40 / Math.pow(t + 8, 0.78), 90 / Math.pow(t + 12, 0.8)]),
    });
    expect(fits.map((f) => f.returnPeriodYears)).toEqual([2, 100]);
    expect(fits[1]?.b).toBeCloseTo(12, 3);
  });
  it("needs at least three points", () => {
    expect(() => fitSherman([5, 10], [5, 4])).toThrow(HydrologyError);
  });
});
