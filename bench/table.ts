export interface BenchRow {
  name: string;
  value: string;
  unit?: string;
  target?: string;
  ok?: boolean;
}

/** A plain-text table with one row per measurement; `ok` shows as "meets" / "misses". */
export function formatTable(rows: Array<BenchRow & { suite?: string }>): string {
  const header = ["suite", "measurement", "value", "unit", "target", "verdict"];
  const body = rows.map((r) => [
    r.suite ?? "",
    r.name,
    r.value,
    r.unit ?? "",
    r.target ?? "",
    r.ok === undefined ? "" : r.ok ? "meets" : "misses",
  ]);
  const widths = header.map((h, i) => Math.max(h.length, ...body.map((row) => row[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i]!)).join(" | ");
  return [line(header), widths.map((w) => "-".repeat(w)).join("-|-"), ...body.map(line)].join("\n");
}
