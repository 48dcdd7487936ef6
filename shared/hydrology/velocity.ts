/**
 * Velocity method and travel time.
 *
 *   V = k·s^0.5            V ft/s (m/s), k ft/s (m/s), s ft/ft (m/m)
 *   Tt = L / (3600·V)      Tt h, L ft, V ft/s        (TR-55 (1986) eq 3-1)
 *   Tc = Σ Tt              over the segments of the flow path (TR-55 (1986) eq 3-2)
 *
 * Source: NEH Part 630 Ch 15 (2010), velocity method, k from Table 15-3 (each row is Manning's
 * equation with a tabulated n and hydraulic radius: k = (1.486/n)·r^(2/3)). Because s is
 * dimensionless, k converts like a velocity (k m/s = 0.3048·k ft/s).
 * Validity: upland and shallow concentrated flow; slopes under 0.001 ft/ft are unreliable.
 */
import { SECONDS_PER_MINUTE } from "./units";

/** V = k·s^0.5 in the unit of k. */
export function velocityFromK(kPerS: number, slopeFtPerFt: number): number {
  return kPerS * Math.sqrt(slopeFtPerFt);
}

/** Travel time in minutes of a reach of length L at velocity V (same length unit). */
export function travelTimeMin(lengthFt: number, velocityFtPerS: number): number {
  return lengthFt / velocityFtPerS / SECONDS_PER_MINUTE;
}

/** NEH 630 Table 15-3 form: k = (1.486/n)·r^(2/3), k ft/s, r ft. */
export function velocityKFromManning(manningN: number, hydraulicRadiusFt: number): number {
  return (1.486 / manningN) * Math.pow(hydraulicRadiusFt, 2 / 3);
}
