import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import {
  freshProject,
  outboxFixture,
  ROUTE_CASES,
  sendCase,
  type RouteFixture,
} from "../support/route-table";
import { GEODATA_ROUTE_CASES } from "../support/route-table-geodata";
import { MAP_ROUTE_CASES } from "../support/route-table-map";

let t: TestApp;
let fixture: RouteFixture;
let outsider: Agent;

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "xteam-a");
  const other = await createTeam(t.db, "xteam-b");
  fixture = {
    db: t.db,
    team,
    projectId: await freshProject(t.db, team.id),
    outboxId: await outboxFixture(t.db, team.id),
  };
  // The other team's owner: the most powerful role there, and still nobody in team A.
  outsider = t.agent();
  await signIn(outsider, other.members.owner);
});
afterAll(() => t.close());

const TEAM_ROUTES = ROUTE_CASES.filter((c) => c.teamScoped);

describe("another team's user", () => {
  it("is checked on every team and project route of the API contract", () => {
    expect(TEAM_ROUTES.map((c) => `${c.method.toUpperCase()} ${c.route}`).sort()).toEqual(
      [
        "GET /api/teams/:teamId",
        "GET /api/teams/:teamId/members",
        "PATCH /api/teams/:teamId/members/:userId",
        "DELETE /api/teams/:teamId/members/:userId",
        "GET /api/teams/:teamId/invitations",
        "POST /api/teams/:teamId/invitations",
        "DELETE /api/teams/:teamId/invitations/:invitationId",
        "GET /api/teams/:teamId/projects",
        "POST /api/teams/:teamId/projects",
        "GET /api/projects/:projectId",
        "PATCH /api/projects/:projectId",
        "DELETE /api/projects/:projectId",
        "POST /api/projects/:projectId/layers",
        "GET /api/projects/:projectId/layers",
        "GET /api/layers/:layerId",
        "DELETE /api/layers/:layerId",
        "GET /api/layers/:layerId/features",
        "GET /api/layers/:layerId/fields/:field/values",
        "PUT /api/layers/:layerId/mapping",
        "GET /api/outbox/:id",
        ...GEODATA_ROUTE_CASES.map((c) => `${c.method.toUpperCase()} ${c.route}`),
        ...MAP_ROUTE_CASES.filter((c) => c.teamScoped).map(
          (c) => `${c.method.toUpperCase()} ${c.route}`,
        ),
      ].sort(),
    );
  });

  it.each(TEAM_ROUTES)("gets 404 not_found on $method $route", async (routeCase) => {
    const res = await sendCase(outsider, routeCase.method, await routeCase.prepare(fixture));
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("not_found");
  });

  it("gets the same 404 for a team or project that does not exist at all", async () => {
    const missingTeam = await outsider.get(`/api/teams/${randomUUID()}`);
    const missingProject = await outsider.get(`/api/projects/${randomUUID()}`);
    const foreign = await outsider.get(`/api/teams/${fixture.team.id}`);
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
    await signIn(owner, fixture.team.members.owner);
    const before = await owner.get(`/api/projects/${fixture.projectId}`);
    await outsider.patch(`/api/projects/${fixture.projectId}`).send({ name: "Taken over" });
    await outsider.delete(`/api/projects/${fixture.projectId}`);
    const after = await owner.get(`/api/projects/${fixture.projectId}`);
    expect(after.status).toBe(200);
    expect(after.body).toEqual(before.body);
  });
});
