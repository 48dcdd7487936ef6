// What every command needs first: Node, dependencies, a database, and the environment the
// children get.
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { DATA_DIR, ROOT, color, ensureDataDirs, log, say, seconds } from "./log.mjs";
import { loadDotEnv } from "./dotenv.mjs";
import { assertNodeVersion, ensureDependencies } from "./node-deps.mjs";
import { ensureCluster, stopCluster } from "./cluster.mjs";
import { ensureDatabase } from "./database.mjs";
import {
  addLease,
  autoStopMarked,
  clearAutoStop,
  dropLease,
  markAutoStop,
  otherLeases,
  shouldStopCluster,
  withClusterLock,
} from "./leases.mjs";
import { onCleanup } from "./children.mjs";

/** A URL for printing: the password, if any, hidden. */
export function redactUrl(url) {
  return url.replace(/(\/\/[^:/@]+):[^@]*@/, "$1:***@");
}

/**
 * Node check, `npm ci` if needed (skipped with needDeps: false), then the database:
 * the managed one from the environment, or `database` in the project-local cluster.
 * Returns { databaseUrl, cluster, release } (cluster null when managed).
 */
export async function prepare({
  command,
  database,
  fresh = false,
  needDeps = true,
  needDb = true,
}) {
  ensureDataDirs();
  log(`=== ${command} (pid ${process.pid}, node ${process.versions.node})`);
  assertNodeVersion();
  // Tests stay hermetic: a developer's .env (SMTP, NODE_ENV, …) must not change them.
  if (command !== "test") {
    const fromFile = loadDotEnv(ROOT);
    if (fromFile.length > 0) say(`settings from .env: ${fromFile.join(", ")}`);
  }
  if (needDeps) await ensureDependencies();
  const none = { databaseUrl: null, cluster: null, release: async () => {} };
  if (!needDb) return none;

  // npm test never uses the user's database; a managed test database has its own variable.
  const managedVar = command === "test" ? "TEST_DATABASE_URL" : "DATABASE_URL";
  const managed = process.env[managedVar];
  if (managed) {
    say(`using the PostgreSQL server of ${managedVar} (${redactUrl(managed)})`);
    return { ...none, databaseUrl: managed };
  }
  if (command === "test" && process.env.DATABASE_URL) {
    say("DATABASE_URL is not used by npm test; it runs against its own local database");
  }

  let cluster = null;
  let releasing = null;
  // One release, shared: a Ctrl-C during the normal end must wait for it, not skip it.
  const release = () => {
    if (!cluster || command === "db") return Promise.resolve();
    releasing ??= releaseCluster(cluster);
    return releasing;
  };
  onCleanup(release);
  await withClusterLock(async () => {
    cluster = await ensureCluster();
    if (command === "db") {
      clearAutoStop();
    } else {
      addLease(command);
      if (cluster.startedHere) markAutoStop();
    }
  });
  const databaseUrl = await ensureDatabase(cluster, database, { fresh });
  return { databaseUrl, cluster, release };
}

async function releaseCluster(cluster) {
  await withClusterLock(async () => {
    dropLease();
    const others = otherLeases().length;
    const autoStop = autoStopMarked();
    if (shouldStopCluster({ others, autoStop })) {
      const started = Date.now();
      if (await stopCluster(cluster)) {
        say(`database server stopped (${seconds(Date.now() - started)})`);
      }
      clearAutoStop();
    } else if (others > 0) {
      say(`database server left running: ${others} other Rillmark command(s) use it`);
    } else {
      say("database server left running (not started by this command)");
      say(color.dim("stop it with: node scripts/bootstrap.mjs db stop"));
    }
  });
}

/** The session secret for local runs: the user's, or one generated once and kept private. */
export function sessionSecret() {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  const file = path.join(DATA_DIR, "session-secret");
  try {
    return fs.readFileSync(file, "utf8").trim();
  } catch {
    // first run
  }
  const secret = randomBytes(48).toString("base64url");
  try {
    fs.writeFileSync(file, `${secret}\n`, { mode: 0o600, flag: "wx" });
  } catch (error) {
    if (error.code === "EEXIST") return fs.readFileSync(file, "utf8").trim();
    throw error;
  }
  return secret;
}

/**
 * Environment of the server for start, dev and bench: the user's variables win, except that
 * the database is the one prepared here. NODE_ENV stays unset: the server's local mode
 * (fake mail server, Outbox) is the default for `npm start`.
 */
export function serverEnv(databaseUrl) {
  return { ...process.env, DATABASE_URL: databaseUrl, SESSION_SECRET: sessionSecret() };
}
