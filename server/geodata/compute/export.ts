/**
 * The travel-time sheet as CSV and as an XLSX workbook: a header block, column names with a
 * units row under them, one row per segment, a totals row, a row per method and the governing
 * Tc. In the workbook numbers stay numbers, with number formats per column.
 */
import ExcelJS from "exceljs";
import Papa from "papaparse";
import type { TravelTimeSheet } from "../../../shared/schemas/sheet";
import { sheetTable, type Cell } from "../../../shared/sheet/table";

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
    pad(["Method", "Status", "Tc (min)", "Tc (h)", "Notes"]),
    ...t.methodRows.map(pad),
    pad([...t.governing]),
  ];
  return Papa.unparse(
    rows.map((r) => r.map((c) => (c === null ? "" : c))),
    { newline: "\r\n" },
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
  const head = ws.addRow(["Method", "Status", "Tc (min)", "Tc (h)", "Notes"]);
  head.font = { bold: true };
  for (const m of t.methodRows) {
    const row = ws.addRow(m);
    row.getCell(3).numFmt = "0.00";
    row.getCell(4).numFmt = "0.000";
  }
  const g = ws.addRow([...t.governing]);
  g.font = { bold: true };
  g.getCell(3).numFmt = "0.00";
  g.getCell(4).numFmt = "0.000";
  return Buffer.from(await book.xlsx.writeBuffer());
}
