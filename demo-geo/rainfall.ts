/**
 * The demo's invented rainfall: an IDF table made from invented Sherman curves
 * i = a / (t + b)^c (i in/h, t min), one per return period, with the same b and c so the curves
 * never cross: intensity falls with duration and rises with return period everywhere. These are
 * not statistics of any real rain gauge or atlas; a real project takes its IDF data from the
 * reviewing agency or the published atlas for the site.
 */
export const RETURN_PERIODS_YEARS = [2, 5, 10, 25, 50, 100] as const;
export const DURATIONS_MIN = [5, 10, 15, 30, 60, 120, 180, 360, 720, 1440] as const;

// Invented coefficients: b and c shared, a grows with the return period.
const SHERMAN_B_MIN = 10;
const SHERMAN_C = 0.8;
const SHERMAN_A: Readonly<Record<(typeof RETURN_PERIODS_YEARS)[number], number>> = {
  2: 40,
  5: 52,
  10: 61,
  25: 73,
  50: 82,
  100: 92,
};

export const IDF_NOTE =
  "Invented IDF table for the Rillmark demo scenario (Harrow Hill Terraces). It does not " +
  "describe the rainfall of any real place; use the agency's or the atlas's data for design.";

/** Three significant figures, as IDF tables are usually printed. */
function sig3(v: number): number {
  return Number(v.toPrecision(3));
}

export function intensityInPerHr(durationMin: number, returnPeriodYears: number): number {
  const a = SHERMAN_A[returnPeriodYears as keyof typeof SHERMAN_A];
  if (a === undefined) throw new RangeError(`no invented curve for ${returnPeriodYears} years`);
  return a / (durationMin + SHERMAN_B_MIN) ** SHERMAN_C;
}

/** Rows by duration, columns by return period, in/h rounded to three significant figures. */
export function idfTableInPerHr(): number[][] {
  return DURATIONS_MIN.map((t) => RETURN_PERIODS_YEARS.map((T) => sig3(intensityInPerHr(t, T))));
}

/**
 * The invented 2-year 24-hour depth for TR-55 sheet flow, consistent with the table: the
 * 2-year intensity at 1440 min times 24 h, to the nearest 0.05 in.
 */
export function p2Depth24hIn(): number {
  return Math.round(intensityInPerHr(1440, 2) * 24 * 20) / 20;
}
