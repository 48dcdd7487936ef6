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
import { pathLengthsM, type PathLengths } from "./geodesic";
import type { PolygonIndex } from "./polygon-index";
import { EdgeSplitter, type MutablePiece } from "./split-edge";
import type { HsgCode, LonLat, PathPiece } from "./types";

export function assertUsablePath(path: readonly LonLat[]): void {
  if (path.length < 2) throw new RangeError("a flow path needs at least 2 vertices");
  path.forEach(([lon, lat], i) => {
    if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lat) > 90) {
      throw new RangeError(`flow path vertex ${i} is not a valid lon/lat (${lon}, ${lat})`);
    }
  });
}

/** Runs of at most 32 edges and 50 m share one search: a few cells of a typical cover layer. */
const RUN_EDGES = 32;
const RUN_M = 50;

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
  const splitter = new EdgeSplitter(path, lengths, cover, soil);
  const edgeM = lengths.edgeLengthsM;
  // One index search serves a run of short edges (a search per edge costs more than the
  // edge's own tests); each edge then keeps the run's candidates whose boxes touch it.
  for (let first = 0; first + 1 < path.length;) {
    let last = first + 1;
    let runM = edgeM[first]!;
    while (last + 1 < path.length && last - first < RUN_EDGES && runM + edgeM[last]! <= RUN_M) {
      runM += edgeM[last]!;
      last += 1;
    }
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (let k = first; k <= last; k += 1) {
      const p = path[k]!;
      minX = Math.min(minX, p[0]);
      maxX = Math.max(maxX, p[0]);
      minY = Math.min(minY, p[1]);
      maxY = Math.max(maxY, p[1]);
    }
    const coverRun = cover.search(minX, minY, maxX, maxY);
    const soilRun = soil.search(minX, minY, maxX, maxY);
    for (let edge = first; edge < last; edge += 1) {
      if (edgeM[edge] === 0) splitter.skipEdge(edge);
      else splitter.splitEdge(edge, coverRun, soilRun);
    }
    first = last;
  }
  return splitter.pieces;
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
