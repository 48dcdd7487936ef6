/**
 * Terrain files of other kinds than the fixture's tiled UTM plane: single-strip files written
 * by geotiff.js (an independent writer), geographic coordinates, a ModelTransformation,
 * pixel-is-point, and the refusals (rotation, an EPSG code Rillmark has no definition for).
 * Each file holds a plane in cell indices, so bilinear samples are exact (1e-6 m, float32-exact
 * coefficients).
 */
import { describe, expect, it } from "vitest";
import { writeArrayBuffer } from "geotiff";
import { geoTiffBytes } from "../writers";
import { readErrorOf, tempDir, writeTemp } from "../readers/test-support";
import { inspectTerrain, openTerrain } from "./index";

const [W, H] = [40, 30];
const plane = (col: number, row: number) => 50 + 0.5 * col - 0.25 * row;
const cells = () => Float32Array.from({ length: W * H }, (_, k) => plane(k % W, Math.floor(k / W)));
// A geographic grid near the invented fixture area: 1e-4° cells.
const [LON0, LAT0, D] = [-122.2, 38.41, 1e-4];

function stripFile(extra: Record<string, unknown>): string {
  const bytes = writeArrayBuffer(cells(), {
    width: W,
    height: H,
    GeographicTypeGeoKey: 4326,
    GTModelTypeGeoKey: 2,
    ...extra,
  });
  return writeTemp(tempDir(), "dem.tif", new Uint8Array(bytes));
}

async function sample(path: string, points: [number, number][]) {
  const info = await inspectTerrain(path, "m");
  const sampler = await openTerrain(path, info);
  try {
    return { info, z: await sampler.elevationsM(points) };
  } finally {
    await sampler.close();
  }
}

describe("terrain files of other kinds", () => {
  it("samples a single-strip geographic file tied at the corner (pixel-is-area)", async () => {
    const path = stripFile({ ModelPixelScale: [D, D, 0], ModelTiepoint: [0, 0, 0, LON0, LAT0, 0] });
    // Cell (10.25, 7.5) in centre coordinates is at corner offset (10.75, 8.0) cells.
    const { info, z } = await sample(path, [[LON0 + 10.75 * D, LAT0 - 8 * D]]);
    expect([info.tiled, info.epsg]).toEqual([false, 4326]);
    expect(Math.abs(z[0]! - plane(10.25, 7.5))).toBeLessThan(1e-6);
  });

  it("samples a file georeferenced by a ModelTransformation", async () => {
    const matrix = [D, 0, 0, LON0, 0, -D, 0, LAT0, 0, 0, 0, 0, 0, 0, 0, 1];
    const { z } = await sample(stripFile({ ModelTransformation: matrix }), [
      [LON0 + 3.5 * D, LAT0 - 2.5 * D],
    ]);
    expect(Math.abs(z[0]! - plane(3, 2))).toBeLessThan(1e-6);
  });

  it("puts the tie point on the cell centre for pixel-is-point", async () => {
    const path = stripFile({
      ModelPixelScale: [D, D, 0],
      ModelTiepoint: [0, 0, 0, LON0, LAT0, 0],
      GTRasterTypeGeoKey: 2,
    });
    const { info, z } = await sample(path, [[LON0 + 4 * D, LAT0 - 6 * D]]);
    expect(info.rasterType).toBe("point");
    expect(Math.abs(z[0]! - plane(4, 6))).toBeLessThan(1e-6);
  });

  it("refuses a rotated raster", async () => {
    const matrix = [D, D / 10, 0, LON0, 0, -D, 0, LAT0, 0, 0, 0, 0, 0, 0, 0, 1];
    const error = await readErrorOf(() =>
      inspectTerrain(stripFile({ ModelTransformation: matrix }), "m", "dem.tif"),
    );
    expect(error.code).toBe("terrain-rotated");
  });

  it("refuses an EPSG code it has no definition for, naming the code", async () => {
    // EPSG:2227, NAD83 / California zone 3 (US survey feet): not among the codes read today.
    const bytes = geoTiffBytes({
      width: 16,
      height: 16,
      tileSize: 16,
      georeference: { epsg: 2227, originX: 6e6, originY: 2e6, pixelSizeX: 3, pixelSizeY: 3 },
      values: () => 1,
    });
    const error = await readErrorOf(() =>
      inspectTerrain(writeTemp(tempDir(), "sp.tif", bytes), "ft", "sp.tif"),
    );
    expect([error.status, error.code]).toEqual([422, "terrain-unknown-crs"]);
    expect(error.message).toContain("EPSG:2227");
  });

  it("stays exact when the points need more blocks than the cache holds", async () => {
    // 320 × 320 cells in 16-cell tiles: 400 blocks, points scattered over all of them.
    const bytes = geoTiffBytes({
      width: 320,
      height: 320,
      tileSize: 16,
      georeference: { epsg: 4326, originX: LON0, originY: LAT0, pixelSizeX: D, pixelSizeY: D },
      values: plane,
    });
    const path = writeTemp(tempDir(), "many.tif", bytes);
    const cellsAt = Array.from({ length: 2000 }, (_, k) => [
      ((k * 7919) % 3180) / 10,
      ((k * 104729) % 3180) / 10,
    ]);
    const points = cellsAt.map(
      ([c, r]) => [LON0 + (c! + 0.5) * D, LAT0 - (r! + 0.5) * D] as [number, number],
    );
    const { z } = await sample(path, points);
    cellsAt.forEach(([c, r], k) => expect(Math.abs(z[k]! - plane(c!, r!))).toBeLessThan(1e-6));
  });
});
