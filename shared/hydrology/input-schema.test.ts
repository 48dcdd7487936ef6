import { describe, expect, it } from "vitest";
import { HydrologyError } from "./errors";
import { parseComputeInput } from "./input-schema";
import { fixture } from "./test-support/cases";

const example = (): unknown => fixture("example-us");

function errorOf(raw: unknown): HydrologyError {
  try {
    parseComputeInput(raw);
  } catch (error) {
    if (error instanceof HydrologyError) return error;
    throw error;
  }
  throw new Error("expected a HydrologyError");
}

const REMOVE = Symbol("remove");
type Key = string | number;

/** The example with the value at `path` replaced (or removed). */
function mutated(path: readonly Key[], value: unknown): unknown {
  const input: unknown = example();
  let node: unknown = input;
  for (const key of path.slice(0, -1)) node = (node as Record<Key, unknown>)[key];
  const last = path[path.length - 1] ?? "";
  const parent = node as Record<Key, unknown>;
  if (value === REMOVE) delete parent[last];
  else parent[last] = value;
  return input;
}

describe("compute input schema", () => {
  it("accepts the example of the format", () => {
    expect(parseComputeInput(example()).segments).toHaveLength(3);
  });
  it.each([
    ["segments[2].slope", ["segments", 2, "slope"], 0, /at least 0.00001/],
    ["segments[0].slope", ["segments", 0, "slope"], 2, /percent/],
    ["segments[0].length", ["segments", 0, "length"], -3, /at least 0.000001/],
    ["segments[0].n", ["segments", 0, "n"], 1.5, /at most 1/],
    ["segments[2].manningN", ["segments", 2, "manningN"], 0, /at least 0.005/],
    ["segments[1].k", ["segments", 1, "k"], REMOVE, /required/],
    ["segments[1].regime", ["segments", 1, "regime"], "pipe", /sheet/],
    ["segments[0].slop", ["segments", 0, "slop"], 1, /not a known field/],
    ["units", ["units"], "metric", /"us" or "si"/],
    ["returnPeriodYears", ["returnPeriodYears"], 500, /not in the IDF table/],
    [
      "rainfall.idf.intensity[3][1]",
      ["rainfall", "idf", "intensity", 3, 1],
      6,
      /rise with duration/,
    ],
    ["rainfall.idf.intensity[2]", ["rainfall", "idf", "intensity", 2], [3.3, 4.5, 5.2], /values/],
    ["rainfall.idf.durationsMin[2]", ["rainfall", "idf", "durationsMin", 2], 8, /increase/],
    ["watershed.cn", ["watershed", "cn"], 120, /at most 100/],
    ["watershed.c", ["watershed", "c"], 1.2, /at most 1/],
    ["rules.governing", ["rules", "governing"], "fastest", /one of/],
    [
      "segments[2].section.wettedPerimeter",
      ["segments", 2, "section", "wettedPerimeter"],
      3,
      /smaller than any section/,
    ],
    [
      "segments[2].section.shape",
      ["segments", 2, "section"],
      { width: 3 },
      /flowArea and wettedPerimeter/,
    ],
    [
      "segments[2].section.flowDepth",
      ["segments", 2, "section"],
      { diameter: 2, flowDepth: 3 },
      /exceed the diameter/,
    ],
  ] as const)("names %s", (path, at, value, message) => {
    const error = errorOf(mutated(at, value));
    expect(error.code).toBe("invalid-input");
    expect(error.fields.map((f) => f.path)).toContain(path);
    expect(error.fields.find((f) => f.path === path)?.message).toMatch(message);
  });
  it("puts the first field path in the message and the error JSON shape", () => {
    const error = errorOf(mutated(["segments", 2, "slope"], -1));
    expect(error.message).toMatch(/^segments\[2\]\.slope: /);
    expect(error.toJSON().error.code).toBe("invalid-input");
  });
  it("accepts trapezoid and pipe sections and a formula IDF", () => {
    const pipe = {
      regime: "channel",
      length: 300,
      slope: 0.01,
      manningN: 0.013,
      section: { diameter: 2 },
    };
    const base = example() as { segments: unknown[] };
    const input = {
      ...base,
      segments: [
        ...base.segments.slice(0, 2),
        { ...(base.segments[2] as object), section: { bottomWidth: 4, sideSlope: 3, depth: 1.5 } },
        pipe,
      ],
      rainfall: { p2_24h: 3.1, idf: { formula: { "25": { a: 60, b: 10, c: 0.8 } } } },
    };
    const parsed = parseComputeInput(input);
    expect(parsed.segments[3]?.regime).toBe("channel");
    expect(parsed.rainfall.idf.kind).toBe("formula");
  });
  it("refuses a formula IDF without the design return period", () => {
    const error = errorOf(
      mutated(["rainfall", "idf"], { formula: { "10": { a: 60, b: 10, c: 0.8 } } }),
    );
    expect(error.path).toBe("returnPeriodYears");
  });
  it("accepts an IDF table given as depth", () => {
    const base = example() as {
      rainfall: { idf: { durationsMin: number[]; intensity: number[][] } };
    };
    const { durationsMin, intensity } = base.rainfall.idf;
    const depth = intensity.map((row, r) => row.map((v) => (v * (durationsMin[r] ?? 0)) / 60));
    const input = mutated(["rainfall", "idf"], {
      durationsMin,
      returnPeriodsYears: [2, 10, 25, 100],
      depth,
    });
    expect(parseComputeInput(input).rainfall.idf.kind).toBe("table");
  });
});
