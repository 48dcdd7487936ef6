// Self-test of npm test's counts and its closing line, with a real node --test run using the
// same reporter flags as the self-test step.
import assert from "node:assert/strict";
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { describe, it } from "node:test";
import { tempDir } from "./self-test-tmp.mjs";
import {
  addTallies,
  closingLine,
  nodeTestCounts,
  stepTally,
  vitestCounts,
} from "./test-counts.mjs";
import { SELF_TEST_FILES, parseTestArgs, planSteps } from "./test-run.mjs";

// What CI looks for: the counts alone on a line, one word with a colon allowed before them.
const CI_LINE = /^(\w+: )?\d+ passed, \d+ failed(, \d+ skipped)?$/;

describe("test counts", () => {
  it("reads vitest's JSON report, skipped and todo tests as skipped", () => {
    const report = {
      numTotalTests: 14,
      numPassedTests: 10,
      numFailedTests: 1,
      numPendingTests: 2,
      numTodoTests: 1,
      testResults: [],
    };
    assert.deepEqual(vitestCounts(report), { passed: 10, failed: 1, skipped: 3 });
    assert.equal(vitestCounts({}), null);
    assert.equal(vitestCounts(null), null);
  });
  it("reads node --test's TAP summary; a cancelled test is a failed one", () => {
    const tap =
      "TAP version 13\n# tests 9\n# pass 5\n# fail 1\n# cancelled 1\n# skipped 1\n# todo 1\n";
    assert.deepEqual(nodeTestCounts(tap), { passed: 5, failed: 2, skipped: 2 });
    assert.equal(nodeTestCounts("ok 1 - x\n"), null);
  });
  it("counts a step that failed without a failed test as one failure", () => {
    assert.deepEqual(stepTally(null, false), { passed: 0, failed: 1, skipped: 0 });
    assert.deepEqual(stepTally({ passed: 3, failed: 0, skipped: 0 }, false).failed, 1);
    assert.deepEqual(stepTally({ passed: 3, failed: 2, skipped: 0 }, false).failed, 2);
    assert.deepEqual(stepTally(null, true), { passed: 0, failed: 0, skipped: 0 });
  });
  it("ends with one plain line in the form CI reads", () => {
    const total = addTallies([
      { passed: 40, failed: 0, skipped: 0 },
      { passed: 560, failed: 0, skipped: 0 },
      { passed: 12, failed: 0, skipped: 0 },
    ]);
    assert.equal(closingLine(total), "rillmark: 612 passed, 0 failed");
    assert.equal(
      closingLine({ passed: 1, failed: 2, skipped: 3 }),
      "rillmark: 1 passed, 2 failed, 3 skipped",
    );
    for (const line of [closingLine(total), closingLine({ passed: 0, failed: 1, skipped: 4 })])
      assert.match(line, CI_LINE);
  });
  it("gets the counts from a real node --test run with the self-test step's flags", () => {
    const dir = tempDir();
    const file = path.join(dir, "sample.test.mjs");
    fs.writeFileSync(
      file,
      'import { it } from "node:test";\n' +
        'it("passes", () => {});\nit("fails", () => { throw new Error("no"); });\n' +
        'it("skipped", { skip: true }, () => {});\n',
    );
    const step = planSteps(parseTestArgs(["--only", "bootstrap"]))[0];
    const tapFile = path.join(dir, "report.tap");
    const args = step.args
      .filter((arg) => !SELF_TEST_FILES.includes(arg))
      .map((arg) =>
        arg.endsWith(step.report.file) ? `--test-reporter-destination=${tapFile}` : arg,
      );
    // Without this variable the inner run would report to this one instead of to its files.
    const env = { ...process.env };
    delete env.NODE_TEST_CONTEXT;
    const run = spawnSync(process.execPath, [...args, file], {
      encoding: "utf8",
      env,
      timeout: 30_000,
    });
    assert.equal(run.status, 1);
    assert.match(run.stdout, /✖ fails/); // the readable reporter still goes to the log
    assert.deepEqual(nodeTestCounts(fs.readFileSync(tapFile, "utf8")), {
      passed: 1,
      failed: 1,
      skipped: 1,
    });
  });
});
