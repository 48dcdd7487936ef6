/**
 * Route-table rows of the routes that need no session (and of sign-out, which ends the one it
 * has): what each caller gets. A public route answers everyone alike; none may answer 401.
 */
import { randomBytes } from "node:crypto";
import { hashToken } from "../../server/auth/tokens";
import { invitations } from "../../server/db/schema";
import type { Caller, RouteCase, RouteFixture } from "./route-table";
import { uniqueEmail } from "./app";

const everyone = (status: number): Record<Caller, number> => ({
  owner: status,
  admin: status,
  engineer: status,
  gis: status,
  reviewer: status,
  viewer: status,
  anonymous: status,
});
const randomToken = () => randomBytes(32).toString("base64url");

/** An open invitation of the fixture team; answers the token its link carries. */
async function freshInvitationToken(f: RouteFixture): Promise<string> {
  const token = randomToken();
  await f.db.insert(invitations).values({
    teamId: f.team.id,
    email: uniqueEmail("route-public-invite"),
    role: "viewer",
    tokenHash: hashToken(token),
    invitedBy: f.team.members.owner.id,
    expiresAt: new Date(Date.now() + 3_600_000),
  });
  return token;
}

export const PUBLIC_ROUTE_CASES: RouteCase[] = [
  {
    method: "get",
    route: "/api/health",
    teamScoped: false,
    prepare: async () => ({ path: "/api/health" }),
    expected: everyone(200),
  },
  {
    method: "get",
    route: "/api/config",
    teamScoped: false,
    prepare: async () => ({ path: "/api/config" }),
    expected: everyone(200),
  },
  {
    method: "get",
    route: "/api/openapi.json",
    teamScoped: false,
    prepare: async () => ({ path: "/api/openapi.json" }),
    expected: everyone(200),
  },
  {
    method: "post",
    route: "/api/auth/sign-in",
    teamScoped: false,
    prepare: async () => ({
      path: "/api/auth/sign-in",
      body: { email: uniqueEmail("route-nobody"), password: "not anyone's password" },
    }),
    expected: everyone(401),
    code: "invalid_credentials",
  },
  {
    method: "post",
    route: "/api/auth/sign-up",
    teamScoped: false,
    prepare: async () => ({
      path: "/api/auth/sign-up",
      body: {
        email: uniqueEmail("route-signup"),
        name: "Route Table",
        password: "a long enough password",
        teamName: "Route table team",
      },
    }),
    expected: everyone(202),
  },
  {
    method: "post",
    route: "/api/auth/confirm-email",
    teamScoped: false,
    prepare: async () => ({ path: "/api/auth/confirm-email", body: { token: randomToken() } }),
    expected: everyone(404),
  },
  {
    method: "post",
    route: "/api/auth/password-reset/request",
    teamScoped: false,
    prepare: async () => ({
      path: "/api/auth/password-reset/request",
      body: { email: uniqueEmail("route-reset") },
    }),
    expected: everyone(202),
  },
  {
    method: "post",
    route: "/api/auth/password-reset/complete",
    teamScoped: false,
    prepare: async () => ({
      path: "/api/auth/password-reset/complete",
      body: { token: randomToken(), password: "a long enough password" },
    }),
    expected: everyone(404),
  },
  {
    method: "get",
    route: "/api/invitations/:token",
    teamScoped: false,
    prepare: async (f) => ({ path: `/api/invitations/${await freshInvitationToken(f)}` }),
    expected: everyone(200),
  },
  {
    method: "post",
    route: "/api/invitations/:token/accept",
    teamScoped: false,
    // An unknown link: accepting a real one would switch the caller's session to the invitee.
    prepare: async () => ({ path: `/api/invitations/${randomToken()}/accept`, body: {} }),
    expected: everyone(404),
  },
  {
    method: "post",
    route: "/api/auth/sign-out",
    teamScoped: false,
    freshSession: true,
    prepare: async () => ({ path: "/api/auth/sign-out" }),
    expected: { ...everyone(204), anonymous: 401 },
  },
];
