// Format detection: bytes first, checked against the name.
import { describe, expect, it } from "vitest";
import { detectFormat } from "./detect";
import { copyAs, fixture, readErrorOf, tempDir, writeTemp } from "./test-support";

describe("detectFormat", () => {
  it.each([
    ["cover-utm10.zip", "cover.zip", "shapefile"],
    ["path.kmz", "path.kmz", "kmz"],
    ["path.kml", "path.kml", "kml"],
    ["track.gpx", "track.gpx", "gpx"],
    ["soils.geojson", "soils.json", "geojson"],
    ["plane-utm10.tif", "dem.TIF", "geotiff"],
    ["rainfall.csv", "idf.csv", "csv"],
  ])("reads %s named %s as %s", async (source, name, format) => {
    expect(await detectFormat(fixture(source), name)).toBe(format);
  });

  it("refuses a file whose name and bytes disagree, naming both (415)", async () => {
    const path = copyAs(tempDir(), "path.kml", "soils.geojson");
    const error = await readErrorOf(() => detectFormat(path, "soils.geojson"));
    expect([error.status, error.message]).toEqual([
      415,
      "soils.geojson: is named as GeoJSON (.geojson) but its contents are KML",
    ]);
  });

  it("refuses a bare .shp and says how to upload a shapefile", async () => {
    const error = await readErrorOf(() => detectFormat(fixture("cover-utm10.zip"), "cover.shp"));
    expect(error.message).toBe(
      "cover.shp: a shapefile must be uploaded as a .zip holding its .shp, .dbf, .shx and .prj",
    );
  });

  it("refuses a zip with neither a .shp nor a .kml inside", async () => {
    const path = copyAs(tempDir(), "path.kmz", "x.zip");
    // path.kmz holds doc.kml: named .zip it reads as KMZ, which the name does not allow.
    const error = await readErrorOf(() => detectFormat(path, "x.zip"));
    expect(error.message).toBe(
      "x.zip: is named as a zipped shapefile (.zip) but its contents are KMZ",
    );
  });

  it("refuses binary bytes under a .csv name", async () => {
    const path = writeTemp(tempDir(), "x.csv", new Uint8Array([1, 0, 2, 0]));
    const error = await readErrorOf(() => detectFormat(path, "x.csv"));
    expect(error.message).toBe("x.csv: its contents are not a CSV table");
  });

  it("refuses XML that is neither KML nor GPX", async () => {
    const path = writeTemp(tempDir(), "x.kml", '<?xml version="1.0"?><svg></svg>');
    const error = await readErrorOf(() => detectFormat(path, "x.kml"));
    expect(error.message).toBe("x.kml: is XML with a <svg> root, neither KML nor GPX");
  });

  it("refuses an extension that is none of ours", async () => {
    const error = await readErrorOf(() => detectFormat(fixture("rainfall.csv"), "idf.xlsx"));
    expect(error.status).toBe(415);
  });
});
