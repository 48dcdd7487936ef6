/**
 * Rainfall tables of a project (IDF data in the project's units, with their source note).
 * The CSV upload route is in rainfall-upload.ts; both store through here.
 */
import { asc, eq } from "drizzle-orm";
import { Router } from "express";
import { createRainfallBody, updateRainfallBody } from "../../shared/schemas/rainfall";
import {
  currentProject,
  currentUser,
  loadProjectAccess,
  requirePermission,
  requireUser,
} from "../auth/guards";
import { rainfallTables } from "../db/schema-geodata";
import { loadViaProject, paramId } from "../geodata/access";
import { toRainfallTable } from "../geodata/rainfall-store";
import { notFound } from "../http/errors";
import { validate } from "../http/validate";
import type { RouteDeps } from "./deps";

export function rainfallRouter({ db }: RouteDeps): Router {
  const router = Router();
  const inProject = [requireUser(db), loadProjectAccess(db)];
  const tableOwner = async (id: string) => {
    const [row] = await db
      .select({ projectId: rainfallTables.projectId })
      .from(rainfallTables)
      .where(eq(rainfallTables.id, id));
    return row?.projectId;
  };
  const oneTable = [requireUser(db), loadViaProject(db, "This rainfall table", tableOwner)];

  router.get(
    "/projects/:projectId/rainfall-tables",
    ...inProject,
    requirePermission("project:read"),
    async (req, res) => {
      const rows = await db
        .select()
        .from(rainfallTables)
        .where(eq(rainfallTables.projectId, currentProject(req).id))
        .orderBy(asc(rainfallTables.createdAt), asc(rainfallTables.id));
      res.json(rows.map(toRainfallTable));
    },
  );

  router.post(
    "/projects/:projectId/rainfall-tables",
    ...inProject,
    requirePermission("project-data:edit"),
    async (req, res) => {
      const body = validate(createRainfallBody, req.body);
      const project = currentProject(req);
      const [row] = await db
        .insert(rainfallTables)
        .values({
          ...body,
          projectId: project.id,
          units: project.units,
          createdBy: currentUser(req).id,
        })
        .returning();
      if (!row) throw new Error("rainfall table insert returned no row");
      res.status(201).json(toRainfallTable(row));
    },
  );

  router.get(
    "/rainfall-tables/:id",
    ...oneTable,
    requirePermission("project:read"),
    async (req, res) => {
      const [row] = await db
        .select()
        .from(rainfallTables)
        .where(eq(rainfallTables.id, paramId(req)));
      if (!row) throw notFound("This rainfall table");
      res.json(toRainfallTable(row));
    },
  );

  router.patch(
    "/rainfall-tables/:id",
    ...oneTable,
    requirePermission("project-data:edit"),
    async (req, res) => {
      const body = validate(updateRainfallBody, req.body);
      const [row] = await db
        .update(rainfallTables)
        .set(body)
        .where(eq(rainfallTables.id, paramId(req)))
        .returning();
      if (!row) throw notFound("This rainfall table");
      res.json(toRainfallTable(row));
    },
  );

  router.delete(
    "/rainfall-tables/:id",
    ...oneTable,
    requirePermission("project-data:edit"),
    async (req, res) => {
      await db.delete(rainfallTables).where(eq(rainfallTables.id, paramId(req)));
      res.status(204).end();
    },
  );

  return router;
}
