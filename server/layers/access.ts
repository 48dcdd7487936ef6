import { eq } from "drizzle-orm";
import type { Request, RequestHandler } from "express";
import { idSchema } from "../../shared/schemas/common";
import { loadProjectAccess } from "../auth/guards";
import type { Db } from "../db/client";
import { layers } from "../db/schema-geodata";
import { notFound } from "../http/errors";
import { validateParam } from "../http/validate";
import type { LayerRow } from "./dto";

const LAYER = Symbol("layer");
type WithLayer = Request & { [LAYER]?: LayerRow };

/**
 * Routes under /layers/:layerId: find the layer, then check the caller's membership of its
 * project's team exactly as project routes do (another team's layer is a 404).
 */
export function loadLayerAccess(db: Db): RequestHandler {
  const projectAccess = loadProjectAccess(db, "projectId", "This layer");
  return async (req, res, next) => {
    const layerId = validateParam(idSchema, req.params.layerId, "This layer");
    const [row] = await db.select().from(layers).where(eq(layers.id, layerId));
    if (!row) throw notFound("This layer");
    (req as WithLayer)[LAYER] = row;
    req.params.projectId = row.projectId;
    await projectAccess(req, res, (err?: unknown) => {
      if (err) throw err;
    });
    next();
  };
}

export function currentLayer(req: Request): LayerRow {
  const row = (req as WithLayer)[LAYER];
  if (!row) throw new Error("currentLayer() used on a route without loadLayerAccess");
  return row;
}
