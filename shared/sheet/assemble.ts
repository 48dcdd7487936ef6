/**
 * Puts the travel-time sheet together from its rows and the engineering core's result: each
 * row gets its travel time by every method and its warnings, each method its total and validity,
 * and the sheet its governing Tc and peak flow. When any row cannot be computed the methods are
 * reported unavailable with the reason (never a partial Tc that would understate the path).
 */
import { METHOD_IDS, METHOD_LABELS, isCheckMethod, type MethodId } from "../hydrology/method-ids";
import { CAUTION, type ComputeResult } from "../hydrology/result-types";
import type { SheetMethod, SheetSegment, SheetWarning, TravelTimeSheet } from "../schemas/sheet";

export type SheetFrame = Omit<
  TravelTimeSheet,
  "segments" | "methods" | "governing" | "peakFlow" | "warnings" | "problems" | "rules" | "caution"
>;

function unavailable(id: MethodId, reason: string): SheetMethod {
  return {
    id,
    label: METHOD_LABELS[id],
    kind: isCheckMethod(id) ? "check" : "method",
    source: "",
    status: "unavailable",
    scope: null,
    computedMin: null,
    totalMin: null,
    totalHr: null,
    minimumApplied: false,
    reason,
    validity: null,
  };
}

function methodRow(result: ComputeResult, id: MethodId): SheetMethod {
  const m = result.methods[id];
  if (m.status === "unavailable") return { ...unavailable(id, m.reason), source: m.source };
  const series =
    (m.id === "kinematic-wave" || m.id === "nrcs-segmental") && "overlandSeries" in m
      ? m.overlandSeries
      : null;
  const band = result.uncertainty?.monteCarlo.methods[id] ?? null;
  return {
    id,
    label: m.label,
    kind: m.kind,
    source: m.source,
    status: "ok",
    scope: m.scope,
    computedMin: m.computedMin,
    totalMin: m.totalMin,
    totalHr: m.totalHr,
    minimumApplied: m.minimumApplied,
    reason: null,
    validity: { range: m.validity.range, outside: [...m.validity.outside] },
    overlandSeries: series && {
      ...series,
      alternatives: series.alternatives.map((a) => ({ ...a })),
    },
    ...(result.uncertainty !== undefined && { band: band && { ...band } }),
  };
}

/** The sensitivity view and Monte Carlo band of the governing Tc and peak flow. */
function uncertaintyOf(result: ComputeResult): TravelTimeSheet["uncertainty"] {
  const u = result.uncertainty;
  if (u === undefined) return undefined;
  const point = (p: { tcMin: number | null; peak: number | null }) => ({ ...p });
  return {
    sensitivity: {
      entered: point(u.sensitivity.entered),
      bars: u.sensitivity.bars.map((b) => ({
        input: b.input,
        label: b.label,
        band: b.band,
        low: point(b.low),
        high: point(b.high),
      })),
    },
    monteCarlo: {
      draws: u.monteCarlo.draws,
      seed: u.monteCarlo.seed,
      distribution: u.monteCarlo.distribution,
      governingTcMin: u.monteCarlo.governingTcMin && { ...u.monteCarlo.governingTcMin },
      peak: u.monteCarlo.peak && { ...u.monteCarlo.peak },
    },
  };
}

/**
 * Rows with times and warnings; the core's segment index is the row index. The lag method's
 * per-segment figures are left out: each is a segment's lag alone and they do not add up to the
 * method's Tc, so a column of them would invite a wrong total.
 */
function fillRows(rows: readonly SheetSegment[], result: ComputeResult): SheetSegment[] {
  const out = rows.map((r) => ({ ...r, timesMin: { ...r.timesMin }, warnings: [...r.warnings] }));
  for (const id of METHOD_IDS) {
    const m = result.methods[id];
    if (m.status !== "ok" || id === "nrcs-lag") continue;
    for (const s of m.segments) {
      const row = out[s.index];
      if (!row) continue;
      row.timesMin[id] = s.travelTimeMin;
      if (id === "velocity" && s.velocity !== undefined) row.velocity = s.velocity;
    }
  }
  for (const w of result.warnings) {
    if (w.segmentIndex !== undefined) out[w.segmentIndex]?.warnings.push(w.message);
  }
  return out;
}

/** The kinematic-wave solve (overland time, intensity, iterates) for the rainfall chart. */
function kinematicSolve(result: ComputeResult): TravelTimeSheet["kinematic"] {
  const m = result.methods["kinematic-wave"];
  if (m.status === "unavailable") return null;
  return {
    tcMin: m.overlandMin,
    intensity: m.intensity,
    solver: m.solver,
    iterations: m.iterations.map((it) => ({ tcMin: it.tcMin, intensity: it.intensity })),
  };
}

export function assembleSheet(
  frame: SheetFrame,
  rows: readonly SheetSegment[],
  result: ComputeResult | null,
  problems: readonly string[],
  extraWarnings: readonly SheetWarning[] = [],
  calcInput?: unknown,
): TravelTimeSheet {
  if (result === null) {
    const reason =
      problems.length > 0 ? problems.join(" ") : "The flow path could not be computed.";
    return {
      ...frame,
      caution: CAUTION,
      segments: rows.map((r) => ({ ...r })),
      methods: METHOD_IDS.map((id) => unavailable(id, reason)),
      governing: null,
      peakFlow: null,
      warnings: [...extraWarnings],
      problems: [...problems],
      rules: null,
    };
  }
  const governed = result.governing;
  return {
    ...frame,
    caution: result.caution,
    segments: fillRows(rows, result),
    methods: METHOD_IDS.map((id) => methodRow(result, id)),
    governing: {
      method: governed.method,
      label: METHOD_LABELS[governed.method],
      tcMin: governed.tcMin,
      tcHr: governed.tcHr,
      reason: governed.reason,
    },
    peakFlow: result.peakFlow && { ...result.peakFlow },
    kinematic: kinematicSolve(result),
    uncertainty: uncertaintyOf(result) ?? null,
    ...(calcInput !== undefined && { calcInput }),
    warnings: [
      ...extraWarnings,
      ...result.warnings
        .filter((w) => w.segmentIndex === undefined)
        .map((w) => ({
          code: w.code,
          message: w.message,
          ...(w.method !== undefined && { method: w.method }),
        })),
    ],
    problems: [...problems],
    rules: { ...result.rules },
  };
}

/** The problems that block the methods: one line per row that has an error. */
export function rowProblems(rows: readonly SheetSegment[]): string[] {
  return rows
    .filter((r) => r.error !== null)
    .map((r) => `Segment ${r.index + 1} (${r.regime}): ${r.error}`);
}
