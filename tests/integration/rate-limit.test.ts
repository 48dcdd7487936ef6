import { randomUUID } from "node:crypto";
import { like } from "drizzle-orm";
import supertest from "supertest";
import { afterEach, describe, expect, it, vi } from "vitest";
import { createApp } from "../../server/app";
import { createSessionStore } from "../../server/auth/session";
import { connectDatabase } from "../../server/db/client";
import { rateLimits } from "../../server/db/schema";
import {
  createTeam,
  createUser,
  latestMailTo,
  localMailer,
  startTestApp,
  testConfig,
  TEST_ORIGIN,
  tokenFromMail,
  type TestApp,
  type TestUser,
} from "../support/app";
import { startDbProxy } from "../support/db-proxy";

const apps: TestApp[] = [];
const cleanups: (() => Promise<void>)[] = [];
afterEach(async () => {
  await Promise.all(apps.splice(0).map((a) => a.close()));
  for (const cleanup of cleanups.splice(0)) await cleanup();
});

async function appWith(limits: Partial<TestApp["config"]["rateLimits"]>): Promise<TestApp> {
  const t = await startTestApp({ rateLimits: { ...testConfig().rateLimits, ...limits } });
  apps.push(t);
  return t;
}

const signIn = (app: TestApp["app"], email: string, password: string) =>
  supertest(app).post("/api/auth/sign-in").set("Origin", TEST_ORIGIN).send({ email, password });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function failTimes(app: TestApp["app"], user: TestUser, n: number): Promise<number[]> {
  const statuses: number[] = [];
  for (let i = 0; i < n; i++)
    statuses.push((await signIn(app, user.email, "a wrong guess")).status);
  return statuses;
}

describe("sign-in limits", () => {
  it("after the account's allowance, lets the right password through once the short wait is over", async () => {
    const t = await appWith({ signInPerAccount: 3, signInLockMs: 1000 });
    const user = await createUser(t.db, "rl-account");
    expect(await failTimes(t.app, user, 3)).toEqual([401, 401, 401]);
    const locked = await signIn(t.app, user.email, user.password);
    expect(locked.status).toBe(429);
    expect(locked.body.error.code).toBe("rate_limited");
    expect(Number(locked.headers["retry-after"])).toBe(1);
    await sleep(1100);
    expect((await signIn(t.app, user.email, user.password)).status).toBe(200);
  });

  it("keeps guessing to one attempt per wait once the allowance is spent", async () => {
    const t = await appWith({ signInPerAccount: 2, signInLockMs: 1000 });
    const user = await createUser(t.db, "rl-slow");
    expect(await failTimes(t.app, user, 3)).toEqual([401, 401, 429]);
    await sleep(1100);
    // Parallel guesses after the wait: one gets the turn, the rest are refused unchecked.
    const burst = await Promise.all(
      Array.from({ length: 5 }, () => signIn(t.app, user.email, "parallel guess")),
    );
    expect(burst.map((r) => r.status).sort()).toEqual([401, 429, 429, 429, 429]);
  });

  it("lets the owner's own device in at once while others' wrong passwords keep the account waiting", async () => {
    const t = await appWith({ signInPerAccount: 3, signInLockMs: 60_000 });
    const team = await createTeam(t.db, "rl-device");
    const owner = team.members.owner;
    const device = t.agent();
    expect((await device.post("/api/auth/sign-in").send(owner)).status).toBe(200);
    // An attacker, from any address, spends the account's allowance and keeps trying.
    expect(await failTimes(t.app, owner, 4)).toEqual([401, 401, 401, 429]);
    expect((await signIn(t.app, owner.email, owner.password)).status).toBe(429);
    // The device that signed in before is not locked out by them.
    const again = await device.post("/api/auth/sign-in").send(owner);
    expect(again.status).toBe(200);
    // Its cookie names this account only: it buys nothing for another one.
    const other = await createUser(t.db, "rl-device-other");
    await failTimes(t.app, other, 3);
    expect((await device.post("/api/auth/sign-in").send(other)).status).toBe(429);
  });

  it("gives a known device its own allowance, after which it waits like anyone else", async () => {
    const t = await appWith({ signInPerAccount: 2, signInLockMs: 60_000 });
    const user = await createUser(t.db, "rl-own-device");
    const device = t.agent();
    expect((await device.post("/api/auth/sign-in").send(user)).status).toBe(200);
    const wrong = { email: user.email, password: "not this one" };
    const statuses = [];
    for (let i = 0; i < 5; i++)
      statuses.push((await device.post("/api/auth/sign-in").send(wrong)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 429]);
  });

  it("ends the account's wait once its owner sets a new password through a reset link", async () => {
    const t = await appWith({ signInPerAccount: 2, signInLockMs: 60_000 });
    const user = await createUser(t.db, "rl-reset-lock");
    expect(await failTimes(t.app, user, 3)).toEqual([401, 401, 429]);
    await t.agent().post("/api/auth/password-reset/request").send({ email: user.email });
    const token = tokenFromMail(await latestMailTo(t.db, user.email), "/reset-password");
    const password = "a brand new password";
    const reset = await t
      .agent()
      .post("/api/auth/password-reset/complete")
      .send({ token, password });
    expect(reset.status).toBe(204);
    expect((await signIn(t.app, user.email, password)).status).toBe(200);
  });

  it("counts the account by its normalised e-mail, whatever its case", async () => {
    const t = await appWith({ signInPerAccount: 2 });
    const user = await createUser(t.db, "rl-case");
    const emails = [user.email, user.email.toUpperCase(), ` ${user.email} `];
    const statuses: number[] = [];
    for (const email of emails) statuses.push((await signIn(t.app, email, "nope-nope-1")).status);
    expect(statuses).toEqual([401, 401, 429]);
  });

  it("answers 429 after too many failed sign-ins from one address across accounts", async () => {
    const t = await appWith({ signInPerIp: 3 });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      statuses.push((await signIn(t.app, `rl-ip-${i}@example.test`, "wrong-password-1")).status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  it("does not count successful sign-ins", async () => {
    const t = await appWith({ signInPerAccount: 2, signInPerIp: 2 });
    const user = await createUser(t.db, "rl-ok");
    for (let i = 0; i < 4; i++)
      expect((await signIn(t.app, user.email, user.password)).status).toBe(200);
  });

  it("does not count attempts the database could not answer (an outage is not a failure)", async () => {
    const t = await appWith({ signInPerAccount: 2, signInPerIp: 2 });
    const user = await createUser(t.db, "rl-outage");
    const proxy = await startDbProxy(t.config.databaseUrl);
    const { pool, db } = connectDatabase(proxy.url, 2);
    const sessionStore = createSessionStore(pool, { pruneIntervalSeconds: false });
    const mailer = localMailer(t.smtp.port, t.smtpCredentials, t.config.mailFrom);
    cleanups.push(async () => {
      sessionStore.close();
      await mailer.close();
      await pool.end();
      await proxy.close();
    });
    const app = createApp(t.config, {
      db,
      pool,
      sessionStore,
      mailer,
      store: t.store,
      jobs: t.jobs,
    });

    expect((await signIn(app, user.email, user.password)).status).toBe(200);
    proxy.cut();
    const quiet = vi.spyOn(console, "error").mockImplementation(() => undefined);
    try {
      for (let i = 0; i < 6; i++)
        expect((await signIn(app, user.email, "during outage")).status).toBe(500);
    } finally {
      quiet.mockRestore();
    }
    proxy.restore();
    expect((await signIn(app, user.email, "first real miss")).status).toBe(401);
    expect((await signIn(app, user.email, user.password)).status).toBe(200);
  });

  it("shares counts between two apps on one database, and keeps them over a restart", async () => {
    const shared = {
      signInPerAccount: 4,
      signInLockMs: 60_000,
      keyPrefix: `shared-${randomUUID()}:`,
    };
    const a = await appWith(shared);
    const b = await appWith(shared);
    const user = await createUser(a.db, "rl-shared");
    expect(await failTimes(a.app, user, 2)).toEqual([401, 401]);
    expect(await failTimes(b.app, user, 2)).toEqual([401, 401]);
    expect((await signIn(a.app, user.email, user.password)).status).toBe(429);
    await a.close();
    await b.close();
    apps.splice(0);
    const restarted = await appWith(shared);
    expect((await signIn(restarted.app, user.email, user.password)).status).toBe(429);
    // The table holds hashed keys: no address in clear.
    const rows = await restarted.db
      .select()
      .from(rateLimits)
      .where(like(rateLimits.key, `${shared.keyPrefix}%`));
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.some((r) => r.key.includes(user.email))).toBe(false);
  });
});

describe("limits on requests that send mail", () => {
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
    expect(Number(limited.headers["retry-after"])).toBeGreaterThan(0);
  });

  it("limits sign-up requests per IP, counted across apps on one database", async () => {
    const shared = { emailPerIp: 2, keyPrefix: `shared-mail-${randomUUID()}:` };
    const a = await appWith(shared);
    const b = await appWith(shared);
    const signUp = (t: TestApp, i: number) =>
      t
        .agent()
        .post("/api/auth/sign-up")
        .send({
          email: `rl-signup-${i}-${randomUUID().slice(0, 6)}@example.test`,
          name: "Rate Limited",
          password: "long-enough-password",
          teamName: "Rate limit team",
        });
    expect((await signUp(a, 1)).status).toBe(202);
    expect((await signUp(b, 2)).status).toBe(202);
    expect((await signUp(a, 3)).status).toBe(429);
  });
});
