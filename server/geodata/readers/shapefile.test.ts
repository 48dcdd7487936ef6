// Zipped shapefiles: reprojection from the .prj, code pages from the .cpg, and each refusal.
import { describe, expect, it } from "vitest";
import { zipSync } from "fflate";
import type { Polygon } from "geojson";
import { COVER, SOILS } from "../../../tests/fixtures/geo/scenario";
import { shapefileFiles } from "../writers";
import { readVectorFile } from "./index";
import { fixture, readErrorOf, tempDir, writeTemp } from "./test-support";

const read = (name: string, as = name) => readVectorFile(fixture(name), "shapefile", as);

describe("zipped shapefile reader", () => {
  it("reads a NAD83 / UTM 10N layer back to the WGS84 coordinates it was made from", async () => {
    const result = await read("cover-utm10.zip", "cover.zip");
    expect(result.features).toHaveLength(COVER.length);
    expect(result.sourceCrs).toBe("NAD_1983_UTM_Zone_10N");
    result.features.forEach((f, k) => {
      const want = COVER[k]!.geometry.coordinates;
      const got = (f.geometry as Polygon).coordinates;
      expect(got).toHaveLength(want.length);
      // 1e-9° ≈ 0.1 mm: a UTM round trip through proj4 is exact far below that.
      got.forEach((ring, r) => {
        const wantSet = want[r]!.map(([x, y]) => [x!, y!] as const);
        for (const [lon, lat] of ring) {
          const near = wantSet.some(
            ([x, y]) => Math.abs(x - lon!) < 1e-9 && Math.abs(y - lat!) < 1e-9,
          );
          expect(near).toBe(true);
        }
      });
    });
  });

  it("keeps the attributes and their field order", async () => {
    const result = await read("cover-utm10.zip");
    expect(result.fields).toEqual(["CODE", "NAME"]);
    expect(result.features.map((f) => f.properties)).toEqual(COVER.map((f) => f.properties));
  });

  it("notes the reprojection for the layer's notes", async () => {
    const result = await read("cover-utm10.zip", "cover.zip");
    expect(result.notes[0]).toEqual({
      where: "cover.zip",
      message: "reprojected from NAD_1983_UTM_Zone_10N to WGS84",
    });
  });

  it("decodes windows-1252 text named by the .cpg (€, „ “ and — included)", async () => {
    const result = await read("soils-1252.zip");
    expect(result.features.map((f) => f.properties.NAME)).toEqual(
      SOILS.map((f) => f.properties.NAME),
    );
  });

  it("orients polygon rings by RFC 7946: outer counter-clockwise, holes clockwise", async () => {
    const [woods] = (await read("cover-utm10.zip")).features;
    const area2 = (ring: number[][]) =>
      ring.slice(1).reduce((sum, p, k) => sum + ring[k]![0]! * p[1]! - p[0]! * ring[k]![1]!, 0);
    const [outer, hole] = (woods!.geometry as Polygon).coordinates;
    expect(area2(outer!)).toBeGreaterThan(0);
    expect(area2(hole!)).toBeLessThan(0);
  });

  it("refuses a shapefile without its .dbf, naming what is missing", async () => {
    const error = await readErrorOf(() => read("no-dbf.zip", "cover.zip"));
    expect([error.status, error.code]).toEqual([422, "missing-dbf"]);
    expect(error.message).toBe(
      "cover.zip: the shapefile cover.shp has no .dbf (the attribute table)",
    );
  });

  it("refuses a shapefile without its .prj", async () => {
    const error = await readErrorOf(() => read("no-prj.zip", "cover.zip"));
    expect(error.message).toBe(
      "cover.zip: the shapefile cover.shp has no .prj (the coordinate system)",
    );
  });

  it("refuses UTM metres under a WGS84 .prj, naming the feature and the coordinate", async () => {
    const error = await readErrorOf(() => read("wrong-prj.zip", "cover.zip"));
    expect([error.status, error.code]).toEqual([422, "outside-wgs84"]);
    expect(error.message).toMatch(
      /^cover\.zip, feature 1: coordinate \(569855\.\d+, 4250500\.\d+\) is outside WGS84/,
    );
  });

  it("refuses a feature with a null shape, naming it", async () => {
    const error = await readErrorOf(() => read("empty-geometry.zip", "soils.zip"));
    expect([error.code, error.message]).toEqual([
      "empty-geometry",
      "soils.zip, feature 2: has no geometry (empty)",
    ]);
  });

  it("refuses a zip holding two shapefiles, naming both", async () => {
    const one = shapefileFiles({ name: "a", features: [SOILS[0]!], prjWkt: 'GEOGCS["x"]' });
    const two = shapefileFiles({ name: "b", features: [SOILS[1]!], prjWkt: 'GEOGCS["x"]' });
    const path = writeTemp(tempDir(), "two.zip", zipSync({ ...one, ...two }));
    const error = await readErrorOf(() => readVectorFile(path, "shapefile", "two.zip"));
    expect(error.message).toBe("two.zip: holds 2 shapefiles (a.shp, b.shp); upload one per zip");
  });

  it("refuses a .prj that proj4 cannot read instead of guessing", async () => {
    const files = shapefileFiles({
      name: "a",
      features: [SOILS[0]!],
      prjWkt: 'LOCAL_CS["site grid"]',
    });
    const path = writeTemp(tempDir(), "local.zip", zipSync(files));
    const error = await readErrorOf(() => readVectorFile(path, "shapefile", "local.zip"));
    expect(error.code).toBe("bad-prj");
  });

  it("lets a self-intersecting polygon through unrepaired (validity is judged in PostGIS)", async () => {
    const result = await read("bowtie-utm10.zip");
    expect((result.features[0]!.geometry as Polygon).coordinates[0]).toHaveLength(5);
  });
});
