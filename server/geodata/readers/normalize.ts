/**
 * Brings every reader's features to one shape: 2D WGS84 coordinates, finite and inside
 * lon [-180, 180] / lat [-90, 90], lines and rings without repeated consecutive points, rings
 * closed. What is fixed here is reported as a note; what cannot be read is refused with the
 * feature named (1-based, in file order). Polygon validity (self-intersections) is checked
 * later in PostGIS, not here.
 */
import type { Feature, Geometry, Position } from "geojson";
import { ReadError, type ReadNote } from "./types";

/** Reprojects one coordinate pair to WGS84 lon/lat (identity for files already in WGS84). */
export type ToWgs84 = (x: number, y: number) => [number, number];

interface Fixes {
  repeated: number;
  closed: number;
  droppedZ: boolean;
}

const MAX_NOTES = 100;

function fmt(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toFixed(6))) : String(v);
}

function point(p: Position, where: string, toWgs84: ToWgs84 | null): Position {
  const [x, y] = p;
  if (
    typeof x !== "number" ||
    typeof y !== "number" ||
    !Number.isFinite(x) ||
    !Number.isFinite(y)
  ) {
    throw new ReadError(
      422,
      "bad-coordinate",
      `${where}: coordinate (${p.join(", ")}) is not a number pair`,
      where,
    );
  }
  const [lon, lat] = toWgs84 ? toWgs84(x, y) : [x, y];
  if (!(Math.abs(lon) <= 180 && Math.abs(lat) <= 90)) {
    throw new ReadError(
      422,
      "outside-wgs84",
      `${where}: coordinate (${fmt(x)}, ${fmt(y)}) is outside WGS84 longitude/latitude` +
        (toWgs84 ? " after reprojection — is the .prj right?" : " — is the file really in WGS84?"),
      where,
    );
  }
  return [lon, lat];
}

function line(coords: Position[], where: string, t: ToWgs84 | null, fixes: Fixes): Position[] {
  const out: Position[] = [];
  for (const p of coords) {
    if (p.length > 2 && p[2] !== 0) fixes.droppedZ = true;
    const q = point(p, where, t);
    const last = out[out.length - 1];
    if (last && last[0] === q[0] && last[1] === q[1]) fixes.repeated += 1;
    else out.push(q);
  }
  return out;
}

/** RFC 7946 section 3.1.6: exterior rings counter-clockwise, holes clockwise. */
function rightHanded(ring: Position[], outer: boolean): Position[] {
  let twiceArea = 0;
  for (let i = 0; i + 1 < ring.length; i += 1) {
    const [x0 = 0, y0 = 0] = ring[i] ?? [];
    const [x1 = 0, y1 = 0] = ring[i + 1] ?? [];
    twiceArea += x0 * y1 - x1 * y0;
  }
  return twiceArea > 0 === outer ? ring : ring.reverse();
}

function polygon(
  rings: Position[][],
  where: string,
  t: ToWgs84 | null,
  fixes: Fixes,
): Position[][] {
  return rings.map((r, k) => rightHanded(ring(r, where, t, fixes), k === 0));
}

function ring(coords: Position[], where: string, t: ToWgs84 | null, fixes: Fixes): Position[] {
  const out = line(coords, where, t, fixes);
  const first = out[0];
  const last = out[out.length - 1];
  if (first && last && (first[0] !== last[0] || first[1] !== last[1])) {
    out.push(first);
    fixes.closed += 1;
  }
  if (out.length < 4) {
    throw new ReadError(
      422,
      "degenerate-ring",
      `${where}: a polygon ring has fewer than 3 distinct points`,
      where,
    );
  }
  return out;
}

function isEmpty(g: Geometry): boolean {
  if (g.type === "GeometryCollection")
    return g.geometries.length === 0 || g.geometries.every(isEmpty);
  const flat = (g.coordinates as unknown[]).flat(3);
  return flat.length === 0;
}

function geometry(g: Geometry, where: string, t: ToWgs84 | null, fixes: Fixes): Geometry {
  switch (g.type) {
    case "Point":
      return { type: "Point", coordinates: point(g.coordinates, where, t) };
    case "MultiPoint":
      return { type: "MultiPoint", coordinates: g.coordinates.map((p) => point(p, where, t)) };
    case "LineString":
    case "MultiLineString": {
      const parts = g.type === "LineString" ? [g.coordinates] : g.coordinates;
      const lines = parts.map((part) => line(part, where, t, fixes));
      if (lines.some((l) => l.length < 2)) {
        throw new ReadError(
          422,
          "degenerate-line",
          `${where}: a line has fewer than 2 distinct points`,
          where,
        );
      }
      return g.type === "LineString"
        ? { type: "LineString", coordinates: lines[0] ?? [] }
        : { type: "MultiLineString", coordinates: lines };
    }
    case "Polygon":
      return { type: "Polygon", coordinates: polygon(g.coordinates, where, t, fixes) };
    case "MultiPolygon":
      return {
        type: "MultiPolygon",
        coordinates: g.coordinates.map((poly) => polygon(poly, where, t, fixes)),
      };
    case "GeometryCollection":
      return {
        type: "GeometryCollection",
        geometries: g.geometries.map((m) => geometry(m, where, t, fixes)),
      };
  }
}

const TYPES = [
  "Point",
  "MultiPoint",
  "LineString",
  "MultiLineString",
  "Polygon",
  "MultiPolygon",
  "GeometryCollection",
];

/** Malformed nesting (a number where a ring should be, …) becomes a message, not a crash. */
function guarded(run: () => Geometry, where: string): Geometry {
  try {
    const g = run();
    if (!TYPES.includes(g?.type)) throw new TypeError("unknown geometry type");
    return g;
  } catch (error) {
    if (error instanceof ReadError) throw error;
    throw new ReadError(
      422,
      "bad-geometry",
      `${where}: the geometry is malformed (${(error as Error).message})`,
      where,
    );
  }
}

function describe(fixes: Fixes): string | null {
  const parts: string[] = [];
  if (fixes.closed > 0)
    parts.push(`closed ${fixes.closed} unclosed ring${fixes.closed > 1 ? "s" : ""}`);
  if (fixes.repeated > 0)
    parts.push(`removed ${fixes.repeated} repeated point${fixes.repeated > 1 ? "s" : ""}`);
  if (fixes.droppedZ) parts.push("dropped heights (kept longitude/latitude)");
  return parts.length > 0 ? parts.join(", ") : null;
}

/**
 * Checks and cleans features in order; `label(n)` names feature n (1-based) in messages,
 * e.g. "cover.zip, feature 3". Notes beyond the first 100 are summed up in one line.
 */
export function normalizeFeatures(
  input: readonly Feature<Geometry | null, Record<string, unknown> | null>[],
  label: (n: number) => string,
  toWgs84: ToWgs84 | null,
  onFeature?: (done: number) => void,
): { features: Feature<Geometry, Record<string, unknown>>[]; notes: ReadNote[] } {
  const features: Feature<Geometry, Record<string, unknown>>[] = [];
  const notes: ReadNote[] = [];
  let unlisted = 0;
  input.forEach((f, i) => {
    const where = label(i + 1);
    if (f.geometry === null || f.geometry === undefined || isEmpty(f.geometry)) {
      throw new ReadError(422, "empty-geometry", `${where}: has no geometry (empty)`, where);
    }
    const fixes: Fixes = { repeated: 0, closed: 0, droppedZ: false };
    const clean = guarded(() => geometry(f.geometry as Geometry, where, toWgs84, fixes), where);
    const note = describe(fixes);
    if (note !== null && notes.length < MAX_NOTES) notes.push({ where, message: note });
    else if (note !== null) unlisted += 1;
    features.push({ type: "Feature", geometry: clean, properties: { ...(f.properties ?? {}) } });
    // Progress every 1,000 features and at the end: often enough for a bar, rare enough to be free.
    if ((i + 1) % 1000 === 0 || i + 1 === input.length) onFeature?.(i + 1);
  });
  if (unlisted > 0) {
    notes.push({ where: "file", message: `${unlisted} more features were cleaned the same ways` });
  }
  return { features, notes };
}

/** Attribute names in order of first appearance across the features. */
export function fieldsOf(
  features: readonly Feature<Geometry, Record<string, unknown>>[],
): string[] {
  const seen = new Set<string>();
  for (const f of features) for (const key of Object.keys(f.properties)) seen.add(key);
  return [...seen];
}
