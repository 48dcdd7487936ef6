/**
 * applySurfaceOverrides is station bookkeeping (no engineering value is computed here), so these
 * checks are structural: where pieces are cut, which class and source each stretch gets, and
 * that the path's stations stay contiguous with its length unchanged. The stations are plain
 * round numbers chosen to make the cuts easy to read.
 */
import { describe, expect, it } from "vitest";
import { regimeSegments } from "./regimes";
import { applySurfaceOverrides, type SurfaceOverride } from "./surface-overrides";
import type { HsgCode, PathPiece } from "./types";

const piece = (
  fromM: number,
  toM: number,
  surfaceClassId: string | null,
  hsg: HsgCode | null = "B",
  coverFeatureId: number | null = 1,
): PathPiece => ({
  stationFromM: fromM,
  stationToM: toM,
  lengthM: toM - fromM,
  surfaceClassId,
  hsg,
  coverFeatureId,
  soilFeatureId: 7,
});
const pieces = [
  piece(0, 30, "lawn", "B", 1),
  piece(30, 80, "woods", "B", 2),
  piece(80, 200, "range", "C", 3),
];
const over = (fromM: number, toM: number, surfaceClassId: string): SurfaceOverride => ({
  stationFromM: fromM,
  stationToM: toM,
  surfaceClassId,
});
const table = (out: ReturnType<typeof applySurfaceOverrides>) =>
  out.map((p) => [p.surfaceClassId, p.surfaceSource, p.stationFromM, p.stationToM]);

describe("applySurfaceOverrides", () => {
  it("leaves the split as it is, marked as from the cover layer, when there is no override", () => {
    const out = applySurfaceOverrides(pieces, []);
    expect(out).toEqual(pieces.map((p) => ({ ...p, surfaceSource: "cover-layer" })));
  });

  it("cuts a piece at both ends of an override inside it", () => {
    expect(table(applySurfaceOverrides(pieces, [over(40, 60, "pavement")]))).toEqual([
      ["lawn", "cover-layer", 0, 30],
      ["woods", "cover-layer", 30, 40],
      ["pavement", "override", 40, 60],
      ["woods", "cover-layer", 60, 80],
      ["range", "cover-layer", 80, 200],
    ]);
  });

  it("merges override stretches of one soil group, keeping the first stretch's feature ids", () => {
    const out = applySurfaceOverrides(pieces, [over(10, 70, "pavement")]);
    expect(table(out)).toEqual([
      ["lawn", "cover-layer", 0, 10],
      ["pavement", "override", 10, 70],
      ["woods", "cover-layer", 70, 80],
      ["range", "cover-layer", 80, 200],
    ]);
    expect(out[1]).toMatchObject({ coverFeatureId: 1, hsg: "B", lengthM: 60 });
  });

  it("keeps a soil-group change inside an override as two stretches", () => {
    const out = applySurfaceOverrides(pieces, [over(50, 120, "pavement")]);
    expect(
      out.filter((p) => p.surfaceSource === "override").map((p) => [p.hsg, p.lengthM]),
    ).toEqual([
      ["B", 30],
      ["C", 40],
    ]);
  });

  it("gives a class to a stretch the cover layer leaves unmapped", () => {
    const gap = [piece(0, 50, "lawn"), piece(50, 90, null, "B", null), piece(90, 120, "lawn")];
    expect(table(applySurfaceOverrides(gap, [over(50, 90, "gravel")]))).toEqual([
      ["lawn", "cover-layer", 0, 50],
      ["gravel", "override", 50, 90],
      ["lawn", "cover-layer", 90, 120],
    ]);
  });

  it("does not merge an override with a cover-layer neighbour of the same class", () => {
    const out = applySurfaceOverrides(pieces, [over(30, 80, "lawn")]);
    expect(table(out).slice(0, 2)).toEqual([
      ["lawn", "cover-layer", 0, 30],
      ["lawn", "override", 30, 80],
    ]);
  });

  it("acts only on the part of an override that lies on the path; an empty one does nothing", () => {
    const out = applySurfaceOverrides(pieces, [
      over(-20, 10, "gravel"),
      over(150, 900, "gravel"),
      over(60, 60, "x"),
      over(70, 65, "x"),
    ]);
    expect(table(out)).toEqual([
      ["gravel", "override", 0, 10],
      ["lawn", "cover-layer", 10, 30],
      ["woods", "cover-layer", 30, 80],
      ["range", "cover-layer", 80, 150],
      ["gravel", "override", 150, 200],
    ]);
  });

  it("lets the later of two overlapping overrides win where they overlap", () => {
    const out = applySurfaceOverrides(pieces, [over(0, 60, "gravel"), over(40, 80, "pavement")]);
    expect(table(out).slice(0, 3)).toEqual([
      ["gravel", "override", 0, 40],
      ["pavement", "override", 40, 80],
      ["range", "cover-layer", 80, 200],
    ]);
  });

  it("keeps stations contiguous and the path's length whatever the overrides", () => {
    const out = applySurfaceOverrides(pieces, [
      over(5, 12.5, "a"),
      over(29.999, 30.001, "b"),
      over(79, 81, "a"),
      over(199, 200, "c"),
    ]);
    expect(out[0]?.stationFromM).toBe(0);
    expect(out.at(-1)?.stationToM).toBe(200);
    for (let i = 1; i < out.length; i += 1) {
      expect(out[i]?.stationFromM).toBe(out[i - 1]?.stationToM);
    }
    const total = out.reduce((sum, p) => sum + p.lengthM, 0);
    expect(total).toBeCloseTo(200, 9);
  });

  it("refuses an override whose stations are not finite numbers", () => {
    expect(() => applySurfaceOverrides(pieces, [over(Number.NaN, 10, "a")])).toThrow(
      /surface override 1/,
    );
  });

  it("carries the source through the regime cut", () => {
    const out = regimeSegments(applySurfaceOverrides(pieces, [over(20, 40, "gravel")]), {
      sheetEndM: 30,
      channelStartM: null,
    });
    expect(out.map((s) => [s.surfaceClassId, s.surfaceSource, s.regime])).toEqual([
      ["lawn", "cover-layer", "sheet"],
      ["gravel", "override", "sheet"],
      ["gravel", "override", "shallow"],
      ["woods", "cover-layer", "shallow"],
      ["range", "cover-layer", "shallow"],
    ]);
  });
});
