import { describe, expect, it } from "vitest";
import {
  MANNING_K_US_EXACT,
  MANNING_K_US_TR55,
  circularGeometry,
  manningVelocity,
  minimumWettedPerimeter,
  sectionGeometry,
  trapezoidGeometry,
} from "./manning";
import { travelTimeMin } from "./velocity";

describe("section elements (Chow 1959, Table 2-1; derived, 1e-12 relative: closed forms)", () => {
  it("trapezoid b = 10, z = 2, y = 3: A = 48, P = 10 + 6√5", () => {
    const g = trapezoidGeometry(10, 2, 2, 3);
    expect(g.flowArea).toBeCloseTo(48, 12);
    expect(g.wettedPerimeter).toBeCloseTo(10 + 6 * Math.sqrt(5), 12);
  });
  it("rectangle and triangle are trapezoids with z = 0 and b = 0", () => {
    expect(trapezoidGeometry(4, 0, 0, 2).hydraulicRadius).toBeCloseTo(1, 12);
    expect(trapezoidGeometry(0, 1, 1, 2).flowArea).toBeCloseTo(4, 12);
  });
  it("a full pipe has A = πD²/4, P = πD, R = D/4; a half-full one also R = D/4", () => {
    const full = circularGeometry(2, 2);
    expect(full.flowArea).toBeCloseTo(Math.PI, 12);
    expect(full.wettedPerimeter).toBeCloseTo(2 * Math.PI, 12);
    expect(full.hydraulicRadius).toBeCloseTo(0.5, 12);
    expect(circularGeometry(2, 1).hydraulicRadius).toBeCloseTo(0.5, 12);
  });
  it("given A and P pass through", () => {
    expect(
      sectionGeometry({ shape: "given", flowArea: 27, wettedPerimeter: 28.2 }).hydraulicRadius,
    ).toBeCloseTo(0.957447, 6);
  });
  it("the half circle has the least wetted perimeter for its area", () => {
    const half = circularGeometry(2, 1);
    expect(minimumWettedPerimeter(half.flowArea)).toBeCloseTo(half.wettedPerimeter, 12);
  });
});

describe("partly full circular pipe: the hydraulic-elements chart of a circular conduit found in hydraulics textbooks [from memory]; maxima derived here", () => {
  const q = (y: number) => {
    const g = circularGeometry(1, y);
    return g.flowArea * Math.pow(g.hydraulicRadius, 2 / 3);
  };
  const v = (y: number) => Math.pow(circularGeometry(1, y).hydraulicRadius, 2 / 3);
  const argmax = (f: (y: number) => number) => {
    let best = 0.5;
    for (let y = 0.5; y <= 1; y += 1e-4) if (f(y) > f(best)) best = y;
    return best;
  };
  // Tolerance ±0.005 in y/D: the chart values are quoted to 2–3 digits.
  it("discharge peaks at y/D ≈ 0.938, about 1.076 × the full-pipe discharge", () => {
    expect(Math.abs(argmax(q) - 0.938)).toBeLessThan(0.005);
    expect(Math.abs(q(argmax(q)) / q(1) - 1.076)).toBeLessThan(0.002);
  });
  it("velocity peaks at y/D ≈ 0.81, about 1.14 × the full-pipe velocity", () => {
    expect(Math.abs(argmax(v) - 0.81)).toBeLessThan(0.005);
    expect(Math.abs(v(argmax(v)) / v(1) - 1.14)).toBeLessThan(0.005);
  });
});

describe("Manning's equation", () => {
  it("TR-55 (1986) Example 3-1 ('Heavenly Acres', Worksheet 3), segment CD: A 27 ft², P 28.2 ft, s 0.005, n 0.05, L 7,300 ft [from memory]", () => {
    const r = 27 / 28.2;
    const vel = manningVelocity(MANNING_K_US_TR55, 0.05, r, 0.005);
    // The worksheet's r is printed 0.957 (±0.0005). Its V is recalled as 2.1 ft/s; the
    // equation gives 2.05, so the recalled figure is held to ±0.1 ft/s only (doubtful memory).
    expect(Math.abs(r - 0.957)).toBeLessThan(0.0005);
    expect(Math.abs(vel - 2.1)).toBeLessThan(0.1);
    // Tt: the example's total (1.53 h) less its sheet (0.30 h) and shallow (0.24 h) parts
    // implies 0.99 h; ±0.01 h (two-decimal printing).
    expect(Math.abs(travelTimeMin(7300, vel) / 60 - 0.99)).toBeLessThan(0.01);
  });
  it("the exact US constant is 1/0.3048^(1/3) = 1.4859 (SI form with 1/n, derived)", () => {
    expect(MANNING_K_US_EXACT).toBeCloseTo(1.48592, 5);
  });
});
