/**
 * The desk's undo and redo: each saved change to the flow path (a trace, a reshaping, a
 * deleted vertex, a reversal), to a regime break or to the subcatchment's boundary or outlet,
 * with what was there before and after. Undo puts the
 * "before" back through the same saving routes as any edit, so the server keeps every version
 * and the sheet is computed for what is on screen; redo puts the "after" back.
 */
import type { LonLat } from "../../../../shared/geo";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import type { BreakChange } from "./regime-edit";

/** Boundary and outlet as the subcatchment update sends them; a field left out is kept. */
export interface OutlineChange {
  boundary?: Subcatchment["boundary"];
  outlet?: Subcatchment["outlet"];
}

export type DeskChange =
  | { kind: "path"; before: readonly LonLat[]; after: readonly LonLat[] }
  | { kind: "breaks"; before: BreakChange; after: BreakChange }
  // Reversing is its own inverse, so it is undone by reversing again (surveyed points and
  // surface stretches turn back with the path); before and after are the engineer's breaks,
  // which a reversal clears because they count from the divide.
  | { kind: "reverse"; before: BreakChange; after: BreakChange }
  | { kind: "outline"; before: OutlineChange; after: OutlineChange };

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

/** A reversal of the saved path, with the breaks it clears. */
export function reverseChange(breaks: Subcatchment["breaks"]): DeskChange {
  return {
    kind: "reverse",
    before: { sheetEnd: breaks.sheetEnd, channelStart: breaks.channelStart },
    after: { sheetEnd: null, channelStart: null },
  };
}

/** A new boundary or outlet, with what the subcatchment had for just those fields. */
export function outlineChange(
  current: Pick<Subcatchment, "boundary" | "outlet">,
  next: OutlineChange,
): DeskChange {
  const before: OutlineChange = {};
  if (next.boundary !== undefined) before.boundary = current.boundary;
  if (next.outlet !== undefined) before.outlet = current.outlet;
  return { kind: "outline", before, after: next };
}

/** Breaks worth sending back: none set means nothing to put back after a reversal. */
export function hasBreaks(change: BreakChange): boolean {
  return (
    (change.sheetEnd !== undefined && change.sheetEnd !== null) ||
    (change.channelStart !== undefined && change.channelStart !== null)
  );
}

/** A ring drawn on the map as the new boundary, or null when it is too short for an area. */
export function areaOutline(ring: readonly LonLat[]): OutlineChange | null {
  if (ring.length < 4) return null;
  const closed = ring.map(([x, y]): [number, number] => [x, y]);
  return { boundary: { type: "Polygon", coordinates: [closed] } };
}

/** A point clicked on the map as the new outlet. */
export function outletOutline(point: LonLat): OutlineChange {
  return { outlet: { type: "Point", coordinates: [point[0], point[1]] } };
}
