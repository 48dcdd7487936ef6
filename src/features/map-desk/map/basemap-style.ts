/**
 * Rillmark's own basemap style over the demo area's tiles (roads, streams, buildings, contours,
 * places) or a self-hosted PMTiles archive. Labels use the page's Noto Sans: the style has no
 * `glyphs`, so maplibre draws the text locally and nothing is fetched for fonts.
 */
import type { LayerSpecification, StyleSpecification } from "maplibre-gl";
import { MAP_COLOURS as C } from "./palette";

// The page loads Noto Sans (bundled); maplibre draws labels with it when the style has no glyphs.
export const MAP_FONT = ["Noto Sans"];
const FONT = MAP_FONT;

export function basemapLayers(source: string): LayerSpecification[] {
  const s = { source };
  return [
    { id: "ground", type: "background", paint: { "background-color": C.ground } },
    // Protomaps-style archives name land and water "earth" and "water"; the demo tiles have none.
    {
      id: "earth",
      type: "fill",
      ...s,
      "source-layer": "earth",
      paint: { "fill-color": C.ground },
    },
    {
      id: "water",
      type: "fill",
      ...s,
      "source-layer": "water",
      paint: { "fill-color": "#cfe3ea" },
    },
    {
      id: "contours",
      type: "line",
      ...s,
      "source-layer": "contours",
      paint: {
        "line-color": ["case", ["==", ["get", "index"], true], C.contourIndex, C.contour],
        "line-width": ["case", ["==", ["get", "index"], true], 1.1, 0.5],
        "line-opacity": 0.8,
      },
    },
    {
      id: "streams",
      type: "line",
      ...s,
      "source-layer": "streams",
      paint: { "line-color": C.stream, "line-width": 1.6 },
    },
    {
      id: "buildings",
      type: "fill",
      ...s,
      "source-layer": "buildings",
      paint: { "fill-color": C.building, "fill-outline-color": C.buildingEdge },
    },
    {
      id: "roads-casing",
      type: "line",
      ...s,
      "source-layer": "roads",
      layout: { "line-cap": "round", "line-join": "round" },
      paint: {
        "line-color": C.roadCasing,
        "line-width": ["interpolate", ["linear"], ["zoom"], 12, 2, 18, 14],
      },
    },
    {
      id: "roads",
      type: "line",
      ...s,
      "source-layer": "roads",
      layout: { "line-cap": "round", "line-join": "round" },
      paint: {
        "line-color": [
          "match",
          ["get", "class"],
          ["primary", "major", "arterial"],
          C.majorRoad,
          C.road,
        ],
        "line-width": ["interpolate", ["linear"], ["zoom"], 12, 1, 18, 11],
      },
    },
    {
      id: "contour-labels",
      type: "symbol",
      ...s,
      "source-layer": "contours",
      minzoom: 15,
      filter: ["==", ["get", "index"], true],
      layout: {
        "symbol-placement": "line",
        "text-field": ["to-string", ["get", "elevation"]],
        "text-font": FONT,
        "text-size": 10,
      },
      paint: {
        "text-color": C.contourIndex,
        "text-halo-color": C.labelHalo,
        "text-halo-width": 1.5,
      },
    },
    {
      id: "road-labels",
      type: "symbol",
      ...s,
      "source-layer": "roads",
      minzoom: 14,
      layout: {
        "symbol-placement": "line",
        "text-field": ["coalesce", ["get", "name"], ""],
        "text-font": FONT,
        "text-size": 11,
      },
      paint: { "text-color": C.label, "text-halo-color": C.labelHalo, "text-halo-width": 1.5 },
    },
    {
      id: "place-labels",
      type: "symbol",
      ...s,
      "source-layer": "places",
      layout: {
        "text-field": ["coalesce", ["get", "name"], ""],
        "text-font": FONT,
        "text-size": 13,
      },
      paint: { "text-color": C.label, "text-halo-color": C.labelHalo, "text-halo-width": 2 },
    },
  ];
}

/** The style for the demo tiles (served by the app) or a PMTiles archive (pmtiles:// URL). */
export function basemapStyle(
  tileSource: { tiles: string[] } | { url: string },
): StyleSpecification {
  return {
    version: 8,
    sources: {
      basemap: { type: "vector", ...tileSource, maxzoom: 16, attribution: "Invented demo area" },
    },
    layers: basemapLayers("basemap"),
  };
}

export function demoBasemapTiles(origin: string): { tiles: string[] } {
  return { tiles: [`${origin}/api/basemap/tiles/{z}/{x}/{y}.mvt`] };
}
