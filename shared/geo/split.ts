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
import { lerpLonLat, pathLengthsM, stationOnEdgeM, type PathLengths } from "./geodesic";
import { edgeSegmentParams } from "./planar";
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
  for (const entry of candidates) {
    for (const ring of index.rings[entry]!) {
      for (let k = 0; k + 3 < ring.length; k += 2) {
        edgeSegmentParams(
          a[0],
          a[1],
          b[0],
          b[1],
          ring[k]!,
          ring[k + 1]!,
          ring[k + 2]!,
          ring[k + 3]!,
          out,
        );
      }
    }
  }
}

/** Sorted break parameters of one edge, 0 and 1 included, near-duplicates dropped. */
function breakParams(raw: number[]): number[] {
  raw.sort((x, y) => x - y);
  const out = [0];
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
  const raw: number[] = [];
  for (let edge = 0; edge + 1 < path.length; edge += 1) {
    if (lengths.edgeLengthsM[edge] === 0) continue; // a repeated vertex adds nothing
    const a = path[edge]!;
    const b = path[edge + 1]!;
    const minX = Math.min(a[0], b[0]);
    const minY = Math.min(a[1], b[1]);
    const maxX = Math.max(a[0], b[0]);
    const maxY = Math.max(a[1], b[1]);
    const coverHits = cover.search(minX, minY, maxX, maxY);
    const soilHits = soil.search(minX, minY, maxX, maxY);
    raw.length = 0;
    collectParams(cover, coverHits, a, b, raw);
    collectParams(soil, soilHits, a, b, raw);
    const ts = breakParams(raw);
    let fromM = lengths.cumulativeM[edge]!;
    for (let k = 0; k + 1 < ts.length; k += 1) {
      const t1 = ts[k + 1]!;
      const toM = stationOnEdgeM(path, lengths, edge, t1);
      if (toM <= fromM) continue;
      const [mx, my] = lerpLonLat(a, b, (ts[k]! + t1) / 2);
      const c = winnerAt(cover, coverHits, mx, my);
      const s = winnerAt(soil, soilHits, mx, my);
      append(pieces, {
        stationFromM: fromM,
        stationToM: toM,
        lengthM: toM - fromM,
        surfaceClassId: c < 0 ? null : cover.values[c]!,
        hsg: s < 0 ? null : soil.values[s]!,
        coverFeatureId: c < 0 ? null : cover.featureIds[c]!,
        soilFeatureId: s < 0 ? null : soil.featureIds[s]!,
      });
      fromM = toM;
    }
  }
  return pieces;
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
