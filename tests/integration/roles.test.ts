import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES } from "../../shared/roles";
import {
  createTeam,
  signIn,
  startTestApp,
  TEST_ORIGIN,
  type Agent,
  type TestApp,
} from "../support/app";
import {
  freshProject,
  outboxFixture,
  ROUTE_CASES,
  sendCase,
  type Caller,
  type RouteFixture,
} from "../support/route-table";

let t: TestApp;
let fixture: RouteFixture;
const agents = new Map<Caller, Agent>();

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "roles");
  fixture = {
    db: t.db,
    team,
    projectId: await freshProject(t.db, team.id),
    outboxId: await outboxFixture(t.db, team.id),
  };
  for (const role of ROLES) {
    const agent = t.agent();
    await signIn(agent, team.members[role]);
    agents.set(role, agent);
  }
  agents.set("anonymous", supertest.agent(t.app).set("Origin", TEST_ORIGIN));
});
afterAll(() => t.close());

const CALLERS: Caller[] = [...ROLES, "anonymous"];

describe.each(ROUTE_CASES)("$method $route", (routeCase) => {
  it.each(CALLERS.map((caller) => ({ caller, status: routeCase.expected[caller] })))(
    "$caller → $status",
    async ({ caller, status }) => {
      const agent = agents.get(caller);
      if (!agent) throw new Error(`no agent for ${caller}`);
      const res = await sendCase(agent, routeCase.method, await routeCase.prepare(fixture));
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      if (status >= 400) {
        const code = { 401: "unauthenticated", 403: "forbidden", 404: "not_found" }[status];
        expect(res.body.error.code).toBe(code);
      }
    },
  );
});
