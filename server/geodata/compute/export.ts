/**
 * The travel-time sheet as CSV and as an XLSX workbook: a header block, column names with a
 * units row under them, one row per segment, a totals row, a row per method with its Monte Carlo
 * band, the governing Tc, and how sure it is (band and sensitivity). In the workbook numbers stay
 * numbers, with number formats per column.
 */
import ExcelJS from "exceljs";
import Papa from "papaparse";
import type { TravelTimeSheet } from "../../../shared/schemas/sheet";
import { sheetTable, type Cell } from "../../../shared/sheet/table";

/**
 * A text cell a spreadsheet would run as a formula (OWASP "CSV Injection": = + - @ tab CR at the
 * start). Such cells are written as text with a leading apostrophe; numbers stay numbers. Only
 * the first character is tested, so a value with a line break in it is caught too.
 */
export const FORMULA_START = /^[=+\-@\t\r]/;

export function sheetCsv(sheet: TravelTimeSheet): string {
  const t = sheetTable(sheet);
  const width = t.titles.length;
  const pad = (row: readonly Cell[]) => [
    ...row,
    ...Array<Cell>(Math.max(0, width - row.length)).fill(null),
  ];
  const rows: Cell[][] = [
    ...t.header.map((h) => pad(h)),
    pad([]),
    [...t.titles],
    [...t.units],
    ...t.rows,
    [...t.totals],
    pad([]),
    pad([...t.methodHead]),
    ...t.methodRows.map(pad),
    pad([...t.governing]),
    ...(t.howSure.length > 0 ? [pad([]), ...t.howSure.map(pad)] : []),
  ];
  return Papa.unparse(
    rows.map((r) => r.map((c) => (c === null ? "" : c))),
    { newline: "\r\n", escapeFormulae: FORMULA_START },
  );
}

export async function sheetXlsx(sheet: TravelTimeSheet): Promise<Buffer> {
  const t = sheetTable(sheet);
  const book = new ExcelJS.Workbook();
  book.creator = "Rillmark";
  book.created = new Date(sheet.computedAt);
  const ws = book.addWorksheet("Travel time", {
    views: [{ state: "frozen", ySplit: t.header.length + 3 }],
  });
  for (const [label, value] of t.header) {
    const row = ws.addRow([label, value]);
    row.getCell(1).font = { bold: true };
  }
  ws.addRow([]);
  const titles = ws.addRow([...t.titles]);
  titles.font = { bold: true };
  const units = ws.addRow([...t.units]);
  units.font = { italic: true };
  for (const values of t.rows) ws.addRow(values);
  const totals = ws.addRow([...t.totals]);
  totals.font = { bold: true };
  t.columns.forEach((c, i) => {
    const col = ws.getColumn(i + 1);
    col.width = Math.max(10, Math.min(40, c.title.length + 2));
    if (c.format) col.numFmt = c.format;
  });
  ws.addRow([]);
  const head = ws.addRow([...t.methodHead]);
  head.font = { bold: true };
  const minutes = (row: ExcelJS.Row) => {
    row.getCell(3).numFmt = "0.00";
    row.getCell(4).numFmt = "0.000";
    for (const c of [5, 6, 7]) row.getCell(c).numFmt = "0.00";
  };
  for (const m of t.methodRows) minutes(ws.addRow(m));
  const g = ws.addRow([...t.governing]);
  g.font = { bold: true };
  minutes(g);
  if (t.howSure.length > 0) {
    ws.addRow([]);
    for (const cells of t.howSure) {
      const row = ws.addRow(cells);
      const first = String(cells[0] ?? "");
      if (first.startsWith("How sure") || first.startsWith("Sensitivity"))
        row.font = { bold: true };
      for (let c = 2; c <= cells.length; c += 1) row.getCell(c).numFmt = "0.000";
    }
  }
  return Buffer.from(await book.xlsx.writeBuffer());
}
