/**
 * Station bookkeeping of the sheet's Surface cell (no engineering value is computed): which
 * overrides are trimmed, split, replaced or joined when one segment's surface is chosen.
 * Stations are plain round numbers chosen to make the cuts easy to read.
 */
import { describe, expect, it } from "vitest";
import { withSurfaceStretch, withinLength, type SurfaceEntry } from "./surface-edit";

const entry = (stationFrom: number, stationTo: number, surfaceClassId: string): SurfaceEntry => ({
  stationFrom,
  stationTo,
  surfaceClassId,
  note: "",
});
const spans = (list: SurfaceEntry[]) =>
  list.map((e) => [e.stationFrom, e.stationTo, e.surfaceClassId]);

describe("withSurfaceStretch", () => {
  it("adds an override for a segment that had none", () => {
    expect(spans(withSurfaceStretch([], { stationFrom: 10, stationTo: 40 }, "pave"))).toEqual([
      [10, 40, "pave"],
    ]);
  });

  it("splits an override around a segment given back to the cover layer", () => {
    const list = [entry(0, 100, "pave")];
    expect(spans(withSurfaceStretch(list, { stationFrom: 30, stationTo: 60 }, null))).toEqual([
      [0, 30, "pave"],
      [60, 100, "pave"],
    ]);
  });

  it("trims the overrides a new segment class reaches into", () => {
    const list = [entry(0, 40, "pave"), entry(40, 90, "gravel")];
    expect(spans(withSurfaceStretch(list, { stationFrom: 30, stationTo: 50 }, "lawn"))).toEqual([
      [0, 30, "pave"],
      [30, 50, "lawn"],
      [50, 90, "gravel"],
    ]);
  });

  it("joins a segment to a touching override of the same class", () => {
    const list = [entry(0, 30, "pave")];
    expect(spans(withSurfaceStretch(list, { stationFrom: 30, stationTo: 45 }, "pave"))).toEqual([
      [0, 45, "pave"],
    ]);
  });

  it("leaves no sliver where an override's end misses the segment's by a rounding error", () => {
    const list = [entry(0, 30.0000004, "pave"), entry(30.0000004, 80, "gravel")];
    expect(spans(withSurfaceStretch(list, { stationFrom: 30, stationTo: 80 }, null))).toEqual([
      [0, 30, "pave"],
    ]);
  });

  it("keeps overrides away from the segment as they are", () => {
    const list = [entry(0, 10, "pave"), entry(90, 100, "gravel")];
    expect(withSurfaceStretch(list, { stationFrom: 10, stationTo: 90 }, null)).toEqual(list);
  });
});

describe("withinLength", () => {
  it("cuts stretches to a path redrawn shorter and drops those past its end", () => {
    const list = [entry(0, 10, "pave"), entry(20, 60, "gravel"), entry(70, 90, "lawn")];
    expect(spans(withinLength(list, 50))).toEqual([
      [0, 10, "pave"],
      [20, 50, "gravel"],
    ]);
  });
});
