/**
 * Design rules: the choices a reviewing agency makes, each with a documented default.
 *
 *   minTcMin              5 min (common practice; TR-55 uses 0.1 h = 6 min [from memory])
 *   sheetFlowMaxLength    "100ft" (NEH 630 Ch 15, 2010) | "300ft" (TR-55 1986) |
 *                         "mccuen-spiess" (L = 100·s^0.5/n ft, NEH 630 eq 15-9) | a length in the
 *                         declared unit. Longer sheet flow is computed and warned about.
 *   kinematicWaveK        "theory-1.49" (0.938) | "ragan-duru" (0.94) | "hec22-us" (0.933) |
 *                         "hec22-si" (6.943) | "theory-si" (6.99) | a number in the declared
 *                         system (US: L ft, i in/h; SI: L m, i mm/h)
 *   arc                   "II"; arcByReturnPeriod overrides it for listed return periods
 *   arcMethod             "table" (NEH 630 Ch 10 Table 10-1) | "chow" | "hawkins"
 *   governing             "nrcs-segmental" | any method id | "largest" | "smallest"
 *   frequencyFactor       true (HEC-22 Table 3-2 Cf in the rational method)
 *   allowIdfExtrapolation false (durations outside the IDF table are refused)
 *   lagCn                 "path-weighted" (length-weighted segment CN) | "watershed"
 *   manningConstant       "1.49" (TR-55 as printed) | "exact" (1 m^(1/3)/s = 1.4859 ft^(1/3)/s)
 */
import { z } from "zod";
import type { Arc, ArcMethod } from "./arc";
import { kinematicKSiFromUs, kinematicKUsFromSi } from "./kinematic-wave";
import { MANNING_K_US_EXACT, MANNING_K_US_TR55 } from "./manning";
import { METHOD_IDS, type MethodId } from "./method-ids";
import { ftFromM, type UnitSystem } from "./units";

export const KINEMATIC_K_PRESETS = {
  "theory-1.49": {
    value: 0.938,
    units: "us",
    source: "kinematic-wave solution with Manning 1.49: 43200^0.4/(60·1.49^0.6) [derived]",
  },
  "ragan-duru": {
    value: 0.94,
    units: "us",
    source: "Ragan & Duru (1972), as printed in Chow, Maidment & Mays (1988) [from memory]",
  },
  "hec22-us": { value: 0.933, units: "us", source: "FHWA HEC-22 3rd ed. (2009), Ku [from memory]" },
  "hec22-si": { value: 6.943, units: "si", source: "FHWA HEC-22 3rd ed. (2009), Ku [from memory]" },
  "theory-si": {
    value: 6.99,
    units: "si",
    source: "kinematic-wave solution with Manning 1/n (SI): 3.6e6^0.4/60 [derived]",
  },
} as const satisfies Record<string, { value: number; units: UnitSystem; source: string }>;

export type KinematicKPreset = keyof typeof KINEMATIC_K_PRESETS;
const K_PRESET_IDS = Object.keys(KINEMATIC_K_PRESETS) as [KinematicKPreset, ...KinematicKPreset[]];

export const SHEET_CAP_PRESETS = ["100ft", "300ft", "mccuen-spiess"] as const;
export const GOVERNING_CHOICES = [...METHOD_IDS, "largest", "smallest"] as const;
export type GoverningChoice = (typeof GOVERNING_CHOICES)[number];

const arcSchema = z.enum(["I", "II", "III"], { error: "must be I, II or III" });

export const rulesSchema = z.strictObject({
  minTcMin: z
    .number({ error: "must be a number of minutes" })
    .min(0, "must be at least 0 min")
    .max(120, "must be at most 120 min")
    .optional(),
  sheetFlowMaxLength: z
    .union([z.number().positive(), z.enum(SHEET_CAP_PRESETS)], {
      error: 'must be a positive length or one of "100ft", "300ft", "mccuen-spiess"',
    })
    .optional(),
  kinematicWaveK: z
    .union([z.number().positive(), z.enum(K_PRESET_IDS)], {
      error: `must be a positive number or one of ${K_PRESET_IDS.map((k) => `"${k}"`).join(", ")}`,
    })
    .optional(),
  arc: arcSchema.optional(),
  arcByReturnPeriod: z
    .record(z.string().regex(/^\d+(\.\d+)?$/, "keys must be return periods in years"), arcSchema)
    .optional(),
  arcMethod: z
    .enum(["table", "chow", "hawkins"], { error: "must be table, chow or hawkins" })
    .optional(),
  governing: z
    .enum(GOVERNING_CHOICES, { error: `must be one of ${GOVERNING_CHOICES.join(", ")}` })
    .optional(),
  frequencyFactor: z.boolean({ error: "must be true or false" }).optional(),
  allowIdfExtrapolation: z.boolean({ error: "must be true or false" }).optional(),
  lagCn: z
    .enum(["path-weighted", "watershed"], { error: "must be path-weighted or watershed" })
    .optional(),
  manningConstant: z.enum(["1.49", "exact"], { error: 'must be "1.49" or "exact"' }).optional(),
});

export type RulesInput = z.infer<typeof rulesSchema>;

export type SheetCap =
  | { readonly kind: "length"; readonly lengthFt: number; readonly label: string }
  | { readonly kind: "mccuen-spiess"; readonly label: string };

/** Rules with every default applied, in internal US units. */
export interface ResolvedRules {
  readonly minTcMin: number;
  readonly sheetCap: SheetCap;
  readonly kinematicK: {
    readonly us: number;
    readonly declared: number;
    readonly label: string;
    readonly source: string;
    readonly suspicious: boolean;
  };
  readonly arc: Arc;
  readonly arcMethod: ArcMethod;
  readonly governing: GoverningChoice;
  readonly frequencyFactor: boolean;
  readonly allowIdfExtrapolation: boolean;
  readonly lagCn: "path-weighted" | "watershed";
  readonly manningConstant: { readonly us: number; readonly label: "1.49" | "exact" };
}

export const RULE_DEFAULTS = {
  minTcMin: 5,
  sheetFlowMaxLength: "100ft",
  kinematicWaveK: "theory-1.49",
  arc: "II",
  arcMethod: "table",
  governing: "nrcs-segmental",
  frequencyFactor: true,
  allowIdfExtrapolation: false,
  lagCn: "path-weighted",
  manningConstant: "1.49",
} as const satisfies Required<Omit<RulesInput, "arcByReturnPeriod">>;

function resolveSheetCap(value: RulesInput["sheetFlowMaxLength"], units: UnitSystem): SheetCap {
  const v = value ?? RULE_DEFAULTS.sheetFlowMaxLength;
  if (v === "mccuen-spiess")
    return { kind: "mccuen-spiess", label: "McCuen–Spiess, 100·s^0.5/n ft" };
  if (v === "100ft")
    return { kind: "length", lengthFt: 100, label: "100 ft (NEH 630 Ch 15, 2010)" };
  if (v === "300ft") return { kind: "length", lengthFt: 300, label: "300 ft (TR-55, 1986)" };
  const lengthFt = units === "si" ? ftFromM(v) : v;
  return { kind: "length", lengthFt, label: `${v} ${units === "si" ? "m" : "ft"} (design rule)` };
}

function resolveK(
  value: RulesInput["kinematicWaveK"],
  units: UnitSystem,
): ResolvedRules["kinematicK"] {
  const v = value ?? RULE_DEFAULTS.kinematicWaveK;
  if (typeof v === "number") {
    const us = units === "si" ? kinematicKUsFromSi(v) : v;
    // US K values sit near 0.94 and SI ones near 6.9: a value on the wrong side is a unit slip.
    const suspicious = units === "us" ? v > 3 : v < 3;
    return { us, declared: v, label: String(v), source: "design rule (number)", suspicious };
  }
  const preset = KINEMATIC_K_PRESETS[v];
  const us = preset.units === "si" ? kinematicKUsFromSi(preset.value) : preset.value;
  const declared =
    units === preset.units ? preset.value : units === "si" ? kinematicKSiFromUs(us) : us;
  return { us, declared, label: v, source: preset.source, suspicious: false };
}

/** Applies the defaults; `returnPeriodYears` picks the ARC from arcByReturnPeriod. */
export function resolveRules(
  rules: RulesInput | undefined,
  units: UnitSystem,
  returnPeriodYears: number,
): ResolvedRules {
  const r = rules ?? {};
  const byPeriod = Object.entries(r.arcByReturnPeriod ?? {}).find(
    ([years]) => Number(years) === returnPeriodYears,
  );
  const manning = r.manningConstant ?? RULE_DEFAULTS.manningConstant;
  return {
    minTcMin: r.minTcMin ?? RULE_DEFAULTS.minTcMin,
    sheetCap: resolveSheetCap(r.sheetFlowMaxLength, units),
    kinematicK: resolveK(r.kinematicWaveK, units),
    arc: byPeriod?.[1] ?? r.arc ?? RULE_DEFAULTS.arc,
    arcMethod: r.arcMethod ?? RULE_DEFAULTS.arcMethod,
    governing: r.governing ?? RULE_DEFAULTS.governing,
    frequencyFactor: r.frequencyFactor ?? RULE_DEFAULTS.frequencyFactor,
    allowIdfExtrapolation: r.allowIdfExtrapolation ?? RULE_DEFAULTS.allowIdfExtrapolation,
    lagCn: r.lagCn ?? RULE_DEFAULTS.lagCn,
    manningConstant: {
      us: manning === "exact" ? MANNING_K_US_EXACT : MANNING_K_US_TR55,
      label: manning,
    },
  };
}

export function isMethodId(value: string): value is MethodId {
  return (METHOD_IDS as readonly string[]).includes(value);
}
