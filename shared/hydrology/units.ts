/**
 * The one conversion module: every factor between US customary and SI units lives here.
 *
 * Definitions, all exact:
 * - 1 ft = 0.3048 m: the international foot (1959 agreement; NIST SP 811 (2008) Appendix B;
 *   the US survey foot was retired on 1 January 2023).
 * - 1 in = 1/12 ft = 25.4 mm.
 * - 1 acre = 43,560 ft² (= 4,046.856 422 4 m² with the international foot).
 * - 1 ha = 10,000 m².
 * - 1 h = 60 min = 3,600 s.
 *
 * Rillmark computes inside in US customary units (the published equations are printed that way)
 * and converts SI input and output here, at the boundary, so a case entered in either system
 * gives the same answer to rounding (about 1e-15 relative).
 */

export type UnitSystem = "us" | "si";

/** Metres per international foot (exact by definition). */
export const M_PER_FT = 0.3048;
/** Millimetres per inch (exact: 0.3048 m / 12 × 1000). */
export const MM_PER_IN = 25.4;
/** Square feet per acre (exact by definition). */
export const FT2_PER_ACRE = 43_560;
/** Square metres per hectare (exact by definition). */
export const M2_PER_HA = 10_000;
/** Square metres per acre, from the two definitions above (4,046.856 422 4). */
export const M2_PER_ACRE = FT2_PER_ACRE * M_PER_FT * M_PER_FT;
/** Cubic metres per cubic foot (0.028 316 846 592). */
export const M3_PER_FT3 = M_PER_FT * M_PER_FT * M_PER_FT;
export const SECONDS_PER_MINUTE = 60;
export const MINUTES_PER_HOUR = 60;
export const SECONDS_PER_HOUR = 3_600;
/** Feet per statute mile (exact: 5,280 ft). */
export const FT_PER_MILE = 5_280;
/** Acres per square mile (exact: 5,280² / 43,560 = 640). */
export const ACRES_PER_SQUARE_MILE = (FT_PER_MILE * FT_PER_MILE) / FT2_PER_ACRE;

export const ftFromM = (lengthM: number): number => lengthM / M_PER_FT;
export const mFromFt = (lengthFt: number): number => lengthFt * M_PER_FT;
export const inFromMm = (depthMm: number): number => depthMm / MM_PER_IN;
export const mmFromIn = (depthIn: number): number => depthIn * MM_PER_IN;
export const acFromHa = (areaHa: number): number => (areaHa * M2_PER_HA) / M2_PER_ACRE;
export const haFromAc = (areaAc: number): number => (areaAc * M2_PER_ACRE) / M2_PER_HA;
export const ft2FromM2 = (areaM2: number): number => areaM2 / (M_PER_FT * M_PER_FT);
export const m2FromFt2 = (areaFt2: number): number => areaFt2 * M_PER_FT * M_PER_FT;
export const cfsFromM3PerS = (flowM3PerS: number): number => flowM3PerS / M3_PER_FT3;
export const m3PerSFromCfs = (flowCfs: number): number => flowCfs * M3_PER_FT3;
export const hrFromMin = (timeMin: number): number => timeMin / MINUTES_PER_HOUR;
export const minFromHr = (timeHr: number): number => timeHr * MINUTES_PER_HOUR;

/** Unit labels of the declared system, for results and printed sheets. */
export interface UnitLabels {
  readonly length: "ft" | "m";
  readonly velocity: "ft/s" | "m/s";
  readonly depth: "in" | "mm";
  readonly intensity: "in/h" | "mm/h";
  readonly area: "ac" | "ha";
  readonly flowArea: "ft²" | "m²";
  readonly flow: "cfs" | "m³/s";
  readonly time: "min";
}

export const UNIT_LABELS: Readonly<Record<UnitSystem, UnitLabels>> = {
  us: {
    length: "ft",
    velocity: "ft/s",
    depth: "in",
    intensity: "in/h",
    area: "ac",
    flowArea: "ft²",
    flow: "cfs",
    time: "min",
  },
  si: {
    length: "m",
    velocity: "m/s",
    depth: "mm",
    intensity: "mm/h",
    area: "ha",
    flowArea: "m²",
    flow: "m³/s",
    time: "min",
  },
};

/**
 * Converts internal US values to the declared system for output. Inputs are named by their
 * internal unit; the output is in the declared unit (identity for "us").
 */
export interface OutputUnits {
  readonly system: UnitSystem;
  readonly labels: UnitLabels;
  length(lengthFt: number): number;
  velocity(velocityFtPerS: number): number;
  depth(depthIn: number): number;
  intensity(intensityInPerHr: number): number;
  area(areaAc: number): number;
  flowArea(areaFt2: number): number;
  flow(flowCfs: number): number;
}

const identity = (value: number): number => value;

export function outputUnits(system: UnitSystem): OutputUnits {
  const labels = UNIT_LABELS[system];
  if (system === "us") {
    return {
      system,
      labels,
      length: identity,
      velocity: identity,
      depth: identity,
      intensity: identity,
      area: identity,
      flowArea: identity,
      flow: identity,
    };
  }
  return {
    system,
    labels,
    length: mFromFt,
    velocity: mFromFt,
    depth: mmFromIn,
    intensity: mmFromIn,
    area: haFromAc,
    flowArea: m2FromFt2,
    flow: m3PerSFromCfs,
  };
}
