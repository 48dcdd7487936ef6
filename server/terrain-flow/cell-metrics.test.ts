/**
 * True cell sizes against closed-form ellipsoid geometry (test-grids.ts): UTM on its central
 * meridian is the grid scaled by k0 = 0.9996 (NGA.SIG.0012); a geographic cell's east side is
 * the parallel arc N·cos φ·Δλ, its north side the meridian arc M·Δφ, its area the integral of
 * M·N·cos φ (derived). Tolerance 1e-7 relative: the formulas' own neglected terms (geodesic
 * against parallel, Δφ³) are below 1e-10 for cells this small; UTM's scale 500 m off the
 * meridian differs from k0 by 3e-9.
 */
import { describe, expect, it } from "vitest";
import { cellMetrics } from "./cell-metrics";
import { CRSES } from "./test-grids";

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe.each(CRSES)("cell sizes in $name", (crs) => {
  const [width, height] = [100, 80];
  const metrics = cellMetrics(crs.georef(width, height), width, height);

  it.each([0, 40, 79])("row %i: east, north and diagonal steps and area", (row) => {
    const ref = crs.steps(row, height);
    expect(relative(metrics.eastM[row]!, ref.east)).toBeLessThan(1e-7);
    expect(relative(metrics.northM[row]!, ref.north)).toBeLessThan(1e-7);
    expect(relative(metrics.diagNorthM[row]!, ref.diag)).toBeLessThan(1e-7);
    expect(relative(metrics.areaM2[row]!, crs.cellAreaM2(row, height))).toBeLessThan(1e-7);
  });
});

describe("a geographic grid is never measured in degrees", () => {
  it("has east steps shorter than north steps at 45° (cos φ ≈ 0.707)", () => {
    const [crs] = CRSES.slice(1);
    const metrics = cellMetrics(crs!.georef(10, 10), 10, 10);
    const ratio = metrics.eastM[5]! / metrics.northM[5]!;
    // N·cos φ / M at 45° N on WGS84 ≈ 0.7095 (derived from the radii above).
    expect(ratio).toBeGreaterThan(0.705);
    expect(ratio).toBeLessThan(0.712);
  });
});
