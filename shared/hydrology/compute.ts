/**
 * The orchestrator: input → every method's segment times and Tc, the warnings, the governing
 * Tc with its reason, and the rational-method peak flow. Pure: no I/O, same input → same output.
 * Computes in US customary units inside (case.ts) and reports in the declared system.
 */
import { toInternalCase, type InternalCase } from "./case";
import { faaCheck, kerbyCheck, kerbyKirpichCheck, kirpichCheck } from "./check-methods";
import { finite, isHydrologyError } from "./errors";
import { chooseGoverning } from "./governing";
import { intensityCurve, type IntensityCurve } from "./idf";
import { parseComputeInput, type ComputeInput } from "./input-schema";
import { lagMethod } from "./lag-method";
import { sheetCapExcesses, type MethodContext } from "./method-context";
import { kinematicMethod } from "./kinematic-method";
import { segmentalMethod, velocityMethod } from "./path-methods";
import { cappedCfC, CFS_PER_ACRE_INCH_PER_HOUR, frequencyFactor } from "./rational";
import {
  CAUTION,
  type ComputeResult,
  type Governing,
  type MethodResults,
  type PeakFlow,
  type RulesApplied,
} from "./result-types";
import { uncertainty } from "./uncertainty/analysis";
import { outputUnits, type OutputUnits } from "./units";
import { LOW_SLOPE_FT_PER_FT, WarningList } from "./warnings";

function pathWarnings(kase: InternalCase, out: OutputUnits, warnings: WarningList): void {
  let concentratedSeen = false;
  for (const s of kase.segments) {
    if (s.slopeFtPerFt < LOW_SLOPE_FT_PER_FT) {
      warnings.add({
        code: "slope-low",
        segmentIndex: s.index,
        message: `slope ${s.slopeFtPerFt} is under 0.1 %: Tc formulas are unreliable on such flat ground`,
      });
    }
    if (s.regime === "sheet" && concentratedSeen) {
      warnings.add({
        code: "sheet-not-upstream",
        segmentIndex: s.index,
        message:
          "sheet flow below shallow or channel flow: sheet flow belongs at the top of the path",
      });
    }
    if (s.regime !== "sheet") concentratedSeen = true;
  }
  for (const c of kase.capSplits) {
    const len = (ft: number) => `${out.length(ft).toPrecision(4)} ${out.labels.length}`;
    warnings.add({
      code: "sheet-past-cap",
      segmentIndex: c.index,
      message:
        c.sheetFt > 0
          ? `sheet flow reaches the cap of ${len(c.limitFt)} (${kase.rules.sheetCap.label}) ` +
            `${len(c.sheetFt)} into this segment; the remaining ${len(c.pastFt)} is carried as ` +
            "shallow concentrated flow (rules.sheetFlowPastCap)"
          : "this sheet segment lies past the sheet-flow cap and is carried as shallow " +
            "concentrated flow (rules.sheetFlowPastCap)",
    });
  }
  for (const e of sheetCapExcesses(kase)) {
    warnings.add({
      code: "sheet-too-long",
      segmentIndex: e.index,
      message:
        `sheet flow length ${out.length(e.cumulativeFt).toPrecision(4)} ${out.labels.length} is past ` +
        `the cap of ${out.length(e.limitFt).toPrecision(4)} ${out.labels.length} (${kase.rules.sheetCap.label}); ` +
        'computed as sheet flow (rules.sheetFlowPastCap is "warn")',
    });
  }
}

/** Sheet flow over several segments: which rule combined them, and what the others give. */
function seriesWarnings(methods: MethodResults, warnings: WarningList): void {
  for (const id of ["kinematic-wave", "nrcs-segmental"] as const) {
    const m = methods[id];
    if (m.status !== "ok" || m.overlandSeries === null) continue;
    const note = m.overlandSeries;
    const others = note.alternatives
      .map((a) => `${a.option} ${a.totalMin.toFixed(2)} min`)
      .join(", ");
    warnings.add({
      code: "sheet-multi-surface",
      method: id,
      message:
        `sheet flow crosses ${note.sheetSegments} segments: rules.${note.rule} "${note.used}" ` +
        `(${note.usedLabel}) gives ${m.totalMin.toFixed(2)} min; ${others}`,
    });
  }
}

function peakFlow(
  kase: InternalCase,
  curve: IntensityCurve,
  governing: Governing,
  out: OutputUnits,
  warnings: WarningList,
): PeakFlow | null {
  const { areaAc, c } = kase.watershed;
  const skip = (message: string) => {
    warnings.add({ code: "peak-flow-skipped", message });
    return null;
  };
  if (areaAc === undefined || c === undefined) {
    return skip("the rational method needs watershed.area and watershed.c");
  }
  const before = curve.extrapolatedMin.length;
  let intensity: number;
  try {
    intensity = curve.at(governing.tcMin);
  } catch (error) {
    if (!isHydrologyError(error)) throw error;
    return skip(`no peak flow: ${error.message}`);
  }
  if (curve.extrapolatedMin.length > before) {
    warnings.add({
      code: "idf-extrapolated",
      message: `the intensity at ${governing.tcMin.toFixed(2)} min is extrapolated beyond the IDF table`,
    });
  }
  const unitFactor =
    kase.units === "si"
      ? kase.rules.rationalUsFactor.value / CFS_PER_ACRE_INCH_PER_HOUR / 360
      : kase.rules.rationalUsFactor.value;
  const factor = kase.rules.frequencyFactor
    ? frequencyFactor(kase.returnPeriodYears)
    : { cf: 1, betweenRows: false };
  if (factor.betweenRows) {
    warnings.add({
      code: "frequency-factor-between-rows",
      message: `HEC-22 Table 3-2 has no row for ${kase.returnPeriodYears} years; Cf ${factor.cf} (the next row up) is used`,
    });
  }
  const cfc = cappedCfC(factor.cf, c);
  if (cfc.capped) {
    warnings.add({
      code: "frequency-factor-capped",
      message: `Cf·C = ${(factor.cf * c).toFixed(3)} is capped at 1`,
    });
  }
  const cfs = cfc.value * intensity * areaAc * kase.rules.rationalUsFactor.value;
  return {
    value: finite(out.flow(cfs), "peak flow"),
    unit: out.labels.flow,
    c,
    cf: factor.cf,
    cfTimesC: cfc.value,
    intensity: out.intensity(intensity),
    durationMin: governing.tcMin,
    area: out.area(areaAc),
    returnPeriodYears: kase.returnPeriodYears,
    unitFactor,
    unitFactorRule: kase.rules.rationalUsFactor.label,
  };
}

function rulesApplied(kase: InternalCase): RulesApplied {
  const r = kase.rules;
  return {
    minTcMin: r.minTcMin,
    sheetFlowMaxLength: r.sheetCap.label,
    sheetFlowPastCap: r.sheetPastCap,
    overlandSeries: r.overlandSeries,
    sheetFlowSeries: r.sheetFlowSeries,
    kinematicWaveK: {
      value: r.kinematicK.declared,
      label: r.kinematicK.label,
      source: r.kinematicK.source,
    },
    arc: r.arc,
    arcMethod: r.arcMethod,
    lagUsesArc: r.lagUsesArc,
    governing: r.governing,
    frequencyFactor: r.frequencyFactor,
    rationalUsFactor: r.rationalUsFactor.label,
    allowIdfExtrapolation: r.allowIdfExtrapolation,
    lagCn: r.lagCn,
    manningConstant: r.manningConstant.label,
    kirpichAdjustment: r.kirpichAdjustment,
  };
}

export interface ComputeOptions {
  /** Add the sensitivity view and the Monte Carlo band (rules.uncertainty sets the bands). */
  readonly uncertainty?: boolean;
}

/** Computes every method for a parsed input. Throws a HydrologyError for data it cannot serve. */
export function compute(input: ComputeInput, options: ComputeOptions = {}): ComputeResult {
  const kase = toInternalCase(input);
  const out = outputUnits(kase.units);
  const warnings = new WarningList();
  const curve = intensityCurve(kase.idf, kase.returnPeriodYears, {
    allowExtrapolation: kase.rules.allowIdfExtrapolation,
  });
  if (curve.returnPeriodInterpolated) {
    warnings.add({
      code: "idf-return-period-interpolated",
      message: `the ${kase.returnPeriodYears}-year intensities are interpolated in log(T) between tabulated return periods`,
    });
  }
  pathWarnings(kase, out, warnings);
  const ctx: MethodContext = { kase, curve, out, warnings };
  const methods: MethodResults = {
    velocity: velocityMethod(ctx),
    "nrcs-lag": lagMethod(ctx),
    "kinematic-wave": kinematicMethod(ctx),
    "nrcs-segmental": segmentalMethod(ctx),
    kirpich: kirpichCheck(ctx),
    kerby: kerbyCheck(ctx),
    faa: faaCheck(ctx),
    "kerby-kirpich": kerbyKirpichCheck(ctx),
  };
  seriesWarnings(methods, warnings);
  const governing = chooseGoverning(methods, kase.rules.governing, warnings, kase.rules.minTcMin);
  const governed = methods[governing.method];
  if (governed.status === "ok" && governing.tcMin > governed.computedMin) {
    warnings.add({
      code: "min-tc-applied",
      method: governing.method,
      message: `computed Tc ${governed.computedMin.toFixed(2)} min is under the minimum; ${kase.rules.minTcMin} min applies`,
    });
  }
  return {
    units: kase.units,
    unitLabels: out.labels,
    returnPeriodYears: kase.returnPeriodYears,
    rules: rulesApplied(kase),
    methods,
    governing,
    peakFlow: peakFlow(kase, curve, governing, out, warnings),
    warnings: warnings.items,
    caution: CAUTION,
    ...(options.uncertainty === true && { uncertainty: uncertainty(kase, out) }),
  };
}

/** Parses raw JSON-like input and computes; throws a HydrologyError naming the field path. */
export function computeFromJson(raw: unknown, options: ComputeOptions = {}): ComputeResult {
  return compute(parseComputeInput(raw), options);
}
