import { detectFormat } from "../geodata/readers";
import { ReadError, type FileFormat } from "../geodata/readers/types";
import { listZip } from "../geodata/readers/zip";
import { inspectTerrain } from "../geodata/terrain";
import type { LayerKind } from "../../shared/schemas/layers";

const VECTOR_NAMES = "a zipped shapefile, KML, KMZ, GPX or GeoJSON file";

function hasExt(names: readonly string[], ext: string): boolean {
  return names.some((n) => n.toLowerCase().endsWith(ext));
}

/**
 * The checks that are cheap enough to answer in the upload request itself: what the file is
 * (magic bytes), whether it suits the layer kind, the zip's table of contents (bombs, `..`
 * names, missing shapefile parts) and a GeoTIFF's georeferencing. Nothing here inflates or
 * parses the whole file; that is the ingest job's work.
 */
export async function preflight(
  filePath: string,
  originalName: string,
  kind: LayerKind,
  verticalUnit: "m" | "ft" | undefined,
): Promise<FileFormat> {
  const format = await detectFormat(filePath, originalName);
  if (format === "csv") {
    throw new ReadError(
      415,
      "csv-not-a-layer",
      `${originalName}: a CSV file is not a map layer. Upload rainfall tables under Rainfall.`,
      originalName,
    );
  }
  if (kind === "terrain" && format !== "geotiff") {
    throw new ReadError(
      422,
      "kind-format-mismatch",
      `${originalName}: a terrain layer must be a GeoTIFF; this is a ${format} file.`,
      originalName,
    );
  }
  if (kind !== "terrain" && format === "geotiff") {
    throw new ReadError(
      422,
      "kind-format-mismatch",
      `${originalName}: a GeoTIFF can only be a terrain layer; a ${kind} layer takes ${VECTOR_NAMES}.`,
      originalName,
    );
  }
  if (format === "shapefile") {
    const names = await listZip(filePath, originalName);
    const missing = [".shp", ".dbf", ".prj"].filter((ext) => !hasExt(names, ext));
    if (missing.length > 0) {
      const why: Record<string, string> = {
        ".shp": "the geometry",
        ".dbf": "the attributes",
        ".prj": "the coordinate system",
      };
      throw new ReadError(
        422,
        "shapefile-incomplete",
        `${originalName}: the zipped shapefile has no ${missing.join(", ")} file (${missing
          .map((m) => why[m])
          .join(", ")}). Zip the .shp with its .shx, .dbf, .prj (and .cpg) files.`,
        originalName,
      );
    }
  }
  if (format === "kmz") {
    const names = await listZip(filePath, originalName);
    if (!hasExt(names, ".kml")) {
      throw new ReadError(
        422,
        "kmz-without-kml",
        `${originalName}: the KMZ holds no .kml document.`,
        originalName,
      );
    }
  }
  if (format === "geotiff") {
    if (!verticalUnit) {
      throw new ReadError(
        422,
        "vertical-unit-missing",
        `${originalName}: say whether the elevations are in metres or feet (verticalUnit m or ft).`,
        originalName,
      );
    }
    await inspectTerrain(filePath, verticalUnit, originalName);
  }
  return format;
}
