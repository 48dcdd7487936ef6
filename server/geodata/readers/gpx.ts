/**
 * GPX 1.1 (Topografix): tracks and routes become lines (a track with several segments a
 * MultiLineString), waypoints points, with name / description / type as attributes
 * (@mapbox/togeojson). Per-vertex times and sensor readings are left out: they describe
 * points, not the feature.
 */
import { readFile } from "node:fs/promises";
import type { Feature, Geometry } from "geojson";
import togeojson from "@mapbox/togeojson";
import { fieldsOf, normalizeFeatures } from "./normalize";
import { ReadError, type OnProgress, type VectorReadResult } from "./types";
import { featureAttributes, parseXml } from "./xml";

const PER_VERTEX = ["coordTimes", "coordinateProperties", "heartRates"];

export async function readGpxFile(
  filePath: string,
  file: string,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  const doc = parseXml(await readFile(filePath, "utf8"), file);
  const root = doc.documentElement?.localName;
  if (root !== "gpx")
    throw new ReadError(422, "not-gpx", `${file}: the XML root is <${root}>, not <gpx>`, file);
  const raw: Feature<Geometry | null, Record<string, unknown>>[] = togeojson
    .gpx(doc)
    .features.map((f) => ({
      type: "Feature",
      geometry: f.geometry,
      properties: featureAttributes(f, PER_VERTEX),
    }));
  const total = raw.length;
  const { features, notes } = normalizeFeatures(
    raw,
    (n) => `${file}, feature ${n}`,
    null,
    (done) => onProgress?.(done, total),
  );
  if (features.length === 0) {
    throw new ReadError(422, "no-features", `${file}: holds no track, route or waypoint`, file);
  }
  return { format: "gpx", features, fields: fieldsOf(features), notes, sourceCrs: "EPSG:4326" };
}
