/**
 * Segment rows of the travel-time sheet: each regime segment of the split path gets its surface
 * parameters (team class with the project's overrides), its soil group and curve number, and its
 * slope; a segment that cannot be computed carries the reason instead of a number. The rows also
 * give the engineering core's segment input, in the project's units.
 */
import type { SurfaceSource } from "../geo/surface-overrides";
import type { HsgCode } from "../geo/types";
import type { SegmentInput } from "../hydrology/input-schema";
import { ftFromM, mFromFt, type UnitSystem } from "../hydrology/units";
import type { SurfaceValues } from "../schemas/catalog";
import type { SheetSegment } from "../schemas/sheet";

export type SlopeProblem = "zero-slope" | "adverse-slope" | "no-elevation";

/** One stretch of one regime, as the split, regimes and slopes leave it (metres). */
export interface RowSource {
  readonly stationFromM: number;
  readonly stationToM: number;
  readonly lengthM: number;
  readonly regime: "sheet" | "shallow" | "channel";
  readonly surfaceClassId: string | null;
  /** Absent: the cover layer's class. */
  readonly surfaceSource?: SurfaceSource;
  readonly hsg: HsgCode | null;
  readonly elevationUpM: number | null;
  readonly elevationDownM: number | null;
  readonly elevationSource: "terrain" | "survey" | "mixed" | null;
  /** Rise/run; null with a problem when it cannot be had. */
  readonly slope: number | null;
  readonly slopeProblem: SlopeProblem | null;
}

export interface SurfaceParams {
  readonly id: string;
  readonly key: string;
  readonly name: string;
  readonly values: SurfaceValues;
}

export interface RowContext {
  readonly units: UnitSystem;
  readonly classes: ReadonlyMap<string, SurfaceParams>;
  readonly dualHsg: "drained" | "undrained";
  /** The subcatchment's channel fields, in project units; null when not entered. */
  readonly channel: { readonly manningN: number; readonly section: unknown } | null;
}

/** Dual groups follow the design rule: drained takes the first letter, undrained D (NEH 630 Ch 7). */
export function resolveHsg(
  hsg: HsgCode | null,
  rule: "drained" | "undrained",
): "A" | "B" | "C" | "D" | null {
  if (hsg === null) return null;
  if (hsg.length === 1) return hsg as "A" | "B" | "C" | "D";
  return rule === "drained" ? (hsg[0] as "A" | "B" | "C") : "D";
}

const SLOPE_MESSAGES: Record<SlopeProblem, string> = {
  "zero-slope":
    "The ground is flat along this segment (zero slope): no Tc method applies. Check the terrain or enter surveyed elevations.",
  "adverse-slope":
    "The ground rises along this segment (adverse slope): water would not flow this way. Check the path direction, the terrain, or enter surveyed elevations.",
  "no-elevation":
    "No elevation for this segment's ends: the terrain layer does not cover it. Add a terrain layer or enter surveyed elevations.",
};

function lengthOut(units: UnitSystem, metres: number): number {
  return units === "si" ? metres : ftFromM(metres);
}

/** k is stored in ft/s; SI sheets show m/s. */
function kOut(units: UnitSystem, kFtPerS: number): number {
  return units === "si" ? mFromFt(kFtPerS) : kFtPerS;
}

export interface BuiltRows {
  readonly rows: SheetSegment[];
  /** The core's segments, one per row, or null when any row has an error. */
  readonly segments: SegmentInput[] | null;
}

export function buildRows(sources: readonly RowSource[], ctx: RowContext): BuiltRows {
  const rows: SheetSegment[] = [];
  const segments: SegmentInput[] = [];
  let blocked = false;
  sources.forEach((src, index) => {
    const cls = src.surfaceClassId === null ? undefined : ctx.classes.get(src.surfaceClassId);
    const v = cls?.values;
    const hsg = resolveHsg(src.hsg, ctx.dualHsg);
    const cn = hsg !== null && v ? v.cn[hsg] : null;
    const errors: string[] = [];
    const warnings: string[] = [];
    if (src.slopeProblem !== null) errors.push(SLOPE_MESSAGES[src.slopeProblem]);
    if (!cls) {
      const msg =
        "No mapped surface class here: the path runs outside every cover polygon or over an unmapped value.";
      if (src.regime === "channel") warnings.push(msg);
      else
        errors.push(
          `${msg} Map the cover layer's values, extend the cover layer, or give the stretch a surface on the sheet.`,
        );
    }
    if (hsg === null)
      warnings.push("No soil group here: the curve number falls back to the subcatchment's.");
    else if (v && cn === null)
      warnings.push(`The surface class prints no CN for soil group ${hsg}.`);
    if (src.hsg !== null && src.hsg.length > 1) {
      warnings.push(`Dual soil group ${src.hsg} taken as ${hsg} (${ctx.dualHsg}, design rule).`);
    }
    let n: number | null = null;
    let k: number | null = null;
    let kSource: string | null = null;
    let kerbyN: number | null = null;
    let manningN: number | null = null;
    if (src.regime === "sheet" && v) {
      n = v.sheetFlowN?.value ?? null;
      if (n === null)
        errors.push(
          `Surface class "${cls?.name}" has no sheet-flow Manning's n: enter one in the catalog.`,
        );
      if (v.velocityKFtPerS) {
        k = kOut(ctx.units, v.velocityKFtPerS.value);
        kSource = v.velocityKFtPerS.source;
      }
      kerbyN = v.kerbyN?.value ?? null;
    } else if (src.regime === "shallow" && v) {
      // TR-55's paved/unpaved k where the class has one (the segmental method's figure), else
      // the velocity-method k of NEH 630 Table 15-3: the core takes one k per shallow segment.
      const sk = v.shallowKFtPerS ?? v.velocityKFtPerS;
      if (sk) {
        k = kOut(ctx.units, sk.value);
        kSource = sk.source;
      } else {
        errors.push(
          `Surface class "${cls?.name}" has no shallow-flow velocity coefficient k: enter one in the catalog.`,
        );
      }
    } else if (src.regime === "channel") {
      if (ctx.channel === null) {
        errors.push(
          "Channel flow needs the subcatchment's channel Manning's n and section: enter them on the subcatchment.",
        );
      } else {
        manningN = ctx.channel.manningN;
      }
    }
    const length = lengthOut(ctx.units, src.lengthM);
    const error = errors.length > 0 ? errors.join(" ") : null;
    rows.push({
      index,
      stationFrom: lengthOut(ctx.units, src.stationFromM),
      stationTo: lengthOut(ctx.units, src.stationToM),
      length,
      stationFromM: src.stationFromM,
      stationToM: src.stationToM,
      regime: src.regime,
      surfaceClassId: cls?.id ?? null,
      surfaceClassKey: cls?.key ?? null,
      surfaceClassName: cls?.name ?? null,
      surfaceSource: src.surfaceSource ?? "cover-layer",
      hsgMapped: src.hsg,
      hsg,
      n,
      k,
      kSource,
      kerbyN,
      manningN,
      cn,
      elevationUp: src.elevationUpM === null ? null : lengthOut(ctx.units, src.elevationUpM),
      elevationDown: src.elevationDownM === null ? null : lengthOut(ctx.units, src.elevationDownM),
      elevationSource: src.elevationSource,
      slope: src.slope,
      velocity: null,
      timesMin: {},
      warnings,
      error,
    });
    if (error !== null || src.slope === null) {
      blocked = true;
      return;
    }
    const common = {
      length,
      slope: src.slope,
      ...(cn !== null && { cn }),
      label: `segment ${index + 1}`,
      ...(cls && { surface: cls.key }),
    };
    if (src.regime === "sheet") {
      // Sheet flow past the cap (a break set beyond it) is carried as shallow flow with the
      // class's shallow-flow k, as the regime cut gives the rows after the cap.
      const shallow = v?.shallowKFtPerS;
      segments.push({
        regime: "sheet",
        ...common,
        n: n ?? 0,
        ...(k !== null && { k }),
        ...(shallow && { shallowK: kOut(ctx.units, shallow.value) }),
        ...(kerbyN !== null && { kerbyN }),
      });
    } else if (src.regime === "shallow") {
      segments.push({ regime: "shallow", ...common, k: k ?? 0 });
    } else if (ctx.channel) {
      segments.push({
        regime: "channel",
        ...common,
        manningN: ctx.channel.manningN,
        section: ctx.channel.section as Extract<SegmentInput, { regime: "channel" }>["section"],
      });
    }
  });
  return { rows, segments: blocked ? null : segments };
}
