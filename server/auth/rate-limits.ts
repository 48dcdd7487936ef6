import type { Request, RequestHandler } from "express";
import { ipKeyGenerator, rateLimit, type Options } from "express-rate-limit";
import type { Config } from "../config";
import { HttpError } from "../http/errors";

/** The e-mail in a body, normalised like the schemas do, or undefined when there is none. */
function bodyEmail(req: Request): string | undefined {
  const body: unknown = req.body;
  if (typeof body !== "object" || body === null || !("email" in body)) return undefined;
  const email = (body as { email: unknown }).email;
  return typeof email === "string" && email.trim() !== "" ? email.trim().toLowerCase() : undefined;
}

function limiter(windowMs: number, limit: number, extra: Partial<Options>): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, res, _next, options) => {
      const minutes = Math.max(1, Math.ceil(options.windowMs / 60_000));
      const err = new HttpError(
        429,
        "rate_limited",
        `Too many attempts. Wait ${minutes} minutes and try again.`,
      );
      res.status(429).json(err.toJSON());
    },
    ...extra,
  });
}

const byIp = (req: Request) => ipKeyGenerator(req.ip ?? "unknown");

export interface RateLimiters {
  signIn: RequestHandler[];
  emailRequest: RequestHandler[];
}

/**
 * One set per app (each with its own memory store). Sign-in counts failed attempts only, per
 * IP and per account; requests that send e-mail (sign-up, reset) count every attempt, per IP
 * and per target address so nobody can flood an inbox.
 */
export function createRateLimiters(config: Config): RateLimiters {
  const { windowMs, signInPerAccount, signInPerIp, emailPerIp, emailPerAddress } =
    config.rateLimits;
  return {
    signIn: [
      limiter(windowMs, signInPerIp, { keyGenerator: byIp, skipSuccessfulRequests: true }),
      limiter(windowMs, signInPerAccount, {
        keyGenerator: (req) => `account:${bodyEmail(req) ?? ""}`,
        skip: (req) => bodyEmail(req) === undefined,
        skipSuccessfulRequests: true,
      }),
    ],
    emailRequest: [
      limiter(windowMs, emailPerIp, { keyGenerator: byIp }),
      limiter(windowMs, emailPerAddress, {
        keyGenerator: (req) => `address:${bodyEmail(req) ?? ""}`,
        skip: (req) => bodyEmail(req) === undefined,
      }),
    ],
  };
}
