import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  ACRES_PER_SQUARE_MILE,
  M2_PER_ACRE,
  M3_PER_FT3,
  acFromHa,
  cfsFromM3PerS,
  ftFromM,
  haFromAc,
  inFromMm,
  m3PerSFromCfs,
  mFromFt,
  mmFromIn,
  outputUnits,
} from "./units";

describe("unit definitions (exact by definition; compared to 1e-15 relative: float rounding)", () => {
  it("1 acre = 4,046.856 422 4 m² (43,560 ft² × 0.3048² m²/ft², NIST SP 811 App. B)", () => {
    expect(M2_PER_ACRE).toBeCloseTo(4046.8564224, 9);
  });
  it("1 ft³ = 0.028 316 846 592 m³", () => {
    expect(M3_PER_FT3).toBeCloseTo(0.028316846592, 15);
  });
  it("1 mi² = 640 ac", () => {
    expect(ACRES_PER_SQUARE_MILE).toBe(640);
  });
  it("1 in = 25.4 mm and 1 ft = 0.3048 m", () => {
    expect(mmFromIn(1)).toBe(25.4);
    expect(mFromFt(1)).toBe(0.3048);
    expect(inFromMm(25.4)).toBe(1);
    expect(ftFromM(0.3048)).toBe(1);
  });
  it("1 ha = 2.471 053 8 ac", () => {
    expect(acFromHa(1)).toBeCloseTo(2.4710538147, 9);
  });
});

describe("conversions round-trip (property, 1e-14 relative)", () => {
  const value = fc.double({ min: 1e-6, max: 1e7, noNaN: true });
  it.each([
    ["length", ftFromM, mFromFt],
    ["depth", inFromMm, mmFromIn],
    ["area", acFromHa, haFromAc],
    ["flow", cfsFromM3PerS, m3PerSFromCfs],
  ] as const)("%s", (_name, there, back) => {
    fc.assert(fc.property(value, (v) => Math.abs(back(there(v)) - v) <= 1e-14 * v));
  });
});

describe("output units", () => {
  it("is the identity for US and converts for SI", () => {
    expect(outputUnits("us").velocity(2)).toBe(2);
    expect(outputUnits("si").velocity(1)).toBe(0.3048);
    expect(outputUnits("si").intensity(1)).toBe(25.4);
    expect(outputUnits("si").labels.flow).toBe("m³/s");
  });
});
