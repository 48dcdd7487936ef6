/**
 * Kinematic-wave overland flow, solved exactly against the design rainfall.
 *
 *   tc = K·(n·L)^0.6 / (i^0.4·S^0.3)          tc min, L ft, i in/h, S ft/ft, n Manning's n
 *   path of overland segments, one intensity: tc = (K/i^0.4)·Σ (n_j·L_j)^0.6 / S_j^0.3
 *   and i = IDF(tc, T), so tc = f(i(tc)): a fixed point.
 *
 * K presets (design rule): 0.938 (derived here from the kinematic solution with Manning 1.49:
 * 43200^0.4/(60·1.49^0.6)); 0.94 (Ragan & Duru 1972, as printed in Chow, Maidment & Mays 1988)
 * [from memory]; HEC-22 3rd ed. Ku = 0.933 US / 6.943 SI [from memory]; SI theory 6.99 =
 * 3.6e6^0.4/60 (derived). An SI K (L m, i mm/h) is K_US·25.4^0.4/0.3048^0.6.
 * Solver: fixed point t ← f(t) from a start inside the data; with i = a/(t+b)^c the map
 * contracts (derivative ≤ 0.4·c at the root), and for any table whose depth does not fall with
 * duration the derivative is ≤ 0.4. If it ever fails (non-finite value, no convergence), a
 * bracketing bisection takes over. Tolerance 1e-4 min; every iterate is kept for a plot.
 * Validity: overland sheet flow only (the sheet-flow length caps apply).
 */
import { HydrologyError } from "./errors";
import { MM_PER_IN, M_PER_FT, SECONDS_PER_HOUR, SECONDS_PER_MINUTE } from "./units";

/** K of the kinematic solution with Manning unit constant kM (ft^(1/3)/s): L ft, i in/h. */
export function kinematicKTheoryUs(manningUnitConstant: number): number {
  const inchesPerHourToFtPerS = 12 * SECONDS_PER_HOUR;
  return (
    Math.pow(inchesPerHourToFtPerS, 0.4) / (SECONDS_PER_MINUTE * Math.pow(manningUnitConstant, 0.6))
  );
}

/** K of the kinematic solution in SI (Manning 1/n, L m, i mm/h): 3.6e6^0.4/60. */
export function kinematicKTheorySi(): number {
  return Math.pow(1000 * SECONDS_PER_HOUR, 0.4) / SECONDS_PER_MINUTE;
}

/** The US K (L ft, i in/h) equivalent to an SI K (L m, i mm/h). */
export function kinematicKUsFromSi(kSi: number): number {
  return (kSi * Math.pow(M_PER_FT, 0.6)) / Math.pow(MM_PER_IN, 0.4);
}

export function kinematicKSiFromUs(kUs: number): number {
  return (kUs * Math.pow(MM_PER_IN, 0.4)) / Math.pow(M_PER_FT, 0.6);
}

/** (n·L)^0.6 / S^0.3 of one overland segment. */
export function overlandTerm(manningN: number, lengthFt: number, slopeFtPerFt: number): number {
  return Math.pow(manningN * lengthFt, 0.6) / Math.pow(slopeFtPerFt, 0.3);
}

/** tc (min) of an overland reach or path for a given intensity (in/h). */
export function kinematicTravelTimeMin(k: number, term: number, intensityInPerHr: number): number {
  return (k * term) / Math.pow(intensityInPerHr, 0.4);
}

export interface KinematicIterate {
  readonly tcMin: number;
  readonly intensityInPerHr: number;
}

export interface KinematicSolution {
  readonly tcMin: number;
  readonly intensityInPerHr: number;
  readonly iterations: readonly KinematicIterate[];
  readonly solver: "fixed-point" | "bracketing";
}

export interface KinematicSolveOptions {
  /** K·Σ(n·L)^0.6/S^0.3: tc = coefficient / i^0.4. */
  readonly coefficient: number;
  /** Design intensity (in/h) for a duration (min); may throw for durations outside the data. */
  readonly intensityAt: (durationMin: number) => number;
  readonly startMin?: number;
  readonly toleranceMin?: number;
  readonly maxIterations?: number;
  /** False skips keeping the iterates (the Monte Carlo solves thousands of times). */
  readonly record?: boolean;
}

export const KINEMATIC_TOLERANCE_MIN = 1e-4;

/** Solves tc = coefficient / intensityAt(tc)^0.4. */
export function solveKinematicWave(options: KinematicSolveOptions): KinematicSolution {
  const tol = options.toleranceMin ?? KINEMATIC_TOLERANCE_MIN;
  const maxIterations = options.maxIterations ?? 100;
  const f = (t: number): KinematicIterate => {
    const i = options.intensityAt(t);
    return { tcMin: options.coefficient / Math.pow(i, 0.4), intensityInPerHr: i };
  };
  const iterations: KinematicIterate[] = [];
  const record = options.record ?? true;
  let t = options.startMin ?? 10;
  for (let k = 0; k < maxIterations; k += 1) {
    const step = f(t);
    if (record) iterations.push({ tcMin: t, intensityInPerHr: step.intensityInPerHr });
    if (!Number.isFinite(step.tcMin) || step.tcMin <= 0) break;
    if (Math.abs(step.tcMin - t) < tol) {
      const last = f(step.tcMin);
      if (record) iterations.push({ tcMin: step.tcMin, intensityInPerHr: last.intensityInPerHr });
      return {
        tcMin: step.tcMin,
        intensityInPerHr: last.intensityInPerHr,
        iterations,
        solver: "fixed-point",
      };
    }
    t = step.tcMin;
  }
  return bisect(options.coefficient, f, options.startMin ?? 10, tol, iterations);
}

/** Bracketing fallback on h(t) = t − f(t): h < 0 for small t, h > 0 for large t. */
function bisect(
  coefficient: number,
  f: (t: number) => KinematicIterate,
  start: number,
  tol: number,
  iterations: KinematicIterate[],
): KinematicSolution {
  const h = (t: number): number => t - f(t).tcMin;
  let lo = start;
  let hi = start;
  for (let k = 0; k < 200 && !(h(lo) < 0); k += 1) lo /= 2;
  for (let k = 0; k < 200 && !(h(hi) > 0); k += 1) hi *= 2;
  if (!(h(lo) < 0) || !(h(hi) > 0)) {
    throw new HydrologyError(
      "no-convergence",
      "rainfall.idf",
      `the kinematic-wave time could not be bracketed (coefficient ${coefficient})`,
    );
  }
  while (hi - lo >= tol) {
    const mid = (lo + hi) / 2;
    const value = f(mid);
    iterations.push({ tcMin: mid, intensityInPerHr: value.intensityInPerHr });
    if (mid - value.tcMin < 0) lo = mid;
    else hi = mid;
  }
  const tcMin = (lo + hi) / 2;
  const last = f(tcMin);
  iterations.push({ tcMin, intensityInPerHr: last.intensityInPerHr });
  return { tcMin, intensityInPerHr: last.intensityInPerHr, iterations, solver: "bracketing" };
}

/** Closed form for i = a/t^c (b = 0): tc = (coefficient·a^−0.4)^(1/(1−0.4c)). */
export function kinematicClosedFormMin(coefficient: number, a: number, c: number): number {
  return Math.pow(coefficient * Math.pow(a, -0.4), 1 / (1 - 0.4 * c));
}
