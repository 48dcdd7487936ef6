/**
 * Test support: synthetic terrains in a projected and a geographic CRS, and reference cell
 * sizes from closed-form ellipsoid formulas (independent of GeographicLib, which the engine
 * uses). WGS84: a = 6378137 m, f = 1/298.257223563 (NIMA TR8350.2).
 */
import { geoTiffBytes } from "../geodata/writers";
import type { ElevationGrid, GridGeoref } from "./types";

const A = 6378137;
const F = 1 / 298.257223563;
const E2 = F * (2 - F);
const E = Math.sqrt(E2);
const RAD = Math.PI / 180;
/** UTM scale on the central meridian (NGA.SIG.0012; Snyder 1987, Map Projections p. 57). */
export const UTM_K0 = 0.9996;

export interface TestCrs {
  readonly name: string;
  readonly georef: (width: number, height: number) => GridGeoref;
  /** Reference step lengths of a row, metres: east, north (to row − 1), diagonal north. */
  readonly steps: (row: number, height: number) => { east: number; north: number; diag: number };
  /** Reference ground area of one cell of a row, m². */
  readonly cellAreaM2: (row: number, height: number) => number;
}

/** 10 m cells in UTM zone 14N, centred on its central meridian (99° W). */
export const UTM: TestCrs = {
  name: "UTM 14N, 10 m cells",
  georef: (width) => ({
    epsg: 32614,
    originX: 500_000 - (width / 2) * 10,
    originY: 4_200_000,
    pixelSizeX: 10,
    pixelSizeY: 10,
  }),
  // On the central meridian the ground is 1/k0 of the grid distance (the grid is scaled by k0).
  steps: () => ({ east: 10 / UTM_K0, north: 10 / UTM_K0, diag: (10 * Math.SQRT2) / UTM_K0 }),
  cellAreaM2: () => (10 / UTM_K0) ** 2,
};

const GEO_CELL_DEG = 1e-4;
const GEO_NORTH = 45.02;

/** Radii of curvature: meridian M and prime vertical N (textbook geodesy, derived). */
const radii = (latDeg: number) => {
  const s = Math.sin(latDeg * RAD);
  const w2 = 1 - E2 * s * s;
  return { m: (A * (1 - E2)) / (w2 * Math.sqrt(w2)), n: A / Math.sqrt(w2) };
};
/** Row centre latitude. */
const latOf = (row: number) => GEO_NORTH - (row + 0.5) * GEO_CELL_DEG;

/**
 * Area between two parallels over Δλ on the ellipsoid: ∫∫ M·N·cos φ dφ dλ
 * = a²(1 − e²)·Δλ·[s / (2(1 − e²s²)) + ln((1 + e·s)/(1 − e·s)) / (4e)], s = sin φ (derived).
 */
function zoneAreaM2(lat1: number, lat2: number, dLonDeg: number): number {
  const g = (lat: number) => {
    const s = Math.sin(lat * RAD);
    return s / (2 * (1 - E2 * s * s)) + Math.log((1 + E * s) / (1 - E * s)) / (4 * E);
  };
  return A * A * (1 - E2) * dLonDeg * RAD * Math.abs(g(lat2) - g(lat1));
}

/** 1e-4° cells (about 7.9 × 11.1 m) just south of 45° N on WGS84 (EPSG:4326). */
export const GEOGRAPHIC: TestCrs = {
  name: "WGS84 longitude/latitude, 1e-4° cells",
  georef: () => ({
    epsg: 4326,
    originX: -99,
    originY: GEO_NORTH,
    pixelSizeX: GEO_CELL_DEG,
    pixelSizeY: GEO_CELL_DEG,
  }),
  steps: (row) => {
    // Parallel arc N·cos φ·Δλ; meridian arc M·Δφ at the mid-latitude (errors of order Δφ³).
    const here = latOf(row);
    const mid = here + GEO_CELL_DEG / 2;
    const east = radii(here).n * Math.cos(here * RAD) * GEO_CELL_DEG * RAD;
    const north = radii(mid).m * GEO_CELL_DEG * RAD;
    const eastMid = radii(mid).n * Math.cos(mid * RAD) * GEO_CELL_DEG * RAD;
    return { east, north, diag: Math.hypot(eastMid, north) };
  },
  cellAreaM2: (row) =>
    zoneAreaM2(latOf(row) + GEO_CELL_DEG / 2, latOf(row) - GEO_CELL_DEG / 2, GEO_CELL_DEG),
};

export const CRSES = [UTM, GEOGRAPHIC] as const;

/** A grid of elevations (metres) from a function of column and row; NaN is nodata. */
export function makeGrid(
  crs: TestCrs,
  width: number,
  height: number,
  elevation: (col: number, row: number) => number,
): ElevationGrid {
  const z = new Float32Array(width * height);
  for (let row = 0; row < height; row += 1) {
    for (let col = 0; col < width; col += 1) z[row * width + col] = elevation(col, row);
  }
  return { width, height, z, verticalToM: 1, georef: crs.georef(width, height) };
}

export const RANDOM_GRID_WIDTH = 100;

/** A deterministic generator (mulberry32), so a failure repeats. */
function random(seed: number) {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Random blobs of `count` cells in a grid RANDOM_GRID_WIDTH wide: a growth from the middle of a
 * `size` square by random steps to any of the eight neighbours, so they have one-cell necks,
 * corner-only links and enclosed holes.
 */
export function randomCells(seed: number, size: number, count: number): Int32Array {
  const W = RANDOM_GRID_WIDTH;
  const next = random(seed);
  const inside = new Set<number>([Math.floor(size / 2) * W + Math.floor(size / 2)]);
  const frontier = [...inside];
  while (inside.size < count) {
    const from = frontier[Math.floor(next() * frontier.length)]!;
    const step = [1, -1, W, -W, W + 1, W - 1, -W + 1, -W - 1][Math.floor(next() * 8)]!;
    const to = from + step;
    const [c, r] = [to % W, Math.floor(to / W)];
    if (c < 1 || r < 1 || c >= size || r >= size || inside.has(to)) continue;
    inside.add(to);
    frontier.push(to);
  }
  return Int32Array.from(inside);
}

/**
 * An invented terrain of valleys, metres at (x east, y north) in metres: a slope falling 4 % to
 * the south with valleys 400 m and 90 m apart, the smaller ones winding (no depressions, no
 * flats); `ripple` adds a small cross-wave.
 */
export function valleysElevation(x: number, y: number, ripple = 0): number {
  const wave = (period: number) => 1 - Math.cos((2 * Math.PI * x) / period);
  return (
    0.04 * y +
    6 * wave(400) +
    2.5 * wave(90) * (1 + 0.4 * Math.sin((2 * Math.PI * y) / 260)) +
    0.002 * x +
    ripple * Math.sin(x * 0.37 + y * 0.11)
  );
}

/**
 * A small valid GeoTIFF whose header claims `width` × `height` cells (ImageWidth and
 * ImageLength, tags 256 and 257, patched): a terrain too large to compute, without writing one.
 */
export function oversizedTiff(width: number, height: number): Uint8Array {
  const bytes = geoTiffBytes({
    width: 16,
    height: 16,
    georeference: {
      epsg: 32614,
      originX: 500_000,
      originY: 4_200_000,
      pixelSizeX: 5,
      pixelSizeY: 5,
    },
    tileSize: 16,
    values: () => 1,
  });
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const ifd = view.getUint32(4, true);
  for (let k = 0; k < view.getUint16(ifd, true); k += 1) {
    const entry = ifd + 2 + 12 * k;
    const tag = view.getUint16(entry, true);
    if (tag === 256) view.setUint32(entry + 8, width, true);
    if (tag === 257) view.setUint32(entry + 8, height, true);
  }
  return bytes;
}
