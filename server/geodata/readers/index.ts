/**
 * The file readers: detect an upload's format, read vector layers to WGS84 features, read
 * rainfall tables. Terrain (GeoTIFF) is read in ../terrain.
 */
import { readGeoJsonFile } from "./geojson";
import { readGpxFile } from "./gpx";
import { readKmlFile, readKmzFile } from "./kml";
import { readShapefileZip } from "./shapefile";
import type { OnProgress, VectorFormat, VectorReadResult } from "./types";

export { detectFormat } from "./detect";
export { readRainfallCsv, type RainfallCsvResult } from "./rainfall-csv";
export { ZIP_LIMITS, type ZipLimits } from "./zip";
export * from "./types";

/** Reads a vector file of a known format; `originalName` names the file in every message. */
export async function readVectorFile(
  filePath: string,
  format: VectorFormat,
  originalName: string,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  switch (format) {
    case "shapefile":
      return readShapefileZip(filePath, originalName, onProgress);
    case "kml":
      return readKmlFile(filePath, originalName, onProgress);
    case "kmz":
      return readKmzFile(filePath, originalName, onProgress);
    case "gpx":
      return readGpxFile(filePath, originalName, onProgress);
    case "geojson":
      return readGeoJsonFile(filePath, originalName, onProgress);
  }
}
