/**
 * The split against hand-built cases whose answers are geodesics between known points, computed
 * with GeographicLib (geographiclib-geodesic, the reference library for lengths on WGS84).
 * PostGIS cuts a lon/lat line at the same planar crossing points; the database comparison
 * (ST_Length(ST_Intersection(…)::geography)) is in the integration tests and bench/split.ts.
 */
import { describe, expect, it } from "vitest";
import { geodesicDistanceM, pathLengthsM } from "./geodesic";
import { buildPolygonIndex } from "./polygon-index";
import { splitFlowPath } from "./split";
import type { HsgCode, LonLat, PathPiece } from "./types";

const X0 = -97.5;
const Y0 = 35.2;
/** A grid cell of about 90 m × 110 m near (X0, Y0). */
const D = 0.001;

function rect(x0: number, y0: number, x1: number, y1: number): LonLat[] {
  return [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
    [x0, y0],
  ];
}

/** Cell (i, j) of the grid as a closed ring. */
const cell = (i: number, j: number, w = 1, h = 1): LonLat[] =>
  rect(X0 + i * D, Y0 + j * D, X0 + (i + w) * D, Y0 + (j + h) * D);

const covers = (...p: Array<[number, string | null, LonLat[][]]>) =>
  buildPolygonIndex<string | null>(
    p.map(([featureId, value, rings]) => ({ featureId, value, rings })),
  );
const soils = (...p: Array<[number, HsgCode | null, LonLat[][]]>) =>
  buildPolygonIndex<HsgCode | null>(
    p.map(([featureId, value, rings]) => ({ featureId, value, rings })),
  );
const noSoil = soils();

/** The east–west line at y through the grid, from column x0 to x1 (in cells). */
const across = (x0: number, x1: number, y = 0.5): LonLat[] => [
  [X0 + x0 * D, Y0 + y * D],
  [X0 + x1 * D, Y0 + y * D],
];
const at = (x: number, y = 0.5): LonLat => [X0 + x * D, Y0 + y * D];
const dist = (x0: number, x1: number, y = 0.5) => geodesicDistanceM(at(x0, y), at(x1, y));

const summary = (pieces: readonly PathPiece[]) =>
  pieces.map((p) => [p.surfaceClassId, p.hsg, p.coverFeatureId]);

describe("splitFlowPath: hand-built cases (lengths to 1e-6 m against GeographicLib)", () => {
  it("cuts a path at the shared edge of two cover polygons", () => {
    const pieces = splitFlowPath(
      across(0.2, 1.7),
      covers([1, "lawn", [cell(0, 0)]], [2, "woods", [cell(1, 0)]]),
      noSoil,
    );
    expect(summary(pieces)).toEqual([
      ["lawn", null, 1],
      ["woods", null, 2],
    ]);
    expect(pieces[0]!.lengthM).toBeCloseTo(dist(0.2, 1), 6);
    expect(pieces[1]!.stationFromM).toBe(pieces[0]!.stationToM);
    expect(pieces[1]!.lengthM).toBeCloseTo(dist(1, 1.7), 6);
  });

  it("cuts at soil boundaries too and reports the soil group", () => {
    const pieces = splitFlowPath(
      across(0.1, 0.9),
      covers([1, "range", [cell(0, 0)]]),
      soils(
        [7, "B", [rect(X0, Y0, X0 + 0.4 * D, Y0 + D)]],
        [8, "C/D", [rect(X0 + 0.4 * D, Y0, X0 + D, Y0 + D)]],
      ),
    );
    expect(pieces.map((p) => [p.hsg, p.soilFeatureId])).toEqual([
      ["B", 7],
      ["C/D", 8],
    ]);
    expect(pieces[0]!.lengthM).toBeCloseTo(dist(0.1, 0.4), 6);
  });

  it("leaves a stretch outside every cover polygon unmapped (class and feature null)", () => {
    const pieces = splitFlowPath(across(-0.5, 0.5), covers([1, "lawn", [cell(0, 0)]]), noSoil);
    expect(summary(pieces)).toEqual([
      [null, null, null],
      ["lawn", null, 1],
    ]);
    expect(pieces[0]!.lengthM).toBeCloseTo(dist(-0.5, 0), 6);
  });

  it("respects holes: the path through a hole is outside the holed polygon", () => {
    const donut = [cell(0, 0, 3, 1), rect(X0 + D, Y0 + 0.1 * D, X0 + 2 * D, Y0 + 0.9 * D)];
    const pieces = splitFlowPath(across(0.5, 2.5), covers([1, "woods", donut]), noSoil);
    expect(summary(pieces)).toEqual([
      ["woods", null, 1],
      [null, null, null],
      ["woods", null, 1],
    ]);
    expect(pieces[1]!.lengthM).toBeCloseTo(dist(1, 2), 6);
  });

  it("gives an overlap to the smallest polygon (a roof on a lawn parcel)", () => {
    const roof = rect(X0 + 0.4 * D, Y0 + 0.2 * D, X0 + 0.6 * D, Y0 + 0.8 * D);
    const pieces = splitFlowPath(
      across(0.1, 0.9),
      covers([1, "lawn", [cell(0, 0)]], [2, "roof", [roof]]),
      noSoil,
    );
    expect(summary(pieces)).toEqual([
      ["lawn", null, 1],
      ["roof", null, 2],
      ["lawn", null, 1],
    ]);
    expect(pieces[1]!.lengthM).toBeCloseTo(dist(0.4, 0.6), 6);
  });

  it("breaks a tie between equal overlapping polygons in favour of the lower featureId", () => {
    const pieces = splitFlowPath(
      across(0.1, 0.9),
      covers([9, "range", [cell(0, 0)]], [4, "woods", [cell(0, 0)]]),
      noSoil,
    );
    expect(summary(pieces)).toEqual([["woods", null, 4]]);
  });

  it("gives a path running along a shared edge to the smaller neighbour", () => {
    const pieces = splitFlowPath(
      across(0.2, 0.8, 1),
      covers([1, "woods", [cell(0, 0, 1, 2)]], [2, "lawn", [cell(0, 1)]]),
      noSoil,
    );
    expect(summary(pieces)).toEqual([["lawn", null, 2]]);
  });

  it("handles vertices exactly on polygon edges without zero-length pieces", () => {
    const path: LonLat[] = [at(0), at(1), at(2), at(2.5)];
    const pieces = splitFlowPath(
      path,
      covers([1, "lawn", [cell(0, 0)]], [2, "woods", [cell(1, 0)]]),
      noSoil,
    );
    expect(summary(pieces)).toEqual([
      ["lawn", null, 1],
      ["woods", null, 2],
      [null, null, null],
    ]);
    expect(pieces.every((p) => p.lengthM > 0)).toBe(true);
    expect(pieces[1]!.lengthM).toBeCloseTo(dist(1, 2), 6);
  });

  it("ignores repeated vertices (zero-length edges)", () => {
    const index = covers([1, "lawn", [cell(0, 0)]], [2, "woods", [cell(1, 0)]]);
    const plain = splitFlowPath([at(0.3), at(1.6)], index, noSoil);
    const repeated = splitFlowPath([at(0.3), at(0.3), at(1), at(1), at(1.6)], index, noSoil);
    expect(summary(repeated)).toEqual(summary(plain));
    expect(repeated[1]!.stationToM).toBeCloseTo(plain[1]!.stationToM, 6); // 1 µm: the split point differs
  });

  it("returns one piece of the whole length for a path inside one polygon", () => {
    const path: LonLat[] = [at(0.1, 0.1), at(0.5, 0.7), at(0.9, 0.2)];
    const pieces = splitFlowPath(
      path,
      covers([3, "pavement", [cell(0, 0)]]),
      soils([5, "D", [cell(0, 0)]]),
    );
    expect(pieces).toEqual([
      {
        stationFromM: 0,
        stationToM: pathLengthsM(path).totalM,
        lengthM: pathLengthsM(path).totalM,
        surfaceClassId: "pavement",
        hsg: "D",
        coverFeatureId: 3,
        soilFeatureId: 5,
      },
    ]);
  });

  it("merges neighbours of the same class from different features", () => {
    const pieces = splitFlowPath(
      across(0.5, 2.5),
      covers([1, "lawn", [cell(0, 0)]], [2, "lawn", [cell(1, 0)]], [3, "lawn", [cell(2, 0)]]),
      noSoil,
    );
    expect(summary(pieces)).toEqual([["lawn", null, 1]]);
    expect(pieces[0]!.lengthM).toBeCloseTo(dist(0.5, 2.5), 6);
  });

  it("measures a stretch of a long diagonal edge as the geodesic between its ends (1 mm in 7 km)", () => {
    // On a 7 km diagonal the metres per degree of longitude change by 0.6 %: a t-fraction of
    // the edge would be off by metres; PostGIS measures the cut stretch itself.
    const path: LonLat[] = [
      [X0, Y0],
      [X0 + 0.06, Y0 + 0.03],
    ];
    const pieces = splitFlowPath(
      path,
      covers([1, "range", [rect(X0 + 0.02, Y0 - 1, X0 + 0.04, Y0 + 1)]]),
      noSoil,
    );
    const enter: LonLat = [X0 + 0.02, Y0 + 0.01];
    const leave: LonLat = [X0 + 0.04, Y0 + 0.02];
    expect(pieces[1]!.lengthM).toBeCloseTo(geodesicDistanceM(enter, leave), 3);
  });

  it("does not carry a corner's class onto the next edge from a vertex a hair off the corner", () => {
    // Regression: the vertex 1e-14° below the corner counted as on the cell's boundary, and the
    // long edge after it took the cell's class without a test of its own.
    const path: LonLat[] = [
      [X0, Y0],
      [X0, Y0 - 1e-14],
      [X0, Y0 - 0.25 * D],
    ];
    const pieces = splitFlowPath(path, covers([1, "lawn", [cell(0, 0)]]), noSoil);
    const last = pieces[pieces.length - 1]!;
    expect(last.surfaceClassId).toBeNull();
    expect(last.lengthM).toBeCloseTo(geodesicDistanceM(path[1]!, path[2]!), 6);
  });

  it("refuses a path of one vertex with a clear message", () => {
    expect(() => splitFlowPath([at(0)], covers(), noSoil)).toThrow(/at least 2 vertices/);
  });
});
