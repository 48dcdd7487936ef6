/**
 * Surface overrides: the engineer says that a stretch of the flow path is really of surface
 * class X (the cover layer is out of date, too coarse, or does not reach the stretch). They are
 * applied to the split before the regime cut, by the server's compute and by the browser's live
 * split alike, so both show the same segments.
 *
 * Pieces are cut at each override's ends; the stretches inside an override take its class and
 * keep their soil group. Neighbouring override stretches with the same class and soil group
 * are merged (the travel time depends on the class, not on which cover polygon lay beneath),
 * keeping the feature ids where the merged stretch starts. Stretches outside every override
 * are left as the split made them.
 */
import type { PathPiece } from "./types";

/** Where a piece's surface class came from. */
export type SurfaceSource = "cover-layer" | "override";

/** A stretch of the path (stations in metres from the divide) said to be of one class. */
export interface SurfaceOverride {
  readonly stationFromM: number;
  readonly stationToM: number;
  readonly surfaceClassId: string;
}

export interface SurfacedPiece extends PathPiece {
  readonly surfaceSource: SurfaceSource;
}

function checkOverride(o: SurfaceOverride, i: number): void {
  if (!Number.isFinite(o.stationFromM) || !Number.isFinite(o.stationToM)) {
    throw new RangeError(`surface override ${i + 1} needs finite stations in metres`);
  }
}

/**
 * The pieces with the overrides applied. The API refuses overlapping overrides; should two
 * overlap here anyway, the later one in the list wins where they do. Overrides reaching past
 * the path's ends act on the part that lies on the path; an empty or inverted one does nothing.
 */
export function applySurfaceOverrides(
  pieces: readonly PathPiece[],
  overrides: readonly SurfaceOverride[],
): SurfacedPiece[] {
  overrides.forEach(checkOverride);
  const live = overrides.filter((o) => o.stationToM > o.stationFromM);
  const out: SurfacedPiece[] = [];
  for (const piece of pieces) {
    const from = piece.stationFromM;
    const to = piece.stationToM;
    const cuts = new Set([from, to]);
    for (const o of live) {
      if (o.stationFromM > from && o.stationFromM < to) cuts.add(o.stationFromM);
      if (o.stationToM > from && o.stationToM < to) cuts.add(o.stationToM);
    }
    if (cuts.size === 2) {
      push(out, piece, from, to, overrideAt(live, (from + to) / 2), false);
      continue;
    }
    const sorted = [...cuts].sort((a, b) => a - b);
    for (let k = 0; k + 1 < sorted.length; k += 1) {
      const a = sorted[k]!;
      const b = sorted[k + 1]!;
      push(out, piece, a, b, overrideAt(live, (a + b) / 2), true);
    }
  }
  return out;
}

/** The override holding a station strictly inside it (the last one listed, if several). */
function overrideAt(
  overrides: readonly SurfaceOverride[],
  stationM: number,
): SurfaceOverride | undefined {
  for (let i = overrides.length - 1; i >= 0; i -= 1) {
    const o = overrides[i]!;
    if (o.stationFromM < stationM && stationM < o.stationToM) return o;
  }
  return undefined;
}

function push(
  out: SurfacedPiece[],
  piece: PathPiece,
  fromM: number,
  toM: number,
  o: SurfaceOverride | undefined,
  cut: boolean,
): void {
  if (!o) {
    out.push({
      ...piece,
      ...(cut && { stationFromM: fromM, stationToM: toM, lengthM: toM - fromM }),
      surfaceSource: "cover-layer",
    });
    return;
  }
  const last = out[out.length - 1];
  if (
    last &&
    last.surfaceSource === "override" &&
    last.surfaceClassId === o.surfaceClassId &&
    last.hsg === piece.hsg &&
    last.stationToM === fromM
  ) {
    out[out.length - 1] = { ...last, stationToM: toM, lengthM: toM - last.stationFromM };
    return;
  }
  out.push({
    ...piece,
    stationFromM: fromM,
    stationToM: toM,
    lengthM: cut ? toM - fromM : piece.lengthM,
    surfaceClassId: o.surfaceClassId,
    surfaceSource: "override",
  });
}
