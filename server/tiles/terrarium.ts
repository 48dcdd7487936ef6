/**
 * Terrarium encoding of elevations in RGB, as maplibre's raster-dem source reads it with
 * `encoding: "terrarium"`: height = R·256 + G + B/256 − 32768 metres, so the resolution is
 * 1/256 m. Cells without an elevation get alpha 0 and, so that the hillshade shows no cliff at
 * the edge of the data, the value of the nearest cell that has one (along the row, else along
 * the column); maplibre decodes RGB only.
 */
import { PNG } from "pngjs";

const OFFSET_M = 32768;

export function terrariumRgb(elevationM: number): [number, number, number] {
  const w = Math.min(Math.max(Math.round((elevationM + OFFSET_M) * 256), 0), 0xffffff);
  return [w >> 16, (w >> 8) & 255, w & 255];
}

export function fromTerrarium(r: number, g: number, b: number): number {
  return r * 256 + g + b / 256 - OFFSET_M;
}

/** Index of the nearest non-null entry of each run of `count` values (stride apart), or -1. */
function nearestKnown(values: (number | null)[], first: number, stride: number, count: number) {
  const nearest = new Array<number>(count).fill(-1);
  let last = -1;
  for (let k = 0; k < count; k += 1) {
    if (values[first + k * stride] !== null) last = k;
    nearest[k] = last;
  }
  last = -1;
  for (let k = count - 1; k >= 0; k -= 1) {
    if (values[first + k * stride] !== null) last = k;
    const before = nearest[k] ?? -1;
    if (last >= 0 && (before < 0 || last - k < k - before)) nearest[k] = last;
  }
  return nearest;
}

/** Fills nulls in place from the nearest value in the row; rows with none, along the column. */
function fillGaps(values: (number | null)[], size: number): void {
  const original = [...values];
  for (let r = 0; r < size; r += 1) {
    const nearest = nearestKnown(original, r * size, 1, size);
    for (let c = 0; c < size; c += 1) {
      const from = nearest[c] ?? -1;
      if (from >= 0) values[r * size + c] = original[r * size + from] ?? null;
    }
  }
  const rowsDone = [...values];
  for (let c = 0; c < size; c += 1) {
    const nearest = nearestKnown(rowsDone, c, size, size);
    for (let r = 0; r < size; r += 1) {
      const from = nearest[r] ?? -1;
      if (from >= 0) values[r * size + c] = rowsDone[from * size + c] ?? null;
    }
  }
}

/** A size × size PNG of terrarium-encoded elevations (row-major, north row first). */
export function terrariumPng(elevationsM: readonly (number | null)[], size: number): Buffer {
  const png = new PNG({ width: size, height: size, colorType: 6 });
  const filled = [...elevationsM];
  fillGaps(filled, size);
  for (let k = 0; k < size * size; k += 1) {
    const [r, g, b] = terrariumRgb(filled[k] ?? 0);
    png.data[4 * k] = r;
    png.data[4 * k + 1] = g;
    png.data[4 * k + 2] = b;
    png.data[4 * k + 3] = elevationsM[k] === null ? 0 : 255;
  }
  // "Sub" filtering suits smooth ground and halves the encoding time of adaptive filtering.
  return PNG.sync.write(png, { filterType: 1 });
}
