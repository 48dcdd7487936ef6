/**
 * Average land slope of a subcatchment from the terrain, the Y of the NRCS lag equation
 * (NEH 630 Ch 15, 2010, eq 15-4: Y is the average watershed land slope in percent).
 *
 * Method (a grid method): elevations are sampled at the centres of a regular grid in metres
 * laid over the boundary; at each sample inside the boundary the gradient is taken by central
 * differences (one-sided at the boundary's edge, where only one neighbour is inside), and Y is
 * the mean of the gradient magnitudes × 100. A plane gives its own slope exactly. Samples with
 * no elevation and samples outside the boundary are left out.
 *
 * The grid uses metres per degree at the boundary's centre (from the geodesic); over a
 * subcatchment a few kilometres across the scale changes by well under 1 %, which moves Y by
 * the same fraction.
 */
import { geodesicDistanceM } from "./geodesic";
import { pointInRings } from "./planar";
import type { LonLat, PolygonRings } from "./types";

export interface LandSlopeGrid {
  readonly width: number;
  readonly height: number;
  readonly cellSizeXM: number;
  readonly cellSizeYM: number;
  /** Row-major elevations in metres; null or NaN where outside the boundary or no data. */
  readonly elevationsM: ArrayLike<number | null>;
}

export function averageLandSlopePercent(
  grid: LandSlopeGrid,
): { slopePercent: number; sampleCount: number } | null {
  const { width, height, cellSizeXM: dx, cellSizeYM: dy } = grid;
  const z = (c: number, r: number): number | null => {
    if (c < 0 || r < 0 || c >= width || r >= height) return null;
    const v = grid.elevationsM[r * width + c];
    return v === null || v === undefined || Number.isNaN(v) ? null : v;
  };
  const derivative = (lo: number | null, mid: number, hi: number | null, step: number) => {
    if (lo !== null && hi !== null) return (hi - lo) / (2 * step);
    if (hi !== null) return (hi - mid) / step;
    if (lo !== null) return (mid - lo) / step;
    return null;
  };
  let sum = 0;
  let count = 0;
  for (let r = 0; r < height; r += 1) {
    for (let c = 0; c < width; c += 1) {
      const here = z(c, r);
      if (here === null) continue;
      const gx = derivative(z(c - 1, r), here, z(c + 1, r), dx);
      const gy = derivative(z(c, r - 1), here, z(c, r + 1), dy);
      if (gx === null || gy === null) continue; // an isolated sample has no gradient
      sum += Math.hypot(gx, gy);
      count += 1;
    }
  }
  return count === 0 ? null : { slopePercent: (100 * sum) / count, sampleCount: count };
}

export interface PolygonGrid {
  readonly width: number;
  readonly height: number;
  readonly cellSizeXM: number;
  readonly cellSizeYM: number;
  /** Row-major sample points (row 0 at the south edge); null outside the boundary. */
  readonly points: readonly (LonLat | null)[];
}

/**
 * Sample points every `spacingM` over a boundary, for averageLandSlopePercent. When that would
 * give more than `maxPoints` points the spacing grows until it does not (the result says which).
 */
export function gridOverPolygon(
  rings: PolygonRings,
  spacingM: number,
  maxPoints = 40_000,
): PolygonGrid {
  if (!(spacingM > 0)) throw new RangeError(`grid spacing must be positive (got ${spacingM})`);
  if (!(maxPoints >= 1)) throw new RangeError(`maxPoints must be at least 1 (got ${maxPoints})`);
  const outer = rings[0];
  if (!outer || outer.length < 3) throw new RangeError("the boundary needs an outer ring");
  const lons = outer.map((p) => p[0]);
  const lats = outer.map((p) => p[1]);
  const [minX, maxX] = [Math.min(...lons), Math.max(...lons)];
  const [minY, maxY] = [Math.min(...lats), Math.max(...lats)];
  const cx = (minX + maxX) / 2;
  const cy = (minY + maxY) / 2;
  const STEP = 1e-3;
  const mPerDegX = geodesicDistanceM([cx - STEP / 2, cy], [cx + STEP / 2, cy]) / STEP;
  const mPerDegY = geodesicDistanceM([cx, cy - STEP / 2], [cx, cy + STEP / 2]) / STEP;
  const spanXM = (maxX - minX) * mPerDegX;
  const spanYM = (maxY - minY) * mPerDegY;
  const wanted = Math.ceil(spanXM / spacingM) * Math.ceil(spanYM / spacingM);
  let useM = wanted > maxPoints ? spacingM * Math.sqrt(wanted / maxPoints) : spacingM;
  const cellsAlong = (spanM: number) => Math.max(1, Math.ceil(spanM / useM));
  while (cellsAlong(spanXM) * cellsAlong(spanYM) > maxPoints) useM *= 1.01;
  const width = cellsAlong(spanXM);
  const height = cellsAlong(spanYM);
  const flat = rings.map((ring) => {
    const first = ring[0];
    const last = ring[ring.length - 1];
    const open = first && last && (first[0] !== last[0] || first[1] !== last[1]);
    return Float64Array.from((open ? [...ring, first] : ring).flat());
  });
  const points: (LonLat | null)[] = [];
  for (let r = 0; r < height; r += 1) {
    for (let c = 0; c < width; c += 1) {
      const x = minX + ((c + 0.5) * useM) / mPerDegX;
      const y = minY + ((r + 0.5) * useM) / mPerDegY;
      points.push(pointInRings(x, y, flat) ? [x, y] : null);
    }
  }
  return { width, height, cellSizeXM: useM, cellSizeYM: useM, points };
}
