/**
 * Cell outlines: the rings of small hand-drawn cell sets (each vertex and orientation worked out
 * by hand), and properties over random cell sets (a seeded generator): the exact outline's area
 * is the number of cells, the smoothed one's within 0.5 % of it or not used, and no point of
 * the smoothed outline is half a cell or more from the cell edges. Validity as PostGIS judges
 * it is checked in tests/integration/terrain-outline.test.ts.
 */
import { describe, expect, it } from "vitest";
import { cutSaddles, signedArea, traceOutline } from "./outline";
import { simplifyOutline } from "./outline-simplify";
import { randomCells } from "./test-grids";

const W = 100; // randomCells' grid width
const cellsOf = (pairs: [number, number][]) => Int32Array.from(pairs, ([c, r]) => r * W + c);

describe("tracing along cell edges", () => {
  it("outlines one cell counter-clockwise from its south-west corner", () => {
    const { polygons, saddles } = traceOutline(cellsOf([[3, 5]]), W);
    expect(polygons).toHaveLength(1);
    // Map coordinates run north: counter-clockwise is SW → SE → NE → NW in (i, j) with j down.
    expect(polygons[0]!.shell).toEqual([3, 6, 4, 6, 4, 5, 3, 5]);
    expect(signedArea(polygons[0]!.shell)).toBe(1);
    expect(saddles.size).toBe(0);
  });

  it("keeps cells that touch at a corner in one shell, passing the saddle twice", () => {
    const { polygons, saddles } = traceOutline(
      cellsOf([
        [1, 1],
        [2, 2],
      ]),
      W,
    );
    expect(polygons).toHaveLength(1);
    expect(signedArea(polygons[0]!.shell)).toBe(2);
    expect([...saddles]).toEqual(["2,2"]);
    const passes = polygons[0]!.shell
      .filter((_, a) => a % 2 === 0)
      .filter((i, k) => i === 2 && polygons[0]!.shell[2 * k + 1] === 2);
    expect(passes).toHaveLength(2);
    // Cut by ε at both passes, the ring gains ε²/2 each time and no longer touches itself.
    const cut = cutSaddles(polygons[0]!.shell, saddles, 0.01);
    expect(signedArea(cut)).toBeCloseTo(2 + 0.0001, 12);
  });

  it("gives a ring of cells its hole, clockwise", () => {
    const ring: [number, number][] = [];
    for (let c = 0; c < 3; c += 1)
      for (let r = 0; r < 3; r += 1) if (c !== 1 || r !== 1) ring.push([c, r]);
    const { polygons } = traceOutline(cellsOf(ring), W);
    expect(polygons).toHaveLength(1);
    expect(signedArea(polygons[0]!.shell)).toBe(9);
    expect(polygons[0]!.holes.map(signedArea)).toEqual([-1]);
  });

  it("groups holes with their own shell when there are several", () => {
    const cells: [number, number][] = [];
    for (const x0 of [0, 10]) {
      for (let c = x0; c < x0 + 3; c += 1)
        for (let r = 0; r < 3; r += 1) if (c !== x0 + 1 || r !== 1) cells.push([c, r]);
    }
    cells.push([20, 20]);
    const { polygons } = traceOutline(cellsOf(cells), W);
    expect(polygons.map((p) => [signedArea(p.shell), p.holes.length]).sort()).toEqual([
      [1, 0],
      [9, 1],
      [9, 1],
    ]);
  });
});

/** Distance from a point to the nearest raw outline edge (brute force). */
function toEdges(rings: number[][], x: number, y: number): number {
  let best = Infinity;
  for (const ring of rings) {
    for (let a = 0; a < ring.length; a += 2) {
      const b = (a + 2) % ring.length;
      const [ax, ay, bx, by] = [ring[a]!, ring[a + 1]!, ring[b]!, ring[b + 1]!];
      const len2 = (bx - ax) ** 2 + (by - ay) ** 2;
      const t = Math.max(0, Math.min(1, ((x - ax) * (bx - ax) + (y - ay) * (by - ay)) / len2));
      best = Math.min(best, Math.hypot(x - ax - t * (bx - ax), y - ay - t * (by - ay)));
    }
  }
  return best;
}

describe("outlines of random cell sets", () => {
  it.each(Array.from({ length: 12 }, (_, k) => k + 1))(
    "seed %i: area kept, within half a cell",
    (seed) => {
      const cells = randomCells(seed, 60, 200 + 150 * seed);
      const outline = traceOutline(cells, W);
      const raw = outline.polygons.flatMap((p) => [p.shell, ...p.holes]);
      expect(raw.reduce((sum, ring) => sum + signedArea(ring), 0)).toBe(cells.length);
      const smooth = simplifyOutline(outline);
      expect(smooth.areaChange).toBeLessThanOrEqual(0.005);
      // Blobs this jagged keep the smooth outline from 500 cells up (the seeds are fixed).
      expect(smooth.simplified).toBe(cells.length >= 500);
      let worst = 0;
      for (const ring of smooth.polygons.flatMap((p) => [p.shell, ...p.holes])) {
        for (let a = 0; a < ring.length; a += 2) {
          const b = (a + 2) % ring.length;
          for (let t = 0; t <= 1; t += 0.125) {
            const x = ring[a]! + t * (ring[b]! - ring[a]!);
            const y = ring[a + 1]! + t * (ring[b + 1]! - ring[a + 1]!);
            worst = Math.max(worst, toEdges(raw, x, y));
          }
        }
      }
      expect(worst).toBeLessThan(0.5);
    },
  );
});
