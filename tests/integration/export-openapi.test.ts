import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mountedRoutes, openApiPath } from "../../server/openapi/mounted-routes";
import { startTestApp, type TestApp } from "../support/app";

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

interface Doc {
  openapi: string;
  paths: Record<string, Record<string, { summary?: string; responses: object }>>;
}

describe("OpenAPI document", () => {
  it("is served without a session and is OpenAPI 3.1", async () => {
    const res = await t.agent().get("/api/openapi.json");
    expect(res.status).toBe(200);
    expect((res.body as Doc).openapi).toBe("3.1.0");
  });

  it("documents every route the app mounts, and nothing it does not", async () => {
    const doc = (await t.agent().get("/api/openapi.json")).body as Doc;
    const mounted = mountedRoutes(t.app).map(
      (r) => `${r.method.toUpperCase()} ${openApiPath(r.path.replace(/^\/api/, ""))}`,
    );
    expect(mounted.length).toBeGreaterThan(50);
    const documented = Object.entries(doc.paths).flatMap(([p, ops]) =>
      Object.keys(ops).map((m) => `${m.toUpperCase()} ${p}`),
    );
    expect(mounted.filter((r) => !documented.includes(r))).toEqual([]);
    expect(documented.filter((r) => !mounted.includes(r))).toEqual([]);
    for (const [p, ops] of Object.entries(doc.paths)) {
      for (const [m, op] of Object.entries(ops)) expect(op.summary, `${m} ${p}`).toBeTruthy();
    }
  });
});
