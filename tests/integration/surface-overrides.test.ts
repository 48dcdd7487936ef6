/**
 * Surface overrides through the API: a stretch given another class changes that segment's
 * class, n, k and CN and the methods' totals, against the same compute without it; bad entries
 * are refused naming the entry; the path's version guards them; roles and teams are checked.
 * The values compared come from the team's Surface catalog as seeded from the published
 * defaults (each value carries its source there); the geometry is the invented test scenario.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { SurfaceValues } from "../../shared/schemas/catalog";
import type { SheetSegment, TravelTimeSheet } from "../../shared/schemas/sheet";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import { buildGeodataCase, type GeodataCase } from "../support/geodata-case";

let t: TestApp;
let c: GeodataCase;
let before: TravelTimeSheet;
let target: SheetSegment;

const base = () => `/api/subcatchments/${c.subcatchmentId}`;
const version = async (agent: Agent = c.engineer) =>
  ((await agent.get(base())).body as { flowPath: { version: number } }).flowPath.version;
const compute = async (id = c.subcatchmentId) =>
  (await c.engineer.post(`/api/subcatchments/${id}/compute`).send({})).body as TravelTimeSheet;

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "surface-overrides");
  before = await compute();
  if (before.problems.length > 0) throw new Error(before.problems.join(" "));
  // A shallow-flow segment on a mapped soil that is not pavement: paving it must change its k
  // and CN.
  const found = before.segments.find(
    (s) =>
      s.regime === "shallow" && s.hsg !== null && s.surfaceClassId !== c.classIdByName.pavement,
  );
  if (!found) throw new Error("the scenario has no unpaved shallow segment");
  target = found;
});
afterAll(() => t.close());

const method = (s: TravelTimeSheet, id: string) => s.methods.find((m) => m.id === id);

describe("surface overrides", () => {
  it("give the stretch the class, its n, k and CN, and change the totals by that segment", async () => {
    const pavement = c.classIdByName.pavement ?? "";
    const put = await c.engineer.put(`${base()}/surface-overrides`).send({
      entries: [
        {
          stationFrom: target.stationFrom,
          stationTo: target.stationTo,
          surfaceClassId: pavement,
          note: "paved since the cover layer was drawn",
        },
      ],
      version: await version(),
    });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body.surfaceOverrides).toEqual([
      {
        stationFrom: target.stationFrom,
        stationTo: target.stationTo,
        surfaceClassId: pavement,
        note: "paved since the cover layer was drawn",
      },
    ]);
    const after = await compute();
    expect(after.problems).toEqual([]);
    const row = after.segments.find((s) => s.stationFromM === target.stationFromM);
    expect(row?.stationToM).toBe(target.stationToM);
    expect(row).toMatchObject({ surfaceClassId: pavement, surfaceSource: "override" });

    const classes = (await c.engineer.get(`/api/projects/${c.projectId}/surface-classes`)).body as {
      id: string;
      values: SurfaceValues;
    }[];
    const paved = classes.find((x) => x.id === pavement)?.values;
    const k = paved?.shallowKFtPerS ?? paved?.velocityKFtPerS;
    // The project is SI: k in m/s, 1 ft = 0.3048 m exactly (international foot).
    expect(row?.k).toBeCloseTo((k?.value ?? Number.NaN) * 0.3048, 12);
    expect(row?.hsg).toBe(target.hsg);
    expect(row?.cn).toBe(paved?.cn[target.hsg ?? "A"]);
    expect(row?.k).not.toBe(target.k);

    // Every other segment is as it was, from the cover layer.
    const others = after.segments.filter((s) => s !== row);
    expect(others.map((s) => [s.stationFromM, s.surfaceClassId, s.surfaceSource])).toEqual(
      before.segments
        .filter((s) => s.stationFromM !== target.stationFromM)
        .map((s) => [s.stationFromM, s.surfaceClassId, "cover-layer"]),
    );
    // Per-segment methods: the total moves by exactly that segment's change of time.
    for (const id of ["velocity", "nrcs-segmental"] as const) {
      const delta = (row?.timesMin[id] ?? 0) - (target.timesMin[id] ?? 0);
      expect(delta, id).not.toBe(0);
      expect(method(after, id)?.computedMin).toBeCloseTo(
        (method(before, id)?.computedMin ?? 0) + delta,
        9,
      );
    }
    // The split as the cover layer gives it is kept for checking.
    expect(after.split.pieces).toEqual(before.split.pieces);
  });

  it("bumps the path's version, so the stored sheet reads back as out of date", async () => {
    const v = await version();
    await compute();
    const put = await c.engineer
      .put(`${base()}/surface-overrides`)
      .send({ entries: [], version: v });
    expect(put.body.flowPath.version).toBe(v + 1);
    expect((await c.engineer.get(`${base()}/sheet`)).body.stale).toBe(true);
  });

  it("refuses overlapping entries with 422 naming the entry, keeping what was stored", async () => {
    const lawn = c.classIdByName.lawn ?? "";
    const stored = (await c.engineer.get(base())).body.surfaceOverrides;
    const res = await c.engineer.put(`${base()}/surface-overrides`).send({
      entries: [
        { stationFrom: 50, stationTo: 120, surfaceClassId: lawn },
        { stationFrom: 100, stationTo: 150, surfaceClassId: lawn },
      ],
      version: await version(),
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["entries.1.stationFrom"]).toMatch(
      /Override 2 \(from 100\) overlaps override 1 \(50 to 120\)/,
    );
    expect((await c.engineer.get(base())).body.surfaceOverrides).toEqual(stored);
  });

  it("refuses a stretch past the path's end or with another team's class, naming the entry", async () => {
    const other = await buildGeodataCase(t, "surface-overrides-other");
    const total = before.totalLength;
    const res = await c.engineer.put(`${base()}/surface-overrides`).send({
      entries: [
        { stationFrom: 0, stationTo: 10, surfaceClassId: c.classIdByName.lawn },
        { stationFrom: 300, stationTo: total + 5, surfaceClassId: c.classIdByName.lawn },
        { stationFrom: 20, stationTo: 30, surfaceClassId: other.classIdByName.lawn },
      ],
      version: await version(),
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      "entries.1.stationTo",
      "entries.2.surfaceClassId",
    ]);
    expect(res.body.error.fields["entries.1.stationTo"]).toMatch(/past the end of the flow path/);
    expect(res.body.error.fields["entries.2.surfaceClassId"]).toMatch(/not in this team/);
  });

  it("answers 409 to a stale version and stores nothing", async () => {
    const v = await version();
    const res = await c.engineer.put(`${base()}/surface-overrides`).send({
      entries: [{ stationFrom: 0, stationTo: 10, surfaceClassId: c.classIdByName.lawn }],
      version: v - 1,
    });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("stale_version");
    expect(await version()).toBe(v);
  });

  it("is refused to a viewer (403) and to another team (404)", async () => {
    const viewer = t.agent();
    await signIn(viewer, c.team.members.viewer);
    const body = {
      entries: [{ stationFrom: 0, stationTo: 10, surfaceClassId: c.classIdByName.lawn }],
      version: await version(),
    };
    expect((await viewer.put(`${base()}/surface-overrides`).send(body)).status).toBe(403);
    const stranger = await createTeam(t.db, "surface-overrides-stranger");
    const outsider = t.agent();
    await signIn(outsider, stranger.members.engineer);
    const res = await outsider.put(`${base()}/surface-overrides`).send(body);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("not_found");
  });

  it("keeps a stretch where it is on the ground when the path is reversed", async () => {
    const o = await buildGeodataCase(t, "surface-overrides-reverse");
    const url = `/api/subcatchments/${o.subcatchmentId}`;
    const v = (await o.engineer.get(url)).body.flowPath.version as number;
    await o.engineer.put(`${url}/surface-overrides`).send({
      entries: [{ stationFrom: 10, stationTo: 40, surfaceClassId: o.classIdByName.woods }],
      version: v,
    });
    const rev = await o.engineer.post(`${url}/flow-path/reverse`).send({ version: v + 1 });
    expect(rev.status, JSON.stringify(rev.body)).toBe(200);
    const total = rev.body.flowPath.lengthM as number;
    const [moved] = rev.body.surfaceOverrides as { stationFrom: number; stationTo: number }[];
    // The reverse measures the path in PostGIS (ST_Length on the spheroid), the answer with
    // GeographicLib: they agree to far better than a micrometre on a path this short.
    expect(moved?.stationFrom).toBeCloseTo(total - 40, 6);
    expect(moved?.stationTo).toBeCloseTo(total - 10, 6);
  });

  it("keeps the catalog from deleting a class an override uses (409 naming the subcatchment)", async () => {
    const o = await buildGeodataCase(t, "surface-overrides-catalog");
    const owner = t.agent();
    await signIn(owner, o.team.members.owner);
    const made = await owner.post(`/api/teams/${o.team.id}/surface-classes`).send({
      key: "gravel-lot",
      name: "Gravel lot",
      values: (
        (await owner.get(`/api/teams/${o.team.id}/surface-classes`)).body as {
          key: string;
          values: SurfaceValues;
        }[]
      ).find((x) => x.key === "pavement")?.values,
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const url = `/api/subcatchments/${o.subcatchmentId}`;
    const v = (await o.engineer.get(url)).body.flowPath.version as number;
    await o.engineer.put(`${url}/surface-overrides`).send({
      entries: [{ stationFrom: 0, stationTo: 20, surfaceClassId: made.body.id }],
      version: v,
    });
    const del = await owner.delete(`/api/surface-classes/${made.body.id}`);
    expect(del.status).toBe(409);
    expect(del.body.error.message).toMatch(/subcatchment "Invented area A"/);
  });
});
