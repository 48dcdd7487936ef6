import { describe, expect, it } from "vitest";
import { TR55_SHEET_COEFF_SI, mcCuenSpiessMaxLengthFt, sheetFlowTravelTimeHr } from "./tr55-sheet";

describe("TR-55 sheet flow, eq 3-3", () => {
  it("TR-55 (1986) Example 3-1 ('Heavenly Acres', Worksheet 3), segment AB: dense grass n 0.24, L 100 ft, P2 3.6 in, s 0.01 → 0.30 h [from memory]", () => {
    // Tolerance ±0.005 h: the worksheet prints two decimals.
    const hours = sheetFlowTravelTimeHr({
      manningN: 0.24,
      lengthFt: 100,
      p2In: 3.6,
      slopeFtPerFt: 0.01,
    });
    expect(Math.abs(hours - 0.3)).toBeLessThan(0.005);
  });
  it("the SI constant (L m, P2 mm) is 0.0913 as printed (derived; ±0.00005, four-decimal printing)", () => {
    expect(Math.abs(TR55_SHEET_COEFF_SI - 0.0913)).toBeLessThan(5e-5);
  });
  it("the SI form with the derived constant equals the US form (1e-12 relative)", () => {
    const us = sheetFlowTravelTimeHr({
      manningN: 0.15,
      lengthFt: 80,
      p2In: 3.1,
      slopeFtPerFt: 0.02,
    });
    const si =
      (TR55_SHEET_COEFF_SI * Math.pow(0.15 * 80 * 0.3048, 0.8)) /
      (Math.sqrt(3.1 * 25.4) * Math.pow(0.02, 0.4));
    expect(Math.abs(si - us) / us).toBeLessThan(1e-12);
  });
});

describe("McCuen–Spiess sheet-flow limit, NEH 630 Ch 15 eq 15-9 (L = 100·s^0.5/n ft)", () => {
  it("smooth surface n 0.011 at 1 % allows about 909 ft; dense grass n 0.24 only 41.7 ft (derived)", () => {
    expect(mcCuenSpiessMaxLengthFt(0.01, 0.011)).toBeCloseTo(909.09, 2);
    expect(mcCuenSpiessMaxLengthFt(0.01, 0.24)).toBeCloseTo(41.667, 3);
  });
});
