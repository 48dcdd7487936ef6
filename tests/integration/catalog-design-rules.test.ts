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

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "design-rules");
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
});
afterAll(() => t.close());

const body = (version: number, extra: object = {}) => ({
  rules: { minTcMin: 6, sheetFlowMaxLength: "300ft" },
  dualHsg: "drained",
  channelSlope: "10-85",
  profileSpacingM: 2,
  version,
  ...extra,
});

describe("Design rules", () => {
  it("answers the documented defaults, version 0, for a project that never saved them", async () => {
    const projectId = await freshProject(t.db, team.id);
    const res = await engineer.get(`/api/projects/${projectId}/design-rules`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      rules: {},
      dualHsg: "undrained",
      channelSlope: "end-to-end",
      rainfallTableId: null,
      profileSpacingM: 5,
      version: 0,
    });
  });

  it("saves with the version read and answers the next version", async () => {
    const projectId = await freshProject(t.db, team.id);
    const first = await engineer.put(`/api/projects/${projectId}/design-rules`).send(body(0));
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body).toMatchObject({ version: 1, dualHsg: "drained", channelSlope: "10-85" });
    const second = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(1, { dualHsg: "undrained" }));
    expect(second.body).toMatchObject({ version: 2, dualHsg: "undrained" });
  });

  it("answers 409 to a stale version and keeps the saved rules", async () => {
    const projectId = await freshProject(t.db, team.id);
    await engineer.put(`/api/projects/${projectId}/design-rules`).send(body(0));
    await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(1, { profileSpacingM: 3 }));
    const stale = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(1, { profileSpacingM: 9 }));
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/changed by someone else \(now version 2\)/);
    const now = await engineer.get(`/api/projects/${projectId}/design-rules`);
    expect(now.body).toMatchObject({ version: 2, profileSpacingM: 3 });
  });

  it("refuses a second first save (version 0) with 409", async () => {
    const projectId = await freshProject(t.db, team.id);
    await engineer.put(`/api/projects/${projectId}/design-rules`).send(body(0));
    const again = await engineer.put(`/api/projects/${projectId}/design-rules`).send(body(0));
    expect(again.status).toBe(409);
  });

  it("refuses a rainfall table of another project and a misspelt rule, naming the fields", async () => {
    const projectId = await freshProject(t.db, team.id);
    const otherProject = await freshProject(t.db, team.id);
    const table = await engineer.post(`/api/projects/${otherProject}/rainfall-tables`).send({
      name: "Other",
      idf: { formula: { "10": { a: 60, b: 10, c: 0.8 } } },
    });
    const res = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(0, { rainfallTableId: table.body.id }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.rainfallTableId).toMatch(/no such rainfall table/);
    const typo = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(0, { rules: { minTcMins: 5 } }));
    expect(typo.status).toBe(422);
    expect(Object.keys(typo.body.error.fields)).toContain("rules");
  });

  it("stores the new core rules and their bands, and refuses a K of the other unit system", async () => {
    const projectId = await freshProject(t.db, team.id);
    const rules = {
      overlandSeries: "independent",
      sheetFlowSeries: "weighted-n",
      sheetFlowPastCap: "warn",
      lagUsesArc: true,
      rationalUsFactor: "1.0",
      kirpichAdjustment: "paved-overland",
      uncertainty: { roughnessPct: 30, draws: 500, seed: 9 },
    };
    const put = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(0, { rules }));
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect((await engineer.get(`/api/projects/${projectId}/design-rules`)).body.rules).toEqual(
      rules,
    );
    // The project is in SI units (freshProject): 0.94 is the US value of K.
    const k = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(1, { rules: { kinematicWaveK: 0.94 } }));
    expect(k.status).toBe(422);
    expect(k.body.error.fields["rules.kinematicWaveK"]).toMatch(/looks like a value for US units/);
    const dup = await engineer
      .put(`/api/projects/${projectId}/design-rules`)
      .send(body(1, { rules: { arcByReturnPeriod: { "25": "III", "25.0": "I" } } }));
    expect(dup.status).toBe(422);
    expect(JSON.stringify(dup.body.error.fields)).toMatch(/same return period/);
  });
});
