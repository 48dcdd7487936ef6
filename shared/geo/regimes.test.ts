import { describe, expect, it } from "vitest";
import { resolveRules } from "../hydrology/rules";
import { regimeSegments, sheetEndStationM } from "./regimes";
import type { PathPiece } from "./types";

const piece = (fromM: number, toM: number, surfaceClassId: string): PathPiece => ({
  stationFromM: fromM,
  stationToM: toM,
  lengthM: toM - fromM,
  surfaceClassId,
  hsg: "B",
  coverFeatureId: 1,
  soilFeatureId: 2,
});
const pieces = [piece(0, 30, "lawn"), piece(30, 80, "woods"), piece(80, 200, "range")];
const table = (segments: ReturnType<typeof regimeSegments>) =>
  segments.map((s) => [s.surfaceClassId, s.regime, s.stationFromM, s.stationToM]);

describe("regimeSegments", () => {
  it("cuts pieces at the sheet and channel breaks: sheet, then shallow, then channel", () => {
    expect(table(regimeSegments(pieces, { sheetEndM: 30.48, channelStartM: 150 }))).toEqual([
      ["lawn", "sheet", 0, 30],
      ["woods", "sheet", 30, 30.48],
      ["woods", "shallow", 30.48, 80],
      ["range", "shallow", 80, 150],
      ["range", "channel", 150, 200],
    ]);
  });

  it("makes everything shallow concentrated flow when neither break is set", () => {
    const segments = regimeSegments(pieces, { sheetEndM: null, channelStartM: null });
    expect(segments.map((s) => s.regime)).toEqual(["shallow", "shallow", "shallow"]);
  });

  it("adds no zero-length segment when a break falls on a piece boundary", () => {
    const segments = regimeSegments(pieces, { sheetEndM: 30, channelStartM: 80 });
    expect(table(segments)).toEqual([
      ["lawn", "sheet", 0, 30],
      ["woods", "shallow", 30, 80],
      ["range", "channel", 80, 200],
    ]);
  });

  it("clamps breaks outside the path", () => {
    expect(
      regimeSegments(pieces, { sheetEndM: -5, channelStartM: 900 }).map((s) => s.regime),
    ).toEqual(["shallow", "shallow", "shallow"]);
    expect(
      regimeSegments(pieces, { sheetEndM: 900, channelStartM: null }).map((s) => s.regime),
    ).toEqual(["sheet", "sheet", "sheet"]);
  });

  it("lets a channel break above the sheet break win from the channel break on", () => {
    expect(table(regimeSegments(pieces, { sheetEndM: 100, channelStartM: 50 }))).toEqual([
      ["lawn", "sheet", 0, 30],
      ["woods", "sheet", 30, 50],
      ["woods", "channel", 50, 80],
      ["range", "channel", 80, 200],
    ]);
  });

  it("keeps the total length and the pieces' classes and features", () => {
    const segments = regimeSegments(pieces, { sheetEndM: 12.3, channelStartM: 101.1 });
    expect(segments.reduce((s, x) => s + x.lengthM, 0)).toBeCloseTo(200, 12);
    expect(segments.every((s) => s.hsg === "B" && s.coverFeatureId === 1)).toBe(true);
  });

  it("refuses a break that is not a number", () => {
    expect(() => regimeSegments(pieces, { sheetEndM: Number.NaN, channelStartM: null })).toThrow(
      /sheetEndM must be a station/,
    );
  });
});

describe("sheetEndStationM", () => {
  const us = (sheetFlowMaxLength: "100ft" | "300ft" | "mccuen-spiess") =>
    resolveRules({ sheetFlowMaxLength }, "us", 10).sheetCap;

  it("takes the 100 ft rule (NEH 630 Ch 15, 2010) as 30.48 m (1 ft = 0.3048 m exactly, NIST SP 811)", () => {
    expect(sheetEndStationM({ totalM: 500, userBreakM: null, cap: us("100ft") })).toEqual({
      ok: true,
      stationM: 30.48,
      source: "design-rule",
      capM: 30.48,
    });
  });

  it("takes the 300 ft rule (TR-55, 1986) as 91.44 m, never past the outlet", () => {
    const r = sheetEndStationM({ totalM: 60, userBreakM: null, cap: us("300ft") });
    expect(r).toEqual({ ok: true, stationM: 60, source: "design-rule", capM: 91.44 });
  });

  it("lets the user's break win over the rule, even past the cap", () => {
    const r = sheetEndStationM({ totalM: 500, userBreakM: 120, cap: us("100ft") });
    expect(r).toEqual({ ok: true, stationM: 120, source: "user-break", capM: null });
  });

  it("computes the McCuen–Spiess cap L = 100·s^0.5/n ft (NEH 630 Ch 15 eq 15-9): s = 0.01, n = 0.24 gives 41.67 ft = 12.70 m", () => {
    const r = sheetEndStationM({
      totalM: 500,
      userBreakM: null,
      cap: us("mccuen-spiess"),
      mcCuenSpiess: { slopeFtPerFt: 0.01, manningN: 0.24 },
    });
    expect(r.ok && r.stationM).toBeCloseTo(((100 * 0.1) / 0.24) * 0.3048, 9);
  });

  it("says what is missing when the McCuen–Spiess cap has no slope or n", () => {
    const r = sheetEndStationM({ totalM: 500, userBreakM: null, cap: us("mccuen-spiess") });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.problem).toMatch(/needs a downhill slope and Manning's n/);
  });
});
