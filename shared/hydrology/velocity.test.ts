import { describe, expect, it } from "vitest";
import {
  TR55_PAVED_K_FT_PER_S,
  TR55_UNPAVED_K_FT_PER_S,
  shallowConcentratedVelocityFtPerS,
} from "./shallow";
import { M_PER_FT } from "./units";
import { travelTimeMin, velocityFromK, velocityKFromManning } from "./velocity";

/**
 * NEH Part 630 Ch 15 (2010) Table 15-3: surface, Manning's n, hydraulic radius r (ft), k (ft/s),
 * k (m/s). k and its SI column as given in the brief (from memory); n and r from memory.
 * Each k is printed from k = (1.486/n)·r^(2/3) (derived).
 */
const TABLE_15_3: ReadonlyArray<readonly [string, number, number, number, number]> = [
  ["pavement; small upland gullies", 0.025, 0.2, 20.3282, 6.196],
  ["grassed waterway", 0.05, 0.4, 16.1345, 4.918],
  ["nearly bare and untilled; alluvial fans", 0.051, 0.2, 9.965, 3.037],
  ["cultivated straight row crops", 0.058, 0.2, 8.762, 2.671],
  ["short-grass pasture", 0.073, 0.2, 6.962, 2.122],
  ["minimum tillage, contour/strip crop; woodland", 0.101, 0.2, 5.032, 1.534],
  ["forest with heavy ground litter; hay meadow", 0.202, 0.2, 2.516, 0.767],
];

describe("NEH 630 Ch 15 (2010) Table 15-3 velocity coefficients [from memory]", () => {
  // Tolerance 5e-4 ft/s: k is printed to 3–4 decimals.
  it.each(TABLE_15_3)("%s: k = (1.486/n)·r^(2/3)", (_surface, n, r, kFt) => {
    expect(Math.abs(velocityKFromManning(n, r) - kFt)).toBeLessThan(5e-4);
  });
  // Tolerance 5e-4 m/s: the SI column is printed to 3 decimals; k m/s = 0.3048·k ft/s (derived).
  it.each(TABLE_15_3)("%s: SI column = 0.3048 × US column", (_surface, _n, _r, kFt, kSi) => {
    expect(Math.abs(kFt * M_PER_FT - kSi)).toBeLessThan(5e-4);
  });
});

describe("TR-55 (1986) Figure 3-1 shallow concentrated flow [from memory]", () => {
  it("uses the Table 15-3 grassed-waterway and pavement coefficients verbatim", () => {
    expect(TR55_UNPAVED_K_FT_PER_S).toBe(16.1345);
    expect(TR55_PAVED_K_FT_PER_S).toBe(20.3282);
  });
  it("TR-55 (1986) Example 3-1 ('Heavenly Acres', Worksheet 3), segment BC: unpaved, 1,400 ft at 0.01 → V 1.6 ft/s, Tt 0.24 h [from memory]", () => {
    // Tolerances: half a unit of the printed last digit (0.05 ft/s, 0.005 h).
    const v = shallowConcentratedVelocityFtPerS("unpaved", 0.01);
    expect(Math.abs(v - 1.6)).toBeLessThan(0.05);
    expect(Math.abs(travelTimeMin(1400, v) / 60 - 0.24)).toBeLessThan(0.005);
  });
  it("paved flow at 1 % runs at 2.03 ft/s (derived: 20.3282 × 0.1)", () => {
    expect(shallowConcentratedVelocityFtPerS("paved", 0.01)).toBeCloseTo(2.03282, 10);
  });
});

describe("travel time (TR-55 eq 3-1: Tt = L/(3600·V) h)", () => {
  it("1,800 ft at 1 ft/s is 30 min", () => {
    expect(travelTimeMin(1800, 1)).toBe(30);
  });
  it("V = k·s^0.5", () => {
    expect(velocityFromK(10, 0.04)).toBeCloseTo(2, 12);
  });
});
