/**
 * Rainfall intensity–duration–frequency (IDF) data: tables and Sherman formulas.
 *
 *   Table: i(t, T) with log(i) linear in log(t) between tabulated durations (common practice)
 *          and i linear in ln(T) between tabulated return periods (common practice; intensity
 *          is close to linear in ln T for extreme-value rainfall). Nodes are reproduced exactly.
 *   Sherman formula: i = a/(t + b)^c per return period, t min, i in/h (mm/h).
 *
 * Outside the tabulated durations the lookup is refused with a clear error unless the design
 * rules allow extrapolation; then the end segment's power law is extended and a warning is
 * raised. A return period outside the table (or with no formula) is always refused.
 * Source of the table layout: NOAA Atlas 14 point estimates (durations 5 min … 24 h by average
 * recurrence interval), as depth or intensity.
 */
import { HydrologyError } from "./errors";

export interface ShermanCoefficients {
  readonly a: number;
  readonly b: number;
  readonly c: number;
}

/** IDF data in internal US units: intensities in in/h, durations in min. */
export type IdfData =
  | {
      readonly kind: "table";
      readonly durationsMin: readonly number[];
      readonly returnPeriodsYears: readonly number[];
      /** intensityInPerHr[durationIndex][returnPeriodIndex] */
      readonly intensityInPerHr: ReadonlyArray<readonly number[]>;
    }
  | { readonly kind: "formula"; readonly curves: ReadonlyMap<number, ShermanCoefficients> };

export function shermanIntensity(coefficients: ShermanCoefficients, durationMin: number): number {
  return coefficients.a / Math.pow(durationMin + coefficients.b, coefficients.c);
}

/** The design curve i(t) for one return period. */
export interface IntensityCurve {
  readonly returnPeriodYears: number;
  /** Tabulated duration range, or undefined for a formula. */
  readonly durationRangeMin: readonly [number, number] | undefined;
  /** True when T lies between two tabulated return periods. */
  readonly returnPeriodInterpolated: boolean;
  /** Intensity in in/h at a duration in min. */
  at(durationMin: number): number;
  /** Durations (min) looked up outside the table, when extrapolation is allowed. */
  readonly extrapolatedMin: number[];
}

/** Why `returnPeriodYears` cannot be served by the data, or null when it can. */
export function returnPeriodProblem(data: IdfData, returnPeriodYears: number): string | null {
  if (data.kind === "formula") {
    if (data.curves.has(returnPeriodYears)) return null;
    // Keys that are not numbers are refused by the schema with their own message.
    const keys = [...data.curves.keys()].filter(Number.isFinite).sort((x, y) => x - y);
    if (keys.length === 0) return null;
    return `no IDF formula for the ${returnPeriodYears}-year storm (formulas given: ${keys.join(", ")} years)`;
  }
  const periods = data.returnPeriodsYears;
  const first = periods[0];
  const last = periods[periods.length - 1];
  if (first === undefined || last === undefined) return "the IDF table has no return periods";
  if (returnPeriodYears < first || returnPeriodYears > last) {
    return `${returnPeriodYears} years is not in the IDF table (return periods ${first}–${last} years)`;
  }
  return null;
}

function column(data: Extract<IdfData, { kind: "table" }>, returnPeriodYears: number): number[] {
  const periods = data.returnPeriodsYears;
  const exact = periods.indexOf(returnPeriodYears);
  const rows = data.intensityInPerHr;
  if (exact >= 0) return rows.map((row) => row[exact] ?? Number.NaN);
  let j = 1;
  while (j < periods.length - 1 && (periods[j] ?? 0) < returnPeriodYears) j += 1;
  const t0 = periods[j - 1] ?? Number.NaN;
  const t1 = periods[j] ?? Number.NaN;
  const f = (Math.log(returnPeriodYears) - Math.log(t0)) / (Math.log(t1) - Math.log(t0));
  return rows.map((row) => {
    const i0 = row[j - 1] ?? Number.NaN;
    return i0 + f * ((row[j] ?? Number.NaN) - i0);
  });
}

/** log–log interpolation between (t0, i0) and (t1, i1), also used to extend an end segment. */
function logLog(t: number, t0: number, i0: number, t1: number, i1: number): number {
  const f = (Math.log(t) - Math.log(t0)) / (Math.log(t1) - Math.log(t0));
  return Math.exp(Math.log(i0) + f * (Math.log(i1) - Math.log(i0)));
}

export interface CurveOptions {
  readonly allowExtrapolation: boolean;
}

/** Builds the design curve; throws a HydrologyError if T cannot be served. */
export function intensityCurve(
  data: IdfData,
  returnPeriodYears: number,
  options: CurveOptions,
): IntensityCurve {
  const problem = returnPeriodProblem(data, returnPeriodYears);
  if (problem !== null) throw new HydrologyError("idf-out-of-range", "returnPeriodYears", problem);
  const extrapolatedMin: number[] = [];
  if (data.kind === "formula") {
    const coefficients = data.curves.get(returnPeriodYears);
    if (coefficients === undefined) {
      throw new HydrologyError(
        "idf-out-of-range",
        "returnPeriodYears",
        `no IDF formula for the ${returnPeriodYears}-year storm`,
      );
    }
    return {
      returnPeriodYears,
      durationRangeMin: undefined,
      returnPeriodInterpolated: false,
      at: (t) => shermanIntensity(coefficients, t),
      extrapolatedMin,
    };
  }
  const d = data.durationsMin;
  const v = column(data, returnPeriodYears);
  const n = d.length;
  const dFirst = d[0] ?? Number.NaN;
  const dLast = d[n - 1] ?? Number.NaN;
  const at = (t: number): number => {
    if (t < dFirst || t > dLast) {
      if (!options.allowExtrapolation) {
        throw new HydrologyError(
          "idf-out-of-range",
          "rainfall.idf.durationsMin",
          `a duration of ${t.toPrecision(4)} min is outside the IDF table (${dFirst}–${dLast} min); ` +
            "extend the table or allow extrapolation (rules.allowIdfExtrapolation)",
        );
      }
      extrapolatedMin.push(t);
      const j = t < dFirst ? 1 : n - 1;
      return logLog(t, d[j - 1] ?? 1, v[j - 1] ?? 1, d[j] ?? 1, v[j] ?? 1);
    }
    let j = 1;
    while (j < n - 1 && (d[j] ?? 0) < t) j += 1;
    const t0 = d[j - 1] ?? Number.NaN;
    const t1 = d[j] ?? Number.NaN;
    if (t === t0) return v[j - 1] ?? Number.NaN;
    if (t === t1) return v[j] ?? Number.NaN;
    return logLog(t, t0, v[j - 1] ?? Number.NaN, t1, v[j] ?? Number.NaN);
  };
  return {
    returnPeriodYears,
    durationRangeMin: [dFirst, dLast],
    returnPeriodInterpolated: !data.returnPeriodsYears.includes(returnPeriodYears),
    at,
    extrapolatedMin,
  };
}
