import type { Request, Response } from "express";
import { RateLimiterRes } from "rate-limiter-flexible";
import type { RateLimitConfig } from "../config";
import type { DeviceCookies } from "./device-cookie";
import { emailKey, ipKey, tooManyAttempts, type Counter, type CounterFactory } from "./rate-limits";

/** What the sign-in route reports once it knows whether the password was right. */
export interface SignInAttempt {
  /** A wrong password (or an unknown account): the only thing that counts as a failure. */
  failed(): Promise<void>;
  succeeded(): Promise<void>;
}

export interface SignInGuard {
  /** Throws 429 when this client may not try this account now; otherwise the attempt. */
  begin(req: Request, res: Response, email: string): Promise<SignInAttempt>;
  /** A new password was set through a reset link: the account's wait ends. */
  forget(email: string): Promise<void>;
}

async function spent(counter: Counter, key: string, limit: number): Promise<RateLimiterRes | null> {
  const used = await counter.get(key);
  return used && used.consumedPoints >= limit ? used : null;
}

/**
 * Sign-in limits (docs/decisions/011-sign-in-limits.md). Failures are counted only once a
 * password has been checked and found wrong, so a database outage (a 500) never counts.
 *
 * - Per IP, across accounts: `signInPerIp` wrong passwords per window, then 429.
 * - Per account, from devices it has not signed in from: `signInPerAccount` wrong passwords per
 *   window; after that one attempt per `signInLockMs`, so the right password still gets through
 *   after a short wait while guessing slows to a crawl.
 * - Per device that signed in to the account before (a signed cookie): an allowance of its own,
 *   untouched by anyone else's failures. Once spent, the device counts as unknown.
 */
export function createSignInGuard(
  counter: CounterFactory,
  limits: RateLimitConfig,
  devices: DeviceCookies,
): SignInGuard {
  const byIp = counter("signin-ip:", limits.signInPerIp, limits.windowMs);
  const byAccount = counter("signin-account:", limits.signInPerAccount, limits.windowMs);
  // Once an account's allowance is spent: one attempt per lock period, taken atomically so
  // parallel guesses cannot all slip into the same opening.
  const turn = counter("signin-turn:", 1, limits.signInLockMs);
  const byDevice = counter("signin-device:", limits.signInPerAccount, limits.windowMs);
  const lockSeconds = Math.max(1, Math.ceil(limits.signInLockMs / 1000));

  async function knownDevice(res: Response, email: string, deviceId: string) {
    if (await spent(byDevice, deviceId, limits.signInPerAccount)) return undefined;
    return {
      failed: async () => {
        await byDevice.penalty(deviceId);
      },
      succeeded: async () => {
        await byDevice.delete(deviceId);
        devices.issue(res, email, deviceId);
      },
    } satisfies SignInAttempt;
  }

  return {
    async begin(req, res, email) {
      const deviceId = devices.read(req, email);
      const trusted = deviceId && (await knownDevice(res, email, deviceId));
      if (trusted) return trusted;

      const ip = ipKey(req);
      const account = emailKey(email);
      const ipSpent = await spent(byIp, ip, limits.signInPerIp);
      if (ipSpent) throw tooManyAttempts(res, ipSpent.msBeforeNext);
      if (await spent(byAccount, account, limits.signInPerAccount)) {
        try {
          await turn.consume(account);
        } catch (err) {
          if (err instanceof RateLimiterRes) throw tooManyAttempts(res, err.msBeforeNext);
          throw err;
        }
      }
      return {
        failed: async () => {
          await byIp.penalty(ip);
          const used = await byAccount.penalty(account);
          // The wait starts at the failure that spent the allowance, and again at each one after.
          if (used.consumedPoints >= limits.signInPerAccount)
            await turn.set(account, 1, lockSeconds);
        },
        succeeded: async () => {
          await byAccount.delete(account);
          await turn.delete(account);
          devices.issue(res, email);
        },
      };
    },
    async forget(email) {
      await byAccount.delete(emailKey(email));
      await turn.delete(emailKey(email));
    },
  };
}
