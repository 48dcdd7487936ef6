/**
 * The writers' output read back by independent readers: shpjs for the shapefile, geotiff.js for
 * the GeoTIFF, proj4 for the .prj. A file that these libraries read as written is one that GIS
 * packages read too.
 */
import { describe, expect, it } from "vitest";
import { fromArrayBuffer } from "geotiff";
import proj4 from "proj4";
import { unzipSync } from "fflate";
import { parseShp } from "shpjs";
import { codePageFromCpg } from "../readers/codepages";
import { readDbf } from "../readers/dbf";
import type { Feature, Geometry, Polygon } from "geojson";
import { geoTiffBytes, prjForEpsg, shapefileFiles, shapefileZip } from "./index";

const UTM10 = "+proj=utm +zone=10 +datum=NAD83 +units=m +no_defs";

// A square with a square hole, outer ring given counter-clockwise (GeoJSON order).
const withHole: Polygon = {
  type: "Polygon",
  coordinates: [
    [
      [500000, 4180000],
      [500100, 4180000],
      [500100, 4180100],
      [500000, 4180100],
      [500000, 4180000],
    ],
    [
      [500040, 4180040],
      [500040, 4180060],
      [500060, 4180060],
      [500060, 4180040],
      [500040, 4180040],
    ],
  ],
};

function feature(
  geometry: Geometry | null,
  properties: Record<string, unknown>,
): Feature<Geometry | null> {
  return { type: "Feature", geometry, properties };
}

describe("shapefile writer", () => {
  it("writes polygons whose rings read back with the outer ring first and the hole second", () => {
    const files = shapefileFiles({
      name: "cover",
      features: [feature(withHole, { id: 1 })],
      prjWkt: "x",
    });
    const [geometry] = parseShp(files["cover.shp"]!);
    expect(geometry?.type).toBe("Polygon");
    const rings = (geometry as Polygon).coordinates;
    expect(rings).toHaveLength(2);
    expect(new Set(rings[0]!.map(String))).toEqual(new Set(withHole.coordinates[0]!.map(String)));
    expect(new Set(rings[1]!.map(String))).toEqual(new Set(withHole.coordinates[1]!.map(String)));
  });

  it("writes non-ASCII text in windows-1252 that decodes back through the .cpg", () => {
    const names = ["Forêt claire", "Café lawn — 5 %", "Straße"];
    const files = shapefileFiles({
      name: "soil",
      features: names.map((name, k) =>
        feature({ type: "Point", coordinates: [k, k] }, { name, n: k + 0.25 }),
      ),
      prjWkt: prjForEpsg(4326)!,
      encoding: "windows-1252",
    });
    const cpg = new TextDecoder().decode(files["soil.cpg"]);
    expect(cpg).toBe("1252");
    // "ê" is one byte (0xEA) in windows-1252, two in UTF-8.
    expect([...files["soil.dbf"]!].includes(0xea)).toBe(true);
    const { rows } = readDbf(files["soil.dbf"]!, codePageFromCpg(cpg)!, "soil.dbf");
    expect(rows.map((r) => r.name)).toEqual(names);
    expect(rows.map((r) => r.n)).toEqual([0.25, 1.25, 2.25]);
  });

  it("writes a feature without geometry as a null shape in its place", () => {
    const files = shapefileFiles({
      name: "lines",
      features: [
        feature(
          {
            type: "LineString",
            coordinates: [
              [0, 0],
              [1, 1],
            ],
          },
          { a: "x" },
        ),
        feature(null, { a: "y" }),
      ],
      prjWkt: prjForEpsg(4326)!,
    });
    const shapes = parseShp(files["lines.shp"]!).map((g) => g && { ...g, bbox: undefined });
    expect(shapes).toEqual([
      {
        type: "LineString",
        coordinates: [
          [0, 0],
          [1, 1],
        ],
      },
      null,
    ]);
  });

  it("zips the five member files under one base name", () => {
    const zip = shapefileZip({
      name: "cover map",
      features: [feature(withHole, {})],
      prjWkt: prjForEpsg(26910)!,
    });
    expect(Object.keys(unzipSync(zip)).sort()).toEqual([
      "cover_map.cpg",
      "cover_map.dbf",
      "cover_map.prj",
      "cover_map.shp",
      "cover_map.shx",
    ]);
  });

  it("writes a UTM .prj that proj4 reads as the same projection as its proj4 definition", () => {
    // Tolerance 1 mm: two definitions of one projection through the same library.
    const fromPrj = proj4(prjForEpsg(26910)!, "EPSG:4326", [512345, 4181234]);
    const fromDef = proj4(UTM10, "EPSG:4326", [512345, 4181234]);
    expect(fromPrj[0]).toBeCloseTo(fromDef[0]!, 8);
    expect(fromPrj[1]).toBeCloseTo(fromDef[1]!, 8);
  });
});

describe("GeoTIFF writer", () => {
  const spec = {
    width: 40,
    height: 30,
    tileSize: 16,
    nodata: -9999,
    georeference: { epsg: 26910, originX: 500000, originY: 4181000, pixelSizeX: 2, pixelSizeY: 2 },
    values: (col: number, row: number) =>
      col === 3 && row === 4 ? -9999 : 100 + col * 0.5 - row * 0.25,
  };

  it("writes tiles, georeferencing and nodata that geotiff.js reads back", async () => {
    const bytes = geoTiffBytes(spec);
    const image = await (await fromArrayBuffer(bytes.buffer as ArrayBuffer)).getImage();
    expect([image.getWidth(), image.getHeight()]).toEqual([40, 30]);
    expect([image.getTileWidth(), image.getTileHeight(), image.isTiled]).toEqual([16, 16, true]);
    expect(image.getOrigin()).toEqual([500000, 4181000, 0]);
    expect(image.getResolution()).toEqual([2, -2, 0]);
    expect(image.getGDALNoData()).toBe(-9999);
    expect(image.getGeoKeys()).toMatchObject({
      GTModelTypeGeoKey: 1,
      GTRasterTypeGeoKey: 1,
      ProjectedCSTypeGeoKey: 26910,
    });
  });

  it("writes every cell, edge tiles included, at its column and row", async () => {
    const bytes = geoTiffBytes(spec);
    const image = await (await fromArrayBuffer(bytes.buffer as ArrayBuffer)).getImage();
    const [band] = (await image.readRasters()) as unknown as Float32Array[];
    for (let row = 0; row < 30; row += 1) {
      for (let col = 0; col < 40; col += 1) {
        expect(band![row * 40 + col]).toBe(Math.fround(spec.values(col, row)));
      }
    }
  });

  it("writes a geographic CRS as GeographicTypeGeoKey", async () => {
    const bytes = geoTiffBytes({
      ...spec,
      georeference: {
        epsg: 4326,
        originX: -122.5,
        originY: 37.8,
        pixelSizeX: 1e-4,
        pixelSizeY: 1e-4,
      },
    });
    const image = await (await fromArrayBuffer(bytes.buffer as ArrayBuffer)).getImage();
    expect(image.getGeoKeys()).toMatchObject({ GTModelTypeGeoKey: 2, GeographicTypeGeoKey: 4326 });
  });

  it("writes no GeoKeys and no tie point when asked for a plain TIFF", async () => {
    const bytes = geoTiffBytes({ ...spec, georeference: null });
    const image = await (await fromArrayBuffer(bytes.buffer as ArrayBuffer)).getImage();
    expect(image.getGeoKeys()).toBeNull();
    expect(image.fileDirectory.getValue("ModelTiepoint")).toBeUndefined();
  });
});
