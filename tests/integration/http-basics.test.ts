import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  signIn,
  startTestApp,
  TEST_ORIGIN,
  type TestApp,
  type TestTeam,
} from "../support/app";

let t: TestApp;
let team: TestTeam;
beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "http");
});
afterAll(() => t.close());

const credentials = () => ({
  email: team.members.viewer.email,
  password: team.members.viewer.password,
});

describe("same-origin check on state-changing requests", () => {
  it("refuses a POST whose Origin is another site with 403 cross_origin", async () => {
    const res = await supertest(t.app)
      .post("/api/auth/sign-in")
      .set("Origin", "https://attacker.example")
      .send(credentials());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("cross_origin");
  });

  it("refuses a signed-in cross-site DELETE before it reaches the route", async () => {
    const agent = t.agent();
    await signIn(agent, team.members.owner);
    const created = await agent
      .post(`/api/teams/${team.id}/projects`)
      .send({ name: "Keep me", units: "si", designReturnPeriodYears: 5 });
    const res = await agent
      .delete(`/api/projects/${created.body.id}`)
      .set("Origin", "http://evil.example")
      .set("Sec-Fetch-Site", "cross-site");
    expect(res.status).toBe(403);
    expect((await agent.get(`/api/projects/${created.body.id}`)).status).toBe(200);
  });

  it("refuses Sec-Fetch-Site: cross-site without an Origin", async () => {
    const res = await supertest(t.app)
      .post("/api/auth/sign-in")
      .set("Sec-Fetch-Site", "cross-site")
      .send(credentials());
    expect(res.status).toBe(403);
  });

  it("accepts our own Origin, Sec-Fetch-Site: same-origin, and clients that send neither", async () => {
    const own = await supertest(t.app)
      .post("/api/auth/sign-in")
      .set("Origin", TEST_ORIGIN)
      .send(credentials());
    const fetchSite = await supertest(t.app)
      .post("/api/auth/sign-in")
      .set("Sec-Fetch-Site", "same-origin")
      .send(credentials());
    const bare = await supertest(t.app).post("/api/auth/sign-in").send(credentials());
    expect([own.status, fetchSite.status, bare.status]).toEqual([200, 200, 200]);
  });

  it("lets cross-site GETs through (they change nothing)", async () => {
    const res = await supertest(t.app)
      .get("/api/health")
      .set("Origin", "https://elsewhere.example");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });
});

describe("bad requests get our error shape", () => {
  it("answers malformed JSON with 400 invalid_json", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-in")
      .set("Content-Type", "application/json")
      .send('{"email": "a@b.test", ');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: "invalid_json", message: expect.any(String) } });
  });

  it("answers a body over the limit with 413", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-in")
      .send({ email: "a@b.test", password: "x".repeat(300_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("payload_too_large");
  });

  it("answers a form-encoded body with 415", async () => {
    const res = await t
      .agent()
      .post("/api/auth/sign-in")
      .type("form")
      .send("email=a@b.test&password=x");
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe("unsupported_media_type");
  });

  it("answers invalid fields with 422 invalid_input naming each field", async () => {
    const res = await t.agent().post("/api/auth/sign-in").send({ email: "not an e-mail" });
    expect(res.status).toBe(422);
    expect(res.body.error).toEqual({
      code: "invalid_input",
      message: expect.any(String),
      fields: { email: "Enter a valid e-mail address.", password: "Enter your password." },
    });
  });

  it("answers a missing body like an empty one: every required field is named", async () => {
    const res = await t.agent().post("/api/auth/sign-in");
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["email", "password"]);
  });

  it("answers an unknown API route with 404 JSON", async () => {
    const res = await t.agent().get("/api/no-such-thing");
    expect(res.status).toBe(404);
    expect(res.headers["content-type"]).toMatch(/json/);
    expect(res.body.error.code).toBe("not_found");
  });

  it("answers a server failure with 500 internal_error and no stack trace", async () => {
    const broken = await startTestApp();
    await broken.pool.end(); // the database is gone: every query now fails
    try {
      const res = await supertest(broken.app).post("/api/auth/sign-in").send(credentials());
      expect(res.status).toBe(500);
      expect(res.body).toEqual({ error: { code: "internal_error", message: expect.any(String) } });
      expect(res.text).not.toMatch(/\bat .+:\d+:\d+/);
      expect((await supertest(broken.app).get("/api/health")).status).toBe(503);
    } finally {
      await broken.close();
    }
  });
});

describe("headers", () => {
  it("sends a self-only content security policy that lets the map worker run", async () => {
    const res = await supertest(t.app).get("/api/health");
    const csp = String(res.headers["content-security-policy"]);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
  });

  it("never lets API answers be cached", async () => {
    const res = await supertest(t.app).get("/api/config");
    expect(res.headers["cache-control"]).toBe("no-store");
    expect(res.body).toEqual({
      signUpEnabled: true,
      outboxEnabled: true,
      basemap: { kind: "demo" },
    });
  });
});
