/**
 * Stations along a flow path: metres from the divide (the first vertex), measured as in the
 * split (geodesic, see stationOnEdgeM). Points at stations feed the terrain sampler; the first
 * meeting with a channel line is where channel flow starts when the user has set no break.
 */
import Flatbush from "flatbush";
import { geodesicDistanceM, lerpLonLat, stationOnEdgeM, type PathLengths } from "./geodesic";
import { edgeSegmentParams } from "./planar";
import type { LonLat } from "./types";

/** The edge holding a station: the last edge of positive length that starts at or before it. */
function edgeAt(lengths: PathLengths, stationM: number): number {
  const cumulative = lengths.cumulativeM;
  let lo = 0;
  let hi = cumulative.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (cumulative[mid]! <= stationM) lo = mid;
    else hi = mid - 1;
  }
  while (lo > 0 && lengths.edgeLengthsM[lo] === 0) lo -= 1;
  return lo;
}

/**
 * The point at a station (clamped to [0, total]). Within an edge the lon/lat parameter t is
 * found so that the geodesic from the edge's start is the wanted distance: t = d / L first,
 * then Newton steps (the derivative is close to L), so pointAtStation and the split's stations
 * agree to well under a millimetre.
 */
export function pointAtStation(
  path: readonly LonLat[],
  lengths: PathLengths,
  stationM: number,
): LonLat {
  if (path.length === 0) throw new RangeError("a path needs at least one vertex");
  if (path.length === 1 || lengths.totalM === 0) return path[0]!;
  const s = Math.min(Math.max(stationM, 0), lengths.totalM);
  const edge = edgeAt(lengths, s);
  const a = path[edge]!;
  const b = path[edge + 1]!;
  const edgeM = lengths.edgeLengthsM[edge]!;
  const wantM = s - lengths.cumulativeM[edge]!;
  if (edgeM === 0 || wantM <= 0) return a;
  if (wantM >= edgeM) return b;
  let t = wantM / edgeM;
  for (let step = 0; step < 4; step += 1) {
    const errorM = geodesicDistanceM(a, lerpLonLat(a, b, t)) - wantM;
    if (Math.abs(errorM) < 1e-9) break;
    t = Math.min(Math.max(t - errorM / edgeM, 0), 1);
  }
  return lerpLonLat(a, b, t);
}

/**
 * Stations every `spacingM` from 0, with the total always last (so the profile ends at the
 * outlet); a last interval shorter than 1 mm is folded into the total.
 */
export function stationsAlong(totalM: number, spacingM: number): number[] {
  if (!(spacingM > 0) || !Number.isFinite(spacingM)) {
    throw new RangeError(`station spacing must be a positive number of metres (got ${spacingM})`);
  }
  if (!(totalM >= 0) || !Number.isFinite(totalM)) {
    throw new RangeError(`path length must be a non-negative number of metres (got ${totalM})`);
  }
  const count = Math.floor(totalM / spacingM);
  if (count > 1_000_000) {
    throw new RangeError(
      `a spacing of ${spacingM} m along ${totalM} m gives over 1,000,000 stations`,
    );
  }
  const out: number[] = [];
  for (let k = 0; k <= count; k += 1) out.push(k * spacingM);
  if (totalM - out[out.length - 1]! < 1e-3 && out.length > 1) out[out.length - 1] = totalM;
  else if (totalM > out[out.length - 1]!) out.push(totalM);
  return out;
}

/**
 * The first station where the path meets or crosses any of the lines (channel centrelines),
 * or null when it meets none. The lines' segments go into a flatbush index, so each path edge
 * tests only the segments near it.
 */
export function firstCrossingStationM(
  path: readonly LonLat[],
  lengths: PathLengths,
  lines: readonly (readonly LonLat[])[],
): number | null {
  const segments: number[] = [];
  for (const line of lines) {
    for (let k = 0; k + 1 < line.length; k += 1) {
      const [cx, cy] = line[k]!;
      const [dx, dy] = line[k + 1]!;
      segments.push(cx, cy, dx, dy);
    }
  }
  const count = segments.length / 4;
  if (count === 0 || path.length < 2) return null;
  const tree = new Flatbush(count);
  for (let k = 0; k < segments.length; k += 4) {
    const [cx, cy, dx, dy] = [segments[k]!, segments[k + 1]!, segments[k + 2]!, segments[k + 3]!];
    tree.add(Math.min(cx, dx), Math.min(cy, dy), Math.max(cx, dx), Math.max(cy, dy));
  }
  tree.finish();
  const ts: number[] = [];
  for (let edge = 0; edge + 1 < path.length; edge += 1) {
    if (lengths.edgeLengthsM[edge] === 0) continue;
    const [ax, ay] = path[edge]!;
    const [bx, by] = path[edge + 1]!;
    ts.length = 0;
    const hits = tree.search(
      Math.min(ax, bx),
      Math.min(ay, by),
      Math.max(ax, bx),
      Math.max(ay, by),
    );
    for (const hit of hits) {
      const k = hit * 4;
      const [cx, cy, dx, dy] = [segments[k]!, segments[k + 1]!, segments[k + 2]!, segments[k + 3]!];
      edgeSegmentParams(ax, ay, bx, by, cx, cy, dx, dy, ts, true);
    }
    if (ts.length > 0) return stationOnEdgeM(path, lengths, edge, Math.min(...ts));
  }
  return null;
}
