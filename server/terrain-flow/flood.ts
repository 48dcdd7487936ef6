/**
 * Depression filling in one priority-flood pass (Barnes, Lehman & Mulla 2014, "Priority-Flood:
 * an optimal depression-filling and watershed-labeling algorithm for digital elevation models",
 * Computers & Geosciences 62): the grid's edge and the cells beside nodata are the seeds; cells
 * are taken lowest first, and a neighbour not yet reached is raised to the level it was reached
 * from when it lies lower (it is in a depression) and queued on a plain FIFO (the "pit queue"
 * of their improved variant).
 *
 * Slopes skip the heap (after Zhou, Sun & Fu 2016, "An efficient variant of the Priority-Flood
 * algorithm for filling depressions in raster digital elevation models", Computers &
 * Geosciences 90): a neighbour higher than the cell that reached it keeps its own elevation
 * whatever happens later, so when none of its unreached neighbours is as low as itself it is
 * finished at once; otherwise it waits in the heap for its level.
 *
 * Every cell reached records, as a D8 code in `parent`, the neighbour it was reached from (0
 * for seeds). Cells of one level are reached breadth-first from all of that level's lower
 * edges together (the heap's cells at the current level go before the pit queue), so on a flat
 * or a filled depression the parents lead to the nearest way out: directions.ts uses them
 * where a cell has no lower neighbour.
 */
import { D_COL, D_ROW, OPPOSITE, offsets } from "./d8";
import { CellQueue } from "./heap";
import { orderedBits, RadixHeap } from "./radix-heap";
import { COND_FILLED, NODATA_MASK, STATE_DONE, STATE_EDGE, STATE_QUEUED } from "./types";

export interface FillResult {
  readonly dataCells: number;
  readonly filledCells: number;
  /** Deepest rise, in the grid's vertical unit. */
  readonly maxFill: number;
}

/**
 * Fills `z` in place; writes reached-from codes into `parent` and COND_FILLED / NODATA_MASK
 * into `cond` (STATE_* bits are left set: the caller clears them).
 */
export function fillDepressions(
  z: Float32Array,
  width: number,
  height: number,
  parent: Uint8Array,
  cond: Uint8Array,
): FillResult {
  const n = width * height;
  const off = offsets(width);
  const heap = new RadixHeap();
  const pit = new CellQueue();
  const trace = new CellQueue();
  const reached = new Int32Array(8);
  let dataCells = 0;
  let filledCells = 0;
  let maxFill = 0;

  const seed = (c: number) => {
    if ((cond[c]! & (STATE_QUEUED | STATE_DONE)) !== 0) return;
    cond[c] = cond[c]! | STATE_QUEUED;
    parent[c] = 0;
    heap.push(c, orderedBits(z[c]!));
  };
  // Nodata is finished from the start (never reached); its neighbours are seeds.
  let nodata = 0;
  for (let c = 0; c < n; c += 1) {
    if (Number.isNaN(z[c]!)) {
      cond[c] = NODATA_MASK | STATE_DONE;
      nodata += 1;
    }
  }
  dataCells = n - nodata;
  // Edge cells are marked so that the inner loops test bounds only there.
  for (let col = 0; col < width; col += 1) {
    cond[col] = cond[col]! | STATE_EDGE;
    cond[(height - 1) * width + col] = cond[(height - 1) * width + col]! | STATE_EDGE;
  }
  for (let row = 0; row < height; row += 1) {
    cond[row * width] = cond[row * width]! | STATE_EDGE;
    cond[row * width + width - 1] = cond[row * width + width - 1]! | STATE_EDGE;
  }
  for (let col = 0; col < width; col += 1) {
    seed(col);
    seed((height - 1) * width + col);
  }
  for (let row = 0; row < height; row += 1) {
    seed(row * width);
    seed(row * width + width - 1);
  }
  if (nodata > 0) {
    for (let c = 0; c < n; c += 1) {
      if ((cond[c]! & NODATA_MASK) === 0) continue;
      const row = (c / width) | 0;
      const col = c - row * width;
      for (let k = 1; k <= 8; k += 1) {
        const r = row + D_ROW[k]!;
        const q = col + D_COL[k]!;
        if (r >= 0 && r < height && q >= 0 && q < width) seed(c + off[k]!);
      }
    }
  }

  /**
   * Finishes a cell reached from below unless an unreached neighbour is as low as it (then its
   * fate waits for that level): one scan decides and collects the neighbours to reach.
   */
  const finishUphill = (c: number): boolean => {
    const zc = z[c]!;
    const edge = (cond[c]! & STATE_EDGE) !== 0;
    const row = edge ? (c / width) | 0 : 0;
    const col = c - row * width;
    let found = 0;
    for (let k = 1; k <= 8; k += 1) {
      if (edge) {
        const r = row + D_ROW[k]!;
        const q = col + D_COL[k]!;
        if (r < 0 || r >= height || q < 0 || q >= width) continue;
      }
      const nb = c + off[k]!;
      if ((cond[nb]! & (STATE_QUEUED | STATE_DONE)) !== 0) continue;
      if (z[nb]! <= zc) return false;
      reached[found] = k;
      found += 1;
    }
    cond[c] = cond[c]! | STATE_DONE;
    for (let i = 0; i < found; i += 1) {
      const k = reached[i]!;
      const nb = c + off[k]!;
      parent[nb] = OPPOSITE[k]!;
      cond[nb] = cond[nb]! | STATE_QUEUED;
      trace.push(nb);
    }
    return true;
  };

  /** Finishes a cell: reaches its unreached neighbours, raising the lower ones. */
  const finish = (c: number) => {
    cond[c] = cond[c]! | STATE_DONE;
    const zc = z[c]!;
    const edge = (cond[c]! & STATE_EDGE) !== 0;
    const row = edge ? (c / width) | 0 : 0;
    const col = c - row * width;
    for (let k = 1; k <= 8; k += 1) {
      if (edge) {
        const r = row + D_ROW[k]!;
        const q = col + D_COL[k]!;
        if (r < 0 || r >= height || q < 0 || q >= width) continue;
      }
      const nb = c + off[k]!;
      const state = cond[nb]!;
      if ((state & (STATE_QUEUED | STATE_DONE)) !== 0) continue;
      parent[nb] = OPPOSITE[k]!;
      const zn = z[nb]!;
      if (zn > zc) {
        cond[nb] = state | STATE_QUEUED;
        trace.push(nb);
      } else {
        if (zn < zc) {
          z[nb] = zc;
          cond[nb] = state | STATE_QUEUED | COND_FILLED;
          filledCells += 1;
          if (zc - zn > maxFill) maxFill = zc - zn;
        } else {
          cond[nb] = state | STATE_QUEUED;
        }
        pit.push(nb);
      }
    }
  };

  for (;;) {
    if (trace.size > 0) {
      const c = trace.shift();
      if (!finishUphill(c)) heap.push(c, orderedBits(z[c]!));
      continue;
    }
    // Cells of the current level still in the heap (other edges of the same flat) go before
    // the pit queue, so a flat is flooded from all of its lower edges together.
    if (pit.size > 0 && !heap.hasLastKey) {
      finish(pit.shift());
    } else if (heap.size > 0) {
      finish(heap.pop());
    } else break;
  }
  return { dataCells, filledCells, maxFill };
}
