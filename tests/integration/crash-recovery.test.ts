/**
 * Crash recovery of the real multi-process server (`node server/main.ts`, as `npm start` runs
 * it): ten rounds of `kill -9` of an app process or the worker process while layers are being
 * uploaded and a flow path saved again and again. Afterwards every acknowledged write is there,
 * no layer is left queued or processing once the killed processes are back (the ingest sweep
 * resumes or fails interrupted reads), and the dead processes' temp folders are gone.
 */
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { connectDatabase, type Database } from "../../server/db/client";
import { projects } from "../../server/db/schema";
import { flowPaths, layers, subcatchments } from "../../server/db/schema-geodata";
import { createTeam, sessionCookieOf, TEST_PASSWORD, type TestTeam } from "../support/app";
import { SOIL_GEOJSON } from "../support/layer-files";

const ROUNDS = 10;
const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-crash-"));
const uploadsDir = path.join(dir, "uploads");
let server: ChildProcess;
let baseUrl = "";
let database: Database;
let team: TestTeam;
let projectId = "";
let subcatchmentId = "";
let cookie = "";

/** The supervisor's children by role, from ps (args end in `entry.ts <role>`). */
function children(): { pid: number; role: string }[] {
  const out = execFileSync("ps", ["-o", "pid=,args=", "--ppid", String(server.pid)], {
    encoding: "utf8",
  });
  return out
    .split("\n")
    .map((line) => /^\s*(\d+)\s.*entry\.ts (\w+)\s*$/.exec(line))
    .filter((m): m is RegExpExecArray => m !== null)
    .map((m) => ({ pid: Number(m[1]), role: m[2] ?? "" }));
}

async function until<T>(what: string, timeoutMs: number, probe: () => Promise<T | undefined>) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe().catch(() => undefined);
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

const api = (route: string, init: RequestInit = {}) =>
  fetch(`${baseUrl}/api${route}`, {
    ...init,
    headers: { Origin: baseUrl, Cookie: cookie, ...init.headers },
    signal: AbortSignal.timeout(15_000),
  });

beforeAll(async () => {
  const databaseUrl = process.env.DATABASE_URL ?? "";
  database = connectDatabase(databaseUrl, 2);
  server = spawn(process.execPath, ["--import", "tsx", "server/main.ts"], {
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      NODE_ENV: "test",
      PORT: "0",
      WEB_CONCURRENCY: "2",
      FAKE_S3_DIR: path.join(dir, "s3"),
      STORAGE_CACHE_DIR: path.join(dir, "cache"),
      UPLOAD_DIR: uploadsDir,
      UPLOAD_WAIT_MS: "0",
      JOB_QUEUE_SUFFIX: `-crash-${randomUUID().slice(0, 8)}`,
      SIGN_IN_LIMIT_PER_IP: "1000",
      CLIENT_DIST: "tests/support/no-client-build",
    },
    stdio: ["ignore", "pipe", "inherit"],
  });
  baseUrl = await new Promise<string>((resolve, reject) => {
    let seen = "";
    server.stdout?.on("data", (chunk: Buffer) => {
      seen += chunk.toString();
      const m = /Rillmark is running at (http:\/\/[\d.:]+)/.exec(seen);
      if (m?.[1]) resolve(m[1]);
    });
    server.once("exit", (code) => reject(new Error(`the server stopped (exit ${code})`)));
  });
  team = await createTeam(database.db, "crash");
  const [project] = await database.db
    .insert(projects)
    .values({ teamId: team.id, name: "Crash rounds", units: "si", designReturnPeriodYears: 10 })
    .returning();
  projectId = project?.id ?? "";
  const [sub] = await database.db
    .insert(subcatchments)
    .values({ projectId, name: "Path saves" })
    .returning();
  subcatchmentId = sub?.id ?? "";
  const signedIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: baseUrl },
    // The owner may both upload layers and edit the path.
    body: JSON.stringify({ email: team.members.owner.email, password: TEST_PASSWORD }),
  });
  expect(signedIn.status).toBe(200);
  cookie = sessionCookieOf(signedIn);
}, 240_000);

afterAll(async () => {
  if (server?.exitCode === null) {
    const exited = new Promise((r) => server.once("exit", r));
    server.kill("SIGTERM");
    await exited;
  }
  await database?.pool.end();
  rmSync(dir, { recursive: true, force: true });
});

describe("kill -9 during uploads and path saves", () => {
  it("keeps every acknowledged write and leaves no layer processing", async () => {
    const acknowledgedLayers: string[] = [];
    let acknowledgedVersion = 0;
    let version = 0;
    const upload = async (k: number) => {
      const form = new FormData();
      form.append("kind", "soil");
      form.append("name", `round ${k}`);
      form.append("file", new Blob([SOIL_GEOJSON]), "soils.geojson");
      const res = await api(`/projects/${projectId}/layers`, { method: "POST", body: form });
      if (res.status === 201 || res.status === 202) {
        acknowledgedLayers.push(((await res.json()) as { id: string }).id);
      }
    };
    const savePaths = async (untilMs: number) => {
      while (Date.now() < untilMs) {
        const x = 0.001 * (version + 1);
        const res = await api(`/subcatchments/${subcatchmentId}/flow-path`, {
          method: "PUT",
          headers: { "Content-Type": "application/json" },
          body: JSON.stringify({
            geometry: {
              type: "LineString",
              coordinates: [
                [x, 0],
                [x + 0.001, 0.001],
              ],
            },
            version,
          }),
        }).catch(() => undefined);
        if (res?.status === 200) {
          version = ((await res.json()) as { flowPath: { version: number } }).flowPath.version;
          acknowledgedVersion = version;
        } else if (res?.status === 409) {
          const now = await database.db
            .select({ version: flowPaths.version })
            .from(flowPaths)
            .where(eq(flowPaths.subcatchmentId, subcatchmentId));
          version = now[0]?.version ?? 0;
        }
      }
    };

    for (let round = 0; round < ROUNDS; round += 1) {
      const role = round % 2 === 0 ? "web" : "worker";
      const victim = await until(`a ${role} process`, 60_000, async () =>
        children().find((c) => c.role === role),
      );
      const work = Promise.all([
        upload(2 * round).catch(() => undefined),
        upload(2 * round + 1).catch(() => undefined),
        savePaths(Date.now() + 1500),
      ]);
      await new Promise((r) => setTimeout(r, 300 + 100 * (round % 4)));
      process.kill(victim.pid, "SIGKILL");
      await work;
    }

    // Back: two app processes and a worker again, and then no unsettled layer of ours.
    await until("the killed processes to be back", 90_000, async () => {
      const roles = children().map((c) => c.role);
      const webs = roles.filter((r) => r === "web").length;
      return webs === 2 && roles.includes("worker") ? true : undefined;
    });
    await until("every layer to settle", 60_000, async () => {
      const open = await database.db
        .select({ id: layers.id })
        .from(layers)
        .where(
          and(eq(layers.projectId, projectId), inArray(layers.status, ["queued", "processing"])),
        );
      return open.length === 0 ? true : undefined;
    });

    expect(acknowledgedLayers.length).toBeGreaterThan(0);
    const stored = await database.db
      .select({ id: layers.id, status: layers.status })
      .from(layers)
      .where(inArray(layers.id, acknowledgedLayers));
    expect(stored.map((l) => l.id).sort()).toEqual([...acknowledgedLayers].sort());
    expect(stored.filter((l) => l.status === "ready").length).toBeGreaterThan(0);

    const [pathRow] = await database.db
      .select({ version: flowPaths.version })
      .from(flowPaths)
      .where(eq(flowPaths.subcatchmentId, subcatchmentId));
    expect(acknowledgedVersion).toBeGreaterThan(0);
    expect(pathRow?.version ?? 0).toBeGreaterThanOrEqual(acknowledgedVersion);

    // Temp folders of killed processes are removed (at a process start or the worker's sweep).
    const alive = new Set(children().map((c) => String(c.pid)));
    await until("dead processes' temp folders to go", 30_000, async () => {
      const names = readdirSync(uploadsDir, { withFileTypes: true }).filter((e) => e.isDirectory());
      const left = names.filter((e) => !alive.has(e.name.split("-").pop() ?? ""));
      return left.length === 0 ? true : undefined;
    });
  }, 300_000);
});
