/**
 * The desk's undo and redo: each saved change to the flow path (a trace, a reshaping, a
 * deleted vertex) or to a regime break, with what was there before and after. Undo puts the
 * "before" back through the same saving routes as any edit, so the server keeps every version
 * and the sheet is computed for what is on screen; redo puts the "after" back.
 */
import type { LonLat } from "../../../../shared/geo";
import type { BreakChange } from "./regime-edit";

export type DeskChange =
  | { kind: "path"; before: readonly LonLat[]; after: readonly LonLat[] }
  | { kind: "breaks"; before: BreakChange; after: BreakChange };

export interface DeskHistory {
  undo: readonly DeskChange[];
  redo: readonly DeskChange[];
}

/** Older changes drop off beyond this many. */
export const HISTORY_LIMIT = 50;

export const EMPTY_HISTORY: DeskHistory = { undo: [], redo: [] };

/** A new change: it can be undone, and nothing undone before it can be redone any more. */
export function recordChange(h: DeskHistory, change: DeskChange): DeskHistory {
  return { undo: [...h.undo, change].slice(-HISTORY_LIMIT), redo: [] };
}

/** The change to take back and the history after it, or null when there is none. */
export function undoStep(h: DeskHistory): { change: DeskChange; history: DeskHistory } | null {
  const change = h.undo.at(-1);
  if (!change) return null;
  return { change, history: { undo: h.undo.slice(0, -1), redo: [...h.redo, change] } };
}

/** The change to make again and the history after it, or null when there is none. */
export function redoStep(h: DeskHistory): { change: DeskChange; history: DeskHistory } | null {
  const change = h.redo.at(-1);
  if (!change) return null;
  return { change, history: { undo: [...h.undo, change], redo: h.redo.slice(0, -1) } };
}
