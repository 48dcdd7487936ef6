import argon2 from "argon2";

/**
 * argon2id at OWASP's minimum (Password Storage Cheat Sheet): 19 MiB memory, 2 passes, 1 lane.
 * See docs/decisions/003-password-hashing.md.
 */
export const ARGON2_OPTIONS = {
  type: argon2.argon2id,
  memoryCost: 19_456,
  timeCost: 2,
  parallelism: 1,
} as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

/** False for a wrong password and for a hash that cannot be read (never throws on bad input). */
export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/** True when a stored hash was made with weaker settings than today's and should be redone. */
export function needsRehash(hash: string): boolean {
  try {
    return argon2.needsRehash(hash, ARGON2_OPTIONS);
  } catch {
    return true;
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * Spend the same time as a real verification when the account does not exist, so the answer
 * time does not tell an attacker which e-mail addresses have accounts.
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword("rillmark-dummy-password-for-timing");
  await verifyPassword(await dummyHash, password);
  return false;
}
