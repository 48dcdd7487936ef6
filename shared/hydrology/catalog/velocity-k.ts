/**
 * Velocity coefficients k of V = k·s^0.5 (velocity method; upland and shallow concentrated flow).
 * V in ft/s with kFtPerS, in m/s with kMPerS; s in ft/ft (m/m) in both.
 *
 * Because s is dimensionless, k is a velocity and converts like one: kMPerS = kFtPerS · 0.3048
 * (exact; international foot). Each NEH 630 Table 15-3 row is Manning's equation with the
 * tabulated n and hydraulic radius r: k = (1.486/n)·r^(2/3). The published coefficients are kept
 * verbatim (they use 1.486, not 1.49).
 */
import { M_PER_FT } from "../units";
import { type VelocityKRow, type VelocityKTable } from "./types";

const NEH = "NEH Part 630 Ch 15 (2010) Table 15-3 [from memory]";
const TR55 = "TR-55 (1986) Figure 3-1 and Appendix F [from memory]";
const HEC22 =
  "FHWA HEC-22 (3rd ed., 2009) Table 3-4, intercept coefficients for velocity vs. slope " +
  "(after FHWA HDS-2, 2002) [from memory; table number uncertain]";
const HEC22_SI =
  "FHWA HEC-22 (3rd ed., 2009) Table 3-4, printed k for V = Ku·k·Sp^0.5 with Sp in percent, " +
  "Ku = 1 (SI) [from memory]";

interface KSpec<Id extends string> {
  readonly id: Id;
  readonly surface: string;
  readonly flow: VelocityKRow["flow"];
  readonly kFtPerS: number;
  readonly manning?: { readonly n: number; readonly hydraulicRadiusFt: number };
  readonly printedSi?: { readonly k: number; readonly slopeUnit: "m/m" | "percent" };
}

function kRows(table: VelocityKTable, source: string, siSource: string) {
  return <const Id extends string>(spec: KSpec<Id>): VelocityKRow & { readonly id: Id } => {
    const { manning, printedSi, ...rest } = spec;
    return {
      ...rest,
      table,
      kMPerS: spec.kFtPerS * M_PER_FT,
      source,
      ...(manning === undefined ? {} : { manning: { ...manning, source } }),
      ...(printedSi === undefined
        ? {}
        : { printedSi: { ...printedSi, decimals: 3, source: siSource } }),
    };
  };
}

const neh = kRows("neh-630-15-3", NEH, NEH);
const tr55 = kRows("tr-55-fig-3-1", TR55, TR55);
const hec22 = kRows("hec-22", HEC22, HEC22_SI);
const R02 = 0.2;

const NEH_ROWS = [
  neh({
    id: "neh-pavement-upland-gullies",
    surface: "Pavement; small upland gullies",
    flow: "shallow concentrated",
    kFtPerS: 20.3282,
    manning: { n: 0.025, hydraulicRadiusFt: R02 },
    printedSi: { k: 6.196, slopeUnit: "m/m" },
  }),
  neh({
    id: "neh-grassed-waterway",
    surface: "Grassed waterway",
    flow: "shallow concentrated",
    kFtPerS: 16.1345,
    manning: { n: 0.05, hydraulicRadiusFt: 0.4 },
    printedSi: { k: 4.918, slopeUnit: "m/m" },
  }),
  neh({
    id: "neh-nearly-bare-untilled",
    surface: "Nearly bare and untilled (overland flow); alluvial fans in western mountain regions",
    flow: "overland",
    kFtPerS: 9.965,
    manning: { n: 0.051, hydraulicRadiusFt: R02 },
    printedSi: { k: 3.037, slopeUnit: "m/m" },
  }),
  neh({
    id: "neh-cultivated-straight-row",
    surface: "Cultivated straight row crops",
    flow: "overland",
    kFtPerS: 8.762,
    manning: { n: 0.058, hydraulicRadiusFt: R02 },
    printedSi: { k: 2.671, slopeUnit: "m/m" },
  }),
  neh({
    id: "neh-short-grass-pasture",
    surface: "Short-grass pasture",
    flow: "overland",
    kFtPerS: 6.962,
    manning: { n: 0.073, hydraulicRadiusFt: R02 },
    printedSi: { k: 2.122, slopeUnit: "m/m" },
  }),
  neh({
    id: "neh-min-tillage-woodland",
    surface: "Minimum tillage cultivation, contour or strip-cropped; woodlands",
    flow: "overland",
    kFtPerS: 5.032,
    manning: { n: 0.101, hydraulicRadiusFt: R02 },
    printedSi: { k: 1.534, slopeUnit: "m/m" },
  }),
  neh({
    id: "neh-forest-litter-hay-meadow",
    surface: "Forest with heavy ground litter; hay meadows (overland flow)",
    flow: "overland",
    kFtPerS: 2.516,
    manning: { n: 0.202, hydraulicRadiusFt: R02 },
    printedSi: { k: 0.767, slopeUnit: "m/m" },
  }),
] as const;

const TR55_ROWS = [
  tr55({
    id: "tr55-paved",
    surface: "Paved (shallow concentrated flow)",
    flow: "shallow concentrated",
    kFtPerS: 20.3282,
    manning: { n: 0.025, hydraulicRadiusFt: R02 },
  }),
  tr55({
    id: "tr55-unpaved",
    surface: "Unpaved (shallow concentrated flow)",
    flow: "shallow concentrated",
    kFtPerS: 16.1345,
    manning: { n: 0.05, hydraulicRadiusFt: 0.4 },
  }),
] as const;

const HEC22_ROWS = [
  hec22({
    id: "hec22-forest-litter-hay-meadow",
    surface: "Forest with heavy ground litter; hay meadow (overland flow)",
    flow: "overland",
    kFtPerS: 2.5,
    printedSi: { k: 0.076, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-trash-fallow-woodland",
    surface:
      "Trash fallow or minimum tillage cultivation; contour or strip cropped; woodland " +
      "(overland flow)",
    flow: "overland",
    kFtPerS: 5,
    printedSi: { k: 0.152, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-short-grass-pasture",
    surface: "Short grass pasture (overland flow)",
    flow: "overland",
    kFtPerS: 7,
    printedSi: { k: 0.213, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-cultivated-straight-row",
    surface: "Cultivated straight row (overland flow)",
    flow: "overland",
    kFtPerS: 9,
    printedSi: { k: 0.274, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-nearly-bare-untilled",
    surface: "Nearly bare and untilled (overland flow); alluvial fans in western mountain regions",
    flow: "overland",
    kFtPerS: 10,
    printedSi: { k: 0.305, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-grassed-waterway",
    surface: "Grassed waterway (shallow concentrated flow)",
    flow: "shallow concentrated",
    kFtPerS: 15,
    printedSi: { k: 0.457, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-unpaved",
    surface: "Unpaved (shallow concentrated flow)",
    flow: "shallow concentrated",
    kFtPerS: 16.1,
    printedSi: { k: 0.491, slopeUnit: "percent" },
  }),
  hec22({
    id: "hec22-paved-upland-gullies",
    surface: "Paved area (sheet flow); small upland gullies (shallow concentrated flow)",
    flow: "shallow concentrated",
    kFtPerS: 20.3,
    printedSi: { k: 0.619, slopeUnit: "percent" },
  }),
] as const;

export const VELOCITY_K = [...NEH_ROWS, ...TR55_ROWS, ...HEC22_ROWS] as const;

export type VelocityKId = (typeof VELOCITY_K)[number]["id"];

export function velocityKRow(id: VelocityKId): VelocityKRow {
  const row = VELOCITY_K.find((r) => r.id === id);
  if (row === undefined) throw new Error(`No velocity coefficient row with id "${id}"`);
  return row;
}
