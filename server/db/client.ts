import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import { followRequests } from "./request-scope";
import * as coreSchema from "./schema";
import * as basemapSchema from "./schema-basemap";
import * as geodataSchema from "./schema-geodata";

const schema = { ...coreSchema, ...geodataSchema, ...basemapSchema };

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };
/** The handle inside `db.transaction(async (tx) => …)`. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Query helpers take either, so they compose inside a caller's transaction. */
export type DbOrTx = Db | Tx;

export interface Database {
  pool: pg.Pool;
  db: Db;
}

export interface ConnectOptions {
  /** PostgreSQL stops any one statement after this long (error 57014); undefined: no limit. */
  statementTimeoutMs?: number;
}

export function connectDatabase(
  databaseUrl: string,
  max = 10,
  options: ConnectOptions = {},
): Database {
  const pool = new pg.Pool({
    connectionString: databaseUrl,
    max,
    // A new connection's first spatial query loads PostGIS into its backend (about 0.1 s here);
    // closing idle ones after pg's default 10 s paid that again after every pause.
    idleTimeoutMillis: 5 * 60_000,
    ...(options.statementTimeoutMs !== undefined && {
      statement_timeout: options.statementTimeoutMs,
    }),
  });
  // An idle client losing its connection (database restart) must not crash the process.
  pool.on("error", (err) => console.error("PostgreSQL pool error:", err.message));
  followRequests(pool, { connectionString: databaseUrl });
  return { pool, db: drizzle(pool, { schema }) };
}

/** The database name of a connection URL (used to refuse running tests on a real database). */
export function databaseName(databaseUrl: string): string {
  return decodeURIComponent(new URL(databaseUrl).pathname.replace(/^\//, ""));
}
