/**
 * Types of the isomorphic geodata core (shared/geo): the flow path, the polygons it is split by,
 * and the ordered pieces that come out. Coordinates are WGS84 longitude/latitude in degrees;
 * every length and station is in metres on the WGS84 ellipsoid (names end in M). Project units
 * are applied only when results are shown or exported.
 */

/** [longitude, latitude] in degrees, WGS84. */
export type LonLat = readonly [number, number];

/** Hydrologic soil group as mapped from a soil layer, dual groups included (TR-55 chapter 2). */
export const HSG_CODES = ["A", "B", "C", "D", "A/D", "B/D", "C/D"] as const;
export type HsgCode = (typeof HSG_CODES)[number];

/** A polygon (outer ring first, then holes), each ring closed, lon/lat. */
export type PolygonRings = readonly (readonly LonLat[])[];

/** One polygon of a layer with the value the split reports for it. */
export interface ValuedPolygon<V> {
  /** The feature's id (database id or file position), carried into the pieces. */
  readonly featureId: number;
  readonly rings: PolygonRings;
  readonly value: V;
}

/** A stretch of the flow path with one cover and one soil, in path order (divide → outlet). */
export interface PathPiece {
  readonly stationFromM: number;
  readonly stationToM: number;
  readonly lengthM: number;
  /** Surface class id of the cover polygon; null where no cover polygon (or an unmapped one). */
  readonly surfaceClassId: string | null;
  readonly hsg: HsgCode | null;
  readonly coverFeatureId: number | null;
  readonly soilFeatureId: number | null;
}

export type FlowRegime = "sheet" | "shallow" | "channel";
