/**
 * A project's Design rules: the engineering core's rules (in the project's units) plus the
 * pipeline's own choices. `version` guards against lost updates: a PUT must send the version it
 * read (0 for a project that has never saved its rules), else 409.
 */
import { z } from "zod";
import { rulesSchema } from "../hydrology/rules";
import { idSchema } from "./common";

export const DUAL_HSG_CHOICES = ["drained", "undrained"] as const;
export const CHANNEL_SLOPE_CHOICES = ["end-to-end", "10-85"] as const;

export const designRulesBody = z.strictObject({
  rules: rulesSchema.default({}),
  /** Dual soil groups (A/D, B/D, C/D): "drained" takes the first letter, "undrained" D. */
  dualHsg: z.enum(DUAL_HSG_CHOICES, { error: "must be drained or undrained" }),
  /** Channel segment slope: end to end, or between 10 % and 85 % of the length (10–85). */
  channelSlope: z.enum(CHANNEL_SLOPE_CHOICES, { error: "must be end-to-end or 10-85" }),
  /** The project's rainfall table to compute with (null: the project's only table). */
  rainfallTableId: idSchema.nullable().default(null),
  /** Spacing of the elevation profile on the sheet, in metres. */
  profileSpacingM: z
    .number({ error: "must be a number of metres" })
    .min(0.5, "must be at least 0.5 m")
    .max(1000, "must be at most 1000 m"),
  version: z.number().int().min(0, "must be the version you read (0 for new rules)"),
});
export type DesignRulesBody = z.input<typeof designRulesBody>;

export interface DesignRules {
  projectId: string;
  rules: z.output<typeof rulesSchema>;
  dualHsg: (typeof DUAL_HSG_CHOICES)[number];
  channelSlope: (typeof CHANNEL_SLOPE_CHOICES)[number];
  rainfallTableId: string | null;
  profileSpacingM: number;
  /** 0 when the project has never saved its rules (the documented defaults apply). */
  version: number;
  updatedAt: string | null;
}

export const designRulesSchema = z.object({
  projectId: idSchema,
  rules: rulesSchema,
  dualHsg: z.enum(DUAL_HSG_CHOICES),
  channelSlope: z.enum(CHANNEL_SLOPE_CHOICES),
  rainfallTableId: idSchema.nullable(),
  profileSpacingM: z.number(),
  version: z.number().int(),
  updatedAt: z.string().nullable(),
});

/** What a project without saved rules computes with (the core's defaults fill `rules`). */
export const DESIGN_RULE_DEFAULTS = {
  dualHsg: "undrained",
  channelSlope: "end-to-end",
  rainfallTableId: null,
  profileSpacingM: 5,
} as const;
