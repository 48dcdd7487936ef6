// Output of the bootstrap: one short line per step on the terminal, everything else in
// .data/logs/. Node built-ins only: this runs before node_modules exists.
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");
export const DATA_DIR = path.join(ROOT, ".data");
export const LOG_DIR = path.join(DATA_DIR, "logs");
export const BOOTSTRAP_LOG = path.join(LOG_DIR, "bootstrap.log");

const useColor = Boolean(process.stdout.isTTY) && !process.env.NO_COLOR;
const paint = (code) => (text) => (useColor ? `\x1b[${code}m${text}\x1b[0m` : text);
export const color = {
  dim: paint("2"),
  bold: paint("1"),
  red: paint("31"),
  green: paint("32"),
  yellow: paint("33"),
  cyan: paint("36"),
};

/** A failure the user can act on: a message, an optional hint and the log to read. */
export class BootstrapError extends Error {
  constructor(message, { hint, logFile, exitCode = 1, details } = {}) {
    super(message);
    this.hint = hint;
    this.logFile = logFile;
    this.exitCode = exitCode;
    this.details = details;
  }
}

export function ensureDataDirs() {
  // 0755 so that the postgres user can traverse .data to reach its cluster (see cluster-location).
  fs.mkdirSync(LOG_DIR, { recursive: true });
  fs.chmodSync(DATA_DIR, 0o755);
}

/** Path shown relative to the project when it is inside it. */
export function rel(file) {
  const r = path.relative(ROOT, file);
  return r && !r.startsWith("..") ? r : file;
}

export function appendLog(file, text) {
  try {
    fs.appendFileSync(file, text.endsWith("\n") ? text : `${text}\n`);
  } catch {
    // Logging must never be the reason a start fails (e.g. .data not yet created).
  }
}

export function log(text) {
  appendLog(BOOTSTRAP_LOG, `${new Date().toISOString()} ${text}`);
}

export function say(text) {
  process.stdout.write(`${color.cyan("rillmark")} ${text}\n`);
  log(text);
}

/**
 * A step that takes a while: "label …" now, "✓ label (12 s)" when done. On a terminal the
 * second line replaces the first, unless other output (inline) may have come in between.
 */
export function progress(label, { inline = true } = {}) {
  const started = Date.now();
  const rewrite = inline && Boolean(process.stdout.isTTY);
  process.stdout.write(`${color.cyan("rillmark")} ${label} …${rewrite ? "" : "\n"}`);
  log(`${label} …`);
  return (ok) => {
    const mark = ok ? color.green("✓") : color.red("✗");
    const text = `${label} ${ok ? "" : "FAILED "}(${seconds(Date.now() - started)})`;
    process.stdout.write(
      `${rewrite ? "\r\x1b[2K" : ""}${color.cyan("rillmark")} ${mark} ${text}\n`,
    );
    log(text);
  };
}

export function warn(text) {
  process.stdout.write(`${color.yellow("rillmark")} ${color.yellow("!")} ${text}\n`);
  log(`warning: ${text}`);
}

export function seconds(ms) {
  return ms < 10_000 ? `${(ms / 1000).toFixed(1)} s` : `${Math.round(ms / 1000)} s`;
}

/** The last `count` lines of a log file, for showing what went wrong. */
export function tail(file, count = 40) {
  try {
    const lines = fs.readFileSync(file, "utf8").trimEnd().split("\n");
    return lines.slice(-count).join("\n");
  } catch {
    return "";
  }
}

export function printError(error) {
  const out = process.stderr;
  if (error instanceof BootstrapError) {
    if (error.details) out.write(`${error.details.trimEnd()}\n`);
    out.write(`${color.red("rillmark ✖")} ${error.message}\n`);
    if (error.hint) out.write(`  ${error.hint.split("\n").join("\n  ")}\n`);
    if (error.logFile) out.write(`  full log: ${rel(error.logFile)}\n`);
    log(`error: ${error.message}${error.hint ? ` (${error.hint})` : ""}`);
  } else {
    out.write(`${color.red("rillmark ✖")} unexpected failure in the bootstrap:\n`);
    out.write(`${error?.stack ?? String(error)}\n`);
    log(`unexpected: ${error?.stack ?? String(error)}`);
  }
}
