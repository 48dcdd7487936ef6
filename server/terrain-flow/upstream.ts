/**
 * Outlets on the routed grid: snapping a click to the cell of largest accumulation near it, and
 * the cells draining to an outlet, found by walking against the flow from it (breadth-first
 * over the neighbours whose direction points in), so a click costs only its own basin.
 */
import { D_COL, D_ROW, OPPOSITE, offsets } from "./d8";
import type { RoutedGrid } from "./types";

/**
 * The cell of largest accumulation within `radius` cells (a disc) of (col, row); among equals
 * the nearest, then the first in row order. Nodata never wins.
 */
export function snapOutlet(routed: RoutedGrid, col: number, row: number, radius: number): number {
  const { width, height, acc } = routed;
  let best = row * width + col;
  let bestAcc = acc[best]!;
  let bestD2 = 0;
  const r = Math.floor(radius);
  for (let dr = -r; dr <= r; dr += 1) {
    for (let dc = -r; dc <= r; dc += 1) {
      const d2 = dr * dr + dc * dc;
      if (d2 > radius * radius) continue;
      const [q, s] = [col + dc, row + dr];
      if (q < 0 || s < 0 || q >= width || s >= height) continue;
      const at = s * width + q;
      const a = acc[at]!;
      if (
        a > bestAcc ||
        (a === bestAcc && a > 0 && (d2 < bestD2 || (d2 === bestD2 && at < best)))
      ) {
        [best, bestAcc, bestD2] = [at, a, d2];
      }
    }
  }
  return best;
}

/**
 * Cells draining to `outlet`, itself first, not entering any cell of `stops` (other outlets:
 * what drains to them is theirs).
 */
export function upstreamCells(
  routed: RoutedGrid,
  outlet: number,
  stops: ReadonlySet<number>,
): Int32Array {
  const { width, height, dir, acc } = routed;
  const off = offsets(width);
  const cells = new Int32Array(acc[outlet]!);
  cells[0] = outlet;
  let tail = 1;
  const checkStops = stops.size > 0;
  // Codes a neighbour must have to drain into the cell, by the neighbour's side.
  const [toW, toSW, toS, toSE, toE, toNE, toN, toNW] = [5, 6, 7, 8, 1, 2, 3, 4];
  const take = (nb: number) => {
    if (!checkStops || !stops.has(nb)) cells[tail++] = nb;
  };
  const perRow = 1 / width;
  for (let head = 0; head < tail; head += 1) {
    const c = cells[head]!;
    const row = ((c + 0.5) * perRow) | 0;
    const col = c - row * width;
    if (row > 0 && col > 0 && row < height - 1 && col < width - 1) {
      // Inside the grid, unrolled: the east neighbour drains in if it points west, and so on.
      if (dir[c + 1] === toW) take(c + 1);
      if (dir[c - width + 1] === toSW) take(c - width + 1);
      if (dir[c - width] === toS) take(c - width);
      if (dir[c - width - 1] === toSE) take(c - width - 1);
      if (dir[c - 1] === toE) take(c - 1);
      if (dir[c + width - 1] === toNE) take(c + width - 1);
      if (dir[c + width] === toN) take(c + width);
      if (dir[c + width + 1] === toNW) take(c + width + 1);
      continue;
    }
    for (let k = 1; k <= 8; k += 1) {
      const r = row + D_ROW[k]!;
      const q = col + D_COL[k]!;
      if (r < 0 || q < 0 || r >= height || q >= width) continue;
      const nb = c + off[k]!;
      if (dir[nb] === OPPOSITE[k]) take(nb);
    }
  }
  return cells.subarray(0, tail);
}
