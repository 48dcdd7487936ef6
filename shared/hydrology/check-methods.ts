/**
 * The labelled checks: Kirpich over the whole path; Kerby and FAA over the overland (sheet)
 * segments, whose times they estimate. Equations, sources and ranges are in kirpich.ts,
 * kerby.ts and faa.ts.
 */
import { faaTcMin, FAA_MAX_LENGTH_FT } from "./faa";
import { kerbyTcMin, KERBY_MAX_LENGTH_FT } from "./kerby";
import { kirpichTcMin, KIRPICH_RANGE } from "./kirpich";
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

const SOURCES: Readonly<Record<CheckMethodId, string>> = {
  kirpich:
    "Kirpich (1940), tc = 0.0078·L^0.77·S^−0.385 (as printed in a state DOT drainage manual)",
  kerby:
    "Kerby (1959), tc = 0.828·(L·N)^0.467·S^−0.235 (as printed in a state DOT drainage manual)",
  faa: "FAA (1970), tc = 1.8·(1.1 − C)·L^0.5/S^(1/3), S in percent (urban drainage criteria manual)",
};

function check(
  ctx: MethodContext,
  id: CheckMethodId,
  scope: CheckResult["scope"],
  tcMin: number,
  inputs: Record<string, number>,
  range: string,
  outside: string[],
): CheckResult {
  return {
    id,
    label: METHOD_LABELS[id],
    kind: "check",
    source: SOURCES[id],
    status: "ok",
    scope,
    ...totals(tcMin, ctx.kase.rules.minTcMin, id),
    segments: [],
    validity: { range, outside },
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
  return check(
    ctx,
    "kirpich",
    "whole-path",
    kirpichTcMin(lengthFt, slope),
    { length: out.length(lengthFt), slope },
    KIRPICH_RANGE.text,
    outside,
  );
}

function overland(ctx: MethodContext, id: CheckMethodId) {
  const sheets = sheetSegments(ctx.kase);
  if (sheets.length === 0) {
    return unavailable(id, SOURCES[id], "the path has no sheet (overland) segment", []);
  }
  return sheets;
}

export function kerbyCheck(ctx: MethodContext): Outcome<CheckResult> {
  const sheets = overland(ctx, "kerby");
  if (!Array.isArray(sheets)) return sheets;
  const missing = sheets
    .filter((s) => s.kerbyN === undefined)
    .map((s) => `segments[${s.index}].kerbyN`);
  if (missing.length > 0) {
    return unavailable(
      "kerby",
      SOURCES.kerby,
      "every sheet segment needs Kerby's retardance N",
      missing,
    );
  }
  const { out } = ctx;
  const lengthFt = totalLengthFt(sheets);
  const retardanceN = sheets.reduce((s, seg) => s + (seg.kerbyN ?? 0) * seg.lengthFt, 0) / lengthFt;
  const slope = averageSlope(sheets);
  const outside: string[] = [];
  if (lengthFt > KERBY_MAX_LENGTH_FT) {
    const message =
      `overland length ${out.length(lengthFt).toPrecision(4)} ${out.labels.length} is past ` +
      `Kerby's ${out.length(KERBY_MAX_LENGTH_FT).toPrecision(4)} ${out.labels.length}`;
    outside.push(message);
    ctx.warnings.add({ code: "kerby-length", method: "kerby", message });
  }
  return check(
    ctx,
    "kerby",
    "overland",
    kerbyTcMin(lengthFt, retardanceN, slope),
    { length: out.length(lengthFt), retardanceN, slope },
    "overland flow up to 1,200 ft (365.76 m)",
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
