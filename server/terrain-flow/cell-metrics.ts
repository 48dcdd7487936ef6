/**
 * True cell sizes, per row, on the WGS84 ellipsoid: the distance from a cell's centre to its
 * east, north and north-east neighbours' centres (GeographicLib's inverse geodesic, Karney 2013)
 * and the cell's ground area (GeographicLib's PolygonArea of its four corners).
 *
 * One rule for every CRS: the centres are taken at the grid's middle column and converted to
 * longitude/latitude, so a geographic grid gets its per-row sizes (a degree of longitude shrinks
 * with cos φ), Web Mercator its 1/cos φ scale, and UTM its point scale (0.9996 on the central
 * meridian), never degrees or projected units taken as metres. Along a row a UTM scale changes
 * by about x·w/R² (x the distance from the central meridian, w the grid's half-width): under
 * 1e-4 for a 20 km grid 300 km off the meridian, well inside any DEM's accuracy.
 */
import geodesic from "geographiclib-geodesic";
import { gridProjection } from "./georef";
import type { CellMetrics, GridGeoref } from "./types";

const WGS84 = geodesic.Geodesic.WGS84;
const DISTANCE = geodesic.Geodesic.DISTANCE;

function distanceM(a: readonly [number, number], b: readonly [number, number]): number {
  return WGS84.Inverse(a[1], a[0], b[1], b[0], DISTANCE).s12 ?? Number.NaN;
}

function quadAreaM2(corners: readonly (readonly [number, number])[]): number {
  const polygon = WGS84.Polygon(false);
  for (const [lon, lat] of corners) polygon.AddPoint(lat, lon);
  return Math.abs(polygon.Compute(false, true).area ?? Number.NaN);
}

export function cellMetrics(georef: GridGeoref, width: number, height: number): CellMetrics {
  const projection = gridProjection(georef);
  const u = Math.floor(width / 2) + 0.5;
  const eastM = new Float64Array(height);
  const northM = new Float64Array(height + 1);
  const diagNorthM = new Float64Array(height + 1);
  const areaM2 = new Float64Array(height);
  // Rows −1 … height: the neighbours of the outer rows are measured too (never used as steps,
  // but they keep every table full of real numbers).
  const centre = (du: number, row: number) => projection.lonLatAt(u + du, row + 0.5);
  for (let row = 0; row <= height; row += 1) {
    const here = centre(0, row);
    northM[row] = distanceM(here, centre(0, row - 1));
    diagNorthM[row] = distanceM(here, centre(1, row - 1));
    if (row === height) break;
    eastM[row] = distanceM(here, centre(1, row));
    const corner = (du: number, dv: number) => projection.lonLatAt(u - 0.5 + du, row + dv);
    areaM2[row] = quadAreaM2([corner(0, 0), corner(0, 1), corner(1, 1), corner(1, 0)]);
  }
  for (const table of [eastM, northM, diagNorthM, areaM2]) {
    if (!table.every((v) => Number.isFinite(v) && v > 0)) {
      throw new Error("the grid's cell sizes could not be measured (is its CRS right?)");
    }
  }
  return { eastM, northM, diagNorthM, areaM2 };
}
