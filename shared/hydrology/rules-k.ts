/**
 * Presets of the kinematic-wave constant K (tc = K·(n·L)^0.6/(i^0.4·S^0.3), tc min). 0.938 and
 * 6.99 follow from the kinematic solution itself (kinematic-wave.ts derives them); 0.94 and the
 * HEC-22 pair are printed constants whose public copies were not at hand (tests mark them from
 * memory), so the product cites them as commonly reproduced values.
 */
import { AS_REPRODUCED } from "./citation";
import type { UnitSystem } from "./units";

export const KINEMATIC_K_PRESETS = {
  "theory-1.49": {
    value: 0.938,
    units: "us",
    source: "derived: kinematic-wave solution with Manning 1.49, 43200^0.4/(60·1.49^0.6)",
  },
  "ragan-duru": {
    value: 0.94,
    units: "us",
    source: "Ragan & Duru (1972), as printed in Chow, Maidment & Mays (1988)",
  },
  "hec22-us": {
    value: 0.933,
    units: "us",
    source: "FHWA HEC-22 3rd ed. (2009), Ku in US units",
  },
  "hec22-si": {
    value: 6.943,
    units: "si",
    source: "FHWA HEC-22 3rd ed. (2009), Ku in SI units",
  },
  "theory-si": {
    value: 6.99,
    units: "si",
    source: "derived: kinematic-wave solution with Manning 1/n (SI), 3.6e6^0.4/60",
  },
} as const satisfies Record<string, { value: number; units: UnitSystem; source: string }>;

export type KinematicKPreset = keyof typeof KINEMATIC_K_PRESETS;

/** The preset's citation as screens show it. */
export function kPresetSourceNote(preset: KinematicKPreset): string {
  const p = KINEMATIC_K_PRESETS[preset];
  return p.source.startsWith("derived") ? p.source : `${p.source} (${AS_REPRODUCED})`;
}
