/** Rainfall tables as the API answers them, with the Sherman fit of a table for plotting. */
import { fitIdfTable, isHydrologyError, type IdfInput } from "../../shared/hydrology";
import type { RainfallTable } from "../../shared/schemas/rainfall";
import type { rainfallTables } from "../db/schema-geodata";

type Row = typeof rainfallTables.$inferSelect;

/** One Sherman fit per return period of a table (depths become intensities first). */
export function shermanFits(idf: IdfInput): RainfallTable["fit"] {
  if (idf.kind !== "table") return null;
  const rows = idf.intensity ?? idf.depth;
  if (!rows) return null;
  const intensity =
    idf.intensity ?? rows.map((row, r) => row.map((d) => (d * 60) / (idf.durationsMin[r] ?? 1)));
  try {
    return fitIdfTable({
      durationsMin: idf.durationsMin,
      returnPeriodsYears: idf.returnPeriodsYears,
      intensity,
    });
  } catch (err) {
    // A table too short or too irregular to fit is still a valid table; the plot shows no curve.
    if (isHydrologyError(err)) return null;
    throw err;
  }
}

export function toRainfallTable(row: Row): RainfallTable {
  const idf = row.idf as IdfInput;
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    units: row.units === "si" ? "si" : "us",
    idf,
    p2_24h: row.p2_24h,
    sourceNote: row.sourceNote,
    originalFilename: row.originalFilename,
    fit: shermanFits(idf),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
