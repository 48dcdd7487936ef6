// Long-running children (the server, Vite, test runners) and the way out: one signal handler
// stops them, then the clean-up steps (lease, database server) run, then the bootstrap exits.
import { spawn } from "node:child_process";
import os from "node:os";
import { ROOT, appendLog, color, say, warn } from "./log.mjs";

const live = new Set();
const cleanups = [];
let stopping = false;
let signalExit = (signal) => (signal === "SIGINT" ? 130 : 143);

/** True once a signal (or the normal end) has begun the shutdown. */
export function isStopping() {
  return stopping;
}

/** Register a clean-up step; they run last-registered first. */
export function onCleanup(fn) {
  cleanups.push(fn);
}

/** start and dev end with 0 on Ctrl-C (a normal way to stop them); test and bench do not. */
export function exitZeroOnSignal() {
  signalExit = () => 0;
}

function prefixer(prefix, target) {
  let pending = "";
  return {
    write(chunk) {
      const lines = (pending + chunk).split("\n");
      pending = lines.pop() ?? "";
      for (const line of lines) target.write(`${prefix} ${line}\n`);
    },
    flush() {
      if (pending) target.write(`${prefix} ${pending}\n`);
      pending = "";
    },
  };
}

/**
 * Start a child in its own process group, so a Ctrl-C reaches it once (through us) and the
 * whole group (e.g. tsx watch and its node, vitest and Chromium) can be stopped together.
 * Output: inherited (default), prefixed lines ({ prefix }) or a log file ({ logFile, echo }).
 * Returns { child, done } where done resolves { code, signal }.
 */
export function spawnChild(cmd, args, { env = process.env, prefix, logFile, echo = false } = {}) {
  const piped = Boolean(prefix || logFile);
  const child = spawn(cmd, args, {
    cwd: ROOT,
    env,
    detached: true,
    stdio: ["ignore", piped ? "pipe" : "inherit", piped ? "pipe" : "inherit"],
  });
  live.add(child);
  if (piped) {
    const outs = prefix
      ? [prefixer(prefix, process.stdout), prefixer(prefix, process.stderr)]
      : [process.stdout, process.stderr];
    for (const [index, stream] of [child.stdout, child.stderr].entries()) {
      stream.on("data", (chunk) => {
        if (logFile) appendLog(logFile, String(chunk));
        if (prefix || echo) outs[index].write(String(chunk));
      });
      stream.on("end", () => outs[index].flush?.());
    }
  }
  const done = new Promise((resolve) => {
    child.on("error", (error) => {
      live.delete(child);
      if (logFile) appendLog(logFile, `could not start ${cmd}: ${error.message}`);
      resolve({ code: 127, signal: null, error });
    });
    child.on("close", (code, signal) => {
      live.delete(child);
      // Killed by a signal: the shell's convention, 128 + its number.
      resolve({ code: code ?? 128 + (os.constants.signals[signal] ?? 0), signal });
    });
  });
  return { child, done };
}

function signalGroup(child, signal) {
  try {
    process.kill(-child.pid, signal);
  } catch {
    // already gone
  }
}

/** Stop every live child: the signal first, SIGKILL for whatever is left after graceMs. */
export async function stopChildren(signal = "SIGTERM", graceMs = 10_000) {
  const children = [...live];
  if (children.length === 0) return;
  const exited = children.map(
    (child) =>
      new Promise((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) resolve();
        else child.once("close", resolve);
      }),
  );
  for (const child of children) signalGroup(child, signal);
  const timer = setTimeout(() => {
    warn(`children still running after ${graceMs / 1000} s; killing them`);
    for (const child of children) signalGroup(child, "SIGKILL");
  }, graceMs);
  await Promise.all(exited);
  clearTimeout(timer);
}

/** Run the registered clean-up steps now (once: each runs a single time). */
export async function runCleanups() {
  while (cleanups.length > 0) {
    const step = cleanups.pop();
    try {
      await step();
    } catch (error) {
      warn(`clean-up step failed: ${error.message}`);
    }
  }
}

/** Normal end of a command: children, clean-ups, exit. A shutdown by signal takes precedence. */
export async function finish(code) {
  if (stopping) return new Promise(() => {});
  stopping = true;
  await stopChildren();
  await runCleanups();
  process.exit(code);
}

export function installSignalHandlers() {
  for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"]) {
    process.on(signal, () => {
      // Repeats are expected: the terminal and npm may both deliver the same Ctrl-C.
      if (stopping) return;
      stopping = true;
      process.stdout.write("\n");
      say(color.dim(`stopping (${signal}) …`));
      void (async () => {
        await stopChildren(signal === "SIGHUP" ? "SIGTERM" : signal);
        await runCleanups();
        process.exit(signalExit(signal));
      })();
    });
  }
  // Last resort (an unexpected exception): never leave a child group behind.
  process.on("exit", () => {
    for (const child of live) signalGroup(child, "SIGTERM");
  });
}
