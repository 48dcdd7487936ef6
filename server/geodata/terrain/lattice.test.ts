/**
 * The lattice's error bound: on whole 256-px map tiles, in every kind of CRS a terrain file may
 * carry and from the coarsest zoom a tile is served at (MAX_CELLS_PER_PIXEL) to street level,
 * each pixel's interpolated raster position is compared with proj4's own projection of the
 * pixel centre (the reference library): no deviation may exceed LATTICE_TOLERANCE_CELLS.
 * The cells are small for their CRS (1 m, 1e-5°), which makes the deviation in cells largest.
 */
import proj4 from "proj4";
import { describe, expect, it } from "vitest";
import { MAX_CELLS_PER_PIXEL, tileGrid } from "../../tiles/terrain-tiles";
import { knownCrs } from "./crs";
import { gridPositions, LATTICE_STEP_PX, LATTICE_TOLERANCE_CELLS, type ToCell } from "./lattice";

interface Case {
  epsg: number;
  /** A point of the area the DEM covers (WGS84) and its cell size in CRS units. */
  lon: number;
  lat: number;
  cell: number;
}

const CASES: Case[] = [
  { epsg: 26910, lon: -122.2, lat: 38.4, cell: 1 }, // NAD83 / UTM 10N, 0.8° off the meridian
  { epsg: 32614, lon: -96.52, lat: 38.41, cell: 1 }, // WGS 84 / UTM 14N
  { epsg: 32614, lon: -102, lat: 48.5, cell: 1 }, // zone 14's western edge, further north
  { epsg: 32756, lon: 151.2, lat: -33.9, cell: 1 }, // WGS 84 / UTM 56S
  { epsg: 25832, lon: 9.9, lat: 53.55, cell: 1 }, // ETRS89 / UTM 32N
  { epsg: 3857, lon: -96.52, lat: 38.41, cell: 1 }, // Web Mercator
  { epsg: 4326, lon: -96.52, lat: 38.41, cell: 1e-5 }, // geographic
  { epsg: 4269, lon: -150, lat: 61.2, cell: 1e-5 }, // geographic, far north
];

function toCellFor(c: Case): ToCell {
  const crs = knownCrs(c.epsg)!;
  const forward = crs.geographic ? null : proj4("EPSG:4326", crs.proj4).forward;
  const [x0, y0] = forward ? forward([c.lon, c.lat]) : [c.lon, c.lat];
  // A raster whose top-left corner is 10 km (or 0.1°) north-west of the point.
  const margin = crs.geographic ? 0.1 : 10_000;
  return (lon, lat) => {
    const [x = Number.NaN, y = Number.NaN] = forward ? forward([lon, lat]) : [lon, lat];
    return [(x - (x0! - margin)) / c.cell - 0.5, (y0! + margin - y) / c.cell - 0.5];
  };
}

function tileAt(lon: number, lat: number, z: number) {
  const n = 2 ** z;
  const r = (lat * Math.PI) / 180;
  return {
    z,
    x: Math.floor(((lon + 180) / 360) * n),
    y: Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * n),
  };
}

/** The coarsest zoom whose pixel is at most MAX_CELLS_PER_PIXEL cells across (the route's rule). */
function coarsestServed(c: Case): number {
  const cellDeg = knownCrs(c.epsg)!.geographic
    ? c.cell
    : (c.cell / 6_378_137 / Math.cos((c.lat * Math.PI) / 180)) * (180 / Math.PI);
  for (let z = 0; ; z += 1) if (360 / 2 ** z / 256 <= MAX_CELLS_PER_PIXEL * cellDeg) return z;
}

/** Largest deviation, in cells, of the lattice positions from proj4 at every pixel. */
function worstDeviation(c: Case, z: number, tolerance = LATTICE_TOLERANCE_CELLS) {
  const grid = tileGrid(tileAt(c.lon, c.lat, z));
  const toCell = toCellFor(c);
  const got = gridPositions(grid, toCell, tolerance);
  let worst = 0;
  for (let j = 0; j < grid.height; j += 1) {
    for (let i = 0; i < grid.width; i += 1) {
      const [lon, lat] = grid.lonLatAt(i + 0.5, j + 0.5);
      const [col, row] = toCell(lon, lat);
      const k = j * grid.width + i;
      worst = Math.max(worst, Math.abs(got.cols[k]! - col), Math.abs(got.rows[k]! - row));
    }
  }
  return { worst, stepPx: got.stepPx };
}

describe("lattice positions of a tile's pixels", () => {
  for (const c of CASES) {
    it(`stay within ${LATTICE_TOLERANCE_CELLS} cell of proj4 in EPSG:${c.epsg} at ${c.lon}, ${c.lat}`, () => {
      const from = coarsestServed(c);
      for (const z of [from, from + 1, from + 3, from + 6]) {
        const { worst } = worstDeviation(c, z);
        expect(worst, `zoom ${z}`).toBeLessThanOrEqual(LATTICE_TOLERANCE_CELLS);
      }
    });
  }

  it("uses the coarse lattice where it is accurate enough", () => {
    // UTM at zoom 16 with 1 m cells: measured about 1.2e-5 m off at 16 px, far inside the bound.
    const { worst, stepPx } = worstDeviation(CASES[0]!, 16);
    expect(stepPx).toBe(LATTICE_STEP_PX);
    expect(worst).toBeLessThan(1e-4);
  });

  it("refines the lattice when the coarse one is not accurate enough", () => {
    // Zoom 10 with 1 m cells (coarser than served): 16 px misses by about 0.05 cell.
    const { worst, stepPx } = worstDeviation(CASES[0]!, 10);
    expect(stepPx).toBeLessThan(LATTICE_STEP_PX);
    expect(worst).toBeLessThanOrEqual(LATTICE_TOLERANCE_CELLS);
  });

  it("projects every pixel when no lattice meets the tolerance", () => {
    const { worst, stepPx } = worstDeviation(CASES[0]!, 12, 1e-12);
    expect(stepPx).toBe(1);
    expect(worst).toBe(0);
  });

  it("projects point by point the lattice cells next to a point that does not project", () => {
    const grid = tileGrid(tileAt(-122.2, 38.4, 16));
    const exact: ToCell = (lon, lat) => [lon * 1e4, -lat * 1e4];
    // A hole in the transform at the west part of the tile (as proj4 gives NaN far off a zone).
    const west = grid.lonLatAt(40, 0)[0];
    const holed: ToCell = (lon, lat) => (lon < west ? [Number.NaN, Number.NaN] : exact(lon, lat));
    const got = gridPositions(grid, holed);
    for (let i = 0; i < grid.width; i += 1) {
      const [lon, lat] = grid.lonLatAt(i + 0.5, 100.5);
      const [col] = holed(lon, lat);
      if (Number.isNaN(col)) expect(got.cols[100 * grid.width + i]).toBeNaN();
      else expect(Math.abs(got.cols[100 * grid.width + i]! - col)).toBeLessThan(1e-6);
    }
  });
});
