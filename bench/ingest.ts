/**
 * Ingest benchmark (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx bench/ingest.ts`):
 * a zipped shapefile of 100,000 cover polygons (synthetic, invented: 12-sided rings on a grid in
 * UTM 10N, two attributes; bench/geodata-files.ts) through the same path as an upload — original into object storage
 * (the local S3 fake), a pg-boss job, the reader in a worker thread, batched inserts in one
 * transaction, the PostGIS validity check — timed from the job's sending to the layer's ready.
 * Peak resident memory of the process (the reader thread included) is sampled every 20 ms;
 * the event loop's longest stall shows whether requests would have waited meanwhile.
 */
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { monitorEventLoopDelay } from "node:perf_hooks";
import { pathToFileURL } from "node:url";
import { eq } from "drizzle-orm";
import { loadConfig } from "../server/config";
import { connectDatabase } from "../server/db/client";
import { runMigrations } from "../server/db/migrate";
import { projects, teams } from "../server/db/schema";
import { layers } from "../server/db/schema-geodata";
import { startJobQueue } from "../server/jobs/queue";
import { startWorkers } from "../server/jobs/workers";
import { waitForLayer } from "../server/layers/wait";
import { startStorage } from "../server/storage";
import { makeCoverShapefile } from "./geodata-files";
import type { BenchRow } from "./table";

const POLYGONS = 100_000;
export async function run(): Promise<BenchRow[]> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) return [{ name: "shapefile ingest", value: "skipped: no DATABASE_URL" }];
  await runMigrations(databaseUrl);
  const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-bench-ingest-"));
  const base = loadConfig({ ...process.env, DATABASE_URL: databaseUrl, NODE_ENV: "test" });
  const config = {
    ...base,
    storage: { ...base.storage, fakeDir: path.join(dir, "s3"), cacheDir: path.join(dir, "cache") },
    uploads: { ...base.uploads, dir: path.join(dir, "uploads") },
  };
  const { pool, db } = connectDatabase(databaseUrl, 5);
  const storage = await startStorage(config.storage);
  const jobs = await startJobQueue({
    connectionString: databaseUrl,
    queueSuffix: `-bench-${randomUUID().slice(0, 8)}`,
    supervise: false,
    deleteQueuesOnClose: true,
  });
  await startWorkers({ db, store: storage.store, jobs, config });
  const [team] = await db.insert(teams).values({ name: "Bench team" }).returning();
  try {
    if (!team) throw new Error("bench set-up failed");
    const [project] = await db
      .insert(projects)
      .values({ teamId: team.id, name: "Bench", units: "si", designReturnPeriodYears: 10 })
      .returning();
    if (!project) throw new Error("bench project insert failed");
    const file = makeCoverShapefile(dir, POLYGONS);

    const layerId = randomUUID();
    const objectKey = `projects/${project.id}/layers/${layerId}/original.zip`;
    await db.insert(layers).values({
      id: layerId,
      projectId: project.id,
      kind: "cover",
      name: "100k squares",
      format: "shapefile",
      originalFilename: "cover-100k.zip",
      sizeBytes: 0,
      objectKey,
    });
    await storage.store.putFile(objectKey, file);

    global.gc?.();
    let peakRss = process.memoryUsage().rss;
    const sampler = setInterval(() => {
      peakRss = Math.max(peakRss, process.memoryUsage().rss);
    }, 20);
    const loop = monitorEventLoopDelay({ resolution: 10 });
    loop.enable();
    const start = performance.now();
    await jobs.sendIngest({ layerId, uploadPath: file });
    const row = await waitForLayer(db, jobs.events, layerId, 600_000);
    const seconds = (performance.now() - start) / 1000;
    loop.disable();
    clearInterval(sampler);
    if (row?.status !== "ready" || row.featureCount !== POLYGONS) {
      throw new Error(`ingest ended ${row?.status}: ${JSON.stringify(row?.error)}`);
    }
    const peakMb = peakRss / 1024 / 1024;
    const stallMs = loop.max / 1e6;
    return [
      {
        name: `ingest ${POLYGONS.toLocaleString("en")}-polygon shapefile (job, thread, insert, validity)`,
        value: seconds.toFixed(1),
        unit: "s",
        target: "< 30",
        ok: seconds < 30,
      },
      {
        name: "ingest peak resident memory",
        value: peakMb.toFixed(0),
        unit: "MB",
        target: "< 1024",
        ok: peakMb < 1024,
      },
      {
        // Our own aim (not in the issue): a request arriving meanwhile waits at most this long.
        name: "ingest longest event-loop stall",
        value: stallMs.toFixed(0),
        unit: "ms",
        target: "< 100",
        ok: stallMs < 100,
      },
    ];
  } finally {
    if (team) await db.delete(teams).where(eq(teams.id, team.id));
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
