import { randomBytes } from "node:crypto";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { hashToken } from "../../server/auth/tokens";
import type { Db } from "../../server/db/client";
import { invitations, outboxMessages, projects } from "../../server/db/schema";
import { layers } from "../../server/db/schema-geodata";
import type { Role } from "../../shared/roles";
import {
  addMember,
  createUser,
  TEST_PASSWORD,
  uniqueEmail,
  type Agent,
  type TestTeam,
} from "./app";
import { GEODATA_ROUTE_CASES } from "./route-table-geodata";
import { MAP_ROUTE_CASES } from "./route-table-map";
import { PUBLIC_ROUTE_CASES } from "./route-table-public";

/** The objects a route case acts on: one team (one member per role) with one project. */
export interface RouteFixture {
  db: Db;
  team: TestTeam;
  projectId: string;
  outboxId: string;
}

export type Caller = Role | "anonymous";

/** A multipart body: text fields, then one file (upload routes). */
export interface RouteUpload {
  fields: Record<string, string>;
  file: string;
}

export interface RouteCase {
  method: "get" | "post" | "put" | "patch" | "delete";
  /** The route as the API contract writes it. */
  route: string;
  /** Team and project routes must answer 404 to members of other teams. */
  teamScoped: boolean;
  /** Builds the concrete request; destructive cases make a fresh target each time. */
  prepare(f: RouteFixture): Promise<{ path: string; body?: object; upload?: RouteUpload }>;
  expected: Record<Caller, number>;
  /** The error code of a refusal when it is not the usual one for its status. */
  code?: string;
  /** The route ends the caller's session (sign-out): each call gets a session of its own. */
  freshSession?: boolean;
}

const table = (
  owner: number,
  admin: number,
  engineer: number,
  gis: number,
  reviewer: number,
  viewer: number,
): Record<Caller, number> => ({ owner, admin, engineer, gis, reviewer, viewer, anonymous: 401 });

async function freshMember(f: RouteFixture): Promise<string> {
  const user = await createUser(f.db, "route-target");
  await addMember(f.db, f.team.id, user.id, "viewer");
  return user.id;
}

async function freshInvitation(f: RouteFixture): Promise<string> {
  const [row] = await f.db
    .insert(invitations)
    .values({
      teamId: f.team.id,
      email: uniqueEmail("route-invite"),
      role: "viewer",
      tokenHash: hashToken(randomBytes(32).toString("base64url")),
      invitedBy: f.team.members.owner.id,
      expiresAt: new Date(Date.now() + 3_600_000),
    })
    .returning({ id: invitations.id });
  if (!row) throw new Error("invitation insert returned no row");
  return row.id;
}

export async function freshProject(db: Db, teamId: string): Promise<string> {
  const [row] = await db
    .insert(projects)
    .values({ teamId, name: "Route test project", units: "si", designReturnPeriodYears: 10 })
    .returning({ id: projects.id });
  if (!row) throw new Error("project insert returned no row");
  return row.id;
}

/** A message sent for the team (as an invitation is): its managers read it, nobody else. */
export async function outboxFixture(db: Db, teamId: string): Promise<string> {
  const [row] = await db
    .insert(outboxMessages)
    .values({
      teamId,
      to: uniqueEmail("route-mail"),
      from: "x@example.test",
      subject: "s",
      text: "t",
      raw: "r",
    })
    .returning({ id: outboxMessages.id });
  if (!row) throw new Error("outbox insert returned no row");
  return row.id;
}

/** A ready cover layer with one field and no features, straight in the database. */
export async function freshLayer(db: Db, projectId: string): Promise<string> {
  const [row] = await db
    .insert(layers)
    .values({
      projectId,
      kind: "cover",
      name: "Route test layer",
      format: "geojson",
      originalFilename: "route.geojson",
      sizeBytes: 1,
      status: "ready",
      fields: ["C"],
    })
    .returning({ id: layers.id });
  if (!row) throw new Error("layer insert returned no row");
  return row.id;
}

let routeUploadFile: string | undefined;
function smallGeoJson(): string {
  if (!routeUploadFile) {
    routeUploadFile = path.join(
      mkdtempSync(path.join(os.tmpdir(), "rillmark-route-")),
      "a.geojson",
    );
    const ring = [
      [-122.4, 37.7],
      [-122.399, 37.7],
      [-122.399, 37.701],
      [-122.4, 37.7],
    ];
    const geometry = { type: "Polygon", coordinates: [ring] };
    const feature = { type: "Feature", geometry, properties: { C: "lawn" } };
    writeFileSync(
      routeUploadFile,
      JSON.stringify({ type: "FeatureCollection", features: [feature] }),
    );
  }
  return routeUploadFile;
}

const project = { name: "Culvert study", units: "us", designReturnPeriodYears: 10 };

/** Every documented API operation, with the status each caller must get. */
export const ROUTE_CASES: RouteCase[] = [
  {
    method: "get",
    route: "/api/auth/me",
    teamScoped: false,
    prepare: async () => ({ path: "/api/auth/me" }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "get",
    route: "/api/account",
    teamScoped: false,
    prepare: async () => ({ path: "/api/account" }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "patch",
    route: "/api/account",
    teamScoped: false,
    prepare: async () => ({ path: "/api/account", body: { name: "Renamed by the route table" } }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "post",
    route: "/api/account/password",
    teamScoped: false,
    // Same password again: the route runs fully, and later sign-ins still work.
    prepare: async () => ({
      path: "/api/account/password",
      body: { currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD },
    }),
    expected: table(204, 204, 204, 204, 204, 204),
  },
  {
    method: "get",
    route: "/api/teams/:teamId",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${f.team.id}` }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "get",
    route: "/api/teams/:teamId/members",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${f.team.id}/members` }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "patch",
    route: "/api/teams/:teamId/members/:userId",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/teams/${f.team.id}/members/${await freshMember(f)}`,
      body: { role: "reviewer" },
    }),
    expected: table(200, 200, 403, 403, 403, 403),
  },
  {
    method: "delete",
    route: "/api/teams/:teamId/members/:userId",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${f.team.id}/members/${await freshMember(f)}` }),
    expected: table(204, 204, 403, 403, 403, 403),
  },
  {
    method: "get",
    route: "/api/teams/:teamId/invitations",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${f.team.id}/invitations` }),
    expected: table(200, 200, 403, 403, 403, 403),
  },
  {
    method: "post",
    route: "/api/teams/:teamId/invitations",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/teams/${f.team.id}/invitations`,
      body: { email: uniqueEmail("route-invitee"), role: "viewer" },
    }),
    expected: table(201, 201, 403, 403, 403, 403),
  },
  {
    method: "delete",
    route: "/api/teams/:teamId/invitations/:invitationId",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/teams/${f.team.id}/invitations/${await freshInvitation(f)}`,
    }),
    expected: table(204, 204, 403, 403, 403, 403),
  },
  {
    method: "get",
    route: "/api/teams/:teamId/projects",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${f.team.id}/projects` }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "post",
    route: "/api/teams/:teamId/projects",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${f.team.id}/projects`, body: project }),
    expected: table(201, 201, 201, 403, 403, 403),
  },
  {
    method: "get",
    route: "/api/projects/:projectId",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}` }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "patch",
    route: "/api/projects/:projectId",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}`,
      body: { description: "Updated by the route table." },
    }),
    expected: table(200, 200, 200, 403, 403, 403),
  },
  {
    method: "delete",
    route: "/api/projects/:projectId",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${await freshProject(f.db, f.team.id)}` }),
    expected: table(204, 204, 403, 403, 403, 403),
  },
  {
    method: "get",
    route: "/api/outbox",
    teamScoped: false,
    // Everyone has a mailbox there (their own mail); what is in it is tested in outbox.test.ts.
    prepare: async () => ({ path: "/api/outbox" }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "get",
    route: "/api/outbox/:id",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/outbox/${f.outboxId}` }),
    expected: table(200, 200, 404, 404, 404, 404),
  },
  {
    method: "post",
    route: "/api/projects/:projectId/layers",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}/layers`,
      upload: { fields: { kind: "cover" }, file: smallGeoJson() },
    }),
    expected: table(201, 201, 403, 201, 403, 403),
  },
  {
    method: "get",
    route: "/api/projects/:projectId/layers",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}/layers` }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "get",
    route: "/api/layers/:layerId",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/layers/${await freshLayer(f.db, f.projectId)}` }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "delete",
    route: "/api/layers/:layerId",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/layers/${await freshLayer(f.db, f.projectId)}` }),
    expected: table(204, 204, 403, 204, 403, 403),
  },
  {
    method: "get",
    route: "/api/layers/:layerId/features",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/layers/${await freshLayer(f.db, f.projectId)}/features`,
    }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "get",
    route: "/api/layers/:layerId/fields/:field/values",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/layers/${await freshLayer(f.db, f.projectId)}/fields/C/values`,
    }),
    expected: table(200, 200, 200, 200, 200, 200),
  },
  {
    method: "put",
    route: "/api/layers/:layerId/mapping",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/layers/${await freshLayer(f.db, f.projectId)}/mapping`,
      body: { field: "C", entries: [] },
    }),
    expected: table(200, 200, 403, 200, 403, 403),
  },
  ...GEODATA_ROUTE_CASES,
  ...MAP_ROUTE_CASES,
  ...PUBLIC_ROUTE_CASES,
];

/** Sends a route case's request: JSON body, multipart upload, or neither. */
export function sendCase(
  agent: Agent,
  method: RouteCase["method"],
  prepared: { path: string; body?: object; upload?: RouteUpload },
) {
  const req = agent[method](prepared.path);
  if (prepared.upload) {
    // The whole multipart body in one buffer, sent with the headers: a route that refuses the
    // caller before reading the body (401/403) must not race the client still streaming the
    // file (write EPIPE instead of the answer).
    const boundary = `rillmark-${randomBytes(8).toString("hex")}`;
    const parts: Buffer[] = [];
    for (const [name, value] of Object.entries(prepared.upload.fields)) {
      parts.push(
        Buffer.from(
          `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`,
        ),
      );
    }
    const fileName = path.basename(prepared.upload.file);
    parts.push(
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\n` +
          "Content-Type: application/octet-stream\r\n\r\n",
      ),
      readFileSync(prepared.upload.file),
      Buffer.from(`\r\n--${boundary}--\r\n`),
    );
    return req
      .set("Content-Type", `multipart/form-data; boundary=${boundary}`)
      .send(Buffer.concat(parts));
  }
  return prepared.body === undefined ? req : req.send(prepared.body);
}
