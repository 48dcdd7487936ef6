import { describe, expect, it } from "vitest";
import {
  areaOutline,
  EMPTY_HISTORY,
  hasBreaks,
  HISTORY_LIMIT,
  outletOutline,
  outlineChange,
  recordChange,
  redoStep,
  reverseChange,
  undoStep,
  type DeskChange,
} from "./desk-history";

const path = (n: number): DeskChange => ({
  kind: "path",
  before: [
    [0, 0],
    [n, 0],
  ],
  after: [
    [0, 0],
    [n + 1, 0],
  ],
});
const brk: DeskChange = { kind: "breaks", before: { sheetEnd: null }, after: { sheetEnd: 80 } };

describe("the desk's undo and redo", () => {
  it("undoes the newest change first and can redo it", () => {
    const h = recordChange(recordChange(EMPTY_HISTORY, path(1)), brk);
    const u = undoStep(h);
    expect(u?.change).toBe(brk);
    expect(u?.history.undo).toEqual([path(1)]);
    const r = redoStep(u!.history);
    expect(r?.change).toBe(brk);
    expect(r?.history).toEqual(h);
  });

  it("forgets what was undone once a new change is made", () => {
    const undone = undoStep(recordChange(EMPTY_HISTORY, path(1)))!.history;
    expect(undone.redo).toHaveLength(1);
    const h = recordChange(undone, brk);
    expect(h.redo).toEqual([]);
    expect(redoStep(h)).toBeNull();
  });

  it("has nothing to undo or redo when empty", () => {
    expect(undoStep(EMPTY_HISTORY)).toBeNull();
    expect(redoStep(EMPTY_HISTORY)).toBeNull();
  });

  it("keeps only the newest changes beyond its limit", () => {
    let h = EMPTY_HISTORY;
    for (let i = 0; i < HISTORY_LIMIT + 5; i++) h = recordChange(h, path(i));
    expect(h.undo).toHaveLength(HISTORY_LIMIT);
    expect(h.undo[0]).toEqual(path(5));
  });
});

describe("reversals, boundaries and outlets in the desk's history", () => {
  it("records a reversal with the breaks it clears, to be set back by undo", () => {
    const change = reverseChange({ sheetEnd: 100, channelStart: null });
    expect(change).toEqual({
      kind: "reverse",
      before: { sheetEnd: 100, channelStart: null },
      after: { sheetEnd: null, channelStart: null },
    });
    const u = undoStep(recordChange(EMPTY_HISTORY, change));
    expect(u?.change).toBe(change);
    expect(u?.history.redo).toEqual([change]);
  });

  it("sends breaks back only when the engineer had set one", () => {
    expect(hasBreaks({ sheetEnd: null, channelStart: null })).toBe(false);
    expect(hasBreaks({})).toBe(false);
    expect(hasBreaks({ sheetEnd: null, channelStart: 420 })).toBe(true);
  });

  it("keeps only the field a new outlet changes, so undo leaves the boundary alone", () => {
    const current = {
      boundary: null,
      outlet: { type: "Point" as const, coordinates: [-122.2, 38.4] as [number, number] },
    };
    const change = outlineChange(current, outletOutline([-122.1, 38.3]));
    expect(change).toEqual({
      kind: "outline",
      before: { outlet: current.outlet },
      after: { outlet: { type: "Point", coordinates: [-122.1, 38.3] } },
    });
  });

  it("turns a drawn ring into a boundary and refuses one too short for an area", () => {
    const ring: [number, number][] = [
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 0],
    ];
    expect(areaOutline(ring)).toEqual({ boundary: { type: "Polygon", coordinates: [ring] } });
    expect(areaOutline(ring.slice(0, 3))).toBeNull();
    const change = outlineChange({ boundary: null, outlet: null }, areaOutline(ring)!);
    expect(change).toEqual({
      kind: "outline",
      before: { boundary: null },
      after: { boundary: { type: "Polygon", coordinates: [ring] } },
    });
  });
});
