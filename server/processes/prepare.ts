import { runMigrations } from "../db/migrate";
import { connectDatabase, type Database } from "../db/client";
import { assertSafeForProduction, loadConfig, type Config } from "../config";
import { seedBasemap } from "../seed/basemap";
import { seedDemo } from "../seed/demo";
import { seedDemoGeodata } from "../seed/demo-geodata";

/** Environment first, then `overrides` (tests pass e.g. `{ port: 0 }`). */
export function baseConfig(overrides: Partial<Config> = {}): Config {
  const env = { ...process.env };
  if (overrides.databaseUrl) env.DATABASE_URL = overrides.databaseUrl;
  const base: Config = { ...loadConfig(env), ...overrides };
  assertSafeForProduction(base);
  if (base.publicBaseUrl?.startsWith("https:") && !base.trustProxy) {
    // The session cookie is Secure then, and Express only sends it on a request it knows came
    // over HTTPS, which (Rillmark serving plain HTTP) means through a trusted proxy.
    console.warn(
      "PUBLIC_BASE_URL is https but TRUST_PROXY is off: sign-in cookies will not be set.",
    );
  }
  return base;
}

/** Migrations and the database-only seeds, once, before any app or worker process starts. */
export async function prepareDatabase(config: Config): Promise<Database> {
  await runMigrations(config.databaseUrl);
  // Seeding is start-up work, not a request: the job limit.
  const database = connectDatabase(config.databaseUrl, 2, {
    statementTimeoutMs: config.statementTimeoutMs.job,
  });
  try {
    await seedDemo(database.db);
    await seedBasemap(database.db);
    return database;
  } catch (err) {
    await database.pool.end();
    throw err;
  }
}

/**
 * The demo's layers, rules and subcatchment go in through the API a user's browser calls, so
 * they wait for an app process (and the worker); a failure is reported and retried next start.
 */
export async function seedDemoThroughApi(database: Database, baseUrl: string): Promise<void> {
  const demo = await seedDemoGeodata({ db: database.db, pool: database.pool, baseUrl });
  if (!demo.ran && demo.reason.startsWith("failed")) {
    console.warn(
      `The demo project's geodata was not loaded (retried at next start): ${demo.reason}`,
    );
  }
}
