/**
 * Flow accumulation and downstream flow length from D8 codes and in-flow counts. Accumulation
 * walks down from every cell nothing drains into, handing its total to the cell below, and goes
 * on down only when that cell has heard from all its donors (a topological order, Kahn 1962,
 * followed path by path so the walks stay in the same stretch of memory). The walks record the
 * order; flow length then adds true step lengths back along it, downstream cells first.
 */
import { offsets } from "./d8";

export interface Accumulation {
  /** Cells draining through each cell, itself included; 0 on nodata. */
  readonly acc: Uint32Array;
  /** Data cells, each after every cell upstream of it; `count` of them. */
  readonly order: Int32Array;
  readonly count: number;
}

/** In-flow count that marks a cell as done (or as nodata, never walked). */
export const INFLOW_DONE = 255;

/**
 * `inflow` holds each cell's number of donors (INFLOW_DONE on nodata) and is consumed.
 */
export function accumulate(dir: Uint8Array, inflow: Uint8Array, width: number): Accumulation {
  const n = dir.length;
  const off = offsets(width);
  const order = new Int32Array(n);
  const acc = new Uint32Array(n);
  let count = 0;
  for (let start = 0; start < n; start += 1) {
    if (inflow[start] !== 0) continue;
    let c = start;
    for (;;) {
      inflow[c] = INFLOW_DONE;
      order[count] = c;
      count += 1;
      const a = acc[c]! + 1;
      acc[c] = a;
      const d = dir[c]!;
      if (d === 0) break;
      const down = c + off[d]!;
      acc[down] = acc[down]! + a;
      const left = inflow[down]! - 1;
      inflow[down] = left;
      if (left !== 0) break;
      c = down;
    }
  }
  return { acc, order, count };
}

/**
 * Distance in metres along the D8 path from each cell's centre to the cell where it leaves the
 * grid (0 there and on nodata). `steps` is the per-row table of d8.ts.
 */
export function flowLengths(
  dir: Uint8Array,
  order: Int32Array,
  count: number,
  width: number,
  steps: Float64Array,
): Float32Array {
  const off = offsets(width);
  const len = new Float32Array(dir.length);
  // Rows by a multiplication, not a division; the half keeps multiples of the width exact.
  const perRow = 1 / width;
  for (let k = count - 1; k >= 0; k -= 1) {
    const c = order[k]!;
    const d = dir[c]!;
    if (d !== 0) len[c] = len[c + off[d]!]! + steps[(((c + 0.5) * perRow) | 0) * 9 + d]!;
  }
  return len;
}
