/**
 * The project's own layers over the basemap: hillshade from the terrain layer (raster-dem,
 * terrarium encoding), cover filled by each class's colour, soils by hydrologic soil group,
 * channels, boundary layers and subcatchment outlines, all from the project's vector tiles.
 */
import type { LayerSpecification, SourceSpecification } from "maplibre-gl";
import type { TerrainTiling } from "../lib/terrain-tiling";
import { HSG_COLOURS, MAP_COLOURS as C } from "./palette";

export type ToggleId =
  "hillshade" | "contours" | "cover" | "soil" | "channel" | "boundary" | "basemap";

export const TOGGLES: readonly { id: ToggleId; label: string; opacity: number }[] = [
  { id: "basemap", label: "Basemap", opacity: 1 },
  { id: "hillshade", label: "Hillshade", opacity: 0.55 },
  { id: "contours", label: "Contours", opacity: 0.9 },
  { id: "cover", label: "Cover", opacity: 0.6 },
  { id: "soil", label: "Soils (HSG)", opacity: 0.35 },
  { id: "channel", label: "Channels", opacity: 1 },
  { id: "boundary", label: "Boundaries", opacity: 1 },
];

/** Map layer ids each toggle shows, hides and fades, with the paint property it fades. */
export const TOGGLE_LAYERS: Record<ToggleId, readonly (readonly [string, string])[]> = {
  basemap: [],
  hillshade: [["hillshade", "hillshade-exaggeration"]],
  contours: [
    ["terrain-contour-line", "line-opacity"],
    ["terrain-contour-label", "text-opacity"],
  ],
  cover: [
    ["cover-fill", "fill-opacity"],
    ["cover-edge", "line-opacity"],
  ],
  soil: [
    ["soil-fill", "fill-opacity"],
    ["soil-edge", "line-opacity"],
  ],
  channel: [["channel-line", "line-opacity"]],
  boundary: [
    ["boundary-line", "line-opacity"],
    ["subcatchment-line", "line-opacity"],
  ],
};

export function projectSources(
  origin: string,
  projectId: string,
  terrainLayerId: string | undefined,
  tiling: TerrainTiling,
): Record<string, SourceSpecification> {
  const sources: Record<string, SourceSpecification> = {
    project: {
      type: "vector",
      tiles: [`${origin}/api/projects/${encodeURIComponent(projectId)}/tiles/{z}/{x}/{y}.mvt`],
      minzoom: 8,
      maxzoom: 18,
    },
  };
  if (terrainLayerId) {
    sources.terrain = {
      type: "raster-dem",
      tiles: [`${origin}/api/layers/${encodeURIComponent(terrainLayerId)}/terrain/{z}/{x}/{y}.png`],
      tileSize: 256,
      encoding: "terrarium",
      maxzoom: tiling.maxzoom,
      ...(tiling.bounds && { bounds: tiling.bounds }),
    };
  }
  return sources;
}

const hsgColour = [
  "match",
  ["get", "hsg"],
  ...Object.entries(HSG_COLOURS).flat(),
  C.unmappedCover,
] as unknown as string;

export function projectLayers(hasTerrain: boolean): LayerSpecification[] {
  const p = { source: "project" };
  return [
    ...(hasTerrain
      ? [
          {
            id: "hillshade",
            type: "hillshade",
            source: "terrain",
            paint: {
              "hillshade-exaggeration": 0.55,
              "hillshade-shadow-color": "#3a4b54",
              "hillshade-highlight-color": "#ffffff",
            },
          } satisfies LayerSpecification,
        ]
      : []),
    {
      id: "cover-fill",
      type: "fill",
      ...p,
      "source-layer": "cover",
      paint: {
        "fill-color": ["coalesce", ["get", "colour"], C.unmappedCover],
        "fill-opacity": 0.6,
      },
    },
    {
      id: "cover-edge",
      type: "line",
      ...p,
      "source-layer": "cover",
      minzoom: 15,
      paint: { "line-color": "#ffffff", "line-width": 0.5, "line-opacity": 0.6 },
    },
    {
      id: "soil-fill",
      type: "fill",
      ...p,
      "source-layer": "soil",
      layout: { visibility: "none" },
      paint: { "fill-color": hsgColour, "fill-opacity": 0.35 },
    },
    {
      id: "soil-edge",
      type: "line",
      ...p,
      "source-layer": "soil",
      layout: { visibility: "none" },
      paint: {
        "line-color": hsgColour,
        "line-width": 1.5,
        "line-dasharray": [3, 2],
        "line-opacity": 0.35,
      },
    },
    {
      id: "channel-line",
      type: "line",
      ...p,
      "source-layer": "channel",
      paint: { "line-color": C.channel, "line-width": 2.5 },
    },
    {
      id: "boundary-line",
      type: "line",
      ...p,
      "source-layer": "boundary",
      paint: { "line-color": C.boundaryLayer, "line-width": 1.5, "line-dasharray": [4, 2] },
    },
    {
      id: "subcatchment-line",
      type: "line",
      ...p,
      "source-layer": "subcatchments",
      paint: { "line-color": C.subcatchment, "line-width": 1.5, "line-opacity": 0.7 },
    },
  ];
}
