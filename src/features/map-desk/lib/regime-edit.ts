/**
 * What a change of one segment's regime means for the two breaks (stations in the sheet's
 * length unit): sheet flow runs from the divide to the sheet break, channel flow from the
 * channel break to the outlet, so a regime is changed by moving the break next to it.
 */
import type { FlowRegime } from "../../../../shared/geo";

export interface BreakChange {
  sheetEnd?: number | null;
  channelStart?: number | null;
}

export function breaksForRegime(
  segment: { stationFrom: number; stationTo: number; regime: FlowRegime },
  to: FlowRegime,
): BreakChange | null {
  const { stationFrom, stationTo, regime: from } = segment;
  if (from === to) return null;
  if (to === "sheet") {
    // Sheet flow now reaches the end of this segment (and channel flow, if it began here, later).
    return from === "channel"
      ? { sheetEnd: stationTo, channelStart: stationTo }
      : { sheetEnd: stationTo };
  }
  if (to === "channel") {
    return from === "sheet"
      ? { sheetEnd: stationFrom, channelStart: stationFrom }
      : { channelStart: stationFrom };
  }
  // to shallow: pull back whichever break put this segment in its regime.
  return from === "sheet" ? { sheetEnd: stationFrom } : { channelStart: stationTo };
}
