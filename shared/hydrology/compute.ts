/**
 * The orchestrator: input → every method's segment times and Tc, the warnings, the governing
 * Tc with its reason, and the rational-method peak flow. Pure: no I/O, same input → same output.
 * Computes in US customary units inside (case.ts) and reports in the declared system.
 */
import { toInternalCase, type InternalCase } from "./case";
import { faaCheck, kerbyCheck, kirpichCheck } from "./check-methods";
import { finite, isHydrologyError } from "./errors";
import { chooseGoverning } from "./governing";
import { intensityCurve, type IntensityCurve } from "./idf";
import { parseComputeInput, type ComputeInput } from "./input-schema";
import { lagMethod } from "./lag-method";
import { sheetCapExcesses, type MethodContext } from "./method-context";
import { kinematicMethod, segmentalMethod, velocityMethod } from "./path-methods";
import { cappedCfC, frequencyFactor, rationalPeakCfs } from "./rational";
import {
  CAUTION,
  type ComputeResult,
  type Governing,
  type MethodResults,
  type PeakFlow,
  type RulesApplied,
} from "./result-types";
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
  for (const e of sheetCapExcesses(kase)) {
    warnings.add({
      code: "sheet-too-long",
      segmentIndex: e.index,
      message:
        `sheet flow length ${out.length(e.cumulativeFt).toPrecision(4)} ${out.labels.length} is past ` +
        `the cap of ${out.length(e.limitFt).toPrecision(4)} ${out.labels.length} (${kase.rules.sheetCap.label})`,
    });
  }
  const k = kase.rules.kinematicK;
  if (k.suspicious) {
    warnings.add({
      code: "kinematic-k-units",
      method: "kinematic-wave",
      message: `kinematic-wave K ${k.declared} looks like a value for the other unit system`,
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
  return {
    value: finite(out.flow(rationalPeakCfs(cfc.value, intensity, areaAc)), "peak flow"),
    unit: out.labels.flow,
    c,
    cf: factor.cf,
    cfTimesC: cfc.value,
    intensity: out.intensity(intensity),
    durationMin: governing.tcMin,
    area: out.area(areaAc),
    returnPeriodYears: kase.returnPeriodYears,
  };
}

function rulesApplied(kase: InternalCase): RulesApplied {
  const r = kase.rules;
  return {
    minTcMin: r.minTcMin,
    sheetFlowMaxLength: r.sheetCap.label,
    kinematicWaveK: {
      value: r.kinematicK.declared,
      label: r.kinematicK.label,
      source: r.kinematicK.source,
    },
    arc: r.arc,
    arcMethod: r.arcMethod,
    governing: r.governing,
    frequencyFactor: r.frequencyFactor,
    allowIdfExtrapolation: r.allowIdfExtrapolation,
    lagCn: r.lagCn,
    manningConstant: r.manningConstant.label,
  };
}

/** Computes every method for a parsed input. Throws a HydrologyError for data it cannot serve. */
export function compute(input: ComputeInput): ComputeResult {
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
  };
  const governing = chooseGoverning(methods, kase.rules.governing, warnings);
  const governed = methods[governing.method];
  if (governed.status === "ok" && governed.minimumApplied) {
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
  };
}

/** Parses raw JSON-like input and computes; throws a HydrologyError naming the field path. */
export function computeFromJson(raw: unknown): ComputeResult {
  return compute(parseComputeInput(raw));
}
