/**
 * Helpers that copy a value out of a published table row into a surface class, keeping the row
 * id and its source string, so a class never restates a number by hand.
 */
import { curveNumberRow, type CurveNumberId } from "./curve-numbers";
import { kerbyNRow, type KerbyNId } from "./kerby-n";
import { runoffCRow, type RunoffCId } from "./runoff-c";
import { sheetFlowNRow, type SheetFlowNId } from "./sheet-flow-n";
import {
  type CatalogGap,
  type CatalogPick,
  type CnByHsg,
  type RunoffCRange,
  type VelocityK,
} from "./types";
import { velocityKRow, type VelocityKId } from "./velocity-k";

const CHOICE = "Rillmark default pairing (review against local criteria)";

function choice(note: string | undefined, fallback: string): string {
  return `${note ?? fallback}. ${CHOICE}.`;
}

export function sheetN(id: SheetFlowNId, note?: string): CatalogPick<number> {
  const row = sheetFlowNRow(id);
  return { rowId: id, value: row.n, source: row.source, note: choice(note, row.surface) };
}

export function nehK(id: VelocityKId & `neh-${string}`, note?: string): CatalogPick<VelocityK> {
  const row = velocityKRow(id);
  return {
    rowId: id,
    value: { kFtPerS: row.kFtPerS, kMPerS: row.kMPerS },
    source: row.source,
    note: choice(note, row.surface),
  };
}

export function tr55K(kind: "paved" | "unpaved"): CatalogPick<VelocityK> {
  const row = velocityKRow(kind === "paved" ? "tr55-paved" : "tr55-unpaved");
  return {
    rowId: row.id,
    value: { kFtPerS: row.kFtPerS, kMPerS: row.kMPerS },
    source: row.source,
    note: choice(undefined, row.surface),
  };
}

export function kerby(id: KerbyNId, note?: string): CatalogPick<number> {
  const row = kerbyNRow(id);
  return { rowId: id, value: row.retardanceN, source: row.source, note: choice(note, row.surface) };
}

export function cn(id: CurveNumberId, note?: string): CatalogPick<CnByHsg> {
  const row = curveNumberRow(id);
  const condition =
    row.condition === null || row.cover.includes("condition") ? null : `${row.condition} condition`;
  const label = [row.cover, row.treatment, condition].filter((p) => p !== null).join(", ");
  return { rowId: id, value: row.cn, source: row.source, note: choice(note, label) };
}

export function runoffC(id: RunoffCId, note?: string): CatalogPick<RunoffCRange> {
  const row = runoffCRow(id);
  return {
    rowId: id,
    value: { low: row.cLow, high: row.cHigh, design: row.cDesign },
    source: `${row.source}; design value: ${row.designSource}`,
    note: choice(note, `${row.category}: ${row.description}`),
  };
}

/** A parameter left empty on purpose; the team fills it from its own criteria. */
export function gap(source: string, note: string): CatalogGap {
  return { rowId: null, value: null, source, note };
}
