/**
 * Map tiles (contract in docs/map-tiles.md): a project's layers and the demo basemap as vector
 * tiles from PostGIS, terrain layers as terrarium raster-dem PNGs, and a configured PMTiles
 * basemap archive served with HTTP range requests.
 */
import { Router } from "express";
import { BASEMAP_ARCHIVE_PATH } from "../config";
import type { TerrainInfo } from "../geodata/terrain";
import {
  currentProject,
  currentTeam,
  loadProjectAccess,
  requirePermission,
  requireUser,
} from "../auth/guards";
import { notFound } from "../http/errors";
import { validate } from "../http/validate";
import { currentLayer, loadLayerAccess } from "../layers/access";
import { BASEMAP_SEED_NAME } from "../seed/basemap";
import { basemapTile } from "../tiles/basemap-tiles";
import { tileCoordsSchema } from "../tiles/coords";
import { PROJECT_TILE_FORMAT, projectTile, projectTileVersion } from "../tiles/project-tiles";
import { answeredFromCache, MVT_TYPE, sendTile, tileEtag } from "../tiles/respond";
import { TerrainTiles } from "../tiles/terrain-tiles";
import type { RouteDeps } from "./deps";

/** Bump when terrain tiles are made differently (size, fill), so cached ones are dropped. */
const TERRAIN_TILE_FORMAT = 2;
const DAY_S = 86_400;
const HOUR_S = 3_600;

export function tilesRouter(deps: RouteDeps): Router {
  const { db, config } = deps;
  const router = Router();
  const terrain = new TerrainTiles(deps.store);

  router.get(
    "/projects/:projectId/tiles/:z/:x/:y.mvt",
    requireUser(db),
    loadProjectAccess(db),
    requirePermission("project:read"),
    async (req, res) => {
      const t = validate(tileCoordsSchema, req.params);
      const project = currentProject(req);
      const version = await projectTileVersion(db, project.id, currentTeam(req).teamId);
      // Always revalidated: a mapping or boundary edited a moment ago shows on the next pan.
      const etag = tileEtag("project", PROJECT_TILE_FORMAT, project.id, version, t.z, t.x, t.y);
      if (answeredFromCache(req, res, etag, 0)) return;
      sendTile(res, await projectTile(db, project.id, t), MVT_TYPE);
    },
  );

  router.get("/basemap/tiles/:z/:x/:y.mvt", requireUser(db), async (req, res) => {
    const t = validate(tileCoordsSchema, req.params);
    const etag = tileEtag("basemap", BASEMAP_SEED_NAME, t.z, t.x, t.y);
    if (answeredFromCache(req, res, etag, HOUR_S)) return;
    sendTile(res, await basemapTile(db, t), MVT_TYPE);
  });

  router.get(BASEMAP_ARCHIVE_PATH.replace(/^\/api/, ""), requireUser(db), (req, res, next) => {
    const { basemap } = config;
    if (basemap.kind !== "pmtiles") throw notFound("A basemap archive");
    res.setHeader("Cache-Control", `private, max-age=${HOUR_S}`);
    // sendFile answers Range requests (206 with Content-Range) and If-Range / ETag itself.
    res.sendFile(basemap.path, { acceptRanges: true, cacheControl: false }, (err?: Error) => {
      if (!err) return;
      if (res.headersSent) return next(err);
      next(notFound("The basemap archive file"));
    });
  });

  router.get(
    "/layers/:layerId/terrain/:z/:x/:y.png",
    requireUser(db),
    loadLayerAccess(db),
    requirePermission("project:read"),
    async (req, res) => {
      const t = validate(tileCoordsSchema, req.params);
      const layer = currentLayer(req);
      if (
        layer.kind !== "terrain" ||
        layer.status !== "ready" ||
        !layer.objectKey ||
        !layer.terrain
      ) {
        throw notFound("This terrain layer");
      }
      const info = layer.terrain as TerrainInfo;
      const etag = tileEtag(
        "terrain",
        TERRAIN_TILE_FORMAT,
        layer.objectKey,
        info.verticalUnit,
        t.z,
        t.x,
        t.y,
      );
      if (answeredFromCache(req, res, etag, DAY_S)) return;
      const png = await terrain.tile({ id: layer.id, objectKey: layer.objectKey, info }, t);
      sendTile(res, png, "image/png");
    },
  );

  return router;
}
