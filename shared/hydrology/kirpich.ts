/**
 * Kirpich (1940) check.
 *
 *   tc = 0.0078·L^0.77·S^−0.385        tc min, L ft, S ft/ft (= 0.0078·(L³/H)^0.385, H ft fall)
 *   SI as printed: 0.0195·L^0.77·S^−0.385 with L m (0.0078/0.3048^0.77 = 0.01947, derived)
 *
 * Source: Kirpich (1940), Civil Engineering 10(6), as printed in a state DOT drainage manual.
 * Validity: small steep rural basins; developed on seven Tennessee farm basins of about 1 to
 * 112 ac with slopes of 3 to 10 % [from memory]. L is the whole flow path, S its fall / length.
 * Adjustment factors (a design rule, off by default): × 0.4 for overland flow on concrete or
 * asphalt, × 0.2 for concrete channels; none for bare soil or roadside ditches (Chow, Maidment &
 * Mays (1988) Table 15.1.2 [from memory]).
 */
import { AS_REPRODUCED } from "./citation";
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
  text: `small rural basins, about 1–112 ac, slopes 3–10 % (Kirpich 1940; ${AS_REPRODUCED})`,
} as const;

export const KIRPICH_ADJUSTMENTS = ["none", "paved-overland", "concrete-channel"] as const;
export type KirpichAdjustment = (typeof KIRPICH_ADJUSTMENTS)[number];

export const KIRPICH_FACTORS: Readonly<Record<KirpichAdjustment, number>> = {
  none: 1,
  "paved-overland": 0.4,
  "concrete-channel": 0.2,
};

export const KIRPICH_ADJUSTMENT_SOURCE = `Chow, Maidment & Mays (1988) Table 15.1.2 (${AS_REPRODUCED})`;
