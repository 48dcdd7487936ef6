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
import { rulesSchema } from "./rules";
import { inputError } from "./zod-errors";

// Upper bounds keep every result finite; they are far beyond any real flow path.
const positive = (what: string, max = 1e6) =>
  z
    .number()
    .positive(`${what} must be greater than 0`)
    .max(max, `${what} must be at most ${max.toLocaleString("en-US")}`);
const fraction = (what: string) =>
  z
    .number()
    .gt(0, `${what} must be between 0 and 1 (exclusive)`)
    .lt(1, `${what} must be between 0 and 1 (exclusive)`);

const length = positive("a length");
const slope = z
  .number()
  .gt(0, "must be greater than 0 (rise/run, e.g. 0.02 for 2 %)")
  .lte(1, "must be at most 1 (rise/run); a value over 1 usually means percent was entered");
const curveNumber = z
  .number()
  .gt(0, "CN must be greater than 0")
  .lte(100, "CN must be at most 100");
const text = z.string().max(500).optional();

const givenSection = z
  .strictObject({
    shape: z.literal("given"),
    flowArea: positive("the flow area"),
    wettedPerimeter: positive("the wetted perimeter"),
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
    bottomWidth: z
      .number()
      .min(0, "the bottom width must be at least 0")
      .max(1e5, "the bottom width must be at most 100,000"),
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
    depth: positive("the flow depth", 1000),
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
    diameter: positive("the diameter", 1000),
    flowDepth: positive("the depth of flow").optional(),
  })
  .superRefine((s, ctx) => {
    if (s.flowDepth !== undefined && s.flowDepth > s.diameter) {
      ctx.addIssue({
        code: "custom",
        path: ["flowDepth"],
        message: "must not exceed the diameter",
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
  n: fraction("Manning's n for sheet flow"),
  k: positive("the velocity coefficient k", 1000).optional(),
  kerbyN: fraction("Kerby's retardance N").optional(),
});

const shallowSegment = z.strictObject({
  regime: z.literal("shallow"),
  ...common,
  k: positive("the velocity coefficient k", 1000),
});

const channelSegment = z.strictObject({
  regime: z.literal("channel"),
  ...common,
  manningN: fraction("Manning's n"),
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
  area: positive("the area", 1e9).optional(),
  avgSlopePercent: z
    .number()
    .gt(0, "must be greater than 0 (percent)")
    .lte(100, "must be at most 100 (percent)")
    .optional(),
  cn: curveNumber.optional(),
  c: z.number().gt(0, "C must be greater than 0").lte(1, "C must be at most 1").optional(),
  label: text,
});

export const computeInputSchema = z
  .strictObject({
    units: z.enum(["us", "si"], { error: 'must be "us" or "si"' }),
    returnPeriodYears: positive("the return period", 1e6),
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
