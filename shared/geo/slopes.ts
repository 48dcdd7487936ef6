/**
 * Segment slopes from elevations along the path.
 *
 *   slope = Δz / L   (m/m, positive downhill: the upper end minus the lower end, over the length)
 *
 * End-to-end: Δz between the segment's two ends over its length (TR-55, 1986, chapter 3 uses the
 * land or water-surface slope of each segment).
 * 10–85 (channel segments, a design-rule option): Δz between the points at 10 % and 85 % of the
 * segment's length over 0.75·L, leaving out the steep head and the flat outfall (Benson, 1962,
 * USGS Water-Supply Paper 1580-B; from memory). Rillmark applies it per channel segment, since
 * each segment carries its own travel time.
 *
 * A slope that cannot be used is a problem on its segment, never NaN: "no-elevation" (a needed
 * end has no elevation; slope null), "zero-slope" (no fall; slope 0), "adverse-slope" (the
 * segment climbs; the negative slope is kept so the engineer sees it), "zero-length".
 */
import type { FlowRegime } from "./types";

export type ElevationSource = "terrain" | "survey";

export interface ElevationSample {
  readonly elevationM: number;
  readonly source: ElevationSource;
}

/** Elevation at a station (metres from the divide), or null where none is known. */
export type ElevationAt = (stationM: number) => ElevationSample | null;

export type ChannelSlopeMethod = "end-to-end" | "10-85";
export type SlopeProblem = "zero-slope" | "adverse-slope" | "no-elevation" | "zero-length";

export interface SlopeInput {
  readonly stationFromM: number;
  readonly stationToM: number;
  readonly regime: FlowRegime;
}

export interface SegmentSlope {
  /** Elevations at the segment's upper and lower ends (shown on the sheet and profile). */
  readonly from: ElevationSample | null;
  readonly to: ElevationSample | null;
  readonly method: ChannelSlopeMethod;
  /** The two stations the slope is measured between (the ends, or the 10 % and 85 % points). */
  readonly slopeFromStationM: number;
  readonly slopeToStationM: number;
  /** Fall between those stations in metres (negative when the segment climbs). */
  readonly dropM: number | null;
  readonly slopeMPerM: number | null;
  readonly problem: SlopeProblem | null;
}

/** A fall below a micrometre is float noise, not a fall. */
const ZERO_DROP_M = 1e-6;

export function segmentSlopes(
  segments: readonly SlopeInput[],
  elevationAt: ElevationAt,
  options: { readonly channelSlope: ChannelSlopeMethod },
): SegmentSlope[] {
  // Neighbouring segments share an end: ask for each station once.
  const cache = new Map<number, ElevationSample | null>();
  const at = (stationM: number) => {
    if (!cache.has(stationM)) cache.set(stationM, elevationAt(stationM));
    return cache.get(stationM)!;
  };
  return segments.map((s) => {
    const from = at(s.stationFromM);
    const to = at(s.stationToM);
    const lengthM = s.stationToM - s.stationFromM;
    const method: ChannelSlopeMethod =
      s.regime === "channel" && options.channelSlope === "10-85" ? "10-85" : "end-to-end";
    const upperM = method === "10-85" ? s.stationFromM + 0.1 * lengthM : s.stationFromM;
    const lowerM = method === "10-85" ? s.stationFromM + 0.85 * lengthM : s.stationToM;
    const base = { from, to, method, slopeFromStationM: upperM, slopeToStationM: lowerM };
    if (!(lengthM > 0)) return { ...base, dropM: null, slopeMPerM: null, problem: "zero-length" };
    const upper = method === "10-85" ? at(upperM) : from;
    const lower = method === "10-85" ? at(lowerM) : to;
    if (!upper || !lower)
      return { ...base, dropM: null, slopeMPerM: null, problem: "no-elevation" };
    const dropM = upper.elevationM - lower.elevationM;
    if (Math.abs(dropM) < ZERO_DROP_M) {
      return { ...base, dropM: 0, slopeMPerM: 0, problem: "zero-slope" };
    }
    const slopeMPerM = dropM / (lowerM - upperM);
    return { ...base, dropM, slopeMPerM, problem: dropM < 0 ? "adverse-slope" : null };
  });
}

/**
 * Whether the path seems drawn the wrong way: its outlet end is higher than its top. Unknown
 * elevations give false (nothing to offer).
 */
export function isPathReversed(elevationTopM: number | null, elevationOutletM: number | null) {
  if (elevationTopM === null || elevationOutletM === null) return false;
  return elevationOutletM - elevationTopM > ZERO_DROP_M;
}

export interface SurveyedElevation {
  readonly stationM: number;
  readonly elevationM: number;
}

/**
 * Elevations from the terrain with surveyed points taking over: a station within `toleranceM`
 * of a surveyed station gets the nearest surveyed elevation (a survey shot is taken at a point;
 * it does not re-shape the ground around it).
 */
export function withSurveyOverrides(
  terrainAt: (stationM: number) => number | null,
  surveyed: readonly SurveyedElevation[],
  toleranceM = 0.5,
): ElevationAt {
  const sorted = [...surveyed].sort((a, b) => a.stationM - b.stationM);
  return (stationM) => {
    let best: SurveyedElevation | null = null;
    for (const s of sorted) {
      const offM = Math.abs(s.stationM - stationM);
      if (offM <= toleranceM && (!best || offM < Math.abs(best.stationM - stationM))) best = s;
    }
    if (best) return { elevationM: best.elevationM, source: "survey" };
    const z = terrainAt(stationM);
    return z === null || Number.isNaN(z) ? null : { elevationM: z, source: "terrain" };
  };
}
