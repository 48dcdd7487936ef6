/**
 * The isomorphic geodata core: the browser previews with it and the server computes with it,
 * so both give the same split, regimes and slopes.
 */
export * from "./types";
export {
  geodesicAreaM2,
  geodesicDistanceM,
  lerpLonLat,
  multiPolygonAreaM2,
  pathLengthsM,
  rankingAreaM2,
  stationOnEdgeM,
  type PathLengths,
} from "./geodesic";
export {
  buildPolygonIndex,
  winnerAt,
  type PolygonIndex,
  type PolygonIndexOptions,
} from "./polygon-index";
export { assertUsablePath, mergePieces, splitFlowPath } from "./split";
export { firstCrossingStationM, pointAtStation, stationsAlong } from "./stations";
export {
  regimeSegments,
  sheetEndStationM,
  type RegimeBreaks,
  type RegimeSegment,
  type SheetEnd,
  type SheetEndInput,
} from "./regimes";
export {
  applySurfaceOverrides,
  type SurfaceOverride,
  type SurfaceSource,
  type SurfacedPiece,
} from "./surface-overrides";
export { bilinear, sampleGrid, type ElevationGrid } from "./bilinear";
export {
  isPathReversed,
  segmentSlopes,
  withSurveyOverrides,
  type ChannelSlopeMethod,
  type ElevationAt,
  type ElevationSample,
  type ElevationSource,
  type SegmentSlope,
  type SlopeInput,
  type SlopeProblem,
  type SurveyedElevation,
} from "./slopes";
export {
  averageLandSlopePercent,
  gridOverPolygon,
  type LandSlopeGrid,
  type PolygonGrid,
} from "./land-slope";
