/**
 * Kerby (1959) retardance coefficient N for overland flow, used by the Kerby check
 * tc = 0.828·(L·N)^0.467·S^-0.235 (tc min, L ft, S ft/ft; valid for L ≤ 1,200 ft).
 * N is a retardance factor of its own, not Manning's n. Dimensionless.
 */
import { type KerbyNRow } from "./types";

const SOURCE =
  "Kerby (1959), Time of concentration for overland flow, Civil Engineering 29(3), " +
  "retardance table [from memory]";

function kerbyRow<const Id extends string>(
  id: Id,
  surface: string,
  retardanceN: number,
): KerbyNRow & { readonly id: Id } {
  return { id, surface, retardanceN, source: SOURCE };
}

export const KERBY_N = [
  kerbyRow("smooth-impervious", "Smooth impervious surface (pavement)", 0.02),
  kerbyRow("bare-packed-soil", "Smooth bare packed soil", 0.1),
  kerbyRow("poor-grass", "Poor grass, cultivated row crops or moderately rough bare surface", 0.2),
  kerbyRow("average-grass", "Pasture or average grass", 0.4),
  kerbyRow("deciduous-timber", "Deciduous timberland", 0.6),
  kerbyRow(
    "dense-grass-conifer",
    "Conifer timberland, deciduous timberland with deep forest litter, or dense grass",
    0.8,
  ),
] as const;

export type KerbyNId = (typeof KERBY_N)[number]["id"];

export function kerbyNRow(id: KerbyNId): KerbyNRow {
  const row = KERBY_N.find((r) => r.id === id);
  if (row === undefined) throw new Error(`No Kerby retardance row with id "${id}"`);
  return row;
}
