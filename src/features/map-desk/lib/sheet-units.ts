/**
 * The travel-time sheet shown in the unit system the engineer picks. The server answers in the
 * project's units; lengths, elevations, velocities, areas and flows are converted here through
 * shared/hydrology/units.ts only. Slopes, times, n, CN and C have no unit to convert.
 */
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import {
  UNIT_LABELS,
  acFromHa,
  cfsFromM3PerS,
  ftFromM,
  haFromAc,
  inFromMm,
  m3PerSFromCfs,
  mFromFt,
  mmFromIn,
  type UnitSystem,
} from "../../../../shared/hydrology/units";

interface Converters {
  length(v: number): number;
  area(v: number): number;
  flow(v: number): number;
  depth(v: number): number;
}

const IDENTITY: Converters = {
  length: (v) => v,
  area: (v) => v,
  flow: (v) => v,
  depth: (v) => v,
};

function converters(from: UnitSystem, to: UnitSystem): Converters {
  if (from === to) return IDENTITY;
  return to === "si"
    ? { length: mFromFt, area: haFromAc, flow: m3PerSFromCfs, depth: mmFromIn }
    : { length: ftFromM, area: acFromHa, flow: cfsFromM3PerS, depth: inFromMm };
}

const maybe = (v: number | null, f: (x: number) => number) => (v === null ? null : f(v));

const flowPoint = (p: { tcMin: number | null; peak: number | null }, c: Converters) => ({
  tcMin: p.tcMin,
  peak: maybe(p.peak, c.flow),
});

function withoutUnitFactor<T extends { unitFactor?: number }>(p: T): Omit<T, "unitFactor"> {
  const { unitFactor: _dropped, ...rest } = p;
  return rest;
}

export function sheetInUnits(sheet: TravelTimeSheet, to: UnitSystem): TravelTimeSheet {
  if (sheet.units === to) return sheet;
  const c = converters(sheet.units, to);
  const len = (v: number) => c.length(v);
  return {
    ...sheet,
    units: to,
    unitLabels: { ...sheet.unitLabels, ...UNIT_LABELS[to] },
    totalLength: len(sheet.totalLength),
    breaks: {
      ...sheet.breaks,
      sheetEnd: maybe(sheet.breaks.sheetEnd, len),
      channelStart: maybe(sheet.breaks.channelStart, len),
    },
    segments: sheet.segments.map((s) => ({
      ...s,
      stationFrom: len(s.stationFrom),
      stationTo: len(s.stationTo),
      length: len(s.length),
      // k is a velocity (V = k·√s), so it converts as a length per second.
      k: maybe(s.k, len),
      elevationUp: maybe(s.elevationUp, len),
      elevationDown: maybe(s.elevationDown, len),
      velocity: maybe(s.velocity, len),
    })),
    // unitFactor is dropped: the printed formula derives it from the converted figures.
    peakFlow: sheet.peakFlow && {
      ...withoutUnitFactor(sheet.peakFlow),
      value: c.flow(sheet.peakFlow.value),
      unit: UNIT_LABELS[to].flow,
      area: c.area(sheet.peakFlow.area),
      intensity: c.depth(sheet.peakFlow.intensity),
    },
    figures: { ...sheet.figures, area: maybe(sheet.figures.area, c.area) },
    // Peak flows of the band and the sensitivity bars convert as flows; times do not.
    uncertainty: sheet.uncertainty && {
      ...sheet.uncertainty,
      sensitivity: {
        entered: flowPoint(sheet.uncertainty.sensitivity.entered, c),
        bars: sheet.uncertainty.sensitivity.bars.map((b) => ({
          ...b,
          low: flowPoint(b.low, c),
          high: flowPoint(b.high, c),
        })),
      },
      monteCarlo: {
        ...sheet.uncertainty.monteCarlo,
        peak: sheet.uncertainty.monteCarlo.peak && {
          p10: c.flow(sheet.uncertainty.monteCarlo.peak.p10),
          p50: c.flow(sheet.uncertainty.monteCarlo.peak.p50),
          p90: c.flow(sheet.uncertainty.monteCarlo.peak.p90),
        },
      },
    },
    // Intensities convert as depths per hour.
    kinematic: sheet.kinematic && {
      ...sheet.kinematic,
      intensity: c.depth(sheet.kinematic.intensity),
      iterations: sheet.kinematic.iterations.map((it) => ({
        tcMin: it.tcMin,
        intensity: c.depth(it.intensity),
      })),
    },
    profile: sheet.profile.map((p) => ({
      station: len(p.station),
      elevation: maybe(p.elevation, len),
    })),
  };
}
