/**
 * D8 flow directions (O'Callaghan & Mark 1984) on the conditioned grid: each cell drains to the
 * neighbour of steepest drop, drop ÷ the true step length of its row (so a geographic grid's
 * narrow east–west cells are weighed right). Ties go to the first code counter-clockwise from
 * east.
 *
 * The grid's edge and nodata drain outward: past them the ground is continued as the plane
 * through the cell with the slopes of its in-grid neighbours (central differences where both
 * sides are there, one-sided where one is, level where none is), and a cell whose steepest drop
 * is that way leaves the grid (code 0). So a plane falling along the edge still runs along it,
 * but a hill cut by the edge sheds water out of the grid instead of sending it along the edge
 * to a corner.
 *
 * A cell with no drop at all — on a flat or a filled depression — keeps the code the flood
 * reached it from, which leads breadth-first to the flat's nearest lower edge (flood.ts).
 */
import { INFLOW_DONE } from "./accumulate";
import { D_COL, D_ROW, offsets } from "./d8";
import { COND_FILLED, COND_FLAT, NODATA_MASK, STATE_DONE, STATE_EDGE, STATE_QUEUED } from "./types";

/** best-code value meaning "out of the grid". */
const OUT = 9;
/** cond bits that outlive the flood. */
const KEEP = ~(STATE_DONE | STATE_QUEUED | STATE_EDGE) & 0xff;

/**
 * Turns the reached-from codes in `dir` into D8 directions, counts each cell's donors into
 * `inflow` (zeroed; INFLOW_DONE on nodata, for accumulate.ts) and clears the flood's STATE_*
 * bits from `cond`; returns the flat cells marked.
 */
export function d8Directions(
  z: Float32Array,
  width: number,
  height: number,
  steps: Float64Array,
  dir: Uint8Array,
  cond: Uint8Array,
  inflow: Uint8Array,
): number {
  const off = offsets(width);
  const inv = steps.map((s) => (s > 0 ? 1 / s : 0));
  let flatCells = 0;
  const inside = (r: number, q: number) => r >= 0 && r < height && q >= 0 && q < width;

  /** The ground's rise per cell east or south at a cell: central, one-sided, or level. */
  const rise = (c: number, row: number, col: number, kPlus: number, kMinus: number) => {
    const plus = inside(row + D_ROW[kPlus]!, col + D_COL[kPlus]!) ? z[c + off[kPlus]!]! : NaN;
    const minus = inside(row + D_ROW[kMinus]!, col + D_COL[kMinus]!) ? z[c + off[kMinus]!]! : NaN;
    const zc = z[c]!;
    if (!Number.isNaN(plus)) return Number.isNaN(minus) ? plus - zc : (plus - minus) / 2;
    return Number.isNaN(minus) ? 0 : zc - minus;
  };
  /** Elevation continued past the edge or nodata in direction k from cell c. */
  const beyond = (c: number, row: number, col: number, k: number) =>
    z[c]! + D_COL[k]! * rise(c, row, col, 1, 5) + D_ROW[k]! * rise(c, row, col, 7, 3);

  /** The steepest way down from a cell on the edge or beside nodata (OUT: out of the grid). */
  const bestAtBorder = (c: number, row: number, col: number) => {
    const zc = z[c]!;
    const base = row * 9;
    let best = 0;
    let bestSlope = 0;
    for (let k = 1; k <= 8; k += 1) {
      let zn: number;
      let out = false;
      if (inside(row + D_ROW[k]!, col + D_COL[k]!)) {
        zn = z[c + off[k]!]!;
        if (Number.isNaN(zn)) {
          zn = beyond(c, row, col, k);
          out = true;
        }
      } else {
        zn = beyond(c, row, col, k);
        out = true;
      }
      if (zn < zc) {
        const slope = (zc - zn) * inv[base + k]!;
        if (slope > bestSlope) {
          bestSlope = slope;
          best = out ? OUT : k;
        }
      }
    }
    return best;
  };

  for (let row = 0; row < height; row += 1) {
    const base = row * 9;
    // West and south-west step like east and south-east, north-west like north-east.
    const [iE, iNE, iN, iS, iSE] = [
      inv[base + 1]!,
      inv[base + 2]!,
      inv[base + 3]!,
      inv[base + 7]!,
      inv[base + 8]!,
    ];
    const edgeRow = row === 0 || row === height - 1;
    for (let col = 0, c = row * width; col < width; col += 1, c += 1) {
      // The flood's working bits go here, in the same pass.
      const kept = cond[c]! & KEEP;
      cond[c] = kept;
      if ((kept & NODATA_MASK) !== 0) {
        dir[c] = 0;
        inflow[c] = INFLOW_DONE;
        continue;
      }
      let best: number;
      if (edgeRow || col === 0 || col === width - 1) best = bestAtBorder(c, row, col);
      else {
        // Inside the grid, unrolled: the eight drops ÷ step lengths, first steepest wins.
        const zc = z[c]!;
        const ze = z[c + 1]!;
        const zne = z[c - width + 1]!;
        const zn = z[c - width]!;
        const znw = z[c - width - 1]!;
        const zw = z[c - 1]!;
        const zsw = z[c + width - 1]!;
        const zs = z[c + width]!;
        const zse = z[c + width + 1]!;
        const sum = ze + zne + zn + znw + zw + zsw + zs + zse;
        if (sum !== sum)
          best = bestAtBorder(c, row, col); // beside nodata
        else {
          best = 0;
          let top = 0;
          let t = (zc - ze) * iE;
          if (t > top) {
            top = t;
            best = 1;
          }
          t = (zc - zne) * iNE;
          if (t > top) {
            top = t;
            best = 2;
          }
          t = (zc - zn) * iN;
          if (t > top) {
            top = t;
            best = 3;
          }
          t = (zc - znw) * iNE;
          if (t > top) {
            top = t;
            best = 4;
          }
          t = (zc - zw) * iE;
          if (t > top) {
            top = t;
            best = 5;
          }
          t = (zc - zsw) * iSE;
          if (t > top) {
            top = t;
            best = 6;
          }
          t = (zc - zs) * iS;
          if (t > top) {
            top = t;
            best = 7;
          }
          t = (zc - zse) * iSE;
          if (t > top) best = 8;
        }
      }
      if (best === OUT) dir[c] = 0;
      else if (best !== 0) dir[c] = best;
      else if (dir[c] !== 0 && (kept & COND_FILLED) === 0) {
        cond[c] = kept | COND_FLAT;
        flatCells += 1;
      }
      const d = dir[c]!;
      if (d !== 0) {
        const down = c + off[d]!;
        inflow[down] = inflow[down]! + 1;
      }
    }
  }
  return flatCells;
}
