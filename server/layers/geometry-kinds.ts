import type { Feature, Geometry } from "geojson";
import { ReadError } from "../geodata/readers/types";
import { findUnstorableText } from "../http/request-checks";

const POLYGONAL = new Set(["Polygon", "MultiPolygon"]);
const LINEAR = new Set(["LineString", "MultiLineString"]);

/** Channel layers are lines; cover, soil and boundary layers are areas. */
export function checkGeometryTypes(
  kind: string,
  fileName: string,
  features: readonly Feature<Geometry, Record<string, unknown>>[],
): void {
  const allowed = kind === "channel" ? LINEAR : POLYGONAL;
  const wanted = kind === "channel" ? "lines" : "polygons";
  const index = features.findIndex((f) => !allowed.has(f.geometry.type));
  const bad = features[index];
  if (!bad) return;
  throw new ReadError(
    422,
    "wrong-geometry-type",
    `${fileName}: feature ${index + 1} is a ${bad.geometry.type}; a ${kind} layer takes ${wanted} only.`,
    `feature ${index + 1}`,
  );
}

/**
 * Attribute names and values PostgreSQL can store (jsonb holds no NUL; an unpaired surrogate has
 * no UTF-8 form): the first that cannot is refused by feature and attribute, not left to fail
 * the insert as a server error.
 */
export function checkStorableAttributes(
  fileName: string,
  features: readonly Feature<Geometry, Record<string, unknown>>[],
): void {
  for (const [index, f] of features.entries()) {
    const field = findUnstorableText(f.properties ?? {});
    if (field === undefined) continue;
    throw new ReadError(
      422,
      "unstorable-text",
      `${fileName}: feature ${index + 1}, attribute "${field.replace(/[^\x20-\x7e]/g, "?")}": ` +
        "contains a NUL or an unpaired surrogate, which cannot be stored. Remove it and upload again.",
      `feature ${index + 1}`,
    );
  }
}

/** Rows per INSERT statement: one JSON text parameter each. */
export const INSERT_BATCH = 2000;

/**
 * The features as UTF-8 JSON of at most INSERT_BATCH rows ({ i, g, a }: position, geometry,
 * attributes), made in the reader thread and handed over without a copy (transferred), so the
 * HTTP thread only passes text to PostgreSQL.
 */
export function insertBatches(
  features: readonly Feature<Geometry, Record<string, unknown>>[],
): Uint8Array[] {
  const encoder = new TextEncoder();
  const batches: Uint8Array[] = [];
  for (let start = 0; start < features.length; start += INSERT_BATCH) {
    const rows = features.slice(start, start + INSERT_BATCH).map((f, k) => ({
      i: start + k,
      g: f.geometry,
      a: f.properties ?? {},
    }));
    batches.push(encoder.encode(JSON.stringify(rows)));
  }
  return batches;
}
