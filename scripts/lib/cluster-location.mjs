// Where the project-local PostgreSQL cluster lives, and whether its server is really running.
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { isRoot, runQuiet } from "./proc.mjs";

// sockaddr_un.sun_path is 108 bytes including the final NUL.
const SOCKET_PATH_MAX = 107;

export function projectHash(projectRoot) {
  return createHash("sha256").update(path.resolve(projectRoot)).digest("hex").slice(0, 12);
}

/**
 * Pure: choose the cluster folder. `postgresCanReach(dir)` tells whether the user the server
 * runs as can traverse every parent of dir (a project under /root is closed to `postgres`).
 * Returns { base, fallback, reason }.
 */
export function chooseClusterBase({ projectRoot, tmpDir, postgresCanReach }) {
  const dataDir = path.join(projectRoot, ".data");
  if (postgresCanReach(dataDir)) {
    return { base: path.join(dataDir, "pg"), fallback: false, reason: null };
  }
  return {
    base: path.join(tmpDir, `rillmark-pg-${projectHash(projectRoot)}`),
    fallback: true,
    reason: `the postgres user cannot reach ${dataDir}`,
  };
}

/** Pure: a 0700 socket folder whose socket path fits the kernel's limit. */
export function chooseSocketDir({ base, port, tmpDir, hash }) {
  const preferred = path.join(base, "run");
  const longest = path.join(preferred, `.s.PGSQL.${port}.lock`);
  if (Buffer.byteLength(longest) <= SOCKET_PATH_MAX) return preferred;
  return path.join(tmpDir, `rillmark-${hash}-run`);
}

/** The real check, run as the user that will own the server. */
export function postgresCanReach(dir) {
  if (!isRoot) return true; // the server runs as the project's own user
  return runQuiet("runuser", ["-u", "postgres", "--", "test", "-x", dir]);
}

export function defaultLocation(projectRoot) {
  return chooseClusterBase({ projectRoot, tmpDir: os.tmpdir(), postgresCanReach });
}

/**
 * A fallback folder in the shared temp dir must be ours: a real folder (no symlink) owned by
 * us or postgres and writable by nobody else. Returns an error message or null.
 */
export function unsafeFallbackReason(base, postgresUid) {
  let stat;
  try {
    stat = fs.lstatSync(base);
  } catch {
    return null; // does not exist yet: we create it
  }
  if (!stat.isDirectory()) return `${base} exists and is not a plain folder`;
  const owners = [process.getuid?.(), postgresUid, 0].filter((uid) => uid !== undefined);
  if (!owners.includes(stat.uid)) return `${base} belongs to another user (uid ${stat.uid})`;
  if (stat.mode & 0o022) return `${base} is writable by other users`;
  return null;
}

/** Pure: the state letter of /proc/<pid>/stat ("R", "S", "Z" zombie, "X" dead, …). */
export function procState(statText) {
  // The command name is in parentheses and may itself contain spaces or ")".
  const close = statText.lastIndexOf(")");
  if (close < 0) return null;
  return statText.slice(close + 2, close + 3) || null;
}

/** "none" (no such process), "zombie" (exited, not yet reaped) or "alive". */
export function pidState(pid) {
  let text;
  try {
    text = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
  } catch {
    return "none";
  }
  const state = procState(text);
  return state === "Z" || state === "X" || state === "x" ? "zombie" : "alive";
}

/** Pure: parse postmaster.pid (pid, data dir, start time, port, socket dir, listen, shm, status). */
export function parsePostmasterPid(text) {
  const lines = text.split("\n");
  const pid = Number.parseInt(lines[0] ?? "", 10);
  if (!Number.isInteger(pid) || pid <= 0) return null;
  return {
    pid,
    dataDir: lines[1] ?? "",
    port: Number.parseInt(lines[3] ?? "", 10) || null,
    socketDir: lines[4] ?? "",
    status: (lines[7] ?? "").trim() || null,
  };
}

/**
 * Is the pid in postmaster.pid our server? A crashed server leaves the file behind, its pid
 * may linger as a zombie for a while, and after a reboot the number may belong to anything.
 */
export function postmasterRunning(dataDir, pid) {
  if (pidState(pid) !== "alive") return false;
  try {
    const comm = fs.readFileSync(`/proc/${pid}/comm`, "utf8").trim();
    if (comm !== "postgres" && comm !== "postmaster") return false;
  } catch {
    return false;
  }
  try {
    // The postmaster runs with its data folder as working folder.
    return fs.realpathSync(`/proc/${pid}/cwd`) === fs.realpathSync(dataDir);
  } catch {
    return true; // cwd unreadable (another user, no root): the name check has to do
  }
}
