/**
 * A request's database work is bounded: a statement past the request limit answers 503 (not a
 * hang), and a request whose client goes away has its running statement cancelled. A second
 * connection holds the subcatchment's row lock, so the request's UPDATE waits on it for as long
 * as the lock is held: a slow statement made on purpose, with no timing in the assertions.
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  sessionCookie,
  signIn,
  startTestApp,
  type TestApp,
  type TestTeam,
} from "../support/app";

let quick: TestApp;
let patient: TestApp;
let team: TestTeam;

beforeAll(async () => {
  quick = await startTestApp({ statementTimeoutMs: { request: 1000, job: 600_000 } });
  // Far longer than the test waits: only a cancel can end its statement in time.
  patient = await startTestApp({ statementTimeoutMs: { request: 120_000, job: 600_000 } });
  team = await createTeam(quick.db, "time-limits");
});
afterAll(async () => {
  await quick?.close();
  await patient?.close();
});

async function newSubcatchment(
  t: TestApp,
): Promise<{ id: string; agent: ReturnType<TestApp["agent"]> }> {
  const agent = t.agent();
  await signIn(agent, team.members.engineer);
  const project = await agent
    .post(`/api/teams/${team.id}/projects`)
    .send({ name: `Limits ${Math.random()}`, units: "si", designReturnPeriodYears: 10 });
  const sub = await agent
    .post(`/api/projects/${project.body.id as string}/subcatchments`)
    .send({ name: "Held", note: "as stored" });
  expect(sub.status).toBe(201);
  return { id: sub.body.id as string, agent };
}

/** A second connection holding the row lock until `release()`. */
async function holdRow(t: TestApp, id: string) {
  const holder = new pg.Client({ connectionString: t.config.databaseUrl });
  await holder.connect();
  await holder.query("begin");
  await holder.query("select 1 from subcatchments where id = $1 for update", [id]);
  const pid = (await holder.query<{ pid: number }>("select pg_backend_pid() as pid")).rows[0]?.pid;
  return {
    /** Backends waiting for this lock (the request's statement while it runs). */
    async waiting(): Promise<number[]> {
      const r = await holder.query<{ pid: number }>(
        "select pid from pg_stat_activity where $1 = any(pg_blocking_pids(pid))",
        [pid],
      );
      return r.rows.map((row) => row.pid);
    },
    async release() {
      await holder.query("rollback");
      await holder.end();
    },
  };
}

async function until<T>(what: string, probe: () => Promise<T>, ok: (v: T) => boolean) {
  for (let k = 0; k < 200; k += 1) {
    const v = await probe();
    if (ok(v)) return v;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`gave up waiting for ${what}`);
}

describe("database time limits", () => {
  it("answers 503 with a clear message when a statement passes the request limit", async () => {
    const { id, agent } = await newSubcatchment(quick);
    const lock = await holdRow(quick, id);
    try {
      const res = await agent
        .patch(`/api/subcatchments/${id}`)
        .send({ note: "changed", version: 1 });
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe("database_timeout");
      expect(res.body.error.message).toMatch(/took longer than the server allows/);
      expect(await lock.waiting()).toEqual([]);
    } finally {
      await lock.release();
    }
    const after = await agent.get(`/api/subcatchments/${id}`);
    expect(after.body.note).toBe("as stored");
  });

  it("cancels the running statement of a request whose client went away", async () => {
    const { id, agent } = await newSubcatchment(patient);
    const signedIn = await signIn(agent, team.members.engineer);
    const cookie = sessionCookie(signedIn)?.split(";")[0] ?? "";
    const server = http.createServer(patient.app);
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const lock = await holdRow(patient, id);
    try {
      const gone = new AbortController();
      const request = fetch(`${base}/api/subcatchments/${id}`, {
        method: "PATCH",
        headers: {
          cookie,
          origin: patient.config.publicBaseUrl,
          "content-type": "application/json",
        },
        body: JSON.stringify({ note: "changed", version: 1 }),
        signal: gone.signal,
      }).catch((err: unknown) => err);
      const [blocked] = await until(
        "the request to wait on the lock",
        lock.waiting,
        (p) => p.length === 1,
      );
      gone.abort();
      await request;
      await until("the statement to be cancelled", lock.waiting, (p) => p.length === 0);
      const state = await patient.pool.query<{ state: string }>(
        "select state from pg_stat_activity where pid = $1",
        [blocked],
      );
      expect(state.rows[0]?.state ?? "gone").not.toBe("active");
    } finally {
      await lock.release();
      await new Promise((resolve) => server.close(resolve));
    }
    const after = await agent.get(`/api/subcatchments/${id}`);
    expect(after.body.note).toBe("as stored");
  });
});
