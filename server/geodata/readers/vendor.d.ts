// Types for the parts of shpjs and @mapbox/togeojson that the readers call (they ship none).
declare module "shpjs" {
  import type { Geometry } from "geojson";
  /** Parses .shp bytes; with a proj4-readable WKT it reprojects (the readers pass none). */
  export function parseShp(shp: ArrayBuffer | ArrayBufferView, prj?: string): (Geometry | null)[];
  /** Parses .dbf bytes, decoding text with the .cpg's code page (UTF-8 when absent). */
  export function parseDbf(
    dbf: ArrayBuffer | ArrayBufferView,
    cpg?: string,
  ): Record<string, string | number | boolean | Date>[];
}

declare module "@mapbox/togeojson" {
  import type { FeatureCollection, Geometry } from "geojson";
  type Collection = FeatureCollection<Geometry | null, Record<string, unknown> | null>;
  // A UMD bundle: Node's ESM loader sees only its default export.
  const togeojson: { kml(doc: Document): Collection; gpx(doc: Document): Collection };
  export default togeojson;
}
