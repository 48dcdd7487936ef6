/**
 * The segment table of a travel-time sheet as plain cells, shared by the CSV and XLSX exports
 * (and usable by the client): a header block, the column names with a units row under them, one
 * row per segment, a totals row, one summary row per method and the governing Tc.
 */
import { METHOD_IDS, type MethodId } from "../hydrology/method-ids";
import { rationalFormula } from "../hydrology/rational";
import type { SheetSegment, TravelTimeSheet } from "../schemas/sheet";

export type Cell = string | number | null;

export interface SheetColumn {
  readonly key: string;
  readonly title: string;
  readonly unit: string;
  /** Number format hint for spreadsheets ("0.00" etc.); text columns have none. */
  readonly format?: string;
  value(row: SheetSegment): Cell;
}

const METHOD_SHORT: Record<MethodId, string> = {
  velocity: "Velocity method",
  "nrcs-lag": "NRCS lag",
  "kinematic-wave": "Kinematic wave",
  "nrcs-segmental": "NRCS segmental",
  kirpich: "Kirpich",
  kerby: "Kerby",
  faa: "FAA",
  "kerby-kirpich": "Kerby–Kirpich",
};

const PER_SEGMENT = METHOD_IDS.filter(
  (id) => id === "velocity" || id === "kinematic-wave" || id === "nrcs-segmental",
);

export function sheetColumns(sheet: TravelTimeSheet): SheetColumn[] {
  const u = sheet.unitLabels;
  const len = u.length ?? "";
  return [
    { key: "segment", title: "Segment", unit: "", format: "0", value: (r) => r.index + 1 },
    {
      key: "stationFrom",
      title: "Station from",
      unit: len,
      format: "0.00",
      value: (r) => r.stationFrom,
    },
    { key: "stationTo", title: "Station to", unit: len, format: "0.00", value: (r) => r.stationTo },
    { key: "length", title: "Length", unit: len, format: "0.00", value: (r) => r.length },
    { key: "regime", title: "Flow regime", unit: "", value: (r) => r.regime },
    {
      key: "surface",
      title: "Surface class",
      unit: "",
      value: (r) => r.surfaceClassName ?? "unmapped",
    },
    {
      key: "surfaceSource",
      title: "Surface source",
      unit: "",
      value: (r) => (r.surfaceSource === "override" ? "override" : "cover layer"),
    },
    { key: "hsg", title: "Soil group", unit: "", value: (r) => r.hsg },
    { key: "n", title: "Manning n", unit: "", format: "0.000", value: (r) => r.n ?? r.manningN },
    {
      key: "k",
      title: "Velocity coefficient k",
      unit: u.velocity ?? "",
      format: "0.000",
      value: (r) => r.k,
    },
    { key: "cn", title: "CN", unit: "", format: "0", value: (r) => r.cn },
    {
      key: "elevationUp",
      title: "Elevation up",
      unit: len,
      format: "0.000",
      value: (r) => r.elevationUp,
    },
    {
      key: "elevationDown",
      title: "Elevation down",
      unit: len,
      format: "0.000",
      value: (r) => r.elevationDown,
    },
    {
      key: "elevationSource",
      title: "Elevation source",
      unit: "",
      value: (r) => r.elevationSource,
    },
    {
      key: "slope",
      title: "Slope",
      unit: `${len}/${len}`,
      format: "0.00000",
      value: (r) => r.slope,
    },
    {
      key: "velocity",
      title: "Velocity",
      unit: u.velocity ?? "",
      format: "0.000",
      value: (r) => r.velocity,
    },
    // Methods that add segment times; the lag method's per-segment figures are not additive
    // and the checks work on the whole path, so they have no column here.
    ...PER_SEGMENT.map((id): SheetColumn => ({
      key: `time:${id}`,
      title: `Time, ${METHOD_SHORT[id]}`,
      unit: "min",
      format: "0.00",
      value: (r) => r.timesMin[id] ?? null,
    })),
    {
      key: "notes",
      title: "Problems and warnings",
      unit: "",
      value: (r) => [r.error, ...r.warnings].filter(Boolean).join(" ") || null,
    },
  ];
}

export interface SheetTable {
  readonly header: readonly (readonly [string, Cell])[];
  readonly columns: readonly SheetColumn[];
  readonly titles: readonly string[];
  readonly units: readonly string[];
  readonly rows: readonly Cell[][];
  readonly totals: readonly Cell[];
  /** The heading of the method rows. */
  readonly methodHead: readonly string[];
  /** method label, status, Tc (min), Tc (h), P10, P50, P90 (min), notes */
  readonly methodRows: readonly Cell[][];
  readonly governing: readonly Cell[];
  /** "How sure" rows: the Monte Carlo band and the sensitivity bars (empty on older sheets). */
  readonly howSure: readonly Cell[][];
}

export const METHOD_HEAD = [
  "Method",
  "Status",
  "Tc (min)",
  "Tc (h)",
  "P10 (min)",
  "P50 (min)",
  "P90 (min)",
  "Notes",
] as const;

/** The Monte Carlo band and the tornado bars as rows of cells. */
function howSureRows(sheet: TravelTimeSheet): Cell[][] {
  const u = sheet.uncertainty;
  if (!u) return [];
  const flow = sheet.unitLabels.flow ?? "";
  const mc = u.monteCarlo;
  const band = (label: string, p: { p10: number; p50: number; p90: number } | null) => [
    label,
    p?.p10 ?? null,
    p?.p50 ?? null,
    p?.p90 ?? null,
  ];
  return [
    [`How sure (Monte Carlo, ${mc.draws} draws, seed ${mc.seed})`, "P10", "P50", "P90"],
    band("Governing Tc (min)", mc.governingTcMin),
    band(`Peak flow (${flow})`, mc.peak),
    [mc.distribution],
    [],
    [
      "Sensitivity: input at the ends of its band",
      "Band",
      "Tc low (min)",
      "Tc high (min)",
      `Q low (${flow})`,
      `Q high (${flow})`,
    ],
    ...u.sensitivity.bars.map((b) => [
      b.label,
      b.band,
      b.low.tcMin,
      b.high.tcMin,
      b.low.peak,
      b.high.peak,
    ]),
  ];
}

/** Where the series rule combined several sheet segments, and what the others give. */
function seriesNote(m: TravelTimeSheet["methods"][number]): string | null {
  const s = m.overlandSeries;
  if (!s) return null;
  const others = s.alternatives
    .map((a) => `"${a.option}" would give ${a.totalMin.toFixed(2)} min`)
    .join(", ");
  return `sheet flow over ${s.sheetSegments} segments combined as "${s.used}" (${s.usedLabel}); ${others}`;
}

/** Minimum Tc applied, and where the case lies outside the method's range (with the range). */
function methodNote(m: TravelTimeSheet["methods"][number]): string | null {
  const parts: string[] = [];
  if (m.minimumApplied) parts.push("minimum Tc applied");
  if (m.scope === "overland") parts.push("overland part only; the minimum Tc is not applied");
  const series = seriesNote(m);
  if (series) parts.push(series);
  if (m.validity && m.validity.outside.length > 0) {
    parts.push(`outside its range (${m.validity.range}): ${m.validity.outside.join("; ")}`);
  }
  return parts.length > 0 ? parts.join("; ") : null;
}

export function sheetTable(sheet: TravelTimeSheet, projectName = sheet.project.name): SheetTable {
  const columns = sheetColumns(sheet);
  const totals: Cell[] = columns.map((c) => {
    if (c.key === "segment") return "Total";
    if (c.key === "length") return sheet.totalLength;
    if (c.key.startsWith("time:")) {
      const m = sheet.methods.find((x) => `time:${x.id}` === c.key);
      return m?.status === "ok" ? m.computedMin : null;
    }
    return null;
  });
  const g = sheet.governing;
  return {
    header: [
      ["Project", projectName],
      ["Subcatchment", sheet.subcatchment.name],
      ["Scenario", sheet.subcatchment.scenario],
      ["Units", sheet.units === "si" ? "SI (m, mm, ha, m³/s)" : "US customary (ft, in, ac, cfs)"],
      ["Return period (years)", sheet.returnPeriodYears],
      ["Flow path version", sheet.flowPathVersion],
      ...(sheet.stale
        ? [["Up to date", "No: the flow path changed since; compute again"] as const]
        : []),
      ["Computed at", sheet.computedAt],
      ...(sheet.peakFlow
        ? [
            [
              "Peak flow (rational method)",
              rationalFormula(sheet.peakFlow, {
                intensity: sheet.unitLabels.intensity ?? "",
                area: sheet.unitLabels.area ?? "",
              }),
            ] as const,
          ]
        : []),
      ["Caution", sheet.caution],
    ],
    columns,
    titles: columns.map((c) => c.title),
    units: columns.map((c) => c.unit),
    rows: sheet.segments.map((r) => columns.map((c) => c.value(r))),
    totals,
    methodHead: METHOD_HEAD,
    methodRows: sheet.methods.map((m) => [
      m.label,
      m.status,
      m.totalMin,
      m.totalHr,
      m.band?.p10 ?? null,
      m.band?.p50 ?? null,
      m.band?.p90 ?? null,
      m.status === "ok" ? methodNote(m) : m.reason,
    ]),
    governing: g
      ? [
          "Governing Tc",
          g.label,
          g.tcMin,
          g.tcHr,
          sheet.uncertainty?.monteCarlo.governingTcMin?.p10 ?? null,
          sheet.uncertainty?.monteCarlo.governingTcMin?.p50 ?? null,
          sheet.uncertainty?.monteCarlo.governingTcMin?.p90 ?? null,
          g.reason,
        ]
      : ["Governing Tc", "none", null, null, null, null, null, sheet.problems.join(" ") || null],
    howSure: howSureRows(sheet),
  };
}
