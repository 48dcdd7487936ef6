import { createHmac, randomBytes, timingSafeEqual } from "node:crypto";
import { parse as parseCookies } from "cookie";
import type { Request, Response } from "express";
import type { AppConfig } from "../config";

/**
 * A device that has signed in to an account keeps a signed cookie naming that account, so a
 * lock others caused by guessing its password does not shut it out (OWASP's "device cookies"
 * against online guessing; docs/decisions/011-sign-in-limits.md). It proves nothing by itself:
 * the password is still checked, and the device has its own failure allowance.
 */
export const DEVICE_COOKIE = "rillmark.device";
const MAX_AGE_MS = 180 * 24 * 3_600_000;

function signer(config: AppConfig) {
  // A key of its own, derived from the session secret, so the two signatures never mix.
  const key = createHmac("sha256", config.sessionSecret).update("rillmark device cookie").digest();
  return (nonce: string, email: string) =>
    createHmac("sha256", key).update(`${nonce}\n${email}`).digest("base64url");
}

export interface DeviceCookies {
  /** The device's id when it carries a valid cookie for `email`, else undefined. */
  read(req: Request, email: string): string | undefined;
  /** Marks this device as one `email` has signed in from (keeps its id when it had one). */
  issue(res: Response, email: string, deviceId?: string): void;
}

export function deviceCookies(config: AppConfig): DeviceCookies {
  const sign = signer(config);
  return {
    read(req, email) {
      const raw = parseCookies(req.get("cookie") ?? "")[DEVICE_COOKIE];
      const [nonce, mac, extra] = (raw ?? "").split(".");
      if (!nonce || !mac || extra !== undefined) return undefined;
      const expected = Buffer.from(sign(nonce, email));
      const given = Buffer.from(mac);
      return given.length === expected.length && timingSafeEqual(given, expected)
        ? nonce
        : undefined;
    },
    issue(res, email, deviceId) {
      const nonce = deviceId ?? randomBytes(16).toString("base64url");
      res.cookie(DEVICE_COOKIE, `${nonce}.${sign(nonce, email)}`, {
        httpOnly: true,
        sameSite: "strict",
        secure: config.publicBaseUrl.startsWith("https:"),
        maxAge: MAX_AGE_MS,
        path: "/api/auth/sign-in",
      });
    },
  };
}
