/**
 * Contour lines of the demo site's ground for the invented basemap: d3-contour (marching squares
 * with linear interpolation) over the analytic surface sampled at the terrain grid's cell
 * centres, every CONTOUR_INTERVAL_M, thinned with Douglas–Peucker (turf). The basemap stands for
 * a general map of the area, so its contours cover the whole site, also the two corners the
 * project's terrain file leaves without data.
 */
import { simplify } from "@turf/turf";
import { contours } from "d3-contour";
import type { Position } from "geojson";
import { CELL_M, GRID_CELLS, groundElevationM, SITE_SIZE_M, type XY } from "./site";

export const CONTOUR_INTERVAL_M = 1;
/** Every fifth line is an index contour (drawn heavier and labelled). */
export const INDEX_EVERY = 5;
/** Douglas–Peucker tolerance in metres: far below what a 1 m contour's position means. */
const SIMPLIFY_M = 0.25;

export interface ContourLine {
  readonly elevationM: number;
  readonly index: boolean;
  /** Local site metres (site.ts), x east and y north. */
  readonly points: XY[];
}

function gridValues(): number[] {
  const values: number[] = [];
  for (let row = 0; row < GRID_CELLS; row += 1) {
    for (let col = 0; col < GRID_CELLS; col += 1) {
      values.push(groundElevationM((col + 0.5) * CELL_M, SITE_SIZE_M - (row + 0.5) * CELL_M));
    }
  }
  return values;
}

/**
 * d3-contour closes its polygons along the grid's edge (and cuts the grid's corners); a segment
 * with both ends on the edge is such a closure, not a contour.
 */
function onEdge([x = 0, y = 0]: Position): boolean {
  return x === 0 || y === 0 || x === GRID_CELLS || y === GRID_CELLS;
}
const closure = (a: Position, b: Position) => onEdge(a) && onEdge(b);

/** A closed ring split into the open runs between edge segments (or kept whole if none). */
function linesOfRing(ring: Position[]): Position[][] {
  const m = ring.length - 1; // closed: last point repeats the first
  const edge = (k: number) => closure(ring[k] ?? [], ring[k + 1] ?? []);
  const firstEdge = Array.from({ length: m }, (_, k) => k).find(edge);
  if (firstEdge === undefined) return [ring];
  const lines: Position[][] = [];
  let current: Position[] = [];
  for (let step = 1; step <= m; step += 1) {
    const k = (firstEdge + step) % m;
    if (edge(k)) {
      if (current.length > 1) lines.push(current);
      current = [];
    } else {
      if (current.length === 0) current.push(ring[k] ?? []);
      current.push(ring[k + 1] ?? []);
    }
  }
  if (current.length > 1) lines.push(current);
  return lines;
}

const toLocal = ([gx = 0, gy = 0]: Position): XY => [gx * CELL_M, SITE_SIZE_M - gy * CELL_M];

export function contourLines(): ContourLine[] {
  const values = gridValues();
  const low = Math.ceil(Math.min(...values) / CONTOUR_INTERVAL_M) * CONTOUR_INTERVAL_M;
  const high = Math.floor(Math.max(...values) / CONTOUR_INTERVAL_M) * CONTOUR_INTERVAL_M;
  const levels: number[] = [];
  for (let z = low; z <= high; z += CONTOUR_INTERVAL_M) levels.push(z);
  const generator = contours().size([GRID_CELLS, GRID_CELLS]).thresholds(levels);
  const out: ContourLine[] = [];
  for (const level of generator(values)) {
    for (const polygon of level.coordinates) {
      for (const ring of polygon) {
        for (const line of linesOfRing(ring)) {
          const local = line.map(toLocal);
          const thin = simplify(
            { type: "LineString", coordinates: local.map((p) => [...p]) },
            { tolerance: SIMPLIFY_M, highQuality: true },
          );
          out.push({
            elevationM: level.value,
            index: Math.round(level.value / CONTOUR_INTERVAL_M) % INDEX_EVERY === 0,
            points: thin.coordinates.map(([x = 0, y = 0]): XY => [x, y]),
          });
        }
      }
    }
  }
  return out;
}
