import path from "node:path";
import { fileURLToPath } from "node:url";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";

export const MIGRATIONS_FOLDER = fileURLToPath(new URL("../../drizzle", import.meta.url));

// Any constant works; it only has to be the same for every process migrating this database.
const MIGRATION_LOCK_KEY = 0x52494c4c; // "RILL"

/**
 * Apply the SQL migrations in drizzle/. Several processes may start at once (test projects, a
 * second server), so the run holds a PostgreSQL advisory lock and the others wait for it.
 */
export async function runMigrations(databaseUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query("SELECT pg_advisory_lock($1)", [MIGRATION_LOCK_KEY]);
    try {
      await migrate(drizzle(client), { migrationsFolder: MIGRATIONS_FOLDER });
    } finally {
      await client.query("SELECT pg_advisory_unlock($1)", [MIGRATION_LOCK_KEY]);
    }
  } finally {
    await client.end();
  }
}

const runDirectly =
  process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);

if (runDirectly) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("Set DATABASE_URL to the database to migrate.");
    process.exit(1);
  }
  runMigrations(url).then(
    () => console.log("Migrations applied."),
    (err: unknown) => {
      console.error("Migrations failed:", err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
