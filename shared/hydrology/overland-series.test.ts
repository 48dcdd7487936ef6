import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { solveKinematicWave } from "./kinematic-wave";
import { kinematicTerms, sheetFlowTimesHr, type Plane } from "./overland-series";
import { sheetFlowTravelTimeHr } from "./tr55-sheet";

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);
const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true });

/** A plane of length L cut at random fractions into `cuts + 1` pieces of the same surface. */
const cutPlane = fc
  .record({
    n: dbl(0.011, 0.8),
    lengthFt: dbl(5, 300),
    slopeFtPerFt: dbl(0.001, 0.3),
    shares: fc.array(dbl(0.01, 1), { minLength: 1, maxLength: 40 }),
  })
  .map(({ n, lengthFt, slopeFtPerFt, shares }) => {
    const total = sum(shares);
    const pieces: Plane[] = shares.map((s) => ({
      n,
      slopeFtPerFt,
      lengthFt: (lengthFt * s) / total,
    }));
    return { whole: { n, lengthFt, slopeFtPerFt }, pieces };
  });

describe("a uniform plane cut into N pieces keeps the uncut plane's time (closed form, derived)", () => {
  // Tolerance 1e-12 relative: the cascade sum telescopes; only rounding of the powers remains.
  it("kinematic wave, cascade: Σ terms = (n·L)^0.6/S^0.3 (property)", () => {
    fc.assert(
      fc.property(cutPlane, ({ whole, pieces }) => {
        const uncut = kinematicTerms([whole], "cascade")[0] ?? Number.NaN;
        const closed = Math.pow(whole.n * whole.lengthFt, 0.6) / Math.pow(whole.slopeFtPerFt, 0.3);
        const cut = sum(kinematicTerms(pieces, "cascade"));
        return (
          Math.abs(cut - closed) <= 1e-12 * closed && Math.abs(uncut - closed) <= 1e-12 * closed
        );
      }),
    );
  });
  it.each(["cascade", "weighted-n"] as const)("TR-55 sheet flow, %s (property)", (series) => {
    fc.assert(
      fc.property(cutPlane, dbl(1, 8), ({ whole, pieces }, p2In) => {
        const closed = sheetFlowTravelTimeHr({
          manningN: whole.n,
          lengthFt: whole.lengthFt,
          p2In,
          slopeFtPerFt: whole.slopeFtPerFt,
        });
        const cut = sum(sheetFlowTimesHr(pieces, p2In, series));
        return Math.abs(cut - closed) <= 1e-12 * closed;
      }),
    );
  });
  it("independent pieces overstate it: four equal pieces give 4^0.4 (kinematic) and 4^0.2 (TR-55)", () => {
    const whole = { n: 0.15, lengthFt: 100, slopeFtPerFt: 0.02 };
    const pieces = [0, 1, 2, 3].map(() => ({ ...whole, lengthFt: 25 }));
    const kw = sum(kinematicTerms(pieces, "independent")) / sum(kinematicTerms([whole], "cascade"));
    expect(kw).toBeCloseTo(Math.pow(4, 0.4), 12);
    const tr55 =
      sum(sheetFlowTimesHr(pieces, 3, "independent")) /
      sum(sheetFlowTimesHr([whole], 3, "cascade"));
    expect(tr55).toBeCloseTo(Math.pow(4, 0.2), 12);
  });
});

describe("four surfaces in series, i = 60/(t+10)^0.8 in/h, K = 0.938 (worked case, derived)", () => {
  // n 0.40, 0.13, 0.15, 0.012 over 30, 25, 20, 25 ft; slopes 0.02, 0.03, 0.015, 0.01. The
  // expected times were computed independently by direct fixed-point iteration of
  // tc = (K/i^0.4)·Σ term with the two forms above; tolerance 1e-4 relative.
  const planes: Plane[] = [
    { n: 0.4, lengthFt: 30, slopeFtPerFt: 0.02 },
    { n: 0.13, lengthFt: 25, slopeFtPerFt: 0.03 },
    { n: 0.15, lengthFt: 20, slopeFtPerFt: 0.015 },
    { n: 0.012, lengthFt: 25, slopeFtPerFt: 0.01 },
  ];
  const tcOf = (series: "cascade" | "independent") =>
    solveKinematicWave({
      coefficient: 0.938 * sum(kinematicTerms(planes, series)),
      intensityAt: (t) => 60 / Math.pow(t + 10, 0.8),
    }).tcMin;
  it("planes in series: 9.68 min", () => {
    expect(Math.abs(tcOf("cascade") - 9.6843) / 9.6843).toBeLessThan(1e-4);
  });
  it("each segment its own plane: 14.72 min", () => {
    expect(Math.abs(tcOf("independent") - 14.7184) / 14.7184).toBeLessThan(1e-4);
  });
  it("TR-55 cascade is the one-plane equation on the path's kinematic coefficient (derived)", () => {
    const c = sum(kinematicTerms(planes, "cascade"));
    const hr = sum(sheetFlowTimesHr(planes, 3.1, "cascade"));
    expect(hr).toBeCloseTo((0.007 * Math.pow(c, 4 / 3)) / Math.sqrt(3.1), 14);
    // Segment times are shares of one storm: proportional to each plane's term.
    const times = sheetFlowTimesHr(planes, 3.1, "cascade");
    const terms = kinematicTerms(planes, "cascade");
    expect((times[0] ?? 0) / (times[3] ?? 1)).toBeCloseTo((terms[0] ?? 0) / (terms[3] ?? 1), 12);
  });
});
