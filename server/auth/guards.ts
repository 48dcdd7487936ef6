import { and, eq } from "drizzle-orm";
import type { Request, RequestHandler } from "express";
import { can, type Permission, type Role } from "../../shared/roles";
import { idSchema } from "../../shared/schemas/common";
import type { Db } from "../db/client";
import { memberships, projects, teams, users } from "../db/schema";
import { forbidden, notFound, unauthenticated } from "../http/errors";
import { validateParam } from "../http/validate";

export interface AuthUser {
  id: string;
  email: string;
  name: string;
}
export interface TeamAccess {
  teamId: string;
  teamName: string;
  role: Role;
}
export type ProjectRow = typeof projects.$inferSelect;

interface RequestContext {
  user?: AuthUser;
  team?: TeamAccess;
  project?: ProjectRow;
}

declare module "express-serve-static-core" {
  interface Request {
    rillmark?: RequestContext;
  }
}

function context(req: Request): RequestContext {
  req.rillmark ??= {};
  return req.rillmark;
}

export function currentUser(req: Request): AuthUser {
  const user = req.rillmark?.user;
  if (!user) throw unauthenticated();
  return user;
}

export function currentTeam(req: Request): TeamAccess {
  const team = req.rillmark?.team;
  if (!team) throw new Error("currentTeam() used on a route without loadTeamMembership");
  return team;
}

export function currentProject(req: Request): ProjectRow {
  const project = req.rillmark?.project;
  if (!project) throw new Error("currentProject() used on a route without loadProjectAccess");
  return project;
}

/** The signed-in user, read fresh from the database (a deleted account signs out). */
export async function findSessionUser(db: Db, req: Request): Promise<AuthUser | undefined> {
  const userId = req.session.userId;
  if (!userId) return undefined;
  const [user] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.id, userId));
  return user;
}

export function requireUser(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const user = await findSessionUser(db, req);
    if (!user) throw unauthenticated();
    context(req).user = user;
    next();
  };
}

async function membershipOf(db: Db, userId: string, teamId: string) {
  const [row] = await db
    .select({ teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, userId), eq(memberships.teamId, teamId)));
  return row;
}

/** Routes under /teams/:teamId: a non-member gets 404, exactly as for a team that is not there. */
export function loadTeamMembership(db: Db, param = "teamId"): RequestHandler {
  return async (req, _res, next) => {
    const teamId = validateParam(idSchema, req.params[param], "This team");
    const access = await membershipOf(db, currentUser(req).id, teamId);
    if (!access) throw notFound("This team");
    context(req).team = access;
    next();
  };
}

/**
 * Routes under /projects/:projectId: find the project's team, then the caller's membership.
 * `what` names the object the route is about (a layer reached through its project answers
 * "This layer" either way, so the message never tells which step failed).
 */
export function loadProjectAccess(
  db: Db,
  param = "projectId",
  what = "This project",
): RequestHandler {
  return async (req, _res, next) => {
    const projectId = validateParam(idSchema, req.params[param], what);
    const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
    if (!project) throw notFound(what);
    const access = await membershipOf(db, currentUser(req).id, project.teamId);
    if (!access) throw notFound(what);
    const ctx = context(req);
    ctx.team = access;
    ctx.project = project;
    next();
  };
}

/** After loadTeamMembership / loadProjectAccess: a member whose role is too low gets 403. */
export function requirePermission(permission: Permission): RequestHandler {
  return (req, _res, next) => {
    if (!can(currentTeam(req).role, permission)) throw forbidden();
    next();
  };
}
