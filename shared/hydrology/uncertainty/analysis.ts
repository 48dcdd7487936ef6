/**
 * How sure is each Tc: a sensitivity view (each input group moved to the ends of its band, the
 * others as entered: the bars of a tornado chart) and a seeded Monte Carlo band (P10 / P50 / P90
 * of every method's Tc, the governing Tc and the peak flow). Bands and their basis are design
 * rules (bands.ts). Percentiles interpolate linearly between order statistics (Hyndman & Fan
 * type 7, the default of R and NumPy). Draws: xoroshiro128+ (pure-rand) from the seed; each
 * group's share of its band is the sum of two uniforms minus one, a triangular distribution on
 * −1…1 with its mode at the entered value. Everything runs in internal US units, so a case
 * entered in SI gives the same band.
 */
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import type { InternalCase } from "../case";
import { intensityCurve } from "../idf";
import { METHOD_IDS, type MethodId } from "../method-ids";
import type { OutputUnits } from "../units";
import { BAND_DEFAULTS, BAND_SOURCES } from "./bands";
import { ENTERED, evaluate, kernelModel, type Draw, type KernelModel } from "./kernel";

export const INPUT_GROUPS = [
  "roughness",
  "velocityK",
  "slope",
  "p2",
  "idf",
  "cn",
  "runoffC",
] as const;
export type InputGroup = (typeof INPUT_GROUPS)[number];

export const INPUT_GROUP_LABELS: Readonly<Record<InputGroup, string>> = {
  roughness: "Manning's n and Kerby's N",
  velocityK: "Velocity coefficient k",
  slope: "Slopes",
  p2: "2-year 24-hour rainfall P2",
  idf: "IDF intensities",
  cn: "Curve numbers",
  runoffC: "Runoff coefficient C",
};

export interface Percentiles {
  readonly p10: number;
  readonly p50: number;
  readonly p90: number;
}

export interface SensitivityBar {
  readonly input: InputGroup;
  readonly label: string;
  readonly band: string;
  /** The input lowered / raised to the end of its band. */
  readonly low: { readonly tcMin: number | null; readonly peak: number | null };
  readonly high: { readonly tcMin: number | null; readonly peak: number | null };
}

export interface UncertaintyResult {
  readonly bands: ReadonlyArray<{ input: InputGroup; label: string; band: string }>;
  readonly sensitivity: {
    readonly entered: { readonly tcMin: number | null; readonly peak: number | null };
    /** Largest swing of the governing Tc first. */
    readonly bars: readonly SensitivityBar[];
  };
  readonly monteCarlo: {
    readonly draws: number;
    readonly seed: number;
    readonly distribution: string;
    readonly governingTcMin: Percentiles | null;
    readonly peak: Percentiles | null;
    /** Per method; null where the method is unavailable in every draw. */
    readonly methods: Readonly<Record<MethodId, (Percentiles & { readonly draws: number }) | null>>;
  };
}

function bandText(kase: InternalCase, out: OutputUnits, group: InputGroup): string {
  const b = kase.rules.bands;
  const pct = (f: number) => `±${Number((100 * f).toPrecision(4))} %`;
  /** The default band cites its basis; a band of the project's own is a design rule. */
  const basis = (value: number, fallback: number, source: string) =>
    value === fallback ? source : "design rule";
  switch (group) {
    case "roughness":
      return `${pct(b.roughness)} (${basis(b.roughness * 100, BAND_DEFAULTS.roughnessPct, BAND_SOURCES.roughness)})`;
    case "velocityK":
      return `${pct(b.velocityK)} (${basis(b.velocityK * 100, BAND_DEFAULTS.velocityKPct, BAND_SOURCES.velocityK)})`;
    case "slope":
      return b.verticalAccuracyFt === null
        ? `${pct(b.slope)} (${basis(b.slope * 100, BAND_DEFAULTS.slopePct, BAND_SOURCES.slope)})`
        : `σz = ${Number(out.length(b.verticalAccuracyFt).toPrecision(4))} ${out.labels.length} ` +
            `(${BAND_SOURCES.slopeTerrain}); land slope ${pct(b.slope)}`;
    case "p2":
      return `${pct(b.p2)} (${basis(b.p2 * 100, BAND_DEFAULTS.p2Pct, BAND_SOURCES.p2)})`;
    case "idf":
      return `${pct(b.idf)} (${basis(b.idf * 100, BAND_DEFAULTS.idfPct, BAND_SOURCES.idf)})`;
    case "cn":
      return `±${b.cnPoints} CN (${basis(b.cnPoints, BAND_DEFAULTS.cnPoints, BAND_SOURCES.cn)})`;
    case "runoffC":
      return `${pct(b.runoffC)} (${basis(b.runoffC * 100, BAND_DEFAULTS.runoffCPct, BAND_SOURCES.runoffC)})`;
  }
}

/** The draw with one group at the `share` end (−1 low, +1 high) of its band. */
function oneGroup(kase: InternalCase, group: InputGroup, share: number): Draw {
  const b = kase.rules.bands;
  switch (group) {
    case "roughness":
      return { ...ENTERED, roughness: 1 + share * b.roughness };
    case "velocityK":
      return { ...ENTERED, velocityK: 1 + share * b.velocityK };
    case "slope":
      return { ...ENTERED, slopeShare: share };
    case "p2":
      return { ...ENTERED, p2: 1 + share * b.p2 };
    case "idf":
      return { ...ENTERED, idf: 1 + share * b.idf };
    case "cn":
      return { ...ENTERED, cnShift: share * b.cnPoints };
    case "runoffC":
      return { ...ENTERED, runoffC: 1 + share * b.runoffC };
  }
}

const orNull = (v: number) => (Number.isFinite(v) ? v : null);

function sensitivity(model: KernelModel): UncertaintyResult["sensitivity"] {
  const { kase, out } = model;
  const entered = evaluate(model, ENTERED);
  const point = (d: Draw) => {
    const e = evaluate(model, d);
    return { tcMin: orNull(e.governingMin), peak: orNull(e.peak) };
  };
  const bars = INPUT_GROUPS.map((input) => ({
    input,
    label: INPUT_GROUP_LABELS[input],
    band: bandText(kase, out, input),
    low: point(oneGroup(kase, input, -1)),
    high: point(oneGroup(kase, input, 1)),
  }));
  const swing = (bar: SensitivityBar) => Math.abs((bar.high.tcMin ?? 0) - (bar.low.tcMin ?? 0));
  return {
    entered: { tcMin: orNull(entered.governingMin), peak: orNull(entered.peak) },
    bars: [...bars].sort((a, b) => swing(b) - swing(a)),
  };
}

/** Type 7 percentile of ascending, finite values. */
export function percentile(sorted: Float64Array, p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const a = sorted[lo] ?? Number.NaN;
  const b = sorted[Math.min(lo + 1, sorted.length - 1)] ?? Number.NaN;
  return a + (h - lo) * (b - a);
}

function percentiles(values: Float64Array, count: number): Percentiles | null {
  if (count === 0) return null;
  const sorted = values.slice(0, count).sort();
  return {
    p10: percentile(sorted, 0.1),
    p50: percentile(sorted, 0.5),
    p90: percentile(sorted, 0.9),
  };
}

function monteCarlo(model: KernelModel): UncertaintyResult["monteCarlo"] {
  const bands = model.kase.rules.bands;
  const { draws, seed } = bands;
  const rng = xoroshiro128plus(seed);
  const share = () => uniformFloat64(rng) + uniformFloat64(rng) - 1;
  const byMethod = METHOD_IDS.map(() => ({ values: new Float64Array(draws), count: 0 }));
  const governing = { values: new Float64Array(draws), count: 0 };
  const peaks = { values: new Float64Array(draws), count: 0 };
  const keep = (into: { values: Float64Array; count: number }, v: number) => {
    if (Number.isFinite(v)) into.values[into.count++] = v;
  };
  const buffer = new Float64Array(METHOD_IDS.length);
  for (let k = 0; k < draws; k += 1) {
    const e = evaluate(
      model,
      {
        roughness: 1 + share() * bands.roughness,
        velocityK: 1 + share() * bands.velocityK,
        slopeShare: share(),
        p2: 1 + share() * bands.p2,
        idf: 1 + share() * bands.idf,
        cnShift: share() * bands.cnPoints,
        runoffC: 1 + share() * bands.runoffC,
      },
      buffer,
    );
    for (let i = 0; i < e.tcMin.length; i += 1) {
      const slot = byMethod[i];
      if (slot) keep(slot, e.tcMin[i] ?? Number.NaN);
    }
    keep(governing, e.governingMin);
    keep(peaks, e.peak);
  }
  const methods = Object.fromEntries(
    METHOD_IDS.map((id, i) => {
      const slot = byMethod[i];
      const p = slot ? percentiles(slot.values, slot.count) : null;
      return [id, p && slot ? { ...p, draws: slot.count } : null];
    }),
  ) as Record<MethodId, (Percentiles & { draws: number }) | null>;
  return {
    draws,
    seed,
    distribution:
      "each input group moved by one triangular share of its band per draw (mode at the entered value), groups independent",
    governingTcMin: percentiles(governing.values, governing.count),
    peak: percentiles(peaks.values, peaks.count),
    methods,
  };
}

function modelOf(kase: InternalCase, out: OutputUnits): KernelModel {
  const curve = intensityCurve(kase.idf, kase.returnPeriodYears, {
    allowExtrapolation: kase.rules.allowIdfExtrapolation,
  });
  return kernelModel(kase, out, curve);
}

/** The sensitivity view alone (the bench times it; the sheet takes it with the band). */
export function sensitivityView(kase: InternalCase, out: OutputUnits) {
  return sensitivity(modelOf(kase, out));
}

/** The sensitivity view and the Monte Carlo band of a case. */
export function uncertainty(kase: InternalCase, out: OutputUnits): UncertaintyResult {
  const model = modelOf(kase, out);
  return {
    bands: INPUT_GROUPS.map((input) => ({
      input,
      label: INPUT_GROUP_LABELS[input],
      band: bandText(kase, out, input),
    })),
    sensitivity: sensitivity(model),
    monteCarlo: monteCarlo(model),
  };
}
