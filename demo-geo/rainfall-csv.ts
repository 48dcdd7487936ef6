/**
 * The invented IDF table as CSV: one row per duration, one column per return period, intensity
 * in in/h.
 */
import { DURATIONS_MIN, idfTableInPerHr, RETURN_PERIODS_YEARS } from "./rainfall";

export function idfCsv(): string {
  const header = ["duration_min", ...RETURN_PERIODS_YEARS.map(String)].join(",");
  const table = idfTableInPerHr();
  const rows = DURATIONS_MIN.map((t, r) => [t, ...(table[r] ?? [])].join(","));
  return `${[header, ...rows].join("\n")}\n`;
}
