/**
 * zod schema of the rainfall block: the 2-year 24-hour depth and the IDF data, either a table
 * (durations × return periods, as intensity or depth) or Sherman formulas keyed by return
 * period. A table must be physically consistent, or it is refused with the offending cell:
 * durations and return periods strictly increasing, intensity not rising with duration, depth
 * not falling with duration, and neither falling with return period.
 */
import { z } from "zod";

// Lower and upper bounds keep every result finite; they are far beyond any real rainfall.
const between = (what: string, min: number, max: number) =>
  z
    .number({ error: `${what} must be a number` })
    .min(min, `${what} must be at least ${min}`)
    .max(max, `${what} must be at most ${max.toLocaleString("en-US")}`);

const tableSchema = z
  .strictObject({
    kind: z.literal("table"),
    durationsMin: z.array(between("a duration", 0.1, 1e6)).min(2, "needs at least 2 durations"),
    returnPeriodsYears: z
      .array(between("a return period", 0.1, 1e6))
      .min(1, "needs a return period"),
    intensity: z.array(z.array(between("an intensity", 1e-4, 1e5))).optional(),
    depth: z.array(z.array(between("a depth", 1e-4, 1e5))).optional(),
    note: z.string().optional(),
    source: z.string().optional(),
  })
  .superRefine((table, ctx) => {
    for (const problem of tableProblems(table)) ctx.addIssue({ code: "custom", ...problem });
  });

const shermanSchema = z.strictObject({
  a: between("a", 1e-3, 1e9),
  b: between("b", 0, 1e4),
  c: z
    .number({ error: "c must be a number" })
    .min(0.05, "c must be at least 0.05")
    .lt(2, "c must be less than 2"),
});

const formulaSchema = z
  .strictObject({
    kind: z.literal("formula"),
    formula: z.record(z.string(), shermanSchema),
    note: z.string().optional(),
    source: z.string().optional(),
  })
  .superRefine((value, ctx) => {
    const keys = Object.keys(value.formula);
    if (keys.length === 0) {
      ctx.addIssue({
        code: "custom",
        path: ["formula"],
        message: "needs at least one return period",
      });
    }
    const seen = new Map<number, string>();
    for (const key of keys) {
      const years = /^\s*\d+(\.\d+)?\s*$/.test(key) ? Number(key) : Number.NaN;
      if (!(years >= 0.1 && years <= 1e6)) {
        ctx.addIssue({
          code: "custom",
          path: ["formula", key],
          message: `"${key}" is not a return period in years (e.g. "25")`,
        });
        continue;
      }
      const first = seen.get(years);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["formula", key],
          message: `is the same return period as "${first}": give each return period once`,
        });
      } else seen.set(years, key);
    }
  });

function inferKind(value: unknown): unknown {
  if (typeof value !== "object" || value === null || Array.isArray(value) || "kind" in value) {
    return value;
  }
  return { ...value, kind: "formula" in value ? "formula" : "table" };
}

export const idfSchema = z.preprocess(
  inferKind,
  z.discriminatedUnion("kind", [tableSchema, formulaSchema], {
    error: "must be a table (durationsMin, returnPeriodsYears, intensity) or { formula }",
  }),
);

export const rainfallSchema = z.strictObject({
  p2_24h: between("the 2-year 24-hour depth", 0.01, 2000).optional(),
  idf: idfSchema,
  note: z.string().optional(),
  source: z.string().optional(),
});

export type IdfInput = z.output<typeof idfSchema>;
export type RainfallInput = z.output<typeof rainfallSchema>;

interface Problem {
  readonly path: Array<string | number>;
  readonly message: string;
}

type TableShape = {
  durationsMin: number[];
  returnPeriodsYears: number[];
  intensity?: number[][] | undefined;
  depth?: number[][] | undefined;
};

function increasing(values: number[], key: string, what: string): Problem[] {
  const out: Problem[] = [];
  for (let j = 1; j < values.length; j += 1) {
    if (!((values[j] ?? 0) > (values[j - 1] ?? 0))) {
      out.push({ path: [key, j], message: `${what} must increase strictly` });
    }
  }
  return out;
}

const TOL = 1e-12;

function tableProblems(table: TableShape): Problem[] {
  const { durationsMin: d, returnPeriodsYears: periods } = table;
  if (table.intensity !== undefined && table.depth !== undefined) {
    return [{ path: ["depth"], message: "give intensity or depth, not both" }];
  }
  const key = table.depth !== undefined ? "depth" : "intensity";
  const rows = table.depth ?? table.intensity;
  if (rows === undefined) {
    return [
      {
        path: ["intensity"],
        message: "is required: one row per duration, one value per return period",
      },
    ];
  }
  const problems = [
    ...increasing(d, "durationsMin", "durations"),
    ...increasing(periods, "returnPeriodsYears", "return periods"),
  ];
  if (rows.length !== d.length) {
    problems.push({
      path: [key],
      message: `has ${rows.length} rows; durationsMin has ${d.length}`,
    });
  }
  rows.forEach((row, r) => {
    if (row.length !== periods.length) {
      problems.push({
        path: [key, r],
        message: `has ${row.length} values; returnPeriodsYears has ${periods.length}`,
      });
    }
  });
  if (problems.length > 0) return problems;
  const value = (r: number, c: number): number => rows[r]?.[c] ?? Number.NaN;
  const intensity = (r: number, c: number): number =>
    key === "depth" ? (value(r, c) * 60) / (d[r] ?? Number.NaN) : value(r, c);
  for (let r = 0; r < rows.length; r += 1) {
    for (let c = 0; c < periods.length; c += 1) {
      if (r > 0) {
        const i0 = intensity(r - 1, c);
        const i1 = intensity(r, c);
        const depth0 = (i0 * (d[r - 1] ?? 0)) / 60;
        const depth1 = (i1 * (d[r] ?? 0)) / 60;
        if (i1 > i0 * (1 + TOL)) {
          problems.push({
            path: [key, r, c],
            message:
              `intensity ${fmt(i1)} at ${d[r]} min is above ${fmt(i0)} at ${d[r - 1]} min ` +
              `(${periods[c]}-year); intensity must not rise with duration`,
          });
        } else if (depth1 < depth0 * (1 - TOL)) {
          problems.push({
            path: [key, r, c],
            message:
              `depth ${fmt(depth1)} by ${d[r]} min is below ${fmt(depth0)} by ${d[r - 1]} min ` +
              `(${periods[c]}-year); the rainfall depth must not fall as the duration grows`,
          });
        }
      }
      if (c > 0 && value(r, c) < value(r, c - 1) * (1 - TOL)) {
        problems.push({
          path: [key, r, c],
          message:
            `${fmt(value(r, c))} for ${periods[c]}-year is below ${fmt(value(r, c - 1))} for ` +
            `${periods[c - 1]}-year at ${d[r]} min; values must not fall as the return period grows`,
        });
      }
    }
  }
  return problems;
}

/** Four significant figures: enough to find the cell, short enough to read. */
function fmt(x: number): string {
  return String(Number(x.toPrecision(4)));
}
