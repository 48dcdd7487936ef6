/** The document entries of the map's tile routes (docs/map-tiles.md has the full contract). */
import { z } from "zod";
import type { ApiDocs } from "./registry";

const MVT = "application/vnd.mapbox-vector-tile";
const tileBytes = z.string().openapi({ format: "binary" });

export function registerMapPaths(d: ApiDocs): void {
  d.route("get", "/projects/:projectId/tiles/:z/:x/:y.mvt", {
    summary:
      "A project's layers as one vector tile: source-layers cover, soil, channel, boundary, " +
      "subcatchments (204 when the tile is empty; ETag, 304 on If-None-Match)",
    tag: "Map",
    permission: "project:read",
    response: tileBytes,
    mediaType: MVT,
  });
  d.route("get", "/basemap/tiles/:z/:x/:y.mvt", {
    summary:
      "The invented demo area's basemap as one vector tile: roads, streams, buildings, " +
      "contours, places (204 when the tile is empty)",
    tag: "Map",
    permission: "signed-in",
    response: tileBytes,
    mediaType: MVT,
  });
  d.route("get", "/basemap/archive.pmtiles", {
    summary:
      "The PMTiles basemap archive named by BASEMAP_PMTILES_PATH, with HTTP range requests " +
      "(206); 404 when none is configured",
    tag: "Map",
    permission: "signed-in",
    response: tileBytes,
    mediaType: "application/octet-stream",
  });
  d.route("get", "/layers/:layerId/terrain/:z/:x/:y.png", {
    summary:
      "A terrain layer as a 256 px raster-dem tile, terrarium encoding (height = R·256 + G + " +
      "B/256 − 32768 m); 204 off the terrain or when too coarse for it",
    tag: "Map",
    permission: "project:read",
    response: tileBytes,
    mediaType: "image/png",
  });
}
