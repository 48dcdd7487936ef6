/**
 * A spatial index over one layer's polygons (cover or soil): a flatbush packed R-tree over
 * their bounding boxes, so a query touches only the polygons near an edge, never every one.
 * Rings are kept as flat Float64Arrays [x0, y0, …, x0, y0] (closed) for fast planar tests.
 *
 * Overlap rule. Where polygons of one layer overlap, the polygon with the smallest area (of its
 * whole feature, on the WGS84 ellipsoid, see rankingAreaM2) wins: the more specific feature, e.g. a building drawn
 * on top of a lawn parcel. Ties go to the lower featureId. Boundaries count as inside, so a
 * path running along a shared edge takes the value of the winner of the two neighbours.
 * Multipolygons arrive as several entries with the same featureId and rank together.
 */
import Flatbush from "flatbush";
import { rankingAreaM2 } from "./geodesic";
import { ON_LINE_EPS_DEG, pointInRings } from "./planar";
import type { ValuedPolygon } from "./types";

export interface PolygonIndex<V> {
  /** Number of polygon entries (parts of multipolygons counted separately). */
  readonly count: number;
  readonly values: readonly V[];
  readonly featureIds: readonly number[];
  /** Closed rings per entry, outer first, as flat lon/lat arrays. */
  readonly rings: readonly (readonly Float64Array[])[];
  /** Precedence of each entry under the overlap rule: the lower rank wins. */
  readonly rank: Int32Array;
  /** Bounding box of each entry's outer ring: minX, minY, maxX, maxY at 4·entry. */
  readonly boxes: Float64Array;
  /** Entries whose bounding box touches the given box, in no particular order. */
  search(minX: number, minY: number, maxX: number, maxY: number): number[];
}

export interface PolygonIndexOptions {
  /** The only rule so far; named so a project-level choice can be added without a break. */
  readonly overlap?: "smallest-area";
}

function flatRing(featureId: number, ring: readonly (readonly [number, number])[]): Float64Array {
  const n = ring.length;
  if (n === 0) throw new RangeError(`feature ${featureId}: a ring has no vertices`);
  const first = ring[0]!;
  const last = ring[n - 1]!;
  const closed = first[0] === last[0] && first[1] === last[1];
  const out = new Float64Array((closed ? n : n + 1) * 2);
  ring.forEach(([x, y], i) => {
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      throw new RangeError(`feature ${featureId}: vertex ${i} is not a finite lon/lat`);
    }
    out[2 * i] = x;
    out[2 * i + 1] = y;
  });
  if (!closed) {
    out[2 * n] = first[0];
    out[2 * n + 1] = first[1];
  }
  return out;
}

function ranksBySmallestArea<V>(polygons: readonly ValuedPolygon<V>[]): Int32Array {
  const featureAreaM2 = new Map<number, number>();
  for (const p of polygons) {
    featureAreaM2.set(p.featureId, (featureAreaM2.get(p.featureId) ?? 0) + rankingAreaM2(p.rings));
  }
  const order = polygons.map((_, i) => i);
  order.sort((i, j) => {
    const a = polygons[i]!.featureId;
    const b = polygons[j]!.featureId;
    return featureAreaM2.get(a)! - featureAreaM2.get(b)! || a - b;
  });
  const rank = new Int32Array(polygons.length);
  order.forEach((entry, position) => {
    rank[entry] = position;
  });
  return rank;
}

export function buildPolygonIndex<V>(
  polygons: readonly ValuedPolygon<V>[],
  _options: PolygonIndexOptions = { overlap: "smallest-area" },
): PolygonIndex<V> {
  const rings = polygons.map((p) => p.rings.map((ring) => flatRing(p.featureId, ring)));
  const tree = polygons.length > 0 ? new Flatbush(polygons.length) : null;
  const boxes = new Float64Array(polygons.length * 4);
  rings.forEach((entry, i) => {
    const outer = entry[0];
    if (!outer) throw new RangeError(`feature ${polygons[i]!.featureId}: a polygon has no ring`);
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (let k = 0; k < outer.length; k += 2) {
      minX = Math.min(minX, outer[k]!);
      maxX = Math.max(maxX, outer[k]!);
      minY = Math.min(minY, outer[k + 1]!);
      maxY = Math.max(maxY, outer[k + 1]!);
    }
    boxes.set([minX, minY, maxX, maxY], 4 * i);
    tree!.add(minX, minY, maxX, maxY);
  });
  tree?.finish();
  return {
    count: polygons.length,
    values: polygons.map((p) => p.value),
    featureIds: polygons.map((p) => p.featureId),
    rings,
    rank: ranksBySmallestArea(polygons),
    boxes,
    search: (minX, minY, maxX, maxY) => (tree ? tree.search(minX, minY, maxX, maxY) : []),
  };
}

/**
 * The entry that holds (x, y) under the overlap rule, among `candidates` (entries found by
 * `search` around the point); -1 when none does.
 */
export function winnerAt<V>(
  index: PolygonIndex<V>,
  candidates: readonly number[],
  x: number,
  y: number,
): number {
  return winnerAmong(index, candidates, candidates.length, x, y);
}

/** winnerAt over the first `count` entries of a reusable buffer. */
export function winnerAmong<V>(
  index: PolygonIndex<V>,
  candidates: ArrayLike<number>,
  count: number,
  x: number,
  y: number,
): number {
  let best = -1;
  const { boxes, rank } = index;
  const e = ON_LINE_EPS_DEG;
  for (let i = 0; i < count; i += 1) {
    const entry = candidates[i]!;
    if (best >= 0 && rank[entry]! > rank[best]!) continue;
    const b = 4 * entry;
    if (
      x < boxes[b]! - e ||
      y < boxes[b + 1]! - e ||
      x > boxes[b + 2]! + e ||
      y > boxes[b + 3]! + e
    ) {
      continue;
    }
    if (pointInRings(x, y, index.rings[entry]!)) best = entry;
  }
  return best;
}
