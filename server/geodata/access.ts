/**
 * Access to objects that live under a project or a team but are addressed by their own id
 * (/api/subcatchments/:id, /api/rainfall-tables/:id, /api/surface-classes/:id): find the owner,
 * then the caller's membership. Someone outside the team gets the same 404 as for an id that is
 * not there; the route's requirePermission then answers 403 for a role too low.
 */
import { and, eq } from "drizzle-orm";
import type { Request, RequestHandler } from "express";
import { idSchema } from "../../shared/schemas/common";
import { currentUser } from "../auth/guards";
import type { Db } from "../db/client";
import { memberships, projects, teams } from "../db/schema";
import { notFound } from "../http/errors";
import { validateParam } from "../http/validate";

async function teamAccess(db: Db, userId: string, teamId: string) {
  const [row] = await db
    .select({ teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, userId), eq(memberships.teamId, teamId)));
  return row;
}

/** `owner(id)` answers the owning project's id, or undefined when there is no such object. */
export function loadViaProject(
  db: Db,
  what: string,
  owner: (id: string) => Promise<string | undefined>,
  param = "id",
): RequestHandler {
  return async (req, _res, next) => {
    const id = validateParam(idSchema, req.params[param], what);
    const projectId = await owner(id);
    if (projectId === undefined) throw notFound(what);
    // The project and the caller's membership of its team in one query.
    const [found] = await db
      .select({ project: projects, teamName: teams.name, role: memberships.role })
      .from(projects)
      .innerJoin(teams, eq(teams.id, projects.teamId))
      .innerJoin(
        memberships,
        and(eq(memberships.teamId, projects.teamId), eq(memberships.userId, currentUser(req).id)),
      )
      .where(eq(projects.id, projectId));
    if (!found) throw notFound(what);
    const { project } = found;
    const access = { teamId: project.teamId, teamName: found.teamName, role: found.role };
    req.rillmark = { ...req.rillmark, team: access, project };
    next();
  };
}

/** As loadViaProject, for objects owned by a team directly. */
export function loadViaTeam(
  db: Db,
  what: string,
  owner: (id: string) => Promise<string | undefined>,
  param = "id",
): RequestHandler {
  return async (req, _res, next) => {
    const id = validateParam(idSchema, req.params[param], what);
    const teamId = await owner(id);
    if (teamId === undefined) throw notFound(what);
    const access = await teamAccess(db, currentUser(req).id, teamId);
    if (!access) throw notFound(what);
    req.rillmark = { ...req.rillmark, team: access };
    next();
  };
}

/** The :id parameter after a loadVia… guard has checked it. */
export function paramId(req: Request, param = "id"): string {
  return idSchema.parse(req.params[param]);
}
