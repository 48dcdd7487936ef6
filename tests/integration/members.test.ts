import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  addMember,
  createTeam,
  createUser,
  signIn,
  startTestApp,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";

let t: TestApp;
let team: TestTeam;
let owner: Agent;
let admin: Agent;

beforeAll(async () => {
  t = await startTestApp();
  team = await createTeam(t.db, "members");
  owner = t.agent();
  admin = t.agent();
  await signIn(owner, team.members.owner);
  await signIn(admin, team.members.admin);
});
afterAll(() => t.close());

async function newMember(role: "viewer" | "owner" | "admin" = "viewer") {
  const user = await createUser(t.db, `members-${role}`);
  await addMember(t.db, team.id, user.id, role);
  return user;
}

const membersPath = () => `/api/teams/${team.id}/members`;

describe("team members", () => {
  it("lists every member with name, e-mail, role and join date", async () => {
    const res = await admin.get(membersPath());
    expect(res.status).toBe(200);
    expect(res.body).toContainEqual({
      userId: team.members.gis.id,
      name: team.members.gis.name,
      email: team.members.gis.email,
      role: "gis",
      joinedAt: expect.any(String),
    });
    expect(res.body).toHaveLength(6);
  });

  it("lets an admin change a member's role", async () => {
    const user = await newMember();
    const res = await admin.patch(`${membersPath()}/${user.id}`).send({ role: "engineer" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ userId: user.id, role: "engineer" });
  });

  it("does not let an admin make someone an owner", async () => {
    const user = await newMember();
    const res = await admin.patch(`${membersPath()}/${user.id}`).send({ role: "owner" });
    expect(res.status).toBe(403);
  });

  it("does not let an admin demote or remove an owner", async () => {
    const second = await newMember("owner");
    expect(
      (await admin.patch(`${membersPath()}/${second.id}`).send({ role: "viewer" })).status,
    ).toBe(403);
    expect((await admin.delete(`${membersPath()}/${second.id}`)).status).toBe(403);
  });

  it("lets an owner make someone an owner", async () => {
    const user = await newMember();
    const res = await owner.patch(`${membersPath()}/${user.id}`).send({ role: "owner" });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe("owner");
  });

  it("refuses to demote or remove the last owner with 409 last_owner", async () => {
    const solo = await createTeam(t.db, "members-solo");
    const agent = t.agent();
    await signIn(agent, solo.members.owner);
    const path = `/api/teams/${solo.id}/members/${solo.members.owner.id}`;
    const demote = await agent.patch(path).send({ role: "admin" });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe("last_owner");
    expect((await agent.delete(path)).status).toBe(409);
  });

  it("removes a member, who then gets 404 on the team", async () => {
    const user = await newMember();
    const theirs = t.agent();
    await signIn(theirs, user);
    expect((await theirs.get(`/api/teams/${team.id}`)).status).toBe(200);
    expect((await admin.delete(`${membersPath()}/${user.id}`)).status).toBe(204);
    expect((await theirs.get(`/api/teams/${team.id}`)).status).toBe(404);
  });

  it("answers 404 for a user who is not a member and 422 for an unknown role", async () => {
    const stranger = await createUser(t.db, "members-stranger");
    expect(
      (await admin.patch(`${membersPath()}/${stranger.id}`).send({ role: "viewer" })).status,
    ).toBe(404);
    const bad = await admin
      .patch(`${membersPath()}/${team.members.viewer.id}`)
      .send({ role: "boss" });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.role).toBeDefined();
  });
});
