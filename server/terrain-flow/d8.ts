/**
 * D8 neighbourhood tables (O'Callaghan & Mark 1984): code k = 1 … 8 is east, north-east, north,
 * north-west, west, south-west, south, south-east; rows run south, so "north" is row − 1.
 */
import type { CellMetrics } from "./types";

/** Column and row steps of codes 0 … 8 (code 0, "leaves the grid", has none). */
export const D_COL = Int8Array.of(0, 1, 1, 0, -1, -1, -1, 0, 1);
export const D_ROW = Int8Array.of(0, 0, -1, -1, -1, 0, 1, 1, 1);
/** The code pointing back: OPPOSITE[k] is the direction from the neighbour at k to the cell. */
export const OPPOSITE = Uint8Array.of(0, 5, 6, 7, 8, 1, 2, 3, 4);

/** Index offsets of codes 0 … 8 in a row-major grid `width` wide. */
export function offsets(width: number): Int32Array {
  return Int32Array.from(D_COL, (dc, k) => dc + D_ROW[k]! * width);
}

/**
 * Step lengths in metres by row and code, `steps[row * 9 + k]`: east and west the row's east
 * distance, north the row's north distance, south the next row's, diagonals likewise.
 */
export function stepTable(metrics: CellMetrics, height: number): Float64Array {
  const steps = new Float64Array(height * 9);
  for (let row = 0; row < height; row += 1) {
    const e = metrics.eastM[row]!;
    const n = metrics.northM[row]!;
    const s = metrics.northM[row + 1]!;
    const dn = metrics.diagNorthM[row]!;
    const ds = metrics.diagNorthM[row + 1]!;
    steps.set([0, e, dn, n, dn, e, ds, s, ds], row * 9);
  }
  return steps;
}
