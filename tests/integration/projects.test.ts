import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  signIn,
  startTestApp,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";

let t: TestApp;
let team: TestTeam;
let engineer: Agent;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "projects");
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
});
afterAll(() => t.close());

const create = (body: object) => engineer.post(`/api/teams/${team.id}/projects`).send(body);

describe("projects", () => {
  it("creates a project with its settings and lists it for the team", async () => {
    const res = await create({
      name: "Larch Street outfall",
      units: "si",
      designReturnPeriodYears: 10,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      teamId: team.id,
      name: "Larch Street outfall",
      description: "",
      units: "si",
      designReturnPeriodYears: 10,
      isDemo: false,
      createdBy: team.members.engineer.id,
    });
    const list = await engineer.get(`/api/teams/${team.id}/projects`);
    expect(list.body.map((p: { id: string }) => p.id)).toContain(res.body.id);
  });

  it("names every invalid field", async () => {
    const res = await create({ name: "x", units: "imperial", designReturnPeriodYears: 7 });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      "designReturnPeriodYears",
      "name",
      "units",
    ]);
  });

  it("updates only the fields sent and keeps the others", async () => {
    const made = await create({
      name: "Birch Lane swale",
      description: "Existing conditions first.",
      units: "us",
      designReturnPeriodYears: 25,
    });
    const res = await engineer
      .patch(`/api/projects/${made.body.id}`)
      .send({ designReturnPeriodYears: 100 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      name: "Birch Lane swale",
      description: "Existing conditions first.",
      designReturnPeriodYears: 100,
    });
    expect(Date.parse(res.body.updatedAt)).toBeGreaterThanOrEqual(Date.parse(made.body.updatedAt));
  });

  it("is deleted by an admin and then answers 404", async () => {
    const made = await create({ name: "Temporary", units: "us", designReturnPeriodYears: 2 });
    const admin = t.agent();
    await signIn(admin, team.members.admin);
    expect((await admin.delete(`/api/projects/${made.body.id}`)).status).toBe(204);
    expect((await admin.get(`/api/projects/${made.body.id}`)).status).toBe(404);
  });
});
