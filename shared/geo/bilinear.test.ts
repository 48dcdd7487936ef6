/**
 * Bilinear interpolation reproduces planes exactly (analytic: the bilinear form contains every
 * linear function), so an analytic plane z = a + b·x + c·y is the reference; 1e-9 m allows for
 * float rounding on values of a few thousand metres.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { bilinear, sampleGrid, type ElevationGrid } from "./bilinear";

const plane = (a: number, b: number, c: number) => (x: number, y: number) => a + b * x + c * y;

function gridOf(width: number, height: number, z: (col: number, row: number) => number) {
  const values = new Float64Array(width * height);
  for (let r = 0; r < height; r += 1)
    for (let c = 0; c < width; c += 1) values[r * width + c] = z(c, r);
  return { width, height, values, nodata: -9999 } satisfies ElevationGrid;
}

describe("bilinear", () => {
  it("reproduces a plane inside one cell (property, 1e-9 m)", () => {
    const n = fc.double({ min: -50, max: 50, noNaN: true });
    const f = fc.double({ min: 0, max: 1, noNaN: true });
    fc.assert(
      fc.property(n, n, n, f, f, (a, b, c, fx, fy) => {
        const z = plane(1000 + a, b, c);
        const value = bilinear(z(0, 0), z(1, 0), z(0, 1), z(1, 1), fx, fy);
        expect(Math.abs(value! - z(fx, fy))).toBeLessThan(1e-9);
      }),
    );
  });

  it("returns the corner values at the corners", () => {
    expect(bilinear(1, 2, 3, 4, 0, 0)).toBe(1);
    expect(bilinear(1, 2, 3, 4, 1, 1)).toBe(4);
  });

  it("gives null, not a re-weighted value, when any corner is nodata", () => {
    expect(bilinear(1, null, 3, 4, 0.1, 0.1)).toBeNull();
    expect(bilinear(1, 2, Number.NaN, 4, 0.9, 0.9)).toBeNull();
  });
});

describe("sampleGrid", () => {
  const z = plane(312.5, 0.75, -1.25);
  const grid = gridOf(40, 30, z);

  it("reproduces a plane anywhere among the samples (property, 1e-9 m)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 39, noNaN: true }),
        fc.double({ min: 0, max: 29, noNaN: true }),
        (col, row) => {
          expect(Math.abs(sampleGrid(grid, col, row)! - z(col, row))).toBeLessThan(1e-9);
        },
      ),
    );
  });

  it("holds the edge value for half a pixel beyond the outer samples, then gives null", () => {
    expect(sampleGrid(grid, -0.4, 3)).toBeCloseTo(z(0, 3), 9);
    expect(sampleGrid(grid, 39.5, 29.5)).toBeCloseTo(z(39, 29), 9);
    expect(sampleGrid(grid, -0.6, 3)).toBeNull();
    expect(sampleGrid(grid, 5, 29.6)).toBeNull();
  });

  it("gives null next to a nodata sample and a value one cell away", () => {
    const values = Float64Array.from(grid.values);
    values[10 * 40 + 10] = -9999;
    const holed = { ...grid, values };
    expect(sampleGrid(holed, 10.5, 10.5)).toBeNull();
    expect(sampleGrid(holed, 9.5, 9.5)).toBeNull();
    expect(sampleGrid(holed, 11.5, 11.5)).toBeCloseTo(z(11.5, 11.5), 9);
  });

  it("samples a single-pixel grid as that pixel's value", () => {
    expect(sampleGrid({ width: 1, height: 1, values: [7], nodata: null }, 0.2, -0.3)).toBe(7);
  });
});
