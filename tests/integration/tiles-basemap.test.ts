/**
 * The demo basemap: loaded once from demo-geo/out/basemap.geojson, served as vector tiles to
 * signed-in users; and the self-hosted alternatives by configuration (an admin's style URL, a
 * PMTiles archive served with HTTP range requests).
 */
import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { count, sql } from "drizzle-orm";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadConfig } from "../../server/config";
import { basemapFeatures } from "../../server/db/schema-basemap";
import { seedBasemap } from "../../server/seed/basemap";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import { binary, decodeTile, layerFeatures, tileOf } from "../support/tiles";

let t: TestApp;
let agent: Agent;
// The invented site sits around 96.52° W, 38.41° N (demo-geo/site.ts); a tile edge crosses it
// (38.4106° N is an edge at every zoom from 11 up), so the tests read the two z 14 tiles.
const AT = tileOf(-96.5185, 38.4115, 14);
const BELOW = { ...AT, y: AT.y + 1 };
const url = `/api/basemap/tiles/${AT.z}/${AT.x}/${AT.y}.mvt`;
const urlOf = (at: typeof AT) => `/api/basemap/tiles/${at.z}/${at.x}/${at.y}.mvt`;

async function bothTiles() {
  const out = [];
  for (const at of [AT, BELOW]) {
    const res = await agent.get(urlOf(at)).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    out.push({ at, tile: decodeTile(res.body as Buffer) });
  }
  return out;
}

/** Basemap features of a kind within a tile and its 64-unit buffer, counted by PostGIS. */
async function countInTile(kind: string, at: typeof AT): Promise<number> {
  const result = await t.db.execute<{ n: number }>(sql`
    select count(*)::int as n from basemap_features
    where kind = ${kind} and ST_Intersects(geom, ST_Transform(
      ST_TileEnvelope(${at.z}::int, ${at.x}::int, ${at.y}::int, margin => ${64 / 4096}::float8), 4326))`);
  return result.rows[0]?.n ?? -1;
}

beforeAll(async () => {
  t = await startTestApp();
  await seedBasemap(t.db);
  const team = await createTeam(t.db, "basemap");
  agent = t.agent();
  await signIn(agent, team.members.viewer);
});
afterAll(async () => {
  await t.close();
});

describe("demo basemap tiles", () => {
  it("loads the basemap once: a second run changes nothing", async () => {
    const before = await t.db.select({ n: count() }).from(basemapFeatures);
    expect(before[0]?.n).toBeGreaterThan(50);
    expect((await seedBasemap(t.db)).ran).toBe(false);
    const after = await t.db.select({ n: count() }).from(basemapFeatures);
    expect(after[0]?.n).toBe(before[0]?.n);
  });

  it("serves roads, streams, buildings, contours and places of the demo area", async () => {
    const tiles = await bothTiles();
    for (const { at, tile } of tiles) {
      expect(Object.keys(tile.layers).length).toBeGreaterThanOrEqual(4);
      const roads = layerFeatures(tile, "roads", at);
      expect(roads.find((r) => r.properties.name === "Terrace Road")?.properties.class).toBe(
        "street",
      );
      const streams = layerFeatures(tile, "streams", at).map((s) => s.properties.name);
      expect(streams).toContain("Harrow Hill swale");
      for (const kind of ["roads", "streams", "buildings", "contours", "places"]) {
        expect(layerFeatures(tile, kind, at).length, `${kind} in ${at.y}`).toBe(
          await countInTile(kind, at),
        );
      }
    }
    const buildings = tiles.reduce(
      (n, { at, tile }) => n + layerFeatures(tile, "buildings", at).length,
      0,
    );
    expect(buildings).toBeGreaterThanOrEqual(10);
    const places = tiles.flatMap(({ at, tile }) =>
      layerFeatures(tile, "places", at).map((p) => p.properties.name),
    );
    expect(places).toContain("Harrow Hill Terraces");
    expect(places).toContain("Harrow Hill");
  });

  it("sends tiles gzip-compressed to a browser that accepts it, decoding to the same tile", async () => {
    const res = await agent.get(url).set("Accept-Encoding", "gzip").buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers["content-encoding"]).toBe("gzip");
    const [plain] = await bothTiles();
    expect(Object.keys(decodeTile(res.body as Buffer).layers).sort()).toEqual(
      Object.keys(plain?.tile.layers ?? {}).sort(),
    );
  });

  it("gives contours their elevation and marks every fifth metre as index", async () => {
    const contours = (await bothTiles()).flatMap(({ at, tile }) =>
      layerFeatures(tile, "contours", at),
    );
    expect(contours.length).toBeGreaterThan(30);
    for (const c of contours) {
      const z = Number(c.properties.elevation);
      expect(Number.isInteger(z), `elevation ${z}`).toBe(true);
      expect(c.properties.index).toBe(z % 5 === 0);
    }
    // Together the two tiles hold every level of the synthetic ground (about 353–399 m).
    const [range] = (
      await t.db.execute<{ lo: number; hi: number }>(sql`
        select min((properties->>'elevation')::float8) as lo,
               max((properties->>'elevation')::float8) as hi
        from basemap_features where kind = 'contours'`)
    ).rows;
    const levels = contours.map((c) => Number(c.properties.elevation));
    expect(Math.min(...levels)).toBe(range?.lo);
    expect(Math.max(...levels)).toBe(range?.hi);
  });

  it("answers 204 far from the demo area, 304 to a known ETag, 401 to nobody", async () => {
    const far = tileOf(10, 50, 15);
    expect((await agent.get(`/api/basemap/tiles/15/${far.x}/${far.y}.mvt`)).status).toBe(204);
    const first = await agent.get(url).buffer(true).parse(binary);
    const again = await agent.get(url).set("If-None-Match", first.headers.etag as string);
    expect(again.status).toBe(304);
    expect((await supertest(t.app).get(url)).status).toBe(401);
  });

  it("tells the client the demo basemap is in use by default", async () => {
    const res = await supertest(t.app).get("/api/config");
    expect(res.body.basemap).toEqual({ kind: "demo" });
    expect((await agent.get("/api/basemap/archive.pmtiles")).status).toBe(404);
  });
});

describe("self-hosted basemap by configuration", () => {
  it("refuses both a style and an archive at once", () => {
    expect(() =>
      loadConfig({
        DATABASE_URL: "postgres://x@127.0.0.1/rillmark_test",
        BASEMAP_STYLE_URL: "http://maps.internal/style.json",
        BASEMAP_PMTILES_PATH: "/srv/a.pmtiles",
      }),
    ).toThrow(/not both/);
  });

  it("passes an admin's style URL to the client and lets the page fetch from its host", async () => {
    const styled = await startTestApp({
      basemap: { kind: "style", url: "http://maps.internal:8080/styles/site.json" },
    });
    try {
      const res = await supertest(styled.app).get("/api/config");
      expect(res.body.basemap).toEqual({
        kind: "style",
        url: "http://maps.internal:8080/styles/site.json",
      });
      expect(res.headers["content-security-policy"]).toMatch(
        /connect-src 'self' http:\/\/maps\.internal:8080/,
      );
    } finally {
      await styled.close();
    }
  });

  it("serves a PMTiles archive with HTTP range requests to signed-in users", async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-pmtiles-"));
    const file = path.join(dir, "region.pmtiles");
    // The PMTiles v3 magic and version, then bytes standing in for the archive's body.
    const bytes = Buffer.concat([Buffer.from("PMTiles"), Buffer.from([3]), randomBytes(40_000)]);
    writeFileSync(file, bytes);
    const archived = await startTestApp({ basemap: { kind: "pmtiles", path: file } });
    try {
      const config = await supertest(archived.app).get("/api/config");
      expect(config.body.basemap).toEqual({ kind: "pmtiles", url: "/api/basemap/archive.pmtiles" });
      const team = await createTeam(archived.db, "pmtiles");
      const viewer = archived.agent();
      await signIn(viewer, team.members.viewer);
      const head = await viewer
        .get("/api/basemap/archive.pmtiles")
        .set("Range", "bytes=0-16383")
        .buffer(true)
        .parse(binary);
      expect(head.status).toBe(206);
      expect(head.headers["content-range"]).toBe(`bytes 0-16383/${bytes.length}`);
      expect((head.body as Buffer).equals(bytes.subarray(0, 16_384))).toBe(true);
      const tail = await viewer
        .get("/api/basemap/archive.pmtiles")
        .set("Range", "bytes=39000-39999")
        .buffer(true)
        .parse(binary);
      expect(tail.status).toBe(206);
      expect((tail.body as Buffer).equals(bytes.subarray(39_000, 40_000))).toBe(true);
      expect((await supertest(archived.app).get("/api/basemap/archive.pmtiles")).status).toBe(401);
    } finally {
      await archived.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
