/**
 * The zod schema of the command-line / compute input (docs/calc-format.md documents it).
 *
 * Lengths, areas and depths are in the declared unit system (`units`: "us" = ft, in, in/h, ac;
 * "si" = m, mm, mm/h, ha); slopes are always rise/run (ft/ft, m/m), except the subcatchment's
 * average land slope, which is in percent as the lag equation takes it. Unknown keys are refused
 * so a misspelt optional key cannot be silently ignored.
 */
import { z } from "zod";
import { idfDataFromInput } from "./case";
import { returnPeriodProblem } from "./idf";
import { rainfallSchema } from "./idf-schema";
import { minimumWettedPerimeter } from "./manning";
import { rulesSchema, rulesUnitProblems } from "./rules";
import { inputError } from "./zod-errors";

/**
 * Every number has a physical lower bound as well as an upper one: the bounds keep every
 * equation well conditioned (a pipe depth of 1e-20 or a k of 1e-320 would otherwise end in a
 * non-finite result), and they lie far outside any real flow path. Bounds are in the declared
 * unit and hold in either system.
 */
const between = (what: string, min: number, max: number, why = "") =>
  z
    .number({ error: numberError(what) })
    .min(min, `${what} must be at least ${fmt(min)}${why}`)
    .max(max, `${what} must be at most ${fmt(max)}`);

/** "is required" for a missing value (as zod-errors words it), else what is wanted. */
export const numberError = (what: string) => (issue: { input?: unknown }) =>
  issue.input === undefined ? "is required (a number)" : `${what} must be a number`;

function fmt(x: number): string {
  return x >= 0.001 ? x.toLocaleString("en-US", { maximumFractionDigits: 6 }) : String(x);
}

const length = between("a length", 1e-6, 1e6);
const slope = z
  .number({ error: "must be a number (rise/run)" })
  .min(
    1e-5,
    "must be at least 0.00001 (0.001 %, rise/run): flatter ground is below survey accuracy and gives meaningless travel times",
  )
  .lte(1, "must be at most 1 (rise/run); a value over 1 usually means percent was entered");
const curveNumber = between("CN", 1, 100);
const text = z.string().max(500).optional();
/** Velocity coefficient k of V = k·s^0.5 (published 2.5–20.3 ft/s, 0.76–6.2 m/s). */
const velocityK = (what: string) => between(what, 0.1, 200, " (ft/s or m/s)");

const givenSection = z
  .strictObject({
    shape: z.literal("given"),
    flowArea: between("the flow area", 1e-4, 1e6),
    wettedPerimeter: between("the wetted perimeter", 1e-3, 1e6),
  })
  .superRefine((s, ctx) => {
    const min = minimumWettedPerimeter(s.flowArea);
    if (s.wettedPerimeter < min * (1 - 1e-9)) {
      ctx.addIssue({
        code: "custom",
        path: ["wettedPerimeter"],
        message: `is smaller than any section of that flow area can have (at least ${min.toPrecision(4)})`,
      });
    }
  });

const trapezoidSection = z
  .strictObject({
    shape: z.literal("trapezoid"),
    bottomWidth: between("the bottom width", 0, 1e5),
    sideSlope: z
      .number()
      .min(0, "side slope (H:V) must be at least 0")
      .max(1000, "side slope (H:V) must be at most 1,000")
      .optional(),
    sideSlopeLeft: z
      .number()
      .min(0, "side slope (H:V) must be at least 0")
      .max(1000, "side slope (H:V) must be at most 1,000")
      .optional(),
    sideSlopeRight: z
      .number()
      .min(0, "side slope (H:V) must be at least 0")
      .max(1000, "side slope (H:V) must be at most 1,000")
      .optional(),
    depth: between("the flow depth", 1e-3, 1000),
  })
  .superRefine((s, ctx) => {
    const left = s.sideSlopeLeft ?? s.sideSlope;
    const right = s.sideSlopeRight ?? s.sideSlope;
    if (left === undefined || right === undefined) {
      ctx.addIssue({
        code: "custom",
        path: ["sideSlope"],
        message: "is required (H:V), or give sideSlopeLeft and sideSlopeRight",
      });
    } else if (s.bottomWidth === 0 && left + right === 0) {
      ctx.addIssue({
        code: "custom",
        path: ["bottomWidth"],
        message: "a section with no bottom and vertical sides has no area",
      });
    }
  });

const circularSection = z
  .strictObject({
    shape: z.literal("circular"),
    diameter: between("the diameter", 0.01, 1000),
    flowDepth: between("the depth of flow", 1e-4, 1000).optional(),
  })
  .superRefine((s, ctx) => {
    if (s.flowDepth !== undefined && s.flowDepth > s.diameter) {
      ctx.addIssue({
        code: "custom",
        path: ["flowDepth"],
        message: "must not exceed the diameter",
      });
    } else if (s.flowDepth !== undefined && s.flowDepth < 0.01 * s.diameter) {
      // Below 1 % full the section's angle rounds to nothing and the velocity is meaningless.
      ctx.addIssue({
        code: "custom",
        path: ["flowDepth"],
        message: "must be at least 1 % of the diameter",
      });
    }
  });

function inferShape(value: unknown): unknown {
  if (typeof value !== "object" || value === null || Array.isArray(value) || "shape" in value) {
    return value;
  }
  if ("diameter" in value) return { ...value, shape: "circular" };
  if ("bottomWidth" in value) return { ...value, shape: "trapezoid" };
  if ("flowArea" in value || "wettedPerimeter" in value) return { ...value, shape: "given" };
  return value;
}

export const sectionSchema = z.preprocess(
  inferShape,
  z.discriminatedUnion("shape", [givenSection, trapezoidSection, circularSection], {
    error:
      "needs flowArea and wettedPerimeter, a trapezoid (bottomWidth, sideSlope, depth) or a " +
      "pipe (diameter, optional flowDepth)",
  }),
);

const common = { length, slope, cn: curveNumber.optional(), label: text, surface: text };

const sheetSegment = z.strictObject({
  regime: z.literal("sheet"),
  ...common,
  n: between("Manning's n for sheet flow", 0.005, 1),
  k: velocityK("the velocity coefficient k").optional(),
  /** k for the part past the sheet-flow cap carried as shallow flow (else `k`). */
  shallowK: velocityK("the shallow-flow velocity coefficient").optional(),
  kerbyN: between("Kerby's retardance N", 0.01, 1).optional(),
});

const shallowSegment = z.strictObject({
  regime: z.literal("shallow"),
  ...common,
  k: velocityK("the velocity coefficient k"),
});

const channelSegment = z.strictObject({
  regime: z.literal("channel"),
  ...common,
  manningN: between("Manning's n", 0.005, 0.5),
  section: sectionSchema,
});

export const segmentSchema = z.discriminatedUnion(
  "regime",
  [sheetSegment, shallowSegment, channelSegment],
  {
    error: 'regime must be "sheet", "shallow" or "channel"',
  },
);

export const watershedSchema = z.strictObject({
  area: between("the area", 1e-3, 1e9).optional(),
  avgSlopePercent: between("the average land slope", 0.001, 100, " (percent)").optional(),
  cn: curveNumber.optional(),
  c: between("C", 0.01, 1).optional(),
  label: text,
});

export const computeInputSchema = z
  .strictObject({
    units: z.enum(["us", "si"], { error: 'must be "us" or "si"' }),
    returnPeriodYears: between("the return period", 0.1, 1e6),
    rules: rulesSchema.optional(),
    rainfall: rainfallSchema,
    watershed: watershedSchema.optional(),
    segments: z
      .array(segmentSchema)
      .min(1, "needs at least one segment")
      .max(100_000, "has more than 100,000 segments"),
    title: text,
    note: z.string().max(2000).optional(),
  })
  .superRefine((input, ctx) => {
    const problem = returnPeriodProblem(
      idfDataFromInput(input.rainfall.idf, "us"),
      input.returnPeriodYears,
    );
    if (problem !== null)
      ctx.addIssue({ code: "custom", path: ["returnPeriodYears"], message: problem });
    for (const p of rulesUnitProblems(input.rules, input.units)) {
      ctx.addIssue({ code: "custom", path: ["rules", ...p.path], message: p.message });
    }
  });

export type ComputeInput = z.output<typeof computeInputSchema>;
export type SegmentInput = z.output<typeof segmentSchema>;
export type SectionInput = z.output<typeof sectionSchema>;
export type WatershedInput = z.output<typeof watershedSchema>;

/** Parses raw input (e.g. JSON.parse output); throws a HydrologyError naming the field path. */
export function parseComputeInput(raw: unknown): ComputeInput {
  const result = computeInputSchema.safeParse(raw);
  if (!result.success) throw inputError(result.error);
  return result.data;
}
