/**
 * Least-cost breaching (after Lindsay 2016, "Efficient hybrid breaching-filling sink removal
 * methods for flow path enforcement in digital elevation models", Hydrological Processes 30):
 * a road embankment or a culvert the DEM cannot see dams a valley, and filling it would flood
 * everything upstream into one flat. Breaching instead cuts a channel through the dam.
 *
 * Each pit (a cell lower than all eight neighbours), lowest first, searches outward
 * (Dijkstra) for the cheapest way to a cell lower than itself or to where water leaves the grid
 * (an edge, or nodata), the cost of a path being the total depth its cells must be lowered to
 * the pit's level. The search stays within `maxLengthCells` of the pit and never enters a cell
 * that would need a cut deeper than `maxDepthM`. The path found is lowered to a steady descent
 * from the pit to its end (cells are only ever lowered). Pits it cannot open stay for the
 * priority flood to fill: the hybrid of the paper. Flat-bottomed depressions (no single lowest
 * cell) are filled.
 */
import { D_COL, D_ROW, offsets } from "./d8";
import { CellHeap } from "./heap";
import { COND_BREACHED, type ElevationGrid } from "./types";

export interface BreachOptions {
  /** Deepest cut allowed, metres. */
  readonly maxDepthM: number;
  /** Farthest a breach may reach from its pit, in cells (chessboard distance). */
  readonly maxLengthCells: number;
}

/**
 * Rillmark's defaults (a Design rule may change them): enough to open a road embankment or a
 * culvert crossing on a 1–5 m DEM, not enough to cut through a real ridge.
 */
export const BREACH_DEFAULTS: BreachOptions = { maxDepthM: 3, maxLengthCells: 100 };

export interface BreachResult {
  readonly breachedPits: number;
  readonly breachedCells: number;
  /** Deepest cut made, in the grid's vertical unit. */
  readonly maxDepth: number;
  readonly unbreachedPits: number;
}

/** How far below the pit the end of a breach that leaves the grid is set (vertical units). */
const EXIT_DROP = 1e-3;
/** Added per step so that among equally cheap paths the shortest wins. */
const STEP_COST = 1e-9;

function findPits(z: Float32Array, width: number, height: number): Int32Array {
  const off = offsets(width);
  const pits: number[] = [];
  for (let row = 1; row < height - 1; row += 1) {
    for (let col = 1; col < width - 1; col += 1) {
      const c = row * width + col;
      const zc = z[c]!;
      if (Number.isNaN(zc)) continue;
      let pit = true;
      for (let k = 1; k <= 8 && pit; k += 1) {
        // NaN fails `>`: a cell beside nodata drains into it and is no pit.
        if (!(z[c + off[k]!]! > zc)) pit = false;
      }
      if (pit) pits.push(c);
    }
  }
  return Int32Array.from(pits.sort((a, b) => z[a]! - z[b]!));
}

export function breachDepressions(
  grid: ElevationGrid,
  steps: Float64Array,
  cond: Uint8Array,
  options: Partial<BreachOptions>,
): BreachResult {
  const { z, width, height, verticalToM } = grid;
  const maxDepth = (options.maxDepthM ?? BREACH_DEFAULTS.maxDepthM) / verticalToM;
  const radius = Math.max(1, Math.floor(options.maxLengthCells ?? BREACH_DEFAULTS.maxLengthCells));
  const side = 2 * radius + 1;
  const off = offsets(width);
  const cost = new Float64Array(side * side);
  const prev = new Int32Array(side * side);
  const stamp = new Int32Array(side * side);
  const heap = new CellHeap();
  const result = { breachedPits: 0, breachedCells: 0, maxDepth: 0, unbreachedPits: 0 };
  const pits = findPits(z, width, height);
  let search = 0;

  const isExit = (c: number, row: number, col: number) => {
    if (row === 0 || col === 0 || row === height - 1 || col === width - 1) return true;
    for (let k = 1; k <= 8; k += 1) if (Number.isNaN(z[c + off[k]!]!)) return true;
    return false;
  };

  for (const pit of pits) {
    const zp = z[pit]!;
    let still = true;
    for (let k = 1; k <= 8 && still; k += 1) if (!(z[pit + off[k]!]! > zp)) still = false;
    if (!still) continue; // an earlier breach opened it
    search += 1;
    const pr = (pit / width) | 0;
    const pc = pit - pr * width;
    const local = (row: number, col: number) => (row - pr + radius) * side + (col - pc + radius);
    heap.size = 0;
    const start = local(pr, pc);
    stamp[start] = search;
    cost[start] = 0;
    prev[start] = -1;
    heap.push(start, 0);
    let end = -1;
    while (heap.size > 0) {
      const at = heap.pop();
      const row = pr - radius + Math.floor(at / side);
      const col = pc - radius + (at % side);
      const c = row * width + col;
      if (c !== pit && (z[c]! < zp || isExit(c, row, col))) {
        end = at;
        break;
      }
      if (cost[at]! < 0) continue; // already settled (a stale heap entry)
      const settled = cost[at]!;
      cost[at] = -1 - settled;
      for (let k = 1; k <= 8; k += 1) {
        const r = row + D_ROW[k]!;
        const q = col + D_COL[k]!;
        if (Math.abs(r - pr) > radius || Math.abs(q - pc) > radius) continue;
        const zn = z[c + off[k]!]!;
        if (Number.isNaN(zn) || zn - zp > maxDepth) continue;
        const next = local(r, q);
        const through = settled + Math.max(zn - zp, 0) + STEP_COST * steps[row * 9 + k]!;
        if (stamp[next] === search && (cost[next]! < 0 || cost[next]! <= through)) continue;
        stamp[next] = search;
        cost[next] = through;
        prev[next] = at;
        heap.push(next, through);
      }
    }
    if (end < 0) {
      result.unbreachedPits += 1;
      continue;
    }
    carve(end, pit);
  }
  return result;

  /** Lowers the path from the pit to `end` (an index in the pit's window) to a steady descent. */
  function carve(end: number, pit: number) {
    const pr = (pit / width) | 0;
    const pc = pit - pr * width;
    const cells: number[] = [];
    for (let at = end; at >= 0; at = prev[at]!) {
      cells.push((pr - radius + Math.floor(at / side)) * width + (pc - radius + (at % side)));
    }
    cells.reverse(); // pit first
    const zp = z[pit]!;
    const zEnd = Math.min(z[cells[cells.length - 1]!]!, zp - EXIT_DROP);
    const m = cells.length - 1;
    let before = zp;
    let lowered = 0;
    for (let i = 1; i <= m; i += 1) {
      const c = cells[i]!;
      const wanted = Math.fround(Math.min(z[c]!, zp - ((zp - zEnd) * i) / m, before));
      if (wanted < z[c]!) {
        result.maxDepth = Math.max(result.maxDepth, z[c]! - wanted);
        z[c] = wanted;
        cond[c] = cond[c]! | COND_BREACHED;
        lowered += 1;
      }
      before = z[c]!;
    }
    result.breachedPits += 1;
    result.breachedCells += lowered;
  }
}
