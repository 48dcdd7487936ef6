import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { surfaceClasses } from "../../server/db/schema-geodata";
import { catalog } from "../../shared/hydrology";
import {
  createTeam,
  latestMailTo,
  signIn,
  startTestApp,
  tokenFromMail,
  uniqueEmail,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";
import { freshProject } from "../support/route-table";

let t: TestApp;
let team: TestTeam;
let admin: Agent;
let engineer: Agent;
let projectId: string;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "catalog");
  projectId = await freshProject(t.db, team.id);
  admin = t.agent();
  await signIn(admin, team.members.admin);
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
});
afterAll(() => t.close());

interface ClassDto {
  id: string;
  key: string;
  name: string;
  values: {
    sheetFlowN: { value: number; source: string } | null;
    cn: Record<string, unknown>;
  };
  override?: { values: object; note: string } | null;
}

const classes = async (agent: Agent, path = `/api/teams/${team.id}/surface-classes`) =>
  (await agent.get(path)).body as ClassDto[];

const sourced = (value: number, source: string) => ({ value, source, note: "", rowId: null });

describe("Surface catalog", () => {
  it("is seeded on the first read with every published default class and its sources", async () => {
    const list = await classes(engineer);
    expect(list.map((c) => c.key).sort()).toEqual(catalog.SURFACE_CLASSES.map((c) => c.id).sort());
    const lawn = list.find((c) => c.key === "lawn-good");
    const published = catalog.SURFACE_CLASSES.find((c) => c.id === "lawn-good");
    expect(lawn?.values.sheetFlowN?.value).toBe(published?.sheetFlowN.value);
    expect(lawn?.values.sheetFlowN?.source).toBe(published?.sheetFlowN.source);
  });

  it("lets an admin add, edit and delete a class of the team's own", async () => {
    const made = await admin.post(`/api/teams/${team.id}/surface-classes`).send({
      key: "gravel-yard",
      name: "Gravel yard",
      values: {
        sheetFlowN: sourced(0.02, "Our criteria manual, table 4"),
        velocityKFtPerS: null,
        shallowKFtPerS: sourced(16.1345, "TR-55 (1986) figure 3-1, unpaved"),
        kerbyN: null,
        cn: { A: 76, B: 85, C: 89, D: 91, source: "Our criteria manual, table 5" },
        runoffC: null,
      },
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const patched = await admin
      .patch(`/api/surface-classes/${made.body.id}`)
      .send({ name: "Gravel yard (compacted)" });
    expect(patched.body.name).toBe("Gravel yard (compacted)");
    expect((await admin.delete(`/api/surface-classes/${made.body.id}`)).status).toBe(204);
    expect((await admin.get(`/api/surface-classes/${made.body.id}`)).status).toBe(404);
  });

  it("refuses a second class with the same key, naming the field", async () => {
    const [first] = await classes(admin);
    const res = await admin
      .post(`/api/teams/${team.id}/surface-classes`)
      .send({ key: first?.key, name: "Copy", values: { ...first?.values } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.key).toMatch(/already has a class/);
  });

  it("refuses to delete a class a layer mapping uses, naming the layer", async () => {
    const list = await classes(admin);
    const target = list.find((c) => c.key === "pavement");
    if (!target) throw new Error("no pavement class");
    const { layers, attributeMappings } = await import("../../server/db/schema-geodata");
    const [layer] = await t.db
      .insert(layers)
      .values({
        projectId,
        kind: "cover",
        name: "Parcels 2026",
        format: "geojson",
        originalFilename: "parcels.geojson",
        sizeBytes: 10,
        status: "ready",
      })
      .returning();
    await t.db
      .insert(attributeMappings)
      .values({ layerId: layer?.id ?? "", value: "PAVED", surfaceClassId: target.id });
    const res = await admin.delete(`/api/surface-classes/${target.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('"Parcels 2026"');
    const [still] = await t.db
      .select()
      .from(surfaceClasses)
      .where(eq(surfaceClasses.id, target.id));
    expect(still).toBeDefined();
  });

  it("merges a project's override into the project's view and keeps the override's source", async () => {
    const list = await classes(engineer);
    const lawn = list.find((c) => c.key === "lawn-fair");
    if (!lawn) throw new Error("no lawn-fair class");
    const put = await engineer
      .put(`/api/projects/${projectId}/surface-classes/${lawn.id}/override`)
      .send({
        values: { sheetFlowN: sourced(0.3, "County manual 2024, table 3") },
        note: "county",
      });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const view = await classes(engineer, `/api/projects/${projectId}/surface-classes`);
    const merged = view.find((c) => c.id === lawn.id);
    expect(merged?.values.sheetFlowN).toMatchObject({
      value: 0.3,
      source: "County manual 2024, table 3",
    });
    expect(merged?.values.cn).toEqual(lawn.values.cn);
    expect(merged?.override?.note).toBe("county");
    // The team's class is untouched.
    const teamView = (await classes(engineer)).find((c) => c.id === lawn.id);
    expect(teamView?.values.sheetFlowN?.value).toBe(lawn.values.sheetFlowN?.value);
    const del = await engineer.delete(
      `/api/projects/${projectId}/surface-classes/${lawn.id}/override`,
    );
    expect(del.status).toBe(204);
    const after = await classes(engineer, `/api/projects/${projectId}/surface-classes`);
    expect(after.find((c) => c.id === lawn.id)?.override).toBeNull();
  });

  it("refuses an override that leaves the class invalid (design C outside its range)", async () => {
    const list = await classes(engineer);
    const withC = list.find((c) => c.key === "lawn-good");
    if (!withC) throw new Error("no lawn-good class");
    const res = await engineer
      .put(`/api/projects/${projectId}/surface-classes/${withC.id}/override`)
      .send({
        values: {
          runoffC: { low: 0.1, high: 0.2, design: 0.5, source: "typo", note: "", rowId: null },
        },
      });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["values.runoffC.design"]).toMatch(/within its range/);
  });

  it("is seeded in the same transaction that makes a team at sign-up", async () => {
    const email = uniqueEmail("catalog-signup");
    await t.agent().post("/api/auth/sign-up").send({
      email,
      name: "Rosa Delgado",
      password: "a-long-new-password",
      teamName: "Delgado Drainage",
    });
    const token = tokenFromMail(await latestMailTo(t.db, email), "/confirm-email");
    const confirmed = await t.agent().post("/api/auth/confirm-email").send({ token });
    expect(confirmed.status).toBe(201);
    const teamId = confirmed.body.memberships[0].teamId as string;
    const rows = await t.db.select().from(surfaceClasses).where(eq(surfaceClasses.teamId, teamId));
    expect(rows).toHaveLength(catalog.SURFACE_CLASSES.length);
  });
});
