/**
 * The longest flow path of a basin: the upstream cell of greatest flow length to the outlet
 * (flow length to the grid's exit minus the outlet's own), traced down its D8 directions.
 *
 * The path starts on the divide: at the upstream side of that cell, half a step back against its
 * direction (a corner for a diagonal), not at its centre, so a one-cell basin still has a path
 * and the length counts the ground the water crosses in the first cell. (A cell that drains out
 * of the grid has no direction; a one-cell basin there starts half a north step away.) It ends
 * at the outlet cell's centre. Where the path crosses conditioned ground — cells raised by
 * filling, routed across a flat, or lowered by breaching — the stretches are listed with their
 * distances from the start.
 */
import { D_COL, D_ROW, offsets, stepTable } from "./d8";
import { COND_BREACHED, COND_FILLED, COND_FLAT, type RoutedGrid } from "./types";

export type ConditionKind = "filled" | "flat" | "breached";

export interface ConditionedStretch {
  readonly kind: ConditionKind;
  /** Distance from the path's start (the divide), metres. */
  readonly fromM: number;
  readonly toM: number;
}

export interface LongestPath {
  /** Vertices in grid units (u columns, v rows from the grid's outer corner), divide first. */
  readonly points: number[];
  readonly lengthM: number;
  /** Cells on the path, start to outlet. */
  readonly cells: Int32Array;
  readonly stretches: ConditionedStretch[];
}

const KINDS: [ConditionKind, number][] = [
  ["filled", COND_FILLED],
  ["flat", COND_FLAT],
  ["breached", COND_BREACHED],
];

export function longestFlowPath(
  routed: RoutedGrid,
  basin: Int32Array,
  outlet: number,
): LongestPath {
  const { width, height, dir, flowLenM, cond, metrics } = routed;
  const steps = stepTable(metrics, height);
  const off = offsets(width);
  const half = (c: number) => {
    const d = dir[c]!;
    const row = (c / width) | 0;
    return d === 0 ? metrics.northM[row]! / 2 : steps[row * 9 + d]! / 2;
  };
  // The farthest reach is a cell's flow length plus at most half its longest step, so only the
  // cells within that half step of the longest flow length seen so far are weighed.
  let maxHalf = 0;
  for (let k = 0; k < steps.length; k += 1) if (steps[k]! / 2 > maxHalf) maxHalf = steps[k]! / 2;
  let longest = -Infinity;
  let start = outlet;
  let best = -Infinity;
  for (let k = 0; k < basin.length; k += 1) {
    const c = basin[k]!;
    const len = flowLenM[c]!;
    if (len > longest) longest = len;
    if (len < longest - maxHalf) continue;
    const reach = len + half(c);
    if (reach > best || (reach === best && c < start)) [best, start] = [reach, c];
  }
  const cells: number[] = [];
  for (let c = start; ; c += off[dir[c]!]!) {
    cells.push(c);
    if (c === outlet) break;
  }
  // Stations of the cell centres along the path (float64 sums of the true steps).
  const stations = new Float64Array(cells.length);
  stations[0] = half(start);
  for (let i = 1; i < cells.length; i += 1) {
    const prev = cells[i - 1]!;
    stations[i] = stations[i - 1]! + steps[((prev / width) | 0) * 9 + dir[prev]!]!;
  }
  const lengthM = stations[cells.length - 1]!;
  return {
    points: pathPoints(cells, dir, width),
    lengthM,
    cells: Int32Array.from(cells),
    stretches: stretchesOf(cells, stations, cond, lengthM),
  };
}

/** Divide point, then cell centres where the direction changes, then the outlet's centre. */
function pathPoints(cells: number[], dir: Uint8Array, width: number): number[] {
  const centre = (c: number) => {
    const row = (c / width) | 0;
    return [c - row * width + 0.5, row + 0.5];
  };
  const first = cells[0]!;
  const d = dir[first]!;
  const [u0, v0] = centre(first) as [number, number];
  const back = d === 0 ? [0, -0.5] : [-D_COL[d]! / 2, -D_ROW[d]! / 2];
  const points = [u0 + back[0]!, v0 + back[1]!, u0, v0];
  for (let i = 1; i < cells.length; i += 1) {
    const c = cells[i]!;
    const last = i === cells.length - 1;
    if (last || dir[c] !== dir[cells[i - 1]!]) points.push(...centre(c));
  }
  return points;
}

function stretchesOf(
  cells: number[],
  stations: Float64Array,
  cond: Uint8Array,
  lengthM: number,
): ConditionedStretch[] {
  const out: ConditionedStretch[] = [];
  const n = cells.length;
  // A cell spans from halfway to the previous centre to halfway to the next.
  const upper = (i: number) => (i === 0 ? 0 : (stations[i - 1]! + stations[i]!) / 2);
  const lower = (i: number) => (i === n - 1 ? lengthM : (stations[i]! + stations[i + 1]!) / 2);
  for (const [kind, bit] of KINDS) {
    for (let i = 0; i < n; i += 1) {
      if ((cond[cells[i]!]! & bit) === 0) continue;
      let j = i;
      while (j + 1 < n && (cond[cells[j + 1]!]! & bit) !== 0) j += 1;
      out.push({ kind, fromM: upper(i), toM: lower(j) });
      i = j;
    }
  }
  return out.sort((a, b) => a.fromM - b.fromM);
}
