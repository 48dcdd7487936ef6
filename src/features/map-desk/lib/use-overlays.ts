/**
 * Keeps the desk overlays on the map in step with the page: segments (live while editing, the
 * computed sheet's once it is current), the subcatchment's outline and outlet, the measure line.
 */
import type { Map as MapLibreMap } from "maplibre-gl";
import { useEffect } from "react";
import type { LonLat, RegimeSegment } from "../../../../shared/geo";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { setOverlay } from "../map/desk-overlays";
import { segmentFeatures } from "./segment-features";

interface OverlayInput {
  path: readonly LonLat[];
  savedPath: readonly LonLat[];
  live: readonly RegimeSegment[];
  sheet: TravelTimeSheet | null;
  upToDate: boolean;
  subcatchment: Subcatchment;
  measure: readonly LonLat[];
}

export function useOverlays(map: MapLibreMap | null, input: OverlayInput) {
  const { path, savedPath, live, sheet, upToDate, subcatchment, measure } = input;
  useEffect(() => {
    if (!map) return;
    const spans =
      upToDate && sheet
        ? sheet.segments.map((s) => ({ ...s, index: s.index }))
        : live.map((s, index) => ({ ...s, index }));
    setOverlay(map, "desk-segments", segmentFeatures(upToDate ? savedPath : path, spans));
  }, [map, path, savedPath, live, sheet, upToDate]);

  const { boundary, outlet } = subcatchment;
  useEffect(() => {
    if (!map) return;
    setOverlay(map, "desk-area", {
      type: "FeatureCollection",
      features: boundary ? [{ type: "Feature", properties: {}, geometry: boundary }] : [],
    });
    setOverlay(map, "desk-outlet", {
      type: "FeatureCollection",
      features: outlet ? [{ type: "Feature", properties: {}, geometry: outlet }] : [],
    });
  }, [map, boundary, outlet]);

  useEffect(() => {
    if (!map) return;
    setOverlay(map, "desk-measure", {
      type: "FeatureCollection",
      features:
        measure.length >= 2
          ? [
              {
                type: "Feature",
                properties: {},
                geometry: { type: "LineString", coordinates: measure.map(([x, y]) => [x, y]) },
              },
            ]
          : [],
    });
  }, [map, measure]);
}
