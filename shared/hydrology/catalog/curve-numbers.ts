/**
 * All rows of TR-55 (1986) Tables 2-2a to 2-2d in one list, with a lookup by id.
 * Rows are ARC II with Ia = 0.2S (see CN_BASIS); other ARCs are converted by the method module.
 */
import { CN_ARID_RANGELAND } from "./cn-arid-rangeland";
import { CN_CULTIVATED } from "./cn-cultivated";
import { CN_OTHER_AGRICULTURAL } from "./cn-other-agricultural";
import { CN_URBAN } from "./cn-urban";
import { type CurveNumberRow } from "./types";

export { CN_ARID_RANGELAND, CN_CULTIVATED, CN_OTHER_AGRICULTURAL, CN_URBAN };
export { CN_BASIS } from "./cn-row";

export const CURVE_NUMBERS = [
  ...CN_URBAN,
  ...CN_CULTIVATED,
  ...CN_OTHER_AGRICULTURAL,
  ...CN_ARID_RANGELAND,
] as const;

export type CurveNumberId = (typeof CURVE_NUMBERS)[number]["id"];

export function curveNumberRow(id: CurveNumberId): CurveNumberRow {
  const row = CURVE_NUMBERS.find((r) => r.id === id);
  if (row === undefined) throw new Error(`No TR-55 Table 2-2 row with id "${id}"`);
  return row;
}
