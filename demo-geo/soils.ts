/**
 * Invented soil map units of the demo site, each with a hydrologic soil group: well-drained
 * loam on the upper hillside (B), silty clay loam on the lower slopes (C) and a wet alluvial
 * unit along the valley floor with a dual group (C/D), which the Design rules resolve as drained
 * or undrained. The unit names are made up; no soil survey describes them. The polygons tile the
 * site; neighbours share their boundary vertices exactly.
 */
import type { Polygon } from "geojson";
import { SITE_SIZE_M, thalwegX, type XY } from "./site";

export interface SoilUnit {
  readonly symbol: string;
  readonly name: string;
  readonly hsg: "B" | "C" | "C/D";
  readonly ring: XY[];
}

const S = SITE_SIZE_M;
const STEP_M = 8;
const BOTTOMLAND_HALF_WIDTH_M = 28;

/** The B/C line wanders across the hillside below the woods. */
const upperEdge = (y: number) => 230 + 25 * Math.sin((2 * Math.PI * y) / 300);
const bottomWest = (y: number) => thalwegX(y) - BOTTOMLAND_HALF_WIDTH_M;
const bottomEast = (y: number) => thalwegX(y) + BOTTOMLAND_HALF_WIDTH_M;

function band(west: (y: number) => number, east: (y: number) => number): XY[] {
  const ys: number[] = [];
  for (let y = 0; y <= S; y += STEP_M) ys.push(y);
  const ring = [
    ...ys.map((y): XY => [east(y), y]),
    ...[...ys].reverse().map((y): XY => [west(y), y]),
  ];
  return [...ring, ring[0] as XY];
}

export function soilUnits(): SoilUnit[] {
  return [
    {
      symbol: "TrC",
      name: "Tallow Ridge silt loam, 5 to 12 percent slopes (invented)",
      hsg: "B",
      ring: band(() => 0, upperEdge),
    },
    {
      symbol: "BfB",
      name: "Brindle Flat silty clay loam, 2 to 8 percent slopes (invented)",
      hsg: "C",
      ring: band(upperEdge, bottomWest),
    },
    {
      symbol: "Wk",
      name: "Wicken Bottom silty clay, frequently wet (invented)",
      hsg: "C/D",
      ring: band(bottomWest, bottomEast),
    },
    {
      symbol: "BfC",
      name: "Brindle Flat silty clay loam, 4 to 10 percent slopes (invented)",
      hsg: "C",
      ring: band(bottomEast, () => S),
    },
  ];
}

export function soilPolygon(unit: SoilUnit, toLonLat: (p: XY) => [number, number]): Polygon {
  return { type: "Polygon", coordinates: [unit.ring.map(toLonLat)] };
}
