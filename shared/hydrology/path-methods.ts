/**
 * The three methods that add travel times segment by segment along the flow path:
 * velocity (V = k·s^0.5, channels by Manning), NRCS segmental (TR-55 sheet flow, shallow
 * concentrated flow, Manning), and kinematic-wave overland flow solved against the IDF curve
 * (shallow and channel segments by velocity and Manning). Equations and sources are in the
 * modules they call.
 */
import type { InternalSegment } from "./case";
import { isHydrologyError } from "./errors";
import {
  KINEMATIC_TOLERANCE_MIN,
  kinematicTravelTimeMin,
  overlandTerm,
  solveKinematicWave,
} from "./kinematic-wave";
import {
  channelTiming,
  kTiming,
  segmentResult,
  sheetCapExcesses,
  sheetSegments,
  totals,
  unavailable,
  type MethodContext,
} from "./method-context";
import { METHOD_LABELS } from "./method-ids";
import type { KinematicResult, MethodOk, Outcome, SegmentResult } from "./result-types";
import { sheetFlowTravelTimeHr } from "./tr55-sheet";
import { minFromHr } from "./units";
import { LOW_SLOPE_FT_PER_FT } from "./warnings";

const VELOCITY_SOURCE =
  "NEH Part 630 Ch 15 (2010) velocity method; Manning's equation (TR-55 eq 3-4)";
const SEGMENTAL_SOURCE =
  "TR-55 (1986) ch 3: eq 3-3 sheet flow, Figure 3-1 shallow flow, eq 3-4 channels";
const KINEMATIC_SOURCE =
  "Kinematic-wave overland flow, tc = K·(nL)^0.6/(i^0.4·S^0.3), solved against the IDF data";

function lowSlopeNotes(ctx: MethodContext): string[] {
  return ctx.kase.segments
    .filter((s) => s.slopeFtPerFt < LOW_SLOPE_FT_PER_FT)
    .map((s) => `segments[${s.index}] slope ${s.slopeFtPerFt} is under 0.001 (0.1 %)`);
}

function capNotes(ctx: MethodContext): string[] {
  const { out } = ctx;
  return sheetCapExcesses(ctx.kase).map(
    (e) =>
      `sheet flow reaches ${out.length(e.cumulativeFt).toPrecision(4)} ${out.labels.length} at ` +
      `segments[${e.index}], past the cap of ${out.length(e.limitFt).toPrecision(4)} ${out.labels.length}`,
  );
}

/** Shallow and channel segments, shared by the three methods. */
function concentrated(segment: InternalSegment, ctx: MethodContext): SegmentResult | undefined {
  if (segment.regime === "shallow") {
    const timing = kTiming(segment.lengthFt, segment.kFtPerS, segment.slopeFtPerFt);
    return segmentResult(segment, "velocity-k", timing, ctx.out);
  }
  if (segment.regime === "channel") {
    const timing = channelTiming(segment, ctx.kase.rules.manningConstant.us);
    return segmentResult(segment, "manning", timing, ctx.out);
  }
  return undefined;
}

function sum(segments: readonly SegmentResult[]): number {
  return segments.reduce((s, r) => s + r.travelTimeMin, 0);
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
  const segments = ctx.kase.segments.map((segment) => {
    if (segment.regime === "sheet") {
      const timing = kTiming(segment.lengthFt, segment.kFtPerS ?? Number.NaN, segment.slopeFtPerFt);
      return segmentResult(segment, "velocity-k", timing, ctx.out);
    }
    return concentrated(segment, ctx) ?? unreachable();
  });
  return {
    id: "velocity",
    label: METHOD_LABELS.velocity,
    kind: "method",
    source: VELOCITY_SOURCE,
    status: "ok",
    scope: "whole-path",
    ...totals(sum(segments), ctx.kase.rules.minTcMin, "velocity"),
    segments,
    validity: {
      range: "upland, shallow concentrated and channel flow; unreliable below 0.1 % slope",
      outside: lowSlopeNotes(ctx),
    },
  };
}

export function segmentalMethod(ctx: MethodContext): Outcome<MethodOk> {
  const { kase } = ctx;
  const p2In = kase.p2In;
  if (p2In === undefined && sheetSegments(kase).length > 0) {
    return unavailable(
      "nrcs-segmental",
      SEGMENTAL_SOURCE,
      "TR-55 sheet flow needs the 2-year 24-hour rainfall depth",
      ["rainfall.p2_24h"],
    );
  }
  const segments = kase.segments.map((segment) => {
    if (segment.regime === "sheet") {
      const hours = sheetFlowTravelTimeHr({
        manningN: segment.sheetN,
        lengthFt: segment.lengthFt,
        p2In: p2In ?? Number.NaN,
        slopeFtPerFt: segment.slopeFtPerFt,
      });
      return segmentResult(segment, "tr55-sheet", { travelTimeMin: minFromHr(hours) }, ctx.out);
    }
    return concentrated(segment, ctx) ?? unreachable();
  });
  const result = totals(sum(segments), kase.rules.minTcMin, "nrcs-segmental");
  const outside = [...lowSlopeNotes(ctx), ...capNotes(ctx)];
  if (result.computedMin < 6 || result.computedMin > 600) {
    outside.push("Tc outside TR-55's 0.1–10 h (TR-55 (1986) limitations) [from memory]");
  }
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
      range: `sheet flow up to ${kase.rules.sheetCap.label}; Tc 0.1–10 h (TR-55 limitations) [from memory]`,
      outside,
    },
  };
}

export function kinematicMethod(ctx: MethodContext): Outcome<KinematicResult> {
  const { kase, curve, out } = ctx;
  const sheets = sheetSegments(kase);
  if (sheets.length === 0) {
    return unavailable(
      "kinematic-wave",
      KINEMATIC_SOURCE,
      "the path has no sheet (overland) segment",
      [],
    );
  }
  const k = kase.rules.kinematicK.us;
  const minTc = kase.rules.minTcMin;
  const terms = new Map(
    sheets.map((s) => [s.index, overlandTerm(s.sheetN, s.lengthFt, s.slopeFtPerFt)]),
  );
  const coefficient = k * [...terms.values()].reduce((a, b) => a + b, 0);
  const range = curve.durationRangeMin;
  const start =
    range === undefined ? Math.max(10, minTc) : Math.min(Math.max(10, minTc, range[0]), range[1]);
  const before = curve.extrapolatedMin.length;
  let solution;
  try {
    // No design storm is shorter than the minimum Tc, so the IDF is read at max(t, minimum).
    solution = solveKinematicWave({
      coefficient,
      intensityAt: (t) => curve.at(Math.max(t, minTc)),
      startMin: start,
    });
  } catch (error) {
    if (!isHydrologyError(error)) throw error;
    return unavailable("kinematic-wave", KINEMATIC_SOURCE, error.message, [error.path]);
  }
  if (curve.extrapolatedMin.length > before) {
    ctx.warnings.add({
      code: "idf-extrapolated",
      method: "kinematic-wave",
      message: "the kinematic-wave solution reads the IDF data beyond the tabulated durations",
    });
  }
  if (solution.solver === "bracketing") {
    ctx.warnings.add({
      code: "kinematic-bracketing",
      method: "kinematic-wave",
      message: "the fixed-point iteration did not settle; the bracketing solver found the root",
    });
  }
  const i = solution.intensityInPerHr;
  const segments = kase.segments.map((segment) => {
    const term = terms.get(segment.index);
    if (segment.regime === "sheet" && term !== undefined) {
      const t = kinematicTravelTimeMin(k, term, i);
      return segmentResult(segment, "kinematic-wave", { travelTimeMin: t }, out);
    }
    return concentrated(segment, ctx) ?? unreachable();
  });
  const overlandMin = segments
    .filter((s) => s.regime === "sheet")
    .reduce((s, r) => s + r.travelTimeMin, 0);
  const outside = [...lowSlopeNotes(ctx), ...capNotes(ctx)];
  if (curve.extrapolatedMin.length > before)
    outside.push("intensity extrapolated beyond the IDF table");
  return {
    id: "kinematic-wave",
    label: METHOD_LABELS["kinematic-wave"],
    kind: "method",
    source: KINEMATIC_SOURCE,
    status: "ok",
    scope: "whole-path",
    ...totals(sum(segments), minTc, "kinematic-wave"),
    segments,
    validity: { range: `overland sheet flow up to ${kase.rules.sheetCap.label}`, outside },
    intensity: out.intensity(i),
    overlandMin,
    k: kase.rules.kinematicK.declared,
    kLabel: kase.rules.kinematicK.label,
    solver: solution.solver,
    toleranceMin: KINEMATIC_TOLERANCE_MIN,
    iterations: solution.iterations.map((it) => ({
      tcMin: it.tcMin,
      intensity: out.intensity(it.intensityInPerHr),
    })),
  };
}

function unreachable(): never {
  throw new Error("Rillmark invariant failed: a segment regime without an equation");
}
