/**
 * Account benchmarks (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx
 * bench/auth.ts`): the password-reset request must take the same time whether or not the address
 * has an account, or its timing tells an attacker which addresses do. Known and unknown
 * addresses alternate over HTTP on loopback, with a pause after each; medians after a warm-up.
 */
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import http from "node:http";
import type { AddressInfo } from "node:net";
import os from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { inArray } from "drizzle-orm";
import { createApp } from "../server/app";
import { hashPassword } from "../server/auth/password";
import { createSessionStore } from "../server/auth/session";
import { loadConfig } from "../server/config";
import { connectDatabase } from "../server/db/client";
import { runMigrations } from "../server/db/migrate";
import { users } from "../server/db/schema";
import { startJobQueue } from "../server/jobs/queue";
import { startFakeSmtp } from "../server/mail/fake-smtp";
import { newStandInCredentials } from "../server/standins";
import { createMailer } from "../server/mail/mailer";
import { startStorage } from "../server/storage";
import type { BenchRow } from "./table";

const WARM_UP = 20;
const TIMED = 200;
const SETTLE_MS = 30;

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
};

export async function run(): Promise<BenchRow[]> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl)
    return [{ name: "password-reset request timing", value: "skipped: no DATABASE_URL" }];
  await runMigrations(databaseUrl);
  const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-bench-auth-"));
  const base = loadConfig({ ...process.env, DATABASE_URL: databaseUrl, NODE_ENV: "test" });
  const many = 1_000_000;
  const config = {
    ...base,
    storage: { ...base.storage, fakeDir: path.join(dir, "s3"), cacheDir: path.join(dir, "cache") },
    uploads: { ...base.uploads, dir: path.join(dir, "uploads") },
    publicBaseUrl: "http://127.0.0.1",
    rateLimits: {
      ...base.rateLimits,
      emailPerIp: many,
      emailPerAddress: many,
      keyPrefix: `bench-${randomUUID()}:`,
      pruneExpired: false,
    },
  };
  const { pool, db } = connectDatabase(databaseUrl, 10);
  const storage = await startStorage(config.storage);
  const jobs = await startJobQueue({
    connectionString: databaseUrl,
    queueSuffix: `-bench-${randomUUID().slice(0, 8)}`,
    supervise: false,
    deleteQueuesOnClose: true,
  });
  const smtpCredentials = newStandInCredentials().smtp;
  const smtp = await startFakeSmtp(db, smtpCredentials, 0);
  const mailer = createMailer(
    {
      host: "127.0.0.1",
      port: smtp.port,
      secure: false,
      user: smtpCredentials.user,
      pass: smtpCredentials.pass,
      requireTls: false,
    },
    config.mailFrom,
  );
  const sessionStore = createSessionStore(pool, { pruneIntervalSeconds: false });
  const app = createApp(config, { db, pool, sessionStore, mailer, store: storage.store, jobs });
  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/auth/password-reset/request`;
  const known = `bench-reset-${randomUUID().slice(0, 8)}@bench.rillmark.test`;
  try {
    await db.insert(users).values({
      email: known,
      name: "Bench reset",
      passwordHash: await hashPassword(randomUUID()),
    });
    const ask = async (email: string) => {
      const start = performance.now();
      const res = await fetch(url, {
        method: "POST",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ email }),
      });
      await res.arrayBuffer();
      if (res.status !== 202) throw new Error(`reset request answered ${res.status}`);
      return performance.now() - start;
    };
    const times = { known: [] as number[], unknown: [] as number[] };
    for (let k = 0; k < WARM_UP + TIMED; k += 1) {
      const unknown = `bench-nobody-${randomUUID().slice(0, 8)}@bench.rillmark.test`;
      // Alternate which goes first, so neither always follows the other's mail.
      const pair = k % 2 === 0 ? [known, unknown] : [unknown, known];
      for (const email of pair) {
        const ms = await ask(email);
        if (k >= WARM_UP) times[email === known ? "known" : "unknown"].push(ms);
        // Let any mail being sent finish, so each request is timed on its own, as a prober
        // timing one request at a time would see it.
        await new Promise((resolve) => setTimeout(resolve, SETTLE_MS));
      }
    }
    const a = median(times.known);
    const b = median(times.unknown);
    return [
      {
        name: `password-reset request, address with an account (median of ${TIMED})`,
        value: a.toFixed(2),
        unit: "ms",
      },
      {
        name: `password-reset request, address without one (median of ${TIMED})`,
        value: b.toFixed(2),
        unit: "ms",
      },
      {
        name: "password-reset request, difference of the medians",
        value: Math.abs(a - b).toFixed(2),
        unit: "ms",
        target: "< 0.5",
        ok: Math.abs(a - b) < 0.5,
      },
    ];
  } finally {
    await mailer.close();
    server.closeAllConnections();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    sessionStore.close();
    await smtp.close();
    await jobs.close();
    await storage.close();
    await db.delete(users).where(inArray(users.email, [known]));
    await pool.end();
    rmSync(dir, { recursive: true, force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
