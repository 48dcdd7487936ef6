import { type RainfallTable } from "../../../../shared/schemas/rainfall";
import { shermanIntensity, type ShermanCoefficients } from "../../../../shared/hydrology/idf";

/** Colours of Rillmark's own for return periods, short storms cool to long storms warm. */
const SERIES_COLOURS = ["#177778", "#3a6fb0", "#6b4fa3", "#b8600d", "#a83622", "#4c5f69"];
export const seriesColour = (i: number) => SERIES_COLOURS[i % SERIES_COLOURS.length]!;

export interface Series {
  returnPeriodYears: number;
  colour: string;
  /** Tabulated points (intensity), absent for a formula. */
  points: { t: number; i: number }[];
  /** The Sherman curve (fitted for a table, as entered for a formula). */
  curve: { t: number; i: number }[];
  coefficients: ShermanCoefficients | null;
}

/** Durations spread evenly on a log axis between two durations (minutes). */
function logSpaced(fromMin: number, toMin: number, count = 40): number[] {
  const a = Math.log(fromMin);
  const b = Math.log(toMin);
  return Array.from({ length: count }, (_, k) => Math.exp(a + ((b - a) * k) / (count - 1)));
}

/** The table's points as intensities, and one Sherman curve per return period. */
export function seriesOf(table: RainfallTable): Series[] {
  const idf = table.idf;
  if (idf.kind === "formula") {
    return Object.entries(idf.formula)
      .map(([years, coef]) => ({ years: Number(years), coef }))
      .sort((x, y) => x.years - y.years)
      .map(({ years, coef }, k) => ({
        returnPeriodYears: years,
        colour: seriesColour(k),
        points: [],
        curve: logSpaced(5, 1440).map((t) => ({ t, i: shermanIntensity(coef, t) })),
        coefficients: coef,
      }));
  }
  const d = idf.durationsMin;
  const rows = idf.intensity ?? idf.depth ?? [];
  const intensity = (r: number, c: number) => {
    const v = rows[r]?.[c] ?? Number.NaN;
    return idf.depth ? (v * 60) / (d[r] ?? Number.NaN) : v;
  };
  const span = logSpaced(d[0] ?? 5, d[d.length - 1] ?? 1440);
  return idf.returnPeriodsYears.map((years, c) => {
    const fit = table.fit?.find((f) => f.returnPeriodYears === years) ?? null;
    return {
      returnPeriodYears: years,
      colour: seriesColour(c),
      points: d.map((t, r) => ({ t, i: intensity(r, c) })),
      curve: fit ? span.map((t) => ({ t, i: shermanIntensity(fit, t) })) : [],
      coefficients: fit,
    };
  });
}
