/**
 * Builds the Map desk's maplibre map: the basemap (demo tiles, a configured style or a PMTiles
 * archive), the project's layers and the desk overlays, with navigation and a scale bar in the
 * project's length unit. maplibre-gl 6 is ESM; its worker ships with the app (bundled URL).
 */
import * as maplibregl from "maplibre-gl";
import workerUrl from "maplibre-gl/dist/maplibre-gl-worker.mjs?url";
import "maplibre-gl/dist/maplibre-gl.css";
import { Protocol } from "pmtiles";
import type { BasemapConfig } from "../api/get-map-config";
import { basemapLayers, basemapStyle, demoBasemapTiles } from "./basemap-style";
import { contourLayers, contourTiles, DEFAULT_INTERVAL } from "./contours";
import { addOverlays, overlaySources, overlayLayers } from "./desk-overlays";
import { projectLayers, projectSources } from "./project-layers";
import type { TerrainTiling } from "../lib/terrain-tiling";

maplibregl.setWorkerUrl(workerUrl);

let pmtilesReady = false;
function ensurePmtiles() {
  if (pmtilesReady) return;
  maplibregl.addProtocol("pmtiles", new Protocol().tile);
  pmtilesReady = true;
}

export interface CreateMapOptions {
  container: HTMLElement;
  basemap: BasemapConfig;
  projectId: string;
  terrainLayerId: string | undefined;
  /** The terrain layer's extent and deepest useful zoom. */
  terrainTiling: TerrainTiling;
  bounds: [number, number, number, number] | null;
  lengthUnit: "ft" | "m";
}

async function baseStyle(basemap: BasemapConfig, origin: string) {
  if (basemap.kind === "style") {
    const response = await fetch(basemap.url, { credentials: "same-origin" });
    if (!response.ok) throw new Error(`The configured map style answered ${response.status}.`);
    return (await response.json()) as maplibregl.StyleSpecification;
  }
  if (basemap.kind === "pmtiles") {
    ensurePmtiles();
    const url = new URL(basemap.url, origin).href;
    return basemapStyle({ url: `pmtiles://${url}` });
  }
  return basemapStyle(demoBasemapTiles(origin));
}

export async function createDeskMap(options: CreateMapOptions): Promise<maplibregl.Map> {
  const origin = window.location.origin;
  const style = await baseStyle(options.basemap, origin);
  const tiling = options.terrainTiling;
  const sources = projectSources(origin, options.projectId, options.terrainLayerId, tiling);
  const terrainId = options.terrainLayerId;
  const unit = options.lengthUnit;
  if (terrainId) {
    sources["terrain-contours"] = {
      type: "vector",
      tiles: contourTiles(origin, terrainId, unit, DEFAULT_INTERVAL[unit], tiling.maxzoom),
      maxzoom: tiling.maxzoom,
      ...(tiling.bounds && { bounds: tiling.bounds }),
    };
  }
  // The project's layers sit under the basemap's labels (the first symbol layer).
  const firstLabel = style.layers.findIndex((l) => l.type === "symbol");
  const at = firstLabel < 0 ? style.layers.length : firstLabel;
  const layers = [
    ...style.layers.slice(0, at),
    ...projectLayers(Boolean(terrainId)),
    ...(terrainId ? contourLayers() : []),
    ...style.layers.slice(at),
    // The desk's overlays are in the first style, so their empty sources load with the rest
    // rather than after the map's first load.
    ...overlayLayers(),
  ];
  const map = new maplibregl.Map({
    container: options.container,
    style: { ...style, sources: { ...style.sources, ...sources, ...overlaySources() }, layers },
    bounds: options.bounds ?? undefined,
    fitBoundsOptions: { padding: 40 },
    center: options.bounds ? undefined : [0, 0],
    zoom: options.bounds ? undefined : 2,
    attributionControl: { compact: true },
    dragRotate: false,
    // Labels appear at once: no fade to wait for before the map is idle.
    fadeDuration: 0,
    pitchWithRotate: false,
  });
  map.touchZoomRotate.disableRotation();
  map.addControl(new maplibregl.NavigationControl({ showCompass: false }), "top-right");
  // A configured style may drop them when it is swapped: put back whatever is missing.
  map.on("load", () => addOverlays(map));
  return map;
}

/** Every basemap layer id (for the basemap toggle), whatever the style names them. */
export function basemapLayerIds(map: maplibregl.Map): string[] {
  const desk = new Set(basemapLayers("basemap").map((l) => l.id));
  return (map.getStyle().layers ?? [])
    .filter((l) => desk.has(l.id) || ("source" in l && l.source === "basemap"))
    .map((l) => l.id);
}
