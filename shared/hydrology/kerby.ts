/**
 * Kerby (1959) overland-flow check.
 *
 *   tc = 0.828·(L·N)^0.467·S^−0.235     tc min, L overland length ft, N retardance, S ft/ft
 *   SI as printed: 1.44·(L·N)^0.467·S^−0.235 with L m (0.828/0.3048^0.467 = 1.442, derived)
 *
 * Source: Kerby (1959), Civil Engineering 29(3), as printed in a state DOT drainage manual.
 * Retardance N: pavement 0.02, bare packed soil 0.10, poor grass 0.20, average grass 0.40,
 * deciduous forest 0.60, dense grass / conifer 0.80 [from memory].
 * Validity: overland (sheet) flow, L ≤ 1,200 ft [src]. Rillmark applies it to the sheet
 * segments of the path: their total length, length-weighted N, and fall / length.
 */
import { M_PER_FT } from "./units";

export const KERBY_COEFF_US = 0.828;
/** Derived SI coefficient (L m): the exact conversion of 0.828; printed 1.44. */
export const KERBY_COEFF_SI = KERBY_COEFF_US / Math.pow(M_PER_FT, 0.467);
export const KERBY_MAX_LENGTH_FT = 1_200;

export function kerbyTcMin(lengthFt: number, retardanceN: number, slopeFtPerFt: number): number {
  return KERBY_COEFF_US * Math.pow(lengthFt * retardanceN, 0.467) * Math.pow(slopeFtPerFt, -0.235);
}
