// KML, KMZ and GPX: placemarks, tracks and the refusals.
import { describe, expect, it } from "vitest";
import { zipSync } from "fflate";
import type { LineString } from "geojson";
import { PATH } from "../../../tests/fixtures/geo/scenario";
import { readVectorFile } from "./index";
import { fixture, readErrorOf, tempDir, writeTemp } from "./test-support";

describe("KML and KMZ readers", () => {
  it("reads each placemark with a geometry as a feature, heights dropped", async () => {
    const result = await readVectorFile(fixture("path.kml"), "kml", "path.kml");
    expect(result.features.map((f) => f.geometry.type)).toEqual(["LineString", "Polygon"]);
    expect((result.features[0]!.geometry as LineString).coordinates).toEqual(
      PATH.geometry.coordinates,
    );
    expect(result.features[0]!.properties).toMatchObject({
      name: "Invented path A",
      description: "divide to outlet",
    });
  });

  it("reads doc.kml inside a KMZ the same way", async () => {
    const kmz = await readVectorFile(fixture("path.kmz"), "kmz", "path.kmz");
    const kml = await readVectorFile(fixture("path.kml"), "kml", "path.kml");
    expect(kmz.features).toEqual(kml.features);
    expect(kmz.format).toBe("kmz");
  });

  it("refuses a KMZ holding no .kml", async () => {
    const path = writeTemp(tempDir(), "x.kmz", zipSync({ "image.png": new Uint8Array(4) }));
    const error = await readErrorOf(() => readVectorFile(path, "kmz", "x.kmz"));
    expect(error.message).toBe("x.kmz: holds no .kml document");
  });

  it("refuses malformed XML with the parser's reason", async () => {
    const path = writeTemp(tempDir(), "bad.kml", "<kml><Placemark><name>a</name></kml>");
    const error = await readErrorOf(() => readVectorFile(path, "kml", "bad.kml"));
    expect([error.status, error.code]).toEqual([422, "bad-xml"]);
    expect(error.message).toContain("bad.kml: is not well-formed XML");
  });

  it("turns a MultiGeometry of polygons and a label point into a MultiPolygon, noting the point", async () => {
    const ring = "0,0 1,0 1,1 0,1 0,0";
    const poly = `<Polygon><outerBoundaryIs><LinearRing><coordinates>${ring}</coordinates></LinearRing></outerBoundaryIs></Polygon>`;
    const kml = `<kml><Placemark><MultiGeometry>${poly}${poly}<Point><coordinates>0.5,0.5</coordinates></Point></MultiGeometry></Placemark></kml>`;
    const result = await readVectorFile(writeTemp(tempDir(), "m.kml", kml), "kml", "m.kml");
    expect(result.features[0]!.geometry.type).toBe("MultiPolygon");
    expect(result.notes[0]?.where).toBe("m.kml, feature 1");
  });

  it("closes an unclosed ring and says so", async () => {
    const kml =
      "<kml><Placemark><Polygon><outerBoundaryIs><LinearRing><coordinates>0,0 1,0 1,1 0,1</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark></kml>";
    const result = await readVectorFile(writeTemp(tempDir(), "open.kml", kml), "kml", "open.kml");
    expect(result.notes).toEqual([
      { where: "open.kml, feature 1", message: "closed 1 unclosed ring" },
    ]);
  });
});

describe("GPX reader", () => {
  it("reads a track as a line with its name, without per-point times", async () => {
    const result = await readVectorFile(fixture("track.gpx"), "gpx", "track.gpx");
    expect(result.features).toHaveLength(1);
    expect((result.features[0]!.geometry as LineString).coordinates).toEqual(
      PATH.geometry.coordinates,
    );
    expect(result.features[0]!.properties).toEqual({ name: "Walked path" });
  });

  it("refuses a file whose root is not <gpx>", async () => {
    const error = await readErrorOf(() => readVectorFile(fixture("path.kml"), "gpx", "path.gpx"));
    expect(error.message).toBe("path.gpx: the XML root is <kml>, not <gpx>");
  });
});
