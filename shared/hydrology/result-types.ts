/**
 * The shape of a computed result (the command line prints it as JSON). Every number is in the
 * declared unit system (see `unitLabels`), times in minutes and hours; never NaN or Infinity.
 */
import type { Arc, ArcMethod } from "./arc";
import type { MethodId } from "./method-ids";
import type { UnitLabels, UnitSystem } from "./units";
import type { UncertaintyResult } from "./uncertainty/analysis";
import type { HydrologyWarning } from "./warnings";

export type Regime = "sheet" | "shallow" | "channel";

export type SegmentEquation =
  "velocity-k" | "manning" | "tr55-sheet" | "kinematic-wave" | "nrcs-lag";

export interface SegmentResult {
  readonly index: number;
  readonly regime: Regime;
  readonly equation: SegmentEquation;
  readonly travelTimeMin: number;
  readonly travelTimeHr: number;
  /** Mean velocity where the equation gives one (length unit per second). */
  readonly velocity?: number;
  readonly flowArea?: number;
  readonly wettedPerimeter?: number;
  readonly hydraulicRadius?: number;
  /** Curve number used (nrcs-lag, the segment alone). */
  readonly cn?: number;
  /** Of travelTimeMin, the time past the sheet-flow cap, carried as shallow flow. */
  readonly pastCapMin?: number;
}

export interface Validity {
  /** The range the method was developed for, in words, with its source. */
  readonly range: string;
  /** Where this case lies outside that range (empty when inside). */
  readonly outside: readonly string[];
}

interface MethodCommon {
  readonly id: MethodId;
  readonly label: string;
  readonly kind: "method" | "check";
  readonly source: string;
}

export interface MethodUnavailable extends MethodCommon {
  readonly status: "unavailable";
  readonly reason: string;
  /** Input fields that would make the method computable. */
  readonly fields: readonly string[];
}

export interface MethodOk extends MethodCommon {
  readonly status: "ok";
  /** "whole-path": every segment; "overland": the sheet segments only (Kerby, FAA). */
  readonly scope: "whole-path" | "overland";
  /** Tc as computed, before the minimum Tc. */
  readonly computedMin: number;
  /** Tc with the minimum Tc applied. */
  readonly totalMin: number;
  readonly totalHr: number;
  readonly minimumApplied: boolean;
  readonly segments: readonly SegmentResult[];
  readonly validity: Validity;
}

/**
 * Sheet flow over more than one segment: which series rule combined them, and the Tc (with the
 * minimum applied) each other rule would give. Null with one sheet segment or none.
 */
export interface OverlandSeriesNote {
  readonly rule: "overlandSeries" | "sheetFlowSeries";
  readonly used: string;
  readonly usedLabel: string;
  readonly sheetSegments: number;
  readonly alternatives: ReadonlyArray<{
    readonly option: string;
    readonly label: string;
    readonly totalMin: number;
  }>;
}

export interface SegmentalResult extends MethodOk {
  readonly overlandSeries: OverlandSeriesNote | null;
}

export interface KinematicResult extends MethodOk {
  readonly overlandSeries: OverlandSeriesNote | null;
  /** Design intensity on the overland segments, at the solved overland time. */
  readonly intensity: number;
  readonly overlandMin: number;
  readonly k: number;
  readonly kLabel: string;
  readonly solver: "fixed-point" | "bracketing";
  readonly toleranceMin: number;
  /** Every iterate (tc, i(tc)), in order, for a convergence plot. */
  readonly iterations: ReadonlyArray<{ readonly tcMin: number; readonly intensity: number }>;
}

export interface LagResult extends MethodOk {
  readonly flowLength: number;
  /** Where the CN came from: the subcatchment's area-weighted CN or the path's segments. */
  readonly cnSource: "watershed" | "path-weighted";
  readonly cnArcII: number;
  readonly cn: number;
  /** The ARC of the CN used: II unless rules.lagUsesArc is on. */
  readonly arc: Arc;
  readonly arcMethod: ArcMethod;
  readonly arcApplied: boolean;
  readonly avgSlopePercent: number;
  readonly slopeSource: "watershed" | "flow-path";
  readonly lagHr: number;
  /** Always false: `segments` give the lag of each segment alone; they do not add up to Tc. */
  readonly segmentTimesAdditive: false;
  /** Σ of the lag equation on each segment alone: NOT the method's Tc (kept for comparison). */
  readonly segmentSumMin: number;
}

export interface CheckResult extends MethodOk {
  /** The figures the check formula used, in the declared units. */
  readonly inputs: Readonly<Record<string, number>>;
}

export type Outcome<T extends MethodOk> = T | MethodUnavailable;

export interface MethodResults {
  readonly velocity: Outcome<MethodOk>;
  readonly "nrcs-lag": Outcome<LagResult>;
  readonly "kinematic-wave": Outcome<KinematicResult>;
  readonly "nrcs-segmental": Outcome<SegmentalResult>;
  readonly kirpich: Outcome<CheckResult>;
  readonly kerby: Outcome<CheckResult>;
  readonly faa: Outcome<CheckResult>;
  readonly "kerby-kirpich": Outcome<CheckResult>;
}

export interface Governing {
  readonly method: MethodId;
  readonly tcMin: number;
  readonly tcHr: number;
  readonly reason: string;
}

export interface PeakFlow {
  readonly value: number;
  readonly unit: UnitLabels["flow"];
  readonly c: number;
  readonly cf: number;
  readonly cfTimesC: number;
  readonly intensity: number;
  readonly durationMin: number;
  readonly area: number;
  readonly returnPeriodYears: number;
  /**
   * Q / (Cf·C·i·A) in the declared units: US 43,560/43,200 = 1.00833 ("exact") or 1 ("1.0");
   * SI 1/360 (or 1/(360·1.00833) with "1.0", which keeps the US convention's figure).
   */
  readonly unitFactor: number;
  readonly unitFactorRule: "exact" | "1.0";
}

export interface RulesApplied {
  readonly minTcMin: number;
  readonly sheetFlowMaxLength: string;
  readonly sheetFlowPastCap: "shallow" | "refuse" | "warn";
  readonly overlandSeries: "cascade" | "independent";
  readonly sheetFlowSeries: "cascade" | "weighted-n" | "independent";
  readonly kinematicWaveK: {
    readonly value: number;
    readonly label: string;
    readonly source: string;
  };
  readonly arc: Arc;
  readonly arcMethod: ArcMethod;
  readonly lagUsesArc: boolean;
  readonly governing: string;
  readonly frequencyFactor: boolean;
  readonly rationalUsFactor: "exact" | "1.0";
  readonly allowIdfExtrapolation: boolean;
  readonly lagCn: "path-weighted" | "watershed";
  readonly manningConstant: "1.49" | "exact";
  readonly kirpichAdjustment: "none" | "paved-overland" | "concrete-channel";
}

export interface ComputeResult {
  readonly units: UnitSystem;
  readonly unitLabels: UnitLabels;
  readonly returnPeriodYears: number;
  readonly rules: RulesApplied;
  readonly methods: MethodResults;
  readonly governing: Governing;
  readonly peakFlow: PeakFlow | null;
  readonly warnings: readonly HydrologyWarning[];
  readonly caution: string;
  /** With compute(input, { uncertainty: true }): the sensitivity view and Monte Carlo band. */
  readonly uncertainty?: UncertaintyResult;
}

export const CAUTION =
  "Design aid for qualified engineers: local drainage criteria and the engineer of record govern.";
