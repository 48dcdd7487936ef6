import { and, asc, eq } from "drizzle-orm";
import { Router, type Request } from "express";
import { canAssignRole, type Role } from "../../shared/roles";
import { idSchema } from "../../shared/schemas/common";
import { changeRoleBody, type Member } from "../../shared/schemas/team";
import { currentTeam, loadTeamMembership, requirePermission, requireUser } from "../auth/guards";
import type { Tx } from "../db/client";
import { memberships, users } from "../db/schema";
import { forbidden, HttpError, notFound } from "../http/errors";
import { validate, validateParam } from "../http/validate";
import type { RouteDeps } from "./deps";

const lastOwner = () =>
  new HttpError(
    409,
    "last_owner",
    "A team needs at least one owner. Make someone else an owner first.",
  );

function memberUserId(req: Request): string {
  return validateParam(idSchema, req.params.userId, "This member");
}

/**
 * Lock the team's owner rows and the target's row, so two managers acting at once cannot
 * leave the team without an owner.
 */
async function lockTarget(tx: Tx, teamId: string, userId: string) {
  const owners = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "owner")))
    .for("update");
  const [target] = await tx
    .select({ id: memberships.id, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .for("update");
  if (!target) throw notFound("This member");
  return { target, ownerCount: owners.length };
}

/** Only an owner may change or remove an owner (canAssignRole on the target's current role). */
function assertMayManage(actor: Role, targetRole: Role): void {
  if (!canAssignRole(actor, targetRole)) throw forbidden("Only an owner can change an owner.");
}

export function membersRouter({ db }: RouteDeps): Router {
  const router = Router();
  const path = "/teams/:teamId/members";
  const member = [requireUser(db), loadTeamMembership(db)];
  const manager = [...member, requirePermission("team:manage-members")];

  router.get(path, ...member, requirePermission("team:read"), async (req, res) => {
    const rows = await db
      .select({
        userId: users.id,
        name: users.name,
        email: users.email,
        role: memberships.role,
        joinedAt: memberships.createdAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, currentTeam(req).teamId))
      .orderBy(asc(users.name), asc(users.email));
    const list: Member[] = rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
    res.json(list);
  });

  router.patch(`${path}/:userId`, ...manager, async (req, res) => {
    const userId = memberUserId(req);
    const { role } = validate(changeRoleBody, req.body);
    const team = currentTeam(req);
    await db.transaction(async (tx) => {
      const { target, ownerCount } = await lockTarget(tx, team.teamId, userId);
      assertMayManage(team.role, target.role);
      if (!canAssignRole(team.role, role))
        throw forbidden("Only an owner can make someone an owner.");
      if (target.role === "owner" && role !== "owner" && ownerCount <= 1) throw lastOwner();
      await tx.update(memberships).set({ role }).where(eq(memberships.id, target.id));
    });
    const [row] = await db
      .select({
        userId: users.id,
        name: users.name,
        email: users.email,
        joinedAt: memberships.createdAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, team.teamId), eq(memberships.userId, userId)));
    if (!row) throw notFound("This member");
    const updated: Member = { ...row, role, joinedAt: row.joinedAt.toISOString() };
    res.json(updated);
  });

  router.delete(`${path}/:userId`, ...manager, async (req, res) => {
    const userId = memberUserId(req);
    const team = currentTeam(req);
    await db.transaction(async (tx) => {
      const { target, ownerCount } = await lockTarget(tx, team.teamId, userId);
      assertMayManage(team.role, target.role);
      if (target.role === "owner" && ownerCount <= 1) throw lastOwner();
      await tx.delete(memberships).where(eq(memberships.id, target.id));
    });
    res.status(204).end();
  });

  return router;
}
