/**
 * How the map asks for a terrain layer's tiles: only inside the file's extent (the server has
 * nothing to send beyond it), and no deeper than the zoom whose pixels are as fine as the
 * file's cells. Deeper tiles carry no more detail, and each costs the server a resample and the
 * browser a DEM decode: maplibre draws the last zoom's tiles larger instead.
 */
import type { Layer } from "../../../../shared/schemas/layers";

/** Web Mercator: metres per pixel of a 256-pixel tile at zoom 0 on the equator (2π · 6378137 / 256). */
export const EQUATOR_M_PER_PX_Z0 = (2 * Math.PI * 6_378_137) / 256;
/** Mean metres per degree of latitude, for the extent's size (a cell size needs no better). */
const M_PER_DEGREE = 111_320;
const DEFAULT_MAXZOOM = 17;

export interface TerrainTiling {
  bounds: [number, number, number, number] | undefined;
  maxzoom: number;
}

/** Ground size of a pixel (m) at a zoom and latitude on a 256-pixel Web Mercator tile. */
export function metresPerPixel(zoom: number, latDeg: number): number {
  return (EQUATOR_M_PER_PX_Z0 * Math.cos((latDeg * Math.PI) / 180)) / 2 ** zoom;
}

/** The first zoom whose pixels are no larger than the cell (m), kept within 10..22. */
export function zoomForCell(cellM: number, latDeg: number): number {
  const z = Math.ceil(
    Math.log2((EQUATOR_M_PER_PX_Z0 * Math.cos((latDeg * Math.PI) / 180)) / cellM),
  );
  return Math.min(22, Math.max(10, z));
}

export function terrainTiling(layer: Pick<Layer, "bbox4326" | "terrain">): TerrainTiling {
  const bbox = layer.bbox4326 ?? undefined;
  const width = Number(layer.terrain?.width);
  const height = Number(layer.terrain?.height);
  if (!bbox || !(width > 0) || !(height > 0)) return { bounds: bbox, maxzoom: DEFAULT_MAXZOOM };
  const [west, south, east, north] = bbox;
  const lat = (south + north) / 2;
  // The finer of the two directions, measured on the ground whatever the file's CRS.
  const cellX = ((east - west) * M_PER_DEGREE * Math.cos((lat * Math.PI) / 180)) / width;
  const cellY = ((north - south) * M_PER_DEGREE) / height;
  const cellM = Math.min(cellX, cellY);
  if (!(cellM > 0)) return { bounds: bbox, maxzoom: DEFAULT_MAXZOOM };
  return { bounds: bbox, maxzoom: zoomForCell(cellM, lat) };
}
