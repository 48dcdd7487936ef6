/**
 * The demo's geodata seed: the invented scenario in demo-geo/out goes through the real API
 * (uploads, ingest jobs, mappings, rainfall CSV, Design rules, subcatchment, compute) into the
 * demo project, once. Like seed.test.ts, it gets a database of its own (the demo's addresses are
 * fixed), made and dropped here.
 */
import { randomUUID } from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { eq, isNull, and } from "drizzle-orm";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runMigrations } from "../../server/db/migrate";
import { projects, seedRuns } from "../../server/db/schema";
import {
  designRules,
  layerFeatures,
  layers,
  rainfallTables,
  subcatchmentResults,
  subcatchments,
} from "../../server/db/schema-geodata";
import { seedDemo } from "../../server/seed/demo";
import {
  DEMO_GEODATA_SEED_NAME,
  seedDemoGeodata,
  type DemoGeodataResult,
} from "../../server/seed/demo-geodata";
import { travelTimeSheetSchema } from "../../shared/schemas/sheet";
import { startTestApp, type TestApp } from "../support/app";

const adminUrl = process.env.DATABASE_URL ?? "";
const name = `rillmark_seedgeo_${randomUUID().slice(0, 8)}_test`;
const seedUrl = (() => {
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
})();

async function run(url: string, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

let testApp: TestApp;
let server: http.Server;
let baseUrl = "";
let first: DemoGeodataResult;
let projectId = "";

beforeAll(async () => {
  await run(adminUrl, `CREATE DATABASE "${name}"`);
  await run(seedUrl, "CREATE EXTENSION IF NOT EXISTS postgis");
  await runMigrations(seedUrl);
  testApp = await startTestApp({ databaseUrl: seedUrl });
  await seedDemo(testApp.db);
  server = http.createServer(testApp.app);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  first = await seedDemoGeodata({ db: testApp.db, pool: testApp.pool, baseUrl });
  const [project] = await testApp.db.select().from(projects).where(eq(projects.isDemo, true));
  projectId = project?.id ?? "";
}, 180_000);

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await testApp?.close();
  await run(adminUrl, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
});

async function demoLayers() {
  return testApp.db.select().from(layers).where(eq(layers.projectId, projectId));
}

describe("demo geodata seed", () => {
  it("loads the invented scenario and reports that it ran", () => {
    expect(first, JSON.stringify(first)).toMatchObject({ ran: true });
  });

  it("uploads terrain, cover, soil and channel layers, each stored and ready", async () => {
    const rows = await demoLayers();
    const byKind = Object.fromEntries(rows.map((r) => [r.kind, r]));
    expect(Object.keys(byKind).sort()).toEqual(["channel", "cover", "soil", "terrain"]);
    expect(rows.every((r) => r.status === "ready")).toBe(true);
    expect(byKind.cover?.featureCount).toBe(28);
    expect(byKind.soil?.featureCount).toBe(4);
    expect(byKind.channel?.featureCount).toBe(1);
    expect(byKind.terrain?.terrain).toMatchObject({ verticalUnit: "m" });
    for (const row of rows) {
      expect(await testApp.store.exists(row.objectKey ?? ""), `${row.kind} original`).toBe(true);
    }
  });

  it("maps every cover code to a catalog class and every soil unit to its HSG", async () => {
    const rows = await demoLayers();
    const cover = rows.find((r) => r.kind === "cover");
    const soil = rows.find((r) => r.kind === "soil");
    expect(cover?.mappingField).toBe("LANDUSE");
    expect(soil?.mappingField).toBe("HSG");
    const unmappedCover = await testApp.db
      .select()
      .from(layerFeatures)
      .where(and(eq(layerFeatures.layerId, cover?.id ?? ""), isNull(layerFeatures.surfaceClassId)));
    expect(unmappedCover).toEqual([]);
    const soils = await testApp.db
      .select({ hsg: layerFeatures.hsg })
      .from(layerFeatures)
      .where(eq(layerFeatures.layerId, soil?.id ?? ""));
    expect(soils.map((s) => s.hsg).sort()).toEqual(["B", "C", "C", "C/D"]);
  });

  it("adds the invented rainfall table and Design rules that compute with it", async () => {
    const tables = await testApp.db
      .select()
      .from(rainfallTables)
      .where(eq(rainfallTables.projectId, projectId));
    expect(tables).toHaveLength(1);
    expect(tables[0]?.sourceNote).toMatch(/invented/i);
    expect(tables[0]?.p2_24h).toBeGreaterThan(0);
    const [rules] = await testApp.db
      .select()
      .from(designRules)
      .where(eq(designRules.projectId, projectId));
    expect(rules).toMatchObject({ rainfallTableId: tables[0]?.id, channelSlope: "10-85" });
  });

  it("computes the subcatchment: a stored travel-time sheet with a governing Tc", async () => {
    const [sub] = await testApp.db
      .select()
      .from(subcatchments)
      .where(eq(subcatchments.projectId, projectId));
    expect(sub?.boundary).not.toBeNull();
    expect(sub?.outlet).not.toBeNull();
    const [result] = await testApp.db
      .select()
      .from(subcatchmentResults)
      .where(eq(subcatchmentResults.subcatchmentId, sub?.id ?? ""));
    const sheet = travelTimeSheetSchema.parse(result?.sheet);
    expect(sheet.problems).toEqual([]);
    expect(sheet.segments.map((s) => s.regime)).toEqual(
      expect.arrayContaining(["sheet", "shallow", "channel"]),
    );
    expect(sheet.governing?.tcMin).toBeGreaterThan(0);
    expect(sheet.peakFlow?.value).toBeGreaterThan(0);
  });

  it("runs once: a second start finds its seed run and changes nothing", async () => {
    const before = (await demoLayers()).map((r) => r.id).sort();
    const again = await seedDemoGeodata({ db: testApp.db, pool: testApp.pool, baseUrl });
    expect(again).toEqual({ ran: false, reason: "already seeded" });
    expect((await demoLayers()).map((r) => r.id).sort()).toEqual(before);
  });

  it("leaves a demo project that already holds data alone, and records that it did", async () => {
    await testApp.db.delete(seedRuns).where(eq(seedRuns.name, DEMO_GEODATA_SEED_NAME));
    const before = (await demoLayers()).map((r) => r.id).sort();
    const again = await seedDemoGeodata({ db: testApp.db, pool: testApp.pool, baseUrl });
    expect(again.ran).toBe(false);
    expect((await demoLayers()).map((r) => r.id).sort()).toEqual(before);
    const runs = await testApp.db
      .select()
      .from(seedRuns)
      .where(eq(seedRuns.name, DEMO_GEODATA_SEED_NAME));
    expect(runs).toHaveLength(1);
  });
});
