/**
 * GeoJSON (RFC 7946): a FeatureCollection, a single Feature or a bare geometry. RFC 7946
 * (section 4) fixes WGS84 longitude/latitude; a legacy `crs` member (2008 GeoJSON) naming any
 * other CRS is refused, since its coordinates would land in the wrong place.
 */
import { readFile } from "node:fs/promises";
import type { Feature, Geometry } from "geojson";
import { fieldsOf, normalizeFeatures } from "./normalize";
import { ReadError, type OnProgress, type VectorReadResult } from "./types";

const WGS84_NAMES = new Set([
  "urn:ogc:def:crs:ogc:1.3:crs84",
  "urn:ogc:def:crs:ogc::crs84",
  "crs84",
  "epsg:4326",
  "urn:ogc:def:crs:epsg::4326",
  "urn:ogc:def:crs:epsg:6.6:4326",
]);

const GEOMETRY_TYPES = [
  "Point",
  "MultiPoint",
  "LineString",
  "MultiLineString",
  "Polygon",
  "MultiPolygon",
  "GeometryCollection",
];

type Raw = Feature<Geometry | null, Record<string, unknown> | null>;

function fail(file: string, message: string, code = "bad-geojson"): never {
  throw new ReadError(422, code, `${file}: ${message}`, file);
}

function checkCrs(value: Record<string, unknown>, file: string): void {
  if (!("crs" in value) || value.crs === null) return;
  const crs = value.crs as { properties?: { name?: unknown } };
  const name = String(crs.properties?.name ?? "");
  if (!WGS84_NAMES.has(name.toLowerCase())) {
    fail(
      file,
      `declares the coordinate system "${name || "unnamed"}"; GeoJSON must be WGS84 longitude/latitude (RFC 7946) — export it again in WGS84`,
      "geojson-crs",
    );
  }
}

function featuresOf(value: Record<string, unknown>, file: string): Raw[] {
  if (value.type === "FeatureCollection") {
    if (!Array.isArray(value.features))
      fail(file, 'is a FeatureCollection without a "features" array');
    return (value.features as unknown[]).map((f, k) => {
      const feature = f as Partial<Raw> | null;
      if (feature?.type !== "Feature")
        fail(file, `features[${k}] (feature ${k + 1}) is not a Feature`);
      return {
        type: "Feature",
        geometry: feature.geometry ?? null,
        properties: feature.properties ?? {},
      };
    });
  }
  if (value.type === "Feature") {
    const f = value as unknown as Raw;
    return [{ type: "Feature", geometry: f.geometry ?? null, properties: f.properties ?? {} }];
  }
  if (typeof value.type === "string" && GEOMETRY_TYPES.includes(value.type)) {
    return [{ type: "Feature", geometry: value as unknown as Geometry, properties: {} }];
  }
  return fail(
    file,
    `has type "${String(value.type)}"; expected a FeatureCollection, Feature or geometry`,
  );
}

export async function readGeoJsonFile(
  filePath: string,
  file: string,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  let value: unknown;
  try {
    value = JSON.parse((await readFile(filePath, "utf8")).replace(/^\uFEFF/, ""));
  } catch (error) {
    fail(file, `is not valid JSON (${(error as Error).message})`);
  }
  if (typeof value !== "object" || value === null || Array.isArray(value))
    fail(file, "is not a GeoJSON object");
  const object = value as Record<string, unknown>;
  checkCrs(object, file);
  const raw = featuresOf(object, file);
  if (raw.length === 0) fail(file, "holds no features", "no-features");
  const total = raw.length;
  const { features, notes } = normalizeFeatures(
    raw,
    (n) => `${file}, feature ${n}`,
    null,
    (done) => onProgress?.(done, total),
  );
  return { format: "geojson", features, fields: fieldsOf(features), notes, sourceCrs: "EPSG:4326" };
}
