/**
 * FAA (1970) overland-flow check.
 *
 *   tc = 1.8·(1.1 − C)·L^0.5 / S^(1/3)      tc min, C rational runoff coefficient, L ft,
 *                                           S slope in PERCENT
 *   SI: 1.8/0.3048^0.5 = 3.26 with L m (derived)
 *
 * Source: FAA Advisory Circular 150/5320-5 (1970), as used in an urban drainage criteria manual.
 * Validity: overland flow, often capped at 500 ft [src]. Rillmark applies it to the sheet
 * segments: their total length and fall / length, with the subcatchment's C.
 */
import { M_PER_FT } from "./units";

export const FAA_COEFF_US = 1.8;
/** Derived SI coefficient (L m). */
export const FAA_COEFF_SI = FAA_COEFF_US / Math.sqrt(M_PER_FT);
export const FAA_MAX_LENGTH_FT = 500;

export function faaTcMin(runoffC: number, lengthFt: number, slopePercent: number): number {
  return (FAA_COEFF_US * (1.1 - runoffC) * Math.sqrt(lengthFt)) / Math.cbrt(slopePercent);
}
