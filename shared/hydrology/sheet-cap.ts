/**
 * Sheet flow past the cap of the design rules (rules.sheetFlowMaxLength), handled as
 * rules.sheetFlowPastCap says, the same way the Map desk breaks a traced path at the cap:
 *   "shallow"  the excess is shallow concentrated flow (the usual practice: sheet flow does not
 *              stay sheet flow past a few hundred feet, NEH 630 Ch 15). The segment that
 *              crosses the cap is cut there; its part past the cap, and every sheet segment
 *              after it, take V = k·s^0.5 with the segment's `shallowK` (else its `k`).
 *   "refuse"   the input is refused, naming the first segment past the cap.
 *   "warn"     computed as sheet flow, with a warning (sheet-too-long).
 * The cap is a length, or McCuen–Spiess 100·s^0.5/n ft (NEH 630 eq 15-9) of each segment in turn
 * against the sheet length so far.
 */
import type { InternalSegment } from "./case";
import { HydrologyError } from "./errors";
import type { ResolvedRules } from "./rules";
import { mcCuenSpiessMaxLengthFt } from "./tr55-sheet";
import { mFromFt, type UnitSystem } from "./units";

export interface CapSplit {
  readonly index: number;
  /** Sheet flow kept on this segment (ft); 0 when the whole segment lies past the cap. */
  readonly sheetFt: number;
  /** Length carried as shallow flow (ft). */
  readonly pastFt: number;
  readonly limitFt: number;
}

type Sheet = Extract<InternalSegment, { regime: "sheet" }>;

function capOf(s: Sheet, rules: ResolvedRules): number {
  const cap = rules.sheetCap;
  return cap.kind === "length" ? cap.lengthFt : mcCuenSpiessMaxLengthFt(s.slopeFtPerFt, s.sheetN);
}

function shallowPart(s: Sheet, lengthFt: number, kFtPerS: number): InternalSegment {
  return {
    index: s.index,
    pastCap: true,
    lengthFt,
    slopeFtPerFt: s.slopeFtPerFt,
    cn: s.cn,
    regime: "shallow",
    kFtPerS,
  };
}

export function applySheetCap(
  segments: InternalSegment[],
  rules: ResolvedRules,
  units: UnitSystem,
): { segments: InternalSegment[]; splits: CapSplit[] } {
  if (rules.sheetPastCap === "warn") return { segments, splits: [] };
  const out: InternalSegment[] = [];
  const splits: CapSplit[] = [];
  const len = (ft: number) =>
    units === "si" ? `${mFromFt(ft).toPrecision(4)} m` : `${ft.toPrecision(4)} ft`;
  let sheetSoFarFt = 0;
  let past = false;
  for (const s of segments) {
    if (s.regime !== "sheet") {
      out.push(s);
      continue;
    }
    const limitFt = capOf(s, rules);
    if (!past && sheetSoFarFt + s.lengthFt <= limitFt * (1 + 1e-12)) {
      sheetSoFarFt += s.lengthFt;
      out.push(s);
      continue;
    }
    if (rules.sheetPastCap === "refuse") {
      throw new HydrologyError(
        "invalid-input",
        `segments[${s.index}].length`,
        `sheet flow reaches ${len(sheetSoFarFt + s.lengthFt)}, past the cap of ${len(limitFt)} ` +
          `(${rules.sheetCap.label}); rules.sheetFlowPastCap is "refuse": end the sheet flow at the cap`,
      );
    }
    const k = s.shallowKFtPerS ?? s.kFtPerS;
    if (k === undefined) {
      throw new HydrologyError(
        "invalid-input",
        `segments[${s.index}].shallowK`,
        "is required: sheet flow past the cap is carried as shallow concentrated flow " +
          '(rules.sheetFlowPastCap is "shallow"); give shallowK or k, or set the rule to "warn"',
      );
    }
    const sheetFt = past ? 0 : Math.max(0, limitFt - sheetSoFarFt);
    past = true;
    splits.push({ index: s.index, sheetFt, pastFt: s.lengthFt - sheetFt, limitFt });
    if (sheetFt > 0) out.push({ ...s, lengthFt: sheetFt });
    out.push(shallowPart(s, s.lengthFt - sheetFt, k));
  }
  return { segments: out, splits };
}
