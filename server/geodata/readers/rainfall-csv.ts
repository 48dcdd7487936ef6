/**
 * Rainfall table (IDF) from CSV, parsed with papaparse. Layout, one table per file:
 *
 *     duration_min, 2-yr, 10-yr, 25-yr, 100-yr     ← row 1: durations header, return periods
 *     5,            4.9,  6.6,   7.6,   9.2        ← one row per duration
 *     10,           3.9,  5.3,   6.1,   7.4
 *
 * - The first header cell names the duration unit: minutes ("duration_min", "duration (min)",
 *   "minutes") or hours ("duration_hr", "hours"); durations are stored in minutes.
 * - It may also say what the values are: "intensity" or "depth" anywhere in that cell
 *   (e.g. "duration_min / intensity"). Otherwise the caller says it (`kind`); both given and
 *   different is an error. Values are in the project's units (in/h or in; mm/h or mm).
 * - Return period headers: "2", "2-yr", "2 yr", "2-year", "T=2", "T2" (years).
 * - Lines whose first cell starts with "#" are comments, kept as notes (e.g. the source).
 * Every problem names the row (1-based, as a spreadsheet counts, header = row 1) and the
 * column header; the table must then pass the engineering core's idfSchema, whose findings
 * (durations increasing, intensity not rising with duration, …) are named the same way.
 */
import Papa from "papaparse";
import { idfSchema, type IdfInput } from "../../../shared/hydrology/idf-schema";
import { ReadError, type ReadNote } from "./types";

export type IdfKind = "intensity" | "depth";

export interface RainfallCsvResult {
  readonly idf: IdfInput;
  readonly notes: readonly ReadNote[];
}

const PERIOD = /^(?:t\s*=?\s*)?(\d+(?:\.\d+)?)\s*(?:-?\s*(?:yr|yrs|year|years|y))?$/i;
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$/i;

function fail(file: string, where: string, message: string): never {
  throw new ReadError(422, "bad-rainfall-csv", `${file}, ${where}: ${message}`, where);
}

function kindOf(first: string, given: IdfKind | undefined, file: string): IdfKind {
  const said = /intensity/i.test(first) ? "intensity" : /depth/i.test(first) ? "depth" : undefined;
  if (said && given && said !== given) {
    fail(file, "row 1", `the first header says ${said} but the upload says ${given}`);
  }
  const kind = said ?? given;
  if (kind === undefined) {
    fail(
      file,
      "row 1",
      'say whether the values are intensity or depth (e.g. "duration_min / intensity")',
    );
  }
  return kind;
}

function minutesPer(first: string, file: string): number {
  if (/\b(h|hr|hrs|hour|hours)\b|_(h|hr|hours?)\b/i.test(first)) return 60;
  if (/min/i.test(first) || /^duration$/i.test(first.trim())) return 1;
  return fail(
    file,
    "row 1",
    `the first header "${first}" should name the duration unit (e.g. "duration_min" or "duration_hr")`,
  );
}

function cellNumber(text: string | undefined, file: string, row: number, header: string): number {
  const trimmed = (text ?? "").trim();
  const where = `row ${row}, column "${header}"`;
  if (trimmed === "") fail(file, where, "is empty; every cell needs a value");
  if (!NUMBER.test(trimmed)) fail(file, where, `"${trimmed}" is not a number`);
  return Number(trimmed);
}

export function readRainfallCsv(
  text: string,
  originalName: string,
  kind?: IdfKind,
): RainfallCsvResult {
  const file = originalName;
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: false });
  const quoteError = parsed.errors.find((e) => e.type === "Quotes");
  if (quoteError) fail(file, `row ${(quoteError.row ?? 0) + 1}`, quoteError.message);
  const notes: ReadNote[] = [];
  // Keep the spreadsheet row number of each line; drop blank lines and comments.
  const lines = parsed.data
    .map((cells, k) => ({ cells, row: k + 1 }))
    .filter(({ cells, row }) => {
      const first = (cells[0] ?? "").trim();
      if (first.startsWith("#")) {
        notes.push({ where: `row ${row}`, message: cells.join(",").replace(/^\s*#\s*/, "") });
        return false;
      }
      return cells.some((c) => c.trim() !== "");
    });
  const [header, ...body] = lines;
  if (header === undefined) fail(file, "row 1", "the file is empty");
  const headers = header.cells.map((c) => c.trim());
  const first = headers[0] ?? "";
  const valueKind = kindOf(first, kind, file);
  const perDuration = minutesPer(first, file);
  if (headers.length < 2)
    fail(file, `row ${header.row}`, "needs at least one return period column after the durations");
  const periods = headers.slice(1).map((h, c) => {
    const match = PERIOD.exec(h);
    if (!match)
      fail(
        file,
        `row ${header.row}, column ${c + 2}`,
        `"${h}" is not a return period in years (e.g. "10-yr")`,
      );
    return Number(match[1]);
  });
  if (body.length === 0) fail(file, `row ${header.row + 1}`, "no durations follow the header");
  const durations: number[] = [];
  const values: number[][] = [];
  for (const { cells, row } of body) {
    if (cells.length > headers.length && cells.slice(headers.length).some((c) => c.trim() !== "")) {
      fail(file, `row ${row}`, `has ${cells.length} cells; the header has ${headers.length}`);
    }
    const duration = cellNumber(
      cells[0]?.replace(/\s*(min|mins|minutes|h|hr|hrs|hours)$/i, ""),
      file,
      row,
      first,
    );
    durations.push(duration * perDuration);
    values.push(headers.slice(1).map((h, c) => cellNumber(cells[c + 1], file, row, h)));
  }
  const candidate = {
    kind: "table" as const,
    durationsMin: durations,
    returnPeriodsYears: periods,
    [valueKind]: values,
  };
  const checked = idfSchema.safeParse(candidate);
  if (!checked.success) {
    const issue = checked.error.issues[0]!;
    const [key, i, c] = issue.path as [string, number | undefined, number | undefined];
    const rowOf = (r: number | undefined) => body[r ?? 0]?.row ?? header.row;
    const where =
      key === "returnPeriodsYears"
        ? `row ${header.row}, column "${headers[(i ?? 0) + 1]}"`
        : key === "durationsMin"
          ? `row ${rowOf(i)}, column "${first}"`
          : c !== undefined
            ? `row ${rowOf(i)}, column "${headers[c + 1]}"`
            : `row ${rowOf(i)}`;
    fail(file, where, issue.message);
  }
  if (perDuration === 60)
    notes.push({ where: "row 1", message: "durations given in hours; stored in minutes" });
  return { idf: checked.data, notes };
}
