/**
 * Generates the invented demo scenario "Harrow Hill Terraces" into demo-geo/out (or the folder
 * given as the first argument): synthetic terrain (GeoTIFF, UTM), land cover (zipped shapefile,
 * UTM), soils and the channel (GeoJSON, WGS84), an invented IDF table (CSV), the subcatchment
 * with its longest flow path (KML) and scenario.json. Everything is deterministic: a re-run
 * writes identical bytes (fixed dates inside the zip and the .dbf, no randomness).
 *
 *   npm run demo:generate            # rewrite demo-geo/out
 *   npx tsx demo-geo/generate.ts DIR # write elsewhere
 */
import { mkdir, writeFile } from "node:fs/promises";
import { resolve } from "node:path";
import { fileURLToPath } from "node:url";
import type { Feature, Geometry, Position } from "geojson";
import { geoTiffBytes } from "../server/geodata/writers";
import { BASEMAP_FILE, basemapGeoJson } from "./basemap";
import { coverPolygons } from "./cover";
import { kmlDocument } from "./kml";
import { boundaryRing, channelLine, DIVIDE, flowPath, OUTLET } from "./paths";
import { idfCsv } from "./rainfall-csv";
import { OUT_FILES, scenarioDocument, SUBCATCHMENT_NAME } from "./scenario";
import { coverShapefileZip } from "./shapefile";
import {
  CELL_M,
  GRID_CELLS,
  lonLatOf,
  NODATA,
  ORIGIN_E,
  ORIGIN_N,
  SITE_SIZE_M,
  terrainCell,
  UTM_EPSG,
} from "./site";
import { soilPolygon, soilUnits } from "./soils";

export const DEFAULT_OUT_DIR = fileURLToPath(new URL("./out/", import.meta.url));

function terrainTiff(): Uint8Array {
  return geoTiffBytes({
    width: GRID_CELLS,
    height: GRID_CELLS,
    georeference: {
      epsg: UTM_EPSG,
      originX: ORIGIN_E,
      originY: ORIGIN_N + SITE_SIZE_M,
      pixelSizeX: CELL_M,
      pixelSizeY: CELL_M,
    },
    nodata: NODATA,
    tileSize: 128,
    values: terrainCell,
  });
}

/** A FeatureCollection with one feature per line: small, and a readable diff. */
function featureCollectionText(features: Feature<Geometry>[]): string {
  const lines = features.map((f) => JSON.stringify(f));
  return `{"type":"FeatureCollection","features":[\n${lines.join(",\n")}\n]}\n`;
}

function soilsGeoJson(): string {
  return featureCollectionText(
    soilUnits().map((unit) => ({
      type: "Feature",
      properties: { MUSYM: unit.symbol, MUNAME: unit.name, HSG: unit.hsg },
      geometry: soilPolygon(unit, lonLatOf),
    })),
  );
}

function channelGeoJson(): string {
  const coordinates: Position[] = channelLine().map(lonLatOf);
  return featureCollectionText([
    {
      type: "Feature",
      properties: { NAME: "Harrow Hill swale (invented)", KIND: "grassed swale" },
      geometry: { type: "LineString", coordinates },
    },
  ]);
}

function subcatchmentKml(): string {
  const about = "Invented demo data: no real site is described.";
  return kmlDocument(
    `${SUBCATCHMENT_NAME} (invented demo)`,
    "Subcatchment of the invented Harrow Hill Terraces demo: boundary, outlet and longest " +
      "flow path (divide to outlet).",
    [
      {
        name: `${SUBCATCHMENT_NAME} boundary`,
        description: about,
        data: { role: "boundary" },
        geometry: { type: "Polygon", outer: boundaryRing().map(lonLatOf) },
      },
      {
        name: `${SUBCATCHMENT_NAME} outlet`,
        description: `Design point at the swale. ${about}`,
        data: { role: "outlet" },
        geometry: { type: "Point", coordinates: lonLatOf(OUTLET) },
      },
      {
        name: `${SUBCATCHMENT_NAME} longest flow path`,
        description: `From the divide at ${DIVIDE.join(", ")} m (site grid) to the outlet. ${about}`,
        data: { role: "flow-path" },
        geometry: { type: "LineString", coordinates: flowPath().map(lonLatOf) },
      },
    ],
  );
}

/** Every output file by name, as bytes. */
export function demoFiles(): Record<string, Uint8Array> {
  const text = new TextEncoder();
  return {
    [OUT_FILES.terrain]: terrainTiff(),
    [OUT_FILES.cover]: coverShapefileZip(coverPolygons()),
    [OUT_FILES.soils]: text.encode(soilsGeoJson()),
    [OUT_FILES.channel]: text.encode(channelGeoJson()),
    [OUT_FILES.rainfall]: text.encode(idfCsv()),
    [OUT_FILES.subcatchment]: text.encode(subcatchmentKml()),
    [OUT_FILES.scenario]: text.encode(`${JSON.stringify(scenarioDocument(), null, 2)}\n`),
    [BASEMAP_FILE]: text.encode(basemapGeoJson()),
  };
}

export async function generateDemo(outDir: string = DEFAULT_OUT_DIR): Promise<string[]> {
  await mkdir(outDir, { recursive: true });
  const files = demoFiles();
  for (const [name, bytes] of Object.entries(files)) await writeFile(resolve(outDir, name), bytes);
  return Object.keys(files);
}

if (process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const outDir = process.argv[2] === undefined ? DEFAULT_OUT_DIR : resolve(process.argv[2]);
  const names = await generateDemo(outDir);
  console.log(`Invented demo scenario written to ${outDir}: ${names.join(", ")}`);
}
