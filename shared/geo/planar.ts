/**
 * Planar tests in longitude/latitude degrees: where an edge meets a ring, and whether a point
 * lies in a polygon. They are the same planar predicates PostGIS applies to EPSG:4326
 * geometry (ST_Intersection, ST_Intersects), so the split lands where PostGIS cuts.
 *
 * Rings are flat arrays [x0, y0, x1, y1, …] with the first vertex repeated at the end.
 */

/**
 * Tolerance of the "on the line" tests, as a distance in degrees from the line: 1e-12° is about
 * 0.1 µm on the ground, far below survey precision but above the float noise of coordinates of
 * magnitude ≤ 180 (their spacing is 2.8e-14°).
 */
export const ON_LINE_EPS_DEG = 1e-12;

/**
 * Pushes onto `out` every parameter t ∈ (0, 1) of edge (ax, ay) → (bx, by) where it crosses
 * or touches the segment (cx, cy) → (dx, dy); a collinear overlap contributes both ends of the
 * overlap. Coordinates are taken relative to a to keep the cross products well conditioned.
 * With `closed`, t = 0 and t = 1 (the edge's own ends) count too, and a segment passing through
 * (or within the on-line tolerance of) the edge's start gives t = 0; a t may then repeat.
 */
export function edgeSegmentParams(
  ax: number,
  ay: number,
  bx: number,
  by: number,
  cx: number,
  cy: number,
  dx: number,
  dy: number,
  out: number[],
  closed = false,
): void {
  // Most ring segments near an edge miss it: reject them by their boxes before any arithmetic.
  if (
    Math.max(cx, dx) < Math.min(ax, bx) - ON_LINE_EPS_DEG ||
    Math.min(cx, dx) > Math.max(ax, bx) + ON_LINE_EPS_DEG ||
    Math.max(cy, dy) < Math.min(ay, by) - ON_LINE_EPS_DEG ||
    Math.min(cy, dy) > Math.max(ay, by) + ON_LINE_EPS_DEG
  ) {
    return;
  }
  const push = closed ? pushClosed : pushOpen;
  const ex = bx - ax;
  const ey = by - ay;
  const px = cx - ax;
  const py = cy - ay;
  const qx = dx - ax;
  const qy = dy - ay;
  const sx = qx - px;
  const sy = qy - py;
  const denom = ex * sy - ey * sx;
  const edgeLen = Math.sqrt(ex * ex + ey * ey);
  const segLen = Math.sqrt(sx * sx + sy * sy);
  if (edgeLen === 0) return;
  if (closed && nearStart(px, py, sx, sy, segLen)) out.push(0);
  if (Math.abs(denom) <= ON_LINE_EPS_DEG * edgeLen * Math.max(segLen, ON_LINE_EPS_DEG)) {
    // Parallel: only a collinear overlap matters; its ends are where the class may change.
    const offLine = Math.abs(ex * py - ey * px) / edgeLen;
    if (offLine > ON_LINE_EPS_DEG) return;
    const e2 = edgeLen * edgeLen;
    const tc = (px * ex + py * ey) / e2;
    const td = (qx * ex + qy * ey) / e2;
    push(tc, out);
    push(td, out);
    return;
  }
  const t = (px * sy - py * sx) / denom;
  const u = (px * ey - py * ex) / denom;
  const uTol = ON_LINE_EPS_DEG / Math.max(segLen, ON_LINE_EPS_DEG);
  if (u < -uTol || u > 1 + uTol) return;
  push(t, out);
}

/**
 * Whether the edge's start (the origin here) is within 2·ON_LINE_EPS_DEG of the segment
 * p → p + s: a superset of what onSegment (and so pointInRings) calls "on the boundary", so a
 * vertex that the point-in-polygon test sees on a boundary always counts as touched.
 */
function nearStart(px: number, py: number, sx: number, sy: number, segLen: number): boolean {
  const w = segLen === 0 ? 0 : Math.min(Math.max(-(px * sx + py * sy) / (segLen * segLen), 0), 1);
  const nx = px + w * sx;
  const ny = py + w * sy;
  return nx * nx + ny * ny <= 4 * ON_LINE_EPS_DEG * ON_LINE_EPS_DEG;
}

function pushOpen(t: number, out: number[]): void {
  if (t > 0 && t < 1) out.push(t);
}

/** Ends included, with the same tolerance as the on-line tests (relative to the edge). */
function pushClosed(t: number, out: number[]): void {
  if (t >= -1e-12 && t <= 1 + 1e-12) out.push(Math.min(Math.max(t, 0), 1));
}

/** Whether (x, y) lies on the segment (ax, ay) → (bx, by), within ON_LINE_EPS_DEG. */
function onSegment(x: number, y: number, ax: number, ay: number, bx: number, by: number): boolean {
  const ex = bx - ax;
  const ey = by - ay;
  const px = x - ax;
  const py = y - ay;
  const len = Math.sqrt(ex * ex + ey * ey);
  if (len === 0) return Math.sqrt(px * px + py * py) <= ON_LINE_EPS_DEG;
  if (Math.abs(ex * py - ey * px) / len > ON_LINE_EPS_DEG) return false;
  const along = (px * ex + py * ey) / len;
  return along >= -ON_LINE_EPS_DEG && along <= len + ON_LINE_EPS_DEG;
}

/**
 * Point in polygon by the even–odd rule over every ring, so holes are respected. A point on
 * any ring counts as inside: polygons are closed sets (as in ST_Intersects), and a path that
 * runs along a shared boundary is then claimed by both sides and settled by the overlap rule.
 */
export function pointInRings(x: number, y: number, rings: readonly Float64Array[]): boolean {
  let inside = false;
  for (let r = 0; r < rings.length; r += 1) {
    const ring = rings[r]!;
    const n = ring.length - 2;
    for (let i = 0; i < n; i += 2) {
      const ax = ring[i]!;
      const ay = ring[i + 1]!;
      const bx = ring[i + 2]!;
      const by = ring[i + 3]!;
      const nearX =
        x >= Math.min(ax, bx) - ON_LINE_EPS_DEG && x <= Math.max(ax, bx) + ON_LINE_EPS_DEG;
      const nearY =
        y >= Math.min(ay, by) - ON_LINE_EPS_DEG && y <= Math.max(ay, by) + ON_LINE_EPS_DEG;
      if (nearX && nearY && onSegment(x, y, ax, ay, bx, by)) return true;
      if (ay > y !== by > y && x < ((bx - ax) * (y - ay)) / (by - ay) + ax) inside = !inside;
    }
  }
  return inside;
}
