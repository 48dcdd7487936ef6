/**
 * Points of the design IDF curve for the rainfall chart, from the stored table through the same
 * core functions the compute uses (idfDataFromInput, intensityCurve), in the units shown.
 */
import { idfDataFromInput } from "../../../../shared/hydrology/case";
import { intensityCurve } from "../../../../shared/hydrology/idf";
import { idfSchema } from "../../../../shared/hydrology/idf-schema";
import { mmFromIn, type UnitSystem } from "../../../../shared/hydrology/units";

export interface ChartPoint {
  tcMin: number;
  intensity: number;
}

export function idfPoints(
  table: { idf: unknown; units: UnitSystem },
  returnPeriodYears: number,
  units: UnitSystem,
  upToMin: number,
): ChartPoint[] {
  const parsed = idfSchema.safeParse(table.idf);
  if (!parsed.success) return [];
  let curve;
  try {
    curve = intensityCurve(idfDataFromInput(parsed.data, table.units), returnPeriodYears, {
      allowExtrapolation: false,
    });
  } catch {
    return [];
  }
  const [from, to] = curve.durationRangeMin ?? [5, Math.max(60, upToMin)];
  const last = Math.min(to, Math.max(upToMin, from * 4));
  const out: ChartPoint[] = [];
  for (let k = 0; k <= 60; k += 1) {
    // Even steps in log duration: the curve bends most at short durations.
    const t = from * Math.pow(last / from, k / 60);
    const i = curve.at(t);
    out.push({ tcMin: t, intensity: units === "si" ? mmFromIn(i) : i });
  }
  return out;
}

/** The kinematic-wave relation through the solution: tc ∝ i^-0.4, so tc = tc_s·(i_s / i)^0.4 through the solution (tc_s, i_s). */
export function kinematicRelation(
  solution: ChartPoint,
  intensities: readonly number[],
): ChartPoint[] {
  return intensities
    .filter((i) => i > 0)
    .map((i) => ({ tcMin: solution.tcMin * Math.pow(solution.intensity / i, 0.4), intensity: i }));
}
