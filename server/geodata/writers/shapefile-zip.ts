/**
 * Writes a zipped shapefile (.shp, .shx, .dbf, .prj, .cpg under one base name) from features
 * whose coordinates are already in the CRS the .prj describes. Used by the GIS-package export,
 * the demo scenario generator and the test fixtures.
 */
import type { Feature, Geometry } from "geojson";
import { zipSync } from "fflate";
import { encodeShp } from "./shp";
import { CPG_TEXT, encodeDbf, type DbfEncoding } from "./dbf";

export interface ShapefileLayer {
  /** Base name of the files inside the zip (letters, digits, - and _ are kept). */
  readonly name: string;
  readonly features: readonly Feature<Geometry | null, Record<string, unknown> | null>[];
  /** WKT of the features' CRS, written as the .prj (see prj.ts for common codes). */
  readonly prjWkt: string;
  /** Code page of the .dbf text, named in the .cpg. Default UTF-8. */
  readonly encoding?: DbfEncoding;
  /** Date stamped in the .dbf header and the zip entries; now by default (fixed for fixtures). */
  readonly date?: Date;
}

/** The five member files by name, for callers that need to leave one out or add one. */
export function shapefileFiles(layer: ShapefileLayer): Record<string, Uint8Array> {
  const base = layer.name.replace(/[^A-Za-z0-9_-]/g, "_") || "layer";
  const encoding = layer.encoding ?? "UTF-8";
  const { shp, shx } = encodeShp(layer.features.map((f) => f.geometry));
  const text = new TextEncoder();
  return {
    [`${base}.shp`]: shp,
    [`${base}.shx`]: shx,
    [`${base}.dbf`]: encodeDbf(
      layer.features.map((f) => f.properties ?? {}),
      encoding,
      layer.date,
    ),
    [`${base}.prj`]: text.encode(layer.prjWkt),
    [`${base}.cpg`]: text.encode(CPG_TEXT[encoding]),
  };
}

/** The zip archive's bytes (deflate). */
export function shapefileZip(layer: ShapefileLayer): Uint8Array {
  return zipSync(shapefileFiles(layer), { level: 6, mtime: layer.date ?? new Date() });
}
