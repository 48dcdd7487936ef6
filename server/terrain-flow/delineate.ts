/**
 * Outlets in, proposed subcatchments out: each outlet is snapped, its basin found (excluding
 * what drains to the other outlets: nested outlets split the area between them), outlined,
 * simplified, and its longest flow path traced; everything is turned into WGS84 GeoJSON with
 * lengths and areas in metres. Only the basin's cells are walked, so a click is cheap once the
 * terrain is routed.
 */
import { geodesicAreaM2 } from "../../shared/geo/geodesic";
import type { LonLat } from "../../shared/geo/types";
import type { DelineationProposal } from "../../shared/schemas/delineation";
import { TerrainFlowError } from "./errors";
import { gridProjection, type GridProjection } from "./georef";
import { longestFlowPath } from "./longest-path";
import { traceOutline } from "./outline";
import { simplifyOutline } from "./outline-simplify";
import { NODATA_MASK, type RoutedGrid } from "./types";
import { snapOutlet, upstreamCells } from "./upstream";
import geodesic from "geographiclib-geodesic";

const WGS84 = geodesic.Geodesic.WGS84;

export interface DelineateOptions {
  /** Snap radius in cells (default 3, the Design rules' default). */
  readonly snapCells?: number;
}

export const DEFAULT_SNAP_CELLS = 3;
export const MAX_SNAP_CELLS = 50;

const where = (lonLat: LonLat) => `${lonLat[0].toFixed(6)}, ${lonLat[1].toFixed(6)}`;

/** The outlets' cells in the grid, snapped; refuses outlets off the grid, on nodata, or shared. */
export function outletCells(
  routed: RoutedGrid,
  projection: GridProjection,
  outlets: readonly LonLat[],
  snapCells: number,
): number[] {
  if (!(Number.isFinite(snapCells) && snapCells >= 0 && snapCells <= MAX_SNAP_CELLS)) {
    throw new TerrainFlowError(
      422,
      "snap-radius",
      `the snap radius must be between 0 and ${MAX_SNAP_CELLS} cells (got ${snapCells})`,
    );
  }
  const seen = new Map<number, number>();
  return outlets.map((lonLat, k) => {
    const [u, v] = projection.gridOf(lonLat[0], lonLat[1]);
    const col = Math.floor(u);
    const row = Math.floor(v);
    if (!(col >= 0 && row >= 0 && col < routed.width && row < routed.height)) {
      throw new TerrainFlowError(
        422,
        "outlet-outside",
        `outlet ${k + 1} (${where(lonLat)}) is outside the terrain grid`,
      );
    }
    if ((routed.cond[row * routed.width + col]! & NODATA_MASK) !== 0) {
      throw new TerrainFlowError(
        422,
        "outlet-on-nodata",
        `outlet ${k + 1} (${where(lonLat)}) is on a nodata cell of the terrain`,
      );
    }
    const cell = snapOutlet(routed, col, row, snapCells);
    const other = seen.get(cell);
    if (other !== undefined) {
      throw new TerrainFlowError(
        422,
        "outlets-same-cell",
        `outlets ${other + 1} and ${k + 1} snap to the same cell; move one or lower the snap radius`,
      );
    }
    seen.set(cell, k);
    return cell;
  });
}

/** GeoJSON coordinates of a flat ring in grid units, closed. */
function ringLonLat(projection: GridProjection, ring: readonly number[]): [number, number][] {
  const out: [number, number][] = [];
  for (let a = 0; a < ring.length; a += 2) out.push(projection.lonLatAt(ring[a]!, ring[a + 1]!));
  out.push(out[0]!);
  return out;
}

export function delineate(
  routed: RoutedGrid,
  outlets: readonly LonLat[],
  options: DelineateOptions = {},
): DelineationProposal[] {
  const projection = gridProjection(routed.georef);
  const snapCells = options.snapCells ?? DEFAULT_SNAP_CELLS;
  const cells = outletCells(routed, projection, outlets, snapCells);
  const stops = new Set(cells);
  return cells.map((outlet, k) => {
    const others = new Set(stops);
    others.delete(outlet);
    const basin = upstreamCells(routed, outlet, others);
    const outline = simplifyOutline(traceOutline(basin, routed.width));
    const polygons = outline.polygons.map((p) =>
      [p.shell, ...p.holes].map((ring) => ringLonLat(projection, ring)),
    );
    const path = longestFlowPath(routed, basin, outlet);
    const pathLonLat: [number, number][] = [];
    for (let a = 0; a < path.points.length; a += 2) {
      pathLonLat.push(projection.lonLatAt(path.points[a]!, path.points[a + 1]!));
    }
    const row = Math.floor(outlet / routed.width);
    const snapped = projection.lonLatAt(outlet - row * routed.width + 0.5, row + 0.5);
    const requested = outlets[k]!;
    let cellsAreaM2 = 0;
    const perRow = 1 / routed.width;
    for (let k = 0; k < basin.length; k += 1) {
      cellsAreaM2 += routed.metrics.areaM2[((basin[k]! + 0.5) * perRow) | 0]!;
    }
    return {
      outlet: {
        requested: [requested[0], requested[1]],
        snapped,
        movedM: WGS84.Inverse(requested[1], requested[0], snapped[1], snapped[0]).s12 ?? 0,
      },
      areaM2: polygons.reduce((sum, rings) => sum + geodesicAreaM2(rings), 0),
      cellsAreaM2,
      longestFlowPathM: path.lengthM,
      cells: basin.length,
      boundary:
        polygons.length === 1
          ? { type: "Polygon", coordinates: polygons[0]! }
          : { type: "MultiPolygon", coordinates: polygons },
      boundarySmoothed: outline.simplified,
      longestFlowPath: { type: "LineString", coordinates: pathLonLat },
      pathConditioning: path.stretches,
      terrainConditioning: routed.report,
    };
  });
}
