import { and, desc, eq, inArray } from "drizzle-orm";
import { Router, type RequestHandler } from "express";
import { PERMISSIONS } from "../../shared/roles";
import { idSchema } from "../../shared/schemas/common";
import type { OutboxMessage, OutboxMessageSummary } from "../../shared/schemas/outbox";
import { currentUser, requireUser } from "../auth/guards";
import type { Db } from "../db/client";
import { memberships, outboxMessages } from "../db/schema";
import { notFound } from "../http/errors";
import { validateParam } from "../http/validate";
import type { RouteDeps } from "./deps";

const LIST_LIMIT = 200;

/** The Outbox exists only outside production, and only for owners and admins of some team. */
function outboxReader(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const [row] = await db
      .select({ id: memberships.id })
      .from(memberships)
      .where(
        and(
          eq(memberships.userId, currentUser(req).id),
          inArray(memberships.role, [...PERMISSIONS["outbox:read"]]),
        ),
      )
      .limit(1);
    if (!row) throw notFound("The outbox");
    next();
  };
}

export function outboxRouter({ db, config }: RouteDeps): Router {
  const router = Router();
  router.use("/outbox", (_req, _res, next) => {
    if (!config.outboxEnabled) throw notFound("The outbox");
    next();
  });
  router.use("/outbox", requireUser(db), outboxReader(db));

  router.get("/outbox", async (_req, res) => {
    const rows = await db
      .select({
        id: outboxMessages.id,
        to: outboxMessages.to,
        from: outboxMessages.from,
        subject: outboxMessages.subject,
        receivedAt: outboxMessages.receivedAt,
      })
      .from(outboxMessages)
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
    const [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.id, id));
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
