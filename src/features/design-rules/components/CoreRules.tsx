import { AS_REPRODUCED } from "../../../../shared/hydrology/citation";
import { KIRPICH_ADJUSTMENT_SOURCE } from "../../../../shared/hydrology/kirpich";
import {
  OVERLAND_SERIES_LABELS,
  SHEET_FLOW_SERIES_LABELS,
} from "../../../../shared/hydrology/overland-series";
import { BAND_SOURCES } from "../../../../shared/hydrology/uncertainty/bands";
import type { FieldErrors } from "../../../lib/form";
import type { BandKey, Draft } from "./draft";
import { CheckRule, ChoiceRule, NumberRule, RuleGroup } from "./fields";

interface Props {
  draft: Draft;
  set: <K extends keyof Draft>(key: K) => (value: Draft[K]) => void;
  errors: FieldErrors;
  mayEdit: boolean;
  units: "us" | "si";
}

const BAND_FIELDS: ReadonlyArray<{ key: BandKey; label: string; unit: string; source: string }> = [
  {
    key: "roughnessPct",
    label: "Manning's n and Kerby's N",
    unit: "± %",
    source: `Default 20 % (${BAND_SOURCES.roughness}).`,
  },
  {
    key: "velocityKPct",
    label: "Velocity coefficient k",
    unit: "± %",
    source: `Default 20 % (${BAND_SOURCES.velocityK}).`,
  },
  {
    key: "slopePct",
    label: "Slopes",
    unit: "± %",
    source: `Default 10 % (${BAND_SOURCES.slope}); also the land slope of the lag method.`,
  },
  {
    key: "p2Pct",
    label: "2-year 24-hour rainfall",
    unit: "± %",
    source: `Default 10 % (${BAND_SOURCES.p2}).`,
  },
  {
    key: "idfPct",
    label: "IDF intensities",
    unit: "± %",
    source: `Default 10 % (${BAND_SOURCES.idf}).`,
  },
  {
    key: "cnPoints",
    label: "Curve numbers",
    unit: "± CN",
    source: `Default 5 (${BAND_SOURCES.cn}).`,
  },
  {
    key: "runoffCPct",
    label: "Runoff coefficient C",
    unit: "± %",
    source: `Default 10 % (${BAND_SOURCES.runoffC}).`,
  },
  {
    key: "draws",
    label: "Monte Carlo draws",
    unit: "draws",
    source: "Default 2,000; the sheet uses at most 5,000 (the command line has no cap).",
  },
  {
    key: "seed",
    label: "Monte Carlo seed",
    unit: "whole number",
    source: "Default 1: the same inputs and seed give the same band.",
  },
];

/** The rules of overland flow across surfaces, the checks, and the bands of how sure each Tc is. */
export function CoreRules({ draft, set, errors, mayEdit, units }: Props) {
  const common = (name: string) => ({ name, error: errors[name], disabled: !mayEdit });
  const setBand = (key: BandKey) => (value: string) =>
    set("bands")({ ...draft.bands, [key]: value });
  const len = units === "si" ? "m" : "ft";
  return (
    <>
      <RuleGroup title="Overland flow across surfaces, and checks">
        <ChoiceRule
          label="Overland flow across segments (kinematic wave)"
          {...common("rules.overlandSeries")}
          value={draft.overlandSeries}
          onChange={set("overlandSeries")}
          options={[
            { value: "cascade", label: OVERLAND_SERIES_LABELS.cascade },
            { value: "independent", label: OVERLAND_SERIES_LABELS.independent },
          ]}
          source="Default: planes in series, derived from the kinematic-wave equations; cutting a plane never changes its time."
        />
        <ChoiceRule
          label="Sheet flow across segments (TR-55)"
          {...common("rules.sheetFlowSeries")}
          value={draft.sheetFlowSeries}
          onChange={set("sheetFlowSeries")}
          options={[
            { value: "cascade", label: SHEET_FLOW_SERIES_LABELS.cascade },
            { value: "weighted-n", label: SHEET_FLOW_SERIES_LABELS["weighted-n"] },
            { value: "independent", label: SHEET_FLOW_SERIES_LABELS.independent },
          ]}
          source="Default: planes in series, an extension of TR-55 eq 3-3 (derived). The sheet shows what the other rules give."
        />
        <ChoiceRule
          label="Beyond the sheet-flow limit"
          {...common("rules.sheetFlowPastCap")}
          value={draft.sheetFlowPastCap}
          onChange={set("sheetFlowPastCap")}
          options={[
            { value: "shallow", label: "Carry the rest as shallow concentrated flow" },
            { value: "refuse", label: "Refuse the path" },
            { value: "warn", label: "Compute it as sheet flow, with a warning" },
          ]}
          source="Default: shallow concentrated flow past the limit (the usual practice)."
        />
        <ChoiceRule
          label="Rational method unit factor (US units)"
          {...common("rules.rationalUsFactor")}
          value={draft.rationalUsFactor}
          onChange={set("rationalUsFactor")}
          options={[
            { value: "exact", label: "1.00833 = 43,560/43,200 (US and SI agree exactly)" },
            { value: "1.0", label: "1.0 (Q = C·i·A as design manuals print it)" },
          ]}
          source="Default: 1.00833 (derived). The sheet prints the factor whenever it is not 1."
        />
        <ChoiceRule
          label="Kirpich adjustment"
          {...common("rules.kirpichAdjustment")}
          value={draft.kirpichAdjustment}
          onChange={set("kirpichAdjustment")}
          options={[
            { value: "none", label: "None (bare soil, roadside ditches)" },
            { value: "paved-overland", label: "× 0.4, overland flow on concrete or asphalt" },
            { value: "concrete-channel", label: "× 0.2, concrete channels" },
          ]}
          source={`Default: none. Factors: ${KIRPICH_ADJUSTMENT_SOURCE}.`}
        />
        <CheckRule
          label="Adjust the lag method's CN to the design ARC"
          name="rules.lagUsesArc"
          checked={draft.lagUsesArc}
          onChange={set("lagUsesArc")}
          disabled={!mayEdit}
          source="Default: off. The lag equation takes CN as a retardance index for ARC II; adjusting it is not standard and the sheet warns."
        />
      </RuleGroup>
      <RuleGroup title="How sure: bands of the sensitivity view and the Monte Carlo">
        {BAND_FIELDS.map((f) => (
          <NumberRule
            key={f.key}
            label={f.label}
            unit={f.unit}
            {...common(`rules.uncertainty.${f.key}`)}
            value={draft.bands[f.key]}
            onChange={setBand(f.key)}
            source={f.source}
          />
        ))}
        <NumberRule
          label="Terrain vertical accuracy (1 σ)"
          unit={len}
          {...common("rules.uncertainty.terrainVerticalAccuracy")}
          value={draft.bands.terrainVerticalAccuracy}
          onChange={setBand("terrainVerticalAccuracy")}
          source={`Empty by default. When set, each slope moves by ±√2·σ/L (${BAND_SOURCES.slopeTerrain}) instead of the slope band. Published terrain accuracies: ${AS_REPRODUCED}.`}
        />
      </RuleGroup>
    </>
  );
}
