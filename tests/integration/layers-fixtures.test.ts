/**
 * The committed geodata fixtures (tests/fixtures/geo, written by its make-fixtures script from
 * scenario.ts) through the upload route: each good file lands with the meant features, each
 * bad one is refused with its problem named and nothing stored.
 */
import path from "node:path";
import { asc, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { layerFeatures } from "../../server/db/schema-geodata";
import { COVER, PLANE, SOILS } from "../fixtures/geo/scenario";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import { leftovers, NOTHING, uploadLayer } from "../support/layers";
import { freshProject } from "../support/route-table";

const fixture = (name: string) => path.join(import.meta.dirname, "../fixtures/geo", name);

let t: TestApp;
let gis: Agent;
let teamId: string;

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "layers-fix");
  teamId = team.id;
  gis = t.agent();
  await signIn(gis, team.members.gis);
});
afterAll(() => t.close());

async function upload(kind: string, name: string, verticalUnit?: "m" | "ft") {
  const projectId = await freshProject(t.db, teamId);
  const res = await uploadLayer(gis, projectId, { kind, file: fixture(name), verticalUnit });
  return { projectId, res };
}

async function stored(layerId: string) {
  return t.db
    .select({
      attributes: layerFeatures.attributes,
      geometry: sql<{ coordinates: number[][][] }>`ST_AsGeoJSON(${layerFeatures.geom})::json`,
    })
    .from(layerFeatures)
    .where(eq(layerFeatures.layerId, layerId))
    .orderBy(asc(layerFeatures.featureIndex));
}

describe("good fixtures", () => {
  it("cover-utm10.zip (NAD83 / UTM 10N) lands on the scenario's WGS84 corners", async () => {
    const { res } = await upload("cover", "cover-utm10.zip");
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.featureCount).toBe(COVER.length);
    const rows = await stored(res.body.id);
    for (const [i, row] of rows.entries()) {
      expect(row.attributes).toMatchObject(COVER[i]?.properties ?? {});
      const meant = COVER[i]?.geometry.coordinates[0]?.[0] ?? [];
      // The script projected these corners with proj4; reading back inverts it. 1e-7° ≈ 1 cm.
      expect(row.geometry.coordinates[0]?.[0]?.[0]).toBeCloseTo(meant[0] ?? NaN, 7);
      expect(row.geometry.coordinates[0]?.[0]?.[1]).toBeCloseTo(meant[1] ?? NaN, 7);
    }
  });

  it("soils-1252.zip keeps its windows-1252 names", async () => {
    const { res } = await upload("soil", "soils-1252.zip");
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const rows = await stored(res.body.id);
    expect(rows.map((r) => r.attributes)).toEqual(SOILS.map((s) => s.properties));
  });

  it("soils.geojson and track.gpx land as soil and channel layers", async () => {
    expect((await upload("soil", "soils.geojson")).res.status).toBe(201);
    const gpx = await upload("channel", "track.gpx");
    expect(gpx.res.status, JSON.stringify(gpx.res.body)).toBe(201);
  });

  it("plane-utm10.tif is described from its GeoKeys", async () => {
    const { res, projectId } = await upload("terrain", "plane-utm10.tif", "m");
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.terrain).toMatchObject({
      epsg: PLANE.epsg,
      width: PLANE.width,
      height: PLANE.height,
      nodata: PLANE.nodata,
    });
    expect(await leftovers(t, projectId)).toMatchObject({ layers: 1, objects: 1, jobs: 0 });
  });
});

describe("bad fixtures are refused and leave nothing", () => {
  it.each([
    ["cover", "truncated.zip", /truncated|damaged/],
    ["cover", "zip-bomb.zip", /zip-bomb\.zip/],
    ["cover", "zip-slip.zip", /\.\./],
    ["cover", "no-dbf.zip", /\.dbf/],
    ["cover", "no-prj.zip", /\.prj/],
    ["cover", "wrong-prj.zip", /outside WGS84 longitude\/latitude/],
    ["cover", "bowtie-utm10.zip", /feature \d+ .*Self-intersection/],
    ["cover", "empty-geometry.zip", /feature \d+/],
    ["terrain", "no-georef.tif", /no-georef\.tif/],
    ["cover", "rainfall-missing-cell.csv", /Rainfall/],
  ])("%s %s", async (kind, name, message) => {
    const { res, projectId } = await upload(kind, name, kind === "terrain" ? "m" : undefined);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.body.error.message).toMatch(message);
    expect(await leftovers(t, projectId)).toEqual(NOTHING);
  });
});
