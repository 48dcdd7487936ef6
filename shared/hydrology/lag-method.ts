/**
 * NRCS lag method over the flow path: the whole-path Tc (length-weighted CN or the
 * subcatchment's CN, the subcatchment's average land slope in percent), with the per-segment
 * sum reported beside it; CN adjusted to the design ARC. Equations in nrcs-lag.ts and arc.ts.
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

export function lagMethod(ctx: MethodContext): Outcome<LagResult> {
  const { kase, out, warnings } = ctx;
  const { rules, watershed } = kase;
  const wCn = watershed.cn;
  const cnOf = (cn: number | undefined) => cn ?? wCn;
  if (rules.lagCn === "watershed" && wCn === undefined) {
    return unavailable("nrcs-lag", SOURCE, "rules.lagCn is watershed but no CN is given", [
      "watershed.cn",
    ]);
  }
  const missing = kase.segments
    .filter((s) => cnOf(s.cn) === undefined)
    .map((s) => `segments[${s.index}].cn`);
  if (rules.lagCn === "path-weighted" && missing.length > 0) {
    return unavailable(
      "nrcs-lag",
      SOURCE,
      "a curve number is needed on every segment (or watershed.cn)",
      [...missing, "watershed.cn"],
    );
  }
  const lengthFt = totalLengthFt(kase.segments);
  const cnArcII =
    rules.lagCn === "watershed" && wCn !== undefined
      ? wCn
      : kase.segments.reduce((s, seg) => s + (cnOf(seg.cn) ?? 0) * seg.lengthFt, 0) / lengthFt;
  const adjust = (cn: number) => adjustCurveNumber(cn, rules.arc, rules.arcMethod);
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
  const segments: SegmentResult[] = kase.segments.map((seg) => {
    const segCn = adjust(
      rules.lagCn === "watershed" && wCn !== undefined ? wCn : (cnOf(seg.cn) ?? cnArcII),
    );
    const tcHr = nrcsLagTcHr({
      flowLengthFt: seg.lengthFt,
      curveNumber: segCn,
      avgSlopePercent: 100 * seg.slopeFtPerFt,
    });
    return segmentResult(seg, "nrcs-lag", { travelTimeMin: minFromHr(tcHr) }, out, segCn);
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
    source: `${SOURCE}; ARC by ${ARC_METHOD_SOURCES[rules.arcMethod]}`,
    status: "ok",
    scope: "whole-path",
    ...totals(minFromHr(nrcsLagTcHr(input)), rules.minTcMin, "nrcs-lag"),
    segments,
    validity: { range: RANGE, outside },
    flowLength: out.length(lengthFt),
    cnArcII,
    cn,
    arc: rules.arc,
    arcMethod: rules.arcMethod,
    avgSlopePercent,
    slopeSource: fromWatershed ? "watershed" : "flow-path",
    lagHr: nrcsLagHr(input),
    segmentSumMin: segments.reduce((s, r) => s + r.travelTimeMin, 0),
  };
}
