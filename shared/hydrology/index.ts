/**
 * Rillmark engineering core: time of concentration by every method, the rational-method peak
 * flow, IDF interpolation and fitting. Pure and isomorphic (browser and server).
 * Results are design aids: local drainage criteria and the engineer of record govern.
 */
export * from "./units";
export * from "./errors";
export * from "./warnings";
export * from "./method-ids";
export * from "./velocity";
export * from "./shallow";
export * from "./manning";
export * from "./tr55-sheet";
export * from "./nrcs-lag";
export * from "./arc";
export * from "./kinematic-wave";
export * from "./idf";
export * from "./idf-fit";
export * from "./kirpich";
export * from "./kerby";
export * from "./faa";
export * from "./rational";
export * from "./rules";
export { idfSchema, rainfallSchema, type IdfInput, type RainfallInput } from "./idf-schema";
export * from "./input-schema";
export { fieldProblems, inputError } from "./zod-errors";
export * from "./result-types";
export { compute, computeFromJson, type ComputeOptions } from "./compute";
export * from "./overland-series";
export {
  INPUT_GROUPS,
  INPUT_GROUP_LABELS,
  type InputGroup,
  type Percentiles,
  type SensitivityBar,
  type UncertaintyResult,
} from "./uncertainty/analysis";
export { BAND_DEFAULTS, BAND_SOURCES, bandsSchema } from "./uncertainty/bands";
export { formatResultText } from "./text-report";
// The published surface defaults (n, k, CN, C), each value with its source.
export * as catalog from "./catalog";
