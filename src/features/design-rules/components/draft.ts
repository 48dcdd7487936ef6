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
} from "../../../../shared/hydrology/rules";
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
  dualHsg: DesignRules["dualHsg"];
  channelSlope: DesignRules["channelSlope"];
  rainfallTableId: string;
  profileSpacing: string;
}

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
