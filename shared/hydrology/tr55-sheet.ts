/**
 * TR-55 sheet flow (Overton and Meadows kinematic solution, 2-year 24-hour rainfall).
 *
 *   Tt = 0.007·(n·L)^0.8 / (P2^0.5 · s^0.4)
 *   Tt h, n Manning's n for sheet flow (TR-55 Table 3-1), L ft, P2 in, s ft/ft
 *
 * Source: TR-55 (1986) eq 3-3; NEH Part 630 Ch 15 (2010) eq 15-8. SI form: the same equation
 * with L m and P2 mm takes 0.007·(1/0.3048)^0.8·25.4^0.5 = 0.09133 (printed 0.0913, derived);
 * Rillmark converts SI input to US and uses 0.007, so both systems agree exactly.
 * Validity: sheet flow length at most 300 ft (TR-55 1986 worksheet) or 100 ft (NEH 630 Ch 15,
 * 2010), or the McCuen–Spiess limit L = 100·s^0.5/n ft (NEH 630 eq 15-9); a design rule picks.
 */
import { MM_PER_IN, M_PER_FT } from "./units";

export const TR55_SHEET_COEFF_US = 0.007;
/** Derived SI coefficient (L m, P2 mm): the exact conversion of 0.007. */
export const TR55_SHEET_COEFF_SI =
  TR55_SHEET_COEFF_US * Math.pow(1 / M_PER_FT, 0.8) * Math.sqrt(MM_PER_IN);

export interface SheetFlowInput {
  readonly manningN: number;
  readonly lengthFt: number;
  readonly p2In: number;
  readonly slopeFtPerFt: number;
}

export function sheetFlowTravelTimeHr(input: SheetFlowInput): number {
  const { manningN, lengthFt, p2In, slopeFtPerFt } = input;
  return (
    (TR55_SHEET_COEFF_US * Math.pow(manningN * lengthFt, 0.8)) /
    (Math.sqrt(p2In) * Math.pow(slopeFtPerFt, 0.4))
  );
}

/** McCuen–Spiess limit on sheet flow length, L = 100·s^0.5/n ft (NEH 630 Ch 15 eq 15-9). */
export function mcCuenSpiessMaxLengthFt(slopeFtPerFt: number, manningN: number): number {
  return (100 * Math.sqrt(slopeFtPerFt)) / manningN;
}
