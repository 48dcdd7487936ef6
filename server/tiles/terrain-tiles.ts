/**
 * Raster-dem tiles of a project's terrain layer: 256 × 256 px in the terrarium encoding, each
 * pixel the bilinear elevation (the terrain sampler) at the pixel's centre. Samplers stay open
 * in a small LRU keyed by layer and object, so a map's burst of tiles reads the file's header
 * once; calls on one sampler run one at a time (its block cache is shared between them).
 */
import type { TerrainInfo, TerrainSampler } from "../geodata/terrain";
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

    const points = pixelCentres(t);
    const entry = this.entry(layer);
    const run = entry.queue.then(async () => (await entry.sampler).elevationsM(points));
    entry.queue = run.catch(() => undefined);
    const elevations = await run;
    if (elevations.every((e) => e === null)) return null;
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

/** Longitude/latitude of each pixel centre, row by row from the north (Web Mercator rows). */
export function pixelCentres({ z, x, y }: TileCoords): [number, number][] {
  const n = 2 ** z * TERRAIN_TILE_PX;
  const out: [number, number][] = [];
  for (let row = 0; row < TERRAIN_TILE_PX; row += 1) {
    const py = y * TERRAIN_TILE_PX + row + 0.5;
    const lat = (Math.atan(Math.sinh(Math.PI * (1 - (2 * py) / n))) * 180) / Math.PI;
    for (let col = 0; col < TERRAIN_TILE_PX; col += 1) {
      const px = x * TERRAIN_TILE_PX + col + 0.5;
      out.push([(px / n) * 360 - 180, lat]);
    }
  }
  return out;
}
