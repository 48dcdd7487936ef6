/**
 * Antecedent runoff condition (ARC) adjustment of a curve number given for ARC II.
 *
 * Table: NEH Part 630 Ch 10 (2004) Table 10-1, loaded row by row for every tabulated CN(II)
 * (100 down to 30 in steps of 1, then 25, 20, 15, 10, 5, 0); a CN between two rows (an
 * area-weighted 74.3) is interpolated between those two neighbouring rows only.
 *   Rows 100, 90, 80, 70, 60, 50, 40 and 30 are confirmed against a textbook reproduction of the
 *   table (after USDA-SCS 1985); the other rows are as commonly reproduced [from memory in the
 *   tests]; 0 → 0/0 follows from the definition (no runoff at CN 0).
 * Formulas:
 *   Chow et al. (1988):   CN(I) = 4.2·CN/(10 − 0.058·CN),   CN(III) = 23·CN/(10 + 0.13·CN)
 *   Hawkins et al.:       CN(I) = CN/(2.281 − 0.01281·CN),  CN(III) = CN/(0.427 + 0.00573·CN)
 *   [both from memory]; results are clamped to [0, 100].
 * Validity: CN(II) in [0, 100]. Which ARC applies to a return period is a design rule (some
 * agencies use ARC III for rare storms: common practice). The lag equation takes CN as a
 * retardance index for ARC II, so ARC reaches it only by an explicit rule (rules.lagUsesArc).
 */
import { AS_REPRODUCED } from "./citation";

export type Arc = "I" | "II" | "III";
export const ARC_METHODS = ["table", "chow", "hawkins"] as const;
export type ArcMethod = (typeof ARC_METHODS)[number];

/** [CN(II), CN(I), CN(III)], descending in CN(II) as the table prints it. */
// Five rows a line, as the table is read.
// prettier-ignore
export const NEH630_TABLE_10_1: ReadonlyArray<readonly [number, number, number]> = [
  [100, 100, 100], [99, 97, 100], [98, 94, 99], [97, 91, 99], [96, 89, 99],
  [95, 87, 98], [94, 85, 98], [93, 83, 98], [92, 81, 97], [91, 80, 97],
  [90, 78, 96], [89, 76, 96], [88, 75, 95], [87, 73, 95], [86, 72, 94],
  [85, 70, 94], [84, 68, 93], [83, 67, 93], [82, 66, 92], [81, 64, 92],
  [80, 63, 91], [79, 62, 91], [78, 60, 90], [77, 59, 89], [76, 58, 89],
  [75, 57, 88], [74, 55, 88], [73, 54, 87], [72, 53, 86], [71, 52, 86],
  [70, 51, 85], [69, 50, 84], [68, 48, 84], [67, 47, 83], [66, 46, 82],
  [65, 45, 82], [64, 44, 81], [63, 43, 80], [62, 42, 79], [61, 41, 78],
  [60, 40, 78], [59, 39, 77], [58, 38, 76], [57, 37, 75], [56, 36, 75],
  [55, 35, 74], [54, 34, 73], [53, 33, 72], [52, 32, 71], [51, 31, 70],
  [50, 31, 70], [49, 30, 69], [48, 29, 68], [47, 28, 67], [46, 27, 66],
  [45, 26, 65], [44, 25, 64], [43, 25, 63], [42, 24, 62], [41, 23, 61],
  [40, 22, 60], [39, 21, 59], [38, 21, 58], [37, 20, 57], [36, 19, 56],
  [35, 18, 55], [34, 18, 54], [33, 17, 53], [32, 16, 52], [31, 16, 51],
  [30, 15, 50], [25, 12, 43], [20, 9, 37], [15, 6, 30], [10, 4, 22],
  [5, 2, 13], [0, 0, 0],
];

/** The rows confirmed against a public reproduction of the table (the others: as reproduced). */
export const ARC_TABLE_CONFIRMED_ROWS: readonly number[] = [100, 90, 80, 70, 60, 50, 40, 30];

export const ARC_TABLE_SOURCE =
  "NEH Part 630 Ch 10 (2004) Table 10-1, row by row (rows 30–100 in steps of 10 checked " +
  `against a textbook reproduction; the other rows: ${AS_REPRODUCED})`;

function fromTable(cnII: number, column: 1 | 2): number {
  const rows = NEH630_TABLE_10_1;
  for (let j = 1; j < rows.length; j += 1) {
    const hi = rows[j - 1];
    const lo = rows[j];
    if (lo === undefined || hi === undefined) break;
    if (cnII >= lo[0]) {
      if (cnII === lo[0]) return lo[column];
      const f = (cnII - lo[0]) / (hi[0] - lo[0]);
      return lo[column] + f * (hi[column] - lo[column]);
    }
  }
  return 0;
}

export function chowCn(cnII: number, arc: "I" | "III"): number {
  return arc === "I" ? (4.2 * cnII) / (10 - 0.058 * cnII) : (23 * cnII) / (10 + 0.13 * cnII);
}

export function hawkinsCn(cnII: number, arc: "I" | "III"): number {
  return arc === "I" ? cnII / (2.281 - 0.01281 * cnII) : cnII / (0.427 + 0.00573 * cnII);
}

/** The curve number for `arc`, from a CN given for ARC II. */
export function adjustCurveNumber(cnII: number, arc: Arc, method: ArcMethod): number {
  if (arc === "II") return cnII;
  let value: number;
  if (method === "table") value = fromTable(cnII, arc === "I" ? 1 : 2);
  else if (method === "chow") value = chowCn(cnII, arc);
  else value = hawkinsCn(cnII, arc);
  return Math.min(Math.max(value, 0), 100);
}

export const ARC_METHOD_SOURCES: Readonly<Record<ArcMethod, string>> = {
  table: ARC_TABLE_SOURCE,
  chow: `Chow, Maidment & Mays (1988), ARC I/III formulas (${AS_REPRODUCED})`,
  hawkins: `Hawkins et al., ARC I/III formulas (${AS_REPRODUCED})`,
};
