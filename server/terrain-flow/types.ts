/**
 * The terrain-flow engine's data: one elevation grid in, typed arrays out, no per-cell objects.
 *
 * Directions are D8 codes (O'Callaghan & Mark 1984): 0 = the water leaves the grid here (an edge
 * cell, a cell beside nodata, or nodata itself), 1–8 = east, north-east, north, north-west, west,
 * south-west, south, south-east (counter-clockwise from east, rows running south).
 */

/** Where the grid sits: the raster CRS and the outer corner of the top-left cell. */
export interface GridGeoref {
  readonly epsg: number;
  /** Map coordinates (raster CRS units) of the outer north-west corner of cell (0, 0). */
  readonly originX: number;
  readonly originY: number;
  /** Cell size in CRS units, both positive (rows run south). */
  readonly pixelSizeX: number;
  readonly pixelSizeY: number;
}

/** An elevation grid, row-major from the north-west; NaN is nodata. */
export interface ElevationGrid {
  readonly width: number;
  readonly height: number;
  /** Elevations in the file's vertical unit (directions do not depend on it). */
  readonly z: Float32Array;
  /** Metres per elevation unit (1, or 0.3048 for feet). */
  readonly verticalToM: number;
  readonly georef: GridGeoref;
}

/** Per-row true cell sizes on the WGS84 ellipsoid (cell-metrics.ts). */
export interface CellMetrics {
  /** Centre to the east (or west) neighbour's centre, per row, metres. */
  readonly eastM: Float64Array;
  /** Centre of row r to the centre of row r − 1, per row (index 0 … height), metres. */
  readonly northM: Float64Array;
  /** Centre of row r to a diagonal neighbour in row r − 1, per row (0 … height), metres. */
  readonly diagNorthM: Float64Array;
  /** Ground area of one cell of row r, m². */
  readonly areaM2: Float64Array;
}

/** Bits of the per-cell conditioning mask. */
export const COND_FILLED = 1;
export const COND_FLAT = 2;
export const COND_BREACHED = 4;
/** Internal to the flood: on the grid's edge, queued, finished. Cleared before hand-out. */
export const STATE_EDGE = 16;
export const STATE_QUEUED = 64;
export const STATE_DONE = 128;

export interface ConditioningReport {
  readonly method: "fill" | "breach";
  /** Cells raised by depression filling, and the deepest rise in metres. */
  readonly filledCells: number;
  readonly maxFillDepthM: number;
  /** Cells with no lower neighbour after conditioning, routed across their flat. */
  readonly flatCells: number;
  /** Breaching (method "breach"): pits opened, cells lowered, deepest cut; pits left to fill. */
  readonly breachedPits: number;
  readonly breachedCells: number;
  readonly maxBreachDepthM: number;
  readonly unbreachedPits: number;
}

/** What a terrain is computed into once; a click then only walks these (delineate.ts). */
export interface RoutedGrid {
  readonly width: number;
  readonly height: number;
  readonly georef: GridGeoref;
  readonly metrics: CellMetrics;
  /** D8 code per cell (see above). */
  readonly dir: Uint8Array;
  /** COND_* bits per cell; nodata cells carry NODATA_MASK. */
  readonly cond: Uint8Array;
  /** Cells draining through each cell, itself included (0 on nodata). */
  readonly acc: Uint32Array;
  /** Distance along the flow path from the cell's centre to where it leaves the grid, metres. */
  readonly flowLenM: Float32Array;
  readonly report: ConditioningReport;
}

/** cond value of a nodata cell. */
export const NODATA_MASK = 32;
