/**
 * Input files for the layer upload tests, made with the project's own writers (zipped
 * shapefile, GeoTIFF) and by hand for the text formats, in a temp folder per test file.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { zipSync } from "fflate";
import type { Feature, Geometry, Polygon } from "geojson";
import { prjForEpsg, shapefileFiles, writeGeoTiff } from "../../server/geodata/writers";

export class FileKit {
  readonly dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-layer-files-"));

  write(name: string, bytes: Uint8Array | string): string {
    const file = path.join(this.dir, name);
    writeFileSync(file, bytes);
    return file;
  }

  close(): void {
    rmSync(this.dir, { recursive: true, force: true });
  }
}

/** UTM zone 10N (EPSG:32610) as proj4 writes it: the reference for expected coordinates. */
export const UTM10N = "+proj=utm +zone=10 +datum=WGS84 +units=m +no_defs";

const square = (x: number, y: number, size: number): Polygon => ({
  type: "Polygon",
  coordinates: [
    [
      [x, y],
      [x + size, y],
      [x + size, y + size],
      [x, y + size],
      [x, y],
    ],
  ],
});

/** Three cover squares (100 m) in UTM 10N with a LANDUSE attribute. */
export const UTM_COVER: Feature<Polygon, Record<string, unknown>>[] = [
  {
    type: "Feature",
    geometry: square(500_000, 4_100_000, 100),
    properties: { LANDUSE: "WOODS", ID: 1 },
  },
  {
    type: "Feature",
    geometry: square(500_100, 4_100_000, 100),
    properties: { LANDUSE: "Asphalt", ID: 2 },
  },
  {
    type: "Feature",
    geometry: square(500_200, 4_100_000, 100),
    properties: { LANDUSE: "WOODS", ID: 3 },
  },
];

function shapefileMembers(features: readonly Feature<Geometry | null, Record<string, unknown>>[]) {
  const prj = prjForEpsg(32610);
  if (!prj) throw new Error("no .prj for EPSG:32610");
  return shapefileFiles({ name: "cover", features, prjWkt: prj });
}

export function coverShapefileZip(leaveOut?: ".dbf" | ".prj"): Uint8Array {
  const members = shapefileMembers(UTM_COVER);
  if (leaveOut) delete members[`cover${leaveOut}`];
  return zipSync(members);
}

/** A polygon of lon/lat degrees near (-122.4, 37.7); `ring` closes itself. */
export function lonLatPolygon(ring: readonly (readonly [number, number])[]): Polygon {
  return {
    type: "Polygon",
    coordinates: [ring.map(([x, y]) => [-122.4 + x / 1000, 37.7 + y / 1000])],
  };
}

export function geojsonText(
  features: readonly { geometry: Geometry | null; properties: object }[],
) {
  return JSON.stringify({
    type: "FeatureCollection",
    features: features.map((f) => ({ type: "Feature", ...f })),
  });
}

export const SOIL_GEOJSON = geojsonText([
  {
    geometry: lonLatPolygon([
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 1],
      [0, 0],
    ]),
    properties: { HYDGRP: "B" },
  },
  {
    geometry: lonLatPolygon([
      [1, 0],
      [2, 0],
      [2, 1],
      [1, 1],
      [1, 0],
    ]),
    properties: { HYDGRP: "C/D" },
  },
  {
    geometry: lonLatPolygon([
      [2, 0],
      [3, 0],
      [3, 1],
      [2, 1],
      [2, 0],
    ]),
    properties: { HYDGRP: "Group A" },
  },
  {
    geometry: lonLatPolygon([
      [3, 0],
      [4, 0],
      [4, 1],
      [3, 1],
      [3, 0],
    ]),
    properties: { HYDGRP: "W" },
  },
]);

/** A bow-tie: the ring crosses itself, so which polygon was meant is a guess. */
export const BOWTIE = lonLatPolygon([
  [0, 0],
  [1, 1],
  [1, 0],
  [0, 1],
  [0, 0],
]);

/** A ring touching itself at one vertex (an inverted hole): repairable without guessing. */
export const SELF_TOUCHING = lonLatPolygon([
  [0, 0],
  [10, 0],
  [10, 10],
  [5, 10],
  [7, 5],
  [3, 5],
  [5, 10],
  [0, 10],
  [0, 0],
]);

export const KML_TEXT = `<?xml version="1.0" encoding="UTF-8"?>
<kml xmlns="http://www.opengis.net/kml/2.2"><Document>
<Placemark><name>North lot</name><ExtendedData><Data name="COVER"><value>pavement</value></Data></ExtendedData>
<Polygon><outerBoundaryIs><LinearRing><coordinates>
-122.40,37.70,0 -122.399,37.70,0 -122.399,37.701,0 -122.40,37.701,0 -122.40,37.70,0
</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>
<Placemark><name>South lawn</name><ExtendedData><Data name="COVER"><value>lawn</value></Data></ExtendedData>
<Polygon><outerBoundaryIs><LinearRing><coordinates>
-122.40,37.699,0 -122.399,37.699,0 -122.399,37.70,0 -122.40,37.70,0 -122.40,37.699,0
</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>
</Document></kml>`;

export const GPX_TEXT = `<?xml version="1.0" encoding="UTF-8"?>
<gpx version="1.1" creator="rillmark-tests" xmlns="http://www.topografix.com/GPX/1/1">
<trk><name>Swale</name><trkseg>
<trkpt lat="37.7000" lon="-122.4000"></trkpt>
<trkpt lat="37.7005" lon="-122.3995"></trkpt>
<trkpt lat="37.7010" lon="-122.3990"></trkpt>
</trkseg></trk></gpx>`;

/** A 40 × 30 GeoTIFF plane in UTM 10N, 2 m cells; `georeferenced: false` leaves out the keys. */
export async function terrainTiff(kit: FileKit, name: string, georeferenced = true) {
  const file = path.join(kit.dir, name);
  await writeGeoTiff(file, {
    width: 40,
    height: 30,
    georeference: georeferenced
      ? { epsg: 32610, originX: 500_000, originY: 4_100_060, pixelSizeX: 2, pixelSizeY: 2 }
      : null,
    nodata: -9999,
    tileSize: 16,
    values: (col, row) => 100 + 0.5 * col - 0.25 * row,
  });
  return file;
}

/** A zip whose one member inflates 40 MB of zeros from a few kilobytes (ratio ≫ 200). */
export function zipBomb(): Uint8Array {
  return zipSync({ "cover.shp": new Uint8Array(40 * 1024 * 1024) }, { level: 9 });
}

/** A shapefile whose members sit under ../, trying to climb out of any folder. */
export function climbingZip(): Uint8Array {
  const members = shapefileMembers(UTM_COVER);
  return zipSync(
    Object.fromEntries(Object.entries(members).map(([name, bytes]) => [`../${name}`, bytes])),
  );
}
