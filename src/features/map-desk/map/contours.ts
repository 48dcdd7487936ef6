/**
 * Contour lines of the project's terrain at an interval the engineer picks, made in the browser
 * from the same terrarium tiles as the hillshade (maplibre-contour, in a worker), labelled in
 * the project's length unit. Every fifth line is an index line.
 */
import * as maplibregl from "maplibre-gl";
import mlcontour from "maplibre-contour";
import type { LayerSpecification, VectorTileSource } from "maplibre-gl";
import { ftFromM } from "../../../../shared/hydrology/units";
import { MAP_FONT } from "./basemap-style";
import { MAP_COLOURS } from "./palette";

export const CONTOUR_INTERVALS = { ft: [1, 2, 5, 10, 20], m: [0.5, 1, 2, 5, 10] } as const;
export const DEFAULT_INTERVAL = { ft: 2, m: 1 } as const;

const sources = new Map<string, InstanceType<typeof mlcontour.DemSource>>();

function demSource(origin: string, layerId: string, maxzoom: number) {
  let dem = sources.get(layerId);
  if (!dem) {
    dem = new mlcontour.DemSource({
      url: `${origin}/api/layers/${encodeURIComponent(layerId)}/terrain/{z}/{x}/{y}.png`,
      encoding: "terrarium",
      maxzoom,
      worker: true,
      timeoutMs: 5_000,
    });
    // The terrain route answers 204 where it has nothing to draw (off the file, or a zoom too
    // coarse for it); such a tile is simply empty, never an error that keeps the map busy.
    const contours = dem.contourProtocolV4;
    maplibregl.addProtocol(dem.contourProtocolId, async (params, abort) => {
      try {
        return await contours(params, abort);
      } catch {
        return { data: new ArrayBuffer(0) };
      }
    });
    sources.set(layerId, dem);
  }
  return dem;
}

/** The contour tiles' URL; the terrain's deepest zoom counts the first time a layer is seen. */
export function contourTiles(
  origin: string,
  layerId: string,
  unit: "ft" | "m",
  interval: number,
  maxzoom = 17,
) {
  return [
    demSource(origin, layerId, maxzoom).contourProtocolUrl({
      multiplier: unit === "ft" ? ftFromM(1) : 1,
      thresholds: { 13: [interval * 5, interval * 25], 15: [interval, interval * 5] },
      elevationKey: "ele",
      levelKey: "level",
      contourLayer: "contours",
    }),
  ];
}

export function contourLayers(): LayerSpecification[] {
  return [
    {
      id: "terrain-contour-line",
      type: "line",
      source: "terrain-contours",
      "source-layer": "contours",
      layout: { visibility: "none" },
      paint: {
        "line-color": MAP_COLOURS.contourIndex,
        "line-width": ["match", ["get", "level"], 1, 1.2, 0.5],
        "line-opacity": 0.9,
      },
    },
    {
      id: "terrain-contour-label",
      type: "symbol",
      source: "terrain-contours",
      "source-layer": "contours",
      filter: [">", ["get", "level"], 0],
      layout: {
        visibility: "none",
        "symbol-placement": "line",
        "text-field": ["number-format", ["get", "ele"], { "max-fraction-digits": 1 }],
        "text-font": MAP_FONT,
        "text-size": 10,
      },
      paint: {
        "text-color": MAP_COLOURS.contourIndex,
        "text-halo-color": MAP_COLOURS.labelHalo,
        "text-halo-width": 1.5,
      },
    },
  ];
}

export function setContourInterval(
  map: maplibregl.Map,
  layerId: string,
  unit: "ft" | "m",
  interval: number,
) {
  map
    .getSource<VectorTileSource>("terrain-contours")
    ?.setTiles(contourTiles(window.location.origin, layerId, unit, interval));
}
