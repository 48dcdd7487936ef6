/**
 * TR-55 shallow concentrated flow.
 *
 *   unpaved: V = 16.1345·s^0.5      paved: V = 20.3282·s^0.5      V ft/s, s ft/ft
 *
 * Source: TR-55 (1986) Figure 3-1 and Appendix F [from memory]. The coefficients are NEH 630
 * Table 15-3's grassed-waterway (n 0.050, r 0.4 ft) and pavement (n 0.025, r 0.2 ft) rows,
 * computed as (1.486/n)·r^(2/3); they are used verbatim. Other surfaces take their own k.
 * Validity: flow concentrated in rills and small gullies after sheet flow ends; s ≥ 0.001.
 */
import { velocityFromK } from "./velocity";

export const TR55_UNPAVED_K_FT_PER_S = 16.1345;
export const TR55_PAVED_K_FT_PER_S = 20.3282;

export type ShallowSurface = "paved" | "unpaved";

export function shallowConcentratedVelocityFtPerS(
  surface: ShallowSurface,
  slopeFtPerFt: number,
): number {
  const k = surface === "paved" ? TR55_PAVED_K_FT_PER_S : TR55_UNPAVED_K_FT_PER_S;
  return velocityFromK(k, slopeFtPerFt);
}
