/**
 * The fill against the textbook Priority-Flood (Barnes, Lehman & Mulla 2014, Algorithm 1: seed
 * the edge, take the lowest open cell, raise each unvisited neighbour to at least its level),
 * written here plainly with a sorted array as the queue: on random rough terrains with nodata,
 * plateaus and pits, the filled elevations must agree cell for cell, and the cells marked as
 * filled must be exactly those raised.
 */
import { describe, expect, it } from "vitest";
import { D_COL, D_ROW } from "./d8";
import { fillDepressions } from "./flood";
import { conditionAndRoute } from "./route";
import { makeGrid, UTM } from "./test-grids";
import { COND_FILLED } from "./types";

function random(seed: number) {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Algorithm 1 of the paper, nodata's neighbours seeded like the edge. */
function textbookFill(z0: Float32Array, w: number, h: number): Float32Array {
  const z = z0.slice();
  const seen = new Uint8Array(w * h);
  const open: number[] = [];
  const inside = (c: number, r: number) => c >= 0 && r >= 0 && c < w && r < h;
  const seed = (k: number) => {
    if (seen[k] || Number.isNaN(z[k]!)) return;
    seen[k] = 1;
    open.push(k);
  };
  for (let k = 0; k < w * h; k += 1) {
    const [c, r] = [k % w, Math.floor(k / w)];
    if (c === 0 || r === 0 || c === w - 1 || r === h - 1) seed(k);
    for (let d = 1; d <= 8; d += 1) {
      const [q, s] = [c + D_COL[d]!, r + D_ROW[d]!];
      if (inside(q, s) && Number.isNaN(z[s * w + q]!)) seed(k);
    }
  }
  while (open.length > 0) {
    open.sort((a, b) => z[b]! - z[a]!); // lowest last
    const k = open.pop()!;
    const [c, r] = [k % w, Math.floor(k / w)];
    for (let d = 1; d <= 8; d += 1) {
      const [q, s] = [c + D_COL[d]!, r + D_ROW[d]!];
      const n = s * w + q;
      if (!inside(q, s) || seen[n] || Number.isNaN(z[n]!)) continue;
      seen[n] = 1;
      z[n] = Math.max(z[n]!, z[k]!);
      open.push(n);
    }
  }
  return z;
}

describe("depression filling against the textbook Priority-Flood", () => {
  it.each([1, 2, 3, 4, 5, 6])(
    "random terrain %i: the same filled surface, cell for cell",
    (seed) => {
      const next = random(seed);
      const [w, h] = [40, 30];
      const z = new Float32Array(w * h);
      for (let k = 0; k < w * h; k += 1) {
        const [c, r] = [k % w, Math.floor(k / w)];
        // Rough ground on a gentle bowl, whole-metre plateaus, and a few nodata cells.
        const ground = 0.01 * ((c - 20) ** 2 + (r - 15) ** 2) + 3 * next();
        z[k] = next() < 0.03 ? Number.NaN : next() < 0.2 ? Math.round(ground) : ground;
      }
      const expected = textbookFill(z, w, h);
      const mine = z.slice();
      const cond = new Uint8Array(w * h);
      fillDepressions(mine, w, h, new Uint8Array(w * h), cond);
      expect(mine).toEqual(expected);
      const raised = [...z.keys()].filter((k) => expected[k]! > z[k]!);
      const marked = [...z.keys()].filter((k) => (cond[k]! & COND_FILLED) !== 0);
      expect(marked).toEqual(raised);
      expect(raised.length).toBeGreaterThan(10);
    },
  );
});

describe("every cell drains", () => {
  it.each([7, 8, 9])("random terrain %i: the exits take every data cell's water", (seed) => {
    const next = random(seed);
    const [w, h] = [50, 40];
    const grid = makeGrid(UTM, w, h, (c, r) =>
      next() < 0.05
        ? Number.NaN
        : next() < 0.3
          ? 7
          : 0.05 * ((c - 25) ** 2 + (r - 20) ** 2) * next(),
    );
    const data = grid.z.filter((v) => !Number.isNaN(v)).length;
    const routed = conditionAndRoute(grid);
    let drained = 0;
    for (let k = 0; k < w * h; k += 1) {
      if (routed.dir[k] === 0) drained += routed.acc[k]!;
    }
    expect(drained).toBe(data);
  });
});
