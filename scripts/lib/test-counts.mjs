// Test counts of npm test, read from the machine-readable reports each runner writes beside
// its human-readable log (vitest: --reporter=json; node --test: a TAP file), and the plain
// closing line CI reads: "rillmark: 612 passed, 0 failed".
import fs from "node:fs";
import path from "node:path";
import { ROOT } from "./log.mjs";

/** Pure: where a step's report goes, relative to the project (the runners' working folder). */
export function reportFile(stepId, extension) {
  return path.join(".data", "logs", `test-${stepId}.${extension}`);
}

/** Pure: the counts of a vitest JSON report (Jest-compatible fields), or null. */
export function vitestCounts(report) {
  const count = (key) => (Number.isInteger(report?.[key]) ? report[key] : null);
  const passed = count("numPassedTests");
  const failed = count("numFailedTests");
  if (passed === null || failed === null) return null;
  return {
    passed,
    failed,
    skipped: (count("numPendingTests") ?? 0) + (count("numTodoTests") ?? 0),
  };
}

/** Pure: the counts of node --test's TAP summary ("# pass 19"), or null without one. */
export function nodeTestCounts(tap) {
  const field = (name) => {
    const match = new RegExp(`^# ${name} (\\d+)\\s*$`, "m").exec(tap);
    return match ? Number(match[1]) : null;
  };
  const passed = field("pass");
  const failed = field("fail");
  if (passed === null || failed === null) return null;
  // A cancelled test (its file crashed, a timeout) did not pass: it counts as failed.
  return {
    passed,
    failed: failed + (field("cancelled") ?? 0),
    skipped: (field("skipped") ?? 0) + (field("todo") ?? 0),
  };
}

/** The counts a finished step reported, or null (no report, or a step without tests). */
export function readStepCounts(step) {
  if (!step.report) return null;
  let text;
  try {
    text = fs.readFileSync(path.resolve(ROOT, step.report.file), "utf8");
  } catch {
    return null;
  }
  if (step.report.kind === "node") return nodeTestCounts(text);
  try {
    return vitestCounts(JSON.parse(text));
  } catch {
    return null;
  }
}

/** Remove a previous run's report, so a runner that dies early is not credited with it. */
export function clearStepReport(step) {
  if (step.report) fs.rmSync(path.resolve(ROOT, step.report.file), { force: true });
}

/**
 * Pure: what a step adds to the closing line. A step that failed without a failed test to
 * show for it (typecheck, lint, a runner that crashed before reporting) counts as one failure,
 * so a failing run never reads "0 failed".
 */
export function stepTally(counts, ok) {
  const tally = counts ? { ...counts } : { passed: 0, failed: 0, skipped: 0 };
  if (!ok && tally.failed === 0) tally.failed = 1;
  return tally;
}

export function addTallies(tallies) {
  const total = { passed: 0, failed: 0, skipped: 0 };
  for (const tally of tallies) {
    total.passed += tally.passed;
    total.failed += tally.failed;
    total.skipped += tally.skipped;
  }
  return total;
}

/** Pure: "612 passed, 0 failed" (", 3 skipped" only when some were). */
export function countsText({ passed, failed, skipped }) {
  return `${passed} passed, ${failed} failed${skipped > 0 ? `, ${skipped} skipped` : ""}`;
}

/** Pure: the closing line, alone and uncoloured. */
export function closingLine(total) {
  return `rillmark: ${countsText(total)}`;
}
