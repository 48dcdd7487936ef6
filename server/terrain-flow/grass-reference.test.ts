/**
 * Against a general-purpose GIS: GRASS GIS 8 (Debian's grass-core) r.watershed -s (D8) and
 * r.water.outlet (tests/support/grass traces GRASS's longest path on its own drainage codes):
 * contributing areas within 2 % of GRASS's (r.stats cell counts × its resolution) and longest
 * flow paths within 5 %, the tolerances asked of this engine. On a synthetic terrain of valleys,
 * outlets spread over basins from 100 cells up; on the demo terrain, clicks along its swale,
 * where an engineer would click. Not on the demo's open hillside: its terraces are planes whose
 * fall lies within a hair of 22.5° off east, where east and south-east drain almost equally and
 * the two engines break that near-tie differently (GRASS rounds elevations to integer
 * millimetres and routes by an A* search), so parallel flow lines merge at other cells and a
 * click on one gets another area. Rillmark's areas are on the ground, GRASS's in the
 * projection's plane: they differ by the UTM scale squared, 0.08 % on the central meridian and
 * 0.04 % at the demo's easting, well inside 2 %. Skipped, with the reason, where GRASS is not
 * installed (npm test installs it as root).
 */
import { describe, expect, it } from "vitest";
import { grassMissing } from "../../tests/support/grass";
import {
  compareWithGrass,
  DEMO_TERRAIN,
  outletCells,
  swaleClicks,
  valleysTif,
} from "../../tests/support/grass-compare";

const missing = grassMissing();

describe.skipIf(missing !== null)("against GRASS GIS r.watershed -s and r.water.outlet", () => {
  it("a synthetic terrain of valleys: basins from 100 cells up, areas within 2 %, paths within 5 %", async () => {
    const rows = await compareWithGrass(valleysTif(), (routed) => outletCells(routed, 12));
    expect(rows.filter((r) => Math.abs(r.area) > 0.02 || Math.abs(r.path) > 0.05)).toEqual([]);
    expect(rows.length).toBeGreaterThanOrEqual(10);
    expect(Math.min(...rows.map((r) => r.cells))).toBeGreaterThan(100);
    expect(Math.max(...rows.map((r) => r.cells))).toBeGreaterThan(1000);
  }, 120_000);

  it("the demo terrain, clicked along its swale: areas within 2 %, paths within 5 %", async () => {
    const rows = await compareWithGrass(DEMO_TERRAIN, swaleClicks);
    expect(rows.filter((r) => Math.abs(r.area) > 0.02 || Math.abs(r.path) > 0.05)).toEqual([]);
    expect(rows.length).toBe(10);
    expect(Math.min(...rows.map((r) => r.cells))).toBeGreaterThan(100);
  }, 120_000);
});

describe.runIf(missing !== null)("against GRASS GIS", () => {
  it(`is skipped: ${missing}`, () => {
    expect(missing).toMatch(/not installed/);
  });
});
