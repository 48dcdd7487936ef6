/**
 * What every method needs while it computes: the internal case, the design intensity curve,
 * the output converter and the warning list; and the helpers they share (per-segment velocity
 * and Manning timings, the minimum Tc, the sheet-flow length cap).
 */
import type { InternalCase, InternalSegment } from "./case";
import { finite } from "./errors";
import type { IntensityCurve } from "./idf";
import { manningVelocity, sectionGeometry } from "./manning";
import { METHOD_LABELS, isCheckMethod, type MethodId } from "./method-ids";
import type { MethodUnavailable, SegmentEquation, SegmentResult } from "./result-types";
import { mcCuenSpiessMaxLengthFt } from "./tr55-sheet";
import { hrFromMin, type OutputUnits } from "./units";
import { travelTimeMin, velocityFromK } from "./velocity";
import type { WarningList } from "./warnings";

export interface MethodContext {
  readonly kase: InternalCase;
  readonly curve: IntensityCurve;
  readonly out: OutputUnits;
  readonly warnings: WarningList;
}

export interface Timing {
  readonly travelTimeMin: number;
  readonly velocityFtPerS?: number;
  readonly geometry?: { flowArea: number; wettedPerimeter: number; hydraulicRadius: number };
}

/** V = k·s^0.5 on a sheet or shallow segment with a k. */
export function kTiming(lengthFt: number, kFtPerS: number, slopeFtPerFt: number): Timing {
  const velocityFtPerS = velocityFromK(kFtPerS, slopeFtPerFt);
  return { travelTimeMin: travelTimeMin(lengthFt, velocityFtPerS), velocityFtPerS };
}

export function channelTiming(
  segment: Extract<InternalSegment, { regime: "channel" }>,
  manningConstant: number,
): Timing {
  const geometry = sectionGeometry(segment.section);
  const velocityFtPerS = manningVelocity(
    manningConstant,
    segment.manningN,
    geometry.hydraulicRadius,
    segment.slopeFtPerFt,
  );
  return {
    travelTimeMin: travelTimeMin(segment.lengthFt, velocityFtPerS),
    velocityFtPerS,
    geometry,
  };
}

export function segmentResult(
  segment: InternalSegment,
  equation: SegmentEquation,
  timing: Timing,
  out: OutputUnits,
  cn?: number,
): SegmentResult {
  const what = `segments[${segment.index}]`;
  const t = finite(timing.travelTimeMin, `${what} travel time`);
  // Built by assignment, not spreads: V8 builds spread objects slowly and paths can be long.
  const result: {
    -readonly [K in keyof SegmentResult]: SegmentResult[K];
  } = {
    index: segment.index,
    regime: segment.regime,
    equation,
    travelTimeMin: t,
    travelTimeHr: hrFromMin(t),
  };
  if (timing.velocityFtPerS !== undefined) {
    result.velocity = finite(out.velocity(timing.velocityFtPerS), `${what} velocity`);
  }
  const g = timing.geometry;
  if (g !== undefined) {
    result.flowArea = out.flowArea(g.flowArea);
    result.wettedPerimeter = out.length(g.wettedPerimeter);
    result.hydraulicRadius = out.length(g.hydraulicRadius);
  }
  if (cn !== undefined) result.cn = cn;
  return result;
}

/**
 * One result per input segment, in input order: the parts of a sheet segment cut at the
 * sheet-flow cap (case.ts) are added up, the time past the cap kept beside the total.
 * `parts[i]` is the result of `kase.segments[i]`.
 */
export function mergeParts(
  kase: InternalCase,
  parts: readonly SegmentResult[],
  out: OutputUnits,
): SegmentResult[] {
  if (kase.capSplits.length === 0) return [...parts];
  const merged: SegmentResult[] = [];
  let lengthFt = 0;
  for (let i = 0; i < parts.length; i += 1) {
    const part = parts[i] as SegmentResult;
    const seg = kase.segments[i] as InternalSegment;
    const last = merged[merged.length - 1];
    if (last === undefined || last.index !== part.index) {
      lengthFt = seg.lengthFt;
      merged.push(seg.pastCap ? { ...part, pastCapMin: part.travelTimeMin } : part);
      continue;
    }
    lengthFt += seg.lengthFt;
    const t = last.travelTimeMin + part.travelTimeMin;
    const both: { -readonly [K in keyof SegmentResult]: SegmentResult[K] } = {
      ...last,
      travelTimeMin: t,
      travelTimeHr: hrFromMin(t),
      pastCapMin: (last.pastCapMin ?? 0) + (seg.pastCap ? part.travelTimeMin : 0),
    };
    if (last.velocity !== undefined && part.velocity !== undefined) {
      both.velocity = out.length(lengthFt) / (t * 60);
    } else delete both.velocity;
    merged[merged.length - 1] = both;
  }
  return merged;
}

export function totals(computedMin: number, minTcMin: number, what: string) {
  const computed = finite(computedMin, `${what} Tc`);
  const totalMin = Math.max(computed, minTcMin);
  return {
    computedMin: computed,
    totalMin,
    totalHr: hrFromMin(totalMin),
    minimumApplied: computed < minTcMin,
  };
}

export function unavailable(
  id: MethodId,
  source: string,
  reason: string,
  fields: string[],
): MethodUnavailable {
  return {
    id,
    label: METHOD_LABELS[id],
    kind: isCheckMethod(id) ? "check" : "method",
    source,
    status: "unavailable",
    reason,
    fields,
  };
}

export function sheetSegments(kase: InternalCase) {
  return kase.segments.filter(
    (s): s is Extract<InternalSegment, { regime: "sheet" }> => s.regime === "sheet",
  );
}

export interface CapExcess {
  readonly index: number;
  readonly cumulativeFt: number;
  readonly limitFt: number;
}

/**
 * Sheet segments where the sheet flow length so far passes the design cap (only with
 * rules.sheetFlowPastCap = "warn"; the other rules leave no sheet flow past the cap).
 */
export function sheetCapExcesses(kase: InternalCase): CapExcess[] {
  const cap = kase.rules.sheetCap;
  let cumulativeFt = 0;
  const out: CapExcess[] = [];
  for (const s of sheetSegments(kase)) {
    cumulativeFt += s.lengthFt;
    const limitFt =
      cap.kind === "length" ? cap.lengthFt : mcCuenSpiessMaxLengthFt(s.slopeFtPerFt, s.sheetN);
    if (cumulativeFt > limitFt * (1 + 1e-12)) out.push({ index: s.index, cumulativeFt, limitFt });
  }
  return out;
}

/** Fall over length of a set of segments: Σ s·L / Σ L. */
export function averageSlope(segments: readonly InternalSegment[]): number {
  let fall = 0;
  let length = 0;
  for (const s of segments) {
    fall += s.slopeFtPerFt * s.lengthFt;
    length += s.lengthFt;
  }
  return fall / length;
}

export function totalLengthFt(segments: readonly InternalSegment[]): number {
  return segments.reduce((sum, s) => sum + s.lengthFt, 0);
}
