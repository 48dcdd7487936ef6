// Writers of the geodata files Rillmark produces (exports, demo scenario, test fixtures).
export { shapefileFiles, shapefileZip, type ShapefileLayer } from "./shapefile-zip";
export { prjForEpsg } from "./prj";
export type { DbfEncoding } from "./dbf";
export {
  geoTiffBytes,
  geoTiffChunks,
  writeGeoTiff,
  type GeoTiffGeoreference,
  type GeoTiffSpec,
} from "./geotiff";
