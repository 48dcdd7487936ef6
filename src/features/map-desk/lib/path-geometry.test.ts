import geodesic from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { pathLengthsM, type LonLat } from "../../../../shared/geo";
import { lineBetween, nearestStationM } from "./path-geometry";

const WGS84 = geodesic.Geodesic.WGS84;
/** The reference: GeographicLib's inverse problem on WGS84 (geographiclib-geodesic 2.2.0). */
const gDist = (a: LonLat, b: LonLat) => WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 as number;

const path: LonLat[] = [
  [-122.3, 47.6],
  [-122.299, 47.6005],
  [-122.2975, 47.6008],
];

describe("path geometry on the Map desk", () => {
  it("snaps a point beside the second edge to its station, measured as GeographicLib measures it (within 1 cm)", () => {
    const lengths = pathLengthsM(path);
    // A point 0.00002° north of the middle of the second edge.
    const mid: LonLat = [(path[1]![0] + path[2]![0]) / 2, (path[1]![1] + path[2]![1]) / 2];
    const snap = nearestStationM(path, lengths, [mid[0], mid[1] + 0.00002]);
    const expected = gDist(path[0]!, path[1]!) + gDist(path[1]!, snap.point);
    expect(snap.stationM).toBeCloseTo(expected, 2);
    expect(snap.stationM).toBeGreaterThan(lengths.cumulativeM[1]!);
    expect(snap.stationM).toBeLessThan(lengths.totalM);
  });

  it("clamps a point beyond the outlet to the path's end", () => {
    const lengths = pathLengthsM(path);
    const snap = nearestStationM(path, lengths, [-122.29, 47.6012]);
    expect(snap.stationM).toBeCloseTo(lengths.totalM, 6);
    expect(snap.point).toEqual(path[2]);
  });

  it("cuts the stretch between two stations with the vertices inside it and both ends on the path", () => {
    const lengths = pathLengthsM(path);
    const from = lengths.cumulativeM[1]! / 2;
    const to = (lengths.cumulativeM[1]! + lengths.totalM) / 2;
    const line = lineBetween(path, lengths, from, to);
    expect(line).toHaveLength(3);
    expect(line[1]).toEqual(path[1]);
    const along = gDist(line[0]!, line[1]!) + gDist(line[1]!, line[2]!);
    expect(along).toBeCloseTo(to - from, 2);
  });
});
