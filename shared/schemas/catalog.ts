/**
 * The team's Surface catalog as the API and the database hold it. Each parameter carries its
 * value and the source it came from (a published table row, or the team's own criteria), so a
 * travel-time sheet and a report can cite every number. Velocity coefficients are stored in
 * ft/s (V = k·s^0.5 with s in ft/ft); SI views multiply by 0.3048 exactly (units.ts).
 */
import { z } from "zod";

const source = z.string().trim().min(1, "Say where the value comes from.").max(500);
const note = z.string().trim().max(500).default("");

const sourced = <T extends z.ZodType>(value: T) =>
  z.strictObject({ value, source, note, rowId: z.string().max(100).nullable().default(null) });

const fraction = (what: string) =>
  z
    .number({ message: `Enter ${what}.` })
    .gt(0, `${what} must be greater than 0`)
    .lt(1, `${what} must be less than 1`);
const cnValue = z.number().gt(0, "CN must be greater than 0").lte(100, "CN must be at most 100");

export const surfaceValuesSchema = z.strictObject({
  /** Manning's n for sheet flow, TR-55 Table 3-1. */
  sheetFlowN: sourced(fraction("Manning's n")).nullable(),
  /** Velocity method k (NEH 630 Ch 15 Table 15-3), ft/s. */
  velocityKFtPerS: sourced(z.number().positive().max(100)).nullable(),
  /** TR-55 shallow concentrated flow k (paved / unpaved), ft/s. */
  shallowKFtPerS: sourced(z.number().positive().max(100)).nullable(),
  kerbyN: sourced(fraction("Kerby's N")).nullable(),
  /** CN by hydrologic soil group at ARC II; null where the table prints none. */
  cn: z.strictObject({
    A: cnValue.nullable(),
    B: cnValue.nullable(),
    C: cnValue.nullable(),
    D: cnValue.nullable(),
    source,
    note,
    rowId: z.string().max(100).nullable().default(null),
  }),
  /** Rational-method runoff coefficient: the published range and the design value. */
  runoffC: z
    .strictObject({
      low: z.number().gt(0).lte(1),
      high: z.number().gt(0).lte(1),
      design: z.number().gt(0, "C must be greater than 0").lte(1, "C must be at most 1"),
      source,
      note,
      rowId: z.string().max(100).nullable().default(null),
    })
    .refine((c) => c.low <= c.design && c.design <= c.high, {
      message: "The design C must lie within its range.",
      path: ["design"],
    })
    .nullable(),
  /** Map colour of the class (#rrggbb), Rillmark's own palette by default. */
  colour: z
    .string()
    .regex(/^#[0-9a-f]{6}$/i, "Use a colour like #4a7f3c.")
    .default("#8a8f7a"),
});
export type SurfaceValues = z.output<typeof surfaceValuesSchema>;
export type SurfaceValuesInput = z.input<typeof surfaceValuesSchema>;

export const surfaceKeySchema = z
  .string()
  .trim()
  .min(2, "Use at least 2 characters.")
  .max(60, "Use at most 60 characters.")
  .regex(/^[a-z0-9][a-z0-9-]*$/, "Use lower-case letters, digits and hyphens.");

export interface SurfaceClassDto {
  id: string;
  teamId: string;
  key: string;
  name: string;
  description: string;
  values: SurfaceValues;
  seededFrom: string | null;
  /** Present in a project's view: the project's changes to this class. */
  override?: { values: Partial<SurfaceValues>; note: string } | null;
}

export const createSurfaceClassBody = z.strictObject({
  key: surfaceKeySchema,
  name: z.string().trim().min(1, "Enter a name.").max(120, "Use at most 120 characters."),
  description: z.string().trim().max(1000).default(""),
  values: surfaceValuesSchema,
});
export type CreateSurfaceClassBody = z.input<typeof createSurfaceClassBody>;

export const updateSurfaceClassBody = createSurfaceClassBody
  .omit({ key: true })
  .partial()
  .extend({ key: surfaceKeySchema.optional() });

/** A project's changes to one team class: any subset of the values, each with its source. */
export const surfaceOverrideBody = z.strictObject({
  values: surfaceValuesSchema.partial().refine((v) => Object.keys(v).length > 0, {
    message: "Change at least one value.",
  }),
  note: z.string().trim().max(500).default(""),
});
export type SurfaceOverrideBody = z.input<typeof surfaceOverrideBody>;
