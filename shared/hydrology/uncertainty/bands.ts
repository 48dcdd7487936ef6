/**
 * How sure is each Tc: the bands within which the sensitivity view and the Monte Carlo vary
 * each input, stored with the design rules (`rules.uncertainty`). Every default with its basis:
 *
 *   roughnessPct  20  Manning's n (sheet and channel) and Kerby's N, ±20 % (common practice
 *                     where no published range is entered; Chow (1959) Table 5-6 prints
 *                     minimum–normal–maximum n about this far apart [from memory])
 *   velocityKPct  20  velocity coefficient k, ±20 % (common practice, as for n: k = 1.486·r^(2/3)/n)
 *   slopePct      10  every slope ±10 % (common practice), unless terrainVerticalAccuracy is set:
 *                     then ±√2·σz/L per segment (the difference of two independent elevation
 *                     errors σz over the segment length L) [derived]
 *   p2Pct         10  2-year 24-hour depth ±10 % (common practice)
 *   idfPct        10  every IDF intensity ±10 % (common practice)
 *   cnPoints       5  curve numbers ±5 (common practice)
 *   runoffCPct    10  runoff coefficient C ±10 % (common practice)
 *   draws       2000  Monte Carlo draws; seed 1 (a fixed seed: the same inputs give the same band)
 *
 * Each draw moves every group by one factor from a triangular distribution over its band
 * (mode at the entered value), groups independent of each other: within a group the error is
 * taken as systematic (a wrong table row moves every segment alike), the cautious choice.
 */
import { z } from "zod";

const pct = (what: string) =>
  z
    .number({ error: `${what} must be a percentage` })
    .min(0, `${what} must be at least 0 %`)
    .max(90, `${what} must be at most 90 %`);

export const bandsSchema = z.strictObject({
  roughnessPct: pct("the roughness band").optional(),
  velocityKPct: pct("the velocity coefficient band").optional(),
  slopePct: pct("the slope band").optional(),
  /** Vertical accuracy (1 σ) of the terrain, in the project's length unit. */
  terrainVerticalAccuracy: z
    .number({ error: "must be a length" })
    .min(0.001, "must be at least 0.001")
    .max(100, "must be at most 100")
    .optional(),
  p2Pct: pct("the P2 band").optional(),
  idfPct: pct("the IDF band").optional(),
  cnPoints: z
    .number({ error: "must be a number of CN points" })
    .min(0, "must be at least 0")
    .max(30, "must be at most 30")
    .optional(),
  runoffCPct: pct("the runoff coefficient band").optional(),
  draws: z
    .number({ error: "must be a whole number of draws" })
    .int("must be a whole number of draws")
    .min(100, "must be at least 100")
    .max(100_000, "must be at most 100,000")
    .optional(),
  seed: z
    .number({ error: "must be a whole number" })
    .int("must be a whole number")
    .min(0, "must be at least 0")
    .max(2_147_483_647, "must be at most 2,147,483,647")
    .optional(),
});

export type BandsInput = z.infer<typeof bandsSchema>;

export const BAND_DEFAULTS = {
  roughnessPct: 20,
  velocityKPct: 20,
  slopePct: 10,
  p2Pct: 10,
  idfPct: 10,
  cnPoints: 5,
  runoffCPct: 10,
  draws: 2000,
  seed: 1,
} as const;

/** The basis of each default band, as the sheet and the exports state it. */
export const BAND_SOURCES = {
  roughness: "common practice; Chow (1959) Table 5-6 spreads n about this far",
  velocityK: "common practice",
  slope: "common practice",
  slopeTerrain: "±√2·σz/L from the terrain's vertical accuracy, derived",
  p2: "common practice",
  idf: "common practice",
  cn: "common practice",
  runoffC: "common practice",
} as const;

/** Bands with defaults applied; the vertical accuracy in ft. */
export interface ResolvedBands {
  readonly roughness: number;
  readonly velocityK: number;
  readonly slope: number;
  readonly verticalAccuracyFt: number | null;
  readonly p2: number;
  readonly idf: number;
  readonly cnPoints: number;
  readonly runoffC: number;
  readonly draws: number;
  readonly seed: number;
}

export function resolveBands(input: BandsInput | undefined, ftPerUnit: number): ResolvedBands {
  const b = input ?? {};
  const fraction = (v: number | undefined, d: number) => (v ?? d) / 100;
  return {
    roughness: fraction(b.roughnessPct, BAND_DEFAULTS.roughnessPct),
    velocityK: fraction(b.velocityKPct, BAND_DEFAULTS.velocityKPct),
    slope: fraction(b.slopePct, BAND_DEFAULTS.slopePct),
    verticalAccuracyFt:
      b.terrainVerticalAccuracy === undefined ? null : b.terrainVerticalAccuracy * ftPerUnit,
    p2: fraction(b.p2Pct, BAND_DEFAULTS.p2Pct),
    idf: fraction(b.idfPct, BAND_DEFAULTS.idfPct),
    cnPoints: b.cnPoints ?? BAND_DEFAULTS.cnPoints,
    runoffC: fraction(b.runoffCPct, BAND_DEFAULTS.runoffCPct),
    draws: b.draws ?? BAND_DEFAULTS.draws,
    seed: b.seed ?? BAND_DEFAULTS.seed,
  };
}
