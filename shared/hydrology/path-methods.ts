/**
 * The methods that add travel times segment by segment along the flow path: velocity
 * (V = k·s^0.5, channels by Manning) and the NRCS segmental method (TR-55 sheet flow over the
 * sheet segments combined by rules.sheetFlowSeries, shallow concentrated flow, Manning). The
 * kinematic-wave method is in kinematic-method.ts. Equations and sources are in the modules
 * they call.
 */
import type { InternalCase, InternalSegment } from "./case";
import {
  channelTiming,
  kTiming,
  mergeParts,
  segmentResult,
  sheetCapExcesses,
  sheetSegments,
  totals,
  unavailable,
  type MethodContext,
} from "./method-context";
import { METHOD_LABELS } from "./method-ids";
import {
  SHEET_FLOW_SERIES,
  SHEET_FLOW_SERIES_LABELS,
  sheetFlowTimesHr,
  type Plane,
  type SheetFlowSeries,
} from "./overland-series";
import type { MethodOk, Outcome, SegmentalResult, SegmentResult } from "./result-types";
import { minFromHr } from "./units";
import { LOW_SLOPE_FT_PER_FT } from "./warnings";

const VELOCITY_SOURCE =
  "NEH Part 630 Ch 15 (2010) velocity method; Manning's equation (TR-55 eq 3-4)";
const SEGMENTAL_SOURCE =
  "TR-55 (1986) ch 3: eq 3-3 sheet flow, Figure 3-1 shallow flow, eq 3-4 channels";

export function lowSlopeNotes(ctx: MethodContext): string[] {
  return ctx.kase.segments
    .filter((s) => s.slopeFtPerFt < LOW_SLOPE_FT_PER_FT)
    .map((s) => `segments[${s.index}] slope ${s.slopeFtPerFt} is under 0.001 (0.1 %)`);
}

export function capNotes(ctx: MethodContext): string[] {
  const { out } = ctx;
  return sheetCapExcesses(ctx.kase).map(
    (e) =>
      `sheet flow reaches ${out.length(e.cumulativeFt).toPrecision(4)} ${out.labels.length} at ` +
      `segments[${e.index}], past the cap of ${out.length(e.limitFt).toPrecision(4)} ${out.labels.length}`,
  );
}

/** Shallow and channel segments, shared by the path methods. */
export function concentrated(segment: InternalSegment, ctx: MethodContext): SegmentResult {
  if (segment.regime === "shallow") {
    const timing = kTiming(segment.lengthFt, segment.kFtPerS, segment.slopeFtPerFt);
    return segmentResult(segment, "velocity-k", timing, ctx.out);
  }
  if (segment.regime === "channel") {
    const timing = channelTiming(segment, ctx.kase.rules.manningConstant.us);
    return segmentResult(segment, "manning", timing, ctx.out);
  }
  throw new Error("Rillmark invariant failed: a sheet segment passed as concentrated flow");
}

export function sumMin(segments: readonly SegmentResult[]): number {
  return segments.reduce((s, r) => s + r.travelTimeMin, 0);
}

export function planesOf(kase: InternalCase): Plane[] {
  return sheetSegments(kase).map((s) => ({
    n: s.sheetN,
    lengthFt: s.lengthFt,
    slopeFtPerFt: s.slopeFtPerFt,
  }));
}

export function velocityMethod(ctx: MethodContext): Outcome<MethodOk> {
  const missing = sheetSegments(ctx.kase)
    .filter((s) => s.kFtPerS === undefined)
    .map((s) => `segments[${s.index}].k`);
  if (missing.length > 0) {
    return unavailable(
      "velocity",
      VELOCITY_SOURCE,
      "every sheet segment needs a velocity coefficient k",
      missing,
    );
  }
  const parts = ctx.kase.segments.map((segment) => {
    if (segment.regime === "sheet") {
      const timing = kTiming(segment.lengthFt, segment.kFtPerS ?? Number.NaN, segment.slopeFtPerFt);
      return segmentResult(segment, "velocity-k", timing, ctx.out);
    }
    return concentrated(segment, ctx);
  });
  const segments = mergeParts(ctx.kase, parts, ctx.out);
  return {
    id: "velocity",
    label: METHOD_LABELS.velocity,
    kind: "method",
    source: VELOCITY_SOURCE,
    status: "ok",
    scope: "whole-path",
    ...totals(sumMin(segments), ctx.kase.rules.minTcMin, "velocity"),
    segments,
    validity: {
      range: "upland, shallow concentrated and channel flow; unreliable below 0.1 % slope",
      outside: lowSlopeNotes(ctx),
    },
  };
}

export function segmentalMethod(ctx: MethodContext): Outcome<SegmentalResult> {
  const { kase } = ctx;
  const p2In = kase.p2In;
  const planes = planesOf(kase);
  if (p2In === undefined && planes.length > 0) {
    return unavailable(
      "nrcs-segmental",
      SEGMENTAL_SOURCE,
      "TR-55 sheet flow needs the 2-year 24-hour rainfall depth",
      ["rainfall.p2_24h"],
    );
  }
  const rule = kase.rules.sheetFlowSeries;
  const p2 = p2In ?? Number.NaN;
  const sheetHr = planes.length > 0 ? sheetFlowTimesHr(planes, p2, rule) : [];
  let j = 0;
  const parts = kase.segments.map((segment) => {
    if (segment.regime !== "sheet") return concentrated(segment, ctx);
    const hours = sheetHr[j] ?? Number.NaN;
    j += 1;
    return segmentResult(segment, "tr55-sheet", { travelTimeMin: minFromHr(hours) }, ctx.out);
  });
  const segments = mergeParts(kase, parts, ctx.out);
  const minTc = kase.rules.minTcMin;
  const result = totals(sumMin(segments), minTc, "nrcs-segmental");
  const outside = [...lowSlopeNotes(ctx), ...capNotes(ctx)];
  if (result.computedMin < 6 || result.computedMin > 600) {
    outside.push("Tc outside TR-55's 0.1–10 h (TR-55 (1986) limitations)");
  }
  const concentratedMin = result.computedMin - minFromHr(sheetHr.reduce((a, b) => a + b, 0));
  const alternatives = (other: SheetFlowSeries) => {
    const hr = sheetFlowTimesHr(planes, p2, other).reduce((a, b) => a + b, 0);
    return Math.max(concentratedMin + minFromHr(hr), minTc);
  };
  return {
    id: "nrcs-segmental",
    label: METHOD_LABELS["nrcs-segmental"],
    kind: "method",
    source: SEGMENTAL_SOURCE,
    status: "ok",
    scope: "whole-path",
    ...result,
    segments,
    validity: {
      range: `sheet flow up to ${kase.rules.sheetCap.label}; Tc 0.1–10 h (TR-55 limitations)`,
      outside,
    },
    overlandSeries:
      planes.length < 2
        ? null
        : {
            rule: "sheetFlowSeries",
            used: rule,
            usedLabel: SHEET_FLOW_SERIES_LABELS[rule],
            sheetSegments: planes.length,
            alternatives: SHEET_FLOW_SERIES.filter((o) => o !== rule).map((o) => ({
              option: o,
              label: SHEET_FLOW_SERIES_LABELS[o],
              totalMin: alternatives(o),
            })),
          },
  };
}
