/**
 * Compute benchmark (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx
 * bench/compute.ts`): the invented demo subcatchment (demo-geo/out) loaded into a bench project
 * through the API exactly as the demo seed does, then POST /api/subcatchments/:id/compute timed
 * over HTTP on loopback — load the path and layers, split, regimes, terrain slopes, every method,
 * store the sheet. Median and 95th percentile of sequential requests after a warm-up.
 */
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import http from "node:http";
import type { AddressInfo } from "node:net";
import os from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { eq } from "drizzle-orm";
import { createApp } from "../server/app";
import { hashPassword } from "../server/auth/password";
import { createSessionStore } from "../server/auth/session";
import { loadConfig } from "../server/config";
import { connectDatabase } from "../server/db/client";
import { runMigrations } from "../server/db/migrate";
import { memberships, projects, teams, users } from "../server/db/schema";
import { startJobQueue } from "../server/jobs/queue";
import { startWorkers } from "../server/jobs/workers";
import { createMailer } from "../server/mail/mailer";
import { ApiClient } from "../server/seed/api-client";
import { loadDemoScenario } from "../server/seed/demo-geodata-steps";
import { DEMO_OUT_DIR } from "../server/seed/demo-scenario";
import { startStorage } from "../server/storage";
import { toInternalCase } from "../shared/hydrology/case";
import { compute } from "../shared/hydrology/compute";
import { parseComputeInput } from "../shared/hydrology/input-schema";
import { sensitivityView } from "../shared/hydrology/uncertainty/analysis";
import { outputUnits } from "../shared/hydrology/units";
import type { BenchRow } from "./table";

const WARM_UP = 5;
const TIMED = 40;
const PASSWORD = "bench-compute-password";

/**
 * The sensitivity view of the demo subcatchment (every input group at both ends of its band)
 * from the engineering core's input the stored sheet keeps, in this process.
 */
async function timeCore(engineer: ApiClient, id: string) {
  const sheet = await engineer.get<{ calcInput?: unknown }>(`/subcatchments/${id}/sheet`);
  const input = parseComputeInput(sheet.calcInput);
  const kase = toInternalCase(input);
  const out = outputUnits(kase.units);
  const median = (fn: () => unknown) => {
    const times: number[] = [];
    for (let k = 0; k < WARM_UP + TIMED; k += 1) {
      const start = performance.now();
      fn();
      if (k >= WARM_UP) times.push(performance.now() - start);
    }
    return percentile(
      times.sort((a, b) => a - b),
      50,
    );
  };
  return {
    sensitivityMs: median(() => sensitivityView(kase, out)),
    plainMs: median(() => compute(input)),
    bandMs: median(() => compute(input, { uncertainty: true })),
  };
}

function percentile(sorted: readonly number[], p: number): number {
  const at = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[at] ?? Number.NaN;
}

export async function run(): Promise<BenchRow[]> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) return [{ name: "demo compute request", value: "skipped: no DATABASE_URL" }];
  await runMigrations(databaseUrl);
  const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-bench-compute-"));
  const base = loadConfig({ ...process.env, DATABASE_URL: databaseUrl, NODE_ENV: "test" });
  const config = {
    ...base,
    storage: { ...base.storage, fakeDir: path.join(dir, "s3"), cacheDir: path.join(dir, "cache") },
    uploads: { ...base.uploads, dir: path.join(dir, "uploads") },
    publicBaseUrl: "http://127.0.0.1",
  };
  const { pool, db } = connectDatabase(databaseUrl, 10);
  const storage = await startStorage(config.storage);
  const jobs = await startJobQueue({
    connectionString: databaseUrl,
    queueSuffix: `-bench-${randomUUID().slice(0, 8)}`,
    supervise: false,
    deleteQueuesOnClose: true,
  });
  await startWorkers({ db, store: storage.store, jobs, config });
  // Nothing here sends mail; the mailer only has to exist.
  const mailer = createMailer(
    {
      host: "127.0.0.1",
      port: 9,
      secure: false,
      user: undefined,
      pass: undefined,
      requireTls: false,
    },
    config.mailFrom,
  );
  const sessionStore = createSessionStore(pool, { pruneIntervalSeconds: false });
  const app = createApp(config, { db, pool, sessionStore, mailer, store: storage.store, jobs });
  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const [team] = await db.insert(teams).values({ name: "Bench compute team" }).returning();
  try {
    if (!team) throw new Error("bench set-up failed");
    const hash = await hashPassword(PASSWORD);
    const people: Record<"gis" | "engineer", string> = { gis: "", engineer: "" };
    for (const role of ["gis", "engineer"] as const) {
      const email = `bench-${role}-${randomUUID().slice(0, 8)}@bench.rillmark.test`;
      const [user] = await db
        .insert(users)
        .values({ email, name: `Bench ${role}`, passwordHash: hash })
        .returning();
      if (!user) throw new Error("bench user insert failed");
      await db.insert(memberships).values({ teamId: team.id, userId: user.id, role });
      people[role] = email;
    }
    const [project] = await db
      .insert(projects)
      .values({ teamId: team.id, name: "Bench demo", units: "us", designReturnPeriodYears: 25 })
      .returning();
    if (!project) throw new Error("bench project insert failed");
    const gis = await ApiClient.signIn(baseUrl, people.gis, PASSWORD);
    const engineer = await ApiClient.signIn(baseUrl, people.engineer, PASSWORD);
    const id = await loadDemoScenario({ gis, engineer }, project, DEMO_OUT_DIR);

    const times: number[] = [];
    for (let k = 0; k < WARM_UP + TIMED; k += 1) {
      const start = performance.now();
      await engineer.json("POST", `/subcatchments/${id}/compute`, {});
      if (k >= WARM_UP) times.push(performance.now() - start);
    }
    times.sort((a, b) => a - b);
    const median = percentile(times, 50);
    const core = await timeCore(engineer, id);
    return [
      {
        name: `compute request, demo subcatchment (median of ${TIMED}, HTTP on loopback)`,
        value: median.toFixed(1),
        unit: "ms",
        target: "< 50",
        ok: median < 50,
      },
      {
        name: "compute request, demo subcatchment (95th percentile)",
        value: percentile(times, 95).toFixed(1),
        unit: "ms",
      },
      {
        name: "sensitivity view, demo subcatchment (median of 40, after warm-up)",
        value: core.sensitivityMs.toFixed(2),
        unit: "ms",
        target: "≤ 50",
        ok: core.sensitivityMs <= 50,
      },
      {
        name: "engineering core, demo subcatchment, without the band (anchor)",
        value: core.plainMs.toFixed(2),
        unit: "ms",
      },
      {
        name: "engineering core, demo subcatchment, with sensitivity and 2,000-draw band",
        value: core.bandMs.toFixed(2),
        unit: "ms",
      },
    ];
  } finally {
    if (team) await db.delete(teams).where(eq(teams.id, team.id));
    await new Promise((resolve) => server.close(resolve));
    sessionStore.close();
    await mailer.close();
    await jobs.close();
    await storage.close();
    await pool.end();
    rmSync(dir, { recursive: true, force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
