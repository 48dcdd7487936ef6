/**
 * The totals of every method for one set of perturbed inputs, without the per-segment report:
 * the inner loop of the sensitivity view and the Monte Carlo (thousands of evaluations). It
 * calls the same equation modules as compute() and follows the same rules (series, minimum Tc,
 * governing choice, frequency factor); kernel.test.ts checks that at the entered values it gives
 * compute()'s totals, governing Tc and peak flow. The sheet-flow cap split stays where the
 * entered values put it.
 */
import { adjustCurveNumber } from "../arc";
import type { InternalCase, InternalSegment } from "../case";
import { isHydrologyError } from "../errors";
import { faaTcMin } from "../faa";
import type { IntensityCurve } from "../idf";
import { kerbyTcMin } from "../kerby";
import { solveOverland } from "../kinematic-method";
import { KIRPICH_FACTORS, kirpichTcMin } from "../kirpich";
import { sectionGeometry } from "../manning";
import { CHECK_METHOD_IDS, METHOD_IDS, TC_METHOD_IDS, type MethodId } from "../method-ids";
import { nrcsLagTcHr } from "../nrcs-lag";
import { kinematicTerms, sheetFlowTimesHr, type Plane } from "../overland-series";
import { cappedCfC, frequencyFactor } from "../rational";
import { minFromHr, type OutputUnits } from "../units";

/** One draw: a factor or a shift per input group (1 and 0 leave the input as entered). */
export interface Draw {
  readonly roughness: number;
  readonly velocityK: number;
  /** −1…1: each slope moves by this share of its band (ratio or √2·σz/L). */
  readonly slopeShare: number;
  readonly p2: number;
  readonly idf: number;
  readonly cnShift: number;
  readonly runoffC: number;
}

export const ENTERED: Draw = {
  roughness: 1,
  velocityK: 1,
  slopeShare: 0,
  p2: 1,
  idf: 1,
  cnShift: 0,
  runoffC: 1,
};

export interface Evaluation {
  /** Tc (min, minimum applied as compute() applies it) by method; NaN where unavailable. */
  readonly tcMin: Float64Array;
  readonly governingMin: number;
  /** Peak flow in the declared units; NaN when it cannot be had. */
  readonly peak: number;
}

const SLOPE_FLOOR = 1e-5;

/** The case prepared once: arrays of segment figures and the section radii. */
export interface KernelModel {
  readonly kase: InternalCase;
  readonly out: OutputUnits;
  readonly curve: IntensityCurve;
  readonly segments: readonly InternalSegment[];
  /** R^(2/3) of each channel segment (NaN elsewhere). */
  readonly radius23: Float64Array;
  /** Band of each segment's slope, as an absolute slope. */
  readonly slopeBand: Float64Array;
  /** The curve the draws read: the model's own, times `scale.idf` (set per draw). */
  readonly scaled: IntensityCurve;
  readonly scale: { idf: number };
}

export function kernelModel(
  kase: InternalCase,
  out: OutputUnits,
  curve: IntensityCurve,
): KernelModel {
  const n = kase.segments.length;
  const radius23 = new Float64Array(n).fill(Number.NaN);
  const slopeBand = new Float64Array(n);
  const { bands } = kase.rules;
  kase.segments.forEach((s, j) => {
    if (s.regime === "channel") {
      radius23[j] = Math.pow(sectionGeometry(s.section).hydraulicRadius, 2 / 3);
    }
    slopeBand[j] =
      bands.verticalAccuracyFt === null
        ? bands.slope * s.slopeFtPerFt
        : (Math.SQRT2 * bands.verticalAccuracyFt) / s.lengthFt;
  });
  const scale = { idf: 1 };
  const scaled: IntensityCurve = { ...curve, at: (t: number) => scale.idf * curve.at(t) };
  return { kase, out, curve, segments: kase.segments, radius23, slopeBand, scaled, scale };
}

const INDEX = new Map(METHOD_IDS.map((id, i) => [id, i]));
const at = (id: MethodId) => INDEX.get(id) ?? -1;

/** Every method's total for one draw; `into` (one slot per method id) is reused if given. */
export function evaluate(
  model: KernelModel,
  d: Draw,
  into: Float64Array = new Float64Array(METHOD_IDS.length),
): Evaluation {
  const { kase, segments } = model;
  const { rules, watershed } = kase;
  const minTc = rules.minTcMin;
  // The model's own curve: what it reads beyond the table is not this draw's warning to keep.
  model.curve.extrapolatedMin.length = 0;
  const tc = into.fill(Number.NaN);
  model.scale.idf = d.idf;
  const curve = model.scaled;
  const planes: Plane[] = [];
  let concentratedMin = 0;
  let sheetVelocityMin = 0;
  let velocityOk = true;
  let kerbyOk = true;
  let totalFt = 0;
  let fallFt = 0;
  let sheetFt = 0;
  let sheetFall = 0;
  let sheetNL = 0;
  let channelFt = 0;
  let channelFall = 0;
  for (let j = 0; j < segments.length; j += 1) {
    const s = segments[j] as InternalSegment;
    const slope = Math.max(s.slopeFtPerFt + d.slopeShare * (model.slopeBand[j] ?? 0), SLOPE_FLOOR);
    totalFt += s.lengthFt;
    fallFt += s.lengthFt * slope;
    if (s.regime === "sheet") {
      planes.push({ n: s.sheetN * d.roughness, lengthFt: s.lengthFt, slopeFtPerFt: slope });
      if (s.kFtPerS === undefined) velocityOk = false;
      else sheetVelocityMin += s.lengthFt / (s.kFtPerS * d.velocityK * Math.sqrt(slope)) / 60;
      if (s.kerbyN === undefined) kerbyOk = false;
      else sheetNL += s.kerbyN * d.roughness * s.lengthFt;
      sheetFt += s.lengthFt;
      sheetFall += s.lengthFt * slope;
      continue;
    }
    channelFt += s.lengthFt;
    channelFall += s.lengthFt * slope;
    const v =
      s.regime === "shallow"
        ? s.kFtPerS * d.velocityK * Math.sqrt(slope)
        : (rules.manningConstant.us / (s.manningN * d.roughness)) *
          (model.radius23[j] ?? Number.NaN) *
          Math.sqrt(slope);
    concentratedMin += s.lengthFt / v / 60;
  }
  const whole = (id: MethodId, computed: number) => {
    tc[at(id)] = Math.max(computed, minTc);
  };
  if (velocityOk) whole("velocity", sheetVelocityMin + concentratedMin);
  const p2 = kase.p2In === undefined ? undefined : kase.p2In * d.p2;
  if (planes.length === 0) whole("nrcs-segmental", concentratedMin);
  else if (p2 !== undefined) {
    const hr = sheetFlowTimesHr(planes, p2, rules.sheetFlowSeries).reduce((a, b) => a + b, 0);
    whole("nrcs-segmental", minFromHr(hr) + concentratedMin);
  }
  if (planes.length > 0) {
    const c = kinematicTerms(planes, rules.overlandSeries).reduce((a, b) => a + b, 0);
    try {
      const coefficient = rules.kinematicK.us * c;
      const solution = solveOverland(coefficient, curve, minTc, false);
      // As compute() reports it: the rows' sum at the solved intensity.
      const overland = coefficient / Math.pow(solution.intensityInPerHr, 0.4);
      whole("kinematic-wave", overland + concentratedMin);
    } catch (error) {
      if (!isHydrologyError(error)) throw error;
    }
  }
  const lag = lagTcMin(kase, d, totalFt, fallFt);
  if (lag !== null) whole("nrcs-lag", lag);
  whole(
    "kirpich",
    KIRPICH_FACTORS[rules.kirpichAdjustment] * kirpichTcMin(totalFt, fallFt / totalFt),
  );
  if (planes.length > 0 && kerbyOk) {
    const kerby = kerbyTcMin(sheetFt, sheetNL / sheetFt, sheetFall / sheetFt);
    tc[at("kerby")] = kerby;
    const channel = channelFt > 0 ? kirpichTcMin(channelFt, channelFall / channelFt) : 0;
    whole("kerby-kirpich", kerby + channel);
  }
  const c = watershed.c === undefined ? undefined : Math.min(1, watershed.c * d.runoffC);
  if (planes.length > 0 && c !== undefined) {
    tc[at("faa")] = faaTcMin(c, sheetFt, (100 * sheetFall) / sheetFt);
  }
  const governingMin = governing(tc, rules.governing, minTc);
  return { tcMin: tc, governingMin, peak: peak(model, curve, governingMin, c) };
}

function lagTcMin(kase: InternalCase, d: Draw, totalFt: number, fallFt: number): number | null {
  const { rules, watershed } = kase;
  const shift = (cn: number) => Math.min(100, Math.max(1, cn + d.cnShift));
  let cnII: number;
  if (rules.lagCn === "watershed" && watershed.cn !== undefined) cnII = shift(watershed.cn);
  else {
    if (rules.lagCn === "watershed" && !rules.lagCnDefaulted) return null;
    let weighted = 0;
    for (const s of kase.segments) {
      const cn = s.cn ?? watershed.cn;
      if (cn === undefined) return null;
      weighted += shift(cn) * s.lengthFt;
    }
    cnII = weighted / totalFt;
  }
  const cn = rules.lagUsesArc ? adjustCurveNumber(cnII, rules.arc, rules.arcMethod) : cnII;
  // The land slope moves with the slope band as a ratio (no per-segment length to apply σz to).
  const landSlope =
    watershed.avgSlopePercent === undefined
      ? (100 * fallFt) / totalFt
      : watershed.avgSlopePercent * Math.max(1 + d.slopeShare * rules.bands.slope, 1e-3);
  return minFromHr(
    nrcsLagTcHr({ flowLengthFt: totalFt, curveNumber: cn, avgSlopePercent: landSlope }),
  );
}

/** chooseGoverning's rule on bare numbers (governing.ts gives the reasons). */
function governing(tc: Float64Array, choice: string, minTc: number): number {
  const pick = (ids: readonly MethodId[], largest: boolean) => {
    let best = Number.NaN;
    for (const id of ids) {
      const v = tc[at(id)] ?? Number.NaN;
      if (Number.isNaN(v)) continue;
      if (Number.isNaN(best) || (largest ? v > best : v < best)) best = v;
    }
    return best;
  };
  const extreme = (largest: boolean) => {
    const v = pick(TC_METHOD_IDS, largest);
    return Number.isNaN(v) ? pick(CHECK_METHOD_IDS, largest) : v;
  };
  if (choice === "largest" || choice === "smallest") return extreme(choice === "largest");
  const named = tc[at(choice as MethodId)] ?? Number.NaN;
  if (Number.isNaN(named)) return extreme(false);
  return choice === "kerby" || choice === "faa" ? Math.max(named, minTc) : named;
}

function peak(
  model: KernelModel,
  curve: IntensityCurve,
  governingMin: number,
  c: number | undefined,
): number {
  const { kase, out } = model;
  const area = kase.watershed.areaAc;
  if (area === undefined || c === undefined || Number.isNaN(governingMin)) return Number.NaN;
  let intensity: number;
  try {
    intensity = curve.at(governingMin);
  } catch (error) {
    if (isHydrologyError(error)) return Number.NaN;
    throw error;
  }
  const cf = kase.rules.frequencyFactor ? frequencyFactor(kase.returnPeriodYears).cf : 1;
  const cfs = cappedCfC(cf, c).value * intensity * area * kase.rules.rationalUsFactor.value;
  return out.flow(cfs);
}
