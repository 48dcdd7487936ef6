// The client bundle (dist/client) is rebuilt only when one of its inputs changed.
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { BootstrapError, DATA_DIR, LOG_DIR, ROOT, say, seconds, tail } from "./log.mjs";
import { binPath } from "./node-deps.mjs";
import { spawnChild } from "./children.mjs";

const INPUT_DIRS = ["src", "shared", "public"];
const INPUT_FILES = [
  "index.html",
  "vite.config.ts",
  "tailwind.config.ts",
  "tsconfig.json",
  "package-lock.json",
  ".env",
  ".env.local",
  ".env.production",
  ".env.production.local",
];
// Tests are not part of the bundle; editing one must not cost a rebuild.
const NOT_INPUT = /\.test\.[cm]?[jt]sx?$/;
const STAMP = path.join(DATA_DIR, "client-build.hash");
export const CLIENT_DIR = path.join(ROOT, "dist", "client");

function listFiles(dir, found) {
  let entries;
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return;
  }
  for (const entry of entries) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) listFiles(full, found);
    else if (entry.isFile() && !NOT_INPUT.test(entry.name)) found.push(full);
  }
}

/** Hash of every input's path and content, plus the VITE_* variables baked into the bundle. */
export function clientInputsHash(root = ROOT, env = process.env) {
  const files = [];
  for (const dir of INPUT_DIRS) listFiles(path.join(root, dir), files);
  for (const file of INPUT_FILES)
    if (fs.existsSync(path.join(root, file))) files.push(path.join(root, file));
  files.sort();
  const hash = createHash("sha256");
  for (const file of files) {
    hash.update(`${path.relative(root, file)}\0`);
    hash.update(fs.readFileSync(file));
    hash.update("\0");
  }
  const viteEnv = Object.keys(env)
    .filter((key) => key.startsWith("VITE_"))
    .sort()
    .map((key) => `${key}=${env[key]}`);
  hash.update(viteEnv.join("\n"));
  return hash.digest("hex");
}

export function clientBuildCurrent(hash) {
  try {
    return (
      fs.existsSync(path.join(CLIENT_DIR, "index.html")) &&
      fs.readFileSync(STAMP, "utf8").trim() === hash
    );
  } catch {
    return false;
  }
}

/** Build with `vite build` unless the stamp matches; { built, ms }. */
export async function ensureClientBuild(env = process.env) {
  const started = Date.now();
  const hash = clientInputsHash(ROOT, env);
  if (clientBuildCurrent(hash)) {
    say(`client build up to date (${seconds(Date.now() - started)})`);
    return { built: false };
  }
  const logFile = path.join(LOG_DIR, "client-build.log");
  fs.writeFileSync(logFile, `# vite build ${new Date().toISOString()}\n`);
  say("building the client (vite build) …");
  fs.rmSync(STAMP, { force: true });
  // NODE_ENV=test (npm test) would make Vite bundle React's development build.
  const buildEnv = { ...env };
  delete buildEnv.NODE_ENV;
  const { done } = spawnChild(binPath("vite"), ["build"], { env: buildEnv, logFile });
  const { code } = await done;
  if (code !== 0 || !fs.existsSync(path.join(CLIENT_DIR, "index.html"))) {
    throw new BootstrapError(`vite build failed (exit ${code})`, {
      logFile,
      details: tail(logFile, 30),
    });
  }
  fs.writeFileSync(STAMP, `${hash}\n`);
  say(`client built in ${seconds(Date.now() - started)}`);
  return { built: true };
}
