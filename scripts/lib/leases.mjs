// Several bootstraps may share the cluster (npm start in one terminal, npm test in another).
// A lock serialises set-up and shut-down; a lease per running bootstrap tells the last one
// out whether someone still needs the database.
import fs from "node:fs";
import path from "node:path";
import { DATA_DIR, say } from "./log.mjs";
import { pidState } from "./cluster-location.mjs";
import { sleep } from "./proc.mjs";

const LOCK_FILE = path.join(DATA_DIR, "cluster.lock");
const LEASE_DIR = path.join(DATA_DIR, "leases");

/** Is pid a live bootstrap (not a zombie, not a reused pid)? */
function bootstrapAlive(pid) {
  if (pid === process.pid) return true;
  if (pidState(pid) !== "alive") return false;
  try {
    return fs.readFileSync(`/proc/${pid}/cmdline`, "utf8").includes("bootstrap.mjs");
  } catch {
    return false;
  }
}

function readPid(file) {
  try {
    return Number.parseInt(fs.readFileSync(file, "utf8"), 10) || null;
  } catch {
    return null;
  }
}

/** Run fn while holding the cluster lock; waits for another bootstrap, takes over a dead one's. */
export async function withClusterLock(fn, { timeoutMs = 180_000 } = {}) {
  // Re-entry: a Ctrl-C during set-up runs the clean-up while set-up still holds the lock.
  if (readPid(LOCK_FILE) === process.pid) return fn();
  const deadline = Date.now() + timeoutMs;
  let told = false;
  for (;;) {
    try {
      fs.writeFileSync(LOCK_FILE, `${process.pid}\n`, { flag: "wx" });
      break;
    } catch (error) {
      if (error.code !== "EEXIST") throw error;
    }
    const holder = readPid(LOCK_FILE);
    if (holder === null || !bootstrapAlive(holder)) {
      fs.rmSync(LOCK_FILE, { force: true });
      continue;
    }
    if (Date.now() > deadline) throw new Error(`cluster lock held by pid ${holder} for too long`);
    if (!told)
      say(`waiting for another Rillmark bootstrap (pid ${holder}) to finish with the database …`);
    told = true;
    await sleep(200);
  }
  try {
    return await fn();
  } finally {
    if (readPid(LOCK_FILE) === process.pid) fs.rmSync(LOCK_FILE, { force: true });
  }
}

export function addLease(command) {
  fs.mkdirSync(LEASE_DIR, { recursive: true });
  fs.writeFileSync(path.join(LEASE_DIR, String(process.pid)), `${command}\n`);
}

export function dropLease() {
  fs.rmSync(path.join(LEASE_DIR, String(process.pid)), { force: true });
}

/** Leases of other live bootstraps; stale ones (crashed runs) are removed on the way. */
export function otherLeases() {
  let names = [];
  try {
    names = fs.readdirSync(LEASE_DIR);
  } catch {
    return [];
  }
  const others = [];
  for (const name of names) {
    const pid = Number.parseInt(name, 10);
    if (pid === process.pid) continue;
    if (Number.isInteger(pid) && bootstrapAlive(pid)) others.push(pid);
    else fs.rmSync(path.join(LEASE_DIR, name), { force: true });
  }
  return others;
}

// Set when a start/dev/test/bench run started the server: the last of them out stops it.
// `db` clears it: a server the user asked for by hand runs until `db stop`.
const AUTO_STOP = path.join(DATA_DIR, "cluster-autostop");

export function markAutoStop() {
  fs.writeFileSync(AUTO_STOP, `${process.pid}\n`);
}

export function clearAutoStop() {
  fs.rmSync(AUTO_STOP, { force: true });
}

export function autoStopMarked() {
  return fs.existsSync(AUTO_STOP);
}

/**
 * Pure: stop the cluster on the way out? Never while another bootstrap uses it, and only a
 * server that one of these runs started (never one the user started with `db`, or one that
 * was already running for other reasons).
 */
export function shouldStopCluster({ others, autoStop }) {
  return others === 0 && autoStop;
}
