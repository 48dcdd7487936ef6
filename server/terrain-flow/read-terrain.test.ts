/**
 * Reading a whole terrain GeoTIFF for routing: values and georeferencing as the terrain reader
 * and geotiff.js see them, nodata as NaN, pixel-is-point moved to the outer corner, feet noted,
 * and a file whose header claims more cells than the engine computes refused before a cell is
 * read (the regression for a terrain upload that would take the server's memory).
 */
import { fromFile } from "geotiff";
import { describe, expect, it } from "vitest";
import { geoTiffBytes } from "../geodata/writers";
import { tempDir, writeTemp } from "../geodata/readers/test-support";
import { inspectTerrain } from "../geodata/terrain";
import { MAX_CELLS, TerrainFlowError } from "./errors";
import { readElevationGrid } from "./read-terrain";
import { oversizedTiff } from "./test-grids";

const DEMO = new URL("../../demo-geo/out/terrain.tif", import.meta.url).pathname;
const georeference = {
  epsg: 32614,
  originX: 500_000,
  originY: 4_200_000,
  pixelSizeX: 5,
  pixelSizeY: 5,
};

describe("reading a terrain grid whole", () => {
  it("reads the demo terrain cell for cell as geotiff.js does, nodata as NaN, with its georeferencing", async () => {
    const grid = await readElevationGrid(DEMO, "m");
    const info = await inspectTerrain(DEMO, "m");
    expect([grid.width, grid.height]).toEqual([info.width, info.height]);
    expect(grid.georef).toMatchObject({
      epsg: info.epsg,
      originX: info.originX,
      originY: info.originY,
    });
    const tiff = await fromFile(DEMO);
    const [values] = (await (await tiff.getImage()).readRasters()) as unknown as Float32Array[];
    tiff.close();
    // The demo's nodata (-9999) comes out as NaN; every other cell as stored.
    expect(grid.z).toEqual(values!.map((v) => (v === -9999 ? Number.NaN : v)));
    expect(grid.z.some(Number.isNaN)).toBe(true);
    expect(grid.verticalToM).toBe(1);
  });

  it("turns nodata into NaN and notes feet", async () => {
    const bytes = geoTiffBytes({
      width: 20,
      height: 10,
      georeference,
      nodata: -9999,
      tileSize: 16,
      values: (c, r) => (c === 3 && r === 4 ? -9999 : 100 + c),
    });
    const path = writeTemp(tempDir(), "ft.tif", bytes);
    const grid = await readElevationGrid(path, "ft");
    expect(Number.isNaN(grid.z[4 * 20 + 3]!)).toBe(true);
    expect(grid.z[4 * 20 + 4]).toBe(104);
    expect(grid.z.filter(Number.isNaN)).toHaveLength(1);
    expect(grid.verticalToM).toBe(0.3048);
  });

  it("moves a pixel-is-point tie point to the outer corner", async () => {
    const bytes = geoTiffBytes({
      width: 4,
      height: 4,
      georeference: { ...georeference, rasterType: "point" },
      values: () => 1,
    });
    const grid = await readElevationGrid(writeTemp(tempDir(), "point.tif", bytes), "m");
    expect([grid.georef.originX, grid.georef.originY]).toEqual([499_997.5, 4_200_002.5]);
  });

  it("refuses a header of 20,000 × 10,000 cells before reading any", async () => {
    const bytes = oversizedTiff(20_000, 10_000);
    const path = writeTemp(tempDir(), "huge.tif", bytes);
    const before = process.memoryUsage().arrayBuffers;
    const error = await readElevationGrid(path, "m", "huge.tif").catch((e: unknown) => e);
    expect(error).toBeInstanceOf(TerrainFlowError);
    expect(error).toMatchObject({ status: 413, code: "terrain-too-large" });
    expect((error as Error).message).toContain("huge.tif has 20,000 × 10,000 = 200,000,000 cells");
    expect((error as Error).message).toContain(MAX_CELLS.toLocaleString("en-US"));
    // Nothing near the grid's 800 MB was allocated on the way.
    expect(process.memoryUsage().arrayBuffers - before).toBeLessThan(50e6);
  });
});
