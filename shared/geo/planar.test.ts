/** Planar predicates in lon/lat against hand-worked cases (exact in binary fractions). */
import { describe, expect, it } from "vitest";
import { edgeSegmentParams, pointInRings } from "./planar";

const params = (seg: [number, number, number, number], closed = false) => {
  const out: number[] = [];
  edgeSegmentParams(0, 0, 4, 0, ...seg, out, closed);
  return out;
};

describe("edgeSegmentParams (edge (0,0) → (4,0))", () => {
  it("finds a crossing at its parameter along the edge", () => {
    expect(params([1, -1, 1, 1])).toEqual([0.25]);
  });
  it("finds a segment that ends on the edge (a touch)", () => {
    expect(params([3, 0, 3, 2])).toEqual([0.75]);
  });
  it("gives both ends of a collinear overlap inside the edge", () => {
    expect(params([1, 0, 2, 0]).sort()).toEqual([0.25, 0.5]);
  });
  it("ignores a parallel segment off the line and a crossing beyond the edge", () => {
    expect(params([0, 1, 4, 1])).toEqual([]);
    expect(params([5, -1, 5, 1])).toEqual([]);
  });
  it("counts the edge's own ends only when closed", () => {
    expect(params([0, -1, 0, 1])).toEqual([]);
    expect(new Set(params([0, -1, 0, 1], true))).toEqual(new Set([0]));
    expect(params([-1, 0, 9, 0], true)).toContain(0);
  });
  it("counts, when closed, a segment within the on-line tolerance of the edge's start", () => {
    expect(params([-1, 5e-13, 1, 5e-13], true)).toContain(0);
    expect(params([-1, 1e-9, 1, 1e-9], true)).not.toContain(0);
  });
});

describe("pointInRings", () => {
  const outer = Float64Array.from([0, 0, 4, 0, 4, 4, 0, 4, 0, 0]);
  const hole = Float64Array.from([1, 1, 3, 1, 3, 3, 1, 3, 1, 1]);
  it("is true inside, false outside and inside a hole", () => {
    expect(pointInRings(0.5, 0.5, [outer, hole])).toBe(true);
    expect(pointInRings(2, 2, [outer, hole])).toBe(false);
    expect(pointInRings(5, 2, [outer, hole])).toBe(false);
  });
  it("counts the boundary as inside, the hole's boundary too (closed sets)", () => {
    expect(pointInRings(4, 2, [outer])).toBe(true);
    expect(pointInRings(1, 2, [outer, hole])).toBe(true);
  });
});
