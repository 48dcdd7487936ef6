/**
 * True cell sizes, per row, on the WGS84 ellipsoid: the distance from a cell's centre to its
 * east, north and north-east neighbours' centres, and the cell's ground area.
 *
 * One rule for every CRS: the centres are taken at the grid's middle column and converted to
 * longitude/latitude, so a geographic grid gets its per-row sizes (a degree of longitude shrinks
 * with cos φ), Web Mercator its 1/cos φ scale, and UTM its point scale (0.9996 on the central
 * meridian), never degrees or projected units taken as metres. Along a row a UTM scale changes
 * by about x·w/R² (x the distance from the central meridian, w the grid's half-width): under
 * 1e-4 for a 20 km grid 300 km off the meridian, well inside any DEM's accuracy.
 *
 * Distances are geodesics (shared/geo: the ellipsoid's radii of curvature below 0.001°, within
 * nanometres of GeographicLib, GeographicLib beyond). A cell's area is its east–west width at
 * its centre times its north–south height: both grids in use keep their axes square on the
 * ground (meridians cross parallels at right angles; UTM and Web Mercator are conformal), and
 * over a cell the width changes linearly to first order, so the product is exact to order
 * (cell ÷ earth radius)², a part in 10¹² for a 10 m cell.
 */
import { geodesicDistanceM } from "../../shared/geo/geodesic";
import { gridProjection } from "./georef";
import type { CellMetrics, GridGeoref } from "./types";

/** Rows measured exactly; the rows between are interpolated (see below). */
const SAMPLE_EVERY = 16;

/**
 * The tables filled at every 16th row and linearly between: cell sizes change with latitude as
 * smoothly as cos φ (or the projection's scale), so over 16 rows the interpolation is off by
 * about (16 · cell / earth radius)² / 8 of the size: under 1e-10 for 10 m or 1e-4° cells.
 */
export function cellMetrics(georef: GridGeoref, width: number, height: number): CellMetrics {
  const projection = gridProjection(georef);
  const u = Math.floor(width / 2) + 0.5;
  const eastM = new Float64Array(height);
  const northM = new Float64Array(height + 1);
  const diagNorthM = new Float64Array(height + 1);
  const areaM2 = new Float64Array(height);
  const centre = (du: number, row: number) => projection.lonLatAt(u + du, row + 0.5);
  // Rows 0 … height: row `height` only for the north steps of the grid's last row (its south
  // neighbour's table entry), never a step itself.
  const measure = (row: number) => {
    const here = centre(0, row);
    northM[row] = geodesicDistanceM(here, centre(0, row - 1));
    diagNorthM[row] = geodesicDistanceM(here, centre(1, row - 1));
    if (row < height) {
      eastM[row] = geodesicDistanceM(here, centre(1, row));
      const heightM = geodesicDistanceM(
        projection.lonLatAt(u, row),
        projection.lonLatAt(u, row + 1),
      );
      areaM2[row] = eastM[row]! * heightM;
    }
  };
  const samples: number[] = [];
  for (let row = 0; row < height; row += SAMPLE_EVERY) samples.push(row);
  samples.push(height - 1, height);
  for (const row of samples) measure(row);
  for (let k = 0; k + 1 < samples.length; k += 1) {
    const [a, b] = [samples[k]!, samples[k + 1]!];
    for (let row = a + 1; row < b; row += 1) {
      const t = (row - a) / (b - a);
      for (const table of [northM, diagNorthM])
        table[row] = table[a]! + t * (table[b]! - table[a]!);
      if (b < height) {
        for (const table of [eastM, areaM2]) table[row] = table[a]! + t * (table[b]! - table[a]!);
      }
    }
  }
  for (const table of [eastM, northM, diagNorthM, areaM2]) {
    if (!table.every((v) => Number.isFinite(v) && v > 0)) {
      throw new Error("the grid's cell sizes could not be measured (is its CRS right?)");
    }
  }
  return { eastM, northM, diagNorthM, areaM2 };
}
