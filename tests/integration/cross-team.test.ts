import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import { freshProject } from "../support/route-table";

// Every operation × another team's member is in the authorization matrix (roles.test.ts); these
// are the cases around it.
let t: TestApp;
let teamId: string;
let projectId: string;
let ownerEmail: { email: string; password: string };
let outsider: Agent;

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "xteam-a");
  const other = await createTeam(t.db, "xteam-b");
  teamId = team.id;
  projectId = await freshProject(t.db, team.id);
  ownerEmail = team.members.owner;
  outsider = t.agent();
  await signIn(outsider, other.members.owner);
});
afterAll(() => t.close());

describe("another team's user", () => {
  it("gets the same 404 for a team or project that does not exist at all", async () => {
    const missingTeam = await outsider.get(`/api/teams/${randomUUID()}`);
    const missingProject = await outsider.get(`/api/projects/${randomUUID()}`);
    const foreign = await outsider.get(`/api/teams/${teamId}`);
    expect(missingTeam.status).toBe(404);
    expect(missingProject.status).toBe(404);
    expect(foreign.body).toEqual(missingTeam.body);
  });

  it("answers 404 for a malformed id rather than a validation error", async () => {
    expect((await outsider.get("/api/projects/not-a-uuid")).status).toBe(404);
    expect((await outsider.get("/api/teams/123/members")).status).toBe(404);
  });

  it("leaves the other team's project unchanged after the refused writes", async () => {
    const owner = t.agent();
    await signIn(owner, ownerEmail);
    const before = await owner.get(`/api/projects/${projectId}`);
    await outsider.patch(`/api/projects/${projectId}`).send({ name: "Taken over" });
    await outsider.delete(`/api/projects/${projectId}`);
    const after = await owner.get(`/api/projects/${projectId}`);
    expect(after.status).toBe(200);
    expect(after.body).toEqual(before.body);
  });
});
