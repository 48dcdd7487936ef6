/**
 * The authorization matrix: every operation of the published API document (GET /api/openapi.json)
 * × every role of the owning team × signed out × the owner of another team. A documented
 * operation without a case here fails, and so does a case for an operation no longer documented,
 * so a new route cannot skip the check.
 */
import { randomUUID } from "node:crypto";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openApiPath } from "../../server/openapi/mounted-routes";
import { ROLES, type Role } from "../../shared/roles";
import {
  createTeam,
  signIn,
  startTestApp,
  TEST_ORIGIN,
  type Agent,
  type TestApp,
  type TestTeam,
} from "../support/app";
import {
  freshProject,
  outboxFixture,
  ROUTE_CASES,
  sendCase,
  type Caller,
  type RouteCase,
  type RouteFixture,
} from "../support/route-table";

type Operation = { "x-rillmark-permission"?: string | null };
interface Doc {
  paths: Record<string, Record<string, Operation>>;
}
type MatrixCaller = Caller | "other team";

let t: TestApp;
let fixture: RouteFixture;
let otherTeam: TestTeam;
let doc: Doc;
const agents = new Map<MatrixCaller, Agent>();

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "matrix");
  otherTeam = await createTeam(t.db, "matrix-other");
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
  // The most powerful role there, and still nobody in the fixture's team.
  const outsider = t.agent();
  await signIn(outsider, otherTeam.members.owner);
  agents.set("other team", outsider);
  doc = (await supertest(t.app).get("/api/openapi.json")).body as Doc;
});
afterAll(() => t.close());

const operationOf = (c: RouteCase) =>
  `${c.method.toUpperCase()} ${openApiPath(c.route.replace(/^\/api/, ""))}`;
const documentedOperations = () =>
  Object.entries(doc.paths).flatMap(([p, ops]) =>
    Object.entries(ops).map(([m, op]) => ({ name: `${m.toUpperCase()} ${p}`, op })),
  );

const CALLERS: MatrixCaller[] = [...ROLES, "anonymous", "other team"];
const CODES: Record<number, string> = {
  401: "unauthenticated",
  403: "forbidden",
  404: "not_found",
};

/** What a caller must get: another team's member gets 404 on anything of the team. */
function expectedFor(c: RouteCase, caller: MatrixCaller): number {
  if (caller !== "other team") return c.expected[caller];
  return c.teamScoped ? 404 : c.expected.owner;
}

async function agentFor(c: RouteCase, caller: MatrixCaller): Promise<Agent> {
  if (c.freshSession && caller !== "anonymous") {
    const agent = t.agent();
    const user =
      caller === "other team" ? otherTeam.members.owner : fixture.team.members[caller as Role];
    await signIn(agent, user);
    return agent;
  }
  const agent = agents.get(caller);
  if (!agent) throw new Error(`no agent for ${caller}`);
  return agent;
}

describe("the authorization matrix", () => {
  it("has a case for every documented operation, and none for an undocumented one", () => {
    const documented = documentedOperations().map((o) => o.name);
    const covered = ROUTE_CASES.map(operationOf);
    expect(documented.length).toBeGreaterThan(70);
    expect(documented.filter((o) => !covered.includes(o))).toEqual([]);
    expect(covered.filter((o) => !documented.includes(o))).toEqual([]);
    expect(covered.length).toBe(new Set(covered).size);
  });

  it("checks another team's member on every operation that needs a team permission", () => {
    const teamOps = documentedOperations()
      .filter((o) => {
        const permission = o.op["x-rillmark-permission"];
        return typeof permission === "string" && permission !== "signed-in";
      })
      .map((o) => o.name);
    const scoped = ROUTE_CASES.filter((c) => c.teamScoped).map(operationOf);
    expect(teamOps.length).toBeGreaterThan(50);
    expect(teamOps.filter((o) => !scoped.includes(o))).toEqual([]);
  });

  it("answers signed-out callers 401 exactly where the document says a session is needed", () => {
    const ops = new Map(documentedOperations().map((o) => [o.name, o.op]));
    for (const c of ROUTE_CASES) {
      const needsSession = ops.get(operationOf(c))?.["x-rillmark-permission"] !== null;
      const refused = c.expected.anonymous === 401 && c.code === undefined;
      expect(refused, operationOf(c)).toBe(needsSession);
    }
  });
});

describe.each(ROUTE_CASES)("$method $route", (routeCase) => {
  it.each(CALLERS.map((caller) => ({ caller, status: expectedFor(routeCase, caller) })))(
    "$caller → $status",
    async ({ caller, status }) => {
      const agent = await agentFor(routeCase, caller);
      const prepared = await routeCase.prepare(fixture);
      const res = await sendCase(agent, routeCase.method, prepared);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      if (status >= 400) {
        expect(res.body.error.code).toBe(
          caller === "other team" && routeCase.teamScoped
            ? "not_found"
            : (routeCase.code ?? CODES[status]),
        );
      }
      if (caller === "other team" && routeCase.teamScoped) {
        // One "not found" whatever the reason: another team's object reads exactly like an
        // object that does not exist.
        const uuid = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;
        const unknown = { ...prepared, path: prepared.path.replace(uuid, () => randomUUID()) };
        const missing = await sendCase(agent, routeCase.method, unknown);
        expect(missing.status).toBe(404);
        expect(res.body).toEqual(missing.body);
      }
    },
  );
});
