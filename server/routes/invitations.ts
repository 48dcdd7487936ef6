import { and, desc, eq, gt, isNull } from "drizzle-orm";
import { Router } from "express";
import type { InvitationPreview } from "../../shared/schemas/auth";
import { canAssignRole } from "../../shared/roles";
import { acceptInvitationBody } from "../../shared/schemas/auth";
import { inviteBody, type Invitation } from "../../shared/schemas/team";
import { idSchema, tokenSchema } from "../../shared/schemas/common";
import {
  currentTeam,
  currentUser,
  findSessionUser,
  loadTeamMembership,
  requirePermission,
  requireUser,
} from "../auth/guards";
import { hashPassword } from "../auth/password";
import { signInSession } from "../auth/session";
import { sessionInfo } from "../auth/session-info";
import { expiresIn, hashToken, newToken, TOKEN_LIFETIME_MS } from "../auth/tokens";
import type { DbOrTx } from "../db/client";
import { isUniqueViolation } from "../db/errors";
import { invitations, memberships, teams, users } from "../db/schema";
import { forbidden, HttpError, invalidInput, linkExpired, notFound } from "../http/errors";
import { validate, validateParam } from "../http/validate";
import { invitationMail } from "../mail/templates";
import type { RouteDeps } from "./deps";

type InvitationRow = typeof invitations.$inferSelect;

function isOpen(inv: InvitationRow, now = new Date()): boolean {
  return !inv.acceptedAt && !inv.revokedAt && inv.expiresAt > now;
}

/** Still-open invitations of a team (not accepted, not revoked, not expired). */
export function openInvitationsOf(teamId: string) {
  return and(
    eq(invitations.teamId, teamId),
    isNull(invitations.acceptedAt),
    isNull(invitations.revokedAt),
    gt(invitations.expiresAt, new Date()),
  );
}

async function userIdByEmail(db: DbOrTx, email: string): Promise<string | undefined> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return row?.id;
}

/** The link an invitee follows: preview, then accept (creating the account when new). */
export function invitationLinkRouter({ db }: RouteDeps): Router {
  const router = Router();

  router.get("/invitations/:token", async (req, res) => {
    const token = validateParam(tokenSchema, req.params.token, "This invitation");
    const [row] = await db
      .select({ invitation: invitations, teamName: teams.name, inviterName: users.name })
      .from(invitations)
      .innerJoin(teams, eq(teams.id, invitations.teamId))
      .leftJoin(users, eq(users.id, invitations.invitedBy))
      .where(eq(invitations.tokenHash, hashToken(token)));
    if (!row) throw notFound("This invitation");
    if (!isOpen(row.invitation)) throw linkExpired();
    const preview: InvitationPreview = {
      teamName: row.teamName,
      email: row.invitation.email,
      role: row.invitation.role,
      invitedBy: row.inviterName ?? "A team admin",
      accountExists: (await userIdByEmail(db, row.invitation.email)) !== undefined,
    };
    res.json(preview);
  });

  router.post("/invitations/:token/accept", async (req, res) => {
    const token = validateParam(tokenSchema, req.params.token, "This invitation");
    const body = validate(acceptInvitationBody, req.body);
    const signedIn = await findSessionUser(db, req);
    const userId = await db
      .transaction(async (tx) => {
        const [inv] = await tx
          .select()
          .from(invitations)
          .where(eq(invitations.tokenHash, hashToken(token)))
          .for("update");
        if (!inv) throw notFound("This invitation");
        if (!isOpen(inv)) throw linkExpired();
        let id = await userIdByEmail(tx, inv.email);
        if (id !== undefined && signedIn?.id !== id) {
          throw new HttpError(
            409,
            "account_exists",
            `${inv.email} already has an account: sign in first, then open the invitation again.`,
          );
        }
        if (id === undefined) {
          const missing: Record<string, string> = {};
          if (!body.name) missing.name = "Enter your name.";
          if (!body.password) missing.password = "Choose a password.";
          if (!body.name || !body.password) throw invalidInput(missing);
          const passwordHash = await hashPassword(body.password);
          const [created] = await tx
            .insert(users)
            .values({ email: inv.email, name: body.name, passwordHash })
            .returning({ id: users.id });
          id = created?.id;
        }
        if (id === undefined) throw new Error("user insert returned no row");
        await tx
          .insert(memberships)
          .values({ teamId: inv.teamId, userId: id, role: inv.role })
          .onConflictDoNothing();
        await tx
          .update(invitations)
          .set({ acceptedAt: new Date() })
          .where(eq(invitations.id, inv.id));
        return id;
      })
      .catch((err: unknown) => {
        if (!isUniqueViolation(err)) throw err;
        throw new HttpError(409, "account_exists", "That account was just created. Sign in first.");
      });
    if (signedIn?.id !== userId) await signInSession(req, userId);
    res.json(await sessionInfo(db, userId));
  });

  return router;
}

function toInvitation(inv: InvitationRow, inviterName: string | null): Invitation {
  return {
    id: inv.id,
    email: inv.email,
    role: inv.role,
    invitedBy: inviterName ?? "A former member",
    createdAt: inv.createdAt.toISOString(),
    expiresAt: inv.expiresAt.toISOString(),
  };
}

/** A team's pending invitations: list, invite (e-mails the link), revoke. Managers only. */
export function teamInvitationsRouter({ db, config, mailer }: RouteDeps): Router {
  const router = Router();
  const path = "/teams/:teamId/invitations";
  router.use(
    path,
    requireUser(db),
    loadTeamMembership(db),
    requirePermission("team:manage-members"),
  );

  router.get(path, async (req, res) => {
    const rows = await db
      .select({ invitation: invitations, inviterName: users.name })
      .from(invitations)
      .leftJoin(users, eq(users.id, invitations.invitedBy))
      .where(openInvitationsOf(currentTeam(req).teamId))
      .orderBy(desc(invitations.createdAt));
    res.json(rows.map((r) => toInvitation(r.invitation, r.inviterName)));
  });

  router.post(path, async (req, res) => {
    const body = validate(inviteBody, req.body);
    const team = currentTeam(req);
    const actor = currentUser(req);
    if (!canAssignRole(team.role, body.role)) {
      throw forbidden("Only an owner can invite someone as an owner.");
    }
    const invitation = await db.transaction(async (tx) => {
      const [member] = await tx
        .select({ id: memberships.id })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.teamId, team.teamId), eq(users.email, body.email)));
      if (member) {
        throw new HttpError(409, "already_member", `${body.email} is already in this team.`, {
          email: "Already a member of this team.",
        });
      }
      // A new invitation replaces an open one to the same address (the old link stops working).
      await tx
        .update(invitations)
        .set({ revokedAt: new Date() })
        .where(and(openInvitationsOf(team.teamId), eq(invitations.email, body.email)));
      const { token, tokenHash } = newToken();
      const [row] = await tx
        .insert(invitations)
        .values({
          teamId: team.teamId,
          email: body.email,
          role: body.role,
          tokenHash,
          invitedBy: actor.id,
          expiresAt: expiresIn(TOKEN_LIFETIME_MS.invitation),
        })
        .returning();
      if (!row) throw new Error("invitation insert returned no row");
      const mail = invitationMail({
        baseUrl: config.publicBaseUrl,
        token,
        teamName: team.teamName,
        inviterName: actor.name,
        role: body.role,
      });
      // Sent inside the transaction: if the mail server refuses it, no dead invitation remains.
      await mailer.send(body.email, mail, { teamId: team.teamId }).catch((err: unknown) => {
        console.error("Invitation mail failed:", err instanceof Error ? err.message : err);
        throw new HttpError(
          502,
          "mail_failed",
          "The invitation e-mail could not be sent. Try again.",
        );
      });
      return row;
    });
    res.status(201).json(toInvitation(invitation, actor.name));
  });

  router.delete(`${path}/:invitationId`, async (req, res) => {
    const invitationId = validateParam(idSchema, req.params.invitationId, "This invitation");
    const revoked = await db
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(openInvitationsOf(currentTeam(req).teamId), eq(invitations.id, invitationId)))
      .returning({ id: invitations.id });
    if (revoked.length === 0) throw notFound("This invitation");
    res.status(204).end();
  });

  return router;
}
