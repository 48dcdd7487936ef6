/**
 * Suggestions for attribute mapping. Cover: a layer's value (e.g. "WOODS", "Asphalt", "roof")
 * matched against the team's catalog classes — their key and name exactly ("exact"), or a
 * word from the list of common land-cover words below ("likely"). Soil: the hydrologic soil
 * group read from values like "B", "c", "C/D", "Group A", "HSG_B" or "B/D" (TR-55 chapter 2
 * groups; dual groups are kept as such and resolved at compute time by the design rule).
 */
import { HSG_CODES, type HsgCode } from "../../shared/geo/types";
import type { SuggestionConfidence } from "../../shared/schemas/layers";

export interface CatalogEntry {
  id: string;
  key: string;
  name: string;
}

export interface Suggestion {
  target: string;
  label: string;
  confidence: SuggestionConfidence;
}

const normal = (s: string) =>
  s
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, " ")
    .trim();

/**
 * Common land-cover words → the default catalog key they most often mean. The key is only
 * suggested when the team's catalog still has it; the GIS specialist confirms every value.
 */
const COVER_WORDS: readonly [RegExp, string][] = [
  [/\b(asphalt|pavement|paved|parking|road|street|highway|blacktop|impervious)\b/, "pavement"],
  [/\b(concrete|cement)\b/, "concrete"],
  [/\b(roofs?|building|buildings|rooftop|structure)\b/, "roof"],
  [/\b(driveway|sidewalk|walkway|walk|drive)\b/, "drive-walk"],
  [/\b(gravel|crushed stone)\b/, "gravel"],
  [/\b(bare|barren|dirt|fallow soil|exposed soil)\b/, "bare-soil"],
  [/\b(lawn|lawns|turf|grass|grassland|yard|park|open space)\b/, "lawn-good"],
  [/\b(swale|grassed channel)\b/, "grass-swale"],
  [/\b(pasture|grazing|hay)\b/, "pasture-good"],
  [/\b(meadow|meadows)\b/, "meadow"],
  [/\b(range|rangeland|prairie|scrub|shrub|shrubland|brush)\b/, "range-natural"],
  [/\b(desert)\b/, "desert-shrub"],
  [/\b(woods|wood|woodland|forest|forested|trees|timber|orchard)\b/, "woods-dense"],
  [/\b(crop|crops|cropland|row crop|cultivated|agriculture|agricultural|farm)\b/, "cultivated-row"],
  [/\b(fallow)\b/, "fallow"],
  [/\b(water|pond|lake|reservoir|river|stream|wetland)\b/, "water"],
];

export function suggestCoverClass(
  value: string,
  catalog: readonly CatalogEntry[],
): Suggestion | null {
  const v = normal(value);
  if (v === "") return null;
  const exact = catalog.find((c) => normal(c.key) === v || normal(c.name) === v);
  if (exact) return { target: exact.id, label: exact.name, confidence: "exact" };
  for (const [pattern, key] of COVER_WORDS) {
    if (!pattern.test(v)) continue;
    const entry = catalog.find((c) => c.key === key);
    if (entry) return { target: entry.id, label: entry.name, confidence: "likely" };
  }
  return null;
}

/** "B", "b", "Group A", "HSG_B", "hsg c", "C/D", "c-d", "B / D" → the group; else null. */
export function parseHsg(value: string): HsgCode | null {
  const v = value
    .toUpperCase()
    .replace(/[_\s]+/g, " ")
    .replace(/\b(HSG|GROUP|SOIL|HYDGRP|HYDROLOGIC)\b/g, " ")
    .trim();
  const dual = /^([ABC])\s*[/\-\\]\s*D$/.exec(v);
  if (dual) return `${dual[1]}/D` as HsgCode;
  const single = /^([ABCD])$/.exec(v);
  const code = single?.[1];
  return code && (HSG_CODES as readonly string[]).includes(code) ? (code as HsgCode) : null;
}

export function suggestHsg(value: string): Suggestion | null {
  const hsg = parseHsg(value);
  if (!hsg) return null;
  const exact = value.trim().toUpperCase() === hsg;
  return { target: hsg, label: `HSG ${hsg}`, confidence: exact ? "exact" : "likely" };
}
