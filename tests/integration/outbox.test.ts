import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  latestMailTo,
  signIn,
  startTestApp,
  uniqueEmail,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";

let t: TestApp;
let team: TestTeam;
let admin: Agent;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "outbox");
  admin = t.agent();
  await signIn(admin, team.members.admin);
});
afterAll(() => t.close());

describe("outbox", () => {
  it("shows an admin the mail the app sent, newest first, and each message in full", async () => {
    const email = uniqueEmail("outbox-invitee");
    await admin.post(`/api/teams/${team.id}/invitations`).send({ email, role: "viewer" });
    const stored = await latestMailTo(t.db, email);
    const list = await admin.get("/api/outbox");
    expect(list.status).toBe(200);
    const times = (list.body as { receivedAt: string }[]).map((m) => Date.parse(m.receivedAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    expect(list.body).toContainEqual({
      id: stored.id,
      to: email,
      from: expect.stringContaining("Rillmark"),
      subject: expect.stringContaining(team.name),
      receivedAt: expect.any(String),
    });
    const one = await admin.get(`/api/outbox/${stored.id}`);
    expect(one.status).toBe(200);
    expect(one.body.text).toContain("/invitations/");
    expect(one.body.html).toContain("<a href=");
  });

  it("is not there (404) when the app runs in production", async () => {
    const prod = await startTestApp({ outboxEnabled: false });
    try {
      const res = await supertest(prod.app).get("/api/outbox");
      expect(res.status).toBe(404);
      const config = await supertest(prod.app).get("/api/config");
      expect(config.body.outboxEnabled).toBe(false);
    } finally {
      await prod.close();
    }
  });
});
