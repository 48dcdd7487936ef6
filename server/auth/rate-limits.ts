import { createHash } from "node:crypto";
import type { Request, RequestHandler, Response } from "express";
import { ipKeyGenerator } from "express-rate-limit";
import type pg from "pg";
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import type { AppConfig, RateLimitConfig } from "../config";
import { HttpError } from "../http/errors";
import { deviceCookies } from "./device-cookie";
import { createSignInGuard, type SignInGuard } from "./sign-in-guard";

/** The table our migrations create (server/db/schema.ts `rateLimits`). */
export const RATE_LIMIT_TABLE = "rate_limits";

/** One named counter: `points` events per `durationMs`, kept in PostgreSQL. */
export type Counter = RateLimiterPostgres;

export interface CounterFactory {
  (name: string, points: number, durationMs: number): Counter;
}

/**
 * Counters in the rate_limits table (docs/decisions/011-sign-in-limits.md): every process on the
 * database shares them and a restart keeps them. Only the first counter prunes expired rows (the
 * store's own timer); the rest would only repeat the same delete.
 */
export function counterFactory(pool: pg.Pool, config: RateLimitConfig): CounterFactory {
  let pruning = config.pruneExpired;
  return (name, points, durationMs) => {
    const counter = new RateLimiterPostgres({
      storeClient: pool,
      storeType: "pool",
      tableName: RATE_LIMIT_TABLE,
      tableCreated: true,
      clearExpiredByTimeout: pruning,
      keyPrefix: `${config.keyPrefix}${name}`,
      points,
      duration: Math.max(1, Math.ceil(durationMs / 1000)),
    });
    pruning = false;
    return counter;
  };
}

/** A client's address as a key; IPv6 by its /56, which one subscriber usually holds whole. */
export function ipKey(req: Request): string {
  return ipKeyGenerator(req.ip ?? "unknown");
}

/** An e-mail address as a key: hashed, so the table holds no addresses and keys stay short. */
export function emailKey(email: string): string {
  return createHash("sha256").update(email.trim().toLowerCase(), "utf8").digest("base64url");
}

/** The 429 answer, with Retry-After in whole seconds. */
export function tooManyAttempts(res: Response, retryAfterMs: number): HttpError {
  const seconds = Math.max(1, Math.ceil(retryAfterMs / 1000));
  res.setHeader("Retry-After", String(seconds));
  const wait = seconds < 120 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`;
  return new HttpError(429, "rate_limited", `Too many attempts. Wait ${wait} and try again.`);
}

/** Consumes one point; a store failure is an error (500), never a free pass or a count. */
async function take(counter: Counter, key: string, res: Response): Promise<void> {
  try {
    await counter.consume(key);
  } catch (err) {
    if (err instanceof RateLimiterRes) throw tooManyAttempts(res, err.msBeforeNext);
    throw err;
  }
}

/** The e-mail in a body, normalised like the schemas do, or undefined when there is none. */
function bodyEmail(req: Request): string | undefined {
  const body: unknown = req.body;
  if (typeof body !== "object" || body === null || !("email" in body)) return undefined;
  const email = (body as { email: unknown }).email;
  return typeof email === "string" && email.trim() !== "" ? email.trim().toLowerCase() : undefined;
}

export interface RateLimiters {
  signIn: SignInGuard;
  /** Requests that send e-mail (sign-up, reset): every attempt counts, per IP and address. */
  emailRequest: RequestHandler;
}

export function createRateLimiters(pool: pg.Pool, config: AppConfig): RateLimiters {
  const limits = config.rateLimits;
  const counter = counterFactory(pool, limits);
  const mailByIp = counter("mail-ip:", limits.emailPerIp, limits.windowMs);
  const mailByAddress = counter("mail-to:", limits.emailPerAddress, limits.windowMs);
  return {
    signIn: createSignInGuard(counter, limits, deviceCookies(config)),
    emailRequest: async (req, res, next) => {
      await take(mailByIp, ipKey(req), res);
      const email = bodyEmail(req);
      if (email !== undefined) await take(mailByAddress, emailKey(email), res);
      next();
    },
  };
}
