/**
 * A cell outline made smooth and small while staying within half a cell of the cell edges and
 * within 0.5 % of the cells' area.
 *
 * First each ring is redrawn through the midpoints of its cell edges (each corner cut by 0.354
 * cell; saddles, where cells meet at a corner, by less). This is the marching-squares line of
 * the cells: its rings never touch or cross (in the square around each vertex the segments are
 * one, or two parallel ones at a saddle), and a 45° staircase becomes one straight segment. Then Douglas–Peucker (1973) drops the points
 * within 0.14 cell of the line kept, so no point moves more than 0.354 + 0.14 < 0.5 cell from
 * the cell edges. A segment that comes to touch or cross any other is put back as it was, until
 * none does. If the area moved by more than 0.5 % (small basins: cutting the corners of a few
 * cells is a large share), the exact cell-edge outline is returned instead, its saddles cut by
 * 1/1000 cell so that it is valid.
 */
import Flatbush from "flatbush";
import { type CellOutline, cutSaddles, type Ring, signedArea } from "./outline";

export const DP_TOLERANCE_CELLS = 0.14;
export const MAX_AREA_CHANGE = 0.005;
const SADDLE_CUT_CELLS = 1e-3;
const SADDLE_CUT_SMOOTH = 0.1;

export interface SimplifiedOutline {
  readonly polygons: { shell: Ring; holes: Ring[] }[];
  /** Whether the smooth outline was kept (false: the exact cell edges). */
  readonly simplified: boolean;
  /** Relative area change of what is returned against the cells' area. */
  readonly areaChange: number;
}

/**
 * The ring through the midpoints of its unit cell edges, collinear points dropped: each corner
 * becomes the two points half a cell before and after it. A saddle corner is cut by only
 * SADDLE_CUT_SMOOTH cell: the two passes stay apart (parallel, 0.14 cell) but the diagonal
 * link between the cells keeps nearly its whole area (a half-cell cut would add 1/8 cell a pass).
 */
export function midpointRing(ring: Ring, saddles: ReadonlySet<string> = new Set()): Ring {
  const n = ring.length;
  const pts: number[] = [];
  for (let a = 0; a < n; a += 2) {
    const p = (a - 2 + n) % n;
    const q = (a + 2) % n;
    const [i, j] = [ring[a]!, ring[a + 1]!];
    const cut = saddles.has(`${i},${j}`) ? SADDLE_CUT_SMOOTH : 0.5;
    pts.push(i - Math.sign(i - ring[p]!) * cut, j - Math.sign(j - ring[p + 1]!) * cut);
    pts.push(i + Math.sign(ring[q]! - i) * cut, j + Math.sign(ring[q + 1]! - j) * cut);
  }
  return dropCollinear(dropRepeats(pts));
}

function dropRepeats(pts: number[]): number[] {
  const out: number[] = [];
  const n = pts.length;
  for (let a = 0; a < n; a += 2) {
    const b = (a + 2) % n;
    if (pts[a] === pts[b] && pts[a + 1] === pts[b + 1]) continue;
    out.push(pts[a]!, pts[a + 1]!);
  }
  return out;
}

function dropCollinear(pts: number[]): number[] {
  const out: number[] = [];
  const n = pts.length;
  for (let a = 0; a < n; a += 2) {
    const p = (a - 2 + n) % n;
    const q = (a + 2) % n;
    const cross =
      (pts[a]! - pts[p]!) * (pts[q + 1]! - pts[a + 1]!) -
      (pts[a + 1]! - pts[p + 1]!) * (pts[q]! - pts[a]!);
    if (Math.abs(cross) > 1e-12) out.push(pts[a]!, pts[a + 1]!);
  }
  return out;
}

/** Distance from point k to the segment from point a to point b of a flat ring. */
function distance(pts: Ring, k: number, a: number, b: number): number {
  const [ax, ay, bx, by] = [pts[2 * a]!, pts[2 * a + 1]!, pts[2 * b]!, pts[2 * b + 1]!];
  const [px, py] = [pts[2 * k]!, pts[2 * k + 1]!];
  const [dx, dy] = [bx - ax, by - ay];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / len2));
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
}

/** Douglas–Peucker flags on a closed ring: kept points marked 1. */
function douglasPeucker(pts: Ring, tolerance: number): Uint8Array {
  const n = pts.length / 2;
  const keep = new Uint8Array(n);
  if (n <= 4) return keep.fill(1);
  // Anchors: point 0 and the point farthest from it.
  let far = 1;
  let best = -1;
  for (let k = 1; k < n; k += 1) {
    const d = Math.hypot(pts[2 * k]! - pts[0]!, pts[2 * k + 1]! - pts[1]!);
    if (d > best) [best, far] = [d, k];
  }
  keep[0] = 1;
  keep[far] = 1;
  const stack: number[] = [0, far, far, n];
  while (stack.length > 0) {
    const b = stack.pop()!;
    const a = stack.pop()!;
    let worst = -1;
    let at = -1;
    for (let k = a + 1; k < b; k += 1) {
      const d = distance(pts, k, a, b % n);
      if (d > worst) [worst, at] = [d, k];
    }
    if (worst > tolerance) {
      keep[at] = 1;
      stack.push(a, at, at, b);
    }
  }
  return keep;
}

interface Segment {
  ring: number;
  from: number;
  to: number;
}

const orient = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) =>
  Math.sign((bx - ax) * (cy - ay) - (by - ay) * (cx - ax));

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number) {
  return (
    Math.min(ax, bx) <= px &&
    px <= Math.max(ax, bx) &&
    Math.min(ay, by) <= py &&
    py <= Math.max(ay, by)
  );
}

/** Whether two closed segments share any point (touching counts). */
function meet(p: number[], q: number[]): boolean {
  const [ax, ay, bx, by] = p as [number, number, number, number];
  const [cx, cy, dx, dy] = q as [number, number, number, number];
  const o1 = orient(ax, ay, bx, by, cx, cy);
  const o2 = orient(ax, ay, bx, by, dx, dy);
  const o3 = orient(cx, cy, dx, dy, ax, ay);
  const o4 = orient(cx, cy, dx, dy, bx, by);
  if (o1 !== o2 && o3 !== o4) return true;
  return (
    (o1 === 0 && onSegment(ax, ay, bx, by, cx, cy)) ||
    (o2 === 0 && onSegment(ax, ay, bx, by, dx, dy)) ||
    (o3 === 0 && onSegment(cx, cy, dx, dy, ax, ay)) ||
    (o4 === 0 && onSegment(cx, cy, dx, dy, bx, by))
  );
}

/**
 * Segments (as spans of kept points) that meet a segment they should not: any other ring's, or
 * their own ring's apart from the neighbours sharing an end.
 */
function conflicts(rings: Ring[], keeps: Uint8Array[]): Segment[] {
  const segs: Segment[] = [];
  const coords: number[][] = [];
  rings.forEach((pts, ring) => {
    const kept = [...keeps[ring]!.keys()].filter((k) => keeps[ring]![k] === 1);
    kept.forEach((from, i) => {
      const to = kept[(i + 1) % kept.length]!;
      segs.push({ ring, from, to });
      coords.push([pts[2 * from]!, pts[2 * from + 1]!, pts[2 * to]!, pts[2 * to + 1]!]);
    });
  });
  const index = new Flatbush(Math.max(segs.length, 1));
  for (const [ax, ay, bx, by] of coords as [number, number, number, number][]) {
    index.add(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by));
  }
  if (segs.length === 0) index.add(0, 0, 0, 0);
  index.finish();
  const bad = new Set<number>();
  segs.forEach((s, i) => {
    const [ax, ay, bx, by] = coords[i]!;
    for (const j of index.search(
      Math.min(ax!, bx!),
      Math.min(ay!, by!),
      Math.max(ax!, bx!),
      Math.max(ay!, by!),
    )) {
      if (j <= i) continue;
      const t = segs[j]!;
      const adjacent = s.ring === t.ring && (s.to === t.from || t.to === s.from);
      if (adjacent) continue;
      if (meet(coords[i]!, coords[j]!)) {
        bad.add(i);
        bad.add(j);
      }
    }
  });
  return [...bad].map((i) => segs[i]!);
}

function areaOf(polygons: { shell: Ring; holes: Ring[] }[]): number {
  return polygons.reduce(
    (sum, p) => sum + signedArea(p.shell) + p.holes.reduce((h, ring) => h + signedArea(ring), 0),
    0,
  );
}

export function simplifyOutline(outline: CellOutline): SimplifiedOutline {
  const layout = outline.polygons.map((p) => 1 + p.holes.length);
  const rings = outline.polygons
    .flatMap((p) => [p.shell, ...p.holes])
    .map((ring) => midpointRing(ring, outline.saddles));
  const keeps = rings.map((pts) => douglasPeucker(pts, DP_TOLERANCE_CELLS));
  for (let round = 0; round < 1000; round += 1) {
    const found = conflicts(rings, keeps);
    if (found.length === 0) break;
    for (const { ring, from, to } of found) {
      const n = keeps[ring]!.length;
      for (let k = from; k !== to; k = (k + 1) % n) keeps[ring]![k] = 1;
    }
  }
  const simplified = rings.map((pts, r) => pts.filter((_, a) => keeps[r]![a >> 1] === 1));
  let at = 0;
  const polygons = layout.map((count) => {
    const [shell, ...holes] = simplified.slice(at, at + count);
    at += count;
    return { shell: shell!, holes };
  });
  const change = Math.abs(areaOf(polygons) - outline.cells) / outline.cells;
  if (change <= MAX_AREA_CHANGE) return { polygons, simplified: true, areaChange: change };
  const exact = exactOutline(outline);
  return {
    polygons: exact,
    simplified: false,
    areaChange: Math.abs(areaOf(exact) - outline.cells) / outline.cells,
  };
}

/** The cell-edge outline itself, its saddles cut by 1/1000 cell so that it is valid. */
export function exactOutline(outline: CellOutline): { shell: Ring; holes: Ring[] }[] {
  return outline.polygons.map((p) => ({
    shell: cutSaddles(p.shell, outline.saddles, SADDLE_CUT_CELLS),
    holes: p.holes.map((h) => cutSaddles(h, outline.saddles, SADDLE_CUT_CELLS)),
  }));
}
