/**
 * No edit of a subcatchment silently replaces another. Many engineers sending an edit made from
 * the same version at once: exactly one lands, every other is told 409 with the version now
 * stored, and what is stored is exactly the one that landed. The subcatchment's own fields
 * (PATCH, boundary file) and the path's stations (surveyed elevations) each have their version.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";

const RACERS = 100;
const PATH = {
  type: "LineString",
  coordinates: [
    [8.5, 47.0],
    [8.501, 47.001],
    [8.502, 47.001],
  ],
};
/** A GeoJSON file holding one polygon (invented), sent as an upload. */
const boundaryFile = Buffer.from(
  JSON.stringify({
    type: "FeatureCollection",
    features: [
      {
        type: "Feature",
        properties: {},
        geometry: {
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
        },
      },
    ],
  }),
);

let t: TestApp;
let engineer: Agent;
let projectId: string;

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "versions");
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
  const project = await engineer
    .post(`/api/teams/${team.id}/projects`)
    .send({ name: "Versions", units: "si", designReturnPeriodYears: 10 });
  projectId = project.body.id as string;
});
afterAll(() => t.close());

async function make(withPath: boolean): Promise<string> {
  const res = await engineer
    .post(`/api/projects/${projectId}/subcatchments`)
    .send({ name: `Raced ${Math.random()}` });
  const id = res.body.id as string;
  if (withPath) {
    await engineer.put(`/api/subcatchments/${id}/flow-path`).send({ geometry: PATH, version: 0 });
  }
  return id;
}

/** Status codes of the racers, and the index of the one answered 200. */
function outcome(statuses: number[]) {
  return {
    wins: statuses.filter((s) => s === 200).length,
    conflicts: statuses.filter((s) => s === 409).length,
    winner: statuses.indexOf(200),
  };
}

describe("edits made from the same version at once", () => {
  it(`surveyed elevations: of ${RACERS}, one lands, the rest 409, none silently lost`, async () => {
    const id = await make(true);
    const base = { station: 0, elevation: 100, note: "shared" };
    const sent = Array.from({ length: RACERS }, (_, k) => [
      base,
      { station: 10 + k, elevation: 90 - k / 10, note: `point ${k}` },
    ]);
    const answers = await Promise.all(
      sent.map((entries) =>
        engineer.put(`/api/subcatchments/${id}/elevations`).send({ entries, version: 1 }),
      ),
    );
    const { wins, conflicts, winner } = outcome(answers.map((a) => a.status));
    expect({ wins, conflicts }).toEqual({ wins: 1, conflicts: RACERS - 1 });
    for (const a of answers.filter((x) => x.status === 409)) {
      expect(a.body.error.code).toBe("stale_version");
      expect(a.body.error.message).toMatch(/changed by someone else \(version 2\)/);
    }
    const stored = await engineer.get(`/api/subcatchments/${id}`);
    expect(stored.body.elevations).toEqual(sent[winner]);
    expect(stored.body.flowPath.version).toBe(2);
  });

  it(`the subcatchment's fields (PATCH): of ${RACERS}, one lands, the rest 409`, async () => {
    const id = await make(false);
    const answers = await Promise.all(
      Array.from({ length: RACERS }, (_, k) =>
        engineer.patch(`/api/subcatchments/${id}`).send({ note: `note ${k}`, version: 1 }),
      ),
    );
    const { wins, conflicts, winner } = outcome(answers.map((a) => a.status));
    expect({ wins, conflicts }).toEqual({ wins: 1, conflicts: RACERS - 1 });
    expect(answers[winner]?.body.version).toBe(2);
    const stored = await engineer.get(`/api/subcatchments/${id}`);
    expect(stored.body).toMatchObject({ note: `note ${winner}`, version: 2 });
  });

  it("the boundary file: one of several uploads from one version lands, a stale one is refused", async () => {
    const id = await make(false);
    const upload = () =>
      engineer
        .post(`/api/subcatchments/${id}/boundary/file`)
        .field("version", "1")
        .attach("file", boundaryFile, "boundary.geojson");
    const answers = await Promise.all(Array.from({ length: 8 }, upload));
    expect(outcome(answers.map((a) => a.status))).toMatchObject({ wins: 1, conflicts: 7 });
    const stored = await engineer.get(`/api/subcatchments/${id}`);
    expect(stored.body.version).toBe(2);
    expect(stored.body.boundary.type).toMatch(/Polygon/);
    const missing = await engineer
      .post(`/api/subcatchments/${id}/boundary/file`)
      .attach("file", boundaryFile, "boundary.geojson");
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields.version).toMatch(/version you read/);
  });
});

describe("the two versions", () => {
  it("keeps them apart: a path edit does not make a field edit stale, nor the reverse", async () => {
    const id = await make(true);
    const patched = await engineer
      .patch(`/api/subcatchments/${id}`)
      .send({ name: "Renamed after the path", version: 1 });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ version: 2, flowPath: { version: 1 } });
    const surveyed = await engineer
      .put(`/api/subcatchments/${id}/elevations`)
      .send({ entries: [{ station: 1, elevation: 5 }], version: 1 });
    expect(surveyed.status).toBe(200);
    expect(surveyed.body).toMatchObject({ version: 2, flowPath: { version: 2 } });
  });

  it("refuses surveyed elevations before there is a path to measure them along", async () => {
    const id = await make(false);
    const res = await engineer
      .put(`/api/subcatchments/${id}/elevations`)
      .send({ entries: [{ station: 1, elevation: 5 }], version: 0 });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.version).toMatch(/Draw the flow path/);
  });
});
