/**
 * Splits a flow path by the cover and soil layers into ordered pieces (divide → outlet).
 *
 * For each edge: both indexes are searched with the edge's bounding box; every place the edge
 * meets a candidate polygon's rings (planar in lon/lat, as PostGIS cuts EPSG:4326 geometry)
 * becomes a break parameter t; each stretch between breaks takes the cover and soil of its
 * midpoint (holes respected; overlaps by the index's rule, see polygon-index.ts). Stations of
 * the breaks are geodesic (stationOnEdgeM), so a piece's length is what PostGIS reports as
 * ST_Length(ST_Intersection(path, polygon)::geography) for the same stretch.
 *
 * Neighbours with the same (surfaceClassId, hsg) are merged, even when they come from
 * different features: the travel time depends on the class, not on which parcel it is. A
 * merged piece keeps the feature ids where it starts. A stretch outside every cover polygon has
 * surfaceClassId null (and coverFeatureId null); the compute step reports it as unmapped.
 */
import { pathLengthsM, stationOnEdgeM, type PathLengths } from "./geodesic";
import { ON_LINE_EPS_DEG, edgeSegmentParams } from "./planar";
import { winnerAt, type PolygonIndex } from "./polygon-index";
import type { HsgCode, LonLat, PathPiece } from "./types";

/** Breaks closer than this fraction of an edge are one break (1e-9 of 1 km is 1 µm). */
const SAME_T = 1e-9;

type MutablePiece = { -readonly [K in keyof PathPiece]: PathPiece[K] };

function collectParams<V>(
  index: PolygonIndex<V>,
  candidates: readonly number[],
  a: LonLat,
  b: LonLat,
  out: number[],
): void {
  const [ax, ay] = a;
  const [bx, by] = b;
  for (let c = 0; c < candidates.length; c += 1) {
    const rings = index.rings[candidates[c]!]!;
    for (let r = 0; r < rings.length; r += 1) {
      const ring = rings[r]!;
      for (let k = 0; k + 3 < ring.length; k += 2) {
        edgeSegmentParams(ax, ay, bx, by, ring[k]!, ring[k + 1]!, ring[k + 2]!, ring[k + 3]!, out);
      }
    }
  }
}

const ascending = (x: number, y: number) => x - y;

/** Sorted break parameters of one edge into `out`, 0 and 1 included, near-duplicates dropped. */
function breakParams(raw: number[], out: number[]): number[] {
  if (raw.length > 1) raw.sort(ascending);
  out.length = 0;
  out.push(0);
  for (const t of raw) {
    if (t - out[out.length - 1]! > SAME_T && t < 1 - SAME_T) out.push(t);
  }
  out.push(1);
  return out;
}

export function assertUsablePath(path: readonly LonLat[]): void {
  if (path.length < 2) throw new RangeError("a flow path needs at least 2 vertices");
  path.forEach(([lon, lat], i) => {
    if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lat) > 90) {
      throw new RangeError(`flow path vertex ${i} is not a valid lon/lat (${lon}, ${lat})`);
    }
  });
}

/**
 * Ordered, merged pieces of the path. `lengths` may be passed when the caller has them already
 * (they must be pathLengthsM(path)). A path of zero length gives no pieces.
 */
export function splitFlowPath(
  path: readonly LonLat[],
  cover: PolygonIndex<string | null>,
  soil: PolygonIndex<HsgCode | null>,
  lengths: PathLengths = pathLengthsM(path),
): PathPiece[] {
  assertUsablePath(path);
  const pieces: MutablePiece[] = [];
  const scratch: Scratch = { raw: [], ts: [], coverNear: [], soilNear: [] };
  const edgeM = lengths.edgeLengthsM;
  // One index search serves a run of short edges (searching per edge costs more than the
  // edge's own tests); each edge then keeps the run's candidates whose boxes touch it.
  for (let first = 0; first + 1 < path.length;) {
    let last = first + 1;
    let runM = edgeM[first]!;
    while (last + 1 < path.length && last - first < RUN_EDGES && runM + edgeM[last]! <= RUN_M) {
      runM += edgeM[last]!;
      last += 1;
    }
    const [minX, minY, maxX, maxY] = boxOf(path, first, last);
    const coverRun = cover.search(minX, minY, maxX, maxY);
    const soilRun = soil.search(minX, minY, maxX, maxY);
    for (let edge = first; edge < last; edge += 1) {
      if (edgeM[edge] !== 0)
        splitEdge(path, lengths, edge, cover, coverRun, soil, soilRun, scratch, pieces);
    }
    first = last;
  }
  return pieces;
}

/** Runs of at most 32 edges and 50 m share one search: a few cells of a typical cover layer. */
const RUN_EDGES = 32;
const RUN_M = 50;

/** Arrays reused from edge to edge (allocation, not arithmetic, dominated the profile). */
interface Scratch {
  raw: number[];
  ts: number[];
  coverNear: number[];
  soilNear: number[];
}

function boxOf(
  path: readonly LonLat[],
  from: number,
  to: number,
): [number, number, number, number] {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let k = from; k <= to; k += 1) {
    const [x, y] = path[k]!;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return [minX, minY, maxX, maxY];
}

/** The entries of `run` whose boxes touch the edge a → b (inclusive, like flatbush). */
function near<V>(
  index: PolygonIndex<V>,
  run: readonly number[],
  a: LonLat,
  b: LonLat,
  out: number[],
) {
  out.length = 0;
  const { boxes } = index;
  const e = ON_LINE_EPS_DEG;
  const minX = Math.min(a[0], b[0]) - e;
  const maxX = Math.max(a[0], b[0]) + e;
  const minY = Math.min(a[1], b[1]) - e;
  const maxY = Math.max(a[1], b[1]) + e;
  for (let i = 0; i < run.length; i += 1) {
    const entry = run[i]!;
    const k = 4 * entry;
    if (
      boxes[k]! <= maxX &&
      boxes[k + 2]! >= minX &&
      boxes[k + 1]! <= maxY &&
      boxes[k + 3]! >= minY
    ) {
      out.push(entry);
    }
  }
  return out;
}

function splitEdge(
  path: readonly LonLat[],
  lengths: PathLengths,
  edge: number,
  cover: PolygonIndex<string | null>,
  coverRun: readonly number[],
  soil: PolygonIndex<HsgCode | null>,
  soilRun: readonly number[],
  scratch: Scratch,
  pieces: MutablePiece[],
): void {
  const a = path[edge]!;
  const b = path[edge + 1]!;
  const coverHits = near(cover, coverRun, a, b, scratch.coverNear);
  const soilHits = near(soil, soilRun, a, b, scratch.soilNear);
  const raw = scratch.raw;
  if (raw.length > 0) raw.length = 0;
  collectParams(cover, coverHits, a, b, raw);
  collectParams(soil, soilHits, a, b, raw);
  const ts = breakParams(raw, scratch.ts);
  let fromM = lengths.cumulativeM[edge]!;
  for (let k = 0; k + 1 < ts.length; k += 1) {
    const t1 = ts[k + 1]!;
    const toM = stationOnEdgeM(path, lengths, edge, t1);
    if (toM <= fromM) continue;
    const tMid = (ts[k]! + t1) / 2;
    const mx = a[0] + (b[0] - a[0]) * tMid;
    const my = a[1] + (b[1] - a[1]) * tMid;
    const c = winnerAt(cover, coverHits, mx, my);
    const s = winnerAt(soil, soilHits, mx, my);
    const surfaceClassId = c < 0 ? null : cover.values[c]!;
    const hsg = s < 0 ? null : soil.values[s]!;
    const last = pieces[pieces.length - 1];
    if (last && last.surfaceClassId === surfaceClassId && last.hsg === hsg) {
      last.stationToM = toM;
      last.lengthM = toM - last.stationFromM;
    } else {
      pieces.push({
        stationFromM: fromM,
        stationToM: toM,
        lengthM: toM - fromM,
        surfaceClassId,
        hsg,
        coverFeatureId: c < 0 ? null : cover.featureIds[c]!,
        soilFeatureId: s < 0 ? null : soil.featureIds[s]!,
      });
    }
    fromM = toM;
  }
}

function append(pieces: MutablePiece[], piece: MutablePiece): void {
  const last = pieces[pieces.length - 1];
  if (last && last.surfaceClassId === piece.surfaceClassId && last.hsg === piece.hsg) {
    last.stationToM = piece.stationToM;
    last.lengthM = last.stationToM - last.stationFromM;
  } else {
    pieces.push(piece);
  }
}

/** Merges neighbours with the same (surfaceClassId, hsg); a no-op on splitFlowPath's output. */
export function mergePieces(pieces: readonly PathPiece[]): PathPiece[] {
  const out: MutablePiece[] = [];
  for (const p of pieces) append(out, { ...p });
  return out;
}
