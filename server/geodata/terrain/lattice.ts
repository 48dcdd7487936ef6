/**
 * Raster positions of every point of a regular grid (a map tile's pixel centres) without a
 * projection per point: the exact transform (proj4) runs on a coarse lattice of grid points
 * (17 × 17 for a 256-px tile: every 16th pixel edge), and each point's raster position is the
 * bilinear interpolation of its lattice cell's four corners.
 *
 * Error bound. The transform is smooth, so inside a lattice cell it is a quadratic plus terms of
 * third order in the cell size. Bilinear interpolation reproduces the constant, linear and
 * cross (u·v) terms exactly; the remaining u² and v² terms leave an error whose largest value in
 * the cell lies at its centre or at the middle of an edge. Each level is therefore checked by
 * projecting those five points of every cell exactly; the level is used only when the largest
 * deviation found is within half the tolerance (the other half covers the third-order terms).
 * Otherwise the lattice is halved (8, 4, 2 px) and, past that, every point is projected.
 * The tolerance is 1/1000 of a DEM cell by default: the elevation error it allows is
 * at most the ground's rise per cell × 0.001, under terrarium's 1/256 m step wherever the ground
 * rises less than 3.9 m per cell. Worst deviations measured over whole tiles against proj4 at
 * every pixel, 1 m (or 1e-5°) cells (lattice.test.ts): UTM and geographic 2e-4 cell at zoom 14
 * on the 16-px lattice, 1.2e-5 at zoom 16, 8e-7 at zoom 18 (the error falls 4-fold a zoom);
 * at zooms 11–13 the check refines to 8, 4 or 2 px and the worst stays under 2e-4 cell; Web
 * Mercator only rounding (5e-9 cell: it is the tile grid itself).
 * A lattice cell with a corner or check point that does not project (NaN) is projected point by
 * point.
 */

/** A grid of width × height sample points given by a smooth map from grid units to WGS84. */
export interface LonLatGrid {
  readonly width: number;
  readonly height: number;
  /**
   * [lon, lat] at grid coordinates (u, v): u from 0 (the west edge) to width, v from 0 (the
   * north edge) to height; sample (i, j) sits at (i + 0.5, j + 0.5).
   */
  lonLatAt(u: number, v: number): readonly [number, number];
}

/** Continuous raster cell coordinates (col, row) of a WGS84 point; NaN where it has none. */
export type ToCell = (lon: number, lat: number) => readonly [number, number];

export const LATTICE_STEP_PX = 16;
export const LATTICE_TOLERANCE_CELLS = 1e-3;

export interface GridPositions {
  /** Per sample, row-major from the north-west: raster col and row (NaN where none). */
  readonly cols: Float64Array;
  readonly rows: Float64Array;
  /** Lattice spacing used, in samples; 1 when every sample was projected. */
  readonly stepPx: number;
}

/** Node coordinates 0, step, 2·step, … up to and including `size`. */
function nodesAlong(size: number, step: number): number[] {
  const out: number[] = [];
  for (let t = 0; t < size; t += step) out.push(t);
  out.push(size);
  return out;
}

interface Level {
  us: number[];
  vs: number[];
  /** Node positions, (ny + 1) rows of (nx + 1). */
  col: Float64Array;
  row: Float64Array;
  /** Per lattice cell: true when it must be projected point by point. */
  exact: Uint8Array;
  worst: number;
}

function projectLevel(grid: LonLatGrid, toCell: ToCell, step: number): Level {
  const us = nodesAlong(grid.width, step);
  const vs = nodesAlong(grid.height, step);
  const nx = us.length - 1;
  const ny = vs.length - 1;
  const at = (u: number, v: number) => {
    const [lon, lat] = grid.lonLatAt(u, v);
    return toCell(lon, lat);
  };
  const col = new Float64Array((nx + 1) * (ny + 1));
  const row = new Float64Array((nx + 1) * (ny + 1));
  for (let b = 0; b <= ny; b += 1) {
    for (let a = 0; a <= nx; a += 1) {
      const [c, r] = at(us[a]!, vs[b]!);
      col[b * (nx + 1) + a] = c;
      row[b * (nx + 1) + a] = r;
    }
  }
  const exact = new Uint8Array(nx * ny);
  const deviation = new Float64Array(nx * ny);
  /** Deviation at (u, v) of the exact position from the bilinear one of cell (a, b). */
  const deviationAt = (a: number, b: number, u: number, v: number, fx: number, fy: number) => {
    const k = b * (nx + 1) + a;
    const k2 = k + nx + 1;
    const c0 = col[k]! + (col[k + 1]! - col[k]!) * fx;
    const c1 = col[k2]! + (col[k2 + 1]! - col[k2]!) * fx;
    const r0 = row[k]! + (row[k + 1]! - row[k]!) * fx;
    const r1 = row[k2]! + (row[k2 + 1]! - row[k2]!) * fx;
    const [ec, er] = at(u, v);
    return Math.max(Math.abs(ec - (c0 + (c1 - c0) * fy)), Math.abs(er - (r0 + (r1 - r0) * fy)));
  };
  const record = (a: number, b: number, d: number) => {
    const cell = b * nx + a;
    if (!Number.isFinite(d)) exact[cell] = 1;
    else deviation[cell] = Math.max(deviation[cell]!, d);
  };
  for (let b = 0; b < ny; b += 1) {
    const vm = (vs[b]! + vs[b + 1]!) / 2;
    for (let a = 0; a < nx; a += 1) {
      const um = (us[a]! + us[a + 1]!) / 2;
      record(a, b, deviationAt(a, b, um, vm, 0.5, 0.5));
      // An edge's interpolation uses only its two nodes, so its check also bounds the cell
      // across it: north and west edges here, south and east ones on the last row and column.
      const north = deviationAt(a, b, um, vs[b]!, 0.5, 0);
      record(a, b, north);
      if (b > 0) record(a, b - 1, north);
      const west = deviationAt(a, b, us[a]!, vm, 0, 0.5);
      record(a, b, west);
      if (a > 0) record(a - 1, b, west);
      if (b === ny - 1) record(a, b, deviationAt(a, b, um, vs[b + 1]!, 0.5, 1));
      if (a === nx - 1) record(a, b, deviationAt(a, b, us[a + 1]!, vm, 1, 0.5));
    }
  }
  let worst = 0;
  for (let cell = 0; cell < nx * ny; cell += 1) {
    if (!exact[cell]) worst = Math.max(worst, deviation[cell]!);
  }
  return { us, vs, col, row, exact, worst };
}

/** For each sample index along an axis: its lattice interval and the fraction across it. */
function intervals(size: number, nodes: number[]): { index: Int32Array; frac: Float64Array } {
  const index = new Int32Array(size);
  const frac = new Float64Array(size);
  let k = 0;
  for (let i = 0; i < size; i += 1) {
    const t = i + 0.5;
    while (k < nodes.length - 2 && t >= nodes[k + 1]!) k += 1;
    index[i] = k;
    frac[i] = (t - nodes[k]!) / (nodes[k + 1]! - nodes[k]!);
  }
  return { index, frac };
}

export function gridPositions(
  grid: LonLatGrid,
  toCell: ToCell,
  toleranceCells = LATTICE_TOLERANCE_CELLS,
): GridPositions {
  const { width, height } = grid;
  const cols = new Float64Array(width * height);
  const rows = new Float64Array(width * height);
  const exactAt = (i: number, j: number) => {
    const [lon, lat] = grid.lonLatAt(i + 0.5, j + 0.5);
    const [c, r] = toCell(lon, lat);
    cols[j * width + i] = c;
    rows[j * width + i] = r;
  };
  for (let step = LATTICE_STEP_PX; step >= 2; step /= 2) {
    const level = projectLevel(grid, toCell, step);
    if (level.worst > toleranceCells / 2) continue;
    const nx = level.us.length - 1;
    const across = intervals(width, level.us);
    const down = intervals(height, level.vs);
    for (let j = 0; j < height; j += 1) {
      const b = down.index[j]!;
      const fy = down.frac[j]!;
      for (let i = 0; i < width; i += 1) {
        const a = across.index[i]!;
        if (level.exact[b * nx + a]) {
          exactAt(i, j);
          continue;
        }
        const fx = across.frac[i]!;
        const k = b * (nx + 1) + a;
        const k2 = k + nx + 1;
        // Same form as shared/geo/bilinear: along u on both rows, then along v.
        const c0 = level.col[k]! + (level.col[k + 1]! - level.col[k]!) * fx;
        const c1 = level.col[k2]! + (level.col[k2 + 1]! - level.col[k2]!) * fx;
        const r0 = level.row[k]! + (level.row[k + 1]! - level.row[k]!) * fx;
        const r1 = level.row[k2]! + (level.row[k2 + 1]! - level.row[k2]!) * fx;
        cols[j * width + i] = c0 + (c1 - c0) * fy;
        rows[j * width + i] = r0 + (r1 - r0) * fy;
      }
    }
    return { cols, rows, stepPx: step };
  }
  for (let j = 0; j < height; j += 1) for (let i = 0; i < width; i += 1) exactAt(i, j);
  return { cols, rows, stepPx: 1 };
}
