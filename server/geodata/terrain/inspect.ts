/**
 * Reads a terrain GeoTIFF's header (never its cells): size, georeferencing from
 * ModelTiepoint + ModelPixelScale or a ModelTransformation without rotation, the CRS from the
 * GeoKeys (OGC GeoTIFF 1.1: ProjectedCSTypeGeoKey / GeographicTypeGeoKey), nodata from the
 * GDAL_NODATA tag, and the extent in WGS84.
 */
import { fromFile, type GeoTIFFImage } from "geotiff";
import proj4 from "proj4";
import { ReadError } from "../readers/types";
import { knownCrs } from "./crs";
import type { TerrainInfo } from "./types";

const USER_DEFINED = 32767;

function fail(file: string, code: string, message: string): never {
  throw new ReadError(422, code, `${file}: ${message}`, file);
}

function epsgOf(image: GeoTIFFImage, file: string): number {
  const keys = image.getGeoKeys() as Record<string, number | undefined> | null;
  const code = keys?.ProjectedCSTypeGeoKey ?? keys?.GeographicTypeGeoKey;
  if (code === undefined)
    fail(
      file,
      "terrain-no-crs",
      "has no coordinate system in its GeoKeys; export it again with an EPSG code",
    );
  if (code === USER_DEFINED) {
    fail(
      file,
      "terrain-custom-crs",
      "uses a user-defined coordinate system; reproject it to an EPSG code (e.g. the local UTM zone)",
    );
  }
  return code;
}

/** North-up geotransform; a rotated or sheared raster is refused (reproject it north-up). */
function geotransform(image: GeoTIFFImage, file: string) {
  const dir = image.fileDirectory;
  const matrix = dir.getValue("ModelTransformation") as number[] | undefined;
  if (matrix !== undefined) {
    if ((matrix[1] ?? 0) !== 0 || (matrix[4] ?? 0) !== 0) {
      fail(
        file,
        "terrain-rotated",
        "is rotated; Rillmark reads north-up rasters — warp it north-up first",
      );
    }
    return {
      originX: matrix[3] ?? 0,
      originY: matrix[7] ?? 0,
      sx: matrix[0] ?? 0,
      sy: -(matrix[5] ?? 0),
    };
  }
  const [originX = 0, originY = 0] = image.getOrigin();
  const [sx = 0, sy = 0] = image.getResolution();
  return { originX, originY, sx, sy: -sy };
}

function bbox4326(
  toLonLat: (x: number, y: number) => [number, number],
  x0: number,
  y0: number,
  x1: number,
  y1: number,
) {
  // Edges sampled, not only corners: a projected rectangle's edges bow in lon/lat.
  const steps = 16;
  let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
  for (let k = 0; k <= steps; k += 1) {
    const t = k / steps;
    for (const [x, y] of [
      [x0 + (x1 - x0) * t, y0],
      [x0 + (x1 - x0) * t, y1],
      [x0, y0 + (y1 - y0) * t],
      [x1, y0 + (y1 - y0) * t],
    ] as const) {
      const [lon, lat] = toLonLat(x, y);
      [w, s, e, n] = [Math.min(w, lon), Math.min(s, lat), Math.max(e, lon), Math.max(n, lat)];
    }
  }
  return [w, s, e, n] as const;
}

export async function inspectTerrain(
  filePath: string,
  verticalUnit: "m" | "ft",
  file = "terrain file",
): Promise<TerrainInfo> {
  let tiff;
  try {
    tiff = await fromFile(filePath);
  } catch {
    return fail(file, "terrain-unreadable", "is not a readable TIFF");
  }
  try {
    const image = await tiff
      .getImage()
      .catch(() => fail(file, "terrain-unreadable", "is not a readable TIFF"));
    const dir = image.fileDirectory;
    const georeferenced = dir.hasTag("ModelTiepoint") || dir.hasTag("ModelTransformation");
    if (image.getGeoKeys() === null || !georeferenced) {
      fail(
        file,
        "terrain-not-georeferenced",
        "has no georeferencing (no GeoKeys / tie points); export it again as a GeoTIFF with its coordinate system",
      );
    }
    const epsg = epsgOf(image, file);
    const crs = knownCrs(epsg);
    if (crs === null) {
      fail(
        file,
        "terrain-unknown-crs",
        `is in EPSG:${epsg}, which Rillmark does not read yet; reproject it to WGS 84 or a UTM zone (WGS 84, NAD83 or ETRS89)`,
      );
    }
    const { originX, originY, sx, sy } = geotransform(image, file);
    if (!(sx > 0 && sy > 0))
      fail(file, "terrain-bad-transform", "has a zero or flipped pixel size; export it north-up");
    const keys = image.getGeoKeys() as Record<string, number | undefined>;
    const rasterType = keys.GTRasterTypeGeoKey === 2 ? "point" : "area";
    const width = image.getWidth();
    const height = image.getHeight();
    // Outer edges of the outer cells, in map units.
    const half = rasterType === "point" ? 0.5 : 0;
    const x0 = originX - half * sx;
    const y0 = originY + half * sy;
    const convert = crs.geographic ? null : proj4(crs.proj4, "EPSG:4326");
    const toLonLat = (x: number, y: number): [number, number] => {
      const out = convert ? convert.forward([x, y]) : [x, y];
      return [out[0] ?? Number.NaN, out[1] ?? Number.NaN];
    };
    const box = bbox4326(toLonLat, x0, y0, x0 + width * sx, y0 - height * sy);
    if (!(
      Math.abs(box[0]) <= 180 &&
      Math.abs(box[2]) <= 180 &&
      Math.abs(box[1]) <= 90 &&
      Math.abs(box[3]) <= 90
    )) {
      fail(
        file,
        "terrain-outside-wgs84",
        `its extent falls outside WGS84 longitude/latitude in EPSG:${epsg}; is the coordinate system right?`,
      );
    }
    return {
      epsg,
      crsName: crs.name,
      width,
      height,
      originX,
      originY,
      pixelSizeX: sx,
      pixelSizeY: sy,
      rasterType,
      nodata: image.getGDALNoData(),
      verticalUnit,
      bbox4326: box,
      blockWidth: image.getTileWidth(),
      blockHeight: image.getTileHeight(),
      tiled: image.isTiled,
    };
  } finally {
    tiff.close();
  }
}
