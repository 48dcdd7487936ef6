/**
 * Terrain: header inspection and bilinear sampling on the analytic plane DEM of the fixture
 * script. Bilinear interpolation reproduces a plane exactly, and the plane's values are exact
 * in float32, so samples must match the plane to 1e-6 m (the acceptance check).
 */
import { describe, expect, it } from "vitest";
import proj4 from "proj4";
import { PLANE, UTM10_NAD83 } from "../../../tests/fixtures/geo/scenario";
import { M_PER_FT } from "../../../shared/hydrology/units";
import { fixture, readErrorOf } from "../readers/test-support";
import { inspectTerrain, openTerrain } from "./index";

/** The plane at map coordinates (x, y): cell centres sit half a cell in from the tie point. */
function planeAtXY(x: number, y: number): number {
  const col = (x - PLANE.originX) / PLANE.pixelSizeM - 0.5;
  const row = (PLANE.originY - y) / PLANE.pixelSizeM - 0.5;
  return PLANE.z0 + PLANE.dzDcol * col + PLANE.dzDrow * row;
}

/** Deterministic pseudo-random numbers (mulberry32), so a failure can be replayed. */
function random(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const toLonLat = (x: number, y: number) =>
  proj4(UTM10_NAD83, "EPSG:4326", [x, y]) as [number, number];

describe("inspectTerrain", () => {
  it("reads size, CRS, pixel size, nodata and tiling from the header", async () => {
    const info = await inspectTerrain(fixture("plane-utm10.tif"), "m");
    expect(info).toMatchObject({
      epsg: 26910,
      crsName: "NAD83 / UTM zone 10N",
      width: PLANE.width,
      height: PLANE.height,
      originX: PLANE.originX,
      originY: PLANE.originY,
      pixelSizeX: 4,
      pixelSizeY: 4,
      rasterType: "area",
      nodata: -9999,
      tiled: true,
      blockWidth: 32,
    });
  });

  it("gives a WGS84 extent that holds the raster's corners", async () => {
    const info = await inspectTerrain(fixture("plane-utm10.tif"), "m");
    const [w, s, e, n] = info.bbox4326;
    const east = PLANE.originX + PLANE.width * PLANE.pixelSizeM;
    const south = PLANE.originY - PLANE.height * PLANE.pixelSizeM;
    for (const [x, y] of [
      [PLANE.originX, PLANE.originY],
      [east, south],
      [PLANE.originX, south],
      [east, PLANE.originY],
    ]) {
      const [lon, lat] = toLonLat(x!, y!);
      expect(lon >= w - 1e-12 && lon <= e + 1e-12 && lat >= s - 1e-12 && lat <= n + 1e-12).toBe(
        true,
      );
    }
  });

  it("refuses a TIFF without georeferencing (422)", async () => {
    const error = await readErrorOf(() => inspectTerrain(fixture("no-georef.tif"), "m", "dem.tif"));
    expect([error.status, error.code]).toEqual([422, "terrain-not-georeferenced"]);
    expect(error.message).toContain("dem.tif: has no georeferencing (no GeoKeys / tie points)");
  });

  it("refuses a file that is not a TIFF", async () => {
    const error = await readErrorOf(() => inspectTerrain(fixture("rainfall.csv"), "m", "dem.tif"));
    expect(error.code).toBe("terrain-unreadable");
  });
});

describe("terrain sampler", () => {
  it("reproduces the plane to 1e-6 m at 500 random points", async () => {
    const info = await inspectTerrain(fixture("plane-utm10.tif"), "m");
    const sampler = await openTerrain(fixture("plane-utm10.tif"), info);
    const next = random(42);
    // Inside the outer cell centres and away from the nodata cell's neighbourhood.
    const xs = Array.from({ length: 500 }, () => [
      PLANE.originX + 2 + next() * (100 * PLANE.pixelSizeM),
      PLANE.originY - 2 - next() * (120 * PLANE.pixelSizeM),
    ]);
    const got = await sampler.elevationsM(xs.map(([x, y]) => toLonLat(x!, y!)));
    await sampler.close();
    xs.forEach(([x, y], k) => expect(Math.abs(got[k]! - planeAtXY(x!, y!))).toBeLessThan(1e-6));
  });

  it("answers null next to a nodata cell and outside the raster", async () => {
    const info = await inspectTerrain(fixture("plane-utm10.tif"), "m");
    const sampler = await openTerrain(fixture("plane-utm10.tif"), info);
    const [c, r] = PLANE.nodataCell;
    const nearNodata = toLonLat(PLANE.originX + (c + 0.8) * 4, PLANE.originY - (r + 0.8) * 4);
    const outside = toLonLat(PLANE.originX - 50, PLANE.originY + 50);
    expect(await sampler.elevationsM([nearNodata, outside])).toEqual([null, null]);
    await sampler.close();
  });

  it("converts a DEM in feet to metres with the international foot (0.3048 m)", async () => {
    const info = await inspectTerrain(fixture("plane-utm10-feet.tif"), "ft");
    const sampler = await openTerrain(fixture("plane-utm10-feet.tif"), info);
    const [x, y] = [PLANE.originX + 101, PLANE.originY - 203];
    const [z] = await sampler.elevationsM([toLonLat(x, y)]);
    await sampler.close();
    // Float32 stores the feet values to ~1e-5 ft: 1e-4 m is the honest tolerance here.
    expect(Math.abs(z! - planeAtXY(x, y))).toBeLessThan(1e-4);
    expect(M_PER_FT).toBe(0.3048);
  });
});
