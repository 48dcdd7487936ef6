/**
 * Manning's equation for channel flow, and the sections it needs.
 *
 *   V = (kM/n)·R^(2/3)·s^(1/2),  R = A/P
 *   kM = 1.49 ft^(1/3)/s (US, V ft/s, R ft; TR-55 (1986) eq 3-4 as printed) or
 *   kM = 1 m^(1/3)/s (SI), which is 1/0.3048^(1/3) = 1.4859 ft^(1/3)/s exactly ("exact").
 *
 * Sections (lengths in one unit, here ft):
 *   trapezoid  A = (b + (zL+zR)/2·y)·y,  P = b + y·(√(1+zL²) + √(1+zR²))   (z = H:V side slope)
 *   circular   θ = 2·acos(1 − 2y/D),  A = D²(θ − sin θ)/8,  P = D·θ/2       (full when y = D)
 *   given      A and P as measured.
 * Source: Chow (1959) Open-Channel Hydraulics, ch 2 (section elements) and ch 5 (Manning).
 * Validity: steady uniform turbulent flow; n for the lining (Chow 1959 Table 5-6).
 */
import { M_PER_FT } from "./units";

/** Unit constant of Manning's equation in ft^(1/3)/s, as TR-55 prints it. */
export const MANNING_K_US_TR55 = 1.49;
/** 1 m^(1/3)/s in ft^(1/3)/s: the exact equivalent of the SI form V = (1/n)·R^(2/3)·s^(1/2). */
export const MANNING_K_US_EXACT = 1 / Math.cbrt(M_PER_FT);

export type ChannelSection =
  | { readonly shape: "given"; readonly flowArea: number; readonly wettedPerimeter: number }
  | {
      readonly shape: "trapezoid";
      readonly bottomWidth: number;
      readonly sideSlopeLeft: number;
      readonly sideSlopeRight: number;
      readonly depth: number;
    }
  | { readonly shape: "circular"; readonly diameter: number; readonly flowDepth: number };

export interface SectionGeometry {
  readonly flowArea: number;
  readonly wettedPerimeter: number;
  readonly hydraulicRadius: number;
}

export function trapezoidGeometry(
  bottomWidth: number,
  sideSlopeLeft: number,
  sideSlopeRight: number,
  depth: number,
): SectionGeometry {
  const flowArea = (bottomWidth + ((sideSlopeLeft + sideSlopeRight) / 2) * depth) * depth;
  const wettedPerimeter =
    bottomWidth +
    depth * (Math.sqrt(1 + sideSlopeLeft * sideSlopeLeft) + Math.sqrt(1 + sideSlopeRight ** 2));
  return { flowArea, wettedPerimeter, hydraulicRadius: flowArea / wettedPerimeter };
}

/** Circular conduit flowing at depth y (y = D: full). */
export function circularGeometry(diameter: number, flowDepth: number): SectionGeometry {
  const ratio = Math.min(Math.max(flowDepth / diameter, 0), 1);
  const theta = 2 * Math.acos(1 - 2 * ratio);
  const flowArea = (diameter * diameter * (theta - Math.sin(theta))) / 8;
  const wettedPerimeter = (diameter * theta) / 2;
  return { flowArea, wettedPerimeter, hydraulicRadius: flowArea / wettedPerimeter };
}

export function sectionGeometry(section: ChannelSection): SectionGeometry {
  switch (section.shape) {
    case "given":
      return {
        flowArea: section.flowArea,
        wettedPerimeter: section.wettedPerimeter,
        hydraulicRadius: section.flowArea / section.wettedPerimeter,
      };
    case "trapezoid":
      return trapezoidGeometry(
        section.bottomWidth,
        section.sideSlopeLeft,
        section.sideSlopeRight,
        section.depth,
      );
    case "circular":
      return circularGeometry(section.diameter, section.flowDepth);
  }
}

/** Manning velocity, V in ft/s for R in ft with a US unit constant kM (ft^(1/3)/s). */
export function manningVelocity(
  unitConstant: number,
  manningN: number,
  hydraulicRadius: number,
  slopeFtPerFt: number,
): number {
  return (unitConstant / manningN) * Math.pow(hydraulicRadius, 2 / 3) * Math.sqrt(slopeFtPerFt);
}

/**
 * The smallest wetted perimeter any section of flow area A can have is the half circle's,
 * √(2πA); a smaller given P cannot be a real section (a full pipe has √(4πA)).
 */
export function minimumWettedPerimeter(flowArea: number): number {
  return Math.sqrt(2 * Math.PI * flowArea);
}
