/**
 * The invented IDF table as CSV in the layout Rillmark's rainfall reader takes
 * (server/geodata/readers/rainfall-csv.ts): "#" comment lines kept as notes, a header naming the
 * duration unit and the kind of value, one column per return period, intensity in in/h.
 */
import { DURATIONS_MIN, IDF_NOTE, idfTableInPerHr, RETURN_PERIODS_YEARS } from "./rainfall";

export function idfCsv(): string {
  const header = ["duration_min / intensity", ...RETURN_PERIODS_YEARS.map((T) => `${T}-yr`)];
  const table = idfTableInPerHr();
  const rows = DURATIONS_MIN.map((t, r) => [t, ...(table[r] ?? [])].join(","));
  return [
    `# ${IDF_NOTE}`,
    "# Intensity in inches per hour; durations in minutes; return periods in years.",
    header.join(","),
    ...rows,
    "",
  ].join("\n");
}
