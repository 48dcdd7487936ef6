/**
 * Average land slope on analytic surfaces: on a plane z = a + b·x + c·y (x, y in metres) every
 * gradient is (b, c), so the average is 100·√(b² + c²) percent exactly (1e-9: float rounding),
 * whatever the boundary's shape.
 */
import { describe, expect, it } from "vitest";
import { geodesicAreaM2 } from "./geodesic";
import { averageLandSlopePercent, gridOverPolygon } from "./land-slope";
import type { LonLat } from "./types";

describe("averageLandSlopePercent", () => {
  it("gives a plane's slope exactly inside an irregular (circular) boundary", () => {
    const width = 41;
    const height = 31;
    const elevationsM: (number | null)[] = [];
    for (let r = 0; r < height; r += 1) {
      for (let c = 0; c < width; c += 1) {
        const inside = (c - 20) ** 2 + (r - 15) ** 2 <= 14 ** 2;
        elevationsM.push(inside ? 150 + 0.03 * (c * 5) - 0.04 * (r * 5) : null);
      }
    }
    const result = averageLandSlopePercent({
      width,
      height,
      cellSizeXM: 5,
      cellSizeYM: 5,
      elevationsM,
    });
    expect(result!.slopePercent).toBeCloseTo(5, 9);
    expect(result!.sampleCount).toBeGreaterThan(500);
  });

  it("averages gradient magnitudes: two planes of 2 % and 6 % side by side give 4 %", () => {
    // Columns 0–1 fall at 2 % and columns 2–3 at 6 % along y only; x-differences are zero.
    const elevationsM: number[] = [];
    for (let r = 0; r < 3; r += 1) {
      for (let c = 0; c < 4; c += 1) elevationsM.push((c < 2 ? 0.02 : 0.06) * r * 10);
    }
    const result = averageLandSlopePercent({
      width: 4,
      height: 3,
      cellSizeXM: 1e9,
      cellSizeYM: 10,
      elevationsM,
    });
    expect(result!.slopePercent).toBeCloseTo(4, 6);
  });

  it("is null when no sample has a neighbour (nothing to measure)", () => {
    expect(
      averageLandSlopePercent({
        width: 3,
        height: 1,
        cellSizeXM: 1,
        cellSizeYM: 1,
        elevationsM: [1, null, 2],
      }),
    ).toBeNull();
  });
});

describe("gridOverPolygon", () => {
  const x0 = 8.5;
  const y0 = 47.3;
  const square = (d: number): LonLat[] => [
    [x0, y0],
    [x0 + d, y0],
    [x0 + d, y0 + d],
    [x0, y0 + d],
    [x0, y0],
  ];

  it("covers the boundary at the spacing: inside points × cell area ≈ the geodesic area (2 %)", () => {
    const rings = [square(0.004)];
    const grid = gridOverPolygon(rings, 5);
    const inside = grid.points.filter((p) => p !== null).length;
    const ratio = (inside * grid.cellSizeXM * grid.cellSizeYM) / geodesicAreaM2(rings);
    expect(Math.abs(ratio - 1)).toBeLessThan(0.02);
    expect(grid.cellSizeXM).toBe(5);
  });

  it("leaves out points in a hole", () => {
    const hole: LonLat[] = [
      [x0 + 0.001, y0 + 0.001],
      [x0 + 0.003, y0 + 0.001],
      [x0 + 0.003, y0 + 0.003],
      [x0 + 0.001, y0 + 0.003],
    ];
    const grid = gridOverPolygon([square(0.004), hole], 10);
    const inHole = grid.points.filter(
      (p) => p && p[0] > x0 + 0.001 && p[0] < x0 + 0.003 && p[1] > y0 + 0.001 && p[1] < y0 + 0.003,
    );
    expect(inHole).toEqual([]);
  });

  it("widens the spacing to stay under the point limit", () => {
    const grid = gridOverPolygon([square(0.05)], 1, 10_000);
    expect(grid.width * grid.height).toBeLessThanOrEqual(10_000);
    expect(grid.cellSizeXM).toBeGreaterThan(1);
  });
});
