// GeoJSON (RFC 7946): collections, single features, bare geometries and the refusals.
import { describe, expect, it } from "vitest";
import { SOILS } from "../../../tests/fixtures/geo/scenario";
import { readVectorFile } from "./index";
import { fixture, readErrorOf, tempDir, writeTemp } from "./test-support";

const readText = (text: string, name = "t.geojson") =>
  readVectorFile(writeTemp(tempDir(), name, text), "geojson", name);

describe("GeoJSON reader", () => {
  it("reads a FeatureCollection in order with its attributes", async () => {
    const result = await readVectorFile(fixture("soils.geojson"), "geojson", "soils.geojson");
    expect(result.features.map((f) => f.properties)).toEqual(SOILS.map((f) => f.properties));
    expect(result.fields).toEqual(["HSG", "NAME"]);
  });

  it("reads a bare geometry as one feature without attributes", async () => {
    const result = await readText('{"type":"LineString","coordinates":[[0,0],[1,1]]}');
    expect(result.features).toEqual([
      {
        type: "Feature",
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 0],
            [1, 1],
          ],
        },
        properties: {},
      },
    ]);
  });

  it("refuses a null geometry, naming the feature", async () => {
    const error = await readErrorOf(() =>
      readVectorFile(fixture("empty-geometry.geojson"), "geojson", "soils.geojson"),
    );
    expect(error.message).toBe("soils.geojson, feature 2: has no geometry (empty)");
  });

  it("refuses a legacy crs member that is not WGS84", async () => {
    const text =
      '{"type":"FeatureCollection","crs":{"type":"name","properties":{"name":"urn:ogc:def:crs:EPSG::26910"}},"features":[]}';
    const error = await readErrorOf(() => readText(text));
    expect(error.code).toBe("geojson-crs");
    expect(error.message).toContain('"urn:ogc:def:crs:EPSG::26910"');
  });

  it("refuses coordinates beyond longitude 180, naming the feature", async () => {
    const error = await readErrorOf(() =>
      readText('{"type":"Point","coordinates":[512345,4181234]}'),
    );
    expect(error.message).toBe(
      "t.geojson, feature 1: coordinate (512345, 4181234) is outside WGS84 longitude/latitude — is the file really in WGS84?",
    );
  });

  it("refuses a NaN or missing coordinate", async () => {
    const error = await readErrorOf(() => readText('{"type":"Point","coordinates":[1]}'));
    expect(error.code).toBe("bad-coordinate");
  });

  it("refuses text that is not JSON", async () => {
    const error = await readErrorOf(() => readText('{"type": '));
    expect(error.message).toMatch(/^t\.geojson: is not valid JSON/);
  });

  it("refuses a geometry of an unknown type, naming the feature", async () => {
    const text =
      '{"type":"FeatureCollection","features":[{"type":"Feature","properties":{},"geometry":{"type":"Circle","coordinates":[0,0]}}]}';
    const error = await readErrorOf(() => readText(text));
    expect([error.code, error.where]).toEqual(["bad-geometry", "t.geojson, feature 1"]);
  });

  it("lets a bow-tie polygon through unrepaired (validity is judged in PostGIS)", async () => {
    const result = await readVectorFile(fixture("bowtie.geojson"), "geojson", "bowtie.geojson");
    expect(result.features).toHaveLength(1);
  });

  it("reports progress every 1,000 features and at the end", async () => {
    const point =
      '{"type":"Feature","properties":{},"geometry":{"type":"Point","coordinates":[1,2]}}';
    const text = `{"type":"FeatureCollection","features":[${Array(2500).fill(point).join(",")}]}`;
    const calls: Array<[number, number]> = [];
    const path = writeTemp(tempDir(), "many.geojson", text);
    await readVectorFile(path, "geojson", "many.geojson", (done, total) =>
      calls.push([done, total]),
    );
    expect(calls).toEqual([
      [1000, 2500],
      [2000, 2500],
      [2500, 2500],
    ]);
  });
});
