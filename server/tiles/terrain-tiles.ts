/**
 * Raster-dem tiles of a project's terrain layer: 256 × 256 px in the terrarium encoding, each
 * pixel the bilinear elevation (the terrain sampler's grid path) at the pixel's centre. Samplers stay open
 * in a small LRU keyed by layer and object, so a map's burst of tiles reads the file's header
 * once; calls on one sampler run one at a time (its block cache is shared between them).
 */
import type { LonLatGrid, TerrainInfo, TerrainSampler } from "../geodata/terrain";
import { openTerrain } from "../geodata/terrain";
import type { ObjectStore } from "../storage";
import { tileBounds4326, type TileCoords } from "./coords";
import { terrariumPng } from "./terrarium";

export const TERRAIN_TILE_PX = 256;
/**
 * Coarsest tile pixel, in DEM cells, a tile is made for: coarser tiles would read the whole file
 * (GeoTIFFs here carry no overviews) for a hillshade too small to see; they answer 204.
 */
export const MAX_CELLS_PER_PIXEL = 16;
const OPEN_SAMPLERS = 8;

interface OpenSampler {
  sampler: Promise<TerrainSampler>;
  /** The tail of the queue of calls on this sampler. */
  queue: Promise<unknown>;
}

export interface TerrainLayerRef {
  id: string;
  objectKey: string;
  info: TerrainInfo;
}

export class TerrainTiles {
  private readonly open = new Map<string, OpenSampler>();

  constructor(private readonly store: ObjectStore) {}

  private entry(layer: TerrainLayerRef): OpenSampler {
    const key = `${layer.id}|${layer.objectKey}`;
    let hit = this.open.get(key);
    if (hit) {
      this.open.delete(key); // re-insert: Map order is the recency order
    } else {
      const sampler = this.store
        .localCopy(layer.objectKey)
        .then((file) => openTerrain(file, layer.info));
      hit = { sampler, queue: Promise.resolve() };
      // A file that fails to open is not kept: the next tile tries again.
      sampler.catch(() => this.open.delete(key));
    }
    this.open.set(key, hit);
    while (this.open.size > OPEN_SAMPLERS) {
      const [oldKey, old] = this.open.entries().next().value as [string, OpenSampler];
      this.open.delete(oldKey);
      void old.queue
        .then(() => old.sampler)
        .then(
          (s) => s.close(),
          () => undefined,
        );
    }
    return hit;
  }

  /** The tile's PNG, or null when it lies off the terrain or is too coarse for it. */
  async tile(layer: TerrainLayerRef, t: TileCoords): Promise<Buffer | null> {
    const [west, south, east, north] = tileBounds4326(t);
    const [bw, bs, be, bn] = layer.info.bbox4326;
    if (west >= be || east <= bw || south >= bn || north <= bs) return null;
    const cellDeg = (be - bw) / layer.info.width;
    const pixelDeg = (east - west) / TERRAIN_TILE_PX;
    if (pixelDeg > MAX_CELLS_PER_PIXEL * cellDeg) return null;

    const grid = tileGrid(t);
    const entry = this.entry(layer);
    const run = entry.queue.then(async () => (await entry.sampler).elevationsOnGridM(grid));
    entry.queue = run.catch(() => undefined);
    const elevations = await run;
    if (elevations.every((e) => Number.isNaN(e))) return null;
    return terrariumPng(elevations, TERRAIN_TILE_PX);
  }

  async close(): Promise<void> {
    const all = [...this.open.values()];
    this.open.clear();
    for (const e of all) {
      await e.queue;
      await e.sampler.then(
        (s) => s.close(),
        () => undefined,
      );
    }
  }
}

/**
 * The tile's pixels as a grid for the sampler: (u, v) in pixels from the tile's north-west
 * corner to WGS84 (inverse Web Mercator), so pixel (i, j)'s centre is at (i + 0.5, j + 0.5).
 */
export function tileGrid({ z, x, y }: TileCoords): LonLatGrid {
  const n = 2 ** z * TERRAIN_TILE_PX;
  return {
    width: TERRAIN_TILE_PX,
    height: TERRAIN_TILE_PX,
    lonLatAt: (u, v) => [
      ((x * TERRAIN_TILE_PX + u) / n) * 360 - 180,
      (Math.atan(Math.sinh(Math.PI * (1 - (2 * (y * TERRAIN_TILE_PX + v)) / n))) * 180) / Math.PI,
    ],
  };
}
