/**
 * A flow path or a boundary from a file (KML/KMZ, GPX, GeoJSON, zipped shapefile) through the
 * same readers as layer uploads: the file must hold exactly one line (or one polygon), else 422
 * saying how many it holds. Each goes in under the version sent (form field "version"): the
 * path's for a path, the subcatchment's for a boundary.
 */
import type { Feature, Geometry } from "geojson";
import { Router, type RequestHandler } from "express";
import { z } from "zod";
import { boundarySchema, lineStringSchema } from "../../shared/schemas/subcatchments";
import { currentUser, requirePermission, requireUser } from "../auth/guards";
import type { Db } from "../db/client";
import { loadViaProject, paramId } from "../geodata/access";
import { writeFlowPath } from "../geodata/flow-path-store";
import { detectFormat, readVectorFile } from "../geodata/readers";
import { VECTOR_FORMATS, type VectorFormat } from "../geodata/readers/types";
import {
  checkBoundary,
  geomFromJson,
  writeSubcatchmentFields,
} from "../geodata/subcatchment-store";
import { withUploadedFile } from "../geodata/upload-file";
import { HttpError } from "../http/errors";
import { validate } from "../http/validate";
import { singleFileUpload, uploadErrors } from "../layers/upload-storage";
import type { RouteDeps } from "./deps";
import { answerSubcatchment, subcatchmentOwner } from "./subcatchments";

const versionField = z.strictObject({
  version: z.coerce
    .number()
    .int()
    .min(0, "must be the path version you read (0 for a new path)")
    .default(0),
});

function wrongCount(file: string, found: number, what: string): HttpError {
  return new HttpError(
    422,
    "wrong_feature_count",
    `${file}: expected exactly one ${what}, found ${found}.`,
    { file },
  );
}

async function readOne(
  file: Express.Multer.File,
  keep: (g: Geometry) => boolean,
  what: string,
): Promise<Feature<Geometry>> {
  const format = await detectFormat(file.path, file.originalname);
  if (!(VECTOR_FORMATS as readonly string[]).includes(format)) {
    throw new HttpError(
      415,
      "unsupported_file",
      `${file.originalname}: send KML, KMZ, GPX, GeoJSON or a zipped shapefile.`,
    );
  }
  const read = await readVectorFile(file.path, format as VectorFormat, file.originalname);
  const found = read.features.filter((f) => keep(f.geometry));
  const [only] = found;
  if (found.length !== 1 || !only) throw wrongCount(file.originalname, found.length, what);
  return only;
}

const isLine = (g: Geometry) =>
  g.type === "LineString" || (g.type === "MultiLineString" && g.coordinates.length === 1);
const isArea = (g: Geometry) => g.type === "Polygon" || g.type === "MultiPolygon";

function pathHandler(db: Db): RequestHandler {
  return async (req, res) => {
    const id = paramId(req);
    await withUploadedFile(req, async (file) => {
      const { version } = validate(versionField, req.body);
      const feature = await readOne(file, isLine, "line (the flow path)");
      const g = feature.geometry;
      // GPX tracks may carry elevations: they are dropped (the terrain and survey give them).
      const coords =
        g.type === "MultiLineString"
          ? (g.coordinates[0] ?? [])
          : g.type === "LineString"
            ? g.coordinates
            : [];
      const line = validate(lineStringSchema, {
        type: "LineString",
        coordinates: coords.map((c) => [c[0], c[1]]),
      });
      await db.transaction((tx) => writeFlowPath(tx, id, line, version, currentUser(req).id));
    });
    res.json(await answerSubcatchment(db, req));
  };
}

/** The boundary is one of the subcatchment's own fields: it goes in under that version. */
const subcatchmentVersionField = z.strictObject({
  version: z.coerce
    .number({ error: "send the subcatchment's version you read" })
    .int()
    .min(1, "must be the subcatchment's version you read"),
});

function boundaryHandler(db: Db): RequestHandler {
  return async (req, res) => {
    const id = paramId(req);
    await withUploadedFile(req, async (file) => {
      const { version } = validate(subcatchmentVersionField, req.body);
      const feature = await readOne(file, isArea, "polygon (the boundary)");
      const boundary = validate(boundarySchema, {
        type: feature.geometry.type,
        coordinates: (feature.geometry as { coordinates: unknown }).coordinates,
      });
      await checkBoundary(db, boundary);
      await writeSubcatchmentFields(db, id, version, { boundary: geomFromJson(boundary) });
    });
    res.json(await answerSubcatchment(db, req));
  };
}

export function subcatchmentFilesRouter({ db, config }: RouteDeps): Router {
  const router = Router();
  const guard = [
    requireUser(db),
    loadViaProject(db, "This subcatchment", subcatchmentOwner(db)),
    requirePermission("geometry:edit"),
  ];
  const upload = [
    ...singleFileUpload(config.uploads, () => ({
      what: "flow path and boundary files",
      bytes: config.uploads.limitsBytes.vector,
    })),
    uploadErrors,
  ];
  router.post("/subcatchments/:id/flow-path/file", ...guard, ...upload, pathHandler(db));
  router.post("/subcatchments/:id/boundary/file", ...guard, ...upload, boundaryHandler(db));
  return router;
}
