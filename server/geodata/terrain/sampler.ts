/**
 * Elevations from a terrain GeoTIFF at WGS84 points, reading only the blocks (tiles, or
 * 256-row bands of a striped file) that the points fall in, through a small LRU of decoded blocks
 * (blocks.ts) so a path that walks along a tile reads it once. Each point: lon/lat → raster CRS
 * (proj4) → continuous sample coordinates (integers on cell centres) → bilinear between the four
 * nearest cell centres (shared/geo/bilinear). Half a cell beyond the outer centres the edge value
 * is held; further out, or next to a nodata cell, the answer is null ("no elevation").
 * A regular grid of points (a map tile) goes faster through elevationsOnGridM: positions from a
 * projected lattice (lattice.ts, error bound there) and blocks fetched per band (grid.ts).
 */
import { fromFile } from "geotiff";
import proj4 from "proj4";
import { bilinear } from "../../../shared/geo/bilinear";
import { M_PER_FT } from "../../../shared/hydrology/units";
import { CACHE_BLOCKS, RasterBlocks } from "./blocks";
import { knownCrs } from "./crs";
import { elevationsAtCells } from "./grid";
import { gridPositions, type ToCell } from "./lattice";
import type { TerrainInfo, TerrainSampler } from "./types";

export async function openTerrain(filePath: string, info: TerrainInfo): Promise<TerrainSampler> {
  const crs = knownCrs(info.epsg);
  if (crs === null) throw new Error(`terrain EPSG:${info.epsg} has no known definition`);
  const tiff = await fromFile(filePath);
  const image = await tiff.getImage();
  const convert = crs.geographic ? null : proj4("EPSG:4326", crs.proj4);
  const toMetres = info.verticalUnit === "ft" ? M_PER_FT : 1;
  const { width, height, nodata } = info;
  const nodata32 = nodata === null ? null : Math.fround(nodata);
  const blocks = new RasterBlocks(image, info);
  // Pixel-is-area: the tie point is the top-left cell's outer corner, its centre half a cell in.
  const shift = info.rasterType === "area" ? 0.5 : 0;

  /** A cell's value from a block the caller made sure is cached. */
  function cell(col: number, row: number): number | null {
    const key = blocks.key(col, row);
    const bx = key % blocks.across;
    const by = Math.floor(key / blocks.across);
    const v =
      blocks.peek(key)?.[(row - by * blocks.bh) * blocks.widthOf(key) + (col - bx * blocks.bw)];
    if (v === undefined || Number.isNaN(v) || v === nodata || v === nodata32) return null;
    return v;
  }

  /** Continuous sample coordinates of a point (NaN where proj4 gives none). */
  const toCell: ToCell = (lon, lat) => {
    const [x = Number.NaN, y = Number.NaN] = convert ? convert.forward([lon, lat]) : [lon, lat];
    return [
      (x - info.originX) / info.pixelSizeX - shift,
      (info.originY - y) / info.pixelSizeY - shift,
    ];
  };

  /** Sample coordinates of a point, or null outside the raster's half-cell margin. */
  function position(lon: number, lat: number): [number, number] | null {
    const [col, row] = toCell(lon, lat);
    if (!(col >= -0.5 && row >= -0.5 && col <= width - 0.5 && row <= height - 0.5)) return null;
    return [Math.min(Math.max(col, 0), width - 1), Math.min(Math.max(row, 0), height - 1)];
  }

  /** The top-left cell of the 2 × 2 used for (c, r); edges reuse the last full pair. */
  const corner = (c: number, r: number) => [
    Math.min(Math.floor(c), Math.max(width - 2, 0)),
    Math.min(Math.floor(r), Math.max(height - 2, 0)),
  ];

  function interpolate(c: number, r: number): number | null {
    const [c0 = 0, r0 = 0] = corner(c, r);
    const c1 = Math.min(c0 + 1, width - 1);
    const r1 = Math.min(r0 + 1, height - 1);
    const z = bilinear(cell(c0, r0), cell(c1, r0), cell(c0, r1), cell(c1, r1), c - c0, r - r0);
    return z === null ? null : z * toMetres;
  }

  return {
    async elevationsM(points) {
      const where = points.map(([lon, lat]) => position(lon, lat));
      const out: (number | null)[] = new Array<number | null>(points.length).fill(null);
      // Runs of points whose blocks fit in the cache together: read those blocks, then
      // interpolate the run without awaiting.
      for (let start = 0; start < points.length;) {
        const needed = new Set<number>();
        let end = start;
        for (; end < points.length && needed.size <= CACHE_BLOCKS - 4; end += 1) {
          const p = where[end];
          if (!p) continue;
          const [c0 = 0, r0 = 0] = corner(p[0], p[1]);
          for (const [dc, dr] of [
            [0, 0],
            [1, 0],
            [0, 1],
            [1, 1],
          ] as const) {
            needed.add(blocks.key(Math.min(c0 + dc, width - 1), Math.min(r0 + dr, height - 1)));
          }
        }
        for (const key of needed) await blocks.get(key);
        for (let k = start; k < end; k += 1) {
          const p = where[k];
          if (p) out[k] = interpolate(p[0], p[1]);
        }
        start = end;
      }
      return out;
    },
    async elevationsOnGridM(grid) {
      const { cols, rows } = gridPositions(grid, toCell);
      return elevationsAtCells(info, blocks, cols, rows, grid.width, toMetres);
    },
    async close() {
      await tiff.close();
    },
  };
}
