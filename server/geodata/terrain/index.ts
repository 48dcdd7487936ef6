// Terrain (DEM GeoTIFF): inspect the header at upload, then sample elevations by windows.
export { inspectTerrain } from "./inspect";
export { openTerrain } from "./sampler";
export { knownCrs } from "./crs";
export type { TerrainInfo, TerrainSampler } from "./types";
export type { LonLatGrid } from "./lattice";
