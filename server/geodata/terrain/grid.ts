/**
 * Bilinear elevations at many raster positions at once (a map tile's pixels): the same rule as
 * the per-point sampler — half a cell beyond the outer centres the edge value is held, further
 * out or next to a nodata cell there is no elevation — but the blocks a band of rows needs are
 * fetched up front into a plain array, and cells are then read from typed arrays with no cache
 * lookups. Bands hold at most about CACHE_BLOCKS blocks, so memory stays bounded on coarse tiles.
 */
import { bilinear } from "../../../shared/geo/bilinear";
import { CACHE_BLOCKS, type RasterBlocks } from "./blocks";
import type { TerrainInfo } from "./types";

interface Band {
  bx0: number;
  by0: number;
  bx1: number;
  by1: number;
}

/**
 * Clamps (col, row) in place to the cells' centre span, or sets NaN outside the half-cell margin.
 * Returns the sample rows' block ranges (by0, by1, bx0, bx1 of the 2 × 2 neighbourhoods).
 */
function clampAndRange(
  info: TerrainInfo,
  blocks: RasterBlocks,
  cols: Float64Array,
  rows: Float64Array,
  samplesPerRow: number,
) {
  const { width, height } = info;
  const rowCount = cols.length / samplesPerRow;
  const range = new Int32Array(4 * rowCount).fill(-1);
  for (let j = 0; j < rowCount; j += 1) {
    let [bx0, by0, bx1, by1] = [Infinity, Infinity, -Infinity, -Infinity];
    for (let k = j * samplesPerRow; k < (j + 1) * samplesPerRow; k += 1) {
      const col = cols[k]!;
      const row = rows[k]!;
      if (!(col >= -0.5 && row >= -0.5 && col <= width - 0.5 && row <= height - 0.5)) {
        cols[k] = Number.NaN;
        continue;
      }
      const c = Math.min(Math.max(col, 0), width - 1);
      const r = Math.min(Math.max(row, 0), height - 1);
      cols[k] = c;
      rows[k] = r;
      const c0 = Math.min(Math.floor(c), Math.max(width - 2, 0));
      const r0 = Math.min(Math.floor(r), Math.max(height - 2, 0));
      bx0 = Math.min(bx0, Math.floor(c0 / blocks.bw));
      bx1 = Math.max(bx1, Math.floor(Math.min(c0 + 1, width - 1) / blocks.bw));
      by0 = Math.min(by0, Math.floor(r0 / blocks.bh));
      by1 = Math.max(by1, Math.floor(Math.min(r0 + 1, height - 1) / blocks.bh));
    }
    if (bx0 <= bx1) range.set([bx0, by0, bx1, by1], 4 * j);
  }
  return range;
}

const blockCount = (b: Band) => (b.bx1 - b.bx0 + 1) * (b.by1 - b.by0 + 1);

/** Elevations in metres (NaN where none) at raster positions, row-major `samplesPerRow` wide. */
export async function elevationsAtCells(
  info: TerrainInfo,
  blocks: RasterBlocks,
  cols: Float64Array,
  rows: Float64Array,
  samplesPerRow: number,
  toMetres: number,
): Promise<Float64Array> {
  const out = new Float64Array(cols.length).fill(Number.NaN);
  const range = clampAndRange(info, blocks, cols, rows, samplesPerRow);
  const rowCount = cols.length / samplesPerRow;
  for (let first = 0; first < rowCount;) {
    let band: Band | null = null;
    let last = first;
    for (; last < rowCount; last += 1) {
      if (range[4 * last]! < 0) continue;
      const [bx0, by0, bx1, by1] = range.subarray(4 * last, 4 * last + 4);
      const grown: Band = band
        ? {
            bx0: Math.min(band.bx0, bx0!),
            by0: Math.min(band.by0, by0!),
            bx1: Math.max(band.bx1, bx1!),
            by1: Math.max(band.by1, by1!),
          }
        : { bx0: bx0!, by0: by0!, bx1: bx1!, by1: by1! };
      if (band && blockCount(grown) > CACHE_BLOCKS) break;
      band = grown;
    }
    if (band)
      await sampleBand(info, blocks, band, cols, rows, out, first, last, samplesPerRow, toMetres);
    first = last;
  }
  return out;
}

async function sampleBand(
  info: TerrainInfo,
  blocks: RasterBlocks,
  band: Band,
  cols: Float64Array,
  rows: Float64Array,
  out: Float64Array,
  firstRow: number,
  endRow: number,
  samplesPerRow: number,
  toMetres: number,
): Promise<void> {
  const { width, height, nodata } = info;
  const nodata32 = nodata === null ? null : Math.fround(nodata);
  const { bw, bh } = blocks;
  const across = band.bx1 - band.bx0 + 1;
  const table: ArrayLike<number>[] = [];
  const widths: number[] = [];
  for (let by = band.by0; by <= band.by1; by += 1) {
    for (let bx = band.bx0; bx <= band.bx1; bx += 1) {
      const key = by * blocks.across + bx;
      table.push(await blocks.get(key));
      widths.push(blocks.widthOf(key));
    }
  }
  const cell = (col: number, row: number): number | null => {
    const bx = Math.floor(col / bw);
    const by = Math.floor(row / bh);
    const t = (by - band.by0) * across + (bx - band.bx0);
    const v = table[t]![(row - by * bh) * widths[t]! + (col - bx * bw)];
    if (v === undefined || Number.isNaN(v) || v === nodata || v === nodata32) return null;
    return v;
  };
  for (let k = firstRow * samplesPerRow; k < endRow * samplesPerRow; k += 1) {
    const c = cols[k]!;
    if (Number.isNaN(c)) continue;
    const r = rows[k]!;
    const c0 = Math.min(Math.floor(c), Math.max(width - 2, 0));
    const r0 = Math.min(Math.floor(r), Math.max(height - 2, 0));
    const c1 = Math.min(c0 + 1, width - 1);
    const r1 = Math.min(r0 + 1, height - 1);
    const z = bilinear(cell(c0, r0), cell(c1, r0), cell(c0, r1), cell(c1, r1), c - c0, r - r0);
    if (z !== null) out[k] = z * toMetres;
  }
}
