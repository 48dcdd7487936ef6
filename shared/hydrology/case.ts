/**
 * The boundary: a parsed input in either unit system becomes one internal case in US customary
 * units (ft, ft/s, in, in/h, ac), through the exact factors of units.ts. Everything after this
 * point computes in US units; results are converted back for output (units.outputUnits).
 */
import type { IdfInput } from "./idf-schema";
import type { IdfData, ShermanCoefficients } from "./idf";
import type { ComputeInput, SectionInput, SegmentInput } from "./input-schema";
import type { ChannelSection } from "./manning";
import { applySheetCap, type CapSplit } from "./sheet-cap";
import { resolveRules, type ResolvedRules } from "./rules";
import { acFromHa, ft2FromM2, ftFromM, inFromMm, type UnitSystem } from "./units";

interface SegmentBase {
  /** The input segment this computes (a sheet segment cut at the cap gives two parts). */
  readonly index: number;
  /** Set on the part of a sheet segment that lies past the sheet-flow cap (now shallow). */
  readonly pastCap?: true;
  readonly lengthFt: number;
  readonly slopeFtPerFt: number;
  readonly cn: number | undefined;
}

export type InternalSegment = SegmentBase &
  (
    | {
        readonly regime: "sheet";
        readonly sheetN: number;
        readonly kFtPerS: number | undefined;
        readonly shallowKFtPerS: number | undefined;
        readonly kerbyN: number | undefined;
      }
    | { readonly regime: "shallow"; readonly kFtPerS: number }
    | { readonly regime: "channel"; readonly manningN: number; readonly section: ChannelSection }
  );

export interface InternalCase {
  readonly units: UnitSystem;
  readonly returnPeriodYears: number;
  readonly rules: ResolvedRules;
  readonly p2In: number | undefined;
  readonly idf: IdfData;
  readonly watershed: {
    readonly areaAc: number | undefined;
    readonly avgSlopePercent: number | undefined;
    readonly cn: number | undefined;
    readonly c: number | undefined;
  };
  /** The computed segments: the input's, with sheet flow past the cap carried as the rule says. */
  readonly segments: readonly InternalSegment[];
  /** Where sheet flow past the cap became shallow flow (rules.sheetFlowPastCap = "shallow"). */
  readonly capSplits: readonly CapSplit[];
}

const lengthIn = (units: UnitSystem) => (value: number) =>
  units === "si" ? ftFromM(value) : value;

function sectionFt(section: SectionInput, units: UnitSystem): ChannelSection {
  const ft = lengthIn(units);
  switch (section.shape) {
    case "given":
      return {
        shape: "given",
        flowArea: units === "si" ? ft2FromM2(section.flowArea) : section.flowArea,
        wettedPerimeter: ft(section.wettedPerimeter),
      };
    case "trapezoid":
      return {
        shape: "trapezoid",
        bottomWidth: ft(section.bottomWidth),
        sideSlopeLeft: section.sideSlopeLeft ?? section.sideSlope ?? 0,
        sideSlopeRight: section.sideSlopeRight ?? section.sideSlope ?? 0,
        depth: ft(section.depth),
      };
    case "circular":
      return {
        shape: "circular",
        diameter: ft(section.diameter),
        flowDepth: ft(section.flowDepth ?? section.diameter),
      };
  }
}

// Object literals, not spreads: V8 builds spread objects slowly (µs each), and paths may hold
// thousands of segments.
function segmentFt(segment: SegmentInput, index: number, units: UnitSystem): InternalSegment {
  const ft = lengthIn(units);
  const lengthFt = ft(segment.length);
  const slopeFtPerFt = segment.slope;
  const cn = segment.cn;
  switch (segment.regime) {
    case "sheet":
      return {
        index,
        lengthFt,
        slopeFtPerFt,
        cn,
        regime: "sheet",
        sheetN: segment.n,
        kFtPerS: segment.k === undefined ? undefined : ft(segment.k),
        shallowKFtPerS: segment.shallowK === undefined ? undefined : ft(segment.shallowK),
        kerbyN: segment.kerbyN,
      };
    case "shallow":
      return { index, lengthFt, slopeFtPerFt, cn, regime: "shallow", kFtPerS: ft(segment.k) };
    case "channel":
      return {
        index,
        lengthFt,
        slopeFtPerFt,
        cn,
        regime: "channel",
        manningN: segment.manningN,
        section: sectionFt(segment.section, units),
      };
  }
}

/** IDF input → internal IDF data (intensity in in/h; depth tables become intensity). */
export function idfDataFromInput(idf: IdfInput, units: UnitSystem): IdfData {
  const inches = (value: number) => (units === "si" ? inFromMm(value) : value);
  if (idf.kind === "formula") {
    const curves = new Map<number, ShermanCoefficients>();
    for (const [years, f] of Object.entries(idf.formula)) {
      curves.set(Number(years), { a: inches(f.a), b: f.b, c: f.c });
    }
    return { kind: "formula", curves };
  }
  const rows = idf.intensity ?? idf.depth ?? [];
  const isDepth = idf.intensity === undefined;
  return {
    kind: "table",
    durationsMin: idf.durationsMin,
    returnPeriodsYears: idf.returnPeriodsYears,
    intensityInPerHr: rows.map((row, r) =>
      row.map((value) =>
        inches(isDepth ? (value * 60) / (idf.durationsMin[r] ?? Number.NaN) : value),
      ),
    ),
  };
}

export function toInternalCase(input: ComputeInput): InternalCase {
  const { units } = input;
  const w = input.watershed ?? {};
  const rules = resolveRules(input.rules, units, input.returnPeriodYears);
  const capped = applySheetCap(
    input.segments.map((segment, index) => segmentFt(segment, index, units)),
    rules,
    units,
  );
  return {
    units,
    returnPeriodYears: input.returnPeriodYears,
    rules,
    p2In:
      input.rainfall.p2_24h === undefined
        ? undefined
        : units === "si"
          ? inFromMm(input.rainfall.p2_24h)
          : input.rainfall.p2_24h,
    idf: idfDataFromInput(input.rainfall.idf, units),
    watershed: {
      areaAc: w.area === undefined ? undefined : units === "si" ? acFromHa(w.area) : w.area,
      avgSlopePercent: w.avgSlopePercent,
      cn: w.cn,
      c: w.c,
    },
    segments: capped.segments,
    capSplits: capped.splits,
  };
}
