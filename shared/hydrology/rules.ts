/**
 * Design rules: the choices a reviewing agency makes, each with a documented default
 * (docs/decisions/010-engineering-core-defaults.md records why the defaults are what they are).
 *
 *   minTcMin              5 min (common practice; TR-55 uses 0.1 h = 6 min [from memory])
 *   sheetFlowMaxLength    "100ft" (NEH 630 Ch 15, 2010) | "300ft" (TR-55 1986) |
 *                         "mccuen-spiess" (L = 100·s^0.5/n ft, NEH 630 eq 15-9) | a length in the
 *                         declared unit
 *   sheetFlowPastCap      "shallow" (the excess is shallow concentrated flow: the usual practice)
 *                         | "refuse" | "warn" (computed as sheet flow, with a warning)
 *   overlandSeries        "cascade" (kinematic planes in series, derived) | "independent"
 *   sheetFlowSeries       "cascade" (TR-55 eq 3-3 on the path's kinematic coefficient, an
 *                         extension, derived) | "weighted-n" (common practice) | "independent"
 *   kinematicWaveK        "theory-1.49" (0.938, derived) | "ragan-duru" (0.94) | "hec22-us" (0.933) |
 *                         "hec22-si" (6.943) | "theory-si" (6.99, derived) | a number in the
 *                         declared system (US: L ft, i in/h; SI: L m, i mm/h), within half to one
 *                         and a half times the theory value of that system
 *   arc                   "II"; arcByReturnPeriod overrides it for listed return periods
 *   arcMethod             "table" (NEH 630 Ch 10 Table 10-1, row by row) | "chow" | "hawkins"
 *   lagUsesArc            false: the lag equation takes CN as a retardance index (ARC II)
 *   governing             "nrcs-segmental" | any method id | "largest" | "smallest"
 *   frequencyFactor       true (HEC-22 Table 3-2 Cf in the rational method)
 *   rationalUsFactor      "exact" (1 ac·in/h = 1.00833 cfs, derived) | "1.0" (as manuals print)
 *   allowIdfExtrapolation false (durations outside the IDF table are refused)
 *   lagCn                 "watershed" (the subcatchment's area-weighted CN, TR-55 Worksheet 2
 *                         practice) | "path-weighted" (length-weighted segment CN)
 *   manningConstant       "1.49" (TR-55 as printed) | "exact" (1 m^(1/3)/s = 1.4859 ft^(1/3)/s)
 *   kirpichAdjustment     "none" | "paved-overland" (× 0.4) | "concrete-channel" (× 0.2)
 *   uncertainty           the bands of the sensitivity view and Monte Carlo (uncertainty/bands.ts)
 */
import { z } from "zod";
import { ARC_METHODS, type Arc, type ArcMethod } from "./arc";
import { kinematicKSiFromUs, kinematicKUsFromSi } from "./kinematic-wave";
import { MANNING_K_US_EXACT, MANNING_K_US_TR55 } from "./manning";
import { METHOD_IDS, type MethodId } from "./method-ids";
import {
  OVERLAND_SERIES,
  SHEET_FLOW_SERIES,
  type OverlandSeries,
  type SheetFlowSeries,
} from "./overland-series";
import { CFS_PER_ACRE_INCH_PER_HOUR } from "./rational";
import { KIRPICH_ADJUSTMENTS, type KirpichAdjustment } from "./kirpich";
import { bandsSchema, resolveBands, type ResolvedBands } from "./uncertainty/bands";
import { ftFromM, type UnitSystem } from "./units";
import { KINEMATIC_K_PRESETS, kPresetSourceNote } from "./rules-k";

export { KINEMATIC_K_PRESETS, type KinematicKPreset } from "./rules-k";
const K_PRESET_IDS = Object.keys(KINEMATIC_K_PRESETS) as [
  keyof typeof KINEMATIC_K_PRESETS,
  ...(keyof typeof KINEMATIC_K_PRESETS)[],
];

export const SHEET_CAP_PRESETS = ["100ft", "300ft", "mccuen-spiess"] as const;
export const SHEET_PAST_CAP = ["shallow", "refuse", "warn"] as const;
export type SheetPastCap = (typeof SHEET_PAST_CAP)[number];
export const GOVERNING_CHOICES = [...METHOD_IDS, "largest", "smallest"] as const;
export type GoverningChoice = (typeof GOVERNING_CHOICES)[number];
export const LAG_CN_CHOICES = ["watershed", "path-weighted"] as const;

const arcSchema = z.enum(["I", "II", "III"], { error: "must be I, II or III" });
const choice = <T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values, { error: `must be one of ${values.map((v) => `"${v}"`).join(", ")}` });

/** Return-period keys: a number of years; two keys for the same number are refused. */
const byReturnPeriod = z
  .record(z.string().regex(/^\d+(\.\d+)?$/, "keys must be return periods in years"), arcSchema)
  .superRefine((record, ctx) => {
    const seen = new Map<number, string>();
    for (const key of Object.keys(record)) {
      const years = Number(key);
      if (!(years > 0)) {
        ctx.addIssue({ code: "custom", path: [key], message: "must be more than 0 years" });
        continue;
      }
      const first = seen.get(years);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: [key],
          message: `is the same return period as "${first}": give each return period once`,
        });
      } else seen.set(years, key);
    }
  });

export const rulesSchema = z.strictObject({
  minTcMin: z
    .number({ error: "must be a number of minutes" })
    .min(0, "must be at least 0 min")
    .max(120, "must be at most 120 min")
    .optional(),
  sheetFlowMaxLength: z
    .union(
      [
        z
          .number()
          .min(1, "a length of at least 1 (ft or m)")
          .max(10_000, "a length of at most 10,000"),
        z.enum(SHEET_CAP_PRESETS),
      ],
      { error: 'must be a length from 1 to 10,000 or one of "100ft", "300ft", "mccuen-spiess"' },
    )
    .optional(),
  sheetFlowPastCap: choice(SHEET_PAST_CAP).optional(),
  overlandSeries: choice(OVERLAND_SERIES).optional(),
  sheetFlowSeries: choice(SHEET_FLOW_SERIES).optional(),
  kinematicWaveK: z
    .union([z.number().min(0.1).max(20), z.enum(K_PRESET_IDS)], {
      error: `must be a number (about 0.94 in US units, 6.9 in SI) or one of ${K_PRESET_IDS.map((k) => `"${k}"`).join(", ")}`,
    })
    .optional(),
  arc: arcSchema.optional(),
  arcByReturnPeriod: byReturnPeriod.optional(),
  arcMethod: choice(ARC_METHODS).optional(),
  lagUsesArc: z.boolean({ error: "must be true or false" }).optional(),
  governing: z
    .enum(GOVERNING_CHOICES, { error: `must be one of ${GOVERNING_CHOICES.join(", ")}` })
    .optional(),
  frequencyFactor: z.boolean({ error: "must be true or false" }).optional(),
  rationalUsFactor: choice(["exact", "1.0"] as const).optional(),
  allowIdfExtrapolation: z.boolean({ error: "must be true or false" }).optional(),
  lagCn: choice(LAG_CN_CHOICES).optional(),
  manningConstant: choice(["1.49", "exact"] as const).optional(),
  kirpichAdjustment: choice(KIRPICH_ADJUSTMENTS).optional(),
  uncertainty: bandsSchema.optional(),
});

export type RulesInput = z.infer<typeof rulesSchema>;

export type SheetCap =
  | { readonly kind: "length"; readonly lengthFt: number; readonly label: string }
  | { readonly kind: "mccuen-spiess"; readonly label: string };

/** Rules with every default applied, in internal US units. */
export interface ResolvedRules {
  readonly minTcMin: number;
  readonly sheetCap: SheetCap;
  readonly sheetPastCap: SheetPastCap;
  readonly overlandSeries: OverlandSeries;
  readonly sheetFlowSeries: SheetFlowSeries;
  readonly kinematicK: {
    readonly us: number;
    readonly declared: number;
    readonly label: string;
    readonly source: string;
  };
  readonly arc: Arc;
  readonly arcMethod: ArcMethod;
  readonly lagUsesArc: boolean;
  readonly governing: GoverningChoice;
  readonly frequencyFactor: boolean;
  /** cfs per ac·in/h: 43,560/43,200 ("exact") or 1 ("1.0"). */
  readonly rationalUsFactor: { readonly value: number; readonly label: "exact" | "1.0" };
  readonly allowIdfExtrapolation: boolean;
  readonly lagCn: "path-weighted" | "watershed";
  /** True when lagCn was not set, so a missing watershed CN may fall back to the path's. */
  readonly lagCnDefaulted: boolean;
  readonly manningConstant: { readonly us: number; readonly label: "1.49" | "exact" };
  readonly kirpichAdjustment: KirpichAdjustment;
  readonly bands: ResolvedBands;
}

export const RULE_DEFAULTS = {
  minTcMin: 5,
  sheetFlowMaxLength: "100ft",
  sheetFlowPastCap: "shallow",
  overlandSeries: "cascade",
  sheetFlowSeries: "cascade",
  kinematicWaveK: "theory-1.49",
  arc: "II",
  arcMethod: "table",
  lagUsesArc: false,
  governing: "nrcs-segmental",
  frequencyFactor: true,
  rationalUsFactor: "exact",
  allowIdfExtrapolation: false,
  lagCn: "watershed",
  manningConstant: "1.49",
  kirpichAdjustment: "none",
} as const satisfies Required<Omit<RulesInput, "arcByReturnPeriod" | "uncertainty">>;

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
    return { us, declared: v, label: String(v), source: "design rule (number)" };
  }
  const preset = KINEMATIC_K_PRESETS[v];
  const us = preset.units === "si" ? kinematicKUsFromSi(preset.value) : preset.value;
  const declared =
    units === preset.units ? preset.value : units === "si" ? kinematicKSiFromUs(us) : us;
  return { us, declared, label: v, source: kPresetSourceNote(v) };
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
  const rational = r.rationalUsFactor ?? RULE_DEFAULTS.rationalUsFactor;
  return {
    minTcMin: r.minTcMin ?? RULE_DEFAULTS.minTcMin,
    sheetCap: resolveSheetCap(r.sheetFlowMaxLength, units),
    sheetPastCap: r.sheetFlowPastCap ?? RULE_DEFAULTS.sheetFlowPastCap,
    overlandSeries: r.overlandSeries ?? RULE_DEFAULTS.overlandSeries,
    sheetFlowSeries: r.sheetFlowSeries ?? RULE_DEFAULTS.sheetFlowSeries,
    kinematicK: resolveK(r.kinematicWaveK, units),
    arc: byPeriod?.[1] ?? r.arc ?? RULE_DEFAULTS.arc,
    arcMethod: r.arcMethod ?? RULE_DEFAULTS.arcMethod,
    lagUsesArc: r.lagUsesArc ?? RULE_DEFAULTS.lagUsesArc,
    governing: r.governing ?? RULE_DEFAULTS.governing,
    frequencyFactor: r.frequencyFactor ?? RULE_DEFAULTS.frequencyFactor,
    rationalUsFactor: {
      value: rational === "exact" ? CFS_PER_ACRE_INCH_PER_HOUR : 1,
      label: rational,
    },
    allowIdfExtrapolation: r.allowIdfExtrapolation ?? RULE_DEFAULTS.allowIdfExtrapolation,
    lagCn: r.lagCn ?? RULE_DEFAULTS.lagCn,
    lagCnDefaulted: r.lagCn === undefined,
    manningConstant: {
      us: manning === "exact" ? MANNING_K_US_EXACT : MANNING_K_US_TR55,
      label: manning,
    },
    kirpichAdjustment: r.kirpichAdjustment ?? RULE_DEFAULTS.kirpichAdjustment,
    bands: resolveBands(r.uncertainty, units === "si" ? ftFromM(1) : 1),
  };
}

/**
 * Problems of rules that depend on the unit system, as field problems relative to `rules`: a
 * kinematic-wave K outside half to one and a half times the theory value of the declared
 * system (a US value in an SI project, or a typing slip).
 */
export function rulesUnitProblems(
  rules: RulesInput | undefined,
  units: UnitSystem,
): Array<{ path: string[]; message: string }> {
  const k = rules?.kinematicWaveK;
  if (typeof k !== "number") return [];
  const theory = units === "us" ? 0.938 : 6.99;
  if (k >= 0.5 * theory && k <= 1.5 * theory) return [];
  const other = units === "us" ? "SI" : "US";
  const looksOther = units === "us" ? k > 3 : k < 3;
  return [
    {
      path: ["kinematicWaveK"],
      message:
        `${k} is outside the plausible band ${(0.5 * theory).toFixed(2)}–${(1.5 * theory).toFixed(2)} ` +
        `for ${units === "us" ? "US units (L ft, i in/h)" : "SI units (L m, i mm/h)"}` +
        (looksOther ? `; it looks like a value for ${other} units` : ""),
    },
  ];
}

export function isMethodId(value: string): value is MethodId {
  return (METHOD_IDS as readonly string[]).includes(value);
}
