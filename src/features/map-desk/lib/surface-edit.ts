/**
 * What choosing a surface for one segment of the sheet means for the subcatchment's list of
 * surface overrides (stations in the project's length unit): the segment's stretch is cut out
 * of every override it touches, then given the chosen class, or left to the cover layer when
 * none is chosen. The API replaces the whole list, so the result is the list to send.
 */
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";

export type SurfaceEntry = Subcatchment["surfaceOverrides"][number];

/**
 * Remnants shorter than this (project length unit) are dropped: a stretch read back through a
 * unit conversion can miss a row's end by a rounding error, which must not leave a sliver.
 */
const SLIVER = 0.001;

export function withSurfaceStretch(
  entries: readonly SurfaceEntry[],
  stretch: { readonly stationFrom: number; readonly stationTo: number },
  surfaceClassId: string | null,
  note = "",
): SurfaceEntry[] {
  const { stationFrom: from, stationTo: to } = stretch;
  const kept: SurfaceEntry[] = [];
  for (const e of entries) {
    if (e.stationTo <= from || e.stationFrom >= to) {
      kept.push(e);
      continue;
    }
    if (e.stationFrom < from - SLIVER) kept.push({ ...e, stationTo: from });
    if (e.stationTo > to + SLIVER) kept.push({ ...e, stationFrom: to });
  }
  if (surfaceClassId !== null)
    kept.push({ stationFrom: from, stationTo: to, surfaceClassId, note });
  kept.sort((a, b) => a.stationFrom - b.stationFrom);
  // Touching stretches of one class and note become one, so the list stays as short as it reads.
  const out: SurfaceEntry[] = [];
  for (const e of kept) {
    const last = out[out.length - 1];
    if (
      last &&
      last.surfaceClassId === e.surfaceClassId &&
      last.note === e.note &&
      Math.abs(last.stationTo - e.stationFrom) <= SLIVER
    ) {
      out[out.length - 1] = { ...last, stationTo: e.stationTo };
    } else {
      out.push(e);
    }
  }
  return out;
}

/**
 * The list cut to a path's length (project length unit): a path redrawn shorter leaves stretches
 * past its end, which the API would refuse when the list is sent again for another change.
 */
export function withinLength(entries: readonly SurfaceEntry[], length: number): SurfaceEntry[] {
  return entries
    .filter((e) => e.stationFrom < length - SLIVER)
    .map((e) => (e.stationTo > length ? { ...e, stationTo: length } : e));
}
