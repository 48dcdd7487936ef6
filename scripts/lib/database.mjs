// Databases inside the project-local cluster, each with PostGIS.
import path from "node:path";
import { BootstrapError, LOG_DIR, say, seconds } from "./log.mjs";
import { mustRun } from "./proc.mjs";
import { pgEnv } from "./cluster-server.mjs";

const NAME = /^[a-z_][a-z0-9_]{0,62}$/;

export function databaseUrl(cluster, name) {
  return `postgres://postgres@127.0.0.1:${cluster.port}/${name}`;
}

/** Run SQL through the cluster's own psql over TCP loopback; resolves psql's stdout. */
export async function psql(cluster, database, sql, what = "psql") {
  const args = ["-X", "-q", "-At", "-v", "ON_ERROR_STOP=1"];
  args.push("-h", "127.0.0.1", "-p", String(cluster.port), "-U", "postgres", "-d", database);
  const result = await mustRun(what, path.join(cluster.bin, "psql"), [...args, "-f", "-"], {
    input: sql,
    env: { ...pgEnv(), PGCONNECT_TIMEOUT: "10" },
    logFile: path.join(LOG_DIR, "psql.log"),
  });
  return result.out.trim();
}

/**
 * Make sure `name` exists with PostGIS. `fresh` drops it first: the test and bench databases
 * start empty every run; the user's database is never dropped.
 */
export async function ensureDatabase(cluster, name, { fresh = false } = {}) {
  if (!NAME.test(name)) throw new BootstrapError(`invalid database name "${name}"`);
  const started = Date.now();
  const drop = fresh ? `DROP DATABASE IF EXISTS ${name} WITH (FORCE);\n` : "";
  const created = await psql(
    cluster,
    "postgres",
    `${drop}SELECT 'created' FROM pg_database WHERE datname = '${name}' HAVING count(*) = 0;\n` +
      `SELECT 'CREATE DATABASE ${name}' WHERE NOT EXISTS ` +
      `(SELECT FROM pg_database WHERE datname = '${name}')\\gexec\n`,
    `creating database ${name}`,
  );
  const version = await psql(
    cluster,
    name,
    "CREATE EXTENSION IF NOT EXISTS postgis;\nSELECT extversion FROM pg_extension WHERE extname = 'postgis';\n",
    `enabling PostGIS in ${name}`,
  );
  const how = created === "created" ? (fresh ? "recreated" : "created") : "ready";
  say(`database ${name} ${how} (PostGIS ${version}) in ${seconds(Date.now() - started)}`);
  return databaseUrl(cluster, name);
}
