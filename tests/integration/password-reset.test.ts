import { eq } from "drizzle-orm";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { passwordResets } from "../../server/db/schema";
import {
  createUser,
  latestMailTo,
  mailsTo,
  sessionCookie,
  signIn,
  startTestApp,
  tokenFromMail,
  type TestApp,
} from "../support/app";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const NEW_PASSWORD = "a-brand-new-password";

async function requestReset(email: string): Promise<string> {
  const res = await t.agent().post("/api/auth/password-reset/request").send({ email });
  expect(res.status).toBe(202);
  return tokenFromMail(await latestMailTo(t.db, email), "/reset-password");
}

describe("password reset", () => {
  it("e-mails a link; the new password works and the old one no longer does", async () => {
    const user = await createUser(t.db, "reset");
    const token = await requestReset(user.email);
    const done = await t
      .agent()
      .post("/api/auth/password-reset/complete")
      .send({ token, password: NEW_PASSWORD });
    expect(done.status).toBe(204);
    const signInWith = (password: string) =>
      t.agent().post("/api/auth/sign-in").send({ email: user.email, password });
    expect((await signInWith(NEW_PASSWORD)).status).toBe(200);
    expect((await signInWith(user.password)).status).toBe(401);
  });

  it("signs the account out everywhere", async () => {
    const user = await createUser(t.db, "reset-sessions");
    const cookie = sessionCookie(await signIn(t.agent(), user))?.split(";")[0] ?? "";
    const me = () => supertest(t.app).get("/api/auth/me").set("Cookie", cookie);
    expect((await me()).status).toBe(200);
    const token = await requestReset(user.email);
    await t
      .agent()
      .post("/api/auth/password-reset/complete")
      .send({ token, password: NEW_PASSWORD });
    expect((await me()).status).toBe(401);
  });

  it("works once: the same link answers 410 the second time", async () => {
    const user = await createUser(t.db, "reset-once");
    const token = await requestReset(user.email);
    const complete = () =>
      t.agent().post("/api/auth/password-reset/complete").send({ token, password: NEW_PASSWORD });
    expect((await complete()).status).toBe(204);
    const again = await complete();
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe("link_expired");
  });

  it("answers 410 after the hour is up", async () => {
    const user = await createUser(t.db, "reset-expired");
    const token = await requestReset(user.email);
    await t.db
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(passwordResets.userId, user.id));
    const res = await t
      .agent()
      .post("/api/auth/password-reset/complete")
      .send({ token, password: NEW_PASSWORD });
    expect(res.status).toBe(410);
  });

  it("answers an unknown address the same way and sends it nothing", async () => {
    const known = await createUser(t.db, "reset-known");
    const unknownEmail = "reset-nobody@example.test";
    const a = await t.agent().post("/api/auth/password-reset/request").send({ email: known.email });
    const b = await t
      .agent()
      .post("/api/auth/password-reset/request")
      .send({ email: unknownEmail });
    expect(b.status).toBe(a.status);
    expect(Object.keys(b.body)).toEqual(Object.keys(a.body));
    await latestMailTo(t.db, known.email); // the known one's mail has arrived by now
    expect(await mailsTo(t.db, unknownEmail)).toEqual([]);
  });

  it("answers before it even looks at the account (its time cannot tell whether one exists)", async () => {
    // Hold the account's row: storing a reset link for it (the foreign key check) must wait.
    // The answer may not: it is the same for every address and leaves before that work.
    const user = await createUser(t.db, "reset-timing");
    const holder = await t.pool.connect();
    try {
      await holder.query("begin");
      await holder.query("select id from users where id = $1 for update", [user.id]);
      const answer = t.agent().post("/api/auth/password-reset/request").send({ email: user.email });
      const first = await Promise.race([
        answer.then((r) => r.status),
        new Promise((resolve) => setTimeout(() => resolve("still waiting"), 3000)),
      ]);
      expect(first).toBe(202);
      expect(await mailsTo(t.db, user.email)).toEqual([]);
    } finally {
      await holder.query("rollback");
      holder.release();
    }
    // Once the row is free the link is stored and sent.
    await latestMailTo(t.db, user.email);
  });

  it("rejects a too-short new password with a field message", async () => {
    const user = await createUser(t.db, "reset-short");
    const token = await requestReset(user.email);
    const res = await t
      .agent()
      .post("/api/auth/password-reset/complete")
      .send({ token, password: "short" });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.password).toMatch(/at least 10/);
  });
});
