/**
 * The Design rules form's state: every rule as the form shows it (text for numbers, the
 * project's length unit), read from the saved rules and turned back into the API body.
 */
import { mFromFt, ftFromM } from "../../../../shared/hydrology/units";
import {
  GOVERNING_CHOICES,
  KINEMATIC_K_PRESETS,
  RULE_DEFAULTS,
  type SHEET_CAP_PRESETS,
  type GoverningChoice,
  type KinematicKPreset,
  type RulesInput,
} from "../../../../shared/hydrology/rules";
import { BAND_DEFAULTS } from "../../../../shared/hydrology/uncertainty/bands";
import {
  type DesignRules,
  type DesignRulesBody,
  DESIGN_RULE_DEFAULTS,
} from "../../../../shared/schemas/design-rules";

type Arc = "I" | "II" | "III";
type SheetCapChoice = (typeof SHEET_CAP_PRESETS)[number] | "length";

export interface ArcRow {
  key: number;
  years: string;
  arc: Arc;
}

export interface Draft {
  minTcMin: string;
  sheetCap: SheetCapChoice;
  sheetCapLength: string;
  kChoice: KinematicKPreset | "number";
  kNumber: string;
  arc: Arc;
  arcByPeriod: ArcRow[];
  arcMethod: "table" | "chow" | "hawkins";
  governing: GoverningChoice;
  frequencyFactor: boolean;
  allowIdfExtrapolation: boolean;
  lagCn: "path-weighted" | "watershed";
  manningConstant: "1.49" | "exact";
  overlandSeries: NonNullable<RulesInput["overlandSeries"]>;
  sheetFlowSeries: NonNullable<RulesInput["sheetFlowSeries"]>;
  sheetFlowPastCap: NonNullable<RulesInput["sheetFlowPastCap"]>;
  lagUsesArc: boolean;
  rationalUsFactor: NonNullable<RulesInput["rationalUsFactor"]>;
  kirpichAdjustment: NonNullable<RulesInput["kirpichAdjustment"]>;
  /** Bands of the sensitivity view and the Monte Carlo, as the form shows them (text). */
  bands: Record<BandKey, string>;
  dualHsg: DesignRules["dualHsg"];
  channelSlope: DesignRules["channelSlope"];
  rainfallTableId: string;
  profileSpacing: string;
}

export const BAND_KEYS = [
  "roughnessPct",
  "velocityKPct",
  "slopePct",
  "terrainVerticalAccuracy",
  "p2Pct",
  "idfPct",
  "cnPoints",
  "runoffCPct",
  "draws",
  "seed",
] as const;
export type BandKey = (typeof BAND_KEYS)[number];

let nextKey = 1;
export const arcRow = (years = "", arc: Arc = "III"): ArcRow => ({ key: nextKey++, years, arc });

const text = (n: number) => String(Number(n.toPrecision(6)));

export function draftOf(saved: DesignRules, units: "us" | "si"): Draft {
  const r = saved.rules;
  const cap = r.sheetFlowMaxLength ?? RULE_DEFAULTS.sheetFlowMaxLength;
  const k = r.kinematicWaveK ?? RULE_DEFAULTS.kinematicWaveK;
  const governing = r.governing ?? RULE_DEFAULTS.governing;
  return {
    minTcMin: text(r.minTcMin ?? RULE_DEFAULTS.minTcMin),
    sheetCap: typeof cap === "number" ? "length" : cap,
    sheetCapLength: typeof cap === "number" ? text(cap) : "",
    kChoice: typeof k === "number" ? "number" : k,
    kNumber: typeof k === "number" ? text(k) : "",
    arc: r.arc ?? RULE_DEFAULTS.arc,
    arcByPeriod: Object.entries(r.arcByReturnPeriod ?? {}).map(([y, a]) => arcRow(y, a)),
    arcMethod: r.arcMethod ?? RULE_DEFAULTS.arcMethod,
    governing: (GOVERNING_CHOICES as readonly string[]).includes(governing)
      ? governing
      : "nrcs-segmental",
    frequencyFactor: r.frequencyFactor ?? RULE_DEFAULTS.frequencyFactor,
    allowIdfExtrapolation: r.allowIdfExtrapolation ?? RULE_DEFAULTS.allowIdfExtrapolation,
    lagCn: r.lagCn ?? RULE_DEFAULTS.lagCn,
    manningConstant: r.manningConstant ?? RULE_DEFAULTS.manningConstant,
    overlandSeries: r.overlandSeries ?? RULE_DEFAULTS.overlandSeries,
    sheetFlowSeries: r.sheetFlowSeries ?? RULE_DEFAULTS.sheetFlowSeries,
    sheetFlowPastCap: r.sheetFlowPastCap ?? RULE_DEFAULTS.sheetFlowPastCap,
    lagUsesArc: r.lagUsesArc ?? RULE_DEFAULTS.lagUsesArc,
    rationalUsFactor: r.rationalUsFactor ?? RULE_DEFAULTS.rationalUsFactor,
    kirpichAdjustment: r.kirpichAdjustment ?? RULE_DEFAULTS.kirpichAdjustment,
    bands: Object.fromEntries(
      BAND_KEYS.map((k) => {
        const v =
          r.uncertainty?.[k] ?? (k === "terrainVerticalAccuracy" ? undefined : BAND_DEFAULTS[k]);
        return [k, v === undefined ? "" : text(v)];
      }),
    ) as Record<BandKey, string>,
    dualHsg: saved.dualHsg,
    channelSlope: saved.channelSlope,
    rainfallTableId: saved.rainfallTableId ?? "",
    profileSpacing: text(units === "si" ? saved.profileSpacingM : ftFromM(saved.profileSpacingM)),
  };
}

const toNumber = (s: string) => (s.trim() === "" ? Number.NaN : Number(s));

/** The PUT body; the server's schema (designRulesBody) judges it, on both sides. */
export function bodyOf(draft: Draft, units: "us" | "si", version: number): DesignRulesBody {
  const spacing = toNumber(draft.profileSpacing);
  return {
    rules: {
      minTcMin: toNumber(draft.minTcMin),
      sheetFlowMaxLength:
        draft.sheetCap === "length" ? toNumber(draft.sheetCapLength) : draft.sheetCap,
      kinematicWaveK: draft.kChoice === "number" ? toNumber(draft.kNumber) : draft.kChoice,
      arc: draft.arc,
      ...(draft.arcByPeriod.length > 0
        ? {
            arcByReturnPeriod: Object.fromEntries(
              draft.arcByPeriod.map((row) => [row.years.trim(), row.arc]),
            ),
          }
        : {}),
      arcMethod: draft.arcMethod,
      governing: draft.governing,
      frequencyFactor: draft.frequencyFactor,
      allowIdfExtrapolation: draft.allowIdfExtrapolation,
      lagCn: draft.lagCn,
      manningConstant: draft.manningConstant,
      overlandSeries: draft.overlandSeries,
      sheetFlowSeries: draft.sheetFlowSeries,
      sheetFlowPastCap: draft.sheetFlowPastCap,
      lagUsesArc: draft.lagUsesArc,
      rationalUsFactor: draft.rationalUsFactor,
      kirpichAdjustment: draft.kirpichAdjustment,
      // An empty vertical accuracy means "none": slopes then take the percentage band.
      uncertainty: Object.fromEntries(
        BAND_KEYS.filter((k) => draft.bands[k].trim() !== "").map((k) => [
          k,
          toNumber(draft.bands[k]),
        ]),
      ),
    },
    dualHsg: draft.dualHsg,
    channelSlope: draft.channelSlope,
    rainfallTableId: draft.rainfallTableId === "" ? null : draft.rainfallTableId,
    profileSpacingM: units === "si" ? spacing : mFromFt(spacing),
    version,
  };
}

export const K_PRESET_IDS = Object.keys(KINEMATIC_K_PRESETS) as KinematicKPreset[];
export { DESIGN_RULE_DEFAULTS, KINEMATIC_K_PRESETS, RULE_DEFAULTS };
