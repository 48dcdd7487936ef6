import http from "node:http";
import type { AddressInfo } from "node:net";
import { gzipSync, brotliCompressSync } from "node:zlib";
import express from "express";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { hashPassword } from "../../server/auth/password";
import { hashToken, newToken } from "../../server/auth/tokens";
import { passwordResets, users } from "../../server/db/schema";
import { errorHandler } from "../../server/http/errors";
import {
  createTeam,
  createUser,
  signIn,
  startTestApp,
  uniqueEmail,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";
import { FileKit, geojsonText, lonLatPolygon } from "../support/layer-files";
import { leftovers, NOTHING, uploadLayer } from "../support/layers";
import { freshProject } from "../support/route-table";

let t: TestApp;
let team: TestTeam;
let owner: Agent;
let projectId: string;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "hygiene");
  owner = t.agent();
  await signIn(owner, team.members.owner);
  const created = await owner
    .post(`/api/teams/${team.id}/projects`)
    .send({ name: "Hygiene base", units: "si", designReturnPeriodYears: 10 });
  projectId = created.body.id as string;
});
afterAll(() => t.close());

const NUL = "a\u0000b";
const LONE = "a\uD800b";

describe("text that cannot be stored", () => {
  // Each JSON text field at its own route, as a user would send it.
  const cases: {
    name: string;
    send: (bad: string) => Promise<supertest.Response>;
    field: string | ((bad: string) => string);
  }[] = [
    {
      name: "project name",
      send: (bad) =>
        owner
          .post(`/api/teams/${team.id}/projects`)
          .send({ name: bad, units: "si", designReturnPeriodYears: 10 }),
      field: "name",
    },
    {
      name: "project description",
      send: (bad) => owner.patch(`/api/projects/${projectId}`).send({ description: bad }),
      field: "description",
    },
    {
      name: "account name",
      send: (bad) => owner.patch("/api/account").send({ name: bad }),
      field: "name",
    },
    {
      name: "sign-up team name",
      send: (bad) =>
        t
          .agent()
          .post("/api/auth/sign-up")
          .send({
            email: uniqueEmail("hygiene-signup"),
            name: "New Person",
            password: "long enough password",
            teamName: bad,
          }),
      field: "teamName",
    },
    {
      name: "sign-in password",
      send: (bad) =>
        t
          .agent()
          .post("/api/auth/sign-in")
          .send({ email: team.members.viewer.email, password: bad }),
      field: "password",
    },
    {
      name: "rainfall table source note",
      send: (bad) =>
        owner.post(`/api/projects/${projectId}/rainfall-tables`).send({
          name: "Invented IDF",
          sourceNote: bad,
          idf: { formula: { "10": { a: 1800, b: 12, c: 0.8 } } },
        }),
      field: "sourceNote",
    },
    {
      name: "a key deep in a body",
      send: (bad) =>
        owner.post(`/api/projects/${projectId}/rainfall-tables`).send({
          name: "Invented IDF",
          idf: { formula: { [bad]: { a: 1800, b: 12, c: 0.8 } } },
        }),
      field: (bad) => `idf.formula.${bad}`,
    },
  ];

  it.each(
    cases.flatMap((c) => [
      { ...c, bad: NUL, kind: "NUL" },
      { ...c, bad: LONE, kind: "lone surrogate" },
    ]),
  )(
    "answers 422 naming the field for a $kind in the $name, and logs nothing",
    async ({ send, bad, field }) => {
      const errors = vi.spyOn(console, "error");
      try {
        const res = await send(bad);
        expect(res.status, JSON.stringify(res.body)).toBe(422);
        expect(res.body.error.code).toBe("invalid_input");
        const named = typeof field === "string" ? field : field(bad);
        expect(Object.keys(res.body.error.fields as object)).toEqual([named]);
        expect(errors).not.toHaveBeenCalled();
      } finally {
        errors.mockRestore();
      }
    },
  );

  it("stores nothing: the refused project is not in the list", async () => {
    await owner
      .post(`/api/teams/${team.id}/projects`)
      .send({ name: `Refused ${NUL}`, units: "si", designReturnPeriodYears: 10 });
    const list = await owner.get(`/api/teams/${team.id}/projects`);
    expect((list.body as { name: string }[]).some((p) => p.name.startsWith("Refused"))).toBe(false);
  });

  it("checks query strings and multipart text fields the same way", async () => {
    const layers = await owner.get(
      `/api/projects/${projectId}/layers?x=${encodeURIComponent(NUL)}`,
    );
    expect(layers.status).toBe(422);
    expect(layers.body.error.fields).toEqual({ "query.x": expect.any(String) });
    const upload = await owner
      .post(`/api/projects/${projectId}/rainfall-tables/upload`)
      .field("name", NUL)
      .field("kind", "intensity")
      .attach("file", Buffer.from("duration_min / intensity,10-yr\n5,150\n10,120\n"), "idf.csv");
    expect(upload.status).toBe(422);
    expect(upload.body.error.fields).toEqual({ name: expect.any(String) });
  });

  it("answers a path name with a NUL as not found", async () => {
    const layer = await owner.get(`/api/layers/${"%00".repeat(3)}`);
    expect(layer.status).toBe(404);
  });
});

describe("text that cannot be stored in an uploaded layer's attributes", () => {
  const kit = new FileKit();
  afterAll(() => kit.close());
  const square = lonLatPolygon([
    [0, 0],
    [1, 0],
    [1, 1],
    [0, 0],
  ]);

  it.each([
    ["a NUL in a value", { C: "lawn", NOTE: NUL }, 'attribute "NOTE"'],
    ["a lone surrogate in a value", { C: LONE }, 'attribute "C"'],
    ["a NUL in a name", { [`N${NUL}`]: 1 }, 'attribute "Na?b"'],
  ])("%s: 422 naming the feature and attribute, nothing stored", async (_label, props, named) => {
    const gis = t.agent();
    await signIn(gis, team.members.gis);
    const project = await freshProject(t.db, team.id);
    const text = geojsonText([
      { geometry: square, properties: { C: "lawn" } },
      { geometry: square, properties: props },
    ]);
    const res = await uploadLayer(gis, project, {
      kind: "cover",
      file: kit.write("bad.geojson", text),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(res.body.error.code).toBe("unstorable-text");
    expect(res.body.error.message).toContain(`bad.geojson: feature 2, ${named}`);
    expect(await leftovers(t, project)).toEqual(NOTHING);
  });
});

describe("compressed request bodies", () => {
  // Raw bytes over a real socket: supertest would re-encode a Buffer body as JSON.
  let base = "";
  let server: http.Server | undefined;
  beforeAll(async () => {
    server = http.createServer(t.app);
    await new Promise<void>((resolve) => server?.listen(0, "127.0.0.1", resolve));
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((resolve) => server?.close(() => resolve())));

  const body = () =>
    JSON.stringify({ email: team.members.viewer.email, password: team.members.viewer.password });
  const post = async (encoding: string, data: Buffer) => {
    const res = await fetch(`${base}/api/auth/sign-in`, {
      method: "POST",
      headers: { "Content-Type": "application/json", "Content-Encoding": encoding },
      body: new Uint8Array(data),
    });
    return { status: res.status, body: (await res.json()) as { error: { code: string } } };
  };

  it("takes a gzip body", async () => {
    expect((await post("gzip", gzipSync(body()))).status).toBe(200);
  });

  it.each([
    ["br", () => brotliCompressSync(body())],
    ["zstd", () => Buffer.from(body())],
    ["gzip, gzip", () => gzipSync(gzipSync(body()))],
    ["deflate", () => Buffer.from(body())],
  ])("refuses Content-Encoding %s with 415", async (encoding, data) => {
    const res = await post(encoding, data());
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe("unsupported_encoding");
  });

  it.each([
    ["garbage", () => Buffer.from("not gzip at all")],
    ["truncated", () => gzipSync(body()).subarray(0, 12)],
  ])("answers 400 for a %s gzip body, not 500", async (_label, data) => {
    const errors = vi.spyOn(console, "error");
    try {
      const res = await post("gzip", data());
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe("invalid_body");
      expect(errors).not.toHaveBeenCalled();
    } finally {
      errors.mockRestore();
    }
  });
});

describe("types in JSON bodies", () => {
  it.each([true, "10", "1e1", [10]])(
    "refuses designReturnPeriodYears: %j instead of guessing a number",
    async (value) => {
      const created = await owner
        .post(`/api/teams/${team.id}/projects`)
        .send({ name: "Coerced", units: "si", designReturnPeriodYears: value });
      expect(created.status).toBe(422);
      expect(created.body.error.fields).toHaveProperty("designReturnPeriodYears");
      const patched = await owner
        .patch(`/api/projects/${projectId}`)
        .send({ designReturnPeriodYears: value });
      expect(patched.status).toBe(422);
    },
  );
});

describe("the error log", () => {
  it("prints neither password hashes, token hashes, query values nor link tokens", async () => {
    // Real database errors whose messages quote an argon2 hash and a token hash.
    const user = await createUser(t.db, "hygiene-log");
    const passwordHash = await hashPassword("a long secret password");
    const duplicateUser = await t.db
      .insert(users)
      .values({ email: user.email, name: "Twin", passwordHash })
      .catch((err: unknown) => err);
    const { tokenHash } = newToken();
    const row = { userId: user.id, tokenHash, expiresAt: new Date(Date.now() + 60_000) };
    await t.db.insert(passwordResets).values(row);
    const duplicateToken = await t.db
      .insert(passwordResets)
      .values(row)
      .catch((err: unknown) => err);
    expect(duplicateUser).toBeInstanceOf(Error);
    expect(duplicateToken).toBeInstanceOf(Error);

    const linkToken = newToken().token;
    const app = express();
    app.post("/api/invitations/:token/accept", (req) => {
      throw req.query.which === "user" ? duplicateUser : duplicateToken;
    });
    app.use(errorHandler);
    const logged: string[] = [];
    const errors = vi.spyOn(console, "error").mockImplementation((...args: unknown[]) => {
      logged.push(args.map(String).join(" "));
    });
    try {
      for (const which of ["user", "token"]) {
        const res = await supertest(app).post(
          `/api/invitations/${linkToken}/accept?which=${which}`,
        );
        expect(res.status).toBe(500);
      }
    } finally {
      errors.mockRestore();
    }
    const text = logged.join("\n");
    expect(text).toContain("Unhandled error on POST /api/invitations/[redacted]/accept");
    expect(text).toContain("users");
    for (const secret of [
      passwordHash,
      passwordHash.split("$").at(-1) ?? "",
      tokenHash,
      linkToken,
      hashToken(linkToken),
    ]) {
      expect(text).not.toContain(secret);
    }
  });
});
