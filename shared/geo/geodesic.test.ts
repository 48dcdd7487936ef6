import { describe, expect, it } from "vitest";
import fc from "fast-check";
import geodesic from "geographiclib-geodesic";
import {
  geodesicAreaM2,
  geodesicDistanceM,
  multiPolygonAreaM2,
  pathLengthsM,
  rankingAreaM2,
  stationOnEdgeM,
} from "./geodesic";
import type { LonLat } from "./types";

/** WGS84 semi-major axis, exact by definition (NIMA TR8350.2, 3rd ed., Table 3.1). */
const A_M = 6_378_137;

describe("geodesic lengths against published values", () => {
  it("Karney (2013), J. Geodesy 87, Table 3 inverse example: (−30°, 0°) to (29.9°, 179.8°) is 19,989,832.82761 m (from memory; 1e-5 m = the printed digits)", () => {
    expect(geodesicDistanceM([0, -30], [179.8, 29.9])).toBeCloseTo(19_989_832.82761, 4);
  });

  it("geographiclib-geodesic 2.2.0 test/geodesictest.js testcases[0]: s12 = 8,935,244.5604818305 m (5e-8 m; that test allows 1e-8 m; its GeodTest origin is from memory)", () => {
    expect(geodesicDistanceM([-139.44815, 35.60777], [-69.95921, -11.17491])).toBeCloseTo(
      8_935_244.56048183,
      7,
    );
  });

  it("geographiclib-geodesic 2.2.0 test/geodesictest.js testcases[12]: s12 = 2,319,004.8601169389 m (5e-8 m)", () => {
    expect(geodesicDistanceM([-174.47484, -19.79938], [-154.35109, -11.99349])).toBeCloseTo(
      2_319_004.86011694,
      7,
    );
  });

  it("1° of longitude along the equator is a·π/180 = 111,319.4908 m (analytic: the equator is a geodesic for short arcs; 1e-6 m)", () => {
    expect(geodesicDistanceM([0, 0], [1, 0])).toBeCloseTo((A_M * Math.PI) / 180, 6);
  });

  it("the meridian arc from 0° to 1° latitude is 110,574.389 m (from memory, 1 mm = the recalled digits)", () => {
    expect(geodesicDistanceM([0, 0], [0, 1])).toBeCloseTo(110_574.389, 2);
  });
});

describe("short edges measured with the local radii of curvature", () => {
  it("agree with GeographicLib's inverse solution to 10 nm (property; the library's own accuracy is 15 nm)", () => {
    const WGS84 = geodesic.Geodesic.WGS84;
    const offset = fc.double({ min: -1e-3, max: 1e-3, noNaN: true });
    fc.assert(
      fc.property(
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        offset,
        offset,
        (lat, lon, dLat, dLon) => {
          const reference = WGS84.Inverse(
            lat,
            lon,
            lat + dLat,
            lon + dLon,
            geodesic.Geodesic.DISTANCE,
          ).s12!;
          expect(
            Math.abs(geodesicDistanceM([lon, lat], [lon + dLon, lat + dLat]) - reference),
          ).toBeLessThan(1e-8);
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe("pathLengthsM", () => {
  const path: LonLat[] = [
    [7.1, 45.2],
    [7.1003, 45.2001],
    [7.1003, 45.2001],
    [7.1009, 45.1998],
  ];

  it("gives per-edge geodesics, stations from 0, and a repeated vertex as a zero-length edge", () => {
    const { edgeLengthsM, cumulativeM, totalM } = pathLengthsM(path);
    expect(edgeLengthsM[0]).toBe(geodesicDistanceM(path[0]!, path[1]!));
    expect(edgeLengthsM[1]).toBe(0);
    expect(cumulativeM[0]).toBe(0);
    expect(cumulativeM[3]).toBe(totalM);
    expect(totalM).toBeCloseTo(edgeLengthsM[0]! + edgeLengthsM[2]!, 12);
  });

  it("is unchanged when the path is reversed (property, 1e-9 relative: float rounding)", () => {
    const lonLat = fc.tuple(
      fc.double({ min: -0.01, max: 0.01, noNaN: true }),
      fc.double({ min: -0.01, max: 0.01, noNaN: true }),
    );
    fc.assert(
      fc.property(fc.array(lonLat, { minLength: 2, maxLength: 20 }), (offsets) => {
        const p: LonLat[] = offsets.map(([dx, dy]) => [-96 + dx, 32 + dy]);
        const forward = pathLengthsM(p).totalM;
        const backward = pathLengthsM([...p].reverse()).totalM;
        expect(Math.abs(forward - backward)).toBeLessThanOrEqual(1e-9 * Math.max(forward, 1));
      }),
    );
  });

  it("is additive: the station of a point on an edge splits the edge into its two geodesics", () => {
    const p: LonLat[] = [
      [-96, 32],
      [-95.999, 32.0004],
    ];
    const lengths = pathLengthsM(p);
    const mid: LonLat = [-95.9995, 32.0002];
    const stationM = stationOnEdgeM(p, lengths, 0, 0.5);
    expect(stationM).toBeCloseTo(geodesicDistanceM(p[0]!, mid), 9);
    expect(stationM + geodesicDistanceM(mid, p[1]!)).toBeCloseTo(lengths.totalM, 6);
  });
});

describe("geodesicAreaM2", () => {
  // geographiclib-geodesic 2.2.0 test/geodesictest.js "Planimeter0": the square with corners
  // (lat, lon) (0, −1), (−1, 0), (0, 1), (1, 0) has area 24,619,419,146 m² (±1 m² there).
  const diamond: LonLat[] = [
    [-1, 0],
    [0, -1],
    [1, 0],
    [0, 1],
    [-1, 0],
  ];

  it("matches the library's published Planimeter0 area, 24,619,419,146 m² (±1 m²)", () => {
    expect(Math.abs(geodesicAreaM2([diamond]) - 24_619_419_146)).toBeLessThanOrEqual(1);
  });

  it("does not depend on the winding or on an explicit closing vertex", () => {
    const reversed = [...diamond].reverse();
    expect(geodesicAreaM2([reversed])).toBeCloseTo(geodesicAreaM2([diamond]), 3);
    expect(geodesicAreaM2([diamond.slice(0, 4)])).toBeCloseTo(geodesicAreaM2([diamond]), 3);
  });

  it("subtracts holes, and a multipolygon is the sum of its parts (1e-6 relative)", () => {
    const square = (x: number, y: number, d: number): LonLat[] => [
      [x, y],
      [x + d, y],
      [x + d, y + d],
      [x, y + d],
      [x, y],
    ];
    const outer = square(10, 50, 0.01);
    const hole = square(10.004, 50.004, 0.002);
    const outerM2 = geodesicAreaM2([outer]);
    const holeM2 = geodesicAreaM2([hole]);
    expect(geodesicAreaM2([outer, hole])).toBeCloseTo(outerM2 - holeM2, 4);
    expect(multiPolygonAreaM2([[outer, hole], [hole]]) / outerM2).toBeCloseTo(1, 6);
  });
});

describe("rankingAreaM2 (the quick area that orders overlapping polygons)", () => {
  /** Each straight lon/lat edge as 32 short geodesics, so GeographicLib measures the same shape. */
  const densified = (ring: readonly LonLat[]): LonLat[] =>
    ring.flatMap((a, i) => {
      const b = ring[(i + 1) % ring.length]!;
      return Array.from({ length: 32 }, (_, j): LonLat => [
        a[0] + ((b[0] - a[0]) * j) / 32,
        a[1] + ((b[1] - a[1]) * j) / 32,
      ]);
    });

  it("is within 0.01 % of GeographicLib's area of the same straight-edged polygon under 0.05° across (property)", () => {
    const polygon = fc.record({
      lat: fc.double({ min: -79, max: 79, noNaN: true }),
      lon: fc.double({ min: -179, max: 179, noNaN: true }),
      turn: fc.double({ min: 0, max: 1, noNaN: true }),
      radii: fc.array(fc.double({ min: 0.002, max: 0.024, noNaN: true }), {
        minLength: 3,
        maxLength: 9,
      }),
    });
    fc.assert(
      fc.property(polygon, ({ lat, lon, turn, radii }) => {
        // A star around (lon, lat) with vertices at evenly spaced angles: always a simple ring.
        const ring: LonLat[] = radii.map((r, k) => {
          const angle = (2 * Math.PI * (k + turn)) / radii.length;
          return [lon + r * Math.cos(angle), lat + r * Math.sin(angle)];
        });
        const reference = geodesicAreaM2([densified(ring)]);
        expect(Math.abs(rankingAreaM2([ring]) - reference) / reference).toBeLessThan(1e-4);
      }),
      { numRuns: 300 },
    );
  });

  it("uses the geodesic area for a polygon over 0.05° across", () => {
    const ring: LonLat[] = [
      [10, 50],
      [10.2, 50],
      [10.2, 50.1],
      [10, 50.1],
    ];
    expect(rankingAreaM2([ring])).toBe(geodesicAreaM2([ring]));
  });
});
