// Who may connect to the project-local cluster. TCP (127.0.0.1 only) needs the password kept
// in .data/pg-password; the Unix socket sits in a 0700 folder of the server's user, and
// peer authentication maps only that user to the postgres role. Clusters made by older
// bootstraps (trust for everyone on the machine) are upgraded in place.
import { createHash, createHmac, pbkdf2Sync, randomBytes } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { BootstrapError, DATA_DIR, LOG_DIR, say } from "./log.mjs";
import { isRoot, mustRun } from "./proc.mjs";
import { pgEnv } from "./cluster-server.mjs";

export const PASSWORD_FILE = path.join(DATA_DIR, "pg-password");
const IDENT_MAP = "rillmark";

/** Pure: pg_hba.conf of the cluster. */
export function hbaConf() {
  return [
    "# Rillmark's project-local cluster (written by scripts/lib/cluster-auth.mjs).",
    "# Socket: its folder is private to the server's user, who alone maps to postgres.",
    `local all postgres peer map=${IDENT_MAP}`,
    "# TCP: IPv4 loopback only, with the password in .data/pg-password.",
    "host all all 127.0.0.1/32 scram-sha-256",
    "",
  ].join("\n");
}

/** Pure: pg_ident.conf: the operating-system user the server runs as may be postgres. */
export function identConf(serverUser) {
  if (!/^[a-z_][a-z0-9_.-]*\$?$/i.test(serverUser)) {
    throw new BootstrapError(`unexpected user name "${serverUser}" for pg_ident.conf`);
  }
  return [
    "# Rillmark's project-local cluster (written by scripts/lib/cluster-auth.mjs).",
    "# MAPNAME  SYSTEM-USERNAME  PG-USERNAME",
    `${IDENT_MAP} ${serverUser} postgres`,
    "",
  ].join("\n");
}

/** The operating-system user the server runs as: postgres under root (runuser), else us. */
export function serverUser() {
  return isRoot ? "postgres" : os.userInfo().username;
}

/** Pure: the URL children get; the password is URL-encoded (base64url needs none, others may). */
export function localDatabaseUrl({ port, password }, database) {
  const auth = password ? `postgres:${encodeURIComponent(password)}` : "postgres";
  return `postgres://${auth}@127.0.0.1:${port}/${encodeURIComponent(database)}`;
}

export function newPassword() {
  return randomBytes(32).toString("base64url");
}

export function readPassword(file = PASSWORD_FILE) {
  try {
    return fs.readFileSync(file, "utf8").trim() || null;
  } catch {
    return null;
  }
}

/** Replace the password file atomically; 0600 whatever the umask or an older file's mode. */
export function savePassword(password, file = PASSWORD_FILE) {
  const temp = `${file}.${process.pid}.tmp`;
  fs.rmSync(temp, { force: true });
  fs.writeFileSync(temp, `${password}\n`, { mode: 0o600, flag: "wx" });
  fs.chmodSync(temp, 0o600);
  fs.renameSync(temp, file);
}

/**
 * Pure: the SCRAM-SHA-256 verifier PostgreSQL stores (RFC 5802 / RFC 7677), as libpq's
 * PQencryptPasswordConn builds it. Sent instead of the password, so the password itself never
 * reaches the server or its log. ASCII passwords (ours are base64url) need no SASLprep.
 */
export function scramVerifier(password, { salt = randomBytes(16), iterations = 4096 } = {}) {
  const salted = pbkdf2Sync(password, salt, iterations, 32, "sha256");
  const hmac = (key, text) => createHmac("sha256", key).update(text).digest();
  const storedKey = createHash("sha256").update(hmac(salted, "Client Key")).digest();
  const serverKey = hmac(salted, "Server Key");
  const b64 = (buffer) => buffer.toString("base64");
  return `SCRAM-SHA-256$${iterations}:${b64(salt)}$${b64(storedKey)}:${b64(serverKey)}`;
}

/** A password file for initdb --pwfile, readable by the server's user; the caller deletes it. */
export function writeInitPwfile(privateDir, password, ids) {
  const file = path.join(privateDir, `initdb-pwfile-${process.pid}`);
  fs.rmSync(file, { force: true });
  fs.writeFileSync(file, `${password}\n`, { mode: 0o600, flag: "wx" });
  if (ids) fs.chownSync(file, ids.uid, ids.gid);
  return file;
}

function readText(file) {
  try {
    return fs.readFileSync(file, "utf8");
  } catch {
    return null;
  }
}

export function writeAuthFiles(dataDir, ids) {
  for (const [name, text] of [
    ["pg_ident.conf", identConf(serverUser())],
    ["pg_hba.conf", hbaConf()],
  ]) {
    const file = path.join(dataDir, name);
    fs.writeFileSync(file, text, { mode: 0o600 });
    fs.chmodSync(file, 0o600); // mode above applies only to a new file
    if (ids) fs.chownSync(file, ids.uid, ids.gid);
  }
}

/** SQL over the private socket, as the server's own user (peer; trust on an old cluster). */
async function socketPsql(cluster, sql, what) {
  const args = ["-X", "-q", "-At", "-v", "ON_ERROR_STOP=1", "-h", cluster.socketDir];
  args.push("-p", String(cluster.port), "-U", "postgres", "-d", "postgres", "-f", "-");
  const result = await mustRun(what, path.join(cluster.bin, "psql"), args, {
    asPostgres: true,
    input: sql,
    env: { ...pgEnv(), PGCONNECT_TIMEOUT: "10" },
    logFile: path.join(LOG_DIR, "psql.log"),
  });
  return result.out.trim();
}

/** Give the postgres role this password, over the socket (it needs none there). */
export async function setPassword(cluster, password) {
  const errors = await socketPsql(
    cluster,
    `ALTER ROLE postgres PASSWORD '${scramVerifier(password)}';\n` +
      // The server keeps its old rules when it cannot read the file: say so instead.
      "SELECT string_agg(line_number || ': ' || error, '; ') FROM pg_hba_file_rules " +
      "WHERE error IS NOT NULL;\n",
    "setting the database password",
  );
  if (errors) throw new BootstrapError(`pg_hba.conf was refused by the server: ${errors}`);
}

/**
 * Step 1, before the server starts (or before a reload): make the auth files ours. A cluster of
 * an older bootstrap (trust for every local user) is thereby closed before it listens again.
 * Returns what step 2 has left to do.
 */
export function writeAuthIfNeeded(dataDir, ids, passwordFile = PASSWORD_FILE) {
  const saved = readPassword(passwordFile);
  const hba = readText(path.join(dataDir, "pg_hba.conf"));
  const current =
    hba === hbaConf() && readText(path.join(dataDir, "pg_ident.conf")) === identConf(serverUser());
  if (!current) writeAuthFiles(dataDir, ids);
  return {
    saved,
    changed: !current,
    wasTrust: !current && /\btrust\b/.test(hba ?? ""),
    needsPassword: !saved || !current,
  };
}

/**
 * Step 2, with the server running: reload changed files, and set the password over the socket
 * when it is new or the files were not ours. The password file is saved only once the server
 * has it, so an interrupted upgrade is simply done again next time. Returns the password.
 */
export async function finishAuth(cluster, plan, { reload }) {
  if (!plan.needsPassword) return plan.saved;
  if (reload) {
    const pgCtl = path.join(cluster.bin, "pg_ctl");
    await mustRun("pg_ctl reload", pgCtl, ["-D", cluster.dataDir, "reload"], {
      asPostgres: true,
      env: pgEnv(),
    });
  }
  const password = plan.saved ?? newPassword();
  await setPassword(cluster, password);
  if (!plan.saved) savePassword(password);
  if (plan.wasTrust) {
    say("database cluster upgraded: connections now need the password in .data/pg-password");
  } else {
    say(
      `database access rules set; password ${plan.saved ? "kept" : "renewed"} in .data/pg-password`,
    );
  }
  return password;
}
