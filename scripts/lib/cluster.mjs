// The project-local PostgreSQL cluster: created once, started on 127.0.0.1, reused while it
// runs, recovered after a crash, stopped on the way out.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { BootstrapError, DATA_DIR, LOG_DIR, ROOT, rel, say, seconds, warn } from "./log.mjs";
import { isRoot, mustRun } from "./proc.mjs";
import { ensurePostgres } from "./pg-install.mjs";
import {
  chooseSocketDir,
  defaultLocation,
  postmasterRunning,
  projectHash,
  unsafeFallbackReason,
} from "./cluster-location.mjs";
import {
  clearStaleLocks,
  pgEnv,
  pickPort,
  readPid,
  startServer,
  waitReady,
} from "./cluster-server.mjs";
import {
  finishAuth,
  newPassword,
  savePassword,
  writeAuthFiles,
  writeAuthIfNeeded,
  writeInitPwfile,
} from "./cluster-auth.mjs";

export { stopCluster } from "./cluster-server.mjs";

export const CLUSTER_JSON = path.join(DATA_DIR, "cluster.json");
export const FIRST_PORT = 55180;

function readJson(file) {
  try {
    return JSON.parse(fs.readFileSync(file, "utf8"));
  } catch {
    return null;
  }
}

/** postgres's uid and gid; only needed as root. */
function postgresIds() {
  const line = fs
    .readFileSync("/etc/passwd", "utf8")
    .split("\n")
    .find((entry) => entry.startsWith("postgres:"));
  if (line) {
    const [, , uid, gid] = line.split(":");
    return { uid: Number(uid), gid: Number(gid) };
  }
  const id = (flag) => Number(spawnSync("id", [flag, "postgres"], { encoding: "utf8" }).stdout);
  const ids = { uid: id("-u"), gid: id("-g") };
  if (!ids.uid) throw new BootstrapError("there is no postgres user (is PostgreSQL installed?)");
  return ids;
}

/** Make a folder (or file) belong to the user the server runs as. */
function own(target, ids) {
  if (isRoot) fs.chownSync(target, ids.uid, ids.gid);
}

/** The base folder, its data folder and the log, from cluster.json or chosen afresh. */
function locate() {
  const saved = readJson(CLUSTER_JSON);
  const savedPort = Number.isInteger(saved?.port) ? saved.port : undefined;
  // Only this project's own places count (a copied project must not reuse the original's).
  const places = [
    { base: path.join(DATA_DIR, "pg"), fallback: false },
    { base: path.join(os.tmpdir(), `rillmark-pg-${projectHash(ROOT)}`), fallback: true },
  ];
  if (saved?.base === places[1].base) places.reverse();
  const existing = places.find((place) =>
    fs.existsSync(path.join(place.base, "data", "PG_VERSION")),
  );
  if (existing) return { ...existing, savedPort };
  const chosen = defaultLocation(ROOT);
  if (saved?.base) {
    warn(`the previous database folder ${saved.base} is gone; creating a new, empty cluster`);
  }
  if (chosen.fallback) warn(`${chosen.reason}: the cluster lives in ${chosen.base} instead`);
  return { base: chosen.base, fallback: chosen.fallback, savedPort };
}

function prepareFolders(loc, ids) {
  if (loc.fallback) {
    const unsafe = unsafeFallbackReason(loc.base, ids.uid);
    if (unsafe) throw new BootstrapError(`cannot use the database folder: ${unsafe}`);
  }
  fs.mkdirSync(loc.base, { recursive: true, mode: 0o700 });
  fs.chmodSync(loc.base, 0o700);
  own(loc.base, ids);
  // Inside the project the server log sits with the other logs; otherwise beside the cluster.
  const logFile = loc.fallback
    ? path.join(loc.base, "postgres.log")
    : path.join(LOG_DIR, "postgres.log");
  try {
    if (fs.statSync(logFile).size > 20 * 1024 * 1024) fs.renameSync(logFile, `${logFile}.1`);
  } catch {
    // no log yet
  }
  fs.closeSync(fs.openSync(logFile, "a"));
  own(logFile, ids);
  return logFile;
}

async function initCluster(pg, loc, dataDir, ids) {
  // A half-made folder from an interrupted initdb would make initdb refuse to start.
  if (fs.existsSync(dataDir)) fs.rmSync(dataDir, { recursive: true, force: true });
  say("creating the project's database cluster (initdb) …");
  const logFile = path.join(LOG_DIR, "initdb.log");
  const password = newPassword();
  // initdb runs as the server's user: it reads a copy in the cluster's private folder.
  const pwfile = writeInitPwfile(loc.base, password, ids);
  try {
    await mustRun(
      "initdb",
      path.join(pg.bin, "initdb"),
      [
        ...["-D", dataDir, "-U", "postgres", `--pwfile=${pwfile}`],
        ...["--auth-host=scram-sha-256", "--auth-local=peer", "-E", "UTF8", "--no-locale"],
      ],
      { asPostgres: true, logFile, env: pgEnv() },
    );
  } finally {
    fs.rmSync(pwfile, { force: true });
  }
  writeAuthFiles(dataDir, ids);
  savePassword(password);
  fs.appendFileSync(
    path.join(dataDir, "postgresql.conf"),
    "\n# Settings of the Rillmark bootstrap (rewritten at every start).\ninclude_if_exists = 'rillmark.conf'\n",
  );
}

function writeOwned(file, text, ids) {
  fs.writeFileSync(file, text, { mode: 0o600 });
  own(file, ids);
}

function writeSettings(dataDir, port, socketDir, ids) {
  writeOwned(
    path.join(dataDir, "rillmark.conf"),
    [
      "listen_addresses = '127.0.0.1'",
      `port = ${port}`,
      `unix_socket_directories = '${socketDir}'`,
      "unix_socket_permissions = 0700",
      "# JIT adds 0.1-1 s to interactive spatial queries.",
      "jit = off",
      "",
    ].join("\n"),
    ids,
  );
}

/**
 * Create (once), recover and start the cluster, password-protected (see cluster-auth.mjs).
 * Returns { base, dataDir, socketDir, port, password, logFile, version, bin, fallback,
 * startedHere }; the password is never written to cluster.json.
 */
export async function ensureCluster() {
  const loc = locate();
  const dataDir = path.join(loc.base, "data");
  let clusterVersion;
  try {
    clusterVersion = fs.readFileSync(path.join(dataDir, "PG_VERSION"), "utf8").trim();
  } catch {
    clusterVersion = undefined;
  }
  const pg = await ensurePostgres(clusterVersion);
  const ids = isRoot ? postgresIds() : null;
  const logFile = prepareFolders(loc, ids);
  const started = Date.now();
  if (!clusterVersion) await initCluster(pg, loc, dataDir, ids);

  const cluster = { base: loc.base, dataDir, logFile, fallback: loc.fallback, ...pg };
  const pidInfo = readPid(dataDir);
  if (pidInfo && postmasterRunning(dataDir, pidInfo.pid)) {
    const port = pidInfo.port ?? loc.savedPort;
    if (await waitReady(pg, dataDir, port)) {
      Object.assign(cluster, { port, socketDir: pidInfo.socketDir, startedHere: false });
      saveClusterJson(cluster);
      say(`database server already running on 127.0.0.1:${port} (${rel(loc.base)})`);
      const plan = writeAuthIfNeeded(dataDir, ids);
      cluster.password = await finishAuth(cluster, plan, { reload: plan.changed });
      return cluster;
    }
    throw new BootstrapError(`PostgreSQL (pid ${pidInfo.pid}) runs but does not answer`, {
      hint: `Stop it with: ${path.join(pg.bin, "pg_ctl")} -D ${dataDir} -m fast stop`,
      logFile,
    });
  }
  if (pidInfo) clearStaleLocks(dataDir, pidInfo);

  // The saved port when it is still free, else the next free one (recorded for next time).
  const port = await pickPort(loc.savedPort ?? FIRST_PORT);
  if (loc.savedPort && port !== loc.savedPort) {
    warn(`port ${loc.savedPort} is taken; PostgreSQL moves to ${port}`);
  }
  const socketDir = chooseSocketDir({
    base: loc.base,
    port,
    tmpDir: os.tmpdir(),
    hash: projectHash(ROOT),
  });
  fs.mkdirSync(socketDir, { recursive: true, mode: 0o700 });
  fs.chmodSync(socketDir, 0o700);
  if (ids) own(socketDir, ids);
  writeSettings(dataDir, port, socketDir, ids);
  const plan = writeAuthIfNeeded(dataDir, ids);
  Object.assign(cluster, { port, socketDir, startedHere: true });
  saveClusterJson(cluster);
  await startServer(pg, cluster);
  say(
    `database server started on 127.0.0.1:${port} in ${seconds(Date.now() - started)} (${rel(loc.base)})`,
  );
  cluster.password = await finishAuth(cluster, plan, { reload: false });
  return cluster;
}

function saveClusterJson(cluster) {
  const { base, dataDir, socketDir, port, logFile, version, fallback } = cluster;
  const record = { base, dataDir, socketDir, port, logFile, version, fallback };
  fs.writeFileSync(CLUSTER_JSON, `${JSON.stringify(record, null, 2)}\n`);
}

/** The saved description of the cluster, for `db stop`. */
export function savedCluster() {
  return readJson(CLUSTER_JSON);
}
