/**
 * The command line (scripts/calc.ts) on the example files of tests/fixtures/calc, in both unit
 * systems, and on bad files: non-zero exit and a message naming the field path.
 */
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const root = fileURLToPath(new URL("../..", import.meta.url));

function calc(...args: string[]) {
  const run = spawnSync(process.execPath, ["--import", "tsx", "scripts/calc.ts", ...args], {
    cwd: root,
    encoding: "utf8",
  });
  return { code: run.status, stdout: run.stdout, stderr: run.stderr };
}

const fixture = (name: string) => `tests/fixtures/calc/${name}`;

interface Printed {
  units: string;
  methods: Record<string, { status: string; totalMin: number }>;
  governing: { method: string; tcMin: number };
  peakFlow: { value: number; unit: string } | null;
  caution: string;
}

describe("npm run calc", () => {
  const us = calc(fixture("example-us.json"));
  const si = calc(fixture("example-si.json"), "--format", "json");

  it("prints JSON for the example file, every method computed", () => {
    expect(us.code).toBe(0);
    const result = JSON.parse(us.stdout) as Printed;
    expect(Object.values(result.methods).every((m) => m.status === "ok")).toBe(true);
    expect(Object.keys(result.methods)).toEqual([
      "velocity",
      "nrcs-lag",
      "kinematic-wave",
      "nrcs-segmental",
      "kirpich",
      "kerby",
      "faa",
      "kerby-kirpich",
    ]);
    expect(result.governing.method).toBe("kinematic-wave");
    expect(result.caution).toMatch(/engineer of record/);
  });

  it("gives the same answer for the SI twin (1e-9 relative)", () => {
    expect(si.code).toBe(0);
    const a = JSON.parse(us.stdout) as Printed;
    const b = JSON.parse(si.stdout) as Printed;
    expect(b.units).toBe("si");
    for (const [id, m] of Object.entries(a.methods)) {
      const other = b.methods[id];
      expect(Math.abs((other?.totalMin ?? 0) - m.totalMin) / m.totalMin).toBeLessThan(1e-9);
    }
    const q = a.peakFlow?.value ?? Number.NaN;
    expect(b.peakFlow?.unit).toBe("m³/s");
    expect(Math.abs((b.peakFlow?.value ?? 0) / 0.3048 ** 3 - q) / q).toBeLessThan(1e-9);
  });

  it("prints a table with units and the caution line", () => {
    const table = calc(fixture("example-us.json"), "--format", "table");
    expect(table.code).toBe(0);
    expect(table.stdout).toContain("length ft");
    expect(table.stdout).toContain("Tt min");
    expect(table.stdout).toContain("kinematic-wave");
    expect(table.stdout).toContain("local drainage criteria and the engineer of record govern");
  });

  it.each([
    ["bad-slope.json", "segments[2].slope"],
    ["bad-missing-k.json", "segments[1].k"],
    ["bad-manning-n.json", "segments[0].n"],
    ["bad-idf-not-monotone.json", "rainfall.idf.intensity[3][1]"],
    ["bad-return-period.json", "returnPeriodYears"],
    ["bad-unknown-key.json", "segments[0].slop"],
  ])("refuses %s and names %s", (file, path) => {
    const run = calc(fixture(file));
    expect(run.code).toBe(1);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain("invalid input");
    expect(run.stderr).toContain(`${path}:`);
  });

  it("with --uncertainty prints the band and the sensitivity, the same from the same seed", () => {
    const args = [fixture("example-us.json"), "--uncertainty", "--draws", "400", "--seed", "5"];
    const a = calc(...args);
    const b = calc(...args);
    expect(a.code).toBe(0);
    const band = (JSON.parse(a.stdout) as { uncertainty: { monteCarlo: { draws: number } } })
      .uncertainty.monteCarlo;
    expect(band.draws).toBe(400);
    expect(b.stdout).toBe(a.stdout);
    const table = calc(fixture("example-si.json"), "--format", "table", "--uncertainty");
    expect(table.stdout).toMatch(/governing Tc min: P10 [\d.]+, P50 [\d.]+, P90 [\d.]+/);
    expect(table.stdout).toContain("Sensitivity");
    expect(calc(fixture("example-us.json"), "--draws", "many").code).toBe(2);
    // Four runs of the command line, each starting tsx: more than the default 5 s on a busy machine.
  }, 60_000);

  it("follows the sheet-flow cap rule: carried as shallow flow, refused, or warned", () => {
    const warn = calc(fixture("sheet-past-cap.json"));
    expect(warn.code).toBe(0);
    expect(warn.stdout).toContain('"code": "sheet-past-cap"');
  });

  it("refuses a file that is not JSON, a missing file and a bad option", () => {
    expect(calc(fixture("bad-not-json.json")).stderr).toMatch(/is not valid JSON/);
    expect(calc(fixture("bad-not-json.json")).code).toBe(2);
    expect(calc(fixture("no-such-file.json")).code).toBe(2);
    const bad = calc(fixture("example-us.json"), "--format", "xml");
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--format must be json or table/);
    // Four runs of the command line, each starting tsx.
  }, 60_000);
});
