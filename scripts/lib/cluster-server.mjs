// The PostgreSQL server process of the project-local cluster: start, readiness, crash
// recovery (stale lock files) and stop.
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { BootstrapError, log, rel, tail, warn } from "./log.mjs";
import { run, sleep } from "./proc.mjs";
import { parsePostmasterPid, postmasterRunning } from "./cluster-location.mjs";

const RETRYABLE_START = /shared memory block|lock file .* already exists/i;

export function portFree(port) {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once("error", () => resolve(false));
    server.listen({ port, host: "127.0.0.1", exclusive: true }, () =>
      server.close(() => resolve(true)),
    );
  });
}

export async function pickPort(preferred) {
  for (let port = preferred; port < preferred + 200; port += 1) {
    if (await portFree(port)) return port;
  }
  throw new BootstrapError(
    `no free port for PostgreSQL between ${preferred} and ${preferred + 199}`,
  );
}

/** PostgreSQL programs get no PG* variables of the user's (they would redirect them). */
export function pgEnv() {
  const env = {};
  for (const [key, value] of Object.entries(process.env))
    if (!key.startsWith("PG")) env[key] = value;
  return env;
}

/**
 * Remove the lock files of a server that is gone (kill -9, power loss). Its socket lock names
 * the same pid; a socket lock with any other pid belongs to someone else and stays.
 */
export function clearStaleLocks(dataDir, pidInfo) {
  warn(`removing the stale lock of a PostgreSQL server that is gone (pid ${pidInfo.pid})`);
  fs.rmSync(path.join(dataDir, "postmaster.pid"), { force: true });
  if (!pidInfo.socketDir || !pidInfo.port) return;
  const socket = path.join(pidInfo.socketDir, `.s.PGSQL.${pidInfo.port}`);
  try {
    const owner = Number.parseInt(fs.readFileSync(`${socket}.lock`, "utf8"), 10);
    if (owner !== pidInfo.pid) return;
  } catch {
    return;
  }
  fs.rmSync(`${socket}.lock`, { force: true });
  fs.rmSync(socket, { force: true });
}

export async function waitReady(pg, dataDir, port) {
  for (let i = 0; i < 150; i += 1) {
    const info = readPid(dataDir);
    if (info?.status === "ready") {
      const probe = await run(
        path.join(pg.bin, "pg_isready"),
        ["-q", "-h", "127.0.0.1", "-p", String(port), "-U", "postgres", "-d", "postgres"],
        { env: pgEnv() },
      );
      if (probe.code === 0) return true;
    }
    if (!info) return false;
    await sleep(200);
  }
  return false;
}

export function readPid(dataDir) {
  try {
    return parsePostmasterPid(fs.readFileSync(path.join(dataDir, "postmaster.pid"), "utf8"));
  } catch {
    return null;
  }
}

export async function startServer(pg, cluster) {
  for (let attempt = 1; ; attempt += 1) {
    const before = tailSize(cluster.logFile);
    const result = await run(
      path.join(pg.bin, "pg_ctl"),
      // Always -l: without it the server keeps our pipes open and we would never return.
      ["-D", cluster.dataDir, "-l", cluster.logFile, "-w", "-t", "60", "start"],
      { asPostgres: true, env: pgEnv() },
    );
    if (result.code === 0) return;
    const newLog = readFrom(cluster.logFile, before);
    log(`pg_ctl start failed: ${newLog}`);
    if (attempt >= 5 || !RETRYABLE_START.test(newLog + result.err)) {
      throw new BootstrapError("PostgreSQL did not start", {
        details: newLog.trim() || tail(cluster.logFile, 20),
        logFile: cluster.logFile,
      });
    }
    // After a kill -9 the old server's children can hold shared memory for a moment.
    const stale = readPid(cluster.dataDir);
    if (stale && !postmasterRunning(cluster.dataDir, stale.pid))
      clearStaleLocks(cluster.dataDir, stale);
    await sleep(1000);
  }
}

function tailSize(file) {
  try {
    return fs.statSync(file).size;
  } catch {
    return 0;
  }
}

function readFrom(file, offset) {
  try {
    return fs.readFileSync(file).subarray(offset).toString("utf8");
  } catch {
    return "";
  }
}

export async function stopCluster(cluster) {
  const bin = cluster.bin ?? `/usr/lib/postgresql/${cluster.version}/bin`;
  const pidInfo = readPid(cluster.dataDir);
  if (!pidInfo || !postmasterRunning(cluster.dataDir, pidInfo.pid)) return false;
  const result = await run(
    path.join(bin, "pg_ctl"),
    ["-D", cluster.dataDir, "-m", "fast", "-w", "stop"],
    {
      asPostgres: true,
      env: pgEnv(),
    },
  );
  if (result.code !== 0)
    warn(`pg_ctl stop failed (exit ${result.code}); see ${rel(cluster.logFile)}`);
  return result.code === 0;
}
