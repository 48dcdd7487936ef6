/**
 * XML parsing for KML and GPX with @xmldom/xmldom (a DOMParser for Node). Malformed XML is
 * refused with the parser's message, which names the line. xmldom neither fetches external
 * entities nor expands DTD entities, so XML entity attacks have nothing to work with.
 */
import { DOMParser } from "@xmldom/xmldom";
import type { Feature, Geometry } from "geojson";
import { ReadError } from "./types";

export function parseXml(text: string, file: string): Document {
  const parser = new DOMParser({
    onError: (level, message) => {
      if (level !== "warning") throw new Error(message);
    },
  });
  try {
    // xmldom's Document implements the DOM interfaces togeojson walks.
    return parser.parseFromString(text, "text/xml") as unknown as Document;
  } catch (error) {
    const reason = (error as Error).message.replace(/^.*?caused Error: (fatalError|error): /s, "");
    throw new ReadError(
      422,
      "bad-xml",
      `${file}: is not well-formed XML (${reason.slice(0, 200)})`,
      file,
    );
  }
}

type RawFeature = Feature<Geometry | null, Record<string, unknown> | null>;

/** Keeps attributes that describe the feature; drops per-vertex arrays and styling objects. */
export function featureAttributes(f: RawFeature, drop: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(f.properties ?? {})) {
    if (drop.includes(key) || (typeof value === "object" && value !== null)) continue;
    out[key] = value;
  }
  return out;
}

/**
 * A KML MultiGeometry arrives as a GeometryCollection; layers hold one kind of geometry, so it
 * becomes a Multi* of its polygons (or else lines, or else points), noting anything left out.
 */
export function flattenCollection(g: Geometry | null): {
  geometry: Geometry | null;
  dropped: number;
} {
  if (g === null || g.type !== "GeometryCollection") return { geometry: g, dropped: 0 };
  const members = g.geometries.flatMap((m) =>
    m.type === "GeometryCollection" ? (flattenCollection(m).geometry ?? []) : [m],
  );
  const polygons = members.flatMap((m) =>
    m.type === "Polygon" ? [m.coordinates] : m.type === "MultiPolygon" ? m.coordinates : [],
  );
  const lines = members.flatMap((m) =>
    m.type === "LineString" ? [m.coordinates] : m.type === "MultiLineString" ? m.coordinates : [],
  );
  const points = members.flatMap((m) =>
    m.type === "Point" ? [m.coordinates] : m.type === "MultiPoint" ? m.coordinates : [],
  );
  if (polygons.length > 0) {
    return {
      geometry: { type: "MultiPolygon", coordinates: polygons },
      dropped: lines.length + points.length,
    };
  }
  if (lines.length > 0)
    return { geometry: { type: "MultiLineString", coordinates: lines }, dropped: points.length };
  if (points.length > 0)
    return { geometry: { type: "MultiPoint", coordinates: points }, dropped: 0 };
  return { geometry: null, dropped: 0 };
}
