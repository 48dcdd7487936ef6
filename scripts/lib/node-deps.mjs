// Node version check and `npm ci` only when node_modules does not match package-lock.json.
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { BootstrapError, LOG_DIR, ROOT, say, seconds, tail, warn } from "./log.mjs";
import { run } from "./proc.mjs";

export const NODE_RANGE = { min: [20, 11], belowMajor: 23 };

/** Pure: is this Node version inside the supported range? */
export function checkNodeVersion(version) {
  const [major = 0, minor = 0] = version.replace(/^v/, "").split(".").map(Number);
  const [minMajor, minMinor] = NODE_RANGE.min;
  const tooOld = major < minMajor || (major === minMajor && minor < minMinor);
  const tooNew = major >= NODE_RANGE.belowMajor;
  if (!tooOld && !tooNew) return { ok: true };
  return {
    ok: false,
    message:
      `Rillmark needs Node.js >= ${minMajor}.${minMinor} and < ${NODE_RANGE.belowMajor}; ` +
      `this is Node ${version}.`,
    hint: tooOld
      ? "Install Node 20 LTS (e.g. Debian's nodejs from NodeSource, or nvm install 20)."
      : "Tools in the lock file (vitest 4) are pinned to Node 20-22: switch with nvm use 20.",
  };
}

export function assertNodeVersion() {
  const result = checkNodeVersion(process.versions.node);
  if (!result.ok) throw new BootstrapError(result.message, { hint: result.hint });
  say(`Node ${process.versions.node}`);
}

const STAMP = ".rillmark-lock.sha256";
// npm writes package-lock.json a few milliseconds before node_modules/.package-lock.json.
const MTIME_SLACK_MS = 1000;

function sha256(file) {
  return createHash("sha256").update(fs.readFileSync(file)).digest("hex");
}

function mtime(file) {
  try {
    return fs.statSync(file).mtimeMs;
  } catch {
    return null;
  }
}

/**
 * Pure decision from what is on disk: { install: boolean, reason }.
 * A hash stamp in node_modules says "this lock was installed"; without a matching stamp the
 * mtimes decide (npm itself writes node_modules/.package-lock.json after the lock file).
 */
export function depsDecision({ hasNodeModules, lockHash, stampHash, lockMtime, hiddenMtime }) {
  if (!hasNodeModules) return { install: true, reason: "node_modules is missing" };
  if (lockHash === null) return { install: false, reason: "no package-lock.json" };
  if (stampHash === lockHash) return { install: false, reason: "stamp matches the lock" };
  if (hiddenMtime === null) return { install: true, reason: "node_modules was not made by npm" };
  if (lockMtime > hiddenMtime + MTIME_SLACK_MS) {
    return { install: true, reason: "package-lock.json is newer than node_modules" };
  }
  return { install: false, reason: "node_modules is newer than the lock" };
}

function readState(root) {
  const lock = path.join(root, "package-lock.json");
  const modules = path.join(root, "node_modules");
  const lockHash = fs.existsSync(lock) ? sha256(lock) : null;
  let stampHash = null;
  try {
    stampHash = fs.readFileSync(path.join(modules, STAMP), "utf8").trim();
  } catch {
    // no stamp yet
  }
  return {
    hasNodeModules: fs.existsSync(modules),
    lockHash,
    stampHash,
    lockMtime: mtime(lock),
    hiddenMtime: mtime(path.join(modules, ".package-lock.json")),
  };
}

function writeStamp(root) {
  const lock = path.join(root, "package-lock.json");
  if (!fs.existsSync(lock) || !fs.existsSync(path.join(root, "node_modules"))) return;
  fs.writeFileSync(path.join(root, "node_modules", STAMP), `${sha256(lock)}\n`);
}

export async function ensureDependencies(root = ROOT) {
  const decision = depsDecision(readState(root));
  if (!decision.install) {
    writeStamp(root);
    say("dependencies up to date");
    return;
  }
  const logFile = path.join(LOG_DIR, "npm-ci.log");
  fs.writeFileSync(logFile, `# ${new Date().toISOString()} ${decision.reason}\n`);
  say(`installing dependencies with npm ci (${decision.reason}) …`);
  const started = Date.now();
  const env = { ...process.env, npm_config_fund: "false", npm_config_audit: "false" };
  let result = await run("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, env, logFile });
  if (result.code !== 0 && /napi-windows-process-start-time/.test(result.out + result.err)) {
    // Known npm quirk with vite 8's optional dependency: re-adding vite settles it.
    warn(
      "npm ci tripped over napi-windows-process-start-time; re-adding vite@8.3.8 as npm advises",
    );
    result = await run("npm", ["i", "-D", "-E", "vite@8.3.8", "--no-audit", "--no-fund"], {
      cwd: root,
      env,
      logFile,
    });
  }
  if (result.code !== 0) {
    throw new BootstrapError(`npm ci failed (exit ${result.code})`, {
      logFile,
      details: tail(logFile, 30),
      hint: "Check network access to the npm registry, then run npm start again.",
    });
  }
  writeStamp(root);
  say(`dependencies installed in ${seconds(Date.now() - started)}`);
}

/** A tool from node_modules/.bin, with a message that says how to get it when missing. */
export function binPath(name, root = ROOT) {
  const file = path.join(root, "node_modules", ".bin", name);
  if (!fs.existsSync(file)) {
    throw new BootstrapError(`${name} is not installed in node_modules`, {
      hint: "Remove node_modules and run npm start again to reinstall from package-lock.json.",
    });
  }
  return file;
}
