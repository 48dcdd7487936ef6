// npm test: set-up, then every check in order, stopping at the first failure, then a summary.
//   npm test -- --only lint,unit     run some steps (ids below)
//   npm test -- --skip e2e           leave some out
//   npm test -- --verbose            stream each tool's output (it is always in .data/logs/)
//   npm test -- <vitest filters>     passed on to the vitest runs
import fs from "node:fs";
import path from "node:path";
import { BootstrapError, LOG_DIR, color, progress, rel, say, seconds, tail } from "./log.mjs";
import { binPath } from "./node-deps.mjs";
import { installPackages } from "./apt.mjs";
import { ensureClientBuild } from "./client-build.mjs";
import { isStopping, spawnChild } from "./children.mjs";
import { prepare } from "./setup.mjs";

export const TEST_SESSION_SECRET = "rillmark-test-session-secret-not-for-production-4f9c2a7e1b";
const VITEST_PROJECTS = ["unit", "integration"];
export const STEP_IDS = [
  "bootstrap",
  "typecheck",
  "lint",
  "format",
  ...VITEST_PROJECTS,
  "build",
  "e2e",
];

export function parseTestArgs(args) {
  const options = { only: null, skip: new Set(), verbose: false, vitestArgs: [] };
  const list = (value, flag) => {
    const ids = (value ?? "").split(",").filter(Boolean);
    const unknown = ids.filter((id) => !STEP_IDS.includes(id));
    if (ids.length === 0 || unknown.length > 0) {
      throw new BootstrapError(`${flag} expects step names from: ${STEP_IDS.join(", ")}`);
    }
    return ids;
  };
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i];
    if (arg === "--only") options.only = new Set(list(args[++i], arg));
    else if (arg === "--skip") for (const id of list(args[++i], arg)) options.skip.add(id);
    else if (arg === "--verbose" || arg === "-v") options.verbose = true;
    else options.vitestArgs.push(arg);
  }
  return options;
}

/** Pure: the ordered steps to run for these options. */
export function planSteps(options) {
  const wanted = (id) => (options.only ? options.only.has(id) : true) && !options.skip.has(id);
  const extra = options.vitestArgs.length > 0 ? [...options.vitestArgs, "--passWithNoTests"] : [];
  const projects = VITEST_PROJECTS.filter(wanted);
  const steps = [
    {
      id: "bootstrap",
      label: "bootstrap self-test (node --test)",
      tool: "node",
      args: ["--test", "scripts/lib/bootstrap.test.mjs"],
    },
    { id: "typecheck", label: "typecheck (tsc)", tool: "tsc", args: ["--noEmit", "-p", "."] },
    { id: "lint", label: "lint (eslint)", tool: "eslint", args: [".", "--max-warnings", "0"] },
    { id: "format", label: "format (prettier)", tool: "prettier", args: ["--check", "."] },
  ].filter((step) => wanted(step.id));
  if (projects.length > 0) {
    const args = ["run", ...projects.flatMap((name) => ["--project", name]), ...extra];
    steps.push({
      id: projects.join("+"),
      label: `${projects.join(" + ")} tests (vitest)`,
      tool: "vitest",
      args,
    });
  }
  if (wanted("build")) steps.push({ id: "build", label: "client build (vite)", build: true });
  if (wanted("e2e")) {
    const args = ["run", "--project", "e2e", ...extra];
    steps.push({ id: "e2e", label: "end-to-end tests (vitest + Chromium)", tool: "vitest", args });
  }
  return steps;
}

async function ensureChromium() {
  const wanted = process.env.CHROMIUM_PATH || "/usr/bin/chromium";
  if (!fs.existsSync(wanted)) {
    if (process.env.CHROMIUM_PATH)
      throw new BootstrapError(`CHROMIUM_PATH=${wanted} does not exist`);
    await installPackages(["chromium"], { why: "Chromium (for the end-to-end tests)" });
  }
  say(`Chromium ${wanted}`);
  return wanted;
}

async function runTool(step, env, verbose) {
  const logFile = path.join(LOG_DIR, `test-${step.id}.log`);
  fs.writeFileSync(logFile, `# ${step.label} — ${new Date().toISOString()}\n`);
  const cmd = step.tool === "node" ? process.execPath : binPath(step.tool);
  const { done } = spawnChild(cmd, step.args, { env, logFile, echo: verbose });
  const { code, signal } = await done;
  return { ok: code === 0, logFile, exit: signal ?? code };
}

function printSummary(rows, totalMs) {
  const width = Math.max(...rows.map((row) => row.label.length), 5) + 2;
  const words = { ok: "ok", failed: "FAILED", skipped: "not run" };
  const paint = { ok: color.green, failed: color.red, skipped: color.dim };
  const lines = [color.bold("\nrillmark test summary")];
  lines.push(color.dim(`  ${"step".padEnd(width)}${"result".padEnd(9)}time`));
  for (const row of rows) {
    const result = paint[row.result](words[row.result].padEnd(9));
    lines.push(
      `  ${row.label.padEnd(width)}${result}${row.ms === undefined ? "" : seconds(row.ms)}`,
    );
  }
  lines.push(`  ${"total".padEnd(width)}${" ".repeat(9)}${seconds(totalMs)}`);
  process.stdout.write(`${lines.join("\n")}\n`);
}

export async function test(args) {
  const started = Date.now();
  const options = parseTestArgs(args);
  const steps = planSteps(options);
  const rows = [];
  const timed = async (label, fn) => {
    const t = Date.now();
    const value = await fn();
    rows.push({ label, result: "ok", ms: Date.now() - t });
    return value;
  };
  const needDb = steps.some((step) => step.id.includes("integration") || step.id === "e2e");
  const { databaseUrl, release } = await timed("set-up (Node, dependencies, database)", () =>
    prepare({ command: "test", database: "rillmark_test", fresh: true, needDb }),
  );
  const chromium = steps.some((step) => step.id === "e2e")
    ? await timed("Chromium", ensureChromium)
    : process.env.CHROMIUM_PATH || "/usr/bin/chromium";
  const env = {
    ...process.env,
    ...(databaseUrl ? { DATABASE_URL: databaseUrl } : {}),
    NODE_ENV: "test",
    CHROMIUM_PATH: chromium,
    SESSION_SECRET: TEST_SESSION_SECRET,
  };

  let failure = null;
  for (const step of steps) {
    if (failure) {
      rows.push({ label: step.label, result: "skipped" });
      continue;
    }
    const t = Date.now();
    // The build step prints its own lines; streamed tool output would break an in-place line.
    const done = progress(step.label, { inline: !step.build && !options.verbose });
    let outcome;
    if (step.build) {
      outcome = await ensureClientBuild(env).then(
        () => ({ ok: true }),
        (error) => ({ ok: false, error, logFile: error.logFile }),
      );
    } else {
      outcome = await runTool(step, env, options.verbose);
    }
    // Interrupted: the signal handler stops the rest and exits; no verdict to print.
    if (isStopping()) return new Promise(() => {});
    done(outcome.ok);
    rows.push({ label: step.label, result: outcome.ok ? "ok" : "failed", ms: Date.now() - t });
    if (!outcome.ok) failure = { step, ...outcome };
  }

  await timed("database shut-down (if started here)", release);
  if (failure?.logFile && !options.verbose) {
    process.stderr.write(
      `\n${color.dim(`── last lines of ${rel(failure.logFile)} ──`)}\n${tail(failure.logFile, 80)}\n`,
    );
  }
  printSummary(rows, Date.now() - started);
  if (!failure) {
    say(color.green("all checks passed"));
    return 0;
  }
  const reason = failure.error?.message ?? `exit ${failure.exit}`;
  process.stderr.write(`${color.red("rillmark ✖")} ${failure.step.label} failed (${reason})`);
  process.stderr.write(`${failure.logFile ? `; full log: ${rel(failure.logFile)}` : ""}\n`);
  return 1;
}
