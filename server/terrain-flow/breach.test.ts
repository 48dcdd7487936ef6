/**
 * Breaching against filling on a valley dammed by an invented road embankment: a channel
 * falling 0.1 m a row from 100 m (10 m cells) with sides rising 3 m a cell, and rows 20–21
 * raised 1.5 m across the whole width. Worked by hand: the channel cell above the dam (row 19,
 * 98.1 m) is a pit; the cheapest way out cuts the two dam cells in the channel (99.5 and 99.4 m)
 * to a steady descent to row 22 (97.8 m): 98.0 and 97.9 m, cuts of 1.5 m. Filling instead
 * raises the channel above the dam to the crest (99.5 m): rows 6–19, the pit by 1.4 m.
 */
import { describe, expect, it } from "vitest";
import { conditionAndRoute } from "./route";
import { makeGrid, UTM } from "./test-grids";
import { COND_BREACHED, COND_FILLED } from "./types";

const [w, h, xc] = [9, 40, 4];
const dammed = () =>
  makeGrid(
    UTM,
    w,
    h,
    (c, r) => 100 + 3 * Math.abs(c - xc) - 0.1 * r + (r === 20 || r === 21 ? 1.5 : 0),
  );

describe("least-cost breaching", () => {
  it("cuts through the embankment along the channel, filling nothing", () => {
    const routed = conditionAndRoute(dammed(), { conditioning: "breach" });
    expect(routed.report).toMatchObject({
      method: "breach",
      breachedPits: 1,
      breachedCells: 2,
      unbreachedPits: 0,
      filledCells: 0,
    });
    expect(routed.cond[20 * w + xc]! & COND_BREACHED).toBe(COND_BREACHED);
    expect(routed.cond[21 * w + xc]! & COND_BREACHED).toBe(COND_BREACHED);
    expect(Math.abs(routed.report.maxBreachDepthM - 1.5)).toBeLessThan(1e-4);
    expect(routed.acc[(h - 1) * w + xc]).toBe(w * h);
  });

  it("fills the valley behind the embankment when asked to fill", () => {
    const routed = conditionAndRoute(dammed());
    expect(routed.report.filledCells).toBe(14);
    expect(Math.abs(routed.report.maxFillDepthM - 1.4)).toBeLessThan(1e-4);
    for (let r = 6; r <= 19; r += 1)
      expect(routed.cond[r * w + xc]! & COND_FILLED).toBe(COND_FILLED);
    expect(routed.acc[(h - 1) * w + xc]).toBe(w * h);
  });

  it("fills what a cut deeper than the limit would open", () => {
    const routed = conditionAndRoute(dammed(), {
      conditioning: "breach",
      breach: { maxDepthM: 1 },
    });
    expect(routed.report).toMatchObject({ breachedPits: 0, unbreachedPits: 1, filledCells: 14 });
  });

  it("fills what lies farther than the search reaches", () => {
    const routed = conditionAndRoute(dammed(), {
      conditioning: "breach",
      breach: { maxLengthCells: 2 },
    });
    expect(routed.report).toMatchObject({ breachedPits: 0, unbreachedPits: 1, filledCells: 14 });
  });
});
