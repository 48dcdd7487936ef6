/**
 * Stream lines and Strahler orders: a hand-drawn network worked by the definition (Strahler
 * 1957: sources are order 1; two links of equal order meeting make the next order; otherwise
 * the higher carries on), and a terrain of valleys checked cell by cell against a direct
 * recursive reading of that definition.
 */
import { describe, expect, it } from "vitest";
import { accumulate, flowLengths } from "./accumulate";
import { cellMetrics } from "./cell-metrics";
import { D_COL, D_ROW, offsets, stepTable } from "./d8";
import { conditionAndRoute } from "./route";
import { cellsForArea, streamLinesGeoJSON, streamLinks } from "./streams";
import { makeGrid, UTM, valleysElevation } from "./test-grids";
import { NODATA_MASK, type RoutedGrid } from "./types";

const [S, SE, SW, W] = [7, 8, 6, 5];

/** A routed grid from drawn directions; cells not drawn are nodata. */
function drawn(width: number, height: number, arrows: [number, number, number][]): RoutedGrid {
  const dir = new Uint8Array(width * height);
  const cond = new Uint8Array(width * height).fill(NODATA_MASK);
  const inflow = new Uint8Array(width * height).fill(255);
  for (const [c, r, d] of arrows) {
    dir[r * width + c] = d;
    cond[r * width + c] = 0;
    inflow[r * width + c] = 0;
  }
  const off = offsets(width);
  for (const [c, r, d] of arrows) {
    const down = r * width + c + off[d]!;
    if (d !== 0) inflow[down] = inflow[down]! + 1;
  }
  const georef = UTM.georef(width, height);
  const metrics = cellMetrics(georef, width, height);
  const { acc, order, count } = accumulate(dir, inflow, width);
  const flowLenM = flowLengths(dir, order, count, width, stepTable(metrics, height));
  const report = {
    method: "fill" as const,
    filledCells: 0,
    maxFillDepthM: 0,
    flatCells: 0,
    breachedPits: 0,
    breachedCells: 0,
    maxBreachDepthM: 0,
    unbreachedPits: 0,
  };
  return { width, height, georef, metrics, dir, cond, acc, flowLenM, report };
}

const cellsOf = (width: number, pairs: [number, number][]) => pairs.map(([c, r]) => r * width + c);

describe("a drawn network", () => {
  // Sources A (column 1) and B (column 3) meet at (2, 3); C (column 4) joins at (2, 5).
  const routed = drawn(6, 7, [
    [1, 0, S],
    [1, 1, S],
    [1, 2, SE],
    [3, 0, S],
    [3, 1, S],
    [3, 2, SW],
    [2, 3, S],
    [2, 4, S],
    [2, 5, S],
    [2, 6, 0],
    [4, 3, S],
    [4, 4, SW],
    [3, 5, W],
  ]);

  it("splits it into links at the confluences, each with its Strahler order", () => {
    const links = streamLinks(routed, 1).map((l) => ({ order: l.order, cells: [...l.cells] }));
    const w = routed.width;
    expect(links).toEqual(
      expect.arrayContaining([
        {
          order: 1,
          cells: cellsOf(w, [
            [1, 0],
            [1, 1],
            [1, 2],
            [2, 3],
          ]),
        },
        {
          order: 1,
          cells: cellsOf(w, [
            [3, 0],
            [3, 1],
            [3, 2],
            [2, 3],
          ]),
        },
        {
          order: 2,
          cells: cellsOf(w, [
            [2, 3],
            [2, 4],
            [2, 5],
          ]),
        },
        {
          order: 1,
          cells: cellsOf(w, [
            [4, 3],
            [4, 4],
            [3, 5],
            [2, 5],
          ]),
        },
        {
          order: 2,
          cells: cellsOf(w, [
            [2, 5],
            [2, 6],
          ]),
        },
      ]),
    );
    expect(links).toHaveLength(5);
  });

  it("starts the lines where the area reaches the threshold", () => {
    // From 2 cells, each source's first cell drops out; the structure stays.
    const links = streamLinks(routed, 2);
    expect(links.map((l) => l.order).sort()).toEqual([1, 1, 1, 2, 2]);
    expect(links.find((l) => l.cells.length === 3 && l.order === 1)!.cells[0]).toBe(1 * 6 + 1);
  });

  it("draws them as GeoJSON lines through cell centres, corners only", () => {
    const lines = streamLinesGeoJSON(routed, streamLinks(routed, 1));
    expect(lines.features).toHaveLength(5);
    const a = lines.features.find(
      (f) => f.properties.order === 1 && f.geometry.coordinates.length === 3,
    );
    expect(a).toBeDefined();
  });
});

describe("a terrain of valleys", () => {
  it("orders every stream cell as the recursive definition does", () => {
    const [w, h, cell] = [120, 120, 10 / 0.9996];
    const routed = conditionAndRoute(
      makeGrid(UTM, w, h, (c, r) => valleysElevation(c * cell, (h - 1 - r) * cell, 0.3)),
    );
    const threshold = cellsForArea(routed, 20 * (10 / 0.9996) ** 2);
    expect(threshold).toBe(20);
    const links = streamLinks(routed, threshold);
    const mine = new Map<number, number>();
    for (const link of links) link.cells.slice(0, -1).forEach((c) => mine.set(c, link.order));
    for (const link of links) {
      const last = link.cells.at(-1)!;
      if (routed.dir[last] === 0 && !mine.has(last)) mine.set(last, link.order);
    }
    // The definition, read directly: recursion over the stream donors of each cell.
    const isStream = (c: number) => routed.acc[c]! >= threshold;
    const memo = new Map<number, number>();
    const strahler = (c: number): number => {
      if (memo.has(c)) return memo.get(c)!;
      const col = c % w;
      const row = Math.floor(c / w);
      const inflows: number[] = [];
      for (let k = 1; k <= 8; k += 1) {
        const [q, r] = [col + D_COL[k]!, row + D_ROW[k]!];
        if (q < 0 || r < 0 || q >= w || r >= h) continue;
        const nb = r * w + q;
        if (isStream(nb) && routed.dir[nb] === ((k + 3) % 8) + 1) inflows.push(strahler(nb));
      }
      const top = Math.max(0, ...inflows);
      const value =
        inflows.length === 0 ? 1 : inflows.filter((o) => o === top).length >= 2 ? top + 1 : top;
      memo.set(c, value);
      return value;
    };
    const wrong: string[] = [];
    let streamCells = 0;
    for (let c = 0; c < w * h; c += 1) {
      if (!isStream(c)) continue;
      streamCells += 1;
      if (mine.get(c) !== strahler(c))
        wrong.push(`${c % w},${Math.floor(c / w)}: ${mine.get(c)} vs ${strahler(c)}`);
    }
    expect(wrong).toEqual([]);
    expect(mine.size).toBe(streamCells);
    expect(Math.max(...links.map((l) => l.order))).toBeGreaterThanOrEqual(3);
  });
});
