/**
 * The blocks (tiles, or 256-row bands of a striped file) of a terrain GeoTIFF's first band,
 * decoded on demand and kept in a small LRU so neighbouring reads (a path walking along a tile,
 * the next map tile) decode each block once. Values stay in the file's own sample type: no copy,
 * no precision lost.
 */
import type { GeoTIFFImage } from "geotiff";
import type { TerrainInfo } from "./types";

export const CACHE_BLOCKS = 64;

export class RasterBlocks {
  /** Block size in cells; the last column and row of blocks may be cut short by the raster. */
  readonly bw: number;
  readonly bh: number;
  /** Blocks across the raster. */
  readonly across: number;
  private readonly blocks = new Map<number, ArrayLike<number>>();

  constructor(
    private readonly image: GeoTIFFImage,
    private readonly info: TerrainInfo,
  ) {
    // Striped files may hold the whole raster in one strip; read them in 256-row bands instead.
    this.bw = info.tiled ? info.blockWidth : Math.min(info.width, 256);
    this.bh = info.tiled ? info.blockHeight : Math.min(info.height, 256);
    this.across = Math.ceil(info.width / this.bw);
  }

  key(col: number, row: number): number {
    return Math.floor(row / this.bh) * this.across + Math.floor(col / this.bw);
  }

  /** Cells across block `key` (short in the last column of blocks). */
  widthOf(key: number): number {
    const bx = key % this.across;
    return Math.min((bx + 1) * this.bw, this.info.width) - bx * this.bw;
  }

  /** A block already decoded, without touching its recency (for reads inside one request). */
  peek(key: number): ArrayLike<number> | undefined {
    return this.blocks.get(key);
  }

  /** The block, decoded now if it is not cached; marks it most recently used. */
  async get(key: number): Promise<ArrayLike<number>> {
    const hit = this.blocks.get(key);
    if (hit !== undefined) {
      this.blocks.delete(key); // re-insert: Map order is the recency order
      this.blocks.set(key, hit);
      return hit;
    }
    const bx = key % this.across;
    const by = Math.floor(key / this.across);
    const { width, height } = this.info;
    const window = [
      bx * this.bw,
      by * this.bh,
      Math.min((bx + 1) * this.bw, width),
      Math.min((by + 1) * this.bh, height),
    ];
    const [band] = (await this.image.readRasters({
      window,
      samples: [0],
    })) as unknown as ArrayLike<number>[];
    const block = band ?? [];
    this.blocks.set(key, block);
    if (this.blocks.size > CACHE_BLOCKS) this.blocks.delete(this.blocks.keys().next().value!);
    return block;
  }
}
