import { desc, eq, sql } from "drizzle-orm";
import { Router } from "express";
import type { Feature, Geometry } from "geojson";
import { layerFeaturesQuery, layerPollQuery } from "../../shared/schemas/layers";
import { currentProject, loadProjectAccess, requirePermission, requireUser } from "../auth/guards";
import { layers } from "../db/schema-geodata";
import { validate } from "../http/validate";
import { currentLayer, loadLayerAccess } from "../layers/access";
import { toLayer } from "../layers/dto";
import { singleFileUpload, uploadErrors } from "../layers/upload-storage";
import { waitForLayer } from "../layers/wait";
import type { RouteDeps } from "./deps";
import { layerLimit, uploadLayerHandler } from "./layer-upload";

type LayerFeature = Feature & {
  featureIndex: number;
  surfaceClassId: string | null;
  hsg: string | null;
};

interface FeatureRow extends Record<string, unknown> {
  id: number;
  feature_index: number;
  geometry: Geometry;
  attributes: Record<string, unknown>;
  surface_class_id: string | null;
  hsg: string | null;
}

export function layersRouter(deps: RouteDeps): Router {
  const { db, store } = deps;
  const router = Router();
  const project = [requireUser(db), loadProjectAccess(db)];
  const layer = [requireUser(db), loadLayerAccess(db)];

  router.post(
    "/projects/:projectId/layers",
    ...project,
    requirePermission("layer:edit"),
    ...singleFileUpload(deps.config.uploads, (body) => layerLimit(deps, body)),
    uploadErrors,
    uploadLayerHandler(deps),
  );

  router.get(
    "/projects/:projectId/layers",
    ...project,
    requirePermission("project:read"),
    async (req, res) => {
      const rows = await db
        .select()
        .from(layers)
        .where(eq(layers.projectId, currentProject(req).id))
        .orderBy(desc(layers.createdAt), desc(layers.id));
      res.json(await Promise.all(rows.map((row) => toLayer(db, row))));
    },
  );

  // Poll, or long-poll with ?waitMs=: answers as soon as the layer is ready or failed.
  router.get("/layers/:layerId", ...layer, requirePermission("project:read"), async (req, res) => {
    const { waitMs } = validate(layerPollQuery, req.query);
    const row = currentLayer(req);
    const latest = waitMs > 0 ? await waitForLayer(db, deps.jobs.events, row.id, waitMs) : row;
    res.json(await toLayer(db, latest ?? row));
  });

  router.delete("/layers/:layerId", ...layer, requirePermission("layer:edit"), async (req, res) => {
    const row = currentLayer(req);
    // Features and mappings go with the row (foreign keys cascade), in one statement.
    await db.delete(layers).where(eq(layers.id, row.id));
    if (row.objectKey) await store.delete(row.objectKey);
    res.status(204).end();
  });

  // GeoJSON of the features in a bbox, capped: for checking a layer and for the map.
  router.get(
    "/layers/:layerId/features",
    ...layer,
    requirePermission("project:read"),
    async (req, res) => {
      const { bbox, limit } = validate(layerFeaturesQuery, req.query);
      const row = currentLayer(req);
      const inBox = bbox
        ? sql`and geom && ST_MakeEnvelope(${bbox[0]}, ${bbox[1]}, ${bbox[2]}, ${bbox[3]}, 4326)`
        : sql``;
      const result = await db.execute<FeatureRow>(sql`
        select id, feature_index, ST_AsGeoJSON(geom, 8)::json as geometry, attributes,
               surface_class_id, hsg
        from layer_features where layer_id = ${row.id}::uuid ${inBox}
        order by feature_index limit ${limit + 1}`);
      // The file's attributes stay as properties; what Rillmark adds rides beside them.
      const features: LayerFeature[] = result.rows.slice(0, limit).map((f) => ({
        type: "Feature",
        id: f.id,
        geometry: f.geometry,
        properties: f.attributes,
        featureIndex: f.feature_index,
        surfaceClassId: f.surface_class_id,
        hsg: f.hsg,
      }));
      res.json({ type: "FeatureCollection", features, truncated: result.rows.length > limit });
    },
  );

  return router;
}
