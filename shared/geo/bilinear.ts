/**
 * Bilinear interpolation of a terrain grid.
 *
 *   z(fx, fy) = z00·(1−fx)(1−fy) + z10·fx(1−fy) + z01·(1−fx)·fy + z11·fx·fy
 *
 * with fx, fy ∈ [0, 1] measured from the z00 corner. It reproduces any plane exactly, is
 * continuous across cells, and needs only the four samples around the point.
 *
 * Nodata: if any of the four corners is nodata the result is null ("no elevation"). Re-weighting
 * the remaining corners would invent a surface across a hole in the data (a masked building, a
 * lake, the edge of the survey) and feed a made-up slope to a travel time; an honest gap lets
 * the engineer add a surveyed elevation instead.
 */

/** Bilinear value in one cell; a null or NaN corner gives null. */
export function bilinear(
  z00: number | null,
  z10: number | null,
  z01: number | null,
  z11: number | null,
  fx: number,
  fy: number,
): number | null {
  if (z00 === null || z10 === null || z01 === null || z11 === null) return null;
  if (Number.isNaN(z00) || Number.isNaN(z10) || Number.isNaN(z01) || Number.isNaN(z11)) {
    return null;
  }
  const bottom = z00 + (z10 - z00) * fx;
  const top = z01 + (z11 - z01) * fx;
  return bottom + (top - bottom) * fy;
}

/** A block of terrain samples, row-major (row 0 first), with its nodata value if any. */
export interface ElevationGrid {
  readonly width: number;
  readonly height: number;
  readonly values: ArrayLike<number>;
  readonly nodata: number | null;
}

/**
 * Samples the grid at continuous sample coordinates (col, row): integers fall on samples
 * (pixel centres), so a GeoTIFF pixel (i, j) with "pixel is area" sits at col = i, row = j and
 * a map x gives col = (x − originX) / pixelWidth − 0.5. Within half a pixel outside the outer
 * samples the edge value is held (the pixel still covers that ground); beyond that, null.
 */
export function sampleGrid(grid: ElevationGrid, col: number, row: number): number | null {
  const { width, height } = grid;
  if (width < 1 || height < 1) return null;
  if (col < -0.5 || row < -0.5 || col > width - 0.5 || row > height - 0.5) return null;
  const c = Math.min(Math.max(col, 0), width - 1);
  const r = Math.min(Math.max(row, 0), height - 1);
  const c0 = Math.min(Math.floor(c), Math.max(width - 2, 0));
  const r0 = Math.min(Math.floor(r), Math.max(height - 2, 0));
  const c1 = Math.min(c0 + 1, width - 1);
  const r1 = Math.min(r0 + 1, height - 1);
  const at = (cc: number, rr: number): number | null => {
    const v = grid.values[rr * width + cc];
    return v === undefined || v === grid.nodata || Number.isNaN(v) ? null : v;
  };
  return bilinear(at(c0, r0), at(c1, r0), at(c0, r1), at(c1, r1), c - c0, r - r0);
}
