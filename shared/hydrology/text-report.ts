/**
 * Plain-text rendering of a result: a summary of every method, one table per method with each
 * segment's travel time and units, the warnings, and the caution line. Used by the command line
 * (`--format table`) and fit for a text export. Pure: returns a string.
 */
import type { ComputeInput } from "./input-schema";
import { METHOD_IDS, type MethodId } from "./method-ids";
import { rationalFormula } from "./rational";
import type { ComputeResult, MethodOk, MethodResults } from "./result-types";

type Cell = string;

function table(header: Cell[], rows: Cell[][], rightAligned: ReadonlySet<number>): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? "").length)));
  const line = (cells: Cell[]) =>
    cells
      .map((c, i) => (rightAligned.has(i) ? c.padStart(widths[i] ?? 0) : c.padEnd(widths[i] ?? 0)))
      .join("  ")
      .trimEnd();
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

const fixed = (value: number | undefined, digits: number): string =>
  value === undefined ? "" : value.toFixed(digits);

function summary(methods: MethodResults, governing: ComputeResult["governing"]): string {
  const rows = METHOD_IDS.map((id) => {
    const m = methods[id];
    const mark = governing.method === id ? "governs" : "";
    if (m.status !== "ok") return [id, m.kind, "", "", `unavailable: ${m.reason}`];
    const notes = [
      mark,
      m.minimumApplied ? `minimum applied (computed ${m.computedMin.toFixed(2)} min)` : "",
      m.scope === "overland" ? "overland part only, no minimum Tc" : "",
      m.validity.outside.length > 0 ? `outside range: ${m.validity.outside.join("; ")}` : "",
    ].filter((n) => n !== "");
    return [id, m.kind, fixed(m.totalMin, 2), fixed(m.totalHr, 3), notes.join("; ")];
  });
  return table(["method", "kind", "Tc min", "Tc h", "notes"], rows, new Set([2, 3]));
}

function segmentTable(m: MethodOk, input: ComputeInput, result: ComputeResult): string {
  const u = result.unitLabels;
  // The lag of each segment alone does not add up to the method's Tc: say so in the column.
  const time = m.id === "nrcs-lag" ? "Tc alone min (not additive)" : "Tt min";
  const rows = m.segments.map((s) => {
    const seg = input.segments[s.index];
    return [
      String(s.index),
      s.regime,
      s.equation,
      seg === undefined ? "" : String(seg.length),
      seg === undefined ? "" : seg.slope.toFixed(4),
      fixed(s.velocity, 3),
      fixed(s.travelTimeMin, 2),
      s.cn === undefined ? "" : s.cn.toFixed(1),
    ];
  });
  return table(
    ["#", "regime", "equation", `length ${u.length}`, "slope", `V ${u.velocity}`, time, "CN"],
    rows,
    new Set([0, 3, 4, 5, 6, 7]),
  );
}

function details(id: MethodId, m: MethodOk, result: ComputeResult): string[] {
  const u = result.unitLabels;
  const lines: string[] = [];
  const kw = result.methods["kinematic-wave"];
  if (id === "kinematic-wave" && kw.status === "ok") {
    lines.push(
      `  i = ${kw.intensity.toFixed(3)} ${u.intensity} at the overland time ` +
        `${kw.overlandMin.toFixed(2)} min; K = ${kw.k.toPrecision(4)} (${kw.kLabel}); ` +
        `${kw.iterations.length} iterates, ${kw.solver}, tolerance ${kw.toleranceMin} min`,
    );
  }
  const lag = result.methods["nrcs-lag"];
  if (id === "nrcs-lag" && lag.status === "ok") {
    lines.push(
      `  whole path: ℓ = ${lag.flowLength.toFixed(1)} ${u.length}, CN ${lag.cnArcII.toFixed(1)} ` +
        `(${lag.cnSource === "watershed" ? "area-weighted, subcatchment" : "length-weighted, path"})` +
        (lag.arcApplied
          ? ` → CN(${lag.arc}) ${lag.cn.toFixed(1)} (${lag.arcMethod}, rules.lagUsesArc)`
          : " for ARC II") +
        `, Y = ${lag.avgSlopePercent.toFixed(2)} % (${lag.slopeSource}), lag ${lag.lagHr.toFixed(3)} h`,
      "  the segment rows give each segment's lag alone: they are not additive and make no total",
    );
  }
  const series =
    id === "kinematic-wave" || id === "nrcs-segmental" ? result.methods[id] : undefined;
  if (series?.status === "ok" && series.overlandSeries !== null) {
    const n = series.overlandSeries;
    lines.push(
      `  sheet flow over ${n.sheetSegments} segments: rules.${n.rule} "${n.used}" (${n.usedLabel})`,
      ...n.alternatives.map(
        (a) => `    "${a.option}" (${a.label}) would give ${a.totalMin.toFixed(2)} min`,
      ),
    );
  }
  if (id === "kirpich" || id === "kerby" || id === "faa" || id === "kerby-kirpich") {
    const check = result.methods[id];
    if (check.status === "ok") {
      const parts = Object.entries(check.inputs).map(
        ([k, v]) => `${k} ${Number(v.toPrecision(5))}${k === "length" ? ` ${u.length}` : ""}`,
      );
      lines.push(`  inputs: ${parts.join(", ")}`);
    }
  }
  lines.push(`  validity: ${m.validity.range}`);
  for (const note of m.validity.outside) lines.push(`  OUTSIDE RANGE: ${note}`);
  lines.push(`  source: ${m.source}`);
  return lines;
}

export function formatResultText(input: ComputeInput, result: ComputeResult): string {
  const u = result.unitLabels;
  const out: string[] = [];
  const system = result.units === "us" ? "US customary" : "SI";
  out.push(`Time of concentration — ${result.returnPeriodYears}-year storm, ${system} units`);
  if (input.title !== undefined) out.push(input.title);
  out.push(`CAUTION: ${result.caution}`, "");
  const g = result.governing;
  out.push(
    `Governing Tc: ${g.tcMin.toFixed(2)} min (${g.tcHr.toFixed(3)} h) by ${g.method} — ${g.reason}`,
  );
  const q = result.peakFlow;
  if (q === null) out.push("Peak flow: not computed (see warnings)");
  else {
    out.push(
      `Peak flow (rational): ${rationalFormula(q, u)} (i at ${q.durationMin.toFixed(2)} min)`,
    );
  }
  out.push("", summary(result.methods, g));
  for (const id of METHOD_IDS) {
    const m = result.methods[id];
    if (m.status !== "ok") continue;
    out.push("", `${id} — ${m.label}: ${m.totalMin.toFixed(2)} min (${m.totalHr.toFixed(3)} h)`);
    if (m.segments.length > 0) out.push(segmentTable(m, input, result));
    out.push(...details(id, m, result));
  }
  if (result.uncertainty !== undefined) out.push("", ...uncertaintyLines(result));
  out.push("", "Warnings:");
  if (result.warnings.length === 0) out.push("  none");
  for (const w of result.warnings) {
    const where = [
      w.segmentIndex === undefined ? "" : `segments[${w.segmentIndex}]`,
      w.method ?? "",
    ].filter((s) => s !== "");
    out.push(`  [${w.code}]${where.length > 0 ? ` ${where.join(", ")}` : ""}: ${w.message}`);
  }
  out.push("", `CAUTION: ${result.caution}`);
  return out.join("\n");
}

const range = (p: { p10: number; p50: number; p90: number } | null, digits: number) =>
  p === null
    ? "not available"
    : `P10 ${p.p10.toFixed(digits)}, P50 ${p.p50.toFixed(digits)}, P90 ${p.p90.toFixed(digits)}`;

/** The sensitivity view and the Monte Carlo band as text. */
function uncertaintyLines(result: ComputeResult): string[] {
  const u = result.uncertainty;
  if (u === undefined) return [];
  const mc = u.monteCarlo;
  const flow = result.unitLabels.flow;
  const lines = [
    `How sure: Monte Carlo, ${mc.draws} draws, seed ${mc.seed} (${mc.distribution})`,
    `  governing Tc min: ${range(mc.governingTcMin, 2)}`,
    `  peak flow ${flow}: ${range(mc.peak, 3)}`,
    ...METHOD_IDS.map((id) => `  ${id} Tc min: ${range(mc.methods[id], 2)}`),
    "",
    "Sensitivity (each input at the ends of its band, the others as entered):",
  ];
  const e = u.sensitivity.entered;
  const fmt = (v: number | null, d: number) => (v === null ? "—" : v.toFixed(d));
  const rows = u.sensitivity.bars.map((b) => [
    b.label,
    fmt(b.low.tcMin, 2),
    fmt(b.high.tcMin, 2),
    fmt(b.low.peak, 3),
    fmt(b.high.peak, 3),
    b.band,
  ]);
  lines.push(
    table(
      ["input", "Tc low", "Tc high", `Q low ${flow}`, `Q high ${flow}`, "band"],
      [
        ["as entered", fmt(e.tcMin, 2), fmt(e.tcMin, 2), fmt(e.peak, 3), fmt(e.peak, 3), ""],
        ...rows,
      ],
      new Set([1, 2, 3, 4]),
    ),
  );
  return lines;
}
