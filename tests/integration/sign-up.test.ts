import { eq } from "drizzle-orm";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailConfirmations } from "../../server/db/schema";
import {
  createUser,
  latestMailTo,
  mailsTo,
  startTestApp,
  tokenFromMail,
  uniqueEmail,
  type TestApp,
} from "../support/app";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const form = (email: string) => ({
  email,
  name: "Rosa Delgado",
  password: "a-long-new-password",
  teamName: "Delgado Drainage",
});

describe("sign-up by e-mail confirmation", () => {
  it("e-mails a confirmation link; following it creates the account, the team and owner role", async () => {
    const email = uniqueEmail("signup");
    const asked = await t.agent().post("/api/auth/sign-up").send(form(email));
    expect(asked.status).toBe(202);
    const mail = await latestMailTo(t.db, email);
    const token = tokenFromMail(mail, "/confirm-email");

    const agent = t.agent();
    const confirmed = await agent.post("/api/auth/confirm-email").send({ token });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.user).toMatchObject({ email, name: "Rosa Delgado" });
    expect(confirmed.body.memberships).toEqual([
      { teamId: expect.any(String), teamName: "Delgado Drainage", role: "owner" },
    ]);
    // Signed in by the confirmation, and the chosen password works from now on.
    expect((await agent.get("/api/auth/me")).status).toBe(200);
    const signIn = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email, password: "a-long-new-password" });
    expect(signIn.status).toBe(200);
  });

  it("creates nothing before the address is confirmed", async () => {
    const email = uniqueEmail("signup-pending");
    await t.agent().post("/api/auth/sign-up").send(form(email));
    const signIn = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email, password: "a-long-new-password" });
    expect(signIn.status).toBe(401);
  });

  it("answers 410 link_expired when the link is used a second time", async () => {
    const email = uniqueEmail("signup-twice");
    await t.agent().post("/api/auth/sign-up").send(form(email));
    const token = tokenFromMail(await latestMailTo(t.db, email), "/confirm-email");
    expect((await t.agent().post("/api/auth/confirm-email").send({ token })).status).toBe(201);
    const again = await t.agent().post("/api/auth/confirm-email").send({ token });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe("link_expired");
  });

  it("answers 410 for an expired link", async () => {
    const email = uniqueEmail("signup-expired");
    await t.agent().post("/api/auth/sign-up").send(form(email));
    const token = tokenFromMail(await latestMailTo(t.db, email), "/confirm-email");
    await t.db
      .update(emailConfirmations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(emailConfirmations.email, email));
    expect((await t.agent().post("/api/auth/confirm-email").send({ token })).status).toBe(410);
  });

  it("does not reveal an existing account: same answer, and a sign-in hint instead of a link", async () => {
    const existing = await createUser(t.db, "signup-existing");
    const fresh = await t
      .agent()
      .post("/api/auth/sign-up")
      .send(form(uniqueEmail("signup-new")));
    const taken = await t.agent().post("/api/auth/sign-up").send(form(existing.email));
    expect(taken.status).toBe(fresh.status);
    expect(Object.keys(taken.body)).toEqual(Object.keys(fresh.body));
    const mail = await latestMailTo(t.db, existing.email);
    expect(mail.subject).toMatch(/already have/i);
    expect(mail.text).not.toMatch(/confirm-email/);
  });

  it("answers 422 with fields for a bad form", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-up")
      .send({ email: "not-an-address", name: "", password: "short", teamName: "x" });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("invalid_input");
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      "email",
      "name",
      "password",
      "teamName",
    ]);
  });

  it("answers 403 signup_disabled and sends nothing when sign-up is turned off", async () => {
    const closed = await startTestApp({ signUpEnabled: false });
    try {
      const email = uniqueEmail("signup-off");
      const res = await supertest(closed.app).post("/api/auth/sign-up").send(form(email));
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe("signup_disabled");
      const config = await supertest(closed.app).get("/api/config");
      expect(config.body).toEqual({
        signUpEnabled: false,
        outboxEnabled: true,
        basemap: { kind: "demo" },
      });
      expect(await mailsTo(closed.db, email)).toEqual([]);
    } finally {
      await closed.close();
    }
  });

  it("answers 404 for a link token that was never issued", async () => {
    const res = await t
      .agent()
      .post("/api/auth/confirm-email")
      .send({ token: "A".repeat(43) });
    expect(res.status).toBe(404);
  });
});
