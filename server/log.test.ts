import { describe, expect, it } from "vitest";
import { redact, redactText } from "./log";

// An argon2id hash in the PHC string format (RFC 9106 parameters as stored by the argon2
// package); the salt and digest here are made up for the test.
const HASH =
  "$argon2id$v=19$m=19456,t=2,p=1$c29tZXNhbHRzb21lc2FsdA$Zm9vYmFyYmF6cXV4Zm9vYmFyYmF6cXV4Zm9vYmFyYmE";
const TOKEN_HASH = "9f86d081884c7d659a2feaa0c55ad015a3bf4f1b2b0b822cd15d6c15b0f00a08";
const TOKEN = "GUkX92RRpBlqh3sYvLB5gnB7JDxowK_lRMvT3JPGFEI";
const ID = "a277f1e1-6fa9-4f55-b5c6-cf34201e2a16";

describe("log redaction", () => {
  it("removes argon2 hashes, token hashes and link tokens from text, and keeps ids", () => {
    const line = `POST /api/invitations/${TOKEN}/accept team ${ID} hash ${HASH}, key ${TOKEN_HASH}`;
    const out = redactText(line);
    for (const secret of [TOKEN, HASH, TOKEN_HASH, "c29tZXNhbHRzb21lc2FsdA"]) {
      expect(out).not.toContain(secret);
    }
    expect(out).toContain(ID);
    expect(out).toContain("/api/invitations/[redacted]/accept");
  });

  it("drops the parameter list a failed query quotes", () => {
    const message = `Failed query: insert into "users" ("email", "name") values ($1, $2)\nparams: a@b.test,Ann`;
    expect(redactText(message)).toBe(
      'Failed query: insert into "users" ("email", "name") values ($1, $2)\nparams: [redacted]',
    );
  });

  it("masks listed keys at any depth, in errors and their causes", () => {
    const cause = Object.assign(new Error("duplicate key"), {
      detail: `Key (token_hash)=(${TOKEN_HASH})`,
    });
    const err = Object.assign(new Error("Failed query"), {
      params: ["x@y.test", HASH],
      cause,
      body: { password: "hunter2hunter2", nested: { passwordHash: "anything" } },
    });
    const out = JSON.stringify(redact(err));
    for (const secret of [HASH, TOKEN_HASH, "hunter2hunter2", "anything", "x@y.test"]) {
      expect(out).not.toContain(secret);
    }
    expect(out).toContain("duplicate key");
  });

  it("survives cycles", () => {
    const a: Record<string, unknown> = { name: "a" };
    a.self = a;
    expect(() => JSON.stringify(redact(a))).not.toThrow();
  });
});
