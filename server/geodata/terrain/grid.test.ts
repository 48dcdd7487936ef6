/**
 * The grid path (elevationsOnGridM, used for map tiles) against the per-point path (elevationsM,
 * proj4 at every point) on whole 256-px tiles over the DEM, its edges and its nodata cell: the
 * same points have an elevation, and the values agree to the bound the lattice promises: a
 * position off by at most LATTICE_TOLERANCE_CELLS moves a bilinear value by at most that times
 * the largest rise between neighbouring cells along each axis. At street zooms the lattice is
 * so close that the plane DEM fixture agrees to 1e-6 m, as the per-point path does with the
 * plane itself (terrain.test.ts).
 */
import { describe, expect, it } from "vitest";
import { PLANE } from "../../../tests/fixtures/geo/scenario";
import { tileGrid } from "../../tiles/terrain-tiles";
import { fixture, tempDir, writeTemp } from "../readers/test-support";
import { geoTiffBytes } from "../writers";
import { inspectTerrain, openTerrain } from "./index";
import { LATTICE_TOLERANCE_CELLS } from "./lattice";
import type { TerrainSampler } from "./types";

/** Every tile at zoom z over a WGS84 box. */
function tilesOver([w, s, e, n]: readonly number[], z: number) {
  const count = 2 ** z;
  const tx = (lon: number) => Math.floor(((lon + 180) / 360) * count);
  const ty = (lat: number) => {
    const r = (lat * Math.PI) / 180;
    return Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * count);
  };
  const out: { z: number; x: number; y: number }[] = [];
  for (let x = tx(w!); x <= tx(e!); x += 1)
    for (let y = ty(n!); y <= ty(s!); y += 1) out.push({ z, x, y });
  return out;
}

/** Largest |grid − per-point| over the tiles; fails on a point with an elevation in one only. */
async function largestDifference(sampler: TerrainSampler, box: readonly number[], zooms: number[]) {
  let worst = 0;
  let compared = 0;
  let missing = 0;
  const onlyOne: string[] = [];
  for (const z of zooms) {
    for (const t of tilesOver(box, z)) {
      const grid = tileGrid(t);
      const points: [number, number][] = [];
      for (let j = 0; j < grid.height; j += 1) {
        for (let i = 0; i < grid.width; i += 1) {
          points.push(grid.lonLatAt(i + 0.5, j + 0.5) as [number, number]);
        }
      }
      const exact = await sampler.elevationsM(points);
      const fast = await sampler.elevationsOnGridM(grid);
      exact.forEach((e, k) => {
        const f = fast[k]!;
        if (e === null) {
          missing += 1;
          if (!Number.isNaN(f)) onlyOne.push(`${z}/${t.x}/${t.y} pixel ${k}: ${f} vs none`);
        } else if (Number.isNaN(f)) {
          onlyOne.push(`${z}/${t.x}/${t.y} pixel ${k}: none vs ${e}`);
        } else {
          worst = Math.max(worst, Math.abs(f - e));
          compared += 1;
        }
      });
    }
  }
  expect(onlyOne.slice(0, 5)).toEqual([]);
  return { worst, compared, missing };
}

async function onPlane(zooms: number[]) {
  const info = await inspectTerrain(fixture("plane-utm10.tif"), "m");
  const sampler = await openTerrain(fixture("plane-utm10.tif"), info);
  try {
    return await largestDifference(sampler, info.bbox4326, zooms);
  } finally {
    await sampler.close();
  }
}

describe("terrain sampler on a grid", { timeout: 30_000 }, () => {
  it("matches the per-point path to 1e-6 m on the plane DEM fixture at zooms 17 and 18", async () => {
    const { worst, compared, missing } = await onPlane([17, 18]);
    expect(compared).toBeGreaterThan(100_000);
    expect(missing).toBeGreaterThan(100_000); // the land around the DEM and the nodata cell
    expect(worst).toBeLessThan(1e-6);
  });

  it("stays within the lattice's bound on the plane at zooms 15 and 16", async () => {
    // Coarser tiles have larger lattice cells: measured about 3e-6 m off at zoom 15.
    const { worst, compared } = await onPlane([15, 16]);
    expect(compared).toBeGreaterThan(20_000);
    const bound = (Math.abs(PLANE.dzDcol) + Math.abs(PLANE.dzDrow)) * LATTICE_TOLERANCE_CELLS;
    expect(worst).toBeLessThanOrEqual(bound);
    expect(worst).toBeLessThan(1e-5);
  });

  it("matches it within the lattice's bound on a curved DEM with holes", async () => {
    // Invented ground: a ridge-and-swale pattern on a tilt, 2 m cells in WGS 84 / UTM 14N, tiled
    // by 32, nodata in a 3 × 3 patch and along a short row.
    const [W, H] = [220, 180];
    const z = (c: number, r: number) =>
      (c >= 100 && c < 103 && r >= 60 && r < 63) || (r === 150 && c > 20 && c < 60)
        ? -9999
        : 300 + 12 * Math.sin(c / 9) * Math.cos(r / 6) + 0.04 * c * r - 0.3 * r;
    const values = Float32Array.from({ length: W * H }, (_, k) => z(k % W, Math.floor(k / W)));
    let riseCol = 0;
    let riseRow = 0;
    for (let r = 0; r < H; r += 1) {
      for (let c = 0; c < W; c += 1) {
        const v = values[r * W + c]!;
        if (v === -9999) continue;
        const east = c + 1 < W ? values[r * W + c + 1]! : -9999;
        const south = r + 1 < H ? values[(r + 1) * W + c]! : -9999;
        if (east !== -9999) riseCol = Math.max(riseCol, Math.abs(east - v));
        if (south !== -9999) riseRow = Math.max(riseRow, Math.abs(south - v));
      }
    }
    const bytes = geoTiffBytes({
      width: W,
      height: H,
      tileSize: 32,
      nodata: -9999,
      georeference: {
        epsg: 32614,
        originX: 716400,
        originY: 4254512,
        pixelSizeX: 2,
        pixelSizeY: 2,
      },
      values,
    });
    const path = writeTemp(tempDir(), "curved.tif", bytes);
    const info = await inspectTerrain(path, "m");
    const sampler = await openTerrain(path, info);
    try {
      const { worst, compared, missing } = await largestDifference(
        sampler,
        info.bbox4326,
        [14, 15, 16, 17],
      );
      expect(compared).toBeGreaterThan(100_000);
      expect(missing).toBeGreaterThan(1_000);
      expect(worst).toBeLessThanOrEqual((riseCol + riseRow) * LATTICE_TOLERANCE_CELLS);
      // Measured far inside that bound (about 1e-4 cell off at zoom 14).
      expect(worst).toBeLessThan(0.002);
    } finally {
      await sampler.close();
    }
  });

  it("reads a tile needing more blocks than the cache holds band by band", async () => {
    // 320 × 320 cells of 1e-4° in 16-cell blocks (400 blocks): a zoom 14 tile spans about 14 × 18
    // of them, so its rows are read in several bands.
    const [lon0, lat0, d] = [-122.2, 38.41, 1e-4];
    const plane = (c: number, r: number) => 50 + 0.5 * c - 0.25 * r;
    const bytes = geoTiffBytes({
      width: 320,
      height: 320,
      tileSize: 16,
      georeference: { epsg: 4326, originX: lon0, originY: lat0, pixelSizeX: d, pixelSizeY: d },
      values: plane,
    });
    const path = writeTemp(tempDir(), "many.tif", bytes);
    const info = await inspectTerrain(path, "m");
    const sampler = await openTerrain(path, info);
    try {
      const { worst, compared } = await largestDifference(sampler, info.bbox4326, [14]);
      expect(compared).toBeGreaterThan(60_000);
      expect(worst).toBeLessThanOrEqual((0.5 + 0.25) * LATTICE_TOLERANCE_CELLS);
    } finally {
      await sampler.close();
    }
  });

  it("converts a DEM in feet to metres like the per-point path", async () => {
    const info = await inspectTerrain(fixture("plane-utm10-feet.tif"), "ft");
    const sampler = await openTerrain(fixture("plane-utm10-feet.tif"), info);
    try {
      const { worst, compared } = await largestDifference(sampler, info.bbox4326, [16]);
      expect(compared).toBeGreaterThan(10_000);
      expect(worst).toBeLessThan(1e-6);
    } finally {
      await sampler.close();
    }
  });
});
