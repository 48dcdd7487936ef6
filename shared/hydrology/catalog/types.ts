/**
 * Types of the Surface catalog defaults: published table rows (sheet-flow n, velocity k, curve
 * numbers, runoff C, Kerby N) and the Rillmark surface classes seeded from them.
 *
 * Every value carries a `source` string naming document, table and edition, with a flag:
 * "[from memory]" for values recalled rather than read from a copy of the document,
 * "[derived]" for values that follow arithmetically, "common practice" for rules of thumb.
 * Reports cite these strings verbatim.
 */

/** Hydrologic soil group, TR-55 (1986) chapter 2. */
export type Hsg = "A" | "B" | "C" | "D";

export const HSGS: readonly Hsg[] = ["A", "B", "C", "D"];

/** Curve number per hydrologic soil group; null where the table prints no value. */
export type CnByHsg = Readonly<Record<Hsg, number | null>>;

/** One row of TR-55 (1986) Table 3-1, Manning's n for sheet flow (dimensionless). */
export interface SheetFlowNRow {
  readonly id: string;
  readonly surface: string;
  readonly n: number;
  readonly source: string;
  readonly note?: string;
}

/** Where a velocity coefficient comes from. */
export type VelocityKTable = "neh-630-15-3" | "tr-55-fig-3-1" | "hec-22";

/**
 * Coefficient k of V = k·s^0.5 with s in ft/ft (m/m): kFtPerS gives V in ft/s, kMPerS gives V
 * in m/s. Because s is dimensionless, kMPerS = kFtPerS · 0.3048 exactly.
 */
export interface VelocityKRow {
  readonly id: string;
  readonly table: VelocityKTable;
  readonly surface: string;
  readonly flow: "overland" | "shallow concentrated";
  readonly kFtPerS: number;
  readonly kMPerS: number;
  readonly source: string;
  /** Manning's n and hydraulic radius from which the table computes k = (1.486/n)·r^(2/3). */
  readonly manning?: {
    readonly n: number;
    readonly hydraulicRadiusFt: number;
    readonly source: string;
  };
  /** The SI coefficient as printed in the document, in the slope unit the document uses. */
  readonly printedSi?: {
    readonly k: number;
    readonly slopeUnit: "m/m" | "percent";
    readonly decimals: number;
    readonly source: string;
  };
}

/** TR-55 (1986) Tables 2-2a to 2-2d. */
export type CnTable = "2-2a" | "2-2b" | "2-2c" | "2-2d";

export type HydrologicCondition = "poor" | "fair" | "good";

/** One row of TR-55 (1986) Table 2-2a/b/c/d: ARC II, Ia = 0.2S. */
export interface CurveNumberRow {
  readonly id: string;
  readonly table: CnTable;
  /** Heading the row sits under in the table. */
  readonly group: string;
  readonly cover: string;
  /** Treatment (Table 2-2b) or sub-type; null where the table has none. */
  readonly treatment: string | null;
  readonly condition: HydrologicCondition | null;
  /** Average percent impervious area (Table 2-2a urban districts); null where not tabulated. */
  readonly averageImperviousPercent: number | null;
  readonly cn: CnByHsg;
  /** Groups where the actual CN is below 30 and the table prints 30 for runoff computations. */
  readonly flooredAt30: readonly Hsg[];
  readonly source: string;
  readonly notes: readonly string[];
}

/** One row of FHWA HEC-22 Table 3-1, runoff coefficient C of the rational method. */
export interface RunoffCRow {
  readonly id: string;
  readonly category: string;
  readonly description: string;
  readonly cLow: number;
  readonly cHigh: number;
  /** Mid-range value offered as the default design C. */
  readonly cDesign: number;
  readonly source: string;
  readonly designSource: string;
}

/** One row of Kerby's (1959) retardance coefficient N for overland flow. */
export interface KerbyNRow {
  readonly id: string;
  readonly surface: string;
  readonly retardanceN: number;
  readonly source: string;
}

/** A value a surface class takes from a table row (rowId null: not from a table row). */
export interface CatalogPick<V> {
  readonly rowId: string | null;
  readonly value: V;
  readonly source: string;
  /** Why this row was chosen for the class. */
  readonly note: string;
}

/** A parameter a surface class deliberately leaves empty, with the reason. */
export interface CatalogGap {
  readonly rowId: null;
  readonly value: null;
  readonly source: string;
  readonly note: string;
}

export type CatalogField<V> = CatalogPick<V> | CatalogGap;

export interface VelocityK {
  readonly kFtPerS: number;
  readonly kMPerS: number;
}

export interface RunoffCRange {
  readonly low: number;
  readonly high: number;
  readonly design: number;
}

/** A default Surface catalog class: the parameters every method needs for one land cover. */
export interface SurfaceClass {
  readonly id: string;
  readonly name: string;
  readonly description: string;
  /** Sheet flow, TR-55 (1986) Table 3-1. */
  readonly sheetFlowN: CatalogField<number>;
  /** Velocity method, NEH 630 Ch 15 (2010) Table 15-3. */
  readonly velocityK: CatalogField<VelocityK>;
  /** TR-55 shallow concentrated flow, paved or unpaved (TR-55 Figure 3-1). */
  readonly shallowFlowK: CatalogField<VelocityK>;
  readonly kerbyN: CatalogField<number>;
  readonly curveNumber: CatalogPick<CnByHsg>;
  readonly runoffC: CatalogField<RunoffCRange>;
}
