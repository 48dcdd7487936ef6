import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { rainfallTables } from "../../server/db/schema-geodata";
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
  team = await createTeam(t.db, "rainfall");
  engineer = t.agent();
  await signIn(engineer, team.members.engineer);
});
afterAll(() => t.close());

// Invented demo numbers (a table shaped like a real IDF table, not taken from any atlas).
const table = {
  durationsMin: [5, 10, 15, 30, 60, 120],
  returnPeriodsYears: [2, 10, 100],
  intensity: [
    [120, 165, 230],
    [95, 132, 185],
    [80, 112, 158],
    [55, 78, 110],
    [35, 50, 72],
    [21, 30, 44],
  ],
};

describe("Rainfall tables (JSON)", () => {
  it("stores a table in the project's units with its source note and answers its Sherman fit", async () => {
    const projectId = await freshProject(t.db, team.id);
    const res = await engineer.post(`/api/projects/${projectId}/rainfall-tables`).send({
      name: "Invented IDF",
      sourceNote: "Invented for a test",
      p2_24h: 60,
      idf: table,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ name: "Invented IDF", units: "si", p2_24h: 60 });
    expect(res.body.fit).toHaveLength(3);
    for (const fit of res.body.fit) {
      expect(fit.rSquared).toBeGreaterThan(0.95);
      expect(fit.maxRelativeError).toBeGreaterThanOrEqual(0);
    }
    const list = await engineer.get(`/api/projects/${projectId}/rainfall-tables`);
    expect(list.body.map((x: { id: string }) => x.id)).toEqual([res.body.id]);
  });

  it("stores Sherman formulas and answers no fit for them", async () => {
    const projectId = await freshProject(t.db, team.id);
    const res = await engineer.post(`/api/projects/${projectId}/rainfall-tables`).send({
      name: "Formulas",
      idf: { formula: { "10": { a: 1800, b: 12, c: 0.8 } } },
    });
    expect(res.status).toBe(201);
    expect(res.body.fit).toBeNull();
  });

  it("refuses an intensity rising with duration, naming the cell, and stores nothing", async () => {
    const projectId = await freshProject(t.db, team.id);
    const bad = structuredClone(table);
    bad.intensity[2] = [99, 140, 190];
    const res = await engineer
      .post(`/api/projects/${projectId}/rainfall-tables`)
      .send({ name: "Bad", idf: bad });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["idf.intensity.2.0"]).toMatch(/must not rise with duration/);
    const rows = await t.db
      .select()
      .from(rainfallTables)
      .where(eq(rainfallTables.projectId, projectId));
    expect(rows).toEqual([]);
  });

  it("renames, then deletes a table", async () => {
    const projectId = await freshProject(t.db, team.id);
    const made = await engineer
      .post(`/api/projects/${projectId}/rainfall-tables`)
      .send({ name: "First", idf: table });
    const patched = await engineer
      .patch(`/api/rainfall-tables/${made.body.id}`)
      .send({ name: "Second", sourceNote: "checked" });
    expect(patched.body).toMatchObject({ name: "Second", sourceNote: "checked" });
    expect((await engineer.delete(`/api/rainfall-tables/${made.body.id}`)).status).toBe(204);
    expect((await engineer.get(`/api/rainfall-tables/${made.body.id}`)).status).toBe(404);
  });
});
