/**
 * A project's vector tiles: the fixture case's cover, soil and subcatchment (tests/support/
 * geodata-case.ts, invented shapes near 122.2° W, 38.4° N) read back with @mapbox/vector-tile.
 * Cover and soil come from zoom 15 up; at z 15 the fixture (about 400 m square) spans two tiles,
 * one above the other, so the tests read both and merge features by id.
 */
import { eq } from "drizzle-orm";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { surfaceClasses } from "../../server/db/schema-geodata";
import { POLYGON_LAYERS_MIN_ZOOM } from "../../server/tiles/project-tiles";
import { COVER, SOILS } from "../fixtures/geo/scenario";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import { buildGeodataCase, COVER_CLASS_KEYS, type GeodataCase } from "../support/geodata-case";
import { binary, decodeTile, layerFeatures, tileOf } from "../support/tiles";

type At = { z: number; x: number; y: number };
let t: TestApp;
let c: GeodataCase;
const UPPER = tileOf(-122.198, 38.403, 15);
const LOWER = { ...UPPER, y: UPPER.y + 1 };
const url = (projectId: string, at: At = UPPER) =>
  `/api/projects/${projectId}/tiles/${at.z}/${at.x}/${at.y}.mvt`;

const getTile = (agent: Agent, path: string) => agent.get(path).buffer(true).parse(binary);

/** A source-layer's features over both tiles, one entry per feature (by id or featureId). */
async function features(agent: Agent, projectId: string, layer: string) {
  const byId = new Map<string, ReturnType<typeof layerFeatures>[number]>();
  for (const at of [UPPER, LOWER]) {
    const res = await getTile(agent, url(projectId, at));
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toContain("application/vnd.mapbox-vector-tile");
    for (const f of layerFeatures(decodeTile(res.body as Buffer), layer, at)) {
      byId.set(String(f.properties.featureId ?? f.properties.id), f);
    }
  }
  return [...byId.values()];
}

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "tiles-project");
});
afterAll(async () => {
  await t.close();
});

describe("project vector tiles", () => {
  it("answers an MVT with every cover polygon, its class key, name and colour", async () => {
    const cover = await features(c.engineer, c.projectId, "cover");
    expect(cover).toHaveLength(COVER.length);
    const rows = await t.db
      .select()
      .from(surfaceClasses)
      .where(eq(surfaceClasses.teamId, c.team.id));
    for (const fixture of COVER) {
      const key = COVER_CLASS_KEYS[fixture.properties.NAME];
      const cls = rows.find((r) => r.key === key);
      const hit = cover.find((f) => f.properties.classKey === key);
      expect(hit, `cover ${fixture.properties.NAME}`).toBeDefined();
      expect(hit?.properties).toMatchObject({
        layerId: c.coverLayerId,
        classId: cls?.id,
        className: cls?.name,
        colour: (cls?.values as { colour: string }).colour,
      });
      expect(hit?.properties.featureId).toBe(hit?.id);
    }
  });

  it("puts cover vertices where the fixture has them (to a tile unit, under 1e-5°)", async () => {
    // The lawn square (38.402–38.404° N) lies wholly in the upper tile.
    const res = await getTile(c.engineer, url(c.projectId, UPPER));
    const cover = layerFeatures(decodeTile(res.body as Buffer), "cover", UPPER);
    const lawn = cover.find((f) => f.properties.classKey === COVER_CLASS_KEYS.lawn);
    const fixture = COVER.find((f) => f.properties.NAME === "lawn");
    if (lawn?.geojson.geometry.type !== "Polygon" || !fixture) throw new Error("no lawn polygon");
    const got = lawn.geojson.geometry.coordinates[0] ?? [];
    for (const [lon = 0, lat = 0] of fixture.geometry.coordinates[0] ?? []) {
      const near = got.some(
        ([x = 0, y = 0]) => Math.abs(x - lon) < 1e-5 && Math.abs(y - lat) < 1e-5,
      );
      expect(near, `vertex ${lon}, ${lat}`).toBe(true);
    }
  });

  it("carries soils with their HSG and the subcatchment with its id and name", async () => {
    const soil = await features(c.engineer, c.projectId, "soil");
    expect(soil.map((f) => f.properties.hsg).sort()).toEqual(
      SOILS.map((s) => s.properties.HSG).sort(),
    );
    expect(soil.every((f) => f.properties.layerId === c.soilLayerId)).toBe(true);
    const subs = await features(c.engineer, c.projectId, "subcatchments");
    expect(subs.map((f) => f.properties)).toEqual([
      { id: c.subcatchmentId, name: "Invented area A", scenario: "existing" },
    ]);
  });

  it("leaves cover and soil out below their zoom, keeping the subcatchments", async () => {
    const at = tileOf(-122.198, 38.402, POLYGON_LAYERS_MIN_ZOOM - 1);
    const res = await getTile(c.engineer, url(c.projectId, at));
    expect(res.status).toBe(200);
    const tile = decodeTile(res.body as Buffer);
    expect(Object.keys(tile.layers)).toEqual(["subcatchments"]);
  });

  it("leaves an unmapped cover polygon's class empty", async () => {
    const fresh = await buildGeodataCase(t, "tiles-unmapped");
    // Clear the mapping of every cover feature of the fresh project.
    await t.pool.query("update layer_features set surface_class_id = null where layer_id = $1", [
      fresh.coverLayerId,
    ]);
    const cover = await features(fresh.engineer, fresh.projectId, "cover");
    expect(cover).toHaveLength(COVER.length);
    for (const f of cover) {
      expect(f.properties.classKey).toBeUndefined();
      expect(f.properties.colour).toBeUndefined();
    }
  });

  it("answers 204 for a tile with nothing of the project in it", async () => {
    const res = await c.engineer.get(url(c.projectId, tileOf(10, 50, 15)));
    expect(res.status).toBe(204);
  });

  it("answers 304 to the same ETag and a new ETag once a subcatchment is added", async () => {
    const first = await getTile(c.engineer, url(c.projectId));
    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^"/);
    const again = await c.engineer.get(url(c.projectId)).set("If-None-Match", etag);
    expect(again.status).toBe(304);
    const added = await c.engineer.post(`/api/projects/${c.projectId}/subcatchments`).send({
      name: "Invented area B",
      boundary: COVER[3]?.geometry,
    });
    expect(added.status).toBe(201);
    const changed = await getTile(c.engineer, url(c.projectId)).set("If-None-Match", etag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(etag);
    const names = layerFeatures(decodeTile(changed.body as Buffer), "subcatchments", UPPER).map(
      (f) => f.properties.name,
    );
    expect(names.sort()).toEqual(["Invented area A", "Invented area B"]);
  });

  it("shows a new mapping on the next request: new ETag, new classes", async () => {
    const fresh = await buildGeodataCase(t, "tiles-remap");
    // The case inserts its features directly; an upload would have listed the file's fields.
    await t.pool.query(`update layers set fields = '["CODE", "NAME"]' where id = $1`, [
      fresh.coverLayerId,
    ]);
    const gis = t.agent();
    await signIn(gis, fresh.team.members.gis);
    const before = await getTile(gis, url(fresh.projectId));
    const etag = before.headers.etag as string;
    // Every fixture polygon mapped to the lawn class.
    const put = await gis.put(`/api/layers/${fresh.coverLayerId}/mapping`).send({
      field: "NAME",
      entries: COVER.map((f) => ({
        value: f.properties.NAME,
        surfaceClassId: fresh.classIdByName.lawn,
      })),
    });
    expect(put.status).toBe(200);
    const after = await getTile(gis, url(fresh.projectId)).set("If-None-Match", etag);
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(etag);
    const cover = await features(gis, fresh.projectId, "cover");
    expect(new Set(cover.map((f) => f.properties.classKey))).toEqual(
      new Set([COVER_CLASS_KEYS.lawn]),
    );
  });

  it("lets a viewer read tiles, and answers 404 to another team and 401 to nobody", async () => {
    const viewer = t.agent();
    await signIn(viewer, c.team.members.viewer);
    expect((await viewer.get(url(c.projectId))).status).toBe(200);
    const other = await createTeam(t.db, "tiles-other");
    const outsider = t.agent();
    await signIn(outsider, other.members.owner);
    expect((await outsider.get(url(c.projectId))).status).toBe(404);
    expect((await supertest(t.app).get(url(c.projectId))).status).toBe(401);
  });

  it("refuses a tile address outside the zoom's grid, naming the coordinate", async () => {
    const bad = await c.engineer.get(`/api/projects/${c.projectId}/tiles/3/8/0.mvt`);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.x).toMatch(/below 8/);
    const deep = await c.engineer.get(`/api/projects/${c.projectId}/tiles/25/0/0.mvt`);
    expect(deep.status).toBe(422);
    expect(deep.body.error.fields.z).toMatch(/0 to 24/);
  });
});
