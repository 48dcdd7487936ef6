/**
 * The kinematic-wave method over the flow path: the sheet segments combined by
 * rules.overlandSeries (planes in series by default, overland-series.ts), one intensity for all
 * of them solved against the IDF curve (kinematic-wave.ts); shallow and channel segments by
 * velocity and Manning.
 */
import { isHydrologyError } from "./errors";
import type { IntensityCurve } from "./idf";
import {
  KINEMATIC_TOLERANCE_MIN,
  kinematicTravelTimeMin,
  solveKinematicWave,
  type KinematicSolution,
} from "./kinematic-wave";
import {
  mergeParts,
  segmentResult,
  totals,
  unavailable,
  type MethodContext,
} from "./method-context";
import { METHOD_LABELS } from "./method-ids";
import {
  OVERLAND_SERIES,
  OVERLAND_SERIES_LABELS,
  kinematicTerms,
  type OverlandSeries,
} from "./overland-series";
import { capNotes, concentrated, lowSlopeNotes, planesOf, sumMin } from "./path-methods";
import type { KinematicResult, Outcome } from "./result-types";

const KINEMATIC_SOURCE =
  "Kinematic-wave overland flow, tc = K·(nL)^0.6/(i^0.4·S^0.3), solved against the IDF data";

/** The overland time for a coefficient K·Σterm; the IDF is never read below the minimum Tc. */
export function solveOverland(
  coefficient: number,
  curve: IntensityCurve,
  minTcMin: number,
  record = true,
): KinematicSolution {
  const range = curve.durationRangeMin;
  const start =
    range === undefined
      ? Math.max(10, minTcMin)
      : Math.min(Math.max(10, minTcMin, range[0]), range[1]);
  // No design storm is shorter than the minimum Tc, so the IDF is read at max(t, minimum).
  return solveKinematicWave({
    coefficient,
    intensityAt: (t) => curve.at(Math.max(t, minTcMin)),
    startMin: start,
    record,
  });
}

export function kinematicMethod(ctx: MethodContext): Outcome<KinematicResult> {
  const { kase, curve, out } = ctx;
  const planes = planesOf(kase);
  if (planes.length === 0) {
    return unavailable(
      "kinematic-wave",
      KINEMATIC_SOURCE,
      "the path has no sheet (overland) segment",
      [],
    );
  }
  const k = kase.rules.kinematicK.us;
  const minTc = kase.rules.minTcMin;
  const rule = kase.rules.overlandSeries;
  const terms = kinematicTerms(planes, rule);
  const before = curve.extrapolatedMin.length;
  let solution;
  try {
    solution = solveOverland(k * terms.reduce((a, b) => a + b, 0), curve, minTc);
  } catch (error) {
    if (!isHydrologyError(error)) throw error;
    return unavailable("kinematic-wave", KINEMATIC_SOURCE, error.message, [error.path]);
  }
  const extrapolated = curve.extrapolatedMin.length > before;
  if (extrapolated) {
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
  let j = 0;
  const parts = kase.segments.map((segment) => {
    if (segment.regime !== "sheet") return concentrated(segment, ctx);
    const t = kinematicTravelTimeMin(k, terms[j] ?? Number.NaN, i);
    j += 1;
    return segmentResult(segment, "kinematic-wave", { travelTimeMin: t }, out);
  });
  const segments = mergeParts(kase, parts, out);
  // The overland time is the sum of the sheet rows, so the rows add up to what is reported.
  const overlandMin = parts
    .filter((s) => s.equation === "kinematic-wave")
    .reduce((sum, r) => sum + r.travelTimeMin, 0);
  const computed = sumMin(segments);
  const outside = [...lowSlopeNotes(ctx), ...capNotes(ctx)];
  if (extrapolated) outside.push("intensity extrapolated beyond the IDF table");
  const alternative = (other: OverlandSeries): number | null => {
    const c = k * kinematicTerms(planes, other).reduce((a, b) => a + b, 0);
    try {
      return Math.max(computed - overlandMin + solveOverland(c, curve, minTc).tcMin, minTc);
    } catch (error) {
      if (isHydrologyError(error)) return null;
      throw error;
    }
  };
  const alternatives = OVERLAND_SERIES.filter((o) => o !== rule).flatMap((o) => {
    const totalMin = alternative(o);
    return totalMin === null ? [] : [{ option: o, label: OVERLAND_SERIES_LABELS[o], totalMin }];
  });
  return {
    id: "kinematic-wave",
    label: METHOD_LABELS["kinematic-wave"],
    kind: "method",
    source: KINEMATIC_SOURCE,
    status: "ok",
    scope: "whole-path",
    ...totals(computed, minTc, "kinematic-wave"),
    segments,
    validity: { range: `overland sheet flow up to ${kase.rules.sheetCap.label}`, outside },
    overlandSeries:
      planes.length < 2
        ? null
        : {
            rule: "overlandSeries",
            used: rule,
            usedLabel: OVERLAND_SERIES_LABELS[rule],
            sheetSegments: planes.length,
            alternatives,
          },
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
