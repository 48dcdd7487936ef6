/**
 * The comparisons with GRASS GIS shared by the reference tests and the bench: a synthetic
 * terrain of valleys, outlets spread over its basins, clicks along the demo's swale, and each
 * basin's area and longest path by Rillmark and by GRASS (grass.ts) side by side.
 */
import { readFileSync } from "node:fs";
import { tempDir, writeTemp } from "../../server/geodata/readers/test-support";
import { geoTiffBytes } from "../../server/geodata/writers";
import { delineate } from "../../server/terrain-flow/delineate";
import { gridProjection } from "../../server/terrain-flow/georef";
import { readElevationGrid } from "../../server/terrain-flow/read-terrain";
import { conditionAndRoute } from "../../server/terrain-flow/route";
import type { RoutedGrid } from "../../server/terrain-flow/types";
import { valleysElevation } from "../../server/terrain-flow/test-grids";
import { snapOutlet, upstreamCells } from "../../server/terrain-flow/upstream";
import { grassReference } from "./grass";

export const DEMO_TERRAIN = new URL("../../demo-geo/out/terrain.tif", import.meta.url).pathname;
const CHANNEL = new URL("../../demo-geo/out/channel.geojson", import.meta.url).pathname;

/** test-grids.ts's valleys as a 300 × 300 GeoTIFF of 5 m cells in UTM 14N. */
export function valleysTif(): string {
  const [w, h, cell] = [300, 300, 5];
  const bytes = geoTiffBytes({
    width: w,
    height: h,
    georeference: {
      epsg: 32614,
      originX: 499_250,
      originY: 4_200_000,
      pixelSizeX: cell,
      pixelSizeY: cell,
    },
    values: (c, r) => valleysElevation(c * cell, (h - 1 - r) * cell),
  });
  return writeTemp(tempDir(), "valleys.tif", bytes);
}

/**
 * Up to `count` outlets, spread over the range of accumulation above 100 cells, whose basins
 * (after the 3-cell snap) have less than 1 % of their cells on the grid's two outer rings.
 * The edge is a convention, not a measurement: GRASS drains every edge cell out of the region,
 * Rillmark continues the ground past the edge and drains a cell out only where it falls that way
 * (directions.ts); basins along the edge differ by that choice, not by an error of either.
 */
export function outletCells(routed: RoutedGrid, count: number): number[] {
  const { width, height, acc } = routed;
  const candidates: number[] = [];
  for (let r = 5; r < height - 5; r += 1) {
    for (let c = 5; c < width - 5; c += 1) {
      if (acc[r * width + c]! > 100) candidates.push(r * width + c);
    }
  }
  candidates.sort((a, b) => acc[a]! - acc[b]!);
  const offEdge = (cell: number) => {
    const outlet = snapOutlet(routed, cell % width, Math.floor(cell / width), 3);
    let edge = 0;
    const basin = upstreamCells(routed, outlet, new Set());
    for (const c of basin) {
      const [q, r] = [c % width, Math.floor(c / width)];
      if (q < 2 || r < 2 || q >= width - 2 || r >= height - 2) edge += 1;
    }
    return edge < 0.01 * basin.length;
  };
  const picked: number[] = [];
  const stride = Math.max(1, Math.floor(candidates.length / (4 * count)));
  for (let k = 0; k < candidates.length && picked.length < count; k += stride) {
    if (offEdge(candidates[k]!)) picked.push(candidates[k]!);
  }
  return picked;
}

/** Clicks along the demo's swale (demo-geo/out/channel.geojson), every fifth vertex. */
export function swaleClicks(routed: RoutedGrid): number[] {
  const channel = JSON.parse(readFileSync(CHANNEL, "utf8")) as {
    features: { geometry: { coordinates: [number, number][] } }[];
  };
  const projection = gridProjection(routed.georef);
  return channel.features[0]!.geometry.coordinates.filter((_, k) => k % 5 === 2).map(
    ([lon, lat]) => {
      const [u, v] = projection.gridOf(lon, lat);
      return Math.floor(v) * routed.width + Math.floor(u);
    },
  );
}

export async function compareWithGrass(tif: string, clicksOf: (routed: RoutedGrid) => number[]) {
  const routed = conditionAndRoute(await readElevationGrid(tif, "m"));
  const projection = gridProjection(routed.georef);
  const cells = clicksOf(routed);
  const centre = (c: number) =>
    [(c % routed.width) + 0.5, Math.floor(c / routed.width) + 0.5] as const;
  // Both snap the click within 3 cells on their own accumulation, as the engineer's click does.
  const ours = cells.map(
    (c) => delineate(routed, [projection.lonLatAt(...centre(c))], { snapCells: 3 })[0]!,
  );
  const grass = await grassReference(
    tif,
    cells.map((c) => projection.xyAt(...centre(c))),
    3,
  );
  return ours.map((p, k) => ({
    cells: p.cells,
    area: p.cellsAreaM2 / grass.basins[k]!.areaM2 - 1,
    path: p.longestFlowPathM / grass.basins[k]!.longestPathM - 1,
  }));
}
