/**
 * Command line: `npm run calc -- <input.json> [--format json|table] [--uncertainty]
 * [--draws N] [--seed S]`.
 *
 * Reads one input file (format: docs/calc-format.md), computes every time-of-concentration
 * method and prints the result as JSON (default) or as a text table; with --uncertainty, the
 * sensitivity view and the Monte Carlo band too (--draws and --seed override
 * rules.uncertainty). Exit codes: 0 success,
 * 1 invalid input or data the methods cannot serve (the message names the field path),
 * 2 usage error or unreadable / non-JSON file.
 */
import { readFileSync } from "node:fs";
import { parseArgs } from "node:util";
import {
  compute,
  formatResultText,
  isHydrologyError,
  parseComputeInput,
} from "../shared/hydrology/index";

const USAGE =
  "usage: npm run calc -- <input.json> [--format json|table] [--uncertainty] [--draws N] [--seed S]";

/** A whole number from a flag, or a usage failure naming the flag. */
function wholeNumber(flag: string, value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  if (!/^\d+$/.test(value))
    fail(2, [`calc: --${flag} must be a whole number (got "${value}")`, USAGE]);
  return Number(value);
}

function fail(code: number, lines: string[]): never {
  process.stderr.write(`${lines.join("\n")}\n`);
  process.exit(code);
}

function main(argv: string[]): void {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      options: {
        format: { type: "string", default: "json" },
        uncertainty: { type: "boolean" },
        draws: { type: "string" },
        seed: { type: "string" },
        help: { type: "boolean" },
      },
    });
  } catch (error) {
    fail(2, [`calc: ${error instanceof Error ? error.message : String(error)}`, USAGE]);
  }
  if (parsed.values.help === true) {
    process.stdout.write(`${USAGE}\nFormat of the input: docs/calc-format.md\n`);
    return;
  }
  const format = parsed.values.format;
  if (format !== "json" && format !== "table") {
    fail(2, [`calc: --format must be json or table (got "${format}")`, USAGE]);
  }
  const [file, ...extra] = parsed.positionals;
  if (file === undefined || extra.length > 0) fail(2, ["calc: give exactly one input file", USAGE]);

  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (error) {
    fail(2, [
      `calc: cannot read ${file}: ${error instanceof Error ? error.message : String(error)}`,
    ]);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    fail(2, [
      `calc: ${file} is not valid JSON: ${error instanceof Error ? error.message : String(error)}`,
    ]);
  }

  const draws = wholeNumber("draws", parsed.values.draws);
  const seed = wholeNumber("seed", parsed.values.seed);
  const withBand = parsed.values.uncertainty === true || draws !== undefined || seed !== undefined;
  try {
    const input = parseComputeInput(withOverrides(raw, draws, seed));
    const result = compute(input, { uncertainty: withBand });
    const body =
      format === "json" ? JSON.stringify(result, null, 2) : formatResultText(input, result);
    process.stdout.write(`${body}\n`);
  } catch (error) {
    if (!isHydrologyError(error)) throw error;
    const heading =
      error.code === "invalid-input"
        ? `calc: invalid input in ${file}`
        : `calc: ${file} cannot be computed (${error.code})`;
    fail(1, [
      heading,
      ...error.fields.map((f) => `  ${f.path === "" ? "(input)" : f.path}: ${f.message}`),
    ]);
  }
}

/** The file's input with --draws / --seed written into rules.uncertainty (then validated). */
function withOverrides(raw: unknown, draws?: number, seed?: number): unknown {
  if ((draws === undefined && seed === undefined) || typeof raw !== "object" || raw === null) {
    return raw;
  }
  const input = raw as { rules?: { uncertainty?: object } };
  return {
    ...input,
    rules: {
      ...input.rules,
      uncertainty: {
        ...input.rules?.uncertainty,
        ...(draws !== undefined && { draws }),
        ...(seed !== undefined && { seed }),
      },
    },
  };
}

main(process.argv.slice(2));
