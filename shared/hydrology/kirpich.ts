/**
 * Kirpich (1940) check.
 *
 *   tc = 0.0078·L^0.77·S^−0.385        tc min, L ft, S ft/ft (= 0.0078·(L³/H)^0.385, H ft fall)
 *   SI as printed: 0.0195·L^0.77·S^−0.385 with L m (0.0078/0.3048^0.77 = 0.01947, derived)
 *
 * Source: Kirpich (1940), Civil Engineering 10(6), as printed in a state DOT drainage manual.
 * Validity: small steep rural basins; developed on seven Tennessee farm basins of about 1 to
 * 112 ac with slopes of 3 to 10 % [from memory]. L is the whole flow path, S its fall / length.
 */
import { M_PER_FT } from "./units";

export const KIRPICH_COEFF_US = 0.0078;
/** Derived SI coefficient (L m): the exact conversion of 0.0078; printed 0.0195. */
export const KIRPICH_COEFF_SI = KIRPICH_COEFF_US / Math.pow(M_PER_FT, 0.77);

export function kirpichTcMin(lengthFt: number, slopeFtPerFt: number): number {
  return KIRPICH_COEFF_US * Math.pow(lengthFt, 0.77) * Math.pow(slopeFtPerFt, -0.385);
}

export const KIRPICH_RANGE = {
  areaMaxAc: 112,
  slopeMinFtPerFt: 0.03,
  slopeMaxFtPerFt: 0.1,
  text: "small rural basins, about 1–112 ac, slopes 3–10 % (Kirpich 1940) [from memory]",
} as const;
