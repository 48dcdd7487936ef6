/**
 * KML and KMZ (OGC KML 2.2): every Placemark with a geometry becomes a feature, with its name,
 * description and simple ExtendedData values as attributes (@mapbox/togeojson). A KMZ is a zip
 * holding doc.kml (or, failing that, one .kml file), read through the same zip defences.
 */
import { readFile } from "node:fs/promises";
import type { Feature, Geometry } from "geojson";
import togeojson from "@mapbox/togeojson";
import { fieldsOf, normalizeFeatures } from "./normalize";
import { ReadError, type OnProgress, type ReadNote, type VectorReadResult } from "./types";
import { featureAttributes, flattenCollection, parseXml } from "./xml";
import { readZipMembers } from "./zip";

// Styling attributes togeojson copies from <Style>; they say how it looked, not what it is.
const STYLE_KEYS = [
  "styleUrl",
  "styleHash",
  "styleMapHash",
  "stroke",
  "stroke-opacity",
  "stroke-width",
  "fill",
  "fill-opacity",
  "icon",
];

export function readKmlText(
  text: string,
  file: string,
  format: "kml" | "kmz",
  onProgress?: OnProgress,
): VectorReadResult {
  const doc = parseXml(text, file);
  const root = doc.documentElement?.localName;
  if (root !== "kml")
    throw new ReadError(422, "not-kml", `${file}: the XML root is <${root}>, not <kml>`, file);
  const collection = togeojson.kml(doc);
  const notes: ReadNote[] = [];
  const raw: Feature<Geometry | null, Record<string, unknown>>[] = collection.features.map(
    (f, k) => {
      const { geometry, dropped } = flattenCollection(f.geometry);
      if (dropped > 0) {
        notes.push({
          where: `${file}, feature ${k + 1}`,
          message: `kept the polygons of a mixed MultiGeometry; left out ${dropped} other parts`,
        });
      }
      return { type: "Feature", geometry, properties: featureAttributes(f, STYLE_KEYS) };
    },
  );
  const total = raw.length;
  const normalized = normalizeFeatures(
    raw,
    (n) => `${file}, feature ${n}`,
    null,
    (done) => onProgress?.(done, total),
  );
  if (normalized.features.length === 0) {
    throw new ReadError(422, "no-features", `${file}: holds no placemark with a geometry`, file);
  }
  return {
    format,
    features: normalized.features,
    fields: fieldsOf(normalized.features),
    notes: [...notes, ...normalized.notes],
    sourceCrs: "EPSG:4326",
  };
}

export async function readKmlFile(
  filePath: string,
  file: string,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  return readKmlText(await readFile(filePath, "utf8"), file, "kml", onProgress);
}

export async function readKmzFile(
  filePath: string,
  file: string,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  const members = await readZipMembers(filePath, file, (name) =>
    name.toLowerCase().endsWith(".kml"),
  );
  const doc =
    members.find((m) => m.baseName.toLowerCase() === "doc.kml") ??
    (members.length === 1 ? members[0] : undefined);
  if (doc === undefined) {
    throw new ReadError(
      422,
      "kmz-no-kml",
      members.length === 0
        ? `${file}: holds no .kml document`
        : `${file}: holds ${members.length} .kml files and no doc.kml; which one is meant is unclear`,
      file,
    );
  }
  return readKmlText(new TextDecoder().decode(doc.bytes), file, "kmz", onProgress);
}
