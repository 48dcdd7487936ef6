/**
 * Builder for TR-55 (1986) Table 2-2 rows, so each table file reads like the printed table.
 * All rows are for antecedent runoff condition II and Ia = 0.2S (footnote 1 of each table).
 */
import { type CnTable, type CurveNumberRow, type HydrologicCondition, type Hsg } from "./types";

export const CN_BASIS = {
  arc: "II",
  initialAbstractionRatio: 0.2,
  source: "TR-55 (1986) Tables 2-2a to 2-2d, footnote 1: average runoff condition, Ia = 0.2S",
} as const;

export interface CnRowSpec<Id extends string> {
  readonly id: Id;
  readonly cover: string;
  readonly treatment?: string;
  readonly condition?: HydrologicCondition;
  /** CN for A, B, C, D; null where the table prints a dash. */
  readonly cn: readonly [number | null, number | null, number | null, number | null];
  readonly imperviousPercent?: number;
  readonly flooredAt30?: readonly Hsg[];
  readonly notes?: readonly string[];
  /** The row is among those METHODS.md lists as corroborated in textbook reproductions. */
  readonly corroborated?: boolean;
}

export function cnRows(table: CnTable) {
  return <const Id extends string>(
    group: string,
    spec: CnRowSpec<Id>,
  ): CurveNumberRow & { readonly id: Id } => {
    const [a, b, c, d] = spec.cn;
    const flag = spec.corroborated
      ? "[from memory; row corroborated in textbook reproductions]"
      : "[from memory]";
    return {
      id: spec.id,
      table,
      group,
      cover: spec.cover,
      treatment: spec.treatment ?? null,
      condition: spec.condition ?? null,
      averageImperviousPercent: spec.imperviousPercent ?? null,
      cn: { A: a, B: b, C: c, D: d },
      flooredAt30: spec.flooredAt30 ?? [],
      source: `TR-55 (1986) Table ${table} ${flag}`,
      notes: spec.notes ?? [],
    };
  };
}

/** TR-55 Table 2-2c footnote 4 (also cited by the meadow and brush rows) [from memory]. */
export const FLOOR_30_NOTE =
  "Actual curve number is less than 30; use CN = 30 for runoff computations.";
