/**
 * NRCS lag method over the flow path: the whole-path Tc with the subcatchment's area-weighted
 * CN (TR-55 Worksheet 2 practice; rules.lagCn "path-weighted" takes the length-weighted segment
 * CN instead) and the subcatchment's average land slope in percent. The lag equation uses CN as
 * a retardance index for ARC II: the design ARC reaches it only when rules.lagUsesArc is on,
 * with a warning. The lag of each segment alone is reported too; those times are NOT additive
 * (the equation is not linear in length) and no total is made of them.
 */
import { adjustCurveNumber, ARC_METHOD_SOURCES } from "./arc";
import {
  averageSlope,
  segmentResult,
  totalLengthFt,
  totals,
  unavailable,
  type MethodContext,
} from "./method-context";
import { METHOD_LABELS } from "./method-ids";
import {
  LAG_AREA_MIN_AC,
  LAG_AREA_TYPICAL_MAX_AC,
  LAG_CN_MAX,
  LAG_CN_MIN,
  nrcsLagHr,
  nrcsLagTcHr,
} from "./nrcs-lag";
import type { LagResult, Outcome, SegmentResult } from "./result-types";
import { minFromHr } from "./units";

const SOURCE =
  "NEH Part 630 Ch 15 (2010) lag method: Lag = ℓ^0.8(S+1)^0.7/(1900·Y^0.5), Tc = Lag/0.6";
const RANGE =
  "developed on 24 watersheds of 1.3 ac to 9.2 mi², most under 2,000 ac (NEH 630 Ch 15); " +
  "CN 50–95 (common practice)";

/** Input segments (parts of a segment cut at the sheet cap rejoined): length, fall, CN. */
function wholeSegments(ctx: MethodContext) {
  const out: Array<{ index: number; lengthFt: number; fallFt: number; cn: number | undefined }> =
    [];
  for (const s of ctx.kase.segments) {
    const last = out[out.length - 1];
    if (last !== undefined && last.index === s.index) {
      last.lengthFt += s.lengthFt;
      last.fallFt += s.lengthFt * s.slopeFtPerFt;
    } else {
      out.push({
        index: s.index,
        lengthFt: s.lengthFt,
        fallFt: s.lengthFt * s.slopeFtPerFt,
        cn: s.cn,
      });
    }
  }
  return out;
}

export function lagMethod(ctx: MethodContext): Outcome<LagResult> {
  const { kase, out, warnings } = ctx;
  const { rules, watershed } = kase;
  const wCn = watershed.cn;
  let lagCn = rules.lagCn;
  if (lagCn === "watershed" && wCn === undefined) {
    if (!rules.lagCnDefaulted) {
      return unavailable("nrcs-lag", SOURCE, "rules.lagCn is watershed but no CN is given", [
        "watershed.cn",
      ]);
    }
    lagCn = "path-weighted";
  }
  const cnOf = (cn: number | undefined) => cn ?? wCn;
  const segmentsIn = wholeSegments(ctx);
  const missing = segmentsIn
    .filter((s) => cnOf(s.cn) === undefined)
    .map((s) => `segments[${s.index}].cn`);
  if (lagCn === "path-weighted" && missing.length > 0) {
    return unavailable(
      "nrcs-lag",
      SOURCE,
      "a curve number is needed on every segment (or watershed.cn)",
      [...missing, "watershed.cn"],
    );
  }
  if (lagCn !== rules.lagCn) {
    warnings.add({
      code: "lag-cn-from-path",
      method: "nrcs-lag",
      message:
        "watershed.cn is not given: the length-weighted CN of the path's segments stands in for " +
        "the subcatchment's area-weighted CN",
    });
  }
  const lengthFt = totalLengthFt(kase.segments);
  const cnArcII =
    lagCn === "watershed" && wCn !== undefined
      ? wCn
      : segmentsIn.reduce((s, seg) => s + (cnOf(seg.cn) ?? 0) * seg.lengthFt, 0) / lengthFt;
  const arcApplied = rules.lagUsesArc && rules.arc !== "II";
  const adjust = (value: number) =>
    rules.lagUsesArc ? adjustCurveNumber(value, rules.arc, rules.arcMethod) : value;
  if (arcApplied) {
    warnings.add({
      code: "lag-arc-applied",
      method: "nrcs-lag",
      message:
        `the lag equation's CN is adjusted to ARC ${rules.arc} (rules.lagUsesArc): not standard ` +
        "practice, the lag equation takes CN as a retardance index for ARC II",
    });
  }
  const cn = adjust(cnArcII);
  const fromWatershed = watershed.avgSlopePercent !== undefined;
  const avgSlopePercent = watershed.avgSlopePercent ?? 100 * averageSlope(kase.segments);
  if (!fromWatershed) {
    warnings.add({
      code: "lag-slope-from-path",
      method: "nrcs-lag",
      message:
        "watershed.avgSlopePercent is not given: the flow path's average slope stands in for the " +
        "subcatchment's average land slope",
    });
  }
  const input = { flowLengthFt: lengthFt, curveNumber: cn, avgSlopePercent };
  const segments: SegmentResult[] = segmentsIn.map((seg) => {
    const segCn = adjust(
      lagCn === "watershed" && wCn !== undefined ? wCn : (cnOf(seg.cn) ?? cnArcII),
    );
    const tcHr = nrcsLagTcHr({
      flowLengthFt: seg.lengthFt,
      curveNumber: segCn,
      avgSlopePercent: (100 * seg.fallFt) / seg.lengthFt,
    });
    const at = kase.segments.find((s) => s.index === seg.index);
    if (at === undefined) throw new Error("Rillmark invariant failed: a segment without parts");
    const r = segmentResult(at, "nrcs-lag", { travelTimeMin: minFromHr(tcHr) }, out, segCn);
    return r;
  });
  const outside: string[] = [];
  if (cn < LAG_CN_MIN || cn > LAG_CN_MAX) {
    const message = `CN ${cn.toFixed(1)} is outside 50–95 (common practice for the lag equation)`;
    outside.push(message);
    warnings.add({ code: "cn-range", method: "nrcs-lag", message });
  }
  const areaAc = watershed.areaAc;
  if (areaAc !== undefined && (areaAc < LAG_AREA_MIN_AC || areaAc > LAG_AREA_TYPICAL_MAX_AC)) {
    const unit = out.labels.area;
    const message =
      `area ${out.area(areaAc).toPrecision(4)} ${unit} is outside the lag method's range ` +
      `(${out.area(LAG_AREA_MIN_AC).toPrecision(3)}–${out.area(LAG_AREA_TYPICAL_MAX_AC).toPrecision(4)} ${unit})`;
    outside.push(message);
    warnings.add({ code: "lag-area-range", method: "nrcs-lag", message });
  }
  return {
    id: "nrcs-lag",
    label: METHOD_LABELS["nrcs-lag"],
    kind: "method",
    source: rules.lagUsesArc ? `${SOURCE}; ARC by ${ARC_METHOD_SOURCES[rules.arcMethod]}` : SOURCE,
    status: "ok",
    scope: "whole-path",
    ...totals(minFromHr(nrcsLagTcHr(input)), rules.minTcMin, "nrcs-lag"),
    segments,
    validity: { range: RANGE, outside },
    flowLength: out.length(lengthFt),
    cnSource: lagCn,
    cnArcII,
    cn,
    arc: rules.lagUsesArc ? rules.arc : "II",
    arcMethod: rules.arcMethod,
    arcApplied,
    avgSlopePercent,
    slopeSource: fromWatershed ? "watershed" : "flow-path",
    lagHr: nrcsLagHr(input),
    segmentTimesAdditive: false,
    segmentSumMin: segments.reduce((s, r) => s + r.travelTimeMin, 0),
  };
}
