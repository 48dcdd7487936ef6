/**
 * The desk's own overlays: the flow path's segments coloured by regime with their numbers,
 * the chosen subcatchment's outline and outlet, and the measuring line. GeoJSON sources, since
 * they are a handful of features that change as the engineer draws.
 */
import type { FeatureCollection } from "geojson";
import type {
  GeoJSONSource,
  LayerSpecification,
  Map as MapLibreMap,
  SourceSpecification,
} from "maplibre-gl";
import { MAP_FONT } from "./basemap-style";
import { MAP_COLOURS as C, REGIME_COLOURS } from "./palette";

export const OVERLAY_SOURCES = [
  "desk-segments",
  "desk-area",
  "desk-outlet",
  "desk-measure",
] as const;
export type OverlaySource = (typeof OVERLAY_SOURCES)[number];

const EMPTY: FeatureCollection = { type: "FeatureCollection", features: [] };

export const SEGMENT_LAYER = "desk-segment-line";

export function overlayLayers(): LayerSpecification[] {
  return [
    {
      id: "desk-area-line",
      type: "line",
      source: "desk-area",
      paint: { "line-color": C.subcatchment, "line-width": 2.5, "line-dasharray": [2, 1] },
    },
    {
      id: "desk-segment-casing",
      type: "line",
      source: "desk-segments",
      layout: { "line-cap": "round", "line-join": "round" },
      paint: {
        "line-color": [
          "case",
          ["boolean", ["feature-state", "hover"], false],
          C.highlight,
          "#ffffff",
        ],
        "line-width": ["case", ["boolean", ["feature-state", "hover"], false], 11, 8],
      },
    },
    {
      id: SEGMENT_LAYER,
      type: "line",
      source: "desk-segments",
      layout: { "line-cap": "round", "line-join": "round" },
      paint: {
        "line-color": [
          "match",
          ["get", "regime"],
          "sheet",
          REGIME_COLOURS.sheet,
          "channel",
          REGIME_COLOURS.channel,
          REGIME_COLOURS.shallow,
        ],
        "line-width": 5,
      },
    },
    {
      id: "desk-segment-labels",
      type: "symbol",
      source: "desk-segments",
      layout: {
        "symbol-placement": "line-center",
        "text-field": ["get", "label"],
        "text-font": MAP_FONT,
        "text-size": 12,
        "text-offset": [0, -1.1],
        "text-allow-overlap": true,
      },
      paint: { "text-color": C.subcatchment, "text-halo-color": "#ffffff", "text-halo-width": 2 },
    },
    {
      id: "desk-measure-line",
      type: "line",
      source: "desk-measure",
      paint: { "line-color": C.measure, "line-width": 2, "line-dasharray": [1, 1] },
    },
    {
      id: "desk-outlet-point",
      type: "circle",
      source: "desk-outlet",
      paint: {
        "circle-radius": 7,
        "circle-color": C.outlet,
        "circle-stroke-color": "#ffffff",
        "circle-stroke-width": 2,
      },
    },
  ];
}

/** The overlays' sources, empty until the desk fills them. */
export function overlaySources(): Record<OverlaySource, SourceSpecification> {
  const empty = (): SourceSpecification => ({ type: "geojson", data: EMPTY, promoteId: "index" });
  return Object.fromEntries(OVERLAY_SOURCES.map((id) => [id, empty()])) as Record<
    OverlaySource,
    SourceSpecification
  >;
}

export function addOverlays(map: MapLibreMap): void {
  const sources = overlaySources();
  for (const id of OVERLAY_SOURCES) {
    if (!map.getSource(id)) map.addSource(id, sources[id]);
  }
  for (const layer of overlayLayers()) if (!map.getLayer(layer.id)) map.addLayer(layer);
}

export function setOverlay(map: MapLibreMap, id: OverlaySource, data: FeatureCollection): void {
  const source = map.getSource<GeoJSONSource>(id);
  source?.setData(data);
}
