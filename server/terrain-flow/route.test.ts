/**
 * Routing on analytic surfaces, in a projected and a geographic CRS, against closed forms:
 * directions, accumulation (cells, exact) and downstream flow length (the D8 path's step count
 * times reference step lengths from test-grids.ts; 1e-5 relative, the float32 storage of the
 * lengths). Each surface's slopes are chosen so that D8 (O'Callaghan & Mark 1984: steepest
 * drop ÷ step length) has one clear answer, worked out beside it. Mismatches are collected and
 * compared with an empty list, so a failure names every cell that is wrong.
 */
import { describe, expect, it } from "vitest";
import { D_COL, D_ROW } from "./d8";
import { conditionAndRoute } from "./route";
import { CRSES, makeGrid, type TestCrs } from "./test-grids";
import type { RoutedGrid } from "./types";

const [E, NE, SE, SW] = [1, 2, 8, 6];

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** Metres of a step of code k leaving a cell of `row`, by the reference formulas. */
export function refStep(crs: TestCrs, height: number, row: number, k: number): number {
  const here = crs.steps(row, height);
  if (k === 1 || k === 5) return here.east;
  if (k === 3) return here.north;
  if (k === 2 || k === 4) return here.diag;
  const below = crs.steps(row + 1, height);
  return k === 7 ? below.north : below.diag;
}

/** The D8 path from a cell to where it leaves the grid: steps and reference length. */
function walk(routed: RoutedGrid, crs: TestCrs, col: number, row: number) {
  let [c, r, steps, lengthM] = [col, row, 0, 0];
  for (;;) {
    const k = routed.dir[r * routed.width + c]!;
    if (k === 0) return { steps, lengthM, col: c, row: r };
    lengthM += refStep(crs, routed.height, r, k);
    [c, r, steps] = [c + D_COL[k]!, r + D_ROW[k]!, steps + 1];
  }
}

/** Cells where `check` returns a complaint, as "col,row: complaint". */
function mismatches(w: number, h: number, check: (c: number, r: number) => string | null) {
  const out: string[] = [];
  for (let r = 0; r < h; r += 1) {
    for (let c = 0; c < w; c += 1) {
      const complaint = check(c, r);
      if (complaint !== null) out.push(`${c},${r}: ${complaint}`);
    }
  }
  return out;
}

describe.each(CRSES)("analytic surfaces in $name", (crs) => {
  it("tilted plane falling east: every cell drains east, area = cells to the west", () => {
    const [w, h] = [30, 20];
    const east = crs.steps(0, h).east;
    // Only the east step drops (0.05 m per metre); north and south are level.
    const routed = conditionAndRoute(makeGrid(crs, w, h, (c) => 100 - 0.05 * c * east));
    const wrong = mismatches(w, h, (c, r) => {
      const at = r * w + c;
      const lengthM = (w - 1 - c) * crs.steps(r, h).east;
      if (routed.dir[at] !== (c === w - 1 ? 0 : E)) return `dir ${routed.dir[at]}`;
      if (routed.acc[at] !== c + 1) return `acc ${routed.acc[at]}`;
      if (c < w - 1 && relative(routed.flowLenM[at]!, lengthM) > 1e-5) return "length";
      return null;
    });
    expect(wrong).toEqual([]);
    expect(routed.report.filledCells + routed.report.flatCells).toBe(0);
  });

  it("tilted plane falling north-east: diagonal paths out through the north or east edge", () => {
    const [w, h] = [25, 25];
    const { east, north } = crs.steps(12, h);
    // z falls s per metre east and per metre north: drop ÷ step is s east or north and
    // s·(east + north)/diagonal north-east (≈ 1.41 s in UTM, 1.40 s at 45° N), the steepest;
    // on the north and east edges the plane continued outside falls that way too, so they exit.
    const routed = conditionAndRoute(
      makeGrid(crs, w, h, (c, r) => 100 - 0.04 * (c * east + (h - 1 - r) * north)),
    );
    const wrong = mismatches(w, h, (c, r) => {
      const at = r * w + c;
      const onEdge = r === 0 || c === w - 1;
      const path = walk(routed, crs, c, r);
      if (routed.dir[at] !== (onEdge ? 0 : NE)) return `dir ${routed.dir[at]}`;
      // Cells on the diagonal line south-west of it, itself included.
      if (routed.acc[at] !== Math.min(c, h - 1 - r) + 1) return `acc ${routed.acc[at]}`;
      if (path.steps !== Math.min(r, w - 1 - c)) return "steps";
      if (path.steps > 0 && relative(routed.flowLenM[at]!, path.lengthM) > 1e-5) return "length";
      return null;
    });
    expect(wrong).toEqual([]);
  });

  it("V-shaped valley draining to a sloping channel: the D8 staircase and each side's area", () => {
    const [w, h, xc] = [21, 40, 10];
    const { east, north } = crs.steps(20, h);
    // Sides rise 0.3 m/m away from the channel column, everything falls 0.25 m/m south. From
    // a side cell: toward the channel 0.3, south 0.25, diagonally toward it and south
    // (0.3·east + 0.25·north)/diagonal ≈ 0.39 (UTM) or 0.38 (45° N): the staircase.
    const side = (c: number) => 0.3 * Math.abs(c - xc) * east;
    const routed = conditionAndRoute(
      makeGrid(crs, w, h, (c, r) => 50 + side(c) + 0.25 * (h - 1 - r) * north),
    );
    const wrong = mismatches(w, h, (c, r) => {
      const at = r * w + c;
      const k = Math.abs(c - xc);
      // The bottom row's side cells fall fastest diagonally out of the grid.
      const expected = r === h - 1 ? 0 : k === 0 ? 7 : c < xc ? SE : SW;
      if (routed.dir[at] !== expected) return `dir ${routed.dir[at]}, expected ${expected}`;
      if (k === 0) {
        // Everything that reaches the channel by row r: rows r' ≤ r, 1 + 2·min(r − r', xc).
        let cells = 0;
        for (let j = 0; j <= r; j += 1) cells += 1 + 2 * Math.min(j, xc);
        if (routed.acc[at] !== cells) return `acc ${routed.acc[at]}, expected ${cells}`;
      }
      const path = walk(routed, crs, c, r);
      if (path.steps !== h - 1 - r) return `steps ${path.steps}`;
      if (relative(routed.flowLenM[at]!, path.lengthM) > 1e-5 && path.steps > 0) return "length";
      return null;
    });
    expect(wrong).toEqual([]);
    // The longest path starts at a top corner: xc diagonal steps, then h − 1 − xc south.
    const top = walk(routed, crs, 0, 0);
    expect(top.steps).toBe(h - 1);
    const expectedM =
      Array.from({ length: xc }, (_, r) => refStep(crs, h, r, SE)).reduce((a, b) => a + b) +
      Array.from({ length: h - 1 - xc }, (_, j) => refStep(crs, h, xc + j, 7)).reduce(
        (a, b) => a + b,
      );
    expect(relative(routed.flowLenM[0]!, expectedM)).toBeLessThan(1e-5);
  });

  it("cone: every cell drains away from the summit to the edge", () => {
    const [w, h, cx, cy] = [31, 31, 15, 15];
    const { east, north } = crs.steps(15, h);
    const routed = conditionAndRoute(
      makeGrid(crs, w, h, (c, r) => 200 - 0.2 * Math.hypot((c - cx) * east, (r - cy) * north)),
    );
    const radius2 = (c: number, r: number) => ((c - cx) * east) ** 2 + ((r - cy) * north) ** 2;
    const wrong = mismatches(w, h, (c, r) => {
      const k = routed.dir[r * w + c]!;
      if (c === cx && r === cy) return null; // the summit: all eight ways fall alike
      if (k === 0) return c === 0 || r === 0 || c === w - 1 || r === h - 1 ? null : "stops";
      return radius2(c + D_COL[k]!, r + D_ROW[k]!) > radius2(c, r) ? null : "climbs";
    });
    expect(wrong).toEqual([]);
    let drained = 0;
    for (let at = 0; at < w * h; at += 1) if (routed.dir[at] === 0) drained += routed.acc[at]!;
    expect(drained).toBe(w * h);
    // Along the east axis the path is straight east.
    for (let c = cx + 1; c < w; c += 1) {
      expect(walk(routed, crs, c, cy).steps).toBe(w - 1 - c);
    }
  });

  it("closed bowl: filled to its lowest rim cell and drained through it", () => {
    const [w, h, cx, cy] = [21, 21, 10, 10];
    const { east, north } = crs.steps(10, h);
    // A paraboloid; the rim's lowest cells are the four edge midpoints, at 10 + 0.01·R².
    const z = (c: number, r: number) =>
      10 + 0.01 * (((c - cx) * east) ** 2 + ((r - cy) * north) ** 2);
    const routed = conditionAndRoute(makeGrid(crs, w, h, z));
    const level = Math.min(z(0, cy), z(cx, 0));
    let below = 0;
    for (let r = 0; r < h; r += 1)
      for (let c = 0; c < w; c += 1) if (Math.fround(z(c, r)) < Math.fround(level)) below += 1;
    expect(routed.report.filledCells).toBe(below);
    expect(Math.abs(routed.report.maxFillDepthM - (Math.fround(level) - 10))).toBeLessThan(1e-4);
    // Every cell drains (the order covered them all) and leaves by a lowest rim cell.
    const exits = [...routed.dir.keys()].filter((at) => routed.dir[at] === 0);
    const lowest = [cy * w, cy * w + w - 1, cx, (h - 1) * w + cx].filter(
      (at) => Math.fround(z(at % w, Math.floor(at / w))) === Math.fround(level),
    );
    expect(exits.sort()).toEqual(lowest.sort());
    expect(exits.reduce((sum, at) => sum + routed.acc[at]!, 0)).toBe(w * h);
  });
});
