/**
 * Least-squares fit of the Sherman IDF formula i = a/(t + b)^c to tabulated intensities.
 *
 * Residuals are relative, (model − i)/i, so short and long durations weigh alike (intensities
 * span an order of magnitude). Start: for a grid of b, ln i = ln a − c·ln(t + b) is linear and
 * is solved exactly; the best start is refined by Levenberg–Marquardt (ml-levenberg-marquardt)
 * with the analytic Jacobian, b ≥ 0, c > 0. The better of start and refinement is kept.
 * Reported: R² of the intensities (1 − SSres/SStot) and the largest relative error.
 * Units: whatever the table uses (t min; i in/h or mm/h); a carries the unit of i·min^c.
 */
import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { HydrologyError } from "./errors";
import { shermanIntensity, type ShermanCoefficients } from "./idf";

export interface ShermanFit extends ShermanCoefficients {
  readonly rSquared: number;
  readonly maxRelativeError: number;
  readonly points: number;
}

const B_GRID = [0, 0.5, 1, 2, 3, 5, 7.5, 10, 12.5, 15, 20, 25, 30, 40, 50, 60, 90, 120];

function relativeSse(p: ShermanCoefficients, t: readonly number[], i: readonly number[]): number {
  let sum = 0;
  for (let k = 0; k < t.length; k += 1) {
    const obs = i[k] ?? Number.NaN;
    const r = (shermanIntensity(p, t[k] ?? Number.NaN) - obs) / obs;
    sum += r * r;
  }
  return sum;
}

/** For fixed b, the log-linear least-squares a and c. */
function logLinear(b: number, t: readonly number[], i: readonly number[]): ShermanCoefficients {
  const x = t.map((tk) => Math.log(tk + b));
  const y = i.map((ik) => Math.log(ik));
  const n = x.length;
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let k = 0; k < n; k += 1) {
    const dx = (x[k] ?? 0) - mx;
    sxy += dx * ((y[k] ?? 0) - my);
    sxx += dx * dx;
  }
  const slope = sxy / sxx;
  return { a: Math.exp(my - slope * mx), b, c: -slope };
}

export function fitSherman(
  durationsMin: readonly number[],
  intensities: readonly number[],
): ShermanFit {
  if (durationsMin.length !== intensities.length || durationsMin.length < 3) {
    throw new HydrologyError(
      "invalid-input",
      "durationsMin",
      "a Sherman fit needs at least 3 durations, each with an intensity",
    );
  }
  let best: ShermanCoefficients = logLinear(0, durationsMin, intensities);
  let bestSse = relativeSse(best, durationsMin, intensities);
  for (const b of B_GRID) {
    const candidate = logLinear(b, durationsMin, intensities);
    const sse = relativeSse(candidate, durationsMin, intensities);
    if (candidate.c > 0 && sse < bestSse) {
      best = candidate;
      bestSse = sse;
    }
  }
  // The model is evaluated at point index k and returns model/observed, fitted to 1 with unit
  // weights: the residual is then the relative error itself (the package's weights scale its
  // step and its error measure differently, so they are left at 1). a is fitted as ln a so the
  // three parameters are of like scale.
  const ratio =
    ([lnA = 0, b = 0, c = 0]: number[]) =>
    (k: number): number =>
      (Math.exp(lnA) * Math.pow((durationsMin[k] ?? 0) + b, -c)) / (intensities[k] ?? 1);
  const refined = levenbergMarquardt(
    { x: durationsMin.map((_, k) => k), y: durationsMin.map(() => 1) },
    ratio,
    {
      initialValues: [Math.log(best.a), best.b, best.c],
      minValues: [-50, 0, 1e-6],
      maxValues: [50, 1e4, 5],
      maxIterations: 200,
      errorTolerance: 1e-24,
      damping: 1e-2,
      jacobianFunction: (p) => (k) => {
        const t = durationsMin[k] ?? 0;
        const b = p[1] ?? 0;
        const c = p[2] ?? 0;
        const f = ratio(p)(k);
        return [f, (-c * f) / (t + b), -Math.log(t + b) * f];
      },
    },
  );
  const [lnA, rb, rc] = refined.parameterValues;
  if (lnA !== undefined && rb !== undefined && rc !== undefined) {
    const candidate = { a: Math.exp(lnA), b: rb, c: rc };
    const sse = relativeSse(candidate, durationsMin, intensities);
    if (Number.isFinite(sse) && sse < bestSse) {
      best = candidate;
      bestSse = sse;
    }
  }
  return { ...best, ...goodness(best, durationsMin, intensities) };
}

function goodness(
  p: ShermanCoefficients,
  t: readonly number[],
  i: readonly number[],
): { rSquared: number; maxRelativeError: number; points: number } {
  const mean = i.reduce((s, v) => s + v, 0) / i.length;
  let ssRes = 0;
  let ssTot = 0;
  let maxRelativeError = 0;
  for (let k = 0; k < t.length; k += 1) {
    const obs = i[k] ?? Number.NaN;
    const model = shermanIntensity(p, t[k] ?? Number.NaN);
    ssRes += (model - obs) ** 2;
    ssTot += (obs - mean) ** 2;
    maxRelativeError = Math.max(maxRelativeError, Math.abs(model - obs) / obs);
  }
  return { rSquared: ssTot === 0 ? 1 : 1 - ssRes / ssTot, maxRelativeError, points: t.length };
}

export interface IdfTableFit extends ShermanFit {
  readonly returnPeriodYears: number;
}

/** One Sherman fit per return period of a table (rows = durations, columns = periods). */
export function fitIdfTable(table: {
  readonly durationsMin: readonly number[];
  readonly returnPeriodsYears: readonly number[];
  readonly intensity: ReadonlyArray<readonly number[]>;
}): IdfTableFit[] {
  return table.returnPeriodsYears.map((returnPeriodYears, col) => ({
    returnPeriodYears,
    ...fitSherman(
      table.durationsMin,
      table.intensity.map((row) => row[col] ?? Number.NaN),
    ),
  }));
}
