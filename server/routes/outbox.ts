import { and, desc, eq, inArray, or, type SQL } from "drizzle-orm";
import { Router } from "express";
import { PERMISSIONS } from "../../shared/roles";
import { idSchema } from "../../shared/schemas/common";
import type { OutboxMessage, OutboxMessageSummary } from "../../shared/schemas/outbox";
import { currentUser, requireUser, type AuthUser } from "../auth/guards";
import type { Db } from "../db/client";
import { memberships, outboxMessages } from "../db/schema";
import { notFound } from "../http/errors";
import { validateParam } from "../http/validate";
import type { RouteDeps } from "./deps";

const LIST_LIMIT = 200;

/**
 * What a reader may see, as a real mailbox would allow: mail addressed to them, and mail sent
 * for a team they manage (its invitations). Personal mail to anyone else (a reset link, an
 * e-mail confirmation) is never shown, whoever asks.
 */
function visibleTo(db: Db, user: AuthUser): SQL | undefined {
  const managedTeams = db
    .select({ teamId: memberships.teamId })
    .from(memberships)
    .where(
      and(
        eq(memberships.userId, user.id),
        inArray(memberships.role, [...PERMISSIONS["outbox:read-team-mail"]]),
      ),
    );
  return or(
    eq(outboxMessages.to, user.email.toLowerCase()),
    inArray(outboxMessages.teamId, managedTeams),
  );
}

/** The local Outbox: only while development mail is in use (config.outboxEnabled). */
export function outboxRouter({ db, config }: RouteDeps): Router {
  const router = Router();
  router.use("/outbox", (_req, _res, next) => {
    if (!config.outboxEnabled) throw notFound("The outbox");
    next();
  });
  router.use("/outbox", requireUser(db));

  router.get("/outbox", async (req, res) => {
    const rows = await db
      .select({
        id: outboxMessages.id,
        to: outboxMessages.to,
        from: outboxMessages.from,
        subject: outboxMessages.subject,
        receivedAt: outboxMessages.receivedAt,
      })
      .from(outboxMessages)
      .where(visibleTo(db, currentUser(req)))
      .orderBy(desc(outboxMessages.receivedAt), desc(outboxMessages.id))
      .limit(LIST_LIMIT);
    const list: OutboxMessageSummary[] = rows.map((r) => ({
      ...r,
      receivedAt: r.receivedAt.toISOString(),
    }));
    res.json(list);
  });

  router.get("/outbox/:id", async (req, res) => {
    const id = validateParam(idSchema, req.params.id, "This message");
    const [row] = await db
      .select()
      .from(outboxMessages)
      .where(and(eq(outboxMessages.id, id), visibleTo(db, currentUser(req))));
    if (!row) throw notFound("This message");
    const message: OutboxMessage = {
      id: row.id,
      to: row.to,
      from: row.from,
      subject: row.subject,
      receivedAt: row.receivedAt.toISOString(),
      text: row.text,
      html: row.html,
    };
    res.json(message);
  });

  return router;
}
