import { describe, expect, it } from "vitest";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { sheetInUnits } from "./sheet-units";

// 1 ft = 0.3048 m exactly (international foot, 1959 agreement; NIST SP 811, 2008, B.8);
// 1 ac = 0.40468564224 ha (NIST SP 811, 2008, B.8); 1 cfs = 0.028316846592 m³/s (same table).
const sheet = {
  units: "us",
  unitLabels: { length: "ft", velocity: "ft/s", area: "ac", flow: "cfs" },
  totalLength: 1000,
  breaks: { sheetEnd: 100, sheetEndSource: "user", channelStart: null, channelStartSource: "none" },
  segments: [
    {
      index: 0,
      stationFrom: 0,
      stationTo: 100,
      length: 100,
      k: 16.1345,
      elevationUp: 500,
      elevationDown: 498,
      slope: 0.02,
      velocity: 2.28,
      timesMin: { velocity: 0.73 },
    },
  ],
  peakFlow: {
    value: 10,
    unit: "cfs",
    area: 5,
    intensity: 2,
    c: 0.5,
    cf: 1,
    cfTimesC: 0.5,
    durationMin: 10,
    returnPeriodYears: 25,
  },
  figures: { area: 5, cn: 70, c: 0.5, avgSlopePercent: 2, notes: [] },
  profile: [{ station: 0, elevation: 500 }],
} as unknown as TravelTimeSheet;

describe("the sheet in the units shown", () => {
  it("converts lengths, elevations, velocities, area and flow to SI by their definitions", () => {
    const si = sheetInUnits(sheet, "si");
    const s = si.segments[0]!;
    expect(si.totalLength).toBeCloseTo(304.8, 10);
    expect(s.elevationUp).toBeCloseTo(152.4, 10);
    expect(s.velocity).toBeCloseTo(2.28 * 0.3048, 10);
    expect(si.figures.area).toBeCloseTo(5 * 0.40468564224, 10);
    expect(si.peakFlow?.value).toBeCloseTo(10 * 0.028316846592, 10);
    expect(si.unitLabels.length).toBe("m");
  });

  it("leaves slopes and times alone", () => {
    const s = sheetInUnits(sheet, "si").segments[0]!;
    expect(s.slope).toBe(0.02);
    expect(s.timesMin.velocity).toBe(0.73);
  });

  it("returns the same sheet when the units already match", () => {
    expect(sheetInUnits(sheet, "us")).toBe(sheet);
  });
});
