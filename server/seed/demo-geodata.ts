/**
 * Loads the invented demo scenario (demo-geo/out) into the demo project through Rillmark's own
 * API, once per database: the GIS specialist uploads the layers and maps them, the engineer adds
 * the rainfall table, the Design rules and the subcatchment with its flow path, and computes it.
 * So the demo opens with everything a user would have made, made the way a user makes it.
 *
 * It runs after the server listens (main.ts). It never touches a demo project that already holds
 * geodata (someone worked in it) or a database where it ran before (seed_runs), and a failure
 * removes what it created, so the next start tries again from a clean project.
 */
import { asc, eq } from "drizzle-orm";
import type pg from "pg";
import type { Db } from "../db/client";
import { projects, seedRuns } from "../db/schema";
import {
  designRules,
  layers,
  projectSurfaceOverrides,
  rainfallTables,
  subcatchments,
} from "../db/schema-geodata";
import { ApiClient } from "./api-client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "./demo";
import { loadDemoScenario } from "./demo-geodata-steps";
import { DEMO_OUT_DIR } from "./demo-scenario";

export const DEMO_GEODATA_SEED_NAME = "demo-geodata-v1";
// One process seeds at a time (two servers starting on one database).
const LOCK_KEY = 0x4745_4f44; // "GEOD"

export interface DemoGeodataOptions {
  readonly db: Db;
  /** The same database's pool: the seed's lock lives on one of its connections. */
  readonly pool: pg.Pool;
  /** Where the API answers, e.g. http://127.0.0.1:5180 (loopback). */
  readonly baseUrl: string;
  /** The scenario's folder; demo-geo/out by default. */
  readonly dir?: string;
}

export type DemoGeodataResult =
  | { readonly ran: true; readonly subcatchmentId: string }
  | { readonly ran: false; readonly reason: string };

function account(role: "gis" | "engineer"): string {
  const found = DEMO_ACCOUNTS.find((a) => a.role === role);
  if (!found) throw new Error(`no demo ${role} account`);
  return found.email;
}

async function hasGeodata(db: Db, projectId: string): Promise<boolean> {
  const checks = await Promise.all([
    db.select({ id: layers.id }).from(layers).where(eq(layers.projectId, projectId)).limit(1),
    db
      .select({ id: rainfallTables.id })
      .from(rainfallTables)
      .where(eq(rainfallTables.projectId, projectId))
      .limit(1),
    db
      .select({ id: subcatchments.id })
      .from(subcatchments)
      .where(eq(subcatchments.projectId, projectId))
      .limit(1),
    db
      .select({ id: designRules.projectId })
      .from(designRules)
      .where(eq(designRules.projectId, projectId))
      .limit(1),
    db
      .select({ id: projectSurfaceOverrides.projectId })
      .from(projectSurfaceOverrides)
      .where(eq(projectSurfaceOverrides.projectId, projectId))
      .limit(1),
  ]);
  return checks.some((rows) => rows.length > 0);
}

async function markDone(db: Db): Promise<void> {
  await db.insert(seedRuns).values({ name: DEMO_GEODATA_SEED_NAME }).onConflictDoNothing();
}

interface Made {
  gis?: ApiClient;
  readonly layerIds: string[];
}

/**
 * Everything the seed made in the project, removed after a failure (the project stays): layers
 * through the API, so their stored originals go too, then whatever is left in one transaction.
 */
async function removeSeeded(db: Db, projectId: string, made: Made): Promise<void> {
  for (const id of made.layerIds) {
    await made.gis?.json("DELETE", `/layers/${id}`).catch(() => undefined);
  }
  await db.transaction(async (tx) => {
    await tx.delete(subcatchments).where(eq(subcatchments.projectId, projectId));
    await tx.delete(designRules).where(eq(designRules.projectId, projectId));
    await tx
      .delete(projectSurfaceOverrides)
      .where(eq(projectSurfaceOverrides.projectId, projectId));
    await tx.delete(rainfallTables).where(eq(rainfallTables.projectId, projectId));
    await tx.delete(layers).where(eq(layers.projectId, projectId));
  });
}

async function load(
  options: DemoGeodataOptions,
  project: { id: string; teamId: string },
  made: Made,
): Promise<string> {
  const gis = await ApiClient.signIn(options.baseUrl, account("gis"), DEMO_PASSWORD);
  made.gis = gis;
  const engineer = await ApiClient.signIn(options.baseUrl, account("engineer"), DEMO_PASSWORD);
  return loadDemoScenario({ gis, engineer }, project, options.dir ?? DEMO_OUT_DIR, (id) =>
    made.layerIds.push(id),
  );
}

/**
 * Seeds the demo project's geodata once. Answers what it did; a failure is reported (and the
 * project left as it was), never thrown, so a server still starts without its demo data.
 */
export async function seedDemoGeodata(options: DemoGeodataOptions): Promise<DemoGeodataResult> {
  const { db, pool } = options;
  const [seen] = await db.select().from(seedRuns).where(eq(seedRuns.name, DEMO_GEODATA_SEED_NAME));
  if (seen) return { ran: false, reason: "already seeded" };
  const client = await pool.connect();
  try {
    const { rows } = await client.query<{ locked: boolean }>(
      "select pg_try_advisory_lock($1) as locked",
      [LOCK_KEY],
    );
    if (!rows[0]?.locked) return { ran: false, reason: "another process is seeding" };
    try {
      const [again] = await db
        .select()
        .from(seedRuns)
        .where(eq(seedRuns.name, DEMO_GEODATA_SEED_NAME));
      if (again) return { ran: false, reason: "already seeded" };
      const [project] = await db
        .select({ id: projects.id, teamId: projects.teamId })
        .from(projects)
        .where(eq(projects.isDemo, true))
        .orderBy(asc(projects.createdAt))
        .limit(1);
      if (!project) {
        await markDone(db);
        return { ran: false, reason: "no demo project (deleted by its team)" };
      }
      if (await hasGeodata(db, project.id)) {
        await markDone(db);
        return { ran: false, reason: "the demo project already holds its team's own data" };
      }
      const made: Made = { layerIds: [] };
      try {
        const subcatchmentId = await load(options, project, made);
        await markDone(db);
        return { ran: true, subcatchmentId };
      } catch (err) {
        await removeSeeded(db, project.id, made);
        const reason = err instanceof Error ? err.message : String(err);
        return { ran: false, reason: `failed: ${reason}` };
      }
    } finally {
      await client.query("select pg_advisory_unlock($1)", [LOCK_KEY]);
    }
  } finally {
    client.release();
  }
}
