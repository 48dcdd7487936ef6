/**
 * Invented land cover of the demo site, as a county GIS might code it: a LANDUSE code and a
 * description. The polygons tile the whole site without gaps or overlaps, west to east: woods on
 * the upper hillside, a meadow, a row of house lots (roofs and gravel drives in lawn), the road,
 * a grass verge, range down to the swale, the grassed swale itself, range on the far side.
 * Coordinates are local site metres (see site.ts); the generator writes them in UTM.
 */
import { difference, featureCollection, polygon } from "@turf/turf";
import type { Polygon } from "geojson";
import { nodeRings } from "./noding";
import { SITE_SIZE_M, thalwegX, type XY } from "./site";

export interface CoverPolygon {
  readonly landuse: string;
  readonly description: string;
  readonly geometry: Polygon;
}

const S = SITE_SIZE_M;
const WOODS_EAST_X = 215;
const LOTS_WEST_X = 262;
const ROAD_WEST_X = 318;
const ROAD_EAST_X = 327;
const VERGE_EAST_X = 336;
const SWALE_HALF_WIDTH_M = 10;
const CURVE_STEP_M = 8;
/** House lots face the road; each has a house and a gravel drive out to the road. */
const LOT_CENTRES_Y = [88, 128, 168, 208, 248, 288, 328, 368, 408, 448];
const HOUSE_WEST_X = 266;
const HOUSE_EAST_X = 284;
const HOUSE_HALF_DEPTH_M = 7;
const DRIVE_HALF_WIDTH_M = 2.5;

function rect(x0: number, y0: number, x1: number, y1: number): XY[] {
  return [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
    [x0, y0],
  ];
}

/** A band between two north-south edges; each edge is x as a function of y. */
function band(west: (y: number) => number, east: (y: number) => number): XY[] {
  const ys: number[] = [];
  for (let y = 0; y <= S; y += CURVE_STEP_M) ys.push(y);
  const eastSide = ys.map((y): XY => [east(y), y]);
  const westSide = [...ys].reverse().map((y): XY => [west(y), y]);
  const ring = [...eastSide, ...westSide];
  return [...ring, ring[0] as XY];
}

const poly = (ring: XY[]): Polygon => ({ type: "Polygon", coordinates: [ring.map((p) => [...p])] });
const at = (x: number) => () => x;

function houses(): XY[][] {
  return LOT_CENTRES_Y.map((y) =>
    rect(HOUSE_WEST_X, y - HOUSE_HALF_DEPTH_M, HOUSE_EAST_X, y + HOUSE_HALF_DEPTH_M),
  );
}

function drives(): XY[][] {
  return LOT_CENTRES_Y.map((y) =>
    rect(HOUSE_EAST_X, y - DRIVE_HALF_WIDTH_M, ROAD_WEST_X, y + DRIVE_HALF_WIDTH_M),
  );
}

/** The lots' lawn: the band between the meadow and the road, less houses and drives. */
function lotLawn(): Polygon {
  let lawn = polygon([rect(LOTS_WEST_X, 0, ROAD_WEST_X, S).map((p) => [...p])]);
  for (const cut of [...houses(), ...drives()]) {
    const next = difference(featureCollection([lawn, polygon([cut.map((p) => [...p])])]));
    if (next === null || next.geometry.type !== "Polygon") {
      throw new Error("demo cover: cutting a lot out of the lawn did not leave one polygon");
    }
    lawn = polygon(next.geometry.coordinates);
  }
  return lawn.geometry;
}

/** The cover, with shared edges noded so neighbours stay gap-free after reprojection. */
export function coverPolygons(): CoverPolygon[] {
  const raw = rawCover();
  const noded = nodeRings(raw.map((c) => c.geometry.coordinates));
  return raw.map((c, k) => ({ ...c, geometry: { type: "Polygon", coordinates: noded[k] ?? [] } }));
}

function rawCover(): CoverPolygon[] {
  const swaleWest = (y: number) => thalwegX(y) - SWALE_HALF_WIDTH_M;
  const swaleEast = (y: number) => thalwegX(y) + SWALE_HALF_WIDTH_M;
  return [
    {
      landuse: "WOODS",
      description: "Oak woodland, light underbrush (invented)",
      geometry: poly(rect(0, 0, WOODS_EAST_X, S)),
    },
    {
      landuse: "RANGE",
      description: "Unmowed meadow below the woods (invented)",
      geometry: poly(rect(WOODS_EAST_X, 0, LOTS_WEST_X, S)),
    },
    { landuse: "LAWN", description: "House lots, mowed lawn (invented)", geometry: lotLawn() },
    ...houses().map((ring, k) => ({
      landuse: "ROOF",
      description: `House ${k + 1}, pitched roof (invented)`,
      geometry: poly(ring),
    })),
    ...drives().map((ring, k) => ({
      landuse: "GRAVEL",
      description: `Gravel drive to house ${k + 1} (invented)`,
      geometry: poly(ring),
    })),
    {
      landuse: "PAVED",
      description: "Terrace Road, asphalt, two lanes (invented)",
      geometry: poly(rect(ROAD_WEST_X, 0, ROAD_EAST_X, S)),
    },
    {
      landuse: "LAWN",
      description: "Grass verge east of the road (invented)",
      geometry: poly(rect(ROAD_EAST_X, 0, VERGE_EAST_X, S)),
    },
    {
      landuse: "RANGE",
      description: "Grazed range down to the swale (invented)",
      geometry: poly(band(at(VERGE_EAST_X), swaleWest)),
    },
    {
      landuse: "SWALE",
      description: "Grassed swale along the valley floor (invented)",
      geometry: poly(band(swaleWest, swaleEast)),
    },
    {
      landuse: "RANGE",
      description: "Grazed range east of the swale (invented)",
      geometry: poly(band(swaleEast, at(S))),
    },
  ];
}
