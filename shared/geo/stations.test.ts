/**
 * Stations along a path, checked against GeographicLib (geographiclib-geodesic, the reference
 * library for WGS84 geodesics): a meridian is both a geodesic and a straight lon/lat line, so
 * a point at a station on it must be the library's direct solution due north.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import geodesic from "geographiclib-geodesic";
import { geodesicDistanceM, pathLengthsM } from "./geodesic";
import { firstCrossingStationM, pointAtStation, stationsAlong } from "./stations";
import type { LonLat } from "./types";

const WGS84 = geodesic.Geodesic.WGS84;

describe("pointAtStation", () => {
  const meridian: LonLat[] = [
    [-104.8, 39.7],
    [-104.8, 39.72],
    [-104.8, 39.75],
  ];
  const lengths = pathLengthsM(meridian);

  it("matches GeographicLib's direct problem due north on a meridian (1e-9°, about 0.1 mm)", () => {
    for (const stationM of [0, 1234.5, 2224.1, 5000]) {
      const expected = WGS84.Direct(39.7, -104.8, 0, stationM);
      const [lon, lat] = pointAtStation(meridian, lengths, stationM);
      expect(lon).toBeCloseTo(-104.8, 12);
      expect(lat).toBeCloseTo(expected.lat2!, 9);
    }
  });

  it("clamps stations before the divide and past the outlet to the path's ends", () => {
    expect(pointAtStation(meridian, lengths, -5)).toEqual(meridian[0]);
    expect(pointAtStation(meridian, lengths, lengths.totalM + 5)).toEqual(meridian[2]);
  });

  it("returns a point whose distance along the path is the station (property, 1e-6 m)", () => {
    const path: LonLat[] = [
      [11.3, 47.2],
      [11.31, 47.205],
      [11.31, 47.205],
      [11.33, 47.19],
    ];
    const pl = pathLengthsM(path);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (f) => {
        const stationM = f * pl.totalM;
        const point = pointAtStation(path, pl, stationM);
        const onFirst = stationM <= pl.cumulativeM[1]!;
        const alongM = onFirst
          ? geodesicDistanceM(path[0]!, point)
          : pl.cumulativeM[2]! + geodesicDistanceM(path[2]!, point);
        expect(Math.abs(alongM - stationM)).toBeLessThan(1e-6);
      }),
    );
  });
});

describe("stationsAlong", () => {
  it("runs from 0 at the spacing and ends at the total", () => {
    expect(stationsAlong(10, 3)).toEqual([0, 3, 6, 9, 10]);
  });
  it("does not repeat the total when it falls on the spacing", () => {
    expect(stationsAlong(9, 3)).toEqual([0, 3, 6, 9]);
  });
  it("gives the single station 0 for a zero-length path", () => {
    expect(stationsAlong(0, 5)).toEqual([0]);
  });
  it("refuses a spacing that is not a positive number", () => {
    expect(() => stationsAlong(10, 0)).toThrow(/positive number of metres/);
    expect(() => stationsAlong(10, Number.NaN)).toThrow(/positive number of metres/);
  });
});

describe("firstCrossingStationM", () => {
  const y = 30.1;
  const path: LonLat[] = [
    [-90.01, y],
    [-90.005, y],
    [-90, y],
  ];
  const lengths = pathLengthsM(path);
  const northSouth = (x: number): LonLat[] => [
    [x, y - 0.001],
    [x, y + 0.001],
  ];

  it("is the geodesic distance to where the path crosses a channel line (1e-6 m)", () => {
    const stationM = firstCrossingStationM(path, lengths, [northSouth(-90.003)]);
    expect(stationM).toBeCloseTo(geodesicDistanceM(path[0]!, [-90.003, y]), 6);
  });

  it("takes the crossing nearest the divide whatever the order of the lines", () => {
    const stationM = firstCrossingStationM(path, lengths, [
      northSouth(-90.002),
      northSouth(-90.008),
    ]);
    expect(stationM).toBeCloseTo(geodesicDistanceM(path[0]!, [-90.008, y]), 6);
  });

  it("counts a line that touches the path at a vertex", () => {
    const touching: LonLat[] = [
      [-90.005, y],
      [-90.005, y + 0.002],
    ];
    expect(firstCrossingStationM(path, lengths, [touching])).toBeCloseTo(
      lengths.cumulativeM[1]!,
      9,
    );
  });

  it("counts a line that runs along the path from where it joins", () => {
    const along: LonLat[] = [
      [-90.004, y],
      [-89.99, y],
    ];
    const stationM = firstCrossingStationM(path, lengths, [along]);
    expect(stationM).toBeCloseTo(geodesicDistanceM(path[0]!, [-90.004, y]), 6);
  });

  it("is null when the path meets no line, or there are none", () => {
    expect(firstCrossingStationM(path, lengths, [northSouth(-89.99)])).toBeNull();
    expect(firstCrossingStationM(path, lengths, [])).toBeNull();
  });
});
