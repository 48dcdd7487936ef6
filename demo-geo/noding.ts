/**
 * Makes neighbouring polygons share their boundaries vertex for vertex: wherever a vertex of one
 * polygon lies on an edge of another, that vertex is inserted into the edge. Without it, two
 * neighbours whose common edge has different end points (a road's long edge beside a lot's short
 * ones) draw slightly different chords once reprojected to longitude/latitude, leaving slivers a
 * flow path can fall into. Works in the local planar metres the site is drawn in.
 */
import type { Position } from "geojson";

type Ring = Position[];
const EPS_M = 1e-9;

function onSegment(p: Position, a: Position, b: Position): number | null {
  const [px = 0, py = 0] = p;
  const [ax = 0, ay = 0] = a;
  const [bx = 0, by = 0] = b;
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  if (len2 === 0) return null;
  const t = ((px - ax) * dx + (py - ay) * dy) / len2;
  if (t <= EPS_M || t >= 1 - EPS_M) return null;
  const cross = (px - ax) * dy - (py - ay) * dx;
  return Math.abs(cross) / Math.sqrt(len2) < EPS_M ? t : null;
}

/** Every ring of every polygon with the other rings' vertices inserted where they touch it. */
export function nodeRings(polygons: readonly Ring[][]): Ring[][] {
  const vertices = polygons.flat(2);
  return polygons.map((rings) =>
    rings.map((ring) => {
      const out: Ring = [];
      for (let k = 0; k + 1 < ring.length; k += 1) {
        const a = ring[k] as Position;
        const b = ring[k + 1] as Position;
        out.push(a);
        const inside = vertices
          .map((v) => ({ v, t: onSegment(v, a, b) }))
          .filter((x): x is { v: Position; t: number } => x.t !== null)
          .sort((x, y) => x.t - y.t);
        for (const { v } of inside) {
          const last = out[out.length - 1];
          if (last === undefined || last[0] !== v[0] || last[1] !== v[1]) out.push([...v]);
        }
      }
      out.push(ring[ring.length - 1] as Position);
      return out;
    }),
  );
}
