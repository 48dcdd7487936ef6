import type { Bbox, Layer } from "../../../../shared/schemas/layers";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";

/** Where the map opens: around the subcatchment's boundary and path, else the layers' extent. */
export function initialBounds(
  s: Pick<Subcatchment, "boundary" | "flowPath" | "outlet"> | null,
  layers: readonly Layer[],
): Bbox | null {
  const points: number[][] = [];
  if (s?.boundary?.type === "Polygon") points.push(...s.boundary.coordinates.flat());
  if (s?.boundary?.type === "MultiPolygon") points.push(...s.boundary.coordinates.flat(2));
  if (s?.flowPath) points.push(...s.flowPath.geometry.coordinates);
  if (s?.outlet) points.push(s.outlet.coordinates);
  for (const l of points.length === 0 ? layers : []) {
    if (l.bbox4326) points.push([l.bbox4326[0], l.bbox4326[1]], [l.bbox4326[2], l.bbox4326[3]]);
  }
  if (points.length === 0) return null;
  const xs = points.map((p) => p[0]!);
  const ys = points.map((p) => p[1]!);
  return [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
}
