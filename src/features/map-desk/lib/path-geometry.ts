/**
 * Path geometry the desk needs beyond shared/geo: the stretch of the path between two stations
 * (to draw one segment) and the station nearest to a point (to snap a dragged break to the path).
 * Stations are geodesic metres from the divide, as in shared/geo.
 */
import {
  geodesicDistanceM,
  lerpLonLat,
  pointAtStation,
  type LonLat,
  type PathLengths,
} from "../../../../shared/geo";

/** The vertices of the path from one station to another (both ends interpolated). */
export function lineBetween(
  path: readonly LonLat[],
  lengths: PathLengths,
  fromM: number,
  toM: number,
): LonLat[] {
  const out: LonLat[] = [pointAtStation(path, lengths, fromM)];
  lengths.cumulativeM.forEach((at, i) => {
    if (at > fromM && at < toM) out.push(path[i]!);
  });
  out.push(pointAtStation(path, lengths, toM));
  return out;
}

/**
 * The station of the point on the path nearest to `p`. Each edge is searched in a local plane
 * (longitude scaled by the cosine of the latitude), good to well under a metre over the short
 * edges of a drawn path; the station itself is then measured geodesically along the edge.
 */
export function nearestStationM(
  path: readonly LonLat[],
  lengths: PathLengths,
  p: LonLat,
): { stationM: number; point: LonLat; offEdgeDeg: number } {
  const kx = Math.cos((p[1] * Math.PI) / 180);
  let best = { stationM: 0, point: path[0]!, offEdgeDeg: Infinity };
  for (let i = 0; i + 1 < path.length; i += 1) {
    const a = path[i]!;
    const b = path[i + 1]!;
    const dx = (b[0] - a[0]) * kx;
    const dy = b[1] - a[1];
    const len2 = dx * dx + dy * dy;
    const t =
      len2 === 0
        ? 0
        : Math.min(1, Math.max(0, ((p[0] - a[0]) * kx * dx + (p[1] - a[1]) * dy) / len2));
    const q = lerpLonLat(a, b, t);
    const off = Math.hypot((p[0] - q[0]) * kx, p[1] - q[1]);
    if (off < best.offEdgeDeg) {
      best = {
        stationM: lengths.cumulativeM[i]! + geodesicDistanceM(a, q),
        point: q,
        offEdgeDeg: off,
      };
    }
  }
  return best;
}
