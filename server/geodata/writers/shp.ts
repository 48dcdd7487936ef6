/**
 * Encodes the geometry half of an ESRI shapefile: the .shp (records) and the .shx (index).
 * Layout per the ESRI Shapefile Technical Description (July 1998): a 100-byte header with the
 * file length in 16-bit words (big-endian) and the shape type and bounding box (little-endian),
 * then one record per feature. Polygon outer rings are written clockwise and holes
 * counter-clockwise, as that document requires; a feature without geometry is a null shape.
 */
import type { Geometry, Position } from "geojson";

export const SHAPE_TYPE = { null: 0, point: 1, polyline: 3, polygon: 5 } as const;
export type ShapeFamily = "point" | "polyline" | "polygon";

export function shapeFamily(geometry: Geometry | null): ShapeFamily | null {
  if (geometry === null) return null;
  switch (geometry.type) {
    case "Point":
      return "point";
    case "LineString":
    case "MultiLineString":
      return "polyline";
    case "Polygon":
    case "MultiPolygon":
      return "polygon";
    default:
      throw new TypeError(
        `shapefile writer: ${geometry.type} is not written (points, lines, polygons)`,
      );
  }
}

/** Twice the signed area (shoelace); positive when counter-clockwise with y up. */
function signedArea2(ring: readonly Position[]): number {
  let sum = 0;
  for (let i = 0; i + 1 < ring.length; i += 1) {
    const [x0 = 0, y0 = 0] = ring[i] ?? [];
    const [x1 = 0, y1 = 0] = ring[i + 1] ?? [];
    sum += x0 * y1 - x1 * y0;
  }
  return sum;
}

function closed(ring: readonly Position[]): Position[] {
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (first && last && (first[0] !== last[0] || first[1] !== last[1])) return [...ring, first];
  return [...ring];
}

function oriented(ring: readonly Position[], clockwise: boolean): Position[] {
  const out = closed(ring);
  return signedArea2(out) > 0 === clockwise ? out.reverse() : out;
}

/** The parts (rings or lines) of a geometry as shapefile parts. */
function partsOf(geometry: Geometry): Position[][] {
  switch (geometry.type) {
    case "LineString":
      return [geometry.coordinates];
    case "MultiLineString":
      return geometry.coordinates;
    case "Polygon":
      return geometry.coordinates.map((ring, k) => oriented(ring, k === 0));
    case "MultiPolygon":
      return geometry.coordinates.flatMap((poly) => poly.map((ring, k) => oriented(ring, k === 0)));
    default:
      return [];
  }
}

function recordContent(geometry: Geometry | null): Uint8Array {
  if (geometry === null) {
    const out = new Uint8Array(4);
    new DataView(out.buffer).setInt32(0, SHAPE_TYPE.null, true);
    return out;
  }
  if (geometry.type === "Point") {
    const out = new Uint8Array(20);
    const view = new DataView(out.buffer);
    view.setInt32(0, SHAPE_TYPE.point, true);
    view.setFloat64(4, geometry.coordinates[0] ?? Number.NaN, true);
    view.setFloat64(12, geometry.coordinates[1] ?? Number.NaN, true);
    return out;
  }
  const parts = partsOf(geometry);
  const points = parts.flat();
  const out = new Uint8Array(44 + parts.length * 4 + points.length * 16);
  const view = new DataView(out.buffer);
  view.setInt32(0, shapeFamily(geometry) === "polygon" ? 5 : 3, true);
  const box = bbox(points);
  box.forEach((v, k) => view.setFloat64(4 + k * 8, v, true));
  view.setInt32(36, parts.length, true);
  view.setInt32(40, points.length, true);
  let start = 0;
  parts.forEach((part, k) => {
    view.setInt32(44 + k * 4, start, true);
    start += part.length;
  });
  const base = 44 + parts.length * 4;
  points.forEach((p, k) => {
    view.setFloat64(base + k * 16, p[0] ?? Number.NaN, true);
    view.setFloat64(base + k * 16 + 8, p[1] ?? Number.NaN, true);
  });
  return out;
}

function bbox(points: readonly Position[]): [number, number, number, number] {
  if (points.length === 0) return [0, 0, 0, 0];
  let [minX, minY, maxX, maxY] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [x = 0, y = 0] of points) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  return [minX, minY, maxX, maxY];
}

function header(lengthBytes: number, shapeType: number, box: readonly number[]): Uint8Array {
  const out = new Uint8Array(100);
  const view = new DataView(out.buffer);
  view.setInt32(0, 9994, false); // file code
  view.setInt32(24, lengthBytes / 2, false); // file length in 16-bit words
  view.setInt32(28, 1000, true); // version
  view.setInt32(32, shapeType, true);
  box.forEach((v, k) => view.setFloat64(36 + k * 8, v, true));
  return out;
}

/** The .shp and .shx of geometries that are all of one family (nulls allowed anywhere). */
export function encodeShp(geometries: readonly (Geometry | null)[]): {
  shp: Uint8Array;
  shx: Uint8Array;
} {
  const families = new Set(geometries.map(shapeFamily).filter((f) => f !== null));
  if (families.size > 1) {
    throw new TypeError(
      `shapefile writer: one shape type per file, got ${[...families].join(", ")}`,
    );
  }
  const family = [...families][0];
  const shapeType = family === undefined ? SHAPE_TYPE.null : SHAPE_TYPE[family];
  const contents = geometries.map(recordContent);
  const shpLength = 100 + contents.reduce((n, c) => n + 8 + c.length, 0);
  const shp = new Uint8Array(shpLength);
  const shx = new Uint8Array(100 + contents.length * 8);
  const allPoints = geometries.flatMap((g) =>
    g === null ? [] : g.type === "Point" ? [g.coordinates] : partsOf(g).flat(),
  );
  const box = [...bbox(allPoints), 0, 0, 0, 0];
  shp.set(header(shpLength, shapeType, box), 0);
  shx.set(header(shx.length, shapeType, box), 0);
  const shpView = new DataView(shp.buffer);
  const shxView = new DataView(shx.buffer);
  let at = 100;
  contents.forEach((content, k) => {
    shxView.setInt32(100 + k * 8, at / 2, false);
    shxView.setInt32(104 + k * 8, content.length / 2, false);
    shpView.setInt32(at, k + 1, false); // record numbers are 1-based
    shpView.setInt32(at + 4, content.length / 2, false);
    shp.set(content, at + 8);
    at += 8 + content.length;
  });
  return { shp, shx };
}
