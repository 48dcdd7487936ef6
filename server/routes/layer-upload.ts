import { randomUUID } from "node:crypto";
import { rm } from "node:fs/promises";
import path from "node:path";
import { eq } from "drizzle-orm";
import type { RequestHandler } from "express";
import { uploadLayerFields, type LayerError, type LayerKind } from "../../shared/schemas/layers";
import { currentProject, currentUser } from "../auth/guards";
import { layers } from "../db/schema-geodata";
import { ReadError, type FileFormat } from "../geodata/readers/types";
import { HttpError, invalidInput } from "../http/errors";
import { validate } from "../http/validate";
import { toLayer } from "../layers/dto";
import { preflight } from "../layers/preflight";
import { tooLarge } from "../layers/upload-storage";
import { waitForLayer } from "../layers/wait";
import type { RouteDeps } from "./deps";

const EXTENSIONS: Record<FileFormat, string> = {
  shapefile: ".zip",
  kml: ".kml",
  kmz: ".kmz",
  gpx: ".gpx",
  geojson: ".geojson",
  geotiff: ".tif",
  csv: ".csv",
};

/**
 * The size limit of the layer kind the form announced before the file; a form that names its
 * kind only after the file is held to the largest limit while streaming and checked after.
 */
export function layerLimit(deps: RouteDeps, body: Record<string, unknown>) {
  const { vector, terrain } = deps.config.uploads.limitsBytes;
  if (body.kind === undefined) {
    return { what: "any layer", bytes: Math.max(vector, terrain) };
  }
  return body.kind === "terrain"
    ? { what: "terrain files", bytes: terrain }
    : { what: "vector layers", bytes: vector };
}

export function httpErrorOf(err: ReadError | LayerError): HttpError {
  const where = err.where ? { where: err.where } : undefined;
  return new HttpError(err.status, err.code, err.message, where);
}

function defaultName(originalName: string): string {
  return path.basename(originalName, path.extname(originalName)).slice(0, 160) || "Layer";
}

/**
 * The upload itself, after multer has streamed the file to disk: cheap checks at once (4xx),
 * then the original into object storage, the layer row and the ingest job. The request waits a
 * few seconds for the job: done → 201 (or the job's 4xx, with nothing kept); still going →
 * 202 with the layer, to be polled at /api/layers/:layerId?waitMs=…
 */
export function uploadLayerHandler(deps: RouteDeps): RequestHandler {
  const { db, store, jobs } = deps;
  return async (req, res) => {
    const file = req.file;
    let handedToJob = false;
    try {
      const fields = validate(uploadLayerFields, req.body);
      if (!file) throw invalidInput({ file: "Choose a file to upload." });
      const limit = layerLimit(deps, fields);
      if (file.size > limit.bytes) throw tooLarge(limit.what, limit.bytes);
      if (file.size === 0) throw invalidInput({ file: `${file.originalname} is empty.` });
      let format: FileFormat;
      try {
        format = await preflight(file.path, file.originalname, fields.kind, fields.verticalUnit);
      } catch (err) {
        throw err instanceof ReadError ? httpErrorOf(err) : err;
      }

      const project = currentProject(req);
      const layerId = randomUUID();
      const objectKey = `projects/${project.id}/layers/${layerId}/original${EXTENSIONS[format]}`;
      const kind: LayerKind = fields.kind;
      await db.insert(layers).values({
        id: layerId,
        projectId: project.id,
        kind,
        name: fields.name || defaultName(file.originalname),
        format,
        originalFilename: file.originalname.slice(0, 255),
        sizeBytes: file.size,
        objectKey,
        status: "queued",
        progress: {
          stage: "received",
          bytesReceived: file.size,
          bytesTotal: file.size,
          featuresDone: 0,
          featuresTotal: 0,
        },
        terrain: kind === "terrain" ? { verticalUnit: fields.verticalUnit } : null,
        createdBy: currentUser(req).id,
      });
      let jobId: string;
      try {
        await store.putFile(objectKey, file.path);
        jobId = await jobs.sendIngest({ layerId, uploadPath: file.path });
        handedToJob = true;
      } catch (err) {
        await db.delete(layers).where(eq(layers.id, layerId));
        await store.delete(objectKey).catch(() => undefined);
        throw err;
      }

      const row = await waitForLayer(db, jobs.events, layerId, deps.config.uploads.waitMs);
      if (!row) throw new HttpError(409, "layer_deleted", "The layer was deleted meanwhile.");
      if (row.status === "failed") {
        // Refused while the client was still waiting: nothing of it stays.
        await db.delete(layers).where(eq(layers.id, layerId));
        await jobs.deleteJob(jobId);
        const error = row.error as LayerError | null;
        throw error
          ? httpErrorOf(error)
          : new HttpError(500, "internal_error", "The file could not be processed.");
      }
      res
        .status(row.status === "ready" ? 201 : 202)
        .location(`/api/layers/${layerId}`)
        .json(await toLayer(db, row));
    } finally {
      if (file && !handedToJob) await rm(file.path, { force: true });
    }
  };
}
