/**
 * Elevations from a terrain GeoTIFF at WGS84 points, reading only the blocks (tiles, or
 * 256-row bands of a striped file) that the points fall in, with a small LRU of decoded blocks
 * so a path that walks along a tile reads it once. Each point: lon/lat → raster CRS (proj4) →
 * continuous sample coordinates (integers on cell centres) → bilinear between the four nearest
 * cell centres (shared/geo/bilinear). Half a cell beyond the outer centres the edge value is
 * held; further out, or next to a nodata cell, the answer is null ("no elevation").
 */
import { fromFile } from "geotiff";
import proj4 from "proj4";
import { bilinear } from "../../../shared/geo/bilinear";
import { M_PER_FT } from "../../../shared/hydrology/units";
import { knownCrs } from "./crs";
import type { TerrainInfo, TerrainSampler } from "./types";

const CACHE_BLOCKS = 64;

class BlockCache {
  private readonly blocks = new Map<number, ArrayLike<number>>();
  constructor(private readonly capacity: number) {}
  get(key: number): ArrayLike<number> | undefined {
    const block = this.blocks.get(key);
    if (block !== undefined) {
      this.blocks.delete(key); // re-insert: Map order is the recency order
      this.blocks.set(key, block);
    }
    return block;
  }
  set(key: number, block: ArrayLike<number>): void {
    this.blocks.set(key, block);
    if (this.blocks.size > this.capacity) this.blocks.delete(this.blocks.keys().next().value!);
  }
}

export async function openTerrain(filePath: string, info: TerrainInfo): Promise<TerrainSampler> {
  const crs = knownCrs(info.epsg);
  if (crs === null) throw new Error(`terrain EPSG:${info.epsg} has no known definition`);
  const tiff = await fromFile(filePath);
  const image = await tiff.getImage();
  const convert = crs.geographic ? null : proj4("EPSG:4326", crs.proj4);
  const toMetres = info.verticalUnit === "ft" ? M_PER_FT : 1;
  const { width, height, nodata } = info;
  const nodata32 = nodata === null ? null : Math.fround(nodata);
  // Striped files may hold the whole raster in one strip; read them in 256-row bands instead.
  const bw = info.tiled ? info.blockWidth : Math.min(width, 256);
  const bh = info.tiled ? info.blockHeight : Math.min(height, 256);
  const across = Math.ceil(width / bw);
  const cache = new BlockCache(CACHE_BLOCKS);
  // Pixel-is-area: the tie point is the top-left cell's outer corner, its centre half a cell in.
  const shift = info.rasterType === "area" ? 0.5 : 0;

  async function load(key: number): Promise<void> {
    const bx = key % across;
    const by = Math.floor(key / across);
    const window = [
      bx * bw,
      by * bh,
      Math.min((bx + 1) * bw, width),
      Math.min((by + 1) * bh, height),
    ];
    const [band] = (await image.readRasters({
      window,
      samples: [0],
    })) as unknown as ArrayLike<number>[];
    // Kept in the file's own sample type: no copy, no precision lost.
    cache.set(key, band ?? []);
  }

  const blockKey = (col: number, row: number) =>
    Math.floor(row / bh) * across + Math.floor(col / bw);

  /** A cell's value from a block the caller made sure is cached. */
  function cell(col: number, row: number): number | null {
    const bx = Math.floor(col / bw);
    const by = Math.floor(row / bh);
    const blockWidth = Math.min((bx + 1) * bw, width) - bx * bw;
    const v = cache.get(by * across + bx)?.[(row - by * bh) * blockWidth + (col - bx * bw)];
    if (v === undefined || Number.isNaN(v) || v === nodata || v === nodata32) return null;
    return v;
  }

  /** Sample coordinates of a point, or null outside the raster's half-cell margin. */
  function position(lon: number, lat: number): [number, number] | null {
    const [x = Number.NaN, y = Number.NaN] = convert ? convert.forward([lon, lat]) : [lon, lat];
    const col = (x - info.originX) / info.pixelSizeX - shift;
    const row = (info.originY - y) / info.pixelSizeY - shift;
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
            needed.add(blockKey(Math.min(c0 + dc, width - 1), Math.min(r0 + dr, height - 1)));
          }
        }
        for (const key of needed) if (cache.get(key) === undefined) await load(key);
        for (let k = start; k < end; k += 1) {
          const p = where[k];
          if (p) out[k] = interpolate(p[0], p[1]);
        }
        start = end;
      }
      return out;
    },
    async close() {
      await tiff.close();
    },
  };
}
