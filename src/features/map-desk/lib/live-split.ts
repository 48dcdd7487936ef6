/**
 * The split the browser runs while the engineer draws: the same shared/geo code the server
 * computes with, over the cover and soil features near the path, cut by the regime breaks.
 * Lengths and classes appear at once; slopes and times wait for the server.
 */
import {
  HSG_CODES,
  applySurfaceOverrides,
  buildPolygonIndex,
  pathLengthsM,
  regimeSegments,
  splitFlowPath,
  type HsgCode,
  type LonLat,
  type PolygonIndex,
  type PolygonRings,
  type RegimeBreaks,
  type RegimeSegment,
  type SurfaceOverride,
  type ValuedPolygon,
} from "../../../../shared/geo";
import type { LayerFeatures } from "../api/get-layer-features";

type Feature = LayerFeatures["features"][number];

function parts(f: Feature): PolygonRings[] {
  const g = f.geometry;
  if (!g) return [];
  const ring = (r: number[][]) => r.map((c): LonLat => [c[0] ?? Number.NaN, c[1] ?? Number.NaN]);
  if (g.type === "Polygon") return [g.coordinates.map(ring)];
  return g.coordinates.map((poly) => poly.map(ring));
}

const isHsg = (v: string | null): v is HsgCode =>
  v !== null && (HSG_CODES as readonly string[]).includes(v);

export function coverIndex(layers: readonly LayerFeatures[]): PolygonIndex<string | null> {
  const polygons: ValuedPolygon<string | null>[] = [];
  for (const layer of layers) {
    for (const f of layer.features) {
      for (const rings of parts(f)) {
        polygons.push({ featureId: f.id, rings, value: f.surfaceClassId });
      }
    }
  }
  return buildPolygonIndex(polygons);
}

export function soilIndex(layers: readonly LayerFeatures[]): PolygonIndex<HsgCode | null> {
  const polygons: ValuedPolygon<HsgCode | null>[] = [];
  for (const layer of layers) {
    for (const f of layer.features) {
      for (const rings of parts(f)) {
        polygons.push({ featureId: f.id, rings, value: isHsg(f.hsg) ? f.hsg : null });
      }
    }
  }
  return buildPolygonIndex(polygons);
}

/**
 * Segments of a drawn path, or none while it has fewer than two distinct vertices. The surface
 * overrides act on the split as the server's compute applies them.
 */
export function liveSegments(
  path: readonly LonLat[],
  cover: PolygonIndex<string | null>,
  soil: PolygonIndex<HsgCode | null>,
  breaks: RegimeBreaks,
  overrides: readonly SurfaceOverride[] = [],
): RegimeSegment[] {
  if (path.length < 2) return [];
  const lengths = pathLengthsM(path);
  if (lengths.totalM === 0) return [];
  const pieces = applySurfaceOverrides(splitFlowPath(path, cover, soil, lengths), overrides);
  return regimeSegments(pieces, breaks);
}

/**
 * A box around the path and boundary, snapped outwards to a 0.005° grid so small edits ask
 * the server again only when the path leaves the box already fetched.
 */
export function featureBox(points: readonly LonLat[]): [number, number, number, number] | null {
  if (points.length === 0) return null;
  const step = 0.005;
  let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [x, y] of points) {
    w = Math.min(w, x);
    s = Math.min(s, y);
    e = Math.max(e, x);
    n = Math.max(n, y);
  }
  const down = (v: number) => Math.floor(v / step - 1e-9) * step;
  const up = (v: number) => Math.ceil(v / step + 1e-9) * step;
  const r = (v: number) => Math.round(v * 1e6) / 1e6;
  return [
    r(Math.max(-180, down(w))),
    r(Math.max(-90, down(s))),
    r(Math.min(180, up(e))),
    r(Math.min(90, up(n))),
  ];
}
