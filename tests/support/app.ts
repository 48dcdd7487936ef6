import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { and, desc, eq, gte } from "drizzle-orm";
import type { Express } from "express";
import type pg from "pg";
import supertest from "supertest";
import { createApp } from "../../server/app";
import { hashPassword } from "../../server/auth/password";
import { createSessionStore, SESSION_COOKIE } from "../../server/auth/session";
import { loadConfig, type AppConfig } from "../../server/config";
import { connectDatabase, type Db } from "../../server/db/client";
import { memberships, outboxMessages, teams, users } from "../../server/db/schema";
import { startFakeSmtp, type FakeSmtp, type SmtpCredentials } from "../../server/mail/fake-smtp";
import { startJobQueue, type JobQueue } from "../../server/jobs/queue";
import { startWorkers } from "../../server/jobs/workers";
import { createMailer, type Mailer } from "../../server/mail/mailer";
import { newStandInCredentials } from "../../server/standins";
import { startStorage, type ObjectStore } from "../../server/storage";
import { ROLES, type Role } from "../../shared/roles";

/** The origin test apps believe they are served from (what browsers would send as Origin). */
export const TEST_ORIGIN = "http://127.0.0.1:5180";
export const TEST_PASSWORD = "correct-horse-battery";

export type Agent = ReturnType<typeof supertest.agent>;

export interface TestApp {
  app: Express;
  db: Db;
  pool: pg.Pool;
  config: AppConfig;
  smtp: FakeSmtp;
  /** What the app's mailer signs in to its SMTP stand-in with. */
  smtpCredentials: SmtpCredentials;
  /** The app's own object store (a local S3 fake in a temp folder). */
  store: ObjectStore;
  /** The app's own job queue (queue names unique to this app). */
  jobs: JobQueue;
  /** A cookie-keeping client that sends our Origin, like the real client in a browser. */
  agent(): Agent;
  close(): Promise<void>;
}

function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: run `npm test`.");
  return url;
}

/** A config for tests: limits high enough not to get in the way unless a test lowers them. */
export function testConfig(overrides: Partial<AppConfig> = {}, tempDir?: string): AppConfig {
  const base = loadConfig({ DATABASE_URL: databaseUrl(), NODE_ENV: "test" });
  const dir = tempDir ?? path.join(os.tmpdir(), "rillmark-test");
  return {
    ...base,
    storage: {
      ...base.storage,
      fakeDir: path.join(dir, "s3"),
      cacheDir: path.join(dir, "cache"),
      fakePort: 0,
    },
    uploads: { ...base.uploads, dir: path.join(dir, "uploads") },
    jobQueueSuffix: `-test-${randomUUID().slice(0, 8)}`,
    publicBaseUrl: TEST_ORIGIN,
    clientDist: "tests/support/no-client-build",
    rateLimits: {
      windowMs: 15 * 60_000,
      signInPerAccount: 1000,
      signInPerIp: 1000,
      signInLockMs: 30_000,
      emailPerIp: 1000,
      emailPerAddress: 1000,
      // Every app counts on its own (tests share one database and one client address).
      keyPrefix: `test-${randomUUID().slice(0, 8)}:`,
      pruneExpired: false,
    },
    ...overrides,
  };
}

/** A mailer that sends to a local stand-in SMTP server with its credentials. */
export function localMailer(port: number, credentials: SmtpCredentials, from: string): Mailer {
  return createMailer(
    {
      host: "127.0.0.1",
      port,
      secure: false,
      user: credentials.user,
      pass: credentials.pass,
      requireTls: false,
    },
    from,
  );
}

/**
 * The real app on the real test database, with its own SMTP and S3 stand-ins on random ports
 * (each with credentials of its own), its own job queue and its own temp folder (removed on
 * close).
 */
export async function startTestApp(
  overrides: Partial<AppConfig> = {},
  options: { workers?: boolean } = {},
): Promise<TestApp> {
  const tempDir = mkdtempSync(path.join(os.tmpdir(), "rillmark-test-"));
  const config = testConfig(overrides, tempDir);
  const { pool, db } = connectDatabase(config.databaseUrl, 5, {
    statementTimeoutMs: config.statementTimeoutMs.request,
  });
  // As in production: jobs on a pool of their own, with the longer statement limit.
  const jobDatabase = connectDatabase(config.databaseUrl, 2, {
    statementTimeoutMs: config.statementTimeoutMs.job,
  });
  const smtpCredentials = newStandInCredentials().smtp;
  const smtp = await startFakeSmtp(db, smtpCredentials, 0);
  const storage = await startStorage(config.storage);
  const jobs = await startJobQueue({
    connectionString: config.databaseUrl,
    queueSuffix: config.jobQueueSuffix,
    supervise: false,
    deleteQueuesOnClose: options.workers !== false,
  });
  // Test apps share one database but each has its own store: no sweeping of others' layers.
  // workers: false when a separate worker (server/processes/worker.ts) runs this app's jobs.
  const workers =
    options.workers === false
      ? { stop: () => Promise.resolve() }
      : await startWorkers({
          db: jobDatabase.db,
          store: storage.store,
          jobs,
          config,
          sweep: false,
        });
  const mailer = localMailer(smtp.port, smtpCredentials, config.mailFrom);
  const sessionStore = createSessionStore(pool, { pruneIntervalSeconds: false });
  const app = createApp(config, { db, pool, sessionStore, mailer, store: storage.store, jobs });
  return {
    app,
    db,
    pool,
    config,
    smtp,
    smtpCredentials,
    store: storage.store,
    jobs,
    agent: () => supertest.agent(app).set("Origin", config.publicBaseUrl),
    async close() {
      sessionStore.close();
      await mailer.close();
      await smtp.close();
      await workers.stop();
      await jobs.close();
      await storage.close();
      if (!pool.ending) await pool.end();
      await jobDatabase.pool.end();
      rmSync(tempDir, { recursive: true, force: true });
    },
  };
}

export interface TestUser {
  id: string;
  email: string;
  name: string;
  password: string;
}

let passwordHash: Promise<string> | undefined;

/** A unique address per call, so test files never see each other's rows. */
export function uniqueEmail(tag: string): string {
  return `${tag}-${randomUUID().slice(0, 8)}@example.test`;
}

export async function createUser(db: Db, tag: string, name = `Test ${tag}`): Promise<TestUser> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const email = uniqueEmail(tag);
  const [row] = await db
    .insert(users)
    .values({ email, name, passwordHash: await passwordHash })
    .returning({ id: users.id });
  if (!row) throw new Error("user insert returned no row");
  return { id: row.id, email, name, password: TEST_PASSWORD };
}

export interface TestTeam {
  id: string;
  name: string;
  members: Record<Role, TestUser>;
}

/** A team with one member per role (directly in the database). */
export async function createTeam(db: Db, tag: string): Promise<TestTeam> {
  const name = `Team ${tag} ${randomUUID().slice(0, 6)}`;
  const [team] = await db.insert(teams).values({ name }).returning({ id: teams.id });
  if (!team) throw new Error("team insert returned no row");
  const members = {} as Record<Role, TestUser>;
  for (const role of ROLES) {
    const user = await createUser(db, `${tag}-${role}`, `${role} of ${tag}`);
    await addMember(db, team.id, user.id, role);
    members[role] = user;
  }
  return { id: team.id, name, members };
}

export async function addMember(db: Db, teamId: string, userId: string, role: Role) {
  await db.insert(memberships).values({ teamId, userId, role });
}

export async function signIn(agent: Agent, user: Pick<TestUser, "email" | "password">) {
  const res = await agent
    .post("/api/auth/sign-in")
    .send({ email: user.email, password: user.password });
  if (res.status !== 200) throw new Error(`sign-in of ${user.email} answered ${res.status}`);
  return res;
}

/** The session id in a response's Set-Cookie (undefined when the response set none). */
export function sessionCookie(res: supertest.Response): string | undefined {
  const raw = res.headers["set-cookie"] as string[] | string | undefined;
  const list = raw === undefined ? [] : Array.isArray(raw) ? raw : [raw];
  return list.find((c) => c.startsWith(`${SESSION_COOKIE}=`));
}

/**
 * "name=value" of the session cookie a fetch() sign-in answer set, ready for a Cookie header.
 * Sign-in sets more than one cookie (the device cookie too): pick it by name.
 */
export function sessionCookieOf(res: Response): string {
  const all = res.headers.getSetCookie().map((c) => c.split(";")[0] ?? "");
  return all.find((c) => c.startsWith(`${SESSION_COOKIE}=`)) ?? "";
}

export type OutboxRow = typeof outboxMessages.$inferSelect;

/** The newest message the fake SMTP server stored for `to`; waits for it (mail is async). */
export async function latestMailTo(
  db: Db,
  to: string,
  options: { since?: Date; timeoutMs?: number } = {},
): Promise<OutboxRow> {
  const deadline = Date.now() + (options.timeoutMs ?? 5000);
  const since = options.since ?? new Date(0);
  for (;;) {
    const [row] = await db
      .select()
      .from(outboxMessages)
      .where(and(eq(outboxMessages.to, to.toLowerCase()), gte(outboxMessages.receivedAt, since)))
      .orderBy(desc(outboxMessages.receivedAt))
      .limit(1);
    if (row) return row;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} arrived in the fake outbox`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Every message stored for `to` (to prove one was *not* sent). */
export async function mailsTo(db: Db, to: string): Promise<OutboxRow[]> {
  return db.select().from(outboxMessages).where(eq(outboxMessages.to, to.toLowerCase()));
}

/** The token of the first `${origin}${path}/<token>` link in a message's text. */
export function tokenFromMail(mail: OutboxRow, path: string, origin = TEST_ORIGIN): string {
  const escaped = `${origin}${path}/`.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const match = new RegExp(`${escaped}([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!match?.[1]) throw new Error(`no ${path} link in mail "${mail.subject}"`);
  return match[1];
}
