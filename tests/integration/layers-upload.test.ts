import { and, asc, eq, sql } from "drizzle-orm";
import proj4 from "proj4";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { layerFeatures } from "../../server/db/schema-geodata";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import {
  coverShapefileZip,
  FileKit,
  GPX_TEXT,
  KML_TEXT,
  BOWTIE,
  SELF_TOUCHING,
  SOIL_GEOJSON,
  geojsonText,
  terrainTiff,
  UTM_COVER,
  UTM10N,
} from "../support/layer-files";
import { leftovers, NOTHING, uploadLayer } from "../support/layers";
import { freshProject } from "../support/route-table";
import { zipSync, strToU8 } from "fflate";

let t: TestApp;
let gis: Agent;
let teamId: string;
const kit = new FileKit();

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "layers-up");
  teamId = team.id;
  gis = t.agent();
  await signIn(gis, team.members.gis);
});
afterAll(async () => {
  await t.close();
  kit.close();
});

async function featuresOf(layerId: string) {
  return t.db
    .select({
      index: layerFeatures.featureIndex,
      attributes: layerFeatures.attributes,
      geometry: sql<{
        type: string;
        coordinates: number[][][];
      }>`ST_AsGeoJSON(${layerFeatures.geom})::json`,
    })
    .from(layerFeatures)
    .where(and(eq(layerFeatures.layerId, layerId)))
    .orderBy(asc(layerFeatures.featureIndex));
}

describe("uploading each format", () => {
  it("reprojects a zipped shapefile in UTM 10N to WGS84 (checked against proj4)", async () => {
    const projectId = await freshProject(t.db, teamId);
    const file = kit.write("cover.zip", coverShapefileZip());
    const res = await uploadLayer(gis, projectId, { kind: "cover", file });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ status: "ready", format: "shapefile", featureCount: 3 });
    expect(res.body.fields).toEqual(expect.arrayContaining(["LANDUSE", "ID"]));
    const rows = await featuresOf(res.body.id);
    expect(rows.map((r) => (r.attributes as { LANDUSE: string }).LANDUSE)).toEqual([
      "WOODS",
      "Asphalt",
      "WOODS",
    ]);
    // Reference: proj4 on the source UTM coordinates. Tolerance 1e-7° (about 1 cm): the
    // database keeps the reader's doubles; only rounding separates the two.
    for (const [i, row] of rows.entries()) {
      const source = UTM_COVER[i]?.geometry.coordinates[0] ?? [];
      const stored = row.geometry.coordinates[0] ?? [];
      expect(stored).toHaveLength(source.length);
      for (const [k, xy] of source.entries()) {
        const [lon, lat] = proj4(UTM10N, "WGS84", xy as [number, number]);
        expect(stored[k]?.[0]).toBeCloseTo(lon, 7);
        expect(stored[k]?.[1]).toBeCloseTo(lat, 7);
      }
    }
    expect(await t.store.exists(`projects/${projectId}/layers/${res.body.id}/original.zip`)).toBe(
      true,
    );
  });

  it("reads KML placemarks with their data fields", async () => {
    const projectId = await freshProject(t.db, teamId);
    const res = await uploadLayer(gis, projectId, {
      kind: "cover",
      file: kit.write("site.kml", KML_TEXT),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ format: "kml", featureCount: 2 });
    const rows = await featuresOf(res.body.id);
    expect(rows[0]?.attributes).toMatchObject({ name: "North lot", COVER: "pavement" });
    expect(rows[0]?.geometry.coordinates[0]?.[0]).toEqual([-122.4, 37.7]);
  });

  it("reads a KMZ (zipped KML)", async () => {
    const projectId = await freshProject(t.db, teamId);
    const file = kit.write("site.kmz", zipSync({ "doc.kml": strToU8(KML_TEXT) }));
    const res = await uploadLayer(gis, projectId, { kind: "boundary", file });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ format: "kmz", featureCount: 2 });
  });

  it("reads a GPX track as a channel line", async () => {
    const projectId = await freshProject(t.db, teamId);
    const res = await uploadLayer(gis, projectId, {
      kind: "channel",
      file: kit.write("swale.gpx", GPX_TEXT),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ format: "gpx", featureCount: 1 });
    const [row] = await featuresOf(res.body.id);
    expect(row?.geometry.type).toBe("LineString");
    expect(row?.geometry.coordinates).toEqual([
      [-122.4, 37.7],
      [-122.3995, 37.7005],
      [-122.399, 37.701],
    ]);
  });

  it("reads a GeoJSON soil layer with its attributes", async () => {
    const projectId = await freshProject(t.db, teamId);
    const res = await uploadLayer(gis, projectId, {
      kind: "soil",
      file: kit.write("soils.geojson", SOIL_GEOJSON),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ format: "geojson", featureCount: 4, fields: ["HYDGRP"] });
    expect(res.body.bbox4326[0]).toBeCloseTo(-122.4, 9);
    expect(res.body.bbox4326[2]).toBeCloseTo(-122.396, 9);
  });

  it("keeps a GeoTIFF terrain in storage and describes it, with no features", async () => {
    const projectId = await freshProject(t.db, teamId);
    const file = await terrainTiff(kit, "dem.tif");
    const res = await uploadLayer(gis, projectId, { kind: "terrain", file, verticalUnit: "ft" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ format: "geotiff", featureCount: 0, status: "ready" });
    expect(res.body.terrain).toMatchObject({ width: 40, height: 30, verticalUnit: "ft" });
    // The bbox corners, from proj4 on the raster's UTM corners (tolerance 1e-6°, ~10 cm).
    const [west] = proj4(UTM10N, "WGS84", [500_000, 4_100_000]);
    expect(res.body.bbox4326[0]).toBeCloseTo(west, 6);
    const left = await leftovers(t, projectId);
    expect(left).toMatchObject({ layers: 1, features: 0, objects: 1, jobs: 0 });
    const local = await t.store.localCopy(
      `projects/${projectId}/layers/${res.body.id}/original.tif`,
    );
    expect(local).toMatch(/\.tif$/);
  });
});

describe("repairs", () => {
  it("repairs a ring that touches itself, keeps its area and notes the feature", async () => {
    const projectId = await freshProject(t.db, teamId);
    const text = geojsonText([{ geometry: SELF_TOUCHING, properties: { C: "lawn" } }]);
    const res = await uploadLayer(gis, projectId, {
      kind: "cover",
      file: kit.write("touching.geojson", text),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.notes).toContainEqual({
      where: "feature 1",
      message: expect.stringMatching(/repaired an invalid polygon \(Ring Self-intersection/),
    });
    const [row] = await t.db
      .select({
        valid: sql<boolean>`ST_IsValid(${layerFeatures.geom})`,
        area: sql<number>`ST_Area(${layerFeatures.geom})`,
      })
      .from(layerFeatures)
      .where(eq(layerFeatures.layerId, res.body.id));
    expect(row?.valid).toBe(true);
    // 10 × 10 square less the 4 × 5 / 2 triangle cut back in, in (1/1000 degree)².
    expect(row?.area).toBeCloseTo(90e-6, 12);
  });
});

describe("progress and waiting", () => {
  it("answers 202 while a slow job runs, and the long poll tells when it is ready", async () => {
    const slow = await startTestApp({ uploads: { ...t.config.uploads, waitMs: 0 } });
    try {
      const team = await createTeam(slow.db, "layers-202");
      const agent = slow.agent();
      await signIn(agent, team.members.owner);
      const projectId = await freshProject(slow.db, team.id);
      const res = await uploadLayer(agent, projectId, {
        kind: "soil",
        file: kit.write("soils-202.geojson", SOIL_GEOJSON),
      });
      expect(res.status, JSON.stringify(res.body)).toBe(202);
      expect(res.headers.location).toBe(`/api/layers/${res.body.id}`);
      expect(res.body.progress).toMatchObject({ bytesReceived: res.body.sizeBytes });
      const done = await agent.get(`/api/layers/${res.body.id}?waitMs=20000`);
      expect(done.status).toBe(200);
      expect(done.body, JSON.stringify(done.body)).toMatchObject({
        status: "ready",
        featureCount: 4,
      });
      expect(done.body.progress).toMatchObject({ stage: "done", featuresDone: 4 });
    } finally {
      await slow.close();
    }
  });

  it("keeps a layer that fails after the answer as failed, with the error and nothing else", async () => {
    const slow = await startTestApp({ uploads: { ...t.config.uploads, waitMs: 0 } });
    try {
      const team = await createTeam(slow.db, "layers-late");
      const agent = slow.agent();
      await signIn(agent, team.members.gis);
      const projectId = await freshProject(slow.db, team.id);
      const text = geojsonText([{ geometry: BOWTIE, properties: { C: "x" } }]);
      const res = await uploadLayer(agent, projectId, {
        kind: "cover",
        file: kit.write("late-bowtie.geojson", text),
      });
      expect(res.status, JSON.stringify(res.body)).toBe(202);
      const done = await agent.get(`/api/layers/${res.body.id}?waitMs=20000`);
      expect(done.body, JSON.stringify(done.body)).toMatchObject({
        status: "failed",
        error: { status: 422, code: "invalid-polygon", where: "feature 1" },
      });
      expect(await leftovers(slow, projectId)).toEqual({
        layers: 1,
        features: 0,
        objects: 0,
        jobs: 0,
      });
      expect((await agent.delete(`/api/layers/${res.body.id}`)).status).toBe(204);
      expect(await leftovers(slow, projectId)).toEqual(NOTHING);
    } finally {
      await slow.close();
    }
  });
});
