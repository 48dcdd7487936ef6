/**
 * Rational method.
 *
 *   Q = Cf·C·i·A
 *   US: Q cfs, i in/h, A ac; 1 ac·in/h = 43,560/(12·3,600) = 1.00833 cfs (derived; printed
 *       1.008 in HEC-22)
 *   SI: Q m³/s, i mm/h, A ha; Q = Cf·C·i·A/360 (1 ha·mm/h = 10 m³ / 3,600 s, derived)
 * Frequency factor Cf: 1.0 for 2–10 yr, 1.1 for 25 yr, 1.2 for 50 yr, 1.25 for 100 yr, with
 * Cf·C ≤ 1 (FHWA HEC-22 3rd ed. (2009) Table 3-2) [from memory]. Between rows Rillmark takes the
 * next higher row (the conservative one) and says so.
 * Which US factor applies is a design rule (rules.rationalUsFactor): "exact" keeps US and SI
 * results identical; "1.0" is Q = C·i·A as most design manuals print it (0.83 % lower). Every
 * printed formula shows the factor whenever it is not 1, so it multiplies out.
 * Validity: small urban catchments (commonly up to about 200 ac: common practice); i at the
 * governing Tc for the design storm.
 */
import { FT2_PER_ACRE, SECONDS_PER_HOUR } from "./units";

/** Cubic feet per second in one acre-inch per hour (43,560/43,200). */
export const CFS_PER_ACRE_INCH_PER_HOUR = FT2_PER_ACRE / (12 * SECONDS_PER_HOUR);

export function rationalPeakCfs(
  cfTimesC: number,
  intensityInPerHr: number,
  areaAc: number,
): number {
  return cfTimesC * intensityInPerHr * areaAc * CFS_PER_ACRE_INCH_PER_HOUR;
}

export function rationalPeakM3PerS(
  cfTimesC: number,
  intensityMmPerHr: number,
  areaHa: number,
): number {
  return (cfTimesC * intensityMmPerHr * areaHa) / 360;
}

const CF_ROWS: ReadonlyArray<readonly [number, number]> = [
  [10, 1.0],
  [25, 1.1],
  [50, 1.2],
  [100, 1.25],
];

export interface FrequencyFactor {
  readonly cf: number;
  /** True when T is not one of the table's rows (2, 5, 10, 25, 50, 100 yr). */
  readonly betweenRows: boolean;
}

export function frequencyFactor(returnPeriodYears: number): FrequencyFactor {
  const rowYears = [2, 5, 10, 25, 50, 100];
  const betweenRows = !rowYears.includes(returnPeriodYears);
  for (const [upTo, cf] of CF_ROWS) {
    if (returnPeriodYears <= upTo) return { cf, betweenRows };
  }
  return { cf: 1.25, betweenRows };
}

/** Cf·C with the HEC-22 cap at 1. */
export function cappedCfC(cf: number, runoffC: number): { value: number; capped: boolean } {
  const product = cf * runoffC;
  return product > 1 ? { value: 1, capped: true } : { value: product, capped: false };
}

/** The figures a printed rational formula needs (a PeakFlow, or a sheet's copy of one). */
export interface RationalFigures {
  readonly value: number;
  readonly unit: string;
  readonly cf: number;
  readonly c: number;
  readonly cfTimesC: number;
  readonly intensity: number;
  readonly area: number;
}

/** Six significant figures, trailing zeros dropped: enough for the product to check out. */
const sig = (x: number) => String(Number(x.toPrecision(6)));

/**
 * "Q = Cf·C·i·A × 1.00833 = 1.1 × 0.35 × 3.95 in/h × 12.4 ac × 1.00833 = 19.01 cfs": the
 * factor is Q/(Cf·C·i·A) of the figures themselves, so the printed product always multiplies
 * out (SI's 1/360 is printed as "/ 360").
 */
export function rationalFormula(
  q: RationalFigures,
  labels: { readonly intensity: string; readonly area: string },
): string {
  const base = q.cfTimesC * q.intensity * q.area;
  const factor = q.value / base;
  const capped = Math.abs(q.cfTimesC - q.cf * q.c) > 1e-12;
  const coefficient = capped
    ? `${sig(q.cfTimesC)} (Cf·C capped: ${sig(q.cf)} × ${sig(q.c)} is over 1)`
    : `${sig(q.cf)} × ${sig(q.c)}`;
  let symbols = "Q = Cf·C·i·A";
  let tail = "";
  if (Math.abs(factor * 360 - 1) < 1e-9) {
    symbols += " / 360";
    tail = " / 360";
  } else if (Math.abs(factor - 1) > 1e-12) {
    symbols += ` × ${sig(factor)}`;
    tail = ` × ${sig(factor)}`;
  }
  return (
    `${symbols} = ${coefficient} × ${sig(q.intensity)} ${labels.intensity} × ` +
    `${sig(q.area)} ${labels.area}${tail} = ${q.value.toPrecision(4)} ${q.unit}`
  );
}
