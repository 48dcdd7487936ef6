import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startRillmark, type RunningRillmark } from "../../server/main";
import { DEMO_PASSWORD } from "../../server/seed/demo";
import { sessionCookieOf } from "../support/app";

// The whole server as `npm start` runs it: migrations, demo seed, local mail server, HTTP.
let running: RunningRillmark;
beforeAll(async () => {
  running = await startRillmark({ port: 0, databaseUrl: process.env.DATABASE_URL ?? "" });
});
afterAll(() => running.close());

async function json(path: string, init: RequestInit = {}) {
  const res = await fetch(`${running.url}${path}`, {
    ...init,
    headers: { "Content-Type": "application/json", Origin: running.url, ...init.headers },
  });
  return { status: res.status, body: (await res.json()) as Record<string, unknown>, res };
}

describe("startRillmark", () => {
  it("listens on a free port when asked for port 0 and reports the real one", async () => {
    expect(running.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect(running.url).not.toMatch(/:0$/);
    expect(running.config.publicBaseUrl).toBe(running.url);
    expect((await json("/api/health")).body).toEqual({ ok: true });
  });

  it("has seeded the demo: the engineer signs in and sees the invented project", async () => {
    const signIn = await json("/api/auth/sign-in", {
      method: "POST",
      body: JSON.stringify({ email: "engineer@demo.rillmark.test", password: DEMO_PASSWORD }),
    });
    expect(signIn.status).toBe(200);
    const memberships = signIn.body.memberships as { teamId: string; role: string }[];
    expect(memberships[0]?.role).toBe("engineer");
    const cookie = sessionCookieOf(signIn.res);
    const list = await json(`/api/teams/${memberships[0]?.teamId}/projects`, {
      headers: { Cookie: cookie },
    });
    expect(list.status).toBe(200);
    expect((list.body as unknown as { name: string }[]).map((p) => p.name)).toContain(
      "Harrow Hill Terraces (invented demo)",
    );
  });

  it("started a local mail server that the app sends through, readable by its recipient", async () => {
    const asked = await json("/api/auth/password-reset/request", {
      method: "POST",
      body: JSON.stringify({ email: "viewer@demo.rillmark.test" }),
    });
    expect(asked.status).toBe(202);
    const viewer = await json("/api/auth/sign-in", {
      method: "POST",
      body: JSON.stringify({ email: "viewer@demo.rillmark.test", password: DEMO_PASSWORD }),
    });
    const cookie = sessionCookieOf(viewer.res);
    const deadline = Date.now() + 5000;
    let found = false;
    while (!found && Date.now() < deadline) {
      const outbox = await json("/api/outbox", { headers: { Cookie: cookie } });
      const messages = outbox.body as unknown as { to: string; subject: string }[];
      found = messages.some(
        (m) => m.to === "viewer@demo.rillmark.test" && /reset/i.test(m.subject),
      );
      if (!found) await new Promise((r) => setTimeout(r, 100));
    }
    expect(found).toBe(true);
  });
});
