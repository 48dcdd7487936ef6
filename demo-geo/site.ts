/**
 * The invented demo site "Harrow Hill Terraces": where it sits and the shape of its ground.
 * Nothing here describes a real place. The coordinates only put the site on the map in a rural
 * spot; the terrain is an analytic surface, not a survey.
 *
 * Local coordinates x (east) and y (north) are metres from the site's south-west corner; the
 * site is SITE_SIZE_M square. They map to WGS 84 / UTM zone 14N (EPSG:32614) by a shift, and to
 * WGS84 longitude/latitude through proj4.
 */
import proj4 from "proj4";

export const UTM_EPSG = 32614;
export const UTM_NAME = "WGS 84 / UTM zone 14N";
const UTM_PROJ = "+proj=utm +zone=14 +datum=WGS84 +units=m +no_defs";

/** UTM easting/northing of the site's south-west corner (invented). */
export const ORIGIN_E = 716_400;
export const ORIGIN_N = 4_254_000;
export const SITE_SIZE_M = 512;

/** Terrain grid: 2 m cells, 256 × 256, elevations in metres. */
export const CELL_M = 2;
export const GRID_CELLS = SITE_SIZE_M / CELL_M;
export const NODATA = -9999;

export type XY = readonly [number, number];

const toWgs84 = proj4(UTM_PROJ, "EPSG:4326");

export function utmOf([x, y]: XY): XY {
  return [ORIGIN_E + x, ORIGIN_N + y];
}

/** Eight decimals of a degree (about 1 mm): enough for a site plan, short in the files. */
function round8(v: number): number {
  return Math.round(v * 1e8) / 1e8;
}

export function lonLatOf(p: XY): [number, number] {
  const [lon, lat] = toWgs84.forward([...utmOf(p)]);
  return [round8(lon), round8(lat)];
}

/** UTM easting/northing of a WGS84 lon/lat (the test maps the path back onto the grid). */
export function utmFromLonLat(lonLat: XY): XY {
  const [e, n] = toWgs84.inverse([...lonLat]);
  return [e, n];
}

/**
 * The valley's thalweg: a swale running south, meandering gently about x = 378 m. The flow
 * path's lower part and the channel line both follow it.
 */
export function thalwegX(y: number): number {
  return 378 + 12 * Math.sin((2 * Math.PI * y) / 420);
}

// Shape of the ground (all invented): the valley floor falls 3 % to the south; the hillside to
// the west rises at 8.5 % from the valley, the far side at 4.5 %; a rounded bottom 12 m wide
// makes the swale; a 0.2 m undulation keeps the surface from being a perfect plane.
const BASE_M = 352;
const VALLEY_FALL = 0.03;
const WEST_RISE = 0.085;
const EAST_RISE = 0.045;
const BOTTOM_RADIUS_M = 12;
const UNDULATION_M = 0.2;

/** Ground elevation in metres at a local point (the analytic surface the terrain samples). */
export function groundElevationM(x: number, y: number): number {
  const d = x - thalwegX(y);
  const rise = d < 0 ? WEST_RISE : EAST_RISE;
  const side = rise * (Math.sqrt(d * d + BOTTOM_RADIUS_M ** 2) - BOTTOM_RADIUS_M);
  const undulation =
    UNDULATION_M * Math.sin((2 * Math.PI * x) / 170) * Math.cos((2 * Math.PI * y) / 230);
  return BASE_M + VALLEY_FALL * y + side + undulation;
}

/**
 * Cells with no data: two clipped corners (north-east and south-east), as a surveyed terrain
 * model often has outside its survey limits. Both lie far from the subcatchment.
 */
export function isNodataCell(col: number, row: number): boolean {
  const fromEast = GRID_CELLS - 1 - col;
  const fromSouth = GRID_CELLS - 1 - row;
  return fromEast + row < 24 || fromEast + fromSouth < 16;
}

/** Cell value for the GeoTIFF writer: row 0 is the northern edge, cells are areas. */
export function terrainCell(col: number, row: number): number {
  if (isNodataCell(col, row)) return NODATA;
  const x = (col + 0.5) * CELL_M;
  const y = SITE_SIZE_M - (row + 0.5) * CELL_M;
  return groundElevationM(x, y);
}
