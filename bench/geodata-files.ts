/**
 * Large synthetic geodata files for benchmarks, written to a temp folder at bench time (never
 * committed): a shapefile of many cover polygons and a big tiled terrain GeoTIFF. The data is
 * invented. Other suites (the upload pipeline's) reuse these makers.
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import type { Feature, Polygon } from "geojson";
import { prjForEpsg, shapefileZip, writeGeoTiff } from "../server/geodata/writers";

const CLASSES = ["woods", "range", "lawn", "pavement", "roofs", "gravel"];

/**
 * `count` cover polygons on NAD83 / UTM 10N in a square grid of 20 m cells, each an irregular
 * 12-sided ring (a realistic vertex count for digitized cover), with two attributes.
 */
export function makeCoverShapefile(dir: string, count: number): string {
  const side = Math.ceil(Math.sqrt(count));
  const features: Feature<Polygon, { CLASS: string; ID: number }>[] = [];
  for (let k = 0; k < count; k += 1) {
    const cx = 560000 + (k % side) * 20 + 10;
    const cy = 4240000 + Math.floor(k / side) * 20 + 10;
    const ring = Array.from({ length: 12 }, (_, j) => {
      const angle = (j / 12) * 2 * Math.PI;
      const r = 7 + 2 * Math.sin(k + j * 1.7);
      return [cx + r * Math.cos(angle), cy + r * Math.sin(angle)];
    });
    ring.push(ring[0]!);
    features.push({
      type: "Feature",
      properties: { CLASS: CLASSES[k % CLASSES.length]!, ID: k + 1 },
      geometry: { type: "Polygon", coordinates: [ring] },
    });
  }
  const path = join(dir, `cover-${count}.zip`);
  writeFileSync(
    path,
    shapefileZip({
      name: "cover",
      features,
      prjWkt: prjForEpsg(26910)!,
      date: new Date(Date.UTC(2026, 0, 1)),
    }),
  );
  return path;
}

/** A terrain of size × size float32 cells of 2 m on NAD83 / UTM 10N, 256-cell tiles: a tilted, rippled hillside. */
export async function makeTerrain(dir: string, size: number): Promise<string> {
  const path = join(dir, `terrain-${size}.tif`);
  await writeGeoTiff(path, {
    width: size,
    height: size,
    tileSize: 256,
    nodata: -9999,
    georeference: { epsg: 26910, originX: 560000, originY: 4255000, pixelSizeX: 2, pixelSizeY: 2 },
    values: (col, row) =>
      300 - 0.02 * col - 0.03 * row + 2 * Math.sin(col / 50) * Math.cos(row / 70),
  });
  return path;
}
