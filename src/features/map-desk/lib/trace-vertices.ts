/**
 * The vertices of a flow path being traced. terra-draw's line being drawn carries one point
 * more than the engineer has clicked: its live end, which follows the pointer until the trace
 * is finished. The live split runs on the clicked vertices only, so moving the pointer redraws
 * nothing on the sheet; each click does.
 */
import type { LonLat } from "../../../../shared/geo";

/** The clicked vertices of a traced line; `drawing` is true while its live end is on it. */
export function placedVertices(coords: readonly LonLat[], drawing: boolean): LonLat[] {
  const placed = drawing ? coords.slice(0, -1) : [...coords];
  // A double click (or a click without a move) can repeat the last vertex: one vertex, not two.
  return placed.filter((p, i) => i === 0 || !sameVertex(p, placed[i - 1]!));
}

function sameVertex(a: LonLat, b: LonLat): boolean {
  return a[0] === b[0] && a[1] === b[1];
}

/** Whether two vertex lists are the same, point for point. */
export function sameVertices(a: readonly LonLat[], b: readonly LonLat[]): boolean {
  return a.length === b.length && a.every((p, i) => sameVertex(p, b[i]!));
}
