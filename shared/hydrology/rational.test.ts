import { describe, expect, it } from "vitest";
import {
  CFS_PER_ACRE_INCH_PER_HOUR,
  cappedCfC,
  frequencyFactor,
  rationalPeakCfs,
  rationalPeakM3PerS,
} from "./rational";
import { haFromAc, m3PerSFromCfs, mmFromIn } from "./units";

describe("rational method Q = Cf·C·i·A", () => {
  it("1 ac·in/h = 43,560/(12·3,600) = 1.00833 cfs, printed 1.008 (derived; ±0.0005)", () => {
    expect(CFS_PER_ACRE_INCH_PER_HOUR).toBeCloseTo(1.008333333, 9);
    expect(Math.abs(CFS_PER_ACRE_INCH_PER_HOUR - 1.008)).toBeLessThan(5e-4);
  });
  it("SI Q = C·i·A/360 is the same flow as the US form (derived, 1e-12 relative)", () => {
    const cfs = rationalPeakCfs(0.5, 4, 10);
    const m3s = rationalPeakM3PerS(0.5, mmFromIn(4), haFromAc(10));
    expect(Math.abs(m3s - m3PerSFromCfs(cfs)) / m3s).toBeLessThan(1e-12);
  });
});

describe("frequency factor, FHWA HEC-22 3rd ed. (2009) Table 3-2 [from memory]", () => {
  it.each([
    [2, 1.0],
    [5, 1.0],
    [10, 1.0],
    [25, 1.1],
    [50, 1.2],
    [100, 1.25],
  ])("%d years → Cf %d", (years, cf) => {
    expect(frequencyFactor(years)).toEqual({ cf, betweenRows: false });
  });
  it("takes the next row up between rows and says so", () => {
    expect(frequencyFactor(15)).toEqual({ cf: 1.1, betweenRows: true });
  });
  it("caps Cf·C at 1", () => {
    expect(cappedCfC(1.25, 0.9)).toEqual({ value: 1, capped: true });
    expect(cappedCfC(1.1, 0.35).capped).toBe(false);
  });
});
