/**
 * NRCS lag (curve number) method.
 *
 *   S = 1000/CN − 10                         S in (potential maximum retention)
 *   Lag = ℓ^0.8·(S + 1)^0.7 / (1900·Y^0.5)   Lag h, ℓ flow length ft, Y average land slope PERCENT
 *   Tc = Lag / 0.6
 *
 * Source: NEH Part 630 Ch 15 (2010), lag method (equation numbers from memory; the form is well
 * established); S from TR-55 (1986) eq 2-4. Y is the average land slope of the subcatchment in
 * percent, not the flow path slope in ft/ft: the unit is in every name here.
 * Validity: developed on 24 watersheds of 1.3 ac to 9.2 mi² (upper limit up to 19 mi²), most
 * under 2,000 ac (NEH 630 Ch 15); CN 50–95 (common practice).
 */

export function potentialRetentionIn(curveNumber: number): number {
  return 1000 / curveNumber - 10;
}

export interface LagInput {
  readonly flowLengthFt: number;
  readonly curveNumber: number;
  readonly avgSlopePercent: number;
}

export function nrcsLagHr(input: LagInput): number {
  const s = potentialRetentionIn(input.curveNumber);
  return (
    (Math.pow(input.flowLengthFt, 0.8) * Math.pow(s + 1, 0.7)) /
    (1900 * Math.sqrt(input.avgSlopePercent))
  );
}

/** Tc = Lag/0.6 (NEH 630 Ch 15: lag is 0.6·Tc). */
export function nrcsLagTcHr(input: LagInput): number {
  return nrcsLagHr(input) / 0.6;
}

/** Range of the watersheds the equation was developed on, in acres (NEH 630 Ch 15, quoted). */
export const LAG_AREA_MIN_AC = 1.3;
export const LAG_AREA_TYPICAL_MAX_AC = 2_000;
/** Common-practice CN range for the lag equation. */
export const LAG_CN_MIN = 50;
export const LAG_CN_MAX = 95;
