/**
 * The project's subcatchment list carries each stored sheet's summary (governing Tc, method,
 * state), so the overview needs no sheet of its own. The checks compare the list with the
 * stored sheet the same server answers.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TravelTimeSheet } from "../../shared/schemas/sheet";
import type { SubcatchmentListItem } from "../../shared/schemas/subcatchments";
import { subcatchmentListItemSchema } from "../../shared/schemas/subcatchments";
import { PATH } from "../fixtures/geo/scenario";
import { startTestApp, type TestApp } from "../support/app";
import { buildGeodataCase, type GeodataCase } from "../support/geodata-case";

let t: TestApp;
let c: GeodataCase;

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "summary");
});
afterAll(() => t.close());

async function listed(id: string): Promise<SubcatchmentListItem | undefined> {
  const res = await c.engineer.get(`/api/projects/${c.projectId}/subcatchments`);
  expect(res.status).toBe(200);
  const items = (res.body as unknown[]).map((x) => subcatchmentListItemSchema.parse(x));
  return items.find((s) => s.id === id);
}

describe("subcatchment list summaries", () => {
  it("has no result before the first compute, with or without a path", async () => {
    const bare = await c.engineer
      .post(`/api/projects/${c.projectId}/subcatchments`)
      .send({ name: "Invented area without a path" });
    expect(bare.status).toBe(201);
    expect((await listed(bare.body.id))?.result).toBeNull();
    const withPath = await listed(c.subcatchmentId);
    expect(withPath?.flowPath).not.toBeNull();
    expect(withPath?.result).toBeNull();
  });

  it("after compute, gives the stored sheet's governing Tc, method, path version and time", async () => {
    const res = await c.engineer.post(`/api/subcatchments/${c.subcatchmentId}/compute`).send({});
    expect(res.status).toBe(200);
    const stored = await c.engineer.get(`/api/subcatchments/${c.subcatchmentId}/sheet`);
    const sheet = stored.body as TravelTimeSheet;
    expect(sheet.governing).not.toBeNull();
    expect((await listed(c.subcatchmentId))?.result).toEqual({
      governingTcMin: sheet.governing?.tcMin,
      governingMethodLabel: sheet.governing?.label,
      problem: null,
      computedAt: sheet.computedAt,
      flowPathVersion: sheet.flowPathVersion,
      stale: false,
    });
  });

  it("marks the result stale once the path changes, keeping the version it was computed on", async () => {
    const before = await listed(c.subcatchmentId);
    const version = before?.flowPath?.version ?? 0;
    const put = await c.engineer
      .put(`/api/subcatchments/${c.subcatchmentId}/flow-path`)
      .send({ geometry: PATH.geometry, version });
    expect(put.status).toBe(200);
    const after = await listed(c.subcatchmentId);
    expect(after?.flowPath?.version).toBe(version + 1);
    expect(after?.result).toMatchObject({ flowPathVersion: version, stale: true });
    expect(after?.result?.governingTcMin).toBe(before?.result?.governingTcMin);
  });
});
