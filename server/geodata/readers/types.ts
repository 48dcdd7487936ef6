/**
 * What every vector file reader returns: features already in WGS84 lon/lat with their
 * attributes, or a ReadError that names the file, the feature or row, and what is wrong.
 */
import type { Feature, Geometry } from "geojson";

export const VECTOR_FORMATS = ["shapefile", "kml", "kmz", "gpx", "geojson"] as const;
export type VectorFormat = (typeof VECTOR_FORMATS)[number];
export type FileFormat = VectorFormat | "geotiff" | "csv";

export interface ReadNote {
  /** e.g. "feature 12" or "row 4" (1-based, as a person counts). */
  readonly where: string;
  readonly message: string;
}

export interface VectorReadResult {
  readonly format: VectorFormat;
  /** Features in file order; geometry in EPSG:4326. */
  readonly features: readonly Feature<Geometry, Record<string, unknown>>[];
  /** Attribute names in the order the file declares them. */
  readonly fields: readonly string[];
  /** What was reprojected or repaired, for the layer's notes. */
  readonly notes: readonly ReadNote[];
  /** Source CRS as read (e.g. "EPSG:26910" or the .prj's name), for the layer's notes. */
  readonly sourceCrs: string;
}

/** A file the app refuses: `status` 400/413/415/422, `where` names file / feature / row. */
export class ReadError extends Error {
  constructor(
    readonly status: 400 | 413 | 415 | 422,
    readonly code: string,
    message: string,
    readonly where?: string,
  ) {
    super(message);
    this.name = "ReadError";
  }
}

/** Progress callback: features (or bytes) done of a total, for the layer's progress bar. */
export type OnProgress = (done: number, total: number) => void;
