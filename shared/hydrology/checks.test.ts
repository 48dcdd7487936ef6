import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { FAA_COEFF_SI, faaTcMin } from "./faa";
import { KERBY_COEFF_SI, kerbyTcMin } from "./kerby";
import { KIRPICH_COEFF_SI, kirpichTcMin } from "./kirpich";

describe("Kirpich (1940)", () => {
  it("SI coefficient 0.0195 (L m) as printed is the US 0.0078 converted (derived; ±0.00005, printing)", () => {
    expect(Math.abs(KIRPICH_COEFF_SI - 0.0195)).toBeLessThan(5e-5);
  });
  it("equals the (L³/H)^0.385 form, H the fall in ft (derived, 1e-12 relative; property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 30_000, noNaN: true }),
        fc.double({ min: 0.001, max: 0.5, noNaN: true }),
        (l, s) => {
          const printed = 0.0078 * Math.pow((l * l * l) / (s * l), 0.385);
          return Math.abs(kirpichTcMin(l, s) - printed) <= 1e-12 * printed;
        },
      ),
    );
  });
  it("the hours–kilometres form 0.0663·L^0.77·S^−0.385 [from memory] is the same equation (±0.0001)", () => {
    expect(Math.abs((KIRPICH_COEFF_SI * Math.pow(1000, 0.77)) / 60 - 0.0663)).toBeLessThan(1e-4);
  });
});

describe("Kerby (1959)", () => {
  it("SI coefficient 1.44 (L m) as printed is the US 0.828 converted (derived; ±0.005, printing)", () => {
    expect(Math.abs(KERBY_COEFF_SI - 1.44)).toBeLessThan(5e-3);
  });
  it("SI and US forms agree on a 1,200 ft (365.76 m) grass slope (1e-12 relative)", () => {
    const us = kerbyTcMin(1200, 0.4, 0.01);
    const si = KERBY_COEFF_SI * Math.pow(365.76 * 0.4, 0.467) * Math.pow(0.01, -0.235);
    expect(Math.abs(us - si) / us).toBeLessThan(1e-12);
  });
});

describe("FAA (1970)", () => {
  it("SI coefficient 3.26 (L m) [from memory] is the US 1.8 converted (derived; ±0.005)", () => {
    expect(Math.abs(FAA_COEFF_SI - 3.26)).toBeLessThan(5e-3);
  });
  it("takes the slope in percent and shortens with C", () => {
    const t = faaTcMin(0.35, 100, 1);
    expect(t).toBeCloseTo(1.8 * 0.75 * 10, 12);
    expect(faaTcMin(0.9, 100, 1)).toBeLessThan(t);
    expect(faaTcMin(0.35, 100, 8)).toBeCloseTo(t / 2, 12);
  });
});
