import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  signIn,
  startTestApp,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";
import { freshProject } from "../support/route-table";

let t: TestApp;
let team: TestTeam;
let engineer: Agent;
let projectId: string;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "subcatchments");
  projectId = await freshProject(t.db, team.id); // SI
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
});
afterAll(() => t.close());

// An invented site: a small square and a path across it.
const boundary = {
  type: "Polygon",
  coordinates: [
    [
      [8.5, 47.0],
      [8.503, 47.0],
      [8.503, 47.002],
      [8.5, 47.002],
      [8.5, 47.0],
    ],
  ],
};
const line = (coords: number[][]) => ({ type: "LineString", coordinates: coords });
const PATH = line([
  [8.5005, 47.0018],
  [8.5015, 47.001],
  [8.5025, 47.0002],
]);

let seq = 0;
async function make(extra: object = {}) {
  seq += 1;
  const res = await engineer.post(`/api/projects/${projectId}/subcatchments`).send({
    name: `Area ${seq}`,
    boundary,
    outlet: { type: "Point", coordinates: [8.5025, 47.0002] },
    ...extra,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string };
}

describe("subcatchments", () => {
  it("creates one with its boundary and outlet, lists, edits and deletes it", async () => {
    const made = await make({
      channel: { manningN: 0.035, section: { bottomWidth: 1, sideSlope: 2, depth: 0.3 } },
    });
    const got = await engineer.get(`/api/subcatchments/${made.id}`);
    expect(got.body.boundary.coordinates[0][1]).toEqual([8.503, 47.0]);
    expect(got.body).toMatchObject({ scenario: "existing", flowPath: null, lengthUnit: "m" });
    const list = await engineer.get(`/api/projects/${projectId}/subcatchments`);
    expect(list.body.map((s: { id: string }) => s.id)).toContain(made.id);
    const patched = await engineer
      .patch(`/api/subcatchments/${made.id}`)
      .send({ scenario: "proposed", note: "after grading", version: 1 });
    expect(patched.body).toMatchObject({ scenario: "proposed", note: "after grading", version: 2 });
    expect((await engineer.delete(`/api/subcatchments/${made.id}`)).status).toBe(204);
    expect((await engineer.get(`/api/subcatchments/${made.id}`)).status).toBe(404);
  });

  it("refuses a self-intersecting boundary with PostGIS's reason", async () => {
    const bowtie = {
      type: "Polygon",
      coordinates: [
        [
          [8.5, 47.0],
          [8.503, 47.002],
          [8.503, 47.0],
          [8.5, 47.002],
          [8.5, 47.0],
        ],
      ],
    };
    const res = await engineer
      .post(`/api/projects/${projectId}/subcatchments`)
      .send({ name: "Bowtie", boundary: bowtie });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.boundary).toMatch(/Self-intersection/i);
  });

  it("refuses a path with one distinct vertex or outside WGS84, naming the field", async () => {
    const made = await make();
    const one = await engineer.put(`/api/subcatchments/${made.id}/flow-path`).send({
      geometry: line([
        [8.5, 47],
        [8.5, 47],
      ]),
    });
    expect(one.status).toBe(422);
    expect(one.body.error.fields["geometry.coordinates"]).toMatch(/2 distinct vertices/);
    const out = await engineer.put(`/api/subcatchments/${made.id}/flow-path`).send({
      geometry: line([
        [8.5, 47],
        [190, 47],
      ]),
    });
    expect(out.status).toBe(422);
    expect(out.body.error.fields["geometry.coordinates.1.0"]).toMatch(/longitude/);
  });

  it("stores a new path as version 1 with its ellipsoidal length, then version 2", async () => {
    const made = await make();
    const first = await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: PATH, version: 0 });
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body.flowPath.version).toBe(1);
    expect(first.body.flowPath.lengthM).toBeGreaterThan(200);
    const second = await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: PATH, version: 1 });
    expect(second.body.flowPath.version).toBe(2);
  });

  it("answers 409 to a stale path version and keeps the stored path", async () => {
    const made = await make();
    await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: PATH, version: 0 });
    await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: PATH, version: 1 });
    const other = line([
      [8.5001, 47.0019],
      [8.5026, 47.0001],
    ]);
    const stale = await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: other, version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toBe(
      "This flow path was changed by someone else (version 2); reload it and apply your edit again.",
    );
    const now = await engineer.get(`/api/subcatchments/${made.id}`);
    expect(now.body.flowPath.geometry.coordinates).toEqual(PATH.coordinates);
  });

  it("reverses a path, counting surveyed stations from the new divide", async () => {
    const made = await make();
    const put = await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: PATH, version: 0 });
    const total = put.body.flowPath.lengthM as number;
    await engineer
      .put(`/api/subcatchments/${made.id}/elevations`)
      .send({ entries: [{ station: 10, elevation: 400.5, note: "rod shot" }], version: 1 });
    const rev = await engineer
      .post(`/api/subcatchments/${made.id}/flow-path/reverse`)
      .send({ version: 2 });
    expect(rev.status, JSON.stringify(rev.body)).toBe(200);
    expect(rev.body.flowPath.version).toBe(3);
    expect(rev.body.flowPath.geometry.coordinates).toEqual([...PATH.coordinates].reverse());
    expect(rev.body.elevations[0].station).toBeCloseTo(total - 10, 3);
    expect(
      (await engineer.post(`/api/subcatchments/${made.id}/flow-path/reverse`).send({ version: 2 }))
        .status,
    ).toBe(409);
  });

  it("keeps breaks in the project's unit, stored in metres, under the path version", async () => {
    const usProject = await engineer
      .post(`/api/teams/${team.id}/projects`)
      .send({ name: "US units", units: "us", designReturnPeriodYears: 10 });
    const made = await engineer
      .post(`/api/projects/${usProject.body.id}/subcatchments`)
      .send({ name: "US area" });
    const id = made.body.id as string;
    await engineer.put(`/api/subcatchments/${id}/flow-path`).send({ geometry: PATH, version: 0 });
    const res = await engineer
      .put(`/api/subcatchments/${id}/breaks`)
      .send({ sheetEnd: 100, channelStart: 500, version: 1 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.breaks).toEqual({ sheetEnd: 100, channelStart: 500 });
    expect(res.body.flowPath.version).toBe(2);
    const { regimeBreaks } = await import("../../server/db/schema-geodata");
    const { eq } = await import("drizzle-orm");
    const rows = await t.db.select().from(regimeBreaks).where(eq(regimeBreaks.subcatchmentId, id));
    // 1 ft = 0.3048 m exactly (units.ts; the international foot).
    expect(rows.find((r) => r.kind === "sheet-end")?.stationM).toBeCloseTo(30.48, 9);
    const stale = await engineer
      .put(`/api/subcatchments/${id}/breaks`)
      .send({ sheetEnd: 50, version: 1 });
    expect(stale.status).toBe(409);
  });

  it("replaces surveyed elevations all at once and refuses two at one station", async () => {
    const made = await make();
    await engineer
      .put(`/api/subcatchments/${made.id}/flow-path`)
      .send({ geometry: PATH, version: 0 });
    const ok = await engineer.put(`/api/subcatchments/${made.id}/elevations`).send({
      entries: [
        { station: 0, elevation: 412.3 },
        { station: 50, elevation: 405.1, note: "culvert invert" },
      ],
      version: 1,
    });
    expect(ok.body.elevations).toHaveLength(2);
    const dup = await engineer.put(`/api/subcatchments/${made.id}/elevations`).send({
      entries: [
        { station: 5, elevation: 1 },
        { station: 5, elevation: 2 },
      ],
      version: 2,
    });
    expect(dup.status).toBe(422);
    const after = await engineer.get(`/api/subcatchments/${made.id}`);
    expect(after.body.elevations).toHaveLength(2);
  });
});

describe("subcatchment geometry from files", () => {
  const fixture = (name: string) => path.join(import.meta.dirname, "../fixtures/geo", name);

  it("takes the flow path from a KML file under the version sent", async () => {
    const made = await make();
    const res = await engineer
      .post(`/api/subcatchments/${made.id}/flow-path/file`)
      .field("version", "0")
      .attach("file", fixture("path.kml"));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // tests/fixtures/geo/scenario.ts PATH (invented), written to path.kml by the fixture script.
    expect(res.body.flowPath.geometry.coordinates[0][0]).toBeCloseTo(-122.1995, 9);
    expect(res.body.flowPath.version).toBe(1);
    const stale = await engineer
      .post(`/api/subcatchments/${made.id}/flow-path/file`)
      .field("version", "0")
      .attach("file", fixture("path.kml"));
    expect(stale.status).toBe(409);
  });

  it("refuses a boundary file with two polygons, saying how many it holds", async () => {
    const made = await make();
    const res = await engineer
      .post(`/api/subcatchments/${made.id}/boundary/file`)
      .field("version", "1")
      .attach("file", fixture("soils.geojson"));
    expect(res.status).toBe(422);
    expect(res.body.error.message).toBe(
      "soils.geojson: expected exactly one polygon (the boundary), found 2.",
    );
  });

  it("refuses a path file that holds no line", async () => {
    const made = await make();
    const res = await engineer
      .post(`/api/subcatchments/${made.id}/flow-path/file`)
      .attach("file", fixture("soils.geojson"));
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/found 0/);
  });
});
