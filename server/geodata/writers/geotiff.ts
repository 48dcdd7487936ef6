/**
 * Writes a georeferenced, single-band float32 GeoTIFF (TIFF 6.0 with the OGC GeoTIFF 1.1 tags):
 * tiled, uncompressed, little-endian, north-up (ModelTiepoint + ModelPixelScale), the CRS as an
 * EPSG code in the GeoKeys, and nodata in the GDAL_NODATA tag. Cells are produced tile by tile
 * from a function or an array, so a file of hundreds of megabytes never sits in memory whole.
 *
 * geotiff.js can write only a single strip from a whole in-memory array, hence this writer.
 */
import { open } from "node:fs/promises";

export interface GeoTiffGeoreference {
  /** EPSG code of the horizontal CRS, e.g. 26910 (NAD83 / UTM 10N) or 4326. */
  readonly epsg: number;
  /** Whether the code is a geographic (lon/lat) or a projected CRS; inferred when absent. */
  readonly modelType?: "geographic" | "projected";
  /** Map coordinates of the outer top-left corner of the top-left cell. */
  readonly originX: number;
  readonly originY: number;
  /** Cell size in CRS units; both positive (rows go south). */
  readonly pixelSizeX: number;
  readonly pixelSizeY: number;
  /** GTRasterTypeGeoKey: cells are areas (default) or points at the tie point. */
  readonly rasterType?: "area" | "point";
}

export interface GeoTiffSpec {
  readonly width: number;
  readonly height: number;
  /** null writes a plain TIFF with no GeoKeys and no tie point (a bad-file fixture). */
  readonly georeference: GeoTiffGeoreference | null;
  readonly nodata?: number | null;
  /** Tile edge in cells, a multiple of 16 (TIFF 6.0, section 15). Default 256. */
  readonly tileSize?: number;
  /** Cell value by column and row (0-based from the top-left), or values in row-major order. */
  readonly values: ((col: number, row: number) => number) | Float32Array;
}

const TYPE = { SHORT: 3, LONG: 4, ASCII: 2, DOUBLE: 12 } as const;
const TYPE_SIZE: Record<number, number> = { 2: 1, 3: 2, 4: 4, 12: 8 };

interface Entry {
  readonly tag: number;
  readonly type: number;
  readonly values: readonly number[] | string;
}

/** EPSG 4000–4999 are geographic 2D CRSs (EPSG registry convention); the rest here projected. */
function inferModelType(epsg: number): "geographic" | "projected" {
  return epsg >= 4000 && epsg < 5000 ? "geographic" : "projected";
}

function geoEntries(geo: GeoTiffGeoreference): Entry[] {
  const modelType = geo.modelType ?? inferModelType(geo.epsg);
  // GeoKeyDirectory: header (version 1, revision 1.0, key count) then sorted keys
  // (id, location 0 = value inline, count 1, value). OGC GeoTIFF 1.1, section 7.1.
  const keys: Array<[number, number]> = [
    [1024, modelType === "geographic" ? 2 : 1], // GTModelTypeGeoKey
    [1025, geo.rasterType === "point" ? 2 : 1], // GTRasterTypeGeoKey
    modelType === "geographic" ? [2048, geo.epsg] : [3072, geo.epsg], // Geographic / ProjectedCRS
  ];
  const directory = [1, 1, 0, keys.length, ...keys.flatMap(([id, v]) => [id, 0, 1, v])];
  return [
    { tag: 33550, type: TYPE.DOUBLE, values: [geo.pixelSizeX, geo.pixelSizeY, 0] },
    { tag: 33922, type: TYPE.DOUBLE, values: [0, 0, 0, geo.originX, geo.originY, 0] },
    { tag: 34735, type: TYPE.SHORT, values: directory },
  ];
}

function checkSpec(spec: GeoTiffSpec, tile: number): void {
  if (!(Number.isInteger(spec.width) && spec.width > 0 && Number.isInteger(spec.height))) {
    throw new RangeError("GeoTIFF width and height must be positive integers");
  }
  if (spec.height <= 0) throw new RangeError("GeoTIFF height must be a positive integer");
  if (!(Number.isInteger(tile) && tile >= 16 && tile % 16 === 0)) {
    throw new RangeError("GeoTIFF tile size must be a multiple of 16");
  }
  if (spec.values instanceof Float32Array && spec.values.length !== spec.width * spec.height) {
    throw new RangeError(
      `GeoTIFF values: ${spec.values.length} cells for ${spec.width} × ${spec.height}`,
    );
  }
  const geo = spec.georeference;
  if (geo !== null && !(geo.pixelSizeX > 0 && geo.pixelSizeY > 0)) {
    throw new RangeError("GeoTIFF pixel sizes must be positive");
  }
}

/** The IFD and its out-of-line values, laid out as if it began at byte `start` of the file. */
function encodeDirectory(entries: Entry[], start: number): Uint8Array {
  entries.sort((a, b) => a.tag - b.tag);
  const ifdSize = 2 + entries.length * 12 + 4;
  const extraSizes = entries.map((e) => {
    const n = typeof e.values === "string" ? e.values.length + 1 : e.values.length;
    const bytes = n * (TYPE_SIZE[e.type] ?? 0);
    return bytes > 4 ? bytes + (bytes % 2) : 0;
  });
  const total = ifdSize + extraSizes.reduce((a, b) => a + b, 0);
  const out = new Uint8Array(total);
  const view = new DataView(out.buffer);
  view.setUint16(0, entries.length, true);
  let extra = ifdSize;
  entries.forEach((e, i) => {
    const at = 2 + i * 12;
    const count = typeof e.values === "string" ? e.values.length + 1 : e.values.length;
    view.setUint16(at, e.tag, true);
    view.setUint16(at + 2, e.type, true);
    view.setUint32(at + 4, count, true);
    const inline = (extraSizes[i] ?? 0) === 0;
    const base = inline ? at + 8 : extra;
    if (!inline) {
      view.setUint32(at + 8, start + extra, true);
      extra += extraSizes[i] ?? 0;
    }
    writeValues(view, base, e);
  });
  view.setUint32(2 + entries.length * 12, 0, true); // no next IFD
  return out;
}

function writeValues(view: DataView, base: number, e: Entry): void {
  if (typeof e.values === "string") {
    for (let k = 0; k < e.values.length; k += 1) view.setUint8(base + k, e.values.charCodeAt(k));
    view.setUint8(base + e.values.length, 0);
    return;
  }
  e.values.forEach((v, k) => {
    if (e.type === TYPE.SHORT) view.setUint16(base + k * 2, v, true);
    else if (e.type === TYPE.LONG) view.setUint32(base + k * 4, v, true);
    else view.setFloat64(base + k * 8, v, true);
  });
}

/** The whole file as chunks: header + directory first, then one chunk per tile. */
export function* geoTiffChunks(spec: GeoTiffSpec): Generator<Uint8Array> {
  const tile = spec.tileSize ?? 256;
  checkSpec(spec, tile);
  const across = Math.ceil(spec.width / tile);
  const down = Math.ceil(spec.height / tile);
  const tileBytes = tile * tile * 4;
  const count = across * down;
  const entriesWith = (offsets: number[]): Entry[] => [
    { tag: 256, type: TYPE.LONG, values: [spec.width] },
    { tag: 257, type: TYPE.LONG, values: [spec.height] },
    { tag: 258, type: TYPE.SHORT, values: [32] }, // BitsPerSample
    { tag: 259, type: TYPE.SHORT, values: [1] }, // Compression: none
    { tag: 262, type: TYPE.SHORT, values: [1] }, // Photometric: BlackIsZero
    { tag: 277, type: TYPE.SHORT, values: [1] }, // SamplesPerPixel
    { tag: 284, type: TYPE.SHORT, values: [1] }, // PlanarConfiguration: chunky
    { tag: 322, type: TYPE.LONG, values: [tile] }, // TileWidth
    { tag: 323, type: TYPE.LONG, values: [tile] }, // TileLength
    { tag: 324, type: TYPE.LONG, values: offsets }, // TileOffsets
    { tag: 325, type: TYPE.LONG, values: new Array<number>(count).fill(tileBytes) },
    { tag: 339, type: TYPE.SHORT, values: [3] }, // SampleFormat: IEEE float
    ...(spec.georeference === null ? [] : geoEntries(spec.georeference)),
    ...(spec.nodata === undefined || spec.nodata === null
      ? []
      : [{ tag: 42113, type: TYPE.ASCII, values: String(spec.nodata) }]),
  ];
  // The directory's size does not depend on the offsets' values: lay it out once to learn it.
  const dirSize = encodeDirectory(entriesWith(new Array<number>(count).fill(0)), 8).length;
  const firstTile = Math.ceil((8 + dirSize) / 4) * 4;
  if (firstTile + count * tileBytes > 0xffffffff) {
    throw new RangeError("GeoTIFF over 4 GB: this writer does not write BigTIFF");
  }
  const offsets = Array.from({ length: count }, (_, k) => firstTile + k * tileBytes);
  const directory = encodeDirectory(entriesWith(offsets), 8);
  const head = new Uint8Array(firstTile);
  head.set([0x49, 0x49, 42, 0]); // "II", 42: little-endian classic TIFF
  new DataView(head.buffer).setUint32(4, 8, true);
  head.set(directory, 8);
  yield head;
  const at =
    typeof spec.values === "function"
      ? spec.values
      : (c: number, r: number) => (spec.values as Float32Array)[r * spec.width + c] ?? Number.NaN;
  const fill = spec.nodata ?? 0;
  for (let ty = 0; ty < down; ty += 1) {
    for (let tx = 0; tx < across; tx += 1) {
      const cells = new Float32Array(tile * tile);
      for (let r = 0; r < tile; r += 1) {
        const row = ty * tile + r;
        for (let c = 0; c < tile; c += 1) {
          const col = tx * tile + c;
          // Edge tiles are padded to full size (TIFF 6.0); padding holds nodata.
          cells[r * tile + c] = row < spec.height && col < spec.width ? at(col, row) : fill;
        }
      }
      yield new Uint8Array(cells.buffer);
    }
  }
}

/** The file in memory (small rasters: fixtures, demo data). */
export function geoTiffBytes(spec: GeoTiffSpec): Uint8Array {
  const chunks = [...geoTiffChunks(spec)];
  const out = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
  let at = 0;
  for (const chunk of chunks) {
    out.set(chunk, at);
    at += chunk.length;
  }
  return out;
}

/** Streams the file to disk in batches of ~4 MB; memory stays near one batch. */
export async function writeGeoTiff(filePath: string, spec: GeoTiffSpec): Promise<void> {
  const handle = await open(filePath, "w");
  try {
    let batch: Uint8Array[] = [];
    let size = 0;
    for (const chunk of geoTiffChunks(spec)) {
      batch.push(chunk);
      size += chunk.length;
      if (size >= 4 * 1024 * 1024) {
        await handle.writev(batch);
        batch = [];
        size = 0;
      }
    }
    if (batch.length > 0) await handle.writev(batch);
  } finally {
    await handle.close();
  }
}
