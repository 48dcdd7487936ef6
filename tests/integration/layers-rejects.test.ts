import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import {
  BOWTIE,
  climbingZip,
  coverShapefileZip,
  FileKit,
  geojsonText,
  KML_TEXT,
  lonLatPolygon,
  terrainTiff,
  zipBomb,
} from "../support/layer-files";
import { leftovers, NOTHING, uploadLayer, type UploadForm } from "../support/layers";
import { freshProject } from "../support/route-table";

let t: TestApp;
let gis: Agent;
let teamId: string;
const kit = new FileKit();

beforeAll(async () => {
  // Small limits so the size test needs no large file.
  const base = await startTestApp();
  const uploads = {
    ...base.config.uploads,
    limitsBytes: { vector: 64 * 1024, terrain: 1024 * 1024, rainfall: 1024 },
  };
  await base.close();
  t = await startTestApp({ uploads });
  const team = await createTeam(t.db, "layers-bad");
  teamId = team.id;
  gis = t.agent();
  await signIn(gis, team.members.gis);
});
afterAll(async () => {
  await t.close();
  kit.close();
});

/** Uploads a bad file to a fresh project: the answer, and proof that nothing stayed. */
async function refused(form: Omit<UploadForm, "file"> & { file: string }) {
  const projectId = await freshProject(t.db, teamId);
  const res = await uploadLayer(gis, projectId, form);
  expect(await leftovers(t, projectId)).toEqual(NOTHING);
  return res;
}

const pad = (n: number) => "x".repeat(n);

describe("bad files get a 4xx naming the problem and leave nothing stored", () => {
  it("a file over the kind's size limit: 413 naming the limit", async () => {
    const big = geojsonText([
      {
        geometry: lonLatPolygon([
          [0, 0],
          [1, 0],
          [1, 1],
          [0, 0],
        ]),
        properties: { note: pad(70_000) },
      },
    ]);
    const res = await refused({ kind: "cover", file: kit.write("big.geojson", big) });
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: "file_too_large" });
    expect(res.body.error.message).toMatch(/64 KB limit for vector layers/);
  });

  it("a file that is none of the formats: 415", async () => {
    const res = await refused({ kind: "cover", file: kit.write("notes.docx", "PK-not-really") });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/notes\.docx/);
  });

  it("a CSV sent as a layer: 415 pointing to Rainfall", async () => {
    const res = await refused({
      kind: "cover",
      file: kit.write("idf.csv", "duration,10\n5,4.1\n"),
    });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/Rainfall/);
  });

  it("a GeoTIFF as a cover layer: 422 (kind and format disagree)", async () => {
    const file = await terrainTiff(kit, "as-cover.tif");
    const res = await refused({ kind: "cover", file });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("kind-format-mismatch");
  });

  it("a truncated zip: 4xx naming the file", async () => {
    const bytes = coverShapefileZip();
    const res = await refused({
      kind: "cover",
      file: kit.write("cut.zip", bytes.slice(0, bytes.length - 40)),
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/cut\.zip.*(truncated|damaged)/);
  });

  it("a zip bomb: refused before inflating", async () => {
    const res = await refused({ kind: "cover", file: kit.write("bomb.zip", zipBomb()) });
    expect([413, 422]).toContain(res.status);
    expect(res.body.error.message).toMatch(/bomb\.zip/);
  });

  it("a zip entry climbing out with ../: refused", async () => {
    const res = await refused({ kind: "cover", file: kit.write("climb.zip", climbingZip()) });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/\.\./);
  });

  it("a shapefile without its .dbf: 422 naming the missing part", async () => {
    const res = await refused({
      kind: "cover",
      file: kit.write("nodbf.zip", coverShapefileZip(".dbf")),
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/nodbf\.zip.*\.dbf/);
  });

  it("a shapefile without its .prj: 422 naming the missing part", async () => {
    const res = await refused({
      kind: "cover",
      file: kit.write("noprj.zip", coverShapefileZip(".prj")),
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/noprj\.zip.*\.prj/);
  });

  it("a self-intersecting polygon (bow-tie): 422 naming the feature and the reason", async () => {
    const text = geojsonText([
      {
        geometry: lonLatPolygon([
          [2, 2],
          [3, 2],
          [3, 3],
          [2, 3],
          [2, 2],
        ]),
        properties: { C: "a" },
      },
      { geometry: BOWTIE, properties: { C: "b" } },
    ]);
    const res = await refused({ kind: "cover", file: kit.write("bowtie.geojson", text) });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("invalid-polygon");
    expect(res.body.error.message).toMatch(/bowtie\.geojson: feature 2 .*Self-intersection/);
    expect(res.body.error.fields).toEqual({ where: "feature 2" });
  });

  it("an empty geometry: 422 naming the feature", async () => {
    const text = JSON.stringify({
      type: "FeatureCollection",
      features: [
        {
          type: "Feature",
          geometry: lonLatPolygon([
            [0, 0],
            [1, 0],
            [1, 1],
            [0, 0],
          ]),
          properties: {},
        },
        { type: "Feature", geometry: { type: "Polygon", coordinates: [] }, properties: {} },
      ],
    });
    const res = await refused({ kind: "cover", file: kit.write("empty.geojson", text) });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/empty\.geojson.*feature 2/);
  });

  it("a line in a cover layer: 422 naming the feature", async () => {
    const res = await refused({
      kind: "cover",
      file: kit.write(
        "line.gpx",
        `<?xml version="1.0"?>
<gpx version="1.1" xmlns="http://www.topografix.com/GPX/1/1"><trk><trkseg>
<trkpt lat="37.7" lon="-122.4"/><trkpt lat="37.71" lon="-122.41"/></trkseg></trk></gpx>`,
      ),
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(
      /feature 1 is a LineString; a cover layer takes polygons/,
    );
  });

  it("a GeoTIFF without georeferencing: 422", async () => {
    const file = await terrainTiff(kit, "plain.tif", false);
    const res = await refused({ kind: "terrain", file, verticalUnit: "m" });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/plain\.tif/);
  });

  it("a terrain without its vertical unit: 422", async () => {
    const file = await terrainTiff(kit, "unitless.tif");
    const res = await refused({ kind: "terrain", file });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/metres or feet/);
  });

  it("a form without a file: 422", async () => {
    const projectId = await freshProject(t.db, teamId);
    const res = await gis.post(`/api/projects/${projectId}/layers`).field("kind", "cover");
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual({ file: "Choose a file to upload." });
  });

  it("a KML cover layer is still accepted by the same small-limit app (control)", async () => {
    const projectId = await freshProject(t.db, teamId);
    const res = await uploadLayer(gis, projectId, {
      kind: "cover",
      file: kit.write("ok.kml", KML_TEXT),
    });
    expect(res.status).toBe(201);
  });
});
