// Short-lived commands (psql, pg_ctl, npm ci, apt-get): output goes to a log file and is kept
// in memory for the caller; the terminal stays quiet.
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { BOOTSTRAP_LOG, BootstrapError, appendLog, tail } from "./log.mjs";

export const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

/** The executable on PATH, or null. */
export function which(name) {
  for (const dir of (process.env.PATH ?? "").split(path.delimiter)) {
    if (!dir) continue;
    const file = path.join(dir, name);
    try {
      fs.accessSync(file, fs.constants.X_OK);
      if (fs.statSync(file).isFile()) return file;
    } catch {
      // not in this folder
    }
  }
  return null;
}

/**
 * PostgreSQL refuses to run as root, so as root its programs go through
 * `runuser -u postgres --`. Their working folder is "/" because the project folder may be
 * closed to that user.
 */
export function postgresCommand(cmd, args) {
  if (!isRoot) return { cmd, args, cwd: undefined };
  return { cmd: "runuser", args: ["-u", "postgres", "--", cmd, ...args], cwd: "/" };
}

/**
 * Run a command to completion. Options: env, cwd, logFile (appended), input (stdin text),
 * asPostgres. Resolves { code, signal, out, err }.
 */
export function run(cmd, args, options = {}) {
  const logFile = options.logFile ?? BOOTSTRAP_LOG;
  const spec = options.asPostgres ? postgresCommand(cmd, args) : { cmd, args, cwd: options.cwd };
  appendLog(logFile, `\n$ ${[spec.cmd, ...spec.args].join(" ")}`);
  return new Promise((resolve) => {
    let out = "";
    let err = "";
    const child = spawn(spec.cmd, spec.args, {
      cwd: spec.cwd,
      env: options.env ?? process.env,
      stdio: [options.input === undefined ? "ignore" : "pipe", "pipe", "pipe"],
    });
    child.stdout.on("data", (chunk) => {
      out += chunk;
      appendLog(logFile, String(chunk));
    });
    child.stderr.on("data", (chunk) => {
      err += chunk;
      appendLog(logFile, String(chunk));
    });
    if (options.input !== undefined) {
      child.stdin.on("error", () => {}); // the program may exit before reading it all
      child.stdin.end(options.input);
    }
    child.on("error", (error) => {
      appendLog(logFile, `spawn failed: ${error.message}`);
      resolve({ code: 127, signal: null, out, err: `${err}${error.message}` });
    });
    child.on("close", (code, signal) => {
      appendLog(logFile, `(exit ${code ?? signal})`);
      resolve({ code: code ?? 128, signal, out, err });
    });
  });
}

/** Like run(), but a non-zero exit becomes a BootstrapError that shows the log's last lines. */
export async function mustRun(what, cmd, args, options = {}) {
  const result = await run(cmd, args, options);
  if (result.code !== 0) {
    const logFile = options.logFile ?? BOOTSTRAP_LOG;
    throw new BootstrapError(`${what} failed (exit ${result.code})`, {
      logFile,
      details: tail(logFile, 25),
      hint: options.hint,
    });
  }
  return result;
}

/** Synchronous variant for quick checks that must not touch the log (e.g. `test -x`). */
export function runQuiet(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { stdio: "ignore", timeout: 10_000, ...options });
  return result.status === 0;
}

export const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));
