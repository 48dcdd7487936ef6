/**
 * Two app instances and a separate worker on one database and one S3 stand-in, as `npm start`
 * runs them (server/supervisor.ts) but in this process: each instance has its own database
 * pool, LISTEN connection, object-store client, terrain cache folder and upload folder, and
 * neither runs jobs; the worker (server/processes/worker.ts) does. Whatever one instance does
 * must be seen by the other through PostgreSQL and the shared store only.
 */
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import proj4 from "proj4";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { AppConfig } from "../../server/config";
import { connectDatabase, type Database } from "../../server/db/client";
import { startWorker, type RunningWorker } from "../../server/processes/worker";
import {
  newStandInCredentials,
  startStandIns,
  withStandIns,
  type RunningStandIns,
} from "../../server/standins";
import {
  createTeam,
  sessionCookie,
  signIn,
  startTestApp,
  testConfig,
  TEST_PASSWORD,
  type TestApp,
  type TestTeam,
} from "../support/app";
import { buildGeodataCase, type GeodataCase } from "../support/geodata-case";
import { FileKit, terrainTiff, UTM10N } from "../support/layer-files";
import { uploadLayer } from "../support/layers";
import { tileOf } from "../support/tiles";

const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-instances-"));
let database: Database;
let standIns: RunningStandIns;
let worker: RunningWorker;
let a: TestApp;
let b: TestApp;
let team: TestTeam;
let geodata: GeodataCase;
const kit = new FileKit();

/** Instance `name`'s config: the shared store and queue, its own cache and upload folders. */
function instanceConfig(shared: AppConfig, name: string): Partial<AppConfig> {
  return {
    storage: { ...shared.storage, cacheDir: path.join(dir, name, "cache") },
    uploads: { ...shared.uploads, dir: path.join(dir, name, "uploads"), waitMs: 0 },
    jobQueueSuffix: shared.jobQueueSuffix,
    rateLimits: { ...shared.rateLimits, signInPerAccount: 4 },
  };
}

beforeAll(async () => {
  const base = testConfig({}, dir);
  database = connectDatabase(base.databaseUrl, 2);
  const credentials = newStandInCredentials();
  standIns = await startStandIns({
    db: database.db,
    s3Dir: path.join(dir, "s3"),
    bucket: base.storage.bucket,
    s3Port: 0,
    smtpPort: 0,
    credentials,
  });
  const pointed = withStandIns(base, standIns, credentials);
  const shared: AppConfig = { ...base, storage: pointed.storage, smtp: pointed.smtp };
  worker = await startWorker({
    ...shared,
    uploads: { ...shared.uploads, dir: path.join(dir, "w") },
  });
  a = await startTestApp(instanceConfig(shared, "a"), { workers: false });
  b = await startTestApp(instanceConfig(shared, "b"), { workers: false });
  team = await createTeam(a.db, "instances");
  geodata = await buildGeodataCase(a, "instances");
}, 120_000);

afterAll(async () => {
  await a?.close();
  await b?.close();
  await worker?.close();
  await standIns?.close();
  await database?.pool.end();
  kit.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("two app instances and a worker", () => {
  it("accept a session made by the other", async () => {
    const signedIn = await signIn(a.agent(), team.members.engineer);
    const cookie = sessionCookie(signedIn)?.split(";")[0] ?? "";
    const me = await b.agent().get("/api/auth/me").set("Cookie", cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(team.members.engineer.email);
  });

  it("compute through one instance with terrain stored through the other", async () => {
    const engineer = b.agent();
    await signIn(engineer, geodata.team.members.engineer);
    const res = await engineer
      .post(`/api/subcatchments/${geodata.subcatchmentId}/compute`)
      .send({});
    expect(res.status).toBe(200);
    // Slopes sampled from the terrain file, which this instance had to fetch from the store.
    const segments = res.body.segments as { elevationSource: string }[];
    expect(segments.length).toBeGreaterThan(0);
    for (const s of segments) expect(s.elevationSource).toBe("terrain");
  });

  it("hear across instances that a layer uploaded through one is read by the worker", async () => {
    const gis = a.agent();
    await signIn(gis, geodata.team.members.gis);
    const file = await terrainTiff(kit, "instances.tif");
    // UPLOAD_WAIT_MS 0: the upload answers 202 at once; the other instance long-polls.
    const res = await uploadLayer(gis, geodata.projectId, {
      kind: "terrain",
      file,
      verticalUnit: "m",
    });
    expect(res.status).toBe(202);
    const viewer = b.agent();
    await signIn(viewer, geodata.team.members.viewer);
    const asked = Date.now();
    const polled = await viewer.get(`/api/layers/${res.body.id}?waitMs=25000`);
    expect(polled.body.status).toBe("ready");
    // Told by NOTIFY from the worker: well before the long-poll's own end (no polling).
    expect(Date.now() - asked).toBeLessThan(20_000);

    // Tiles through the other instance: its cache is empty, so the file comes from the store.
    const [lon = 0, lat = 0] = proj4(UTM10N, "EPSG:4326", [500_040, 4_100_030]);
    const at = tileOf(lon, lat, 17);
    const tile = await viewer.get(`/api/layers/${res.body.id}/terrain/${at.z}/${at.x}/${at.y}.png`);
    expect(tile.status).toBe(200);
    expect(tile.headers["content-type"]).toBe("image/png");
  });

  it("show mail sent by one instance in the other's Outbox", async () => {
    const admin = a.agent();
    await signIn(admin, team.members.admin);
    const invitee = `invitee-${Date.now()}@example.test`;
    const invited = await admin
      .post(`/api/teams/${team.id}/invitations`)
      .send({ email: invitee, role: "viewer" });
    expect(invited.status).toBe(201);
    const reader = b.agent();
    await signIn(reader, team.members.owner);
    let found = false;
    for (let k = 0; k < 50 && !found; k += 1) {
      const outbox = await reader.get("/api/outbox");
      found = (outbox.body as { to: string }[]).some((m) => m.to === invitee);
      if (!found) await new Promise((r) => setTimeout(r, 100));
    }
    expect(found).toBe(true);
  });

  // The counters live in PostgreSQL (docs/decisions/011-sign-in-limits.md).
  it("count sign-in failures made through either instance together", async () => {
    const who = { email: team.members.reviewer.email, password: `${TEST_PASSWORD}-wrong` };
    for (const app of [a, b, a, b]) {
      const res = await app.agent().post("/api/auth/sign-in").send(who);
      expect(res.status).toBe(401);
    }
    const fifth = await b.agent().post("/api/auth/sign-in").send(who);
    expect(fifth.status).toBe(429);
  });
});
