import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../support/app";

let t: TestApp;
let dist: string;

beforeAll(async () => {
  // A stand-in for Vite's output: index.html plus one content-hashed asset.
  dist = mkdtempSync(path.join(tmpdir(), "rillmark-dist-"));
  mkdirSync(path.join(dist, "assets"));
  writeFileSync(
    path.join(dist, "index.html"),
    "<!doctype html><title>Rillmark</title><div id=root></div>",
  );
  writeFileSync(
    path.join(dist, "assets", "index-3f9a1c.js"),
    "console.log('client');\n".repeat(200),
  );
  writeFileSync(path.join(dist, "favicon.svg"), "<svg xmlns='http://www.w3.org/2000/svg'/>");
  t = await startTestApp({ clientDist: dist });
});
afterAll(async () => {
  await t.close();
  rmSync(dist, { recursive: true, force: true });
});

describe("serving the client", () => {
  it("answers client routes with index.html, revalidated on every load", async () => {
    for (const route of ["/", "/sign-in", "/teams/abc/projects", "/invitations/some-token"]) {
      const res = await supertest(t.app).get(route);
      expect(res.status, route).toBe(200);
      expect(res.text).toContain("<div id=root>");
      expect(res.headers["cache-control"]).toBe("no-cache");
    }
  });

  it("caches hashed assets for a year as immutable", async () => {
    const res = await supertest(t.app).get("/assets/index-3f9a1c.js");
    expect(res.status).toBe(200);
    expect(res.headers["cache-control"]).toContain("immutable");
    expect(res.headers["cache-control"]).toContain("max-age=31536000");
  });

  it("sends the client gzip-compressed to a browser that accepts it", async () => {
    const res = await supertest(t.app)
      .get("/assets/index-3f9a1c.js")
      .set("Accept-Encoding", "gzip");
    expect(res.headers["content-encoding"]).toBe("gzip");
    expect(res.text).toContain("console.log('client');");
  });

  it("answers a missing asset with 404, not the page", async () => {
    const res = await supertest(t.app).get("/assets/index-000000.js");
    expect(res.status).toBe(404);
    expect(res.text).not.toContain("<div id=root>");
  });

  it("answers a missing file outside assets/ with 404 too", async () => {
    const res = await supertest(t.app).get("/robots.txt");
    expect(res.status).toBe(404);
  });

  it("serves other files from the build without the immutable header", async () => {
    const res = await supertest(t.app).get("/favicon.svg");
    expect(res.status).toBe(200);
    expect(res.headers["cache-control"]).not.toContain("immutable");
  });

  it("keeps /api answers in JSON, never the page", async () => {
    const res = await supertest(t.app).get("/api/teams");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("not_found");
  });

  it("explains when the client has not been built", async () => {
    const bare = await startTestApp({ clientDist: path.join(dist, "missing") });
    try {
      const res = await supertest(bare.app).get("/sign-in");
      expect(res.status).toBe(503);
      expect(res.text).toMatch(/npm run build/);
    } finally {
      await bare.close();
    }
  });
});
