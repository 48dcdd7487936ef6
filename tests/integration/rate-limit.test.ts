import { afterEach, describe, expect, it } from "vitest";
import { createTeam, createUser, startTestApp, testConfig, type TestApp } from "../support/app";

const apps: TestApp[] = [];
afterEach(async () => {
  await Promise.all(apps.splice(0).map((a) => a.close()));
});

async function appWith(limits: Partial<TestApp["config"]["rateLimits"]>): Promise<TestApp> {
  const t = await startTestApp({ rateLimits: { ...testConfig().rateLimits, ...limits } });
  apps.push(t);
  return t;
}

describe("rate limits", () => {
  it("answers 429 rate_limited after too many failed sign-ins to one account", async () => {
    const t = await appWith({ signInPerAccount: 3 });
    const user = await createUser(t.db, "rl-account");
    const attempt = (password: string) =>
      t.agent().post("/api/auth/sign-in").send({ email: user.email, password });
    for (let i = 0; i < 3; i++) expect((await attempt("wrong-password-1")).status).toBe(401);
    const limited = await attempt("wrong-password-1");
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe("rate_limited");
    // Even the right password waits out the window: the guessing stops for this account.
    expect((await attempt(user.password)).status).toBe(429);
  });

  it("counts the account by its normalised e-mail, whatever its case", async () => {
    const t = await appWith({ signInPerAccount: 2 });
    const user = await createUser(t.db, "rl-case");
    const emails = [user.email, user.email.toUpperCase(), ` ${user.email} `];
    const statuses: number[] = [];
    for (const email of emails) {
      statuses.push(
        (await t.agent().post("/api/auth/sign-in").send({ email, password: "nope-nope-1" })).status,
      );
    }
    expect(statuses).toEqual([401, 401, 429]);
  });

  it("answers 429 after too many failed sign-ins from one address across accounts", async () => {
    const t = await appWith({ signInPerIp: 3 });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await t
        .agent()
        .post("/api/auth/sign-in")
        .send({ email: `rl-ip-${i}@example.test`, password: "wrong-password-1" });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  it("does not count successful sign-ins", async () => {
    const t = await appWith({ signInPerAccount: 2, signInPerIp: 2 });
    const team = await createTeam(t.db, "rl-ok");
    const user = team.members.viewer;
    for (let i = 0; i < 4; i++) {
      const res = await t
        .agent()
        .post("/api/auth/sign-in")
        .send({ email: user.email, password: user.password });
      expect(res.status).toBe(200);
    }
  });

  it("limits password-reset requests per address", async () => {
    const t = await appWith({ emailPerAddress: 2 });
    const user = await createUser(t.db, "rl-reset");
    const ask = () =>
      t.agent().post("/api/auth/password-reset/request").send({ email: user.email });
    expect((await ask()).status).toBe(202);
    expect((await ask()).status).toBe(202);
    const limited = await ask();
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe("rate_limited");
  });

  it("limits sign-up requests per IP", async () => {
    const t = await appWith({ emailPerIp: 2 });
    const signUp = (i: number) =>
      t
        .agent()
        .post("/api/auth/sign-up")
        .send({
          email: `rl-signup-${i}-${Date.now()}@example.test`,
          name: "Rate Limited",
          password: "long-enough-password",
          teamName: "Rate limit team",
        });
    expect((await signUp(1)).status).toBe(202);
    expect((await signUp(2)).status).toBe(202);
    expect((await signUp(3)).status).toBe(429);
  });
});
