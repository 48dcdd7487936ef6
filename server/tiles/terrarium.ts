/**
 * Terrarium encoding of elevations in RGB, as maplibre's raster-dem source reads it with
 * `encoding: "terrarium"`: height = R·256 + G + B/256 − 32768 metres, so the resolution is
 * 1/256 m. Cells without an elevation get alpha 0 and, so that the hillshade shows no cliff at
 * the edge of the data, the value of the nearest cell that has one (along the row, else along
 * the column); maplibre decodes RGB only.
 */
import { PNG } from "pngjs";

const OFFSET_M = 32768;
export const PNG_DEFLATE_LEVEL = 1;

export function terrariumRgb(elevationM: number): [number, number, number] {
  const w = Math.min(Math.max(Math.round((elevationM + OFFSET_M) * 256), 0), 0xffffff);
  return [w >> 16, (w >> 8) & 255, w & 255];
}

export function fromTerrarium(r: number, g: number, b: number): number {
  return r * 256 + g + b / 256 - OFFSET_M;
}

/** Index of the nearest known entry of each run of `count` values (stride apart), or -1. */
function nearestKnown(values: Float64Array, first: number, stride: number, count: number) {
  const nearest = new Int32Array(count).fill(-1);
  let last = -1;
  for (let k = 0; k < count; k += 1) {
    if (!Number.isNaN(values[first + k * stride]!)) last = k;
    nearest[k] = last;
  }
  last = -1;
  for (let k = count - 1; k >= 0; k -= 1) {
    if (!Number.isNaN(values[first + k * stride]!)) last = k;
    const before = nearest[k]!;
    if (last >= 0 && (before < 0 || last - k < k - before)) nearest[k] = last;
  }
  return nearest;
}

/** Fills NaNs from the nearest value in the row; rows with none, along the column. */
function fillGaps(values: Float64Array, size: number): Float64Array {
  const rowsDone = Float64Array.from(values);
  for (let r = 0; r < size; r += 1) {
    const nearest = nearestKnown(values, r * size, 1, size);
    for (let c = 0; c < size; c += 1) {
      const from = nearest[c]!;
      if (from >= 0) rowsDone[r * size + c] = values[r * size + from]!;
    }
  }
  const filled = Float64Array.from(rowsDone);
  for (let c = 0; c < size; c += 1) {
    const nearest = nearestKnown(rowsDone, c, size, size);
    for (let r = 0; r < size; r += 1) {
      const from = nearest[r]!;
      if (from >= 0) filled[r * size + c] = rowsDone[from * size + c]!;
    }
  }
  return filled;
}

/**
 * A size × size PNG of terrarium-encoded elevations (row-major, north row first, NaN where there
 * is none).
 */
export function terrariumPng(elevationsM: Float64Array, size: number): Buffer {
  const png = new PNG({ width: size, height: size, colorType: 6 });
  const filled = elevationsM.some(Number.isNaN) ? fillGaps(elevationsM, size) : elevationsM;
  const data = png.data;
  for (let k = 0; k < size * size; k += 1) {
    const z = filled[k]!;
    // terrariumRgb inlined: this loop runs 65,536 times a tile.
    const w = Number.isNaN(z)
      ? OFFSET_M * 256
      : Math.min(Math.max(Math.round((z + OFFSET_M) * 256), 0), 0xffffff);
    data[4 * k] = w >> 16;
    data[4 * k + 1] = (w >> 8) & 255;
    data[4 * k + 2] = w & 255;
    data[4 * k + 3] = Number.isNaN(elevationsM[k]!) ? 0 : 255;
  }
  // "Sub" filtering suits smooth ground. zlib level 1 with the default strategy encodes a full
  // demo tile faster and a third smaller than pngjs's default (level 9, run-length only); the
  // "terrain tile parts" bench compares them.
  return PNG.sync.write(png, {
    filterType: 1,
    deflateLevel: PNG_DEFLATE_LEVEL,
    deflateStrategy: 0,
  });
}
