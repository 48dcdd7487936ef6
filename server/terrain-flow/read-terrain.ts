/**
 * A whole terrain GeoTIFF into one float32 grid for routing: the header through the terrain
 * reader (server/geodata/terrain: CRS from the GeoKeys, nodata, vertical unit), the size
 * checked against MAX_CELLS before anything is allocated, then the cells read in bands of whole
 * blocks so a tiled file never sits in memory twice. Nodata (the GDAL_NODATA value, as stored
 * or as float32) becomes NaN.
 */
import { fromFile } from "geotiff";
import { M_PER_FT } from "../../shared/hydrology/units";
import { inspectTerrain } from "../geodata/terrain";
import { checkGridSize } from "./errors";
import type { ElevationGrid } from "./types";

const BAND_ROWS = 512;

export async function readElevationGrid(
  filePath: string,
  verticalUnit: "m" | "ft",
  file = "terrain file",
): Promise<ElevationGrid> {
  const info = await inspectTerrain(filePath, verticalUnit, file);
  const { width, height } = info;
  checkGridSize(width, height, file);
  const z = new Float32Array(width * height);
  const nodata = info.nodata;
  const nodata32 = nodata === null ? null : Math.fround(nodata);
  const tiff = await fromFile(filePath);
  try {
    const image = await tiff.getImage();
    const block = Math.max(1, info.blockHeight);
    const band = Math.max(block, Math.floor(BAND_ROWS / block) * block);
    for (let r0 = 0; r0 < height; r0 += band) {
      const r1 = Math.min(height, r0 + band);
      const [values] = (await image.readRasters({
        window: [0, r0, width, r1],
        samples: [0],
      })) as unknown as ArrayLike<number>[];
      if (!values) throw new Error(`${file}: no cell values in rows ${r0}–${r1}`);
      const at = r0 * width;
      for (let k = 0; k < values.length; k += 1) {
        const v = values[k]!;
        z[at + k] = v === nodata || Math.fround(v) === nodata32 ? Number.NaN : v;
      }
    }
  } finally {
    tiff.close();
  }
  // Pixel-is-point ties the first cell's centre; the grid starts at its outer corner.
  const shift = info.rasterType === "point" ? 0.5 : 0;
  return {
    width,
    height,
    z,
    verticalToM: verticalUnit === "ft" ? M_PER_FT : 1,
    georef: {
      epsg: info.epsg,
      originX: info.originX - shift * info.pixelSizeX,
      originY: info.originY + shift * info.pixelSizeY,
      pixelSizeX: info.pixelSizeX,
      pixelSizeY: info.pixelSizeY,
    },
  };
}
