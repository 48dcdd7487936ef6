// Databases inside the project-local cluster, each with PostGIS.
import path from "node:path";
import { BootstrapError, LOG_DIR, say, seconds, tail, warn } from "./log.mjs";
import { run } from "./proc.mjs";
import { pgEnv } from "./cluster-server.mjs";
import { localDatabaseUrl, setPassword } from "./cluster-auth.mjs";

const NAME = /^[a-z_][a-z0-9_]{0,62}$/;

export function databaseUrl(cluster, name) {
  return localDatabaseUrl(cluster, name);
}

const PSQL_LOG = path.join(LOG_DIR, "psql.log");
const PASSWORD_FAILED = /password authentication failed/;
const PASSWORD_HINT =
  "The cluster does not accept the password in .data/pg-password. Delete that file and run " +
  "the command again: the bootstrap then sets a new password over the private socket.";

function tcpPsql(cluster, database, sql) {
  const args = ["-X", "-q", "-At", "-v", "ON_ERROR_STOP=1"];
  args.push("-h", "127.0.0.1", "-p", String(cluster.port), "-U", "postgres", "-d", database);
  return run(path.join(cluster.bin, "psql"), [...args, "-f", "-"], {
    input: sql,
    env: { ...pgEnv(), PGPASSWORD: cluster.password ?? "", PGCONNECT_TIMEOUT: "10" },
    logFile: PSQL_LOG,
  });
}

/**
 * Run SQL through the cluster's own psql over TCP loopback; resolves psql's stdout. A server
 * whose password drifted from .data/pg-password (a restored backup, a manual ALTER ROLE) gets
 * the file's password again, once, over the private socket; the SQL had not run.
 */
export async function psql(cluster, database, sql, what = "psql") {
  let result = await tcpPsql(cluster, database, sql);
  const refused = () => result.code !== 0 && PASSWORD_FAILED.test(result.err);
  if (refused() && cluster.password && !cluster.passwordReset) {
    cluster.passwordReset = true;
    warn("the database refused the password in .data/pg-password; setting it again");
    await setPassword(cluster, cluster.password);
    result = await tcpPsql(cluster, database, sql);
  }
  if (result.code !== 0) {
    throw new BootstrapError(`${what} failed (exit ${result.code})`, {
      logFile: PSQL_LOG,
      details: tail(PSQL_LOG, 25),
      hint: refused() ? PASSWORD_HINT : undefined,
    });
  }
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
