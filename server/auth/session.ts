import connectPgSimple from "connect-pg-simple";
import { and, ne, sql } from "drizzle-orm";
import type { Request, RequestHandler } from "express";
import session from "express-session";
import type pg from "pg";
import type { AppConfig } from "../config";
import type { DbOrTx } from "../db/client";
import { userSessions } from "../db/schema";

declare module "express-session" {
  interface SessionData {
    userId: string;
  }
}

export const SESSION_COOKIE = "rillmark.sid";
export const SESSION_TABLE = "user_sessions";

/**
 * Sessions live in PostgreSQL (docs/decisions/001-sessions.md). The table comes from our
 * migrations, so the store never creates it. Pruning runs on a timer; tests turn it off.
 */
export type SessionStore = session.Store & { close(): void };

export function createSessionStore(
  pool: pg.Pool,
  options: { pruneIntervalSeconds: number | false } = { pruneIntervalSeconds: 900 },
): SessionStore {
  const PgStore = connectPgSimple(session);
  return new PgStore({
    pool,
    tableName: SESSION_TABLE,
    createTableIfMissing: false,
    pruneSessionInterval: options.pruneIntervalSeconds,
    // The cookie's expiry is fixed at sign-in (rolling: false), so moving the row's expiry on
    // every request only wrote a row per request and let it outlive the cookie.
    disableTouch: true,
  });
}

export function sessionMiddleware(config: AppConfig, store: session.Store): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    proxy: config.trustProxy,
    cookie: {
      httpOnly: true,
      sameSite: "lax",
      secure: config.publicBaseUrl.startsWith("https:"),
      maxAge: config.sessionMaxAgeMs,
      path: "/",
    },
  });
}

/** A fresh session id for a sign-in, so an id planted before sign-in is worthless after it. */
export async function signInSession(req: Request, userId: string): Promise<void> {
  await new Promise<void>((resolve, reject) =>
    req.session.regenerate((err: unknown) => (err ? reject(err) : resolve())),
  );
  req.session.userId = userId;
  await new Promise<void>((resolve, reject) =>
    req.session.save((err: unknown) => (err ? reject(err) : resolve())),
  );
}

export async function destroySession(req: Request): Promise<void> {
  await new Promise<void>((resolve, reject) =>
    req.session.destroy((err: unknown) => (err ? reject(err) : resolve())),
  );
}

/** Sign a user out everywhere, optionally keeping one session (the one changing the password). */
export async function deleteUserSessions(
  db: DbOrTx,
  userId: string,
  keepSid?: string,
): Promise<void> {
  const ofUser = sql`(${userSessions.sess}->>'userId') = ${userId}`;
  await db
    .delete(userSessions)
    .where(keepSid ? and(ofUser, ne(userSessions.sid, keepSid)) : ofUser);
}
