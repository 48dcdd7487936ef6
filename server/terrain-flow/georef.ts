/**
 * Grid positions ↔ WGS84 longitude/latitude for a terrain grid: cell (col, row) has its centre
 * at (col + 0.5, row + 0.5) in grid units from the outer north-west corner; grid vertex (i, j)
 * is a cell corner. The raster CRS comes from the terrain reader's table of known EPSG codes.
 */
import proj4 from "proj4";
import { knownCrs } from "../geodata/terrain/crs";
import type { GridGeoref } from "./types";

export interface GridProjection {
  readonly geographic: boolean;
  /** Map coordinates of grid position (u, v) = (columns, rows) from the outer corner. */
  xyAt(u: number, v: number): [number, number];
  /** WGS84 [lon, lat] of grid position (u, v). */
  lonLatAt(u: number, v: number): [number, number];
  /** Grid position (u, v) of a WGS84 point; NaN where the CRS has none. */
  gridOf(lon: number, lat: number): [number, number];
}

export function gridProjection(georef: GridGeoref): GridProjection {
  const crs = knownCrs(georef.epsg);
  if (crs === null) throw new Error(`EPSG:${georef.epsg} has no known definition`);
  const convert = crs.geographic ? null : proj4(crs.proj4, "EPSG:4326");
  const { originX, originY, pixelSizeX: sx, pixelSizeY: sy } = georef;
  const xyAt = (u: number, v: number): [number, number] => [originX + u * sx, originY - v * sy];
  return {
    geographic: crs.geographic,
    xyAt,
    lonLatAt(u, v) {
      const xy = xyAt(u, v);
      if (!convert) return xy;
      const [lon = Number.NaN, lat = Number.NaN] = convert.forward(xy);
      return [lon, lat];
    },
    gridOf(lon, lat) {
      const [x = Number.NaN, y = Number.NaN] = convert ? convert.inverse([lon, lat]) : [lon, lat];
      return [(x - originX) / sx, (originY - y) / sy];
    },
  };
}
