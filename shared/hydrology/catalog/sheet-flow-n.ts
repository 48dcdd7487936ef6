/**
 * Manning's n for sheet flow, TR-55 (1986) Table 3-1 (dimensionless).
 *
 * Used only in the sheet-flow equation Tt = 0.007·(n·L)^0.8 / (P2^0.5·s^0.4) (TR-55 eq 3-3)
 * and the kinematic-wave overland flow equation; these n are far larger than channel n because
 * they lump raindrop impact, drag over the surface, obstacles and erosion/transport of sediment
 * over a flow depth of about 0.1 ft. Sheet flow lengths: at most 300 ft (TR-55, 1986) or 100 ft
 * (NEH 630 Ch 15, 2010), by design rule.
 */
import { type SheetFlowNRow } from "./types";

const SOURCE = "TR-55 (1986) Table 3-1 [from memory]";
const WOODS_NOTE =
  "Table 3-1 footnote [from memory]: for woody cover consider cover to a height of about " +
  "0.1 ft, the only part of the plant cover that obstructs sheet flow.";

function nRow<const Id extends string>(
  id: Id,
  surface: string,
  n: number,
  note?: string,
): SheetFlowNRow & { readonly id: Id } {
  return note === undefined
    ? { id, surface, n, source: SOURCE }
    : { id, surface, n, source: SOURCE, note };
}

export const SHEET_FLOW_N = [
  nRow("smooth", "Smooth surfaces (concrete, asphalt, gravel or bare soil)", 0.011),
  nRow("fallow", "Fallow (no residue)", 0.05),
  nRow("cultivated-residue-le-20", "Cultivated soils, residue cover ≤ 20 %", 0.06),
  nRow("cultivated-residue-gt-20", "Cultivated soils, residue cover > 20 %", 0.17),
  nRow("grass-short-prairie", "Grass: short-grass prairie", 0.15),
  nRow(
    "grass-dense",
    "Grass: dense grasses",
    0.24,
    "Table 3-1 footnote [from memory]: species such as weeping lovegrass, bluegrass, buffalo " +
      "grass, blue grama grass and native grass mixtures.",
  ),
  nRow("grass-bermuda", "Grass: Bermudagrass", 0.41),
  nRow("range-natural", "Range (natural)", 0.13),
  nRow("woods-light-underbrush", "Woods: light underbrush", 0.4, WOODS_NOTE),
  nRow("woods-dense-underbrush", "Woods: dense underbrush", 0.8, WOODS_NOTE),
] as const;

export type SheetFlowNId = (typeof SHEET_FLOW_N)[number]["id"];

export function sheetFlowNRow(id: SheetFlowNId): SheetFlowNRow {
  const row = SHEET_FLOW_N.find((r) => r.id === id);
  if (row === undefined) throw new Error(`No TR-55 Table 3-1 row with id "${id}"`);
  return row;
}
