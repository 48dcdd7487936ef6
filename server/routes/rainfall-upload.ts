/**
 * A rainfall table from a CSV file (multipart: name, sourceNote, kind, p2_24h, file): parsed
 * with the rainfall CSV reader and checked by the engineering core's IDF rules; any error names
 * the row and column, answers 422 and stores nothing.
 */
import { readFile } from "node:fs/promises";
import { Router, type RequestHandler } from "express";
import { idfSchema } from "../../shared/hydrology";
import { rainfallCsvFields } from "../../shared/schemas/rainfall";
import {
  currentProject,
  currentUser,
  loadProjectAccess,
  requirePermission,
  requireUser,
} from "../auth/guards";
import { rainfallTables } from "../db/schema-geodata";
import { toRainfallTable } from "../geodata/rainfall-store";
import { readRainfallCsv } from "../geodata/readers";
import { withUploadedFile } from "../geodata/upload-file";
import { singleFileUpload, uploadErrors } from "../layers/upload-storage";
import { validate } from "../http/validate";
import type { RouteDeps } from "./deps";

export function rainfallUploadRouter({ db, config }: RouteDeps): Router {
  const router = Router();
  const store = storeHandler(db);
  router.post(
    "/projects/:projectId/rainfall-tables/upload",
    requireUser(db),
    loadProjectAccess(db),
    requirePermission("project-data:edit"),
    ...singleFileUpload(config.uploads, () => ({
      what: "rainfall tables",
      bytes: config.uploads.limitsBytes.rainfall,
    })),
    uploadErrors,
    store,
  );
  return router;
}

function storeHandler(db: RouteDeps["db"]): RequestHandler {
  return async (req, res) => {
    const row = await withUploadedFile(req, async (file) => {
      const fields = validate(rainfallCsvFields, req.body);
      const text = await readFile(file.path, "utf8");
      const { idf } = readRainfallCsv(text, file.originalname, fields.kind);
      // The reader checks the cells; the core's schema checks the table as a whole.
      const checked = validate(idfSchema, idf);
      const project = currentProject(req);
      const [inserted] = await db
        .insert(rainfallTables)
        .values({
          projectId: project.id,
          name: fields.name,
          sourceNote: fields.sourceNote,
          p2_24h: fields.p2_24h,
          idf: checked,
          units: project.units,
          originalFilename: file.originalname.slice(0, 255),
          createdBy: currentUser(req).id,
        })
        .returning();
      return inserted;
    });
    if (!row) throw new Error("rainfall table insert returned no row");
    res.status(201).json(toRainfallTable(row));
  };
}
