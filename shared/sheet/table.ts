/**
 * The segment table of a travel-time sheet as plain cells, shared by the CSV and XLSX exports
 * (and usable by the client): a header block, the column names with a units row under them, one
 * row per segment, a totals row, one summary row per method and the governing Tc.
 */
import { METHOD_IDS, type MethodId } from "../hydrology/method-ids";
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
    ...METHOD_IDS.map((id): SheetColumn => ({
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
  /** method label, status, Tc (min), Tc (h), validity note */
  readonly methodRows: readonly Cell[][];
  readonly governing: readonly Cell[];
}

/** Minimum Tc applied, and where the case lies outside the method's range (with the range). */
function methodNote(m: TravelTimeSheet["methods"][number]): string | null {
  const parts: string[] = [];
  if (m.minimumApplied) parts.push("minimum Tc applied");
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
      ["Caution", sheet.caution],
    ],
    columns,
    titles: columns.map((c) => c.title),
    units: columns.map((c) => c.unit),
    rows: sheet.segments.map((r) => columns.map((c) => c.value(r))),
    totals,
    methodRows: sheet.methods.map((m) => [
      m.label,
      m.status,
      m.totalMin,
      m.totalHr,
      m.status === "ok" ? methodNote(m) : m.reason,
    ]),
    governing: g
      ? ["Governing Tc", g.label, g.tcMin, g.tcHr, g.reason]
      : ["Governing Tc", "none", null, null, sheet.problems.join(" ") || null],
  };
}
