import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  createTeam,
  createUser,
  latestMailTo,
  signIn,
  startTestApp,
  tokenFromMail,
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
  team = await createTeam(t.db, "invite");
  admin = t.agent();
  await signIn(admin, team.members.admin);
});
afterAll(() => t.close());

async function invite(email: string, role = "gis"): Promise<string> {
  const res = await admin.post(`/api/teams/${team.id}/invitations`).send({ email, role });
  expect(res.status).toBe(201);
  return tokenFromMail(await latestMailTo(t.db, email), "/invitations");
}

async function roleOf(email: string): Promise<string | undefined> {
  const members = await admin.get(`/api/teams/${team.id}/members`);
  return (members.body as { email: string; role: string }[]).find((m) => m.email === email)?.role;
}

describe("invitations", () => {
  it("e-mails a link whose preview names the team, role and inviter", async () => {
    const email = uniqueEmail("invitee");
    const token = await invite(email, "reviewer");
    const preview = await supertest(t.app).get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({
      teamName: team.name,
      email,
      role: "reviewer",
      invitedBy: team.members.admin.name,
      accountExists: false,
    });
  });

  it("lets a new person set a name and password, join with the role and be signed in", async () => {
    const email = uniqueEmail("newcomer");
    const token = await invite(email, "gis");
    const agent = t.agent();
    const res = await agent
      .post(`/api/invitations/${token}/accept`)
      .send({ name: "Noor Haddad", password: "a-long-password-1" });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email, name: "Noor Haddad" });
    expect(res.body.memberships).toEqual([{ teamId: team.id, teamName: team.name, role: "gis" }]);
    expect((await agent.get(`/api/teams/${team.id}`)).status).toBe(200);
    expect(await roleOf(email)).toBe("gis");
  });

  it("asks a new person for the missing name and password (422 with fields)", async () => {
    const token = await invite(uniqueEmail("nameless"));
    const res = await t.agent().post(`/api/invitations/${token}/accept`).send({});
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual({
      name: expect.any(String),
      password: expect.any(String),
    });
  });

  it("answers 409 account_exists to an existing account that is not signed in", async () => {
    const existing = await createUser(t.db, "invite-existing");
    const token = await invite(existing.email);
    const res = await t
      .agent()
      .post(`/api/invitations/${token}/accept`)
      .send({ name: "Someone", password: "a-long-password-1" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("account_exists");
  });

  it("adds an existing account that is signed in as the invited address", async () => {
    const existing = await createUser(t.db, "invite-signed-in");
    const token = await invite(existing.email, "viewer");
    const agent = t.agent();
    await signIn(agent, existing);
    const res = await agent.post(`/api/invitations/${token}/accept`).send({});
    expect(res.status).toBe(200);
    expect(res.body.memberships).toContainEqual({
      teamId: team.id,
      teamName: team.name,
      role: "viewer",
    });
  });

  it("works once: a second accept answers 410", async () => {
    const token = await invite(uniqueEmail("once"));
    const body = { name: "Once Only", password: "a-long-password-1" };
    expect((await t.agent().post(`/api/invitations/${token}/accept`).send(body)).status).toBe(200);
    const again = await t.agent().post(`/api/invitations/${token}/accept`).send(body);
    expect(again.status).toBe(410);
    expect((await supertest(t.app).get(`/api/invitations/${token}`)).status).toBe(410);
  });

  it("lists pending invitations and revokes one, after which its link answers 410", async () => {
    const email = uniqueEmail("revoked");
    const token = await invite(email);
    const list = await admin.get(`/api/teams/${team.id}/invitations`);
    const pending = (list.body as { id: string; email: string }[]).find((i) => i.email === email);
    expect(pending).toBeDefined();
    const del = await admin.delete(`/api/teams/${team.id}/invitations/${pending?.id ?? ""}`);
    expect(del.status).toBe(204);
    expect((await supertest(t.app).get(`/api/invitations/${token}`)).status).toBe(410);
    const after = await admin.get(`/api/teams/${team.id}/invitations`);
    expect((after.body as { email: string }[]).map((i) => i.email)).not.toContain(email);
  });

  it("replaces an open invitation to the same address: only the newest link works", async () => {
    const email = uniqueEmail("reinvite");
    const first = await invite(email);
    const second = await invite(email);
    expect(second).not.toBe(first);
    expect((await supertest(t.app).get(`/api/invitations/${first}`)).status).toBe(410);
    expect((await supertest(t.app).get(`/api/invitations/${second}`)).status).toBe(200);
  });

  it("answers 409 already_member when inviting someone already in the team", async () => {
    const res = await admin
      .post(`/api/teams/${team.id}/invitations`)
      .send({ email: team.members.viewer.email, role: "engineer" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("already_member");
  });

  it("does not let an admin invite an owner (403)", async () => {
    const res = await admin
      .post(`/api/teams/${team.id}/invitations`)
      .send({ email: uniqueEmail("would-be-owner"), role: "owner" });
    expect(res.status).toBe(403);
  });

  it("answers 404 for a link that was never issued", async () => {
    const res = await supertest(t.app).get(`/api/invitations/${"b".repeat(43)}`);
    expect(res.status).toBe(404);
  });
});
