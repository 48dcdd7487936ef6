import { describe, expect, it } from "vitest";
import type { LonLat } from "../../../../shared/geo";
import { placedVertices, sameVertices } from "./trace-vertices";

const A: LonLat = [-122.2, 38.4];
const B: LonLat = [-122.199, 38.402];
const C: LonLat = [-122.1975, 38.4005];
const POINTER: LonLat = [-122.1971, 38.4003];

describe("placedVertices", () => {
  it("drops the live end that follows the pointer while the line is drawn", () => {
    expect(placedVertices([A, B, POINTER], true)).toEqual([A, B]);
  });

  it("keeps every vertex of a finished line", () => {
    expect(placedVertices([A, B, C], false)).toEqual([A, B, C]);
  });

  it("counts a vertex clicked twice in a row once", () => {
    // terra-draw right after the second click: the live end sits on the vertex just placed.
    expect(placedVertices([A, B, B], true)).toEqual([A, B]);
    expect(placedVertices([A, A], true)).toEqual([A]);
  });
});

describe("sameVertices", () => {
  it("tells a moved pointer (same vertices) from a new click (one more)", () => {
    expect(
      sameVertices(placedVertices([A, B, C], true), placedVertices([A, B, POINTER], true)),
    ).toBe(true);
    expect(sameVertices([A, B], [A, B, C])).toBe(false);
    expect(sameVertices([A, B], [A, C])).toBe(false);
  });
});
