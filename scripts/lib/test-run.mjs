// npm test: set-up, then every check in order, stopping at the first failure, then a summary.
//   npm test -- --only lint,unit     run some steps (ids below)
//   npm test -- --skip e2e           leave some out
//   npm test -- --verbose            stream each tool's output (it is always in .data/logs/)
//   npm test -- <vitest filters>     passed on to the vitest runs
// The last line is plain, for CI: "rillmark: 612 passed, 0 failed" (every test runner summed).
import fs from "node:fs";
import path from "node:path";
import {
  BootstrapError,
  LOG_DIR,
  color,
  printError,
  progress,
  rel,
  say,
  seconds,
  tail,
  warn,
} from "./log.mjs";
import { binPath } from "./node-deps.mjs";
import { installPackages } from "./apt.mjs";
import { ensureGrass } from "./grass.mjs";
import { ensureClientBuild } from "./client-build.mjs";
import { isStopping, runCleanups, spawnChild } from "./children.mjs";
import { prepare } from "./setup.mjs";
import {
  addTallies,
  clearStepReport,
  closingLine,
  countsText,
  readStepCounts,
  reportFile,
  stepTally,
} from "./test-counts.mjs";

export const TEST_SESSION_SECRET = "rillmark-test-session-secret-not-for-production-4f9c2a7e1b";
const VITEST_PROJECTS = ["unit", "integration"];
export const SELF_TEST_FILES = [
  "scripts/lib/bootstrap.test.mjs",
  "scripts/lib/cluster-auth.test.mjs",
  "scripts/lib/test-counts.test.mjs",
];
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

/** Pure: vitest's own output stays in the log; a JSON report beside it gives the counts. */
function vitestStep(id, label, args) {
  const file = reportFile(id, "json");
  const reporters = ["--reporter=default", "--reporter=json", `--outputFile.json=${file}`];
  return {
    id,
    label,
    tool: "vitest",
    args: [...args, ...reporters],
    report: { kind: "vitest", file },
  };
}

/** Pure: the self-test, readable (spec) in the log and as TAP in a file for the counts. */
function selfTestStep() {
  const file = reportFile("bootstrap", "tap");
  return {
    id: "bootstrap",
    label: "bootstrap self-test (node --test)",
    tool: "node",
    args: [
      ...["--test", "--test-reporter=spec", "--test-reporter-destination=stdout"],
      ...["--test-reporter=tap", `--test-reporter-destination=${file}`],
      ...SELF_TEST_FILES,
    ],
    report: { kind: "node", file },
  };
}

/** Pure: the ordered steps to run for these options. */
export function planSteps(options) {
  const wanted = (id) => (options.only ? options.only.has(id) : true) && !options.skip.has(id);
  const extra = options.vitestArgs.length > 0 ? [...options.vitestArgs, "--passWithNoTests"] : [];
  const projects = VITEST_PROJECTS.filter(wanted);
  const steps = [
    selfTestStep(),
    { id: "typecheck", label: "typecheck (tsc)", tool: "tsc", args: ["--noEmit", "-p", "."] },
    { id: "lint", label: "lint (eslint)", tool: "eslint", args: [".", "--max-warnings", "0"] },
    { id: "format", label: "format (prettier)", tool: "prettier", args: ["--check", "."] },
  ].filter((step) => wanted(step.id));
  if (projects.length > 0) {
    const args = ["run", ...projects.flatMap((name) => ["--project", name]), ...extra];
    steps.push(vitestStep(projects.join("+"), `${projects.join(" + ")} tests (vitest)`, args));
  }
  if (wanted("build")) steps.push({ id: "build", label: "client build (vite)", build: true });
  if (wanted("e2e")) {
    const args = ["run", "--project", "e2e", ...extra];
    steps.push(vitestStep("e2e", "end-to-end tests (vitest + Chromium)", args));
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
  clearStepReport(step);
  const { done } = spawnChild(cmd, step.args, { env, logFile, echo: verbose });
  const { code, signal } = await done;
  const counts = readStepCounts(step);
  // Never a silent zero in the closing line: say when a passing runner left no report.
  if (step.report && !counts && code === 0)
    warn(`${step.label}: no test report in ${step.report.file}`);
  return { ok: code === 0, logFile, exit: signal ?? code, counts };
}

function printSummary(rows, totalMs) {
  const width = Math.max(...rows.map((row) => row.label.length), 5) + 2;
  const words = { ok: "ok", failed: "FAILED", skipped: "not run" };
  const paint = { ok: color.green, failed: color.red, skipped: color.dim };
  const lines = [color.bold("\nrillmark test summary")];
  lines.push(color.dim(`  ${"step".padEnd(width)}${"result".padEnd(9)}time`));
  for (const row of rows) {
    const result = paint[row.result](words[row.result].padEnd(9));
    const time = row.ms === undefined ? "" : seconds(row.ms).padEnd(8);
    const counts = row.counts ? color.dim(countsText(row.counts)) : "";
    lines.push(`  ${row.label.padEnd(width)}${result}${time}${counts}`.trimEnd());
  }
  lines.push(`  ${"total".padEnd(width)}${" ".repeat(9)}${seconds(totalMs)}`);
  process.stdout.write(`${lines.join("\n")}\n`);
}

export async function test(args) {
  const started = Date.now();
  const options = parseTestArgs(args);
  const steps = planSteps(options);
  const rows = [];
  const tallies = [];
  const timed = async (label, fn) => {
    const t = Date.now();
    try {
      const value = await fn();
      rows.push({ label, result: "ok", ms: Date.now() - t });
      return value;
    } catch (error) {
      rows.push({ label, result: "failed", ms: Date.now() - t });
      throw error;
    }
  };
  const needDb = steps.some((step) => step.id.includes("integration") || step.id === "e2e");
  let setup;
  try {
    setup = await timed("set-up (Node, dependencies, database)", () =>
      prepare({ command: "test", database: "rillmark_test", fresh: true, needDb }),
    );
    setup.chromium = steps.some((step) => step.id === "e2e")
      ? await timed("Chromium", ensureChromium)
      : process.env.CHROMIUM_PATH || "/usr/bin/chromium";
    if (steps.some((step) => step.id.includes("unit"))) await timed("GRASS GIS", ensureGrass);
  } catch (error) {
    // CI still gets its closing line, last: the clean-up steps registered so far run first.
    if (isStopping()) return new Promise(() => {});
    printError(error);
    await runCleanups();
    for (const step of steps) rows.push({ label: step.label, result: "skipped" });
    printSummary(rows, Date.now() - started);
    process.stdout.write(`${closingLine(addTallies([stepTally(null, false)]))}\n`);
    return error?.exitCode ?? 1;
  }
  const env = {
    ...process.env,
    ...(setup.databaseUrl ? { DATABASE_URL: setup.databaseUrl } : {}),
    NODE_ENV: "test",
    CHROMIUM_PATH: setup.chromium,
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
    const counts = outcome.counts ?? null;
    rows.push({
      label: step.label,
      result: outcome.ok ? "ok" : "failed",
      ms: Date.now() - t,
      counts,
    });
    tallies.push(stepTally(counts, outcome.ok));
    if (!outcome.ok) failure = { step, ...outcome };
  }

  await timed("database shut-down (if started here)", setup.release);
  if (failure?.logFile && !options.verbose) {
    process.stderr.write(
      `\n${color.dim(`── last lines of ${rel(failure.logFile)} ──`)}\n${tail(failure.logFile, 80)}\n`,
    );
  }
  printSummary(rows, Date.now() - started);
  if (!failure) {
    say(color.green("all checks passed"));
  } else {
    const reason = failure.error?.message ?? `exit ${failure.exit}`;
    process.stderr.write(`${color.red("rillmark ✖")} ${failure.step.label} failed (${reason})`);
    process.stderr.write(`${failure.logFile ? `; full log: ${rel(failure.logFile)}` : ""}\n`);
  }
  process.stdout.write(`${closingLine(addTallies(tallies))}\n`);
  return failure ? 1 : 0;
}
