/**
 * The labelled checks: Kirpich over the whole path (with its adjustment factor when the design
 * rules ask for one); Kerby and FAA over the overland (sheet) segments, whose times they estimate;
 * Kerby–Kirpich over both parts. The minimum Tc belongs to a whole path, so it is not applied to
 * the overland-only checks, and they say so. Equations, sources and ranges are in kirpich.ts,
 * kerby.ts, faa.ts and kerby-kirpich.ts.
 */
import type { InternalSegment } from "./case";
import { faaTcMin, FAA_MAX_LENGTH_FT } from "./faa";
import { kerbyTcMin, KERBY_MAX_LENGTH_FT } from "./kerby";
import { KERBY_KIRPICH_RANGE, KERBY_KIRPICH_SOURCE } from "./kerby-kirpich";
import { KIRPICH_ADJUSTMENT_SOURCE, KIRPICH_FACTORS, kirpichTcMin, KIRPICH_RANGE } from "./kirpich";
import {
  averageSlope,
  sheetSegments,
  totalLengthFt,
  totals,
  unavailable,
  type MethodContext,
} from "./method-context";
import { METHOD_LABELS, type CheckMethodId } from "./method-ids";
import type { CheckResult, Outcome } from "./result-types";
import { hrFromMin } from "./units";

const SOURCES: Readonly<Record<CheckMethodId, string>> = {
  kirpich:
    "Kirpich (1940), tc = 0.0078·L^0.77·S^−0.385 (as printed in a state DOT drainage manual)",
  kerby:
    "Kerby (1959), tc = 0.828·(L·N)^0.467·S^−0.235 (as printed in a state DOT drainage manual)",
  faa: "FAA (1970), tc = 1.8·(1.1 − C)·L^0.5/S^(1/3), S in percent (urban drainage criteria manual)",
  "kerby-kirpich": KERBY_KIRPICH_SOURCE,
};

const OVERLAND_NOTE = "overland part only: the minimum Tc (a whole-path rule) is not applied";

function check(
  ctx: MethodContext,
  id: CheckMethodId,
  scope: CheckResult["scope"],
  tcMin: number,
  inputs: Record<string, number>,
  range: string,
  outside: string[],
  source = SOURCES[id],
): CheckResult {
  const whole = totals(tcMin, ctx.kase.rules.minTcMin, id);
  const shown =
    scope === "overland"
      ? {
          computedMin: whole.computedMin,
          totalMin: whole.computedMin,
          totalHr: hrFromMin(whole.computedMin),
          minimumApplied: false,
        }
      : whole;
  return {
    id,
    label: METHOD_LABELS[id],
    kind: "check",
    source,
    status: "ok",
    scope,
    ...shown,
    segments: [],
    validity: { range: scope === "overland" ? `${range}; ${OVERLAND_NOTE}` : range, outside },
    inputs,
  };
}

export function kirpichCheck(ctx: MethodContext): Outcome<CheckResult> {
  const { kase, out } = ctx;
  const lengthFt = totalLengthFt(kase.segments);
  const slope = averageSlope(kase.segments);
  const outside: string[] = [];
  if (slope < KIRPICH_RANGE.slopeMinFtPerFt || slope > KIRPICH_RANGE.slopeMaxFtPerFt) {
    outside.push(`average slope ${(100 * slope).toFixed(2)} % is outside 3–10 %`);
  }
  const areaAc = kase.watershed.areaAc;
  if (areaAc !== undefined && areaAc > KIRPICH_RANGE.areaMaxAc) {
    outside.push(
      `area ${out.area(areaAc).toPrecision(4)} ${out.labels.area} is larger than the basins Kirpich used`,
    );
  }
  // The check is still reported, but a reader of the warnings list must see it is out of range.
  for (const message of outside)
    ctx.warnings.add({ code: "kirpich-range", method: "kirpich", message });
  const adjustment = kase.rules.kirpichAdjustment;
  const factor = KIRPICH_FACTORS[adjustment];
  const source =
    adjustment === "none"
      ? SOURCES.kirpich
      : `${SOURCES.kirpich}; × ${factor} for ${adjustment === "paved-overland" ? "overland flow on concrete or asphalt" : "concrete channels"}, ${KIRPICH_ADJUSTMENT_SOURCE}`;
  return check(
    ctx,
    "kirpich",
    "whole-path",
    factor * kirpichTcMin(lengthFt, slope),
    { length: out.length(lengthFt), slope, factor },
    KIRPICH_RANGE.text,
    outside,
    source,
  );
}

function overland(ctx: MethodContext, id: CheckMethodId) {
  const sheets = sheetSegments(ctx.kase);
  if (sheets.length === 0) {
    return unavailable(id, SOURCES[id], "the path has no sheet (overland) segment", []);
  }
  return sheets;
}

/** Kerby's time over the sheet segments (total length, length-weighted N, fall / length). */
function kerbyPart(ctx: MethodContext, id: CheckMethodId) {
  const sheets = overland(ctx, id);
  if (!Array.isArray(sheets)) return sheets;
  const missing = sheets
    .filter((s) => s.kerbyN === undefined)
    .map((s) => `segments[${s.index}].kerbyN`);
  if (missing.length > 0) {
    return unavailable(id, SOURCES[id], "every sheet segment needs Kerby's retardance N", missing);
  }
  const lengthFt = totalLengthFt(sheets);
  const retardanceN = sheets.reduce((s, seg) => s + (seg.kerbyN ?? 0) * seg.lengthFt, 0) / lengthFt;
  const slope = averageSlope(sheets);
  return { lengthFt, retardanceN, slope, tcMin: kerbyTcMin(lengthFt, retardanceN, slope) };
}

function kerbyLengthNote(ctx: MethodContext, lengthFt: number, id: CheckMethodId): string[] {
  if (lengthFt <= KERBY_MAX_LENGTH_FT) return [];
  const { out } = ctx;
  const message =
    `overland length ${out.length(lengthFt).toPrecision(4)} ${out.labels.length} is past ` +
    `Kerby's ${out.length(KERBY_MAX_LENGTH_FT).toPrecision(4)} ${out.labels.length}`;
  ctx.warnings.add({ code: "kerby-length", method: id, message });
  return [message];
}

export function kerbyCheck(ctx: MethodContext): Outcome<CheckResult> {
  const part = kerbyPart(ctx, "kerby");
  if ("status" in part) return part;
  const { out } = ctx;
  return check(
    ctx,
    "kerby",
    "overland",
    part.tcMin,
    { length: out.length(part.lengthFt), retardanceN: part.retardanceN, slope: part.slope },
    "overland flow up to 1,200 ft (365.76 m)",
    kerbyLengthNote(ctx, part.lengthFt, "kerby"),
  );
}

export function kerbyKirpichCheck(ctx: MethodContext): Outcome<CheckResult> {
  const part = kerbyPart(ctx, "kerby-kirpich");
  if ("status" in part) return part;
  const { kase, out } = ctx;
  const channel: InternalSegment[] = kase.segments.filter((s) => s.regime !== "sheet");
  const channelFt = totalLengthFt(channel);
  const channelSlope = channel.length > 0 ? averageSlope(channel) : 0;
  const channelMin = channel.length > 0 ? kirpichTcMin(channelFt, channelSlope) : 0;
  const outside = kerbyLengthNote(ctx, part.lengthFt, "kerby-kirpich");
  const r = KERBY_KIRPICH_RANGE;
  const areaAc = kase.watershed.areaAc;
  if (areaAc !== undefined && (areaAc < r.areaMinAc || areaAc > r.areaMaxAc)) {
    outside.push(
      `area ${out.area(areaAc).toPrecision(4)} ${out.labels.area} is outside 0.25–150 mi²`,
    );
  }
  if (channel.length > 0 && (channelFt < r.channelMinFt || channelFt > r.channelMaxFt)) {
    outside.push(
      `channel length ${out.length(channelFt).toPrecision(4)} ${out.labels.length} is outside 1–50 mi`,
    );
  }
  if (channel.length > 0 && (channelSlope < r.slopeMin || channelSlope > r.slopeMax)) {
    outside.push(`channel slope ${channelSlope.toPrecision(3)} is outside 0.002–0.02`);
  }
  return check(
    ctx,
    "kerby-kirpich",
    "whole-path",
    part.tcMin + channelMin,
    {
      overlandLength: out.length(part.lengthFt),
      retardanceN: part.retardanceN,
      overlandSlope: part.slope,
      overlandMin: part.tcMin,
      channelLength: out.length(channelFt),
      channelSlope,
      channelMin,
    },
    r.text,
    outside,
  );
}

export function faaCheck(ctx: MethodContext): Outcome<CheckResult> {
  const sheets = overland(ctx, "faa");
  if (!Array.isArray(sheets)) return sheets;
  const c = ctx.kase.watershed.c;
  if (c === undefined) {
    return unavailable("faa", SOURCES.faa, "the FAA formula needs the runoff coefficient C", [
      "watershed.c",
    ]);
  }
  const { out } = ctx;
  const lengthFt = totalLengthFt(sheets);
  const slopePercent = 100 * averageSlope(sheets);
  const outside: string[] = [];
  if (lengthFt > FAA_MAX_LENGTH_FT) {
    const message =
      `overland length ${out.length(lengthFt).toPrecision(4)} ${out.labels.length} is past ` +
      `the FAA formula's ${out.length(FAA_MAX_LENGTH_FT).toPrecision(4)} ${out.labels.length}`;
    outside.push(message);
    ctx.warnings.add({ code: "faa-length", method: "faa", message });
  }
  return check(
    ctx,
    "faa",
    "overland",
    faaTcMin(c, lengthFt, slopePercent),
    { length: out.length(lengthFt), c, slopePercent },
    "overland flow, commonly up to 500 ft (152.4 m)",
    outside,
  );
}
