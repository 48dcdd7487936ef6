/**
 * The team's Surface catalog (n, k, CN, C per class, each value with its source) and a project's
 * overrides of it. Reads are for every member; the team catalog is kept by owners and admins,
 * project overrides by those who edit project data.
 */
import { and, eq } from "drizzle-orm";
import { Router } from "express";
import {
  createSurfaceClassBody,
  surfaceOverrideBody,
  surfaceValuesSchema,
  updateSurfaceClassBody,
} from "../../shared/schemas/catalog";
import { idSchema } from "../../shared/schemas/common";
import {
  currentProject,
  currentTeam,
  loadProjectAccess,
  loadTeamMembership,
  requirePermission,
  requireUser,
} from "../auth/guards";
import { isUniqueViolation } from "../db/errors";
import {
  attributeMappings,
  layers,
  projectSurfaceOverrides,
  surfaceClasses,
} from "../db/schema-geodata";
import { loadViaTeam, paramId } from "../geodata/access";
import { ensureTeamCatalog } from "../geodata/catalog-seed";
import { projectClasses, teamClasses, toSurfaceClassDto } from "../geodata/catalog-store";
import { subcatchmentsOverridingWith } from "../geodata/surface-override-store";
import { HttpError, invalidInput, notFound } from "../http/errors";
import { validate, validateParam } from "../http/validate";
import type { RouteDeps } from "./deps";

const keyTaken = (key: string) =>
  invalidInput({ key: `The team already has a class with the key "${key}".` });

export function catalogRouter({ db }: RouteDeps): Router {
  const router = Router();
  const inTeam = [requireUser(db), loadTeamMembership(db)];
  const inProject = [requireUser(db), loadProjectAccess(db)];
  const classOwner = async (id: string) => {
    const [row] = await db
      .select({ teamId: surfaceClasses.teamId })
      .from(surfaceClasses)
      .where(eq(surfaceClasses.id, id));
    return row?.teamId;
  };
  const oneClass = [requireUser(db), loadViaTeam(db, "This surface class", classOwner)];

  router.get(
    "/teams/:teamId/surface-classes",
    ...inTeam,
    requirePermission("project:read"),
    async (req, res) => {
      res.json(await teamClasses(db, currentTeam(req).teamId));
    },
  );

  router.post(
    "/teams/:teamId/surface-classes",
    ...inTeam,
    requirePermission("catalog:edit"),
    async (req, res) => {
      const body = validate(createSurfaceClassBody, req.body);
      const teamId = currentTeam(req).teamId;
      await ensureTeamCatalog(db, teamId);
      const [row] = await db
        .insert(surfaceClasses)
        .values({ ...body, teamId, seededFrom: null })
        .returning()
        .catch((err: unknown) => {
          throw isUniqueViolation(err) ? keyTaken(body.key) : err;
        });
      if (!row) throw new Error("surface class insert returned no row");
      res.status(201).json(toSurfaceClassDto(row));
    },
  );

  router.get(
    "/surface-classes/:id",
    ...oneClass,
    requirePermission("project:read"),
    async (req, res) => {
      const [row] = await db
        .select()
        .from(surfaceClasses)
        .where(eq(surfaceClasses.id, paramId(req)));
      if (!row) throw notFound("This surface class");
      res.json(toSurfaceClassDto(row));
    },
  );

  router.patch(
    "/surface-classes/:id",
    ...oneClass,
    requirePermission("catalog:edit"),
    async (req, res) => {
      const body = validate(updateSurfaceClassBody, req.body);
      const [row] = await db
        .update(surfaceClasses)
        .set(body)
        .where(eq(surfaceClasses.id, paramId(req)))
        .returning()
        .catch((err: unknown) => {
          throw isUniqueViolation(err) ? keyTaken(body.key ?? "") : err;
        });
      if (!row) throw notFound("This surface class");
      res.json(toSurfaceClassDto(row));
    },
  );

  router.delete(
    "/surface-classes/:id",
    ...oneClass,
    requirePermission("catalog:edit"),
    async (req, res) => {
      const id = paramId(req);
      await db.transaction(async (tx) => {
        const used = await tx
          .selectDistinct({ name: layers.name })
          .from(attributeMappings)
          .innerJoin(layers, eq(layers.id, attributeMappings.layerId))
          .where(eq(attributeMappings.surfaceClassId, id));
        if (used.length > 0) {
          const names = used.map((u) => `"${u.name}"`).join(", ");
          throw new HttpError(
            409,
            "class_in_use",
            `This surface class is used by the mapping of ${used.length === 1 ? "layer" : "layers"} ${names}. Map those values to another class first.`,
          );
        }
        const overriding = await subcatchmentsOverridingWith(tx, id);
        if (overriding.length > 0) {
          const names = overriding.map((n) => `"${n}"`).join(", ");
          throw new HttpError(
            409,
            "class_in_use",
            `This surface class is given to a stretch of the flow path of ${overriding.length === 1 ? "subcatchment" : "subcatchments"} ${names}. Change those surface overrides first.`,
          );
        }
        await tx.delete(surfaceClasses).where(eq(surfaceClasses.id, id));
      });
      res.status(204).end();
    },
  );

  router.get(
    "/projects/:projectId/surface-classes",
    ...inProject,
    requirePermission("project:read"),
    async (req, res) => {
      const project = currentProject(req);
      res.json(await projectClasses(db, project.teamId, project.id));
    },
  );

  const overrideTarget = async (teamId: string, raw: unknown) => {
    const classId = validateParam(idSchema, raw, "This surface class");
    const [cls] = await db
      .select()
      .from(surfaceClasses)
      .where(and(eq(surfaceClasses.id, classId), eq(surfaceClasses.teamId, teamId)));
    if (!cls) throw notFound("This surface class");
    return cls;
  };

  router.put(
    "/projects/:projectId/surface-classes/:classId/override",
    ...inProject,
    requirePermission("project-data:edit"),
    async (req, res) => {
      const project = currentProject(req);
      const cls = await overrideTarget(project.teamId, req.params.classId);
      const body = validate(surfaceOverrideBody, req.body);
      // The merged class must still be a valid class (e.g. the design C within its range).
      validate(surfaceValuesSchema, { ...(cls.values as object), ...body.values });
      await db
        .insert(projectSurfaceOverrides)
        .values({
          projectId: project.id,
          surfaceClassId: cls.id,
          values: body.values,
          note: body.note,
        })
        .onConflictDoUpdate({
          target: [projectSurfaceOverrides.projectId, projectSurfaceOverrides.surfaceClassId],
          set: { values: body.values, note: body.note },
        });
      const merged = await projectClasses(db, project.teamId, project.id);
      res.json(merged.find((c) => c.id === cls.id));
    },
  );

  router.delete(
    "/projects/:projectId/surface-classes/:classId/override",
    ...inProject,
    requirePermission("project-data:edit"),
    async (req, res) => {
      const project = currentProject(req);
      const cls = await overrideTarget(project.teamId, req.params.classId);
      await db
        .delete(projectSurfaceOverrides)
        .where(
          and(
            eq(projectSurfaceOverrides.projectId, project.id),
            eq(projectSurfaceOverrides.surfaceClassId, cls.id),
          ),
        );
      res.status(204).end();
    },
  );

  return router;
}
