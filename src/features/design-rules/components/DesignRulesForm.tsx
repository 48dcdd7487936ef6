import { useState, type FormEvent } from "react";
import { ARC_METHOD_SOURCES } from "../../../../shared/hydrology/arc";
import { kPresetSourceNote } from "../../../../shared/hydrology/rules-k";
import { METHOD_LABELS, METHOD_IDS } from "../../../../shared/hydrology/method-ids";
import { designRulesBody, type DesignRules } from "../../../../shared/schemas/design-rules";
import { type RainfallTable } from "../../../../shared/schemas/rainfall";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { isApiError } from "../../../lib/api";
import { fieldErrorsOf, type FieldErrors } from "../../../lib/form";
import { type useSaveDesignRules } from "../api/save-design-rules";
import { ArcByPeriod } from "./ArcByPeriod";
import { CoreRules } from "./CoreRules";
import { bodyOf, draftOf, K_PRESET_IDS, KINEMATIC_K_PRESETS, type Draft } from "./draft";
import { CheckRule, ChoiceRule, NumberRule, RuleGroup } from "./fields";

interface Props {
  /** Kept by the page, so the outcome of a save outlives the form it re-creates. */
  save: ReturnType<typeof useSaveDesignRules>;
  units: "us" | "si";
  saved: DesignRules;
  tables: readonly RainfallTable[];
  mayEdit: boolean;
  onReload: () => void;
}

const ARC_OPTIONS = [
  { value: "I", label: "ARC I (dry)" },
  { value: "II", label: "ARC II (average)" },
  { value: "III", label: "ARC III (wet)" },
];

/** Every rule as a labelled control, with its default and its source under it. */
export function DesignRulesForm({ save, units, saved, tables, mayEdit, onReload }: Props) {
  const [draft, setDraft] = useState<Draft>(() => draftOf(saved, units));
  const [clientErrors, setClientErrors] = useState<FieldErrors | null>(null);
  const len = units === "si" ? "m" : "ft";
  const set =
    <K extends keyof Draft>(key: K) =>
    (value: Draft[K]) =>
      setDraft((d) => ({ ...d, [key]: value }));
  const errors = clientErrors ?? (isApiError(save.error) ? save.error.fields : {});
  const stale = isApiError(save.error, 409);
  const common = (name: string) => ({ name, error: errors[name], disabled: !mayEdit });

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const parsed = designRulesBody.safeParse(bodyOf(draft, units, saved.version));
    if (!parsed.success) {
      setClientErrors(fieldErrorsOf(parsed.error));
      return save.reset();
    }
    setClientErrors(null);
    save.mutate(bodyOf(draft, units, saved.version));
  }

  const sheetCapPreset = draft.sheetCap === "length";
  const kNumber = draft.kChoice === "number";
  return (
    <form noValidate onSubmit={onSubmit} aria-label="Design rules" className="space-y-6">
      <RuleGroup title="Time of concentration">
        <ChoiceRule
          label="Governing method"
          {...common("rules.governing")}
          value={draft.governing}
          onChange={set("governing")}
          options={[
            ...METHOD_IDS.map((id) => ({ value: id, label: METHOD_LABELS[id] })),
            { value: "largest", label: "The largest Tc of the methods" },
            { value: "smallest", label: "The smallest Tc of the methods" },
          ]}
          source="Default: NRCS segmental method (TR-55, 1986). Checks (Kirpich, Kerby, FAA) govern only when chosen here."
        />
        <NumberRule
          label="Minimum Tc"
          unit="min"
          {...common("rules.minTcMin")}
          value={draft.minTcMin}
          onChange={set("minTcMin")}
          source="Default: 5 min (common practice; TR-55 uses 0.1 h = 6 min, from memory)."
        />
        <ChoiceRule
          label="Longest sheet flow"
          {...common("rules.sheetFlowMaxLength")}
          value={draft.sheetCap}
          onChange={set("sheetCap")}
          options={[
            { value: "100ft", label: "100 ft (NEH 630 Ch 15, 2010)" },
            { value: "300ft", label: "300 ft (TR-55, 1986)" },
            {
              value: "mccuen-spiess",
              label: "McCuen–Spiess limit, 100·s^0.5/n ft (NEH 630 eq 15-9)",
            },
            { value: "length", label: `A length of your own (${len})` },
          ]}
          source="Default: 100 ft (NEH 630 Ch 15, 2010). Longer sheet flow is computed and warned about."
        />
        {sheetCapPreset && (
          <NumberRule
            label="Sheet flow length limit"
            unit={len}
            {...common("rules.sheetFlowMaxLength")}
            value={draft.sheetCapLength}
            onChange={set("sheetCapLength")}
            source="The agency's own limit."
          />
        )}
        <ChoiceRule
          label="Kinematic-wave constant"
          {...common("rules.kinematicWaveK")}
          value={draft.kChoice}
          onChange={set("kChoice")}
          options={[
            ...K_PRESET_IDS.map((id) => ({
              value: id,
              label: `${KINEMATIC_K_PRESETS[id].value} (${KINEMATIC_K_PRESETS[id].units === "us" ? "US" : "SI"}) — ${kPresetSourceNote(id)}`,
            })),
            { value: "number", label: "A number of your own" },
          ]}
          source="Default: 0.938, derived from the kinematic-wave solution with Manning 1.49 (HEC-22 prints 0.933). US: L ft, i in/h; SI: L m, i mm/h; a value far from the system's own is refused."
        />
        {kNumber && (
          <NumberRule
            label="Kinematic-wave constant"
            unit={units === "si" ? "SI" : "US"}
            {...common("rules.kinematicWaveK")}
            value={draft.kNumber}
            onChange={set("kNumber")}
            source="US values lie near 0.94, SI values near 6.9."
          />
        )}
        <ChoiceRule
          label="Manning constant"
          {...common("rules.manningConstant")}
          value={draft.manningConstant}
          onChange={set("manningConstant")}
          options={[
            { value: "1.49", label: "1.49 (TR-55 as printed)" },
            { value: "exact", label: "1.486 (exact: 1 m^(1/3)/s in ft)" },
          ]}
          source="Default: 1.49 (TR-55, 1986)."
        />
        <ChoiceRule
          label="Lag method curve number"
          {...common("rules.lagCn")}
          value={draft.lagCn}
          onChange={set("lagCn")}
          options={[
            { value: "watershed", label: "Area-weighted CN of the subcatchment" },
            { value: "path-weighted", label: "Length-weighted CN of the path's segments" },
          ]}
          source="Default: area-weighted over the subcatchment (TR-55 Worksheet 2 practice)."
        />
      </RuleGroup>
      <RuleGroup title="Curve numbers and soils">
        <ChoiceRule
          label="Antecedent runoff condition"
          {...common("rules.arc")}
          value={draft.arc}
          onChange={set("arc")}
          options={ARC_OPTIONS}
          source="Default: ARC II (NEH 630 Ch 10, 2004)."
        />
        <ChoiceRule
          label="ARC adjustment"
          {...common("rules.arcMethod")}
          value={draft.arcMethod}
          onChange={set("arcMethod")}
          options={[
            { value: "table", label: "Table 10-1" },
            { value: "chow", label: "Chow formulas" },
            { value: "hawkins", label: "Hawkins formulas" },
          ]}
          source={`Default: table, row by row — ${ARC_METHOD_SOURCES.table}`}
        />
        <ArcByPeriod
          rows={draft.arcByPeriod}
          onChange={set("arcByPeriod")}
          errors={errors}
          disabled={!mayEdit}
        />
        <ChoiceRule
          label="Dual soil groups (A/D, B/D, C/D)"
          {...common("dualHsg")}
          value={draft.dualHsg}
          onChange={set("dualHsg")}
          options={[
            { value: "undrained", label: "Undrained: use D" },
            { value: "drained", label: "Drained: use the first letter" },
          ]}
          source="Default: undrained (TR-55 ch 2 gives the first letter only for drained sites)."
        />
      </RuleGroup>
      <RuleGroup title="Rainfall, slopes and profile">
        <ChoiceRule
          label="Rainfall table"
          {...common("rainfallTableId")}
          value={draft.rainfallTableId}
          onChange={set("rainfallTableId")}
          options={[
            { value: "", label: "The project's only table" },
            ...tables.map((t) => ({ value: t.id, label: t.name })),
          ]}
          source="With several tables, choose the one to compute with."
        />
        <CheckRule
          label="Frequency factor in the rational method"
          name="rules.frequencyFactor"
          checked={draft.frequencyFactor}
          onChange={set("frequencyFactor")}
          disabled={!mayEdit}
          source="Default: on — Cf by return period, FHWA HEC-22 3rd ed. (2009) Table 3-2 (from memory)."
        />
        <CheckRule
          label="Allow durations outside the rainfall table"
          name="rules.allowIdfExtrapolation"
          checked={draft.allowIdfExtrapolation}
          onChange={set("allowIdfExtrapolation")}
          disabled={!mayEdit}
          source="Default: off — durations outside the table are refused."
        />
        <ChoiceRule
          label="Channel segment slope"
          {...common("channelSlope")}
          value={draft.channelSlope}
          onChange={set("channelSlope")}
          options={[
            { value: "end-to-end", label: "End to end" },
            { value: "10-85", label: "Between 10 % and 85 % of the length" },
          ]}
          source="Default: end to end."
        />
        <NumberRule
          label="Profile spacing"
          unit={len}
          {...common("profileSpacingM")}
          value={draft.profileSpacing}
          onChange={set("profileSpacing")}
          source={`Default: 5 m${units === "us" ? " (16.4 ft)" : ""}. Elevations are sampled this far apart for the profile.`}
        />
      </RuleGroup>
      <CoreRules draft={draft} set={set} errors={errors} mayEdit={mayEdit} units={units} />
      {stale ? (
        <div
          role="alert"
          className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-caution-300 bg-caution-50 px-3 py-2 text-sm text-caution-900"
        >
          <span>
            Someone else changed these rules since you opened them. Reload to see theirs, then make
            your change again. {save.error?.message}
          </span>
          <Button size="sm" variant="secondary" onClick={onReload}>
            Reload the rules
          </Button>
        </div>
      ) : (
        <FormError
          message={
            clientErrors && Object.keys(clientErrors).length > 0
              ? "Check the fields marked in red."
              : isApiError(save.error)
                ? save.error.message
                : null
          }
        />
      )}
      {save.isSuccess && !save.isPending && (
        <Notice>Design rules saved (version {save.data.version}).</Notice>
      )}
      {mayEdit && (
        <Button type="submit" pending={save.isPending}>
          Save design rules
        </Button>
      )}
    </form>
  );
}
