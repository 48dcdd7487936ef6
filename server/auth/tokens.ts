import { createHash, randomBytes } from "node:crypto";

export const TOKEN_LIFETIME_MS = {
  invitation: 7 * 24 * 3_600_000,
  passwordReset: 3_600_000,
  emailConfirmation: 24 * 3_600_000,
} as const;

/** A link token: 32 random bytes, base64url. Only its SHA-256 is stored. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function expiresIn(ms: number, now = new Date()): Date {
  return new Date(now.getTime() + ms);
}
