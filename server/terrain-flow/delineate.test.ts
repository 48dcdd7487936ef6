/**
 * Delineation on analytic surfaces (UTM and geographic): the basin of an outlet counted in
 * closed form, its area as the cells' ground area (test-grids.ts formulas), the longest flow
 * path as the D8 staircase plus the half step from the divide (longest-path.ts), nested outlets
 * splitting the area, snapping, refusals, and the conditioned stretches a path crosses.
 * Lengths 1e-5 relative (float32 flow lengths); areas 1e-6 (cells) and 0.5 % (the smoothed
 * boundary, its stated bound).
 */
import { describe, expect, it } from "vitest";
import { delineate } from "./delineate";
import { TerrainFlowError } from "./errors";
import { gridProjection } from "./georef";
import { conditionAndRoute } from "./route";
import { CRSES, makeGrid, type TestCrs, UTM } from "./test-grids";

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** The V-valley of route.test.ts: channel at column 10, sides 0.3 m/m, falling 0.25 m/m south. */
function valley(crs: TestCrs) {
  const [w, h, xc] = [21, 40, 10];
  const { east, north } = crs.steps(20, h);
  const grid = makeGrid(
    crs,
    w,
    h,
    (c, r) => 50 + 0.3 * Math.abs(c - xc) * east + 0.25 * (h - 1 - r) * north,
  );
  const routed = conditionAndRoute(grid);
  const centre = (c: number, r: number) => gridProjection(routed.georef).lonLatAt(c + 0.5, r + 0.5);
  return { w, h, xc, routed, centre };
}

/** Cells reaching the channel by row r (route.test.ts): Σ over rows r' ≤ r of 1 + 2·min(r − r', xc). */
const channelCells = (r: number, xc: number) =>
  Array.from({ length: r + 1 }, (_, j) => 1 + 2 * Math.min(j, xc)).reduce((a, b) => a + b);

describe.each(CRSES)("delineation in $name", (crs) => {
  it("the valley's outlet: every cell above it, the corner's staircase as longest path", () => {
    const { xc, routed, centre } = valley(crs);
    const [proposal] = delineate(routed, [centre(xc, 38)], { snapCells: 0 });
    expect(proposal!.cells).toBe(channelCells(38, xc));
    let cellsAreaM2 = 0;
    for (let j = 0; j <= 38; j += 1)
      cellsAreaM2 += (1 + 2 * Math.min(j, xc)) * crs.cellAreaM2(38 - j, 40);
    expect(relative(proposal!.cellsAreaM2, cellsAreaM2)).toBeLessThan(1e-6);
    expect(relative(proposal!.areaM2, cellsAreaM2)).toBeLessThan(0.005);
    // From the north-west corner of cell (0, 0): half a diagonal, 10 diagonal steps, 28 south.
    let lengthM = crs.steps(0, 40).diag / 2;
    for (let r = 0; r < 10; r += 1) lengthM += crs.steps(r + 1, 40).diag;
    for (let r = 10; r < 38; r += 1) lengthM += crs.steps(r + 1, 40).north;
    expect(relative(proposal!.longestFlowPathM, lengthM)).toBeLessThan(1e-5);
    const line = proposal!.longestFlowPath.coordinates;
    const start = gridProjection(routed.georef).lonLatAt(0, 0);
    expect(line[0]![0]).toBeCloseTo(start[0], 9);
    expect(line[0]![1]).toBeCloseTo(start[1], 9);
    expect(line.at(-1)).toEqual(centre(xc, 38));
    expect(proposal!.boundary.type).toBe("Polygon");
  });

  it("nested outlets split the valley: the lower one keeps only what the upper one does not take", () => {
    const { xc, routed, centre } = valley(crs);
    const [lower, upper] = delineate(routed, [centre(xc, 38), centre(xc, 20)], { snapCells: 0 });
    expect(upper!.cells).toBe(channelCells(20, xc));
    expect(lower!.cells).toBe(channelCells(38, xc) - channelCells(20, xc));
    // The lower basin's farthest cell is now a side corner just below the upper outlet's reach.
    expect(lower!.longestFlowPathM).toBeLessThan(
      upper!.longestFlowPathM + 20 * crs.steps(30, 40).north,
    );
  });

  it("a side cell's basin is its diagonal line of cells", () => {
    const { xc, routed, centre } = valley(crs);
    const [side] = delineate(routed, [centre(xc - 1, 30)], { snapCells: 0 });
    // Cells (xc − 1 − j, 30 − j): min(30, xc − 1) + 1 of them.
    expect(side!.cells).toBe(xc);
  });

  it("a ridge cell is a basin of one cell, its path half a step long", () => {
    const { routed, centre } = valley(crs);
    const [one] = delineate(routed, [centre(0, 39)], { snapCells: 0 });
    expect(one!.cells).toBe(1);
    expect(relative(one!.cellsAreaM2, crs.cellAreaM2(39, 40))).toBeLessThan(1e-6);
    expect(relative(one!.areaM2, one!.cellsAreaM2)).toBeLessThan(1e-5);
    expect(one!.boundarySmoothed).toBe(false);
    expect(one!.longestFlowPath.coordinates).toHaveLength(2);
  });

  it("snaps a click beside the channel to the largest accumulation in reach, and says how far", () => {
    const { xc, routed, centre } = valley(crs);
    // Within 3 cells of (8, 38) the channel's last cell (10, 39), √5 cells away, drains most.
    const [near] = delineate(routed, [centre(xc - 2, 38)], { snapCells: 3 });
    expect(near!.outlet.snapped).toEqual(centre(xc, 39));
    const { east, north } = crs.steps(38, 40);
    expect(relative(near!.outlet.movedM, Math.hypot(2 * east, north))).toBeLessThan(1e-3);
    expect(near!.cells).toBe(channelCells(39, xc));
    // With no radius the click stays where it is.
    const [stay] = delineate(routed, [centre(xc - 2, 38)], { snapCells: 0 });
    expect(stay!.outlet.movedM).toBeLessThan(1e-6);
  });
});

describe("refusals", () => {
  const { xc, routed, centre } = valley(UTM);
  const codeOf = (fn: () => unknown) => {
    try {
      fn();
    } catch (error) {
      if (error instanceof TerrainFlowError) return error.code;
      throw error;
    }
    return "accepted";
  };

  it("an outlet outside the grid", () => {
    expect(codeOf(() => delineate(routed, [[10, 10]]))).toBe("outlet-outside");
  });

  it("two outlets that snap to the same cell", () => {
    expect(codeOf(() => delineate(routed, [centre(xc - 1, 30), centre(xc + 1, 30)]))).toBe(
      "outlets-same-cell",
    );
  });

  it("an outlet on nodata", () => {
    const grid = makeGrid(UTM, 10, 10, (c) => (c < 3 ? Number.NaN : 10 + c));
    const holey = conditionAndRoute(grid);
    const at = gridProjection(holey.georef).lonLatAt(1.5, 4.5);
    expect(codeOf(() => delineate(holey, [at]))).toBe("outlet-on-nodata");
  });

  it("a snap radius out of range", () => {
    expect(codeOf(() => delineate(routed, [centre(xc, 38)], { snapCells: 51 }))).toBe(
      "snap-radius",
    );
  });
});

describe("conditioned ground on the path", () => {
  it("names the filled stretch of a valley dammed by an embankment", () => {
    // breach.test.ts's valley: channel rows 6–19 are filled to the crest (99.5 m).
    const [w, h, xc] = [9, 40, 4];
    const grid = makeGrid(
      UTM,
      w,
      h,
      (c, r) => 100 + 3 * Math.abs(c - xc) - 0.1 * r + (r === 20 || r === 21 ? 1.5 : 0),
    );
    const routed = conditionAndRoute(grid);
    const outlet = gridProjection(routed.georef).lonLatAt(xc + 0.5, 30.5);
    const [proposal] = delineate(routed, [outlet], { snapCells: 0 });
    // Sides fall 0.3 m/m to the channel, which falls 0.01 m/m: side cells drain straight east
    // or west, and the longest path runs from cell (0, 0): 4.5 steps east, then south.
    const step = 10 / 0.9996;
    const filled = proposal!.pathConditioning.filter((s) => s.kind === "filled");
    expect(filled).toHaveLength(1);
    expect(filled[0]!.fromM).toBeCloseTo(4.5 * step + 5.5 * step, 6);
    expect(filled[0]!.toM).toBeCloseTo(4.5 * step + 19.5 * step, 6);
    expect(proposal!.terrainConditioning.filledCells).toBe(14);
  });
});
