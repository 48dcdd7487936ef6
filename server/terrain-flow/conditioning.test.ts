/**
 * What the engine does where the terrain does not drain by itself: flats, pits, nodata
 * islands, the grid's edge. The expected answers follow from the rules in flood.ts and
 * directions.ts (every cell drains; a flat drains to its nearest lower edge; nodata and the
 * edge take water out of the grid) worked out by hand for each small surface.
 */
import { describe, expect, it } from "vitest";
import { D_COL, D_ROW } from "./d8";
import { conditionAndRoute } from "./route";
import { CRSES, makeGrid } from "./test-grids";
import { COND_FILLED, COND_FLAT, NODATA_MASK, type RoutedGrid } from "./types";

/** Cells on the D8 path from (col, row) to where it leaves the grid, the start included. */
function pathOf(routed: RoutedGrid, col: number, row: number): [number, number][] {
  const out: [number, number][] = [[col, row]];
  for (let k = routed.dir[row * routed.width + col]!; k !== 0;) {
    [col, row] = [col + D_COL[k]!, row + D_ROW[k]!];
    out.push([col, row]);
    k = routed.dir[row * routed.width + col]!;
  }
  return out;
}

describe.each(CRSES)("conditioning in $name", (crs) => {
  it("a level grid drains every cell to its nearest edge", () => {
    const [w, h] = [15, 11];
    const routed = conditionAndRoute(makeGrid(crs, w, h, () => 42));
    const wrong: string[] = [];
    for (let r = 0; r < h; r += 1) {
      for (let c = 0; c < w; c += 1) {
        const nearest = Math.min(c, r, w - 1 - c, h - 1 - r);
        const steps = pathOf(routed, c, r).length - 1;
        if (steps !== nearest) wrong.push(`${c},${r}: ${steps} steps, nearest edge ${nearest}`);
        const flat = (routed.cond[r * w + c]! & COND_FLAT) !== 0;
        if (flat !== nearest > 0) wrong.push(`${c},${r}: flat mark ${flat}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(routed.report.flatCells).toBe((w - 2) * (h - 2));
    expect(routed.report.filledCells).toBe(0);
  });

  it("a terrace on a slope drains across to its lower edge, never back up", () => {
    const [w, h] = [12, 30];
    const north = crs.steps(15, h).north;
    // Falls 0.1 m/m south, except rows 10–20, level at row 20's height.
    const z = (r: number) =>
      80 - 0.1 * Math.max(Math.min(r, 20), 10) * north - 0.1 * Math.max(r - 20, 0) * north;
    const routed = conditionAndRoute(makeGrid(crs, w, h, (_c, r) => z(r)));
    for (let r = 10; r < 20; r += 1) {
      for (const c of [0, 5, 11]) {
        const path = pathOf(routed, c, r);
        // Row 21 is the first lower row: 20 − r steps across the terrace, each one row south.
        const acrossTerrace = path.findIndex(([, row]) => row === 20);
        expect(acrossTerrace).toBe(20 - r);
        for (let i = 1; i <= acrossTerrace; i += 1) expect(path[i]![1] - path[i - 1]![1]).toBe(1);
      }
    }
  });

  it("a one-cell pit is raised to its lowest neighbour and drains", () => {
    const [w, h] = [9, 9];
    const east = crs.steps(4, h).east;
    const plane = (c: number) => 20 - 0.05 * c * east;
    const grid = makeGrid(crs, w, h, (c, r) => (c === 4 && r === 4 ? plane(4) - 1.5 : plane(c)));
    const lowest = Math.fround(plane(5));
    const routed = conditionAndRoute(grid);
    expect(routed.report.filledCells).toBe(1);
    expect(routed.cond[4 * w + 4]! & COND_FILLED).toBe(COND_FILLED);
    // It was 1.5 m below its own level; the lowest neighbour lies one east step lower still.
    expect(
      Math.abs(routed.report.maxFillDepthM - (lowest - Math.fround(plane(4) - 1.5))),
    ).toBeLessThan(1e-4);
    expect(grid.z[4 * w + 4]).toBe(lowest);
    // It is now level with three neighbours to the east and drains through one of them.
    const path = pathOf(routed, 4, 4);
    expect(path[1]![0]).toBe(5);
    expect(path.at(-1)![0]).toBe(w - 1);
  });

  it("a nodata island takes the water that reaches it; cells behind it start afresh", () => {
    const [w, h] = [25, 25];
    const east = crs.steps(12, h).east;
    const island = (c: number, r: number) => c >= 10 && c <= 14 && r >= 10 && r <= 14;
    const routed = conditionAndRoute(
      makeGrid(crs, w, h, (c, r) => (island(c, r) ? Number.NaN : 60 - 0.05 * c * east)),
    );
    for (let r = 11; r <= 13; r += 1) {
      // West of the island the plane continued into it falls east: the water leaves there.
      expect(routed.dir[r * w + 9]).toBe(0);
      expect(routed.acc[r * w + 9]).toBe(10);
    }
    for (let r = 10; r <= 14; r += 1) {
      expect(routed.cond[r * w + 12]).toBe(NODATA_MASK);
      expect(routed.acc[r * w + 12]).toBe(0);
      // East of it nothing arrives from the west: the row starts again at column 15.
      expect(routed.acc[r * w + 15]).toBe(1);
      expect(routed.acc[r * w + w - 1]).toBe(w - 15);
    }
  });

  it("the grid's edge takes the water of a plane falling out of it", () => {
    const [w, h] = [10, 6];
    const east = crs.steps(3, h).east;
    const routed = conditionAndRoute(makeGrid(crs, w, h, (c) => 10 + 0.02 * c * east));
    for (let r = 0; r < h; r += 1) {
      expect(routed.dir[r * w]).toBe(0);
      expect(routed.acc[r * w]).toBe(w);
      expect(routed.flowLenM[r * w]).toBe(0);
    }
  });

  it("a cell nothing drains into is a basin of one cell", () => {
    const [w, h] = [7, 7];
    const east = crs.steps(3, h).east;
    // A ridge along column 3: both sides fall away from it.
    const routed = conditionAndRoute(makeGrid(crs, w, h, (c) => 30 - 0.1 * Math.abs(c - 3) * east));
    for (let r = 0; r < h; r += 1) expect(routed.acc[r * w + 3]).toBe(1);
  });
});
