/**
 * A project's Design rules. Saving sends the version that was read; if someone saved in between,
 * the answer is 409 and nothing is overwritten.
 */
import { and, eq } from "drizzle-orm";
import { Router } from "express";
import { rulesUnitProblems } from "../../shared/hydrology/rules";
import { designRulesBody } from "../../shared/schemas/design-rules";
import {
  currentProject,
  currentUser,
  loadProjectAccess,
  requirePermission,
  requireUser,
} from "../auth/guards";
import { isUniqueViolation } from "../db/errors";
import { designRules, rainfallTables } from "../db/schema-geodata";
import { loadDesignRules, toDesignRules } from "../geodata/design-rules-store";
import { HttpError, invalidInput } from "../http/errors";
import { validate } from "../http/validate";
import type { RouteDeps } from "./deps";

const stale = (version: number) =>
  new HttpError(
    409,
    "stale_version",
    `These design rules were changed by someone else (now version ${version}); reload them and apply your edit again.`,
  );

export function designRulesRouter({ db }: RouteDeps): Router {
  const router = Router();
  const inProject = [requireUser(db), loadProjectAccess(db)];
  const path = "/projects/:projectId/design-rules";

  router.get(path, ...inProject, requirePermission("project:read"), async (req, res) => {
    res.json(await loadDesignRules(db, currentProject(req).id));
  });

  router.put(path, ...inProject, requirePermission("project-data:edit"), async (req, res) => {
    const body = validate(designRulesBody, req.body);
    const project = currentProject(req);
    const projectId = project.id;
    // K's plausible band depends on the project's unit system, which the body does not carry.
    const unitProblems = rulesUnitProblems(body.rules, project.units === "si" ? "si" : "us");
    if (unitProblems.length > 0) {
      throw invalidInput(
        Object.fromEntries(unitProblems.map((p) => [`rules.${p.path.join(".")}`, p.message])),
      );
    }
    if (body.rainfallTableId !== null) {
      const [table] = await db
        .select({ id: rainfallTables.id })
        .from(rainfallTables)
        .where(
          and(eq(rainfallTables.id, body.rainfallTableId), eq(rainfallTables.projectId, projectId)),
        );
      if (!table)
        throw invalidInput({ rainfallTableId: "This project has no such rainfall table." });
    }
    const values = {
      rules: body.rules,
      dualHsg: body.dualHsg,
      channelSlope: body.channelSlope,
      rainfallTableId: body.rainfallTableId,
      profileSpacingM: body.profileSpacingM,
      updatedBy: currentUser(req).id,
    };
    const row = await db.transaction(async (tx) => {
      if (body.version === 0) {
        const [inserted] = await tx
          .insert(designRules)
          .values({ projectId, ...values, version: 1 })
          .returning()
          .catch(async (err: unknown) => {
            if (!isUniqueViolation(err)) throw err;
            throw stale((await loadDesignRules(db, projectId)).version);
          });
        return inserted;
      }
      const [updated] = await tx
        .update(designRules)
        .set({ ...values, version: body.version + 1 })
        .where(and(eq(designRules.projectId, projectId), eq(designRules.version, body.version)))
        .returning();
      if (!updated) throw stale((await loadDesignRules(tx, projectId)).version);
      return updated;
    });
    res.json(toDesignRules(projectId, row));
  });

  return router;
}
