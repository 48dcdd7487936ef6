/**
 * Rainfall tables of a project: IDF data as the engineering core reads it (a table of
 * durations × return periods, or Sherman formulas i = a/(t+b)^c per return period), in the
 * project's units (in, in/h or mm, mm/h), with the note of where the numbers come from.
 */
import { z } from "zod";
import { idfSchema } from "../hydrology/idf-schema";
import { idSchema } from "./common";

const name = z.string().trim().min(1, "Enter a name.").max(160, "Use at most 160 characters.");
const sourceNote = z.string().trim().max(2000, "Use at most 2000 characters.");
const p2 = z
  .number({ error: "must be a depth (in or mm)" })
  .positive("must be greater than 0")
  .max(10_000, "must be at most 10,000");

export const createRainfallBody = z.strictObject({
  name,
  sourceNote: sourceNote.default(""),
  /** 2-year 24-hour depth in the project's depth unit (TR-55 sheet flow needs it). */
  p2_24h: p2.nullable().default(null),
  idf: idfSchema,
});
export type CreateRainfallBody = z.input<typeof createRainfallBody>;

/** The text fields sent beside a CSV file (multipart/form-data, so numbers arrive as text). */
export const rainfallCsvFields = z.strictObject({
  name,
  sourceNote: sourceNote.default(""),
  kind: z.enum(["intensity", "depth"], { error: "must be intensity or depth" }),
  p2_24h: z
    .union([z.literal(""), z.coerce.number()])
    .transform((v) => (v === "" ? null : v))
    .pipe(p2.nullable())
    .default(null),
});

export const updateRainfallBody = z.strictObject({
  name: name.optional(),
  sourceNote: sourceNote.optional(),
  p2_24h: p2.nullable().optional(),
  idf: idfSchema.optional(),
});

export const shermanFitSchema = z.object({
  returnPeriodYears: z.number(),
  a: z.number(),
  b: z.number(),
  c: z.number(),
  rSquared: z.number(),
  maxRelativeError: z.number(),
  points: z.number().int(),
});

export const rainfallTableSchema = z.object({
  id: idSchema,
  projectId: idSchema,
  name: z.string(),
  units: z.enum(["us", "si"]),
  idf: z.unknown(),
  p2_24h: z.number().nullable(),
  sourceNote: z.string(),
  originalFilename: z.string().nullable(),
  /** Sherman fit of each return period of a table (null for formulas or a failed fit). */
  fit: z.array(shermanFitSchema).nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type RainfallTable = Omit<z.output<typeof rainfallTableSchema>, "idf"> & {
  idf: z.output<typeof idfSchema>;
};
