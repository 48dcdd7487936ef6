/**
 * Flow regimes along the path: sheet flow from the divide to the sheet break, shallow
 * concentrated flow after it, channel flow from the channel break to the outlet (TR-55, 1986,
 * chapter 3 orders them this way).
 *
 * Rules of the cut, all in stations (metres from the divide):
 * - sheetEndM null: no sheet flow; channelStartM null: no channel flow.
 * - Breaks outside [0, total] are clamped to the path.
 * - A channel break above the sheet break wins: channel flow starts there, and sheet flow
 *   stops there too (a defined channel ends overland flow).
 * Pieces are cut at the breaks; pieces are never merged across a regime change.
 */
import { mcCuenSpiessMaxLengthFt } from "../hydrology/tr55-sheet";
import type { SheetCap } from "../hydrology/rules";
import { mFromFt } from "../hydrology/units";
import type { FlowRegime, PathPiece } from "./types";

export interface RegimeSegment extends PathPiece {
  readonly regime: FlowRegime;
}

export interface RegimeBreaks {
  readonly sheetEndM: number | null;
  readonly channelStartM: number | null;
}

function checkBreak(name: string, value: number | null): void {
  if (value !== null && !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a station in metres or null (got ${value})`);
  }
}

/** Generic so what a piece carries besides PathPiece (e.g. its surface source) comes through. */
export function regimeSegments<P extends PathPiece>(
  pieces: readonly P[],
  breaks: RegimeBreaks,
): (P & { readonly regime: FlowRegime })[] {
  checkBreak("sheetEndM", breaks.sheetEndM);
  checkBreak("channelStartM", breaks.channelStartM);
  const totalM = pieces.length > 0 ? pieces[pieces.length - 1]!.stationToM : 0;
  const clamp = (v: number) => Math.min(Math.max(v, 0), totalM);
  const channelM = breaks.channelStartM === null ? Infinity : clamp(breaks.channelStartM);
  const sheetM = Math.min(breaks.sheetEndM === null ? 0 : clamp(breaks.sheetEndM), channelM);
  const regimeAt = (stationM: number): FlowRegime =>
    stationM < sheetM ? "sheet" : stationM < channelM ? "shallow" : "channel";

  const out: (P & { readonly regime: FlowRegime })[] = [];
  for (const piece of pieces) {
    const cuts = [piece.stationFromM];
    for (const at of [sheetM, channelM]) {
      if (at > piece.stationFromM && at < piece.stationToM && !cuts.includes(at)) cuts.push(at);
    }
    cuts.push(piece.stationToM);
    for (let k = 0; k + 1 < cuts.length; k += 1) {
      const fromM = cuts[k]!;
      const toM = cuts[k + 1]!;
      if (toM <= fromM) continue;
      out.push({
        ...piece,
        stationFromM: fromM,
        stationToM: toM,
        lengthM: toM - fromM,
        regime: regimeAt((fromM + toM) / 2),
      });
    }
  }
  return out;
}

/** Where sheet flow ends, and why. */
export type SheetEnd =
  | {
      readonly ok: true;
      readonly stationM: number;
      readonly source: "user-break" | "design-rule" | "mccuen-spiess";
      /** The cap of the design rule in metres (null when the user's break decides). */
      readonly capM: number | null;
    }
  | { readonly ok: false; readonly problem: string };

export interface SheetEndInput {
  readonly totalM: number;
  /** The user's sheet break, a station in metres; it wins over the design rule. */
  readonly userBreakM: number | null;
  /** The design rule's cap (resolveRules(...).sheetCap). */
  readonly cap: SheetCap;
  /**
   * For the McCuen–Spiess cap (L = 100·s^0.5/n ft, NEH 630 Ch 15 eq 15-9): the slope and
   * Manning's n of the sheet-flow surface at the top of the path.
   */
  readonly mcCuenSpiess?: { readonly slopeFtPerFt: number; readonly manningN: number } | null;
}

/**
 * The sheet break: the user's station when given, else the design rule's cap, never past the
 * outlet. A user's break longer than the cap is kept: the engineering core then treats the
 * sheet flow past the cap as rules.sheetFlowPastCap says (shallow flow by default, with a note).
 */
export function sheetEndStationM(input: SheetEndInput): SheetEnd {
  const clamp = (v: number) => Math.min(Math.max(v, 0), Math.max(input.totalM, 0));
  if (input.userBreakM !== null) {
    checkBreak("userBreakM", input.userBreakM);
    return { ok: true, stationM: clamp(input.userBreakM), source: "user-break", capM: null };
  }
  if (input.cap.kind === "length") {
    const capM = mFromFt(input.cap.lengthFt);
    return { ok: true, stationM: clamp(capM), source: "design-rule", capM };
  }
  const surface = input.mcCuenSpiess;
  if (!surface || !(surface.slopeFtPerFt > 0) || !(surface.manningN > 0)) {
    return {
      ok: false,
      problem:
        "the McCuen–Spiess sheet-flow cap needs a downhill slope and Manning's n at the top of " +
        "the path; set a sheet break or give the top segment a slope and surface class",
    };
  }
  const capM = mFromFt(mcCuenSpiessMaxLengthFt(surface.slopeFtPerFt, surface.manningN));
  return { ok: true, stationM: clamp(capM), source: "mccuen-spiess", capM };
}
