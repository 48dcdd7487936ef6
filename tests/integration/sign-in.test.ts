import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  sessionCookie,
  signIn,
  startTestApp,
  type TestApp,
  type TestTeam,
} from "../support/app";

let t: TestApp;
let team: TestTeam;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "signin");
});
afterAll(() => t.close());

const sid = (cookie: string | undefined) => cookie?.split(";")[0];

describe("sign-in", () => {
  it("signs in with the right password and answers the user with their team and role", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email: team.members.engineer.email, password: team.members.engineer.password });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(team.members.engineer.email);
    expect(res.body.memberships).toEqual([
      { teamId: team.id, teamName: team.name, role: "engineer" },
    ]);
  });

  it("accepts the e-mail in any case and with spaces around it", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({
        email: `  ${team.members.viewer.email.toUpperCase()} `,
        password: team.members.viewer.password,
      });
    expect(res.status).toBe(200);
  });

  it("answers 401 invalid_credentials for a wrong password, without a session cookie", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email: team.members.engineer.email, password: "not-the-password" });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("invalid_credentials");
    expect(sessionCookie(res)).toBeUndefined();
  });

  it("answers an unknown e-mail exactly like a wrong password", async () => {
    const wrong = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email: team.members.engineer.email, password: "not-the-password" });
    const unknown = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email: "nobody-here@example.test", password: "not-the-password" });
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it("sets the session cookie HttpOnly and SameSite=Lax, not Secure on plain http", async () => {
    const cookie = sessionCookie(await signIn(t.agent(), team.members.engineer));
    expect(cookie).toMatch(/^rillmark\.sid=/);
    expect(cookie).toMatch(/; HttpOnly/i);
    expect(cookie).toMatch(/; SameSite=Lax/i);
    expect(cookie).not.toMatch(/; Secure/i);
  });

  it("marks the cookie Secure when the public address is https behind a proxy", async () => {
    const https = await startTestApp({
      publicBaseUrl: "https://rillmark.example.test",
      trustProxy: true,
    });
    try {
      const res = await supertest(https.app)
        .post("/api/auth/sign-in")
        .set("Origin", "https://rillmark.example.test")
        .set("X-Forwarded-Proto", "https")
        .send({ email: team.members.admin.email, password: team.members.admin.password });
      expect(res.status).toBe(200);
      expect(sessionCookie(res)).toMatch(/; Secure/i);
      expect(res.headers["strict-transport-security"]).toBeDefined();
    } finally {
      await https.close();
    }
  });

  it("gives a new session id at sign-in; the id from before no longer works", async () => {
    const agent = t.agent();
    const first = sid(sessionCookie(await signIn(agent, team.members.engineer)));
    const second = sid(sessionCookie(await signIn(agent, team.members.engineer)));
    expect(first).toBeDefined();
    expect(second).toBeDefined();
    expect(second).not.toBe(first);
    const replay = await supertest(t.app)
      .get("/api/auth/me")
      .set("Cookie", first ?? "");
    expect(replay.status).toBe(401);
  });

  it("reports the signed-in user at /api/auth/me and 401 without a session", async () => {
    const agent = t.agent();
    await signIn(agent, team.members.gis);
    const me = await agent.get("/api/auth/me");
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(team.members.gis.email);
    const anonymous = await supertest(t.app).get("/api/auth/me");
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.code).toBe("unauthenticated");
  });
});

describe("sign-out", () => {
  it("destroys the session: a replayed cookie afterwards gets 401", async () => {
    const agent = t.agent();
    const cookie = sid(sessionCookie(await signIn(agent, team.members.reviewer))) ?? "";
    expect((await supertest(t.app).get("/api/auth/me").set("Cookie", cookie)).status).toBe(200);
    const out = await agent.post("/api/auth/sign-out");
    expect(out.status).toBe(204);
    const replay = await supertest(t.app).get("/api/auth/me").set("Cookie", cookie);
    expect(replay.status).toBe(401);
  });

  it("answers 401 when nobody is signed in", async () => {
    const res = await t.agent().post("/api/auth/sign-out");
    expect(res.status).toBe(401);
  });
});
