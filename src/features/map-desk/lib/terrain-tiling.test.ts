import { describe, expect, it } from "vitest";
import { metresPerPixel, terrainTiling, zoomForCell } from "./terrain-tiling";

describe("terrain tiling", () => {
  // Ground resolution on the equator by level, Microsoft "Bing Maps Tile System" (table of
  // levels of detail): level 1 78,271.5170 m/px, level 16 2.3887 m/px (from memory).
  it("gives Web Mercator pixel sizes as the published table of levels", () => {
    expect(metresPerPixel(1, 0)).toBeCloseTo(78_271.517, 2);
    expect(metresPerPixel(16, 0)).toBeCloseTo(2.3887, 4);
    // Same source: ground resolution = cos(latitude) · the equator's.
    expect(metresPerPixel(16, 60)).toBeCloseTo(2.3887 / 2, 4);
  });

  it("stops at the first zoom whose pixels are no larger than the cell", () => {
    // At 38.4° a zoom-16 pixel is 1.87 m and a zoom-15 pixel 3.74 m: a 2 m cell needs 16.
    expect(zoomForCell(2, 38.4)).toBe(16);
    expect(zoomForCell(1.87, 38.4)).toBe(17);
    expect(zoomForCell(30, 0)).toBe(13);
  });

  it("keeps the zoom within the tile route's useful range", () => {
    expect(zoomForCell(100_000, 0)).toBe(10);
    expect(zoomForCell(0.001, 0)).toBe(22);
  });

  it("bounds a layer to its extent and sizes its cells on the ground, whatever its CRS", () => {
    // A 512 m square of 256 × 256 cells (2 m) at 38.41° N, as the invented demo terrain.
    const lat = 38.41;
    const dLat = 512 / 111_320;
    const dLon = 512 / (111_320 * Math.cos((lat * Math.PI) / 180));
    const bbox: [number, number, number, number] = [
      -96.52,
      lat - dLat / 2,
      -96.52 + dLon,
      lat + dLat / 2,
    ];
    const tiling = terrainTiling({ bbox4326: bbox, terrain: { width: 256, height: 256 } });
    expect(tiling).toEqual({ bounds: bbox, maxzoom: 16 });
  });

  it("falls back to zoom 17 and no bounds when the layer does not say its extent", () => {
    expect(terrainTiling({ bbox4326: null, terrain: null })).toEqual({
      bounds: undefined,
      maxzoom: 17,
    });
  });
});
