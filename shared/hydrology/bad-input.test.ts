/**
 * No input crashes the core: every numeric field of a full input (every section shape, the
 * optional keys, the rules and the bands) is set to extreme values, and the answer is either a
 * finite result or a HydrologyError; a value outside every bound names its field.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computeFromJson } from "./compute";
import { formatPath, isHydrologyError } from "./errors";
import { fixture, numbersIn, type Json } from "./test-support/cases";

type Key = string | number;

/** The example with every shape and optional number present. */
function fullInput(idf: "table" | "formula"): Json {
  const base = fixture("example-us") as unknown as Json;
  const segments = base.segments as Json[];
  const rainfall = base.rainfall as Json;
  return {
    ...base,
    rules: {
      minTcMin: 5,
      sheetFlowMaxLength: 100,
      kinematicWaveK: 0.938,
      uncertainty: {
        roughnessPct: 20,
        velocityKPct: 20,
        slopePct: 10,
        terrainVerticalAccuracy: 0.5,
        p2Pct: 10,
        idfPct: 10,
        cnPoints: 5,
        runoffCPct: 10,
        draws: 200,
        seed: 7,
      },
    },
    rainfall:
      idf === "table"
        ? rainfall
        : { ...rainfall, idf: { formula: { "25": { a: 60, b: 10, c: 0.8 } } } },
    segments: [
      { ...segments[0], shallowK: 16.1345 },
      segments[1],
      segments[2],
      { ...segments[2], section: { bottomWidth: 4, sideSlope: 3, depth: 1.5 } },
      {
        ...segments[2],
        section: { bottomWidth: 2, sideSlopeLeft: 2, sideSlopeRight: 4, depth: 1 },
      },
      { ...segments[2], manningN: 0.013, section: { diameter: 2, flowDepth: 1.2 } },
    ],
  };
}

function numberPaths(value: unknown, path: Key[] = [], out: Key[][] = []): Key[][] {
  if (typeof value === "number") out.push(path);
  else if (Array.isArray(value)) value.forEach((v, i) => numberPaths(v, [...path, i], out));
  else if (typeof value === "object" && value !== null) {
    for (const [k, v] of Object.entries(value)) numberPaths(v, [...path, k], out);
  }
  return out;
}

function mutated(input: Json, path: Key[], value: number): Json {
  const copy = structuredClone(input);
  let node = copy as Record<Key, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<Key, unknown>;
  node[path[path.length - 1] as Key] = value;
  return copy;
}

/** Outside every field's bounds, in either system. */
const HOPELESS = [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 1e308, -1];
const EXTREME = fc.oneof(
  fc.constantFrom(...HOPELESS, 5e-324, 1e-320, 1e-20, 0, 1e-7, 1e6, 1e30),
  fc.double({ min: 5e-324, max: 1e308, noNaN: true }),
);

describe.each(["table", "formula"] as const)(
  "every numeric field, IDF as a %s (property)",
  (idf) => {
    const input = fullInput(idf);
    const paths = numberPaths(input);
    it("the full input is valid and computes", () => {
      expect(numbersIn(computeFromJson(input)).every(Number.isFinite)).toBe(true);
      expect(paths.length).toBeGreaterThan(40);
    });
    it("gives a finite result or a field error, never a stack trace", () => {
      fc.assert(
        fc.property(fc.constantFrom(...paths), EXTREME, (path, value) => {
          const name = formatPath(path);
          try {
            const result = computeFromJson(mutated(input, path, value));
            if (HOPELESS.includes(value) || Number.isNaN(value)) return false;
            return numbersIn(result).every(Number.isFinite);
          } catch (error) {
            if (!isHydrologyError(error)) throw error;
            if (!HOPELESS.includes(value) && !Number.isNaN(value)) return true;
            return error.code === "invalid-input" && error.fields.some((f) => f.path === name);
          }
        }),
        { numRuns: 600 },
      );
    });
  },
);

describe("refusals a checking engineer asked for", () => {
  const run = (raw: unknown) => {
    try {
      computeFromJson(raw);
    } catch (error) {
      if (isHydrologyError(error)) return error.fields;
      throw error;
    }
    throw new Error("expected a refusal");
  };
  it("a pipe depth of 1e-20, k of 1e-320 and an area of 5e-324 get field errors", () => {
    const base = fullInput("table");
    expect(run(mutated(base, ["segments", 5, "section", "flowDepth"], 1e-20))[0]?.path).toBe(
      "segments[5].section.flowDepth",
    );
    expect(run(mutated(base, ["segments", 1, "k"], 1e-320))[0]?.path).toBe("segments[1].k");
    expect(run(mutated(base, ["watershed", "area"], 5e-324))[0]?.path).toBe("watershed.area");
  });
  it('return periods that parse to one number ("25" and "25.0") are refused', () => {
    const base = fullInput("formula");
    const formula = { "25": { a: 60, b: 10, c: 0.8 }, "25.0": { a: 61, b: 10, c: 0.8 } };
    const fields = run({ ...base, rainfall: { p2_24h: 3.1, idf: { formula } } });
    expect(fields.find((f) => f.path === "rainfall.idf.formula.25.0")?.message).toMatch(
      /same return period as "25"/,
    );
  });
  it("a junk formula key is named, not reported as NaN", () => {
    const base = fullInput("formula");
    const formula = { "25": { a: 60, b: 10, c: 0.8 }, ten: { a: 50, b: 10, c: 0.8 } };
    const fields = run({ ...base, rainfall: { p2_24h: 3.1, idf: { formula } } });
    expect(fields.map((f) => f.message).join(" ")).toMatch(/"ten" is not a return period/);
    expect(fields.map((f) => f.message).join(" ")).not.toMatch(/NaN/);
  });
  it("a kinematic-wave K outside the plausible band of the system is refused", () => {
    const base = fullInput("table");
    const fields = run({ ...base, rules: { kinematicWaveK: 6.99 } });
    expect(fields[0]?.path).toBe("rules.kinematicWaveK");
    expect(fields[0]?.message).toMatch(/looks like a value for SI units/);
  });
  it("a slope that would give absurd times is refused", () => {
    const fields = run(mutated(fullInput("table"), ["segments", 0, "slope"], 1e-9));
    expect(fields[0]?.path).toBe("segments[0].slope");
  });
});
