import { describe, expect, it } from "vitest";
import {
  EMPTY_HISTORY,
  HISTORY_LIMIT,
  recordChange,
  redoStep,
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
