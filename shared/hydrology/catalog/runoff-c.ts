/**
 * Runoff coefficients C for the rational method Q = Cf·C·i·A, FHWA HEC-22 Table 3-1
 * (after ASCE, 1960), dimensionless, for storms of 10-year return period or less; rarer storms
 * take the frequency factor Cf of HEC-22 Table 3-2 in the method module (Cf·C ≤ 1).
 *
 * The table gives ranges; the designer picks within them (lower for large, flat, permeable,
 * well-vegetated areas, higher for small, steep, dense-soiled, sparse ones). The default design
 * value is the middle of the range, a common-practice starting point until the engineer picks.
 */
import { type RunoffCRow } from "./types";

const SOURCE = "FHWA HEC-22 (3rd ed., 2009) Table 3-1 [from memory]";
const DESIGN_SOURCE = "mid-range of the HEC-22 Table 3-1 range (common practice) [derived]";

function cRow<const Id extends string>(
  id: Id,
  category: string,
  description: string,
  cLow: number,
  cHigh: number,
): RunoffCRow & { readonly id: Id } {
  // Mid-point of two 2-decimal bounds has at most 3 decimals; rounding drops binary noise.
  const cDesign = Math.round(((cLow + cHigh) / 2) * 1000) / 1000;
  return {
    id,
    category,
    description,
    cLow,
    cHigh,
    cDesign,
    source: SOURCE,
    designSource: DESIGN_SOURCE,
  };
}

export const RUNOFF_C = [
  cRow("business-downtown", "Business", "Downtown areas", 0.7, 0.95),
  cRow("business-neighborhood", "Business", "Neighborhood areas", 0.5, 0.7),
  cRow("residential-single-family", "Residential", "Single-family areas", 0.3, 0.5),
  cRow("residential-multi-detached", "Residential", "Multi-units, detached", 0.4, 0.6),
  cRow("residential-multi-attached", "Residential", "Multi-units, attached", 0.6, 0.75),
  cRow("residential-suburban", "Residential", "Suburban", 0.25, 0.4),
  cRow("residential-apartment", "Residential", "Apartment dwelling areas", 0.5, 0.7),
  cRow("industrial-light", "Industrial", "Light areas", 0.5, 0.8),
  cRow("industrial-heavy", "Industrial", "Heavy areas", 0.6, 0.9),
  cRow("parks-cemeteries", "Open", "Parks, cemeteries", 0.1, 0.25),
  cRow("playgrounds", "Open", "Playgrounds", 0.2, 0.4),
  cRow("railroad-yards", "Open", "Railroad yard areas", 0.2, 0.4),
  cRow("unimproved", "Open", "Unimproved areas", 0.1, 0.3),
  cRow("lawn-sandy-flat", "Lawns", "Sandy soil, flat, 2 %", 0.05, 0.1),
  cRow("lawn-sandy-average", "Lawns", "Sandy soil, average, 2 % to 7 %", 0.1, 0.15),
  cRow("lawn-sandy-steep", "Lawns", "Sandy soil, steep, 7 %", 0.15, 0.2),
  cRow("lawn-heavy-flat", "Lawns", "Heavy soil, flat, 2 %", 0.13, 0.17),
  cRow("lawn-heavy-average", "Lawns", "Heavy soil, average, 2 % to 7 %", 0.18, 0.22),
  cRow("lawn-heavy-steep", "Lawns", "Heavy soil, steep, 7 %", 0.25, 0.35),
  cRow("street-asphalt", "Streets", "Asphaltic", 0.7, 0.95),
  cRow("street-concrete", "Streets", "Concrete", 0.8, 0.95),
  cRow("street-brick", "Streets", "Brick", 0.7, 0.85),
  cRow("drives-walks", "Other impervious", "Drives and walks", 0.75, 0.85),
  cRow("roofs", "Other impervious", "Roofs", 0.75, 0.95),
] as const;

export type RunoffCId = (typeof RUNOFF_C)[number]["id"];

export function runoffCRow(id: RunoffCId): RunoffCRow {
  const row = RUNOFF_C.find((r) => r.id === id);
  if (row === undefined) throw new Error(`No HEC-22 Table 3-1 row with id "${id}"`);
  return row;
}
