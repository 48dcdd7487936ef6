import { desc, eq } from "drizzle-orm";
import { Router } from "express";
import { createProjectBody, updateProjectBody, type Project } from "../../shared/schemas/projects";
import {
  currentProject,
  currentTeam,
  currentUser,
  loadProjectAccess,
  loadTeamMembership,
  requirePermission,
  requireUser,
  type ProjectRow,
} from "../auth/guards";
import { projects } from "../db/schema";
import { notFound } from "../http/errors";
import { validate } from "../http/validate";
import type { RouteDeps } from "./deps";

export function toProject(row: ProjectRow): Project {
  return {
    id: row.id,
    teamId: row.teamId,
    name: row.name,
    description: row.description,
    units: row.units,
    designReturnPeriodYears: row.designReturnPeriodYears,
    isDemo: row.isDemo,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export function projectsRouter({ db }: RouteDeps): Router {
  const router = Router();
  const inTeam = [requireUser(db), loadTeamMembership(db)];
  const project = [requireUser(db), loadProjectAccess(db)];

  router.get(
    "/teams/:teamId/projects",
    ...inTeam,
    requirePermission("project:read"),
    async (req, res) => {
      const rows = await db
        .select()
        .from(projects)
        .where(eq(projects.teamId, currentTeam(req).teamId))
        .orderBy(desc(projects.updatedAt), desc(projects.id));
      res.json(rows.map(toProject));
    },
  );

  router.post(
    "/teams/:teamId/projects",
    ...inTeam,
    requirePermission("project:create"),
    async (req, res) => {
      const body = validate(createProjectBody, req.body);
      const [row] = await db
        .insert(projects)
        .values({ ...body, teamId: currentTeam(req).teamId, createdBy: currentUser(req).id })
        .returning();
      if (!row) throw new Error("project insert returned no row");
      res.status(201).json(toProject(row));
    },
  );

  router.get("/projects/:projectId", ...project, requirePermission("project:read"), (req, res) => {
    res.json(toProject(currentProject(req)));
  });

  router.patch(
    "/projects/:projectId",
    ...project,
    requirePermission("project:edit"),
    async (req, res) => {
      const body = validate(updateProjectBody, req.body);
      const current = currentProject(req);
      if (Object.keys(body).length === 0) {
        res.json(toProject(current));
        return;
      }
      const [row] = await db
        .update(projects)
        .set(body)
        .where(eq(projects.id, current.id))
        .returning();
      if (!row) throw notFound("This project");
      res.json(toProject(row));
    },
  );

  router.delete(
    "/projects/:projectId",
    ...project,
    requirePermission("project:delete"),
    async (req, res) => {
      await db.delete(projects).where(eq(projects.id, currentProject(req).id));
      res.status(204).end();
    },
  );

  return router;
}
