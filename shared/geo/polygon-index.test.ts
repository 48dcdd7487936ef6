/**
 * The polygon index: bounding-box search (flatbush) and the overlap rule documented in
 * polygon-index.ts (smallest feature area on WGS84 wins, ties to the lower featureId).
 */
import { describe, expect, it } from "vitest";
import { buildPolygonIndex, winnerAt } from "./polygon-index";
import type { LonLat } from "./types";

const square = (x: number, y: number, d: number): LonLat[] => [
  [x, y],
  [x + d, y],
  [x + d, y + d],
  [x, y + d],
];

describe("buildPolygonIndex", () => {
  it("finds only the polygons whose boxes touch the query box", () => {
    const index = buildPolygonIndex(
      Array.from({ length: 100 }, (_, k) => ({
        featureId: k,
        value: `c${k}`,
        rings: [square((k % 10) * 0.01, Math.floor(k / 10) * 0.01, 0.01)],
      })),
    );
    const hits = index.search(0.0251, 0.0351, 0.0252, 0.0352).map((e) => index.featureIds[e]);
    expect(hits).toEqual([32]);
  });

  it("closes open rings and keeps them as flat lon/lat arrays", () => {
    const index = buildPolygonIndex([{ featureId: 1, value: "a", rings: [square(0, 0, 1)] }]);
    expect(Array.from(index.rings[0]![0]!)).toEqual([0, 0, 1, 0, 1, 1, 0, 1, 0, 0]);
  });

  it("ranks a multipolygon by the area of the whole feature", () => {
    // Feature 5 has two parts of 0.3° each (0.18 deg² in all); feature 6 is one 0.4° square.
    const index = buildPolygonIndex([
      { featureId: 5, value: "woods", rings: [square(0, 0, 0.3)] },
      { featureId: 5, value: "woods", rings: [square(1, 0, 0.3)] },
      { featureId: 6, value: "range", rings: [square(0.1, 0.1, 0.4)] },
    ]);
    const point: [number, number] = [0.2, 0.2];
    const hits = index.search(point[0], point[1], point[0], point[1]);
    expect(index.values[winnerAt(index, hits, ...point)]).toBe("range");
  });

  it("gives -1 where no polygon holds the point, and works with no polygons at all", () => {
    const index = buildPolygonIndex<string>([
      { featureId: 1, value: "a", rings: [square(0, 0, 1)] },
    ]);
    expect(winnerAt(index, index.search(2, 2, 2, 2), 2, 2)).toBe(-1);
    expect(buildPolygonIndex<string>([]).search(-180, -90, 180, 90)).toEqual([]);
  });

  it("names the feature whose vertex is not a number", () => {
    expect(() =>
      buildPolygonIndex([
        {
          featureId: 42,
          value: "a",
          rings: [
            [
              [0, 0],
              [1, Number.NaN],
              [1, 1],
            ],
          ],
        },
      ]),
    ).toThrow(/feature 42: vertex 1/);
  });
});
