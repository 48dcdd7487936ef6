/**
 * The travel-time sheet of a subcatchment: its flow path cut into ordered segments (cover,
 * soil, regime, slope), every method's travel times and totals, the governing Tc with its
 * reason, the subcatchment's figures and the peak flow. Numbers are in the project's units
 * (`unitLabels`), times in minutes and hours; a figure that cannot be had is null, never NaN.
 */
import { z } from "zod";
import { METHOD_IDS } from "../hydrology/method-ids";

const num = z.number();
const maybe = num.nullable();

export const ELEVATION_SOURCES = ["terrain", "survey", "mixed"] as const;
/** Sheets stored before overrides existed have no source: their classes are the cover layer's. */
export const SURFACE_SOURCES = ["cover-layer", "override"] as const;

export const sheetSegmentSchema = z.object({
  index: z.number().int(),
  stationFrom: num,
  stationTo: num,
  length: num,
  /** The same stretch in metres (what the split works in). */
  stationFromM: num,
  stationToM: num,
  regime: z.enum(["sheet", "shallow", "channel"]),
  surfaceClassId: z.string().nullable(),
  surfaceClassKey: z.string().nullable(),
  surfaceClassName: z.string().nullable(),
  /** Where the class came from: the cover layer, or the engineer's override of the stretch. */
  surfaceSource: z.enum(SURFACE_SOURCES).default("cover-layer"),
  /** Soil group as mapped (dual groups kept) and as used after the design rule. */
  hsgMapped: z.string().nullable(),
  hsg: z.enum(["A", "B", "C", "D"]).nullable(),
  n: maybe,
  k: maybe,
  kSource: z.string().nullable(),
  kerbyN: maybe,
  manningN: maybe,
  cn: maybe,
  elevationUp: maybe,
  elevationDown: maybe,
  elevationSource: z.enum(ELEVATION_SOURCES).nullable(),
  slope: maybe,
  /** Mean velocity by the velocity method (V = k·s^0.5, Manning in channels). */
  velocity: maybe,
  /** Travel time of this segment by each method that computes per segment (minutes). */
  timesMin: z.partialRecord(z.enum(METHOD_IDS), maybe),
  warnings: z.array(z.string()),
  /** What keeps this segment from being computed (zero or adverse slope, a missing value). */
  error: z.string().nullable(),
});
export type SheetSegment = z.output<typeof sheetSegmentSchema>;

const percentilesSchema = z.object({ p10: num, p50: num, p90: num });

/** Sheet flow over several segments: the series rule used and the Tc the others give. */
export const overlandSeriesSchema = z.object({
  rule: z.enum(["overlandSeries", "sheetFlowSeries"]),
  used: z.string(),
  usedLabel: z.string(),
  sheetSegments: z.number().int(),
  alternatives: z.array(z.object({ option: z.string(), label: z.string(), totalMin: num })),
});
export type OverlandSeriesNote = z.output<typeof overlandSeriesSchema>;

export const sheetMethodSchema = z.object({
  id: z.enum(METHOD_IDS),
  label: z.string(),
  kind: z.enum(["method", "check"]),
  source: z.string(),
  status: z.enum(["ok", "unavailable"]),
  scope: z.enum(["whole-path", "overland"]).nullable(),
  computedMin: maybe,
  totalMin: maybe,
  totalHr: maybe,
  minimumApplied: z.boolean(),
  reason: z.string().nullable(),
  validity: z.object({ range: z.string(), outside: z.array(z.string()) }).nullable(),
  /** Absent on sheets stored before the series rules; null with one sheet segment or none. */
  overlandSeries: overlandSeriesSchema.nullable().optional(),
  /** The Monte Carlo band of this method's Tc (min); absent on older sheets. */
  band: percentilesSchema.extend({ draws: z.number().int() }).nullable().optional(),
});
export type SheetMethod = z.output<typeof sheetMethodSchema>;

export const sheetWarningSchema = z.object({
  code: z.string(),
  message: z.string(),
  segmentIndex: z.number().int().optional(),
  method: z.enum(METHOD_IDS).optional(),
});
export type SheetWarning = z.output<typeof sheetWarningSchema>;

const sensitivityPoint = z.object({ tcMin: maybe, peak: maybe });

/**
 * How sure the governing Tc and the peak flow are: the sensitivity view (each input group at
 * the ends of its band) and the Monte Carlo band, in the sheet's units (peak flows).
 */
export const sheetUncertaintySchema = z.object({
  sensitivity: z.object({
    entered: sensitivityPoint,
    bars: z.array(
      z.object({
        input: z.string(),
        label: z.string(),
        band: z.string(),
        low: sensitivityPoint,
        high: sensitivityPoint,
      }),
    ),
  }),
  monteCarlo: z.object({
    draws: z.number().int(),
    seed: z.number().int(),
    distribution: z.string(),
    governingTcMin: percentilesSchema.nullable(),
    peak: percentilesSchema.nullable(),
  }),
});
export type SheetUncertainty = z.output<typeof sheetUncertaintySchema>;

export const pathPieceSchema = z.object({
  stationFromM: num,
  stationToM: num,
  lengthM: num,
  surfaceClassId: z.string().nullable(),
  hsg: z.string().nullable(),
  coverFeatureId: z.number().int().nullable(),
  soilFeatureId: z.number().int().nullable(),
});

export const travelTimeSheetSchema = z.object({
  caution: z.string(),
  project: z.object({ id: z.string(), name: z.string() }),
  subcatchment: z.object({ id: z.string(), name: z.string(), scenario: z.string() }),
  flowPathVersion: z.number().int(),
  /** Set when read back: the path (or its breaks) changed since this sheet was computed. */
  stale: z.boolean().optional(),
  computedAt: z.string(),
  units: z.enum(["us", "si"]),
  unitLabels: z.record(z.string(), z.string()),
  returnPeriodYears: num,
  totalLength: num,
  /** The outlet end lies higher than the top: the path is probably drawn the wrong way. */
  reversed: z.boolean(),
  breaks: z.object({
    sheetEnd: maybe,
    sheetEndSource: z.enum(["user", "design-rule", "none"]),
    channelStart: maybe,
    channelStartSource: z.enum(["user", "channel-layer", "none"]),
  }),
  segments: z.array(sheetSegmentSchema),
  methods: z.array(sheetMethodSchema),
  governing: z
    .object({
      method: z.enum(METHOD_IDS),
      label: z.string(),
      tcMin: num,
      tcHr: num,
      reason: z.string(),
    })
    .nullable(),
  peakFlow: z
    .object({
      value: num,
      unit: z.string(),
      c: num,
      cf: num,
      cfTimesC: num,
      intensity: num,
      durationMin: num,
      area: num,
      returnPeriodYears: num,
      /** Q/(Cf·C·i·A) in the sheet's units; absent on older sheets (derive it from the rest). */
      unitFactor: num.optional(),
    })
    .nullable(),
  figures: z.object({
    area: maybe,
    cn: maybe,
    c: maybe,
    avgSlopePercent: maybe,
    notes: z.array(z.string()),
  }),
  /**
   * The kinematic-wave solve for the rainfall chart: the overland time and design intensity it
   * settled on, and every iterate (tc, i(tc)) on the IDF curve, intensities in the sheet's units.
   * Absent on sheets stored before it was kept, null when the method did not run.
   */
  kinematic: z
    .object({
      tcMin: num,
      intensity: num,
      solver: z.enum(["fixed-point", "bracketing"]),
      iterations: z.array(z.object({ tcMin: num, intensity: num })),
    })
    .nullable()
    .optional(),
  /** Absent on sheets stored before it was kept; null when the methods did not run. */
  uncertainty: sheetUncertaintySchema.nullable().optional(),
  /**
   * The engineering core's input exactly as computed, in the project's units: `npm run calc`
   * reads it (docs/calc-format.md), so a checking engineer can run the numbers again.
   */
  calcInput: z.unknown().optional(),
  /** Warnings that concern no single segment (the segments carry their own too). */
  warnings: z.array(sheetWarningSchema),
  /** What keeps the methods from running at all; empty when they ran. */
  problems: z.array(z.string()),
  profile: z.array(z.object({ station: num, elevation: maybe })),
  rules: z.record(z.string(), z.unknown()).nullable(),
  rainfall: z.object({ tableId: z.string(), name: z.string(), sourceNote: z.string() }).nullable(),
  /** The split as computed (metres), and the features it used, so a client can check it. */
  split: z.object({
    pieces: z.array(pathPieceSchema),
    coverFeatureIds: z.array(z.number().int()),
    soilFeatureIds: z.array(z.number().int()),
  }),
});
export type TravelTimeSheet = z.output<typeof travelTimeSheetSchema>;
