/**
 * Kerby–Kirpich check: Kerby (1959) over the overland (sheet) part of the path plus Kirpich
 * (1940) over the rest (the concentrated part, its own length and fall / length).
 *
 *   tc = t_ov + t_ch,  t_ov = 0.828·(L_ov·N)^0.467·S_ov^−0.235,  t_ch = 0.0078·L_ch^0.77·S_ch^−0.385
 *   tc min, lengths ft, slopes ft/ft (SI coefficients 1.44 and 0.0195 are the derived conversions)
 *
 * Source: Roussel et al. (2005), as printed in a state DOT hydraulic design manual (read in a
 * public copy: overland length up to 1,200 ft; watersheds 0.25–150 mi², main channel 1–50 mi
 * long with slopes 0.002–0.02 ft/ft). Small urban subcatchments usually lie below that range, and
 * the sheet says so.
 */
import { ACRES_PER_SQUARE_MILE, FT_PER_MILE } from "./units";

export const KERBY_KIRPICH_RANGE = {
  areaMinAc: 0.25 * ACRES_PER_SQUARE_MILE,
  areaMaxAc: 150 * ACRES_PER_SQUARE_MILE,
  channelMinFt: 1 * FT_PER_MILE,
  channelMaxFt: 50 * FT_PER_MILE,
  slopeMin: 0.002,
  slopeMax: 0.02,
  text: "watersheds 0.25–150 mi², main channel 1–50 mi at 0.002–0.02 ft/ft (Roussel et al. 2005)",
} as const;

export const KERBY_KIRPICH_SOURCE =
  "Kerby (1959) overland + Kirpich (1940) channel, Roussel et al. (2005), as printed in a " +
  "state DOT hydraulic design manual";
