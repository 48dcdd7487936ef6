import type { LonLatGrid } from "./lattice";

/** What Rillmark knows of a terrain GeoTIFF after inspecting it (stored with the layer, JSON). */
export interface TerrainInfo {
  readonly epsg: number;
  readonly crsName: string;
  readonly width: number;
  readonly height: number;
  /** Map coordinates (raster CRS units) of the tie point: the top-left pixel's outer corner
   * ("area") or its centre ("point"), as GTRasterTypeGeoKey says. */
  readonly originX: number;
  readonly originY: number;
  /** Cell size in raster CRS units, both positive (rows run south). */
  readonly pixelSizeX: number;
  readonly pixelSizeY: number;
  readonly rasterType: "area" | "point";
  readonly nodata: number | null;
  /** Unit of the cell values, chosen at upload; samples are returned in metres. */
  readonly verticalUnit: "m" | "ft";
  /** [west, south, east, north] in EPSG:4326. */
  readonly bbox4326: readonly [number, number, number, number];
  /** Tile (or strip) size the file is stored in; reads are aligned to it. */
  readonly blockWidth: number;
  readonly blockHeight: number;
  readonly tiled: boolean;
}

export interface TerrainSampler {
  /** Bilinear elevations in metres at WGS84 points; null outside the raster or at nodata. */
  elevationsM(points: readonly (readonly [number, number])[]): Promise<(number | null)[]>;
  /**
   * The same elevations at every point of a regular grid (a map tile's pixel centres), row-major
   * from the north-west, NaN where there is none; positions within 1/1000 cell of the exact
   * ones (lattice.ts).
   */
  elevationsOnGridM(grid: LonLatGrid): Promise<Float64Array>;
  close(): Promise<void>;
}
