/**
 * Slopes against analytic profiles: on a straight-line profile z = z0 − g·s every method must
 * give g; on z = z0 − k·s² the 10–85 slope is (z(0.10·L) − z(0.85·L)) / (0.75·L) by its
 * definition (Benson, 1962, USGS WSP 1580-B; from memory). Tolerance 1e-12 m/m: float rounding.
 */
import { describe, expect, it } from "vitest";
import { sampleGrid } from "./bilinear";
import { pathLengthsM } from "./geodesic";
import { isPathReversed, segmentSlopes, withSurveyOverrides, type SlopeInput } from "./slopes";
import { pointAtStation } from "./stations";
import type { LonLat } from "./types";

const terrain = (z: (s: number) => number) => (stationM: number) => ({
  elevationM: z(stationM),
  source: "terrain" as const,
});
const seg = (fromM: number, toM: number, regime: SlopeInput["regime"] = "shallow") => ({
  stationFromM: fromM,
  stationToM: toM,
  regime,
});

describe("segmentSlopes", () => {
  it("gives the fall over the length on a straight-line profile, for every regime and method", () => {
    const slopes = segmentSlopes(
      [seg(0, 30, "sheet"), seg(30, 110), seg(110, 400, "channel")],
      terrain((s) => 250 - 0.02 * s),
      { channelSlope: "10-85" },
    );
    for (const s of slopes) {
      expect(s.slopeMPerM).toBeCloseTo(0.02, 12);
      expect(s.problem).toBeNull();
    }
    expect(slopes[2]!.method).toBe("10-85");
    expect(slopes[1]!.from).toEqual({ elevationM: 250 - 0.02 * 30, source: "terrain" });
  });

  it("measures a channel's 10–85 slope between the points at 10 % and 85 % of its length", () => {
    const z = (s: number) => 300 - 1e-4 * s * s;
    const [channel] = segmentSlopes([seg(100, 500, "channel")], terrain(z), {
      channelSlope: "10-85",
    });
    const upperM = 100 + 0.1 * 400;
    const lowerM = 100 + 0.85 * 400;
    expect(channel!.slopeFromStationM).toBe(upperM);
    expect(channel!.slopeToStationM).toBe(lowerM);
    expect(channel!.slopeMPerM).toBeCloseTo((z(upperM) - z(lowerM)) / (0.75 * 400), 12);
  });

  it("uses the ends of a channel segment when the rule is end-to-end", () => {
    const z = (s: number) => 300 - 1e-4 * s * s;
    const [channel] = segmentSlopes([seg(100, 500, "channel")], terrain(z), {
      channelSlope: "end-to-end",
    });
    expect(channel!.slopeMPerM).toBeCloseTo((z(100) - z(500)) / 400, 12);
  });

  it("reports a flat segment as zero-slope with slope 0, not NaN", () => {
    const [flat] = segmentSlopes(
      [seg(0, 50)],
      terrain(() => 12),
      { channelSlope: "10-85" },
    );
    expect(flat).toMatchObject({ slopeMPerM: 0, dropM: 0, problem: "zero-slope" });
  });

  it("reports a climbing segment as adverse-slope and keeps its negative slope", () => {
    const [uphill] = segmentSlopes(
      [seg(0, 50)],
      terrain((s) => 10 + 0.1 * s),
      {
        channelSlope: "end-to-end",
      },
    );
    expect(uphill!.problem).toBe("adverse-slope");
    expect(uphill!.slopeMPerM).toBeCloseTo(-0.1, 12);
  });

  it("reports no-elevation with a null slope where an end has no elevation", () => {
    const holed = (s: number) =>
      s > 60 ? null : { elevationM: 100 - s, source: "terrain" as const };
    const slopes = segmentSlopes([seg(0, 50), seg(50, 80)], holed, { channelSlope: "end-to-end" });
    expect(slopes[0]!.problem).toBeNull();
    expect(slopes[1]).toMatchObject({ slopeMPerM: null, to: null, problem: "no-elevation" });
  });

  it("reports a zero-length segment rather than dividing by zero", () => {
    const [s] = segmentSlopes(
      [seg(5, 5)],
      terrain(() => 1),
      { channelSlope: "end-to-end" },
    );
    expect(s).toMatchObject({ slopeMPerM: null, problem: "zero-length" });
  });

  it("asks for each shared end station once", () => {
    const asked: number[] = [];
    segmentSlopes(
      [seg(0, 10), seg(10, 20), seg(20, 30)],
      (s) => {
        asked.push(s);
        return { elevationM: 50 - s, source: "terrain" };
      },
      { channelSlope: "end-to-end" },
    );
    expect(asked).toEqual([0, 10, 20, 30]);
  });
});

describe("slopes on an analytic plane DEM through the terrain grid (1e-6 m/m)", () => {
  // z = 180 + 9000·(lon − lon0) − 4000·(lat − lat0) metres, sampled on a 0.0001° grid: bilinear
  // reproduces it exactly, so each slope must be the plane's fall between the segment's ends.
  const lon0 = -105.3;
  const lat0 = 40.0;
  const cell = 1e-4;
  const plane = ([lon, lat]: LonLat) => 180 + 9000 * (lon - lon0) - 4000 * (lat - lat0);
  const width = 60;
  const height = 60;
  const values = new Float64Array(width * height);
  for (let r = 0; r < height; r += 1) {
    for (let c = 0; c < width; c += 1)
      values[r * width + c] = plane([lon0 + c * cell, lat0 + r * cell]);
  }
  const grid = { width, height, values, nodata: null };
  const path: LonLat[] = [
    [lon0 + 0.005, lat0 + 0.001],
    [lon0 + 0.003, lat0 + 0.003],
    [lon0 + 0.0005, lat0 + 0.0052],
  ];
  const lengths = pathLengthsM(path);
  const terrainAt = (stationM: number) => {
    const [lon, lat] = pointAtStation(path, lengths, stationM);
    return sampleGrid(grid, (lon - lon0) / cell, (lat - lat0) / cell);
  };

  it("matches the plane's fall over each segment's geodesic length", () => {
    const cutM = lengths.cumulativeM[1]! * 0.4;
    const segments = [seg(0, cutM), seg(cutM, lengths.totalM)];
    const slopes = segmentSlopes(segments, withSurveyOverrides(terrainAt, []), {
      channelSlope: "end-to-end",
    });
    segments.forEach((s, i) => {
      const zFrom = plane(pointAtStation(path, lengths, s.stationFromM));
      const zTo = plane(pointAtStation(path, lengths, s.stationToM));
      expect(slopes[i]!.slopeMPerM! - (zFrom - zTo) / (s.stationToM - s.stationFromM)).toBeCloseTo(
        0,
        6,
      );
    });
  });
});

describe("withSurveyOverrides", () => {
  const terrainAt = (s: number) => 100 - 0.05 * s;

  it("takes the nearest surveyed elevation within the tolerance, else the terrain", () => {
    const at = withSurveyOverrides(terrainAt, [
      { stationM: 40, elevationM: 97.2 },
      { stationM: 40.4, elevationM: 97.1 },
    ]);
    expect(at(40.3)).toEqual({ elevationM: 97.1, source: "survey" });
    expect(at(41)).toEqual({ elevationM: terrainAt(41), source: "terrain" });
  });

  it("gives null where the terrain has no value and nothing is surveyed", () => {
    expect(withSurveyOverrides(() => null, [])(5)).toBeNull();
  });
});

describe("isPathReversed", () => {
  it("is true when the outlet end is higher than the top", () => {
    expect(isPathReversed(101.2, 104.9)).toBe(true);
  });
  it("is false for a path that falls, or when an end has no elevation", () => {
    expect(isPathReversed(104.9, 101.2)).toBe(false);
    expect(isPathReversed(null, 101.2)).toBe(false);
  });
});
