/**
 * Elevations from a terrain GeoTIFF at WGS84 points, reading only the blocks (tiles, or
 * 256-row bands of a striped file) that the points fall in, with a small LRU of decoded blocks
 * so a path that walks along a tile reads it once. Each point: lon/lat → raster CRS (proj4) →
 * continuous sample coordinates (integers on cell centres) → bilinear between the four nearest
 * cell centres (shared/geo/bilinear). Half a cell beyond the outer centres the edge value is
 * held; further out, or next to a nodata cell, the answer is null ("no elevation").
 */
import { fromFile, type GeoTIFF, type GeoTIFFImage } from "geotiff";
import proj4 from "proj4";
import { bilinear } from "../../../shared/geo/bilinear";
import { M_PER_FT } from "../../../shared/hydrology/units";
import { knownCrs } from "./crs";
import type { TerrainInfo, TerrainSampler } from "./types";

const CACHE_BLOCKS = 64;

class BlockCache {
  private readonly blocks = new Map<number, Float64Array>();
  constructor(private readonly capacity: number) {}
  get(key: number): Float64Array | undefined {
    const block = this.blocks.get(key);
    if (block !== undefined) {
      this.blocks.delete(key); // re-insert: Map order is the recency order
      this.blocks.set(key, block);
    }
    return block;
  }
  set(key: number, block: Float64Array): void {
    this.blocks.set(key, block);
    if (this.blocks.size > this.capacity)
      this.blocks.delete(this.blocks.keys().next().value as number);
  }
}

export async function openTerrain(filePath: string, info: TerrainInfo): Promise<TerrainSampler> {
  const crs = knownCrs(info.epsg);
  if (crs === null) throw new Error(`terrain EPSG:${info.epsg} has no known definition`);
  const tiff: GeoTIFF = await fromFile(filePath);
  const image: GeoTIFFImage = await tiff.getImage();
  const convert = crs.geographic ? null : proj4("EPSG:4326", crs.proj4);
  const toMetres = info.verticalUnit === "ft" ? M_PER_FT : 1;
  const nodata = info.nodata;
  const nodata32 = nodata === null ? null : Math.fround(nodata);
  // Striped files may hold the whole raster in one strip; read them in 256-row bands instead.
  const bw = info.tiled ? info.blockWidth : Math.min(info.width, 256);
  const bh = info.tiled ? info.blockHeight : Math.min(info.height, 256);
  const across = Math.ceil(info.width / bw);
  const cache = new BlockCache(CACHE_BLOCKS);
  // Pixel-is-area: the tie point is the top-left cell's outer corner, its centre half a cell in.
  const shift = info.rasterType === "area" ? 0.5 : 0;

  async function load(bx: number, by: number): Promise<Float64Array> {
    const window = [
      bx * bw,
      by * bh,
      Math.min((bx + 1) * bw, info.width),
      Math.min((by + 1) * bh, info.height),
    ];
    const [band] = (await image.readRasters({
      window,
      samples: [0],
    })) as unknown as ArrayLike<number>[];
    const values = Float64Array.from(band ?? []);
    cache.set(by * across + bx, values);
    return values;
  }

  /** The cell's value from a block already in the cache (the caller loaded it). */
  function cell(col: number, row: number): number | null {
    const bx = Math.floor(col / bw);
    const by = Math.floor(row / bh);
    const values = cache.get(by * across + bx);
    const width = Math.min((bx + 1) * bw, info.width) - bx * bw;
    const v = values?.[(row - by * bh) * width + (col - bx * bw)];
    if (v === undefined || Number.isNaN(v) || v === nodata || v === nodata32) return null;
    return v;
  }

  async function at(lon: number, lat: number): Promise<number | null> {
    const [x = Number.NaN, y = Number.NaN] = convert ? convert.forward([lon, lat]) : [lon, lat];
    const col = (x - info.originX) / info.pixelSizeX - shift;
    const row = (info.originY - y) / info.pixelSizeY - shift;
    const { width, height } = info;
    if (!(col >= -0.5 && row >= -0.5 && col <= width - 0.5 && row <= height - 0.5)) return null;
    const c = Math.min(Math.max(col, 0), width - 1);
    const r = Math.min(Math.max(row, 0), height - 1);
    const c0 = Math.min(Math.floor(c), Math.max(width - 2, 0));
    const r0 = Math.min(Math.floor(r), Math.max(height - 2, 0));
    const c1 = Math.min(c0 + 1, width - 1);
    const r1 = Math.min(r0 + 1, height - 1);
    // The four cells span at most 2 × 2 blocks; read the ones not cached (awaits only on a miss).
    for (const by of new Set([Math.floor(r0 / bh), Math.floor(r1 / bh)])) {
      for (const bx of new Set([Math.floor(c0 / bw), Math.floor(c1 / bw)])) {
        if (cache.get(by * across + bx) === undefined) await load(bx, by);
      }
    }
    const z = bilinear(cell(c0, r0), cell(c1, r0), cell(c0, r1), cell(c1, r1), c - c0, r - r0);
    return z === null ? null : z * toMetres;
  }

  return {
    async elevationsM(points) {
      const out: (number | null)[] = [];
      for (const [lon, lat] of points) out.push(await at(lon, lat));
      return out;
    },
    async close() {
      await tiff.close();
    },
  };
}
