/**
 * The outline of a set of cells, traced along cell edges into rings.
 *
 * Every inside cell contributes its edges that face an outside cell, oriented with the inside on
 * the left (counter-clockwise in map coordinates, rows running south); the edges link into
 * rings. Where two inside cells meet only at a corner (a saddle: D8 flows diagonally, so a
 * basin is connected corner to corner), the ring turns so as to keep them together: a basin is
 * one shell, whatever its one-cell necks, with holes for the ground it encloses but does not
 * drain. Shells come out counter-clockwise (positive area), holes clockwise (RFC 7946 order).
 *
 * Rings are corner vertices in grid units: vertex (i, j) is the north-west corner of cell
 * (i, j). At a saddle a ring passes the same vertex twice (or touches another ring there),
 * which OGC validity forbids; `cutSaddles` moves each pass a hair into its own outside cell.
 */

/** Directions of ring edges, as bits: east, north, west, south (rows run south). */
const EAST = 1;
const NORTH = 2;
const WEST = 4;
const SOUTH = 8;
// Indexed by the direction bit.
const STEP_I = [0, 1, 0, 0, -1, 0, 0, 0, 0];
const STEP_J = [0, 0, -1, 0, 0, 0, 0, 0, 1];
const RIGHT_OF = [0, SOUTH, EAST, 0, NORTH, 0, 0, 0, WEST];

/** A ring of corner vertices, flat [i0, j0, i1, j1, …], not repeating the first. */
export type Ring = number[];

export interface CellOutline {
  /** Shells with their holes (grid vertex coordinates). */
  readonly polygons: { shell: Ring; holes: Ring[] }[];
  /** Vertices where a ring passes twice or two rings meet (saddles), as "i,j" keys. */
  readonly saddles: ReadonlySet<string>;
  /** Number of cells outlined. */
  readonly cells: number;
}

export function signedArea(ring: readonly number[]): number {
  let twice = 0;
  const n = ring.length;
  for (let a = 0; a < n; a += 2) {
    const b = (a + 2) % n;
    // Map y runs north (−j): the shoelace on (i, −j).
    twice += ring[a]! * -ring[b + 1]! - ring[b]! * -ring[a + 1]!;
  }
  return twice / 2;
}

/** Traces the outline of `cells` (indices into a grid `width` wide). */
export function traceOutline(cells: Int32Array, width: number): CellOutline {
  const n = cells.length;
  // Rows by a multiplication, not a division; the half keeps multiples of the width exact.
  const perRow = 1 / width;
  let [minC, minR, maxC, maxR] = [Infinity, Infinity, -Infinity, -Infinity];
  for (let k = 0; k < n; k += 1) {
    const cell = cells[k]!;
    const r = ((cell + 0.5) * perRow) | 0;
    const c = cell - r * width;
    if (c < minC) minC = c;
    if (c > maxC) maxC = c;
    if (r < minR) minR = r;
    if (r > maxR) maxR = r;
  }
  // A one-cell margin so that every inside cell has four neighbours in the mask.
  const mw = maxC - minC + 3;
  const mh = maxR - minR + 3;
  // Mask position of a cell: its row and column less the box's, plus the margin.
  const shift = (1 - minR) * mw + 1 - minC;
  const maskAt = (cell: number) => {
    const r = ((cell + 0.5) * perRow) | 0;
    return r * mw + (cell - r * width) + shift;
  };
  const mask = new Uint8Array(mw * mh);
  for (let k = 0; k < n; k += 1) mask[maskAt(cells[k]!)] = 1;
  const vw = mw + 1;
  const out = new Uint8Array(vw * (mh + 1));
  // Vertices that start an edge, so the search for rings visits only the boundary.
  const starts: number[] = [];
  const mark = (vertex: number, bit: number) => {
    if (out[vertex] === 0) starts.push(vertex);
    out[vertex] = out[vertex]! | bit;
  };
  for (let k = 0; k < n; k += 1) {
    const at = maskAt(cells[k]!);
    // Vertex (c, r) of mask cell (c, r) is at r·vw + c = at + r: one more per row above.
    const v = at + (((at + 0.5) / mw) | 0);
    if (mask[at + mw] === 0) mark(v + vw, EAST); // bottom edge
    if (mask[at + 1] === 0) mark(v + vw + 1, NORTH); // right edge
    if (mask[at - mw] === 0) mark(v + 1, WEST); // top edge
    if (mask[at - 1] === 0) mark(v, SOUTH); // left edge
  }
  const rings: { ring: Ring; leftCell: number }[] = [];
  const saddles = new Set<string>();
  const [i0, j0] = [minC - 1, minR - 1]; // mask (0, 0) in grid vertex coordinates
  // In vertex order, so the first ring found is the same whatever the cells' order.
  starts.sort((a, b) => a - b);
  for (const v of starts) {
    while (out[v] !== 0) {
      const first = out[v]! & -out[v]!;
      rings.push(traceRing(out, vw, v, first, mask, mw, i0, j0, saddles));
    }
  }
  return { polygons: group(rings, mask, mw), saddles, cells: n };
}

function traceRing(
  out: Uint8Array,
  vw: number,
  start: number,
  first: number,
  mask: Uint8Array,
  mw: number,
  i0: number,
  j0: number,
  saddles: Set<string>,
): { ring: Ring; leftCell: number } {
  const ring: Ring = [];
  let v = start;
  let d = first;
  out[v] = out[v]! & ~d;
  // The cell on the left of the first edge (mask coordinates).
  const vi = v % vw;
  const vj = Math.floor(v / vw);
  const leftCell =
    d === EAST
      ? (vj - 1) * mw + vi
      : d === NORTH
        ? (vj - 1) * mw + vi - 1
        : d === WEST
          ? vj * mw + vi - 1
          : vj * mw + vi;
  if (mask[leftCell] !== 1) throw new Error("outline: an edge without an inside cell on its left");
  for (;;) {
    v += STEP_I[d]! + STEP_J[d]! * vw;
    const arriving = d;
    let bits = out[v]!;
    if (v === start) bits |= first;
    if ((bits & (bits - 1)) !== 0) {
      // Two ways on: a saddle; turn right, keeping the corner-touching cells together.
      d = RIGHT_OF[arriving]!;
      saddles.add(`${(v % vw) + i0},${Math.floor(v / vw) + j0}`);
    } else d = bits;
    if ((bits & d) === 0 || d === 0) throw new Error("outline: a ring does not close");
    if (d !== arriving) ring.push((v % vw) + i0, Math.floor(v / vw) + j0);
    if (v === start && d === first) break;
    out[v] = out[v]! & ~d;
  }
  return { ring, leftCell };
}

/** Shells (positive) with the holes (negative) of the same corner-connected cells. */
function group(rings: { ring: Ring; leftCell: number }[], mask: Uint8Array, mw: number) {
  const shells = rings.filter((r) => signedArea(r.ring) > 0);
  const holes = rings.filter((r) => signedArea(r.ring) < 0);
  if (shells.length === 1) return [{ shell: shells[0]!.ring, holes: holes.map((h) => h.ring) }];
  const label = labelComponents(mask, mw);
  const byLabel = new Map<number, { shell: Ring; holes: Ring[] }>();
  for (const s of shells) byLabel.set(label[s.leftCell]!, { shell: s.ring, holes: [] });
  for (const h of holes) byLabel.get(label[h.leftCell]!)!.holes.push(h.ring);
  return [...byLabel.values()];
}

/** 8-connected labels of the inside cells (1, 2, …), 0 outside. */
function labelComponents(mask: Uint8Array, mw: number): Int32Array {
  const label = new Int32Array(mask.length);
  const queue = new Int32Array(mask.length);
  const around = [1, -1, mw, -mw, mw + 1, mw - 1, -mw + 1, -mw - 1];
  let next = 0;
  for (let seed = 0; seed < mask.length; seed += 1) {
    if (mask[seed] !== 1 || label[seed] !== 0) continue;
    next += 1;
    label[seed] = next;
    let [head, tail] = [0, 0];
    queue[tail++] = seed;
    while (head < tail) {
      const at = queue[head++]!;
      for (const step of around) {
        const nb = at + step;
        if (mask[nb] === 1 && label[nb] === 0) {
          label[nb] = next;
          queue[tail++] = nb;
        }
      }
    }
  }
  return label;
}

/**
 * The rings with every pass through a saddle vertex replaced by two points `epsilon` before and
 * after it, cutting the corner into the pass's own outside cell: rings no longer touch
 * themselves or each other, and each cut adds epsilon²/2 to the area.
 */
export function cutSaddles(ring: Ring, saddles: ReadonlySet<string>, epsilon: number): Ring {
  const out: Ring = [];
  const n = ring.length;
  for (let a = 0; a < n; a += 2) {
    const [i, j] = [ring[a]!, ring[a + 1]!];
    if (!saddles.has(`${i},${j}`)) {
      out.push(i, j);
      continue;
    }
    const p = (a - 2 + n) % n;
    const q = (a + 2) % n;
    const inI = Math.sign(i - ring[p]!);
    const inJ = Math.sign(j - ring[p + 1]!);
    const outI = Math.sign(ring[q]! - i);
    const outJ = Math.sign(ring[q + 1]! - j);
    out.push(i - epsilon * inI, j - epsilon * inJ, i + epsilon * outI, j + epsilon * outJ);
  }
  return out;
}
