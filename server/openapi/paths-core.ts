/** The document entries of the routes that came before the geodata pipeline, and of layers. */
import { z } from "zod";
import {
  acceptInvitationBody,
  changePasswordBody,
  invitationPreviewSchema,
  publicConfigSchema,
  resetCompleteBody,
  resetRequestBody,
  sessionInfoSchema,
  signInBody,
  signUpBody,
  tokenBody,
  updateAccountBody,
  userSchema,
} from "../../shared/schemas/auth";
import {
  coverMappingBody,
  fieldValuesSchema,
  layerPollQuery,
  layerSchema,
  soilMappingBody,
  uploadLayerFields,
} from "../../shared/schemas/layers";
import { outboxMessageSchema, outboxMessageSummarySchema } from "../../shared/schemas/outbox";
import { createProjectBody, projectSchema, updateProjectBody } from "../../shared/schemas/projects";
import {
  changeRoleBody,
  invitationSchema,
  inviteBody,
  memberSchema,
  teamSchema,
} from "../../shared/schemas/team";
import type { ApiDocs } from "./registry";

export function registerCorePaths(d: ApiDocs): void {
  const ok = z.object({ ok: z.literal(true) });
  d.route("get", "/health", {
    summary: "Health check (database reachable)",
    tag: "Service",
    permission: null,
  });
  d.route("get", "/config", {
    summary: "Public settings the client needs",
    tag: "Service",
    permission: null,
    response: publicConfigSchema,
  });
  d.route("get", "/openapi.json", {
    summary: "This document (OpenAPI 3.1)",
    tag: "Service",
    permission: null,
  });

  d.route("post", "/auth/sign-in", {
    summary: "Sign in with e-mail and password",
    tag: "Account",
    permission: null,
    body: signInBody,
    response: sessionInfoSchema,
  });
  d.route("post", "/auth/sign-out", {
    summary: "Sign out",
    tag: "Account",
    permission: "signed-in",
    status: 204,
  });
  d.route("get", "/auth/me", {
    summary: "The signed-in user and their teams",
    tag: "Account",
    permission: "signed-in",
    response: sessionInfoSchema,
  });
  d.route("post", "/auth/sign-up", {
    summary: "Ask for an account (a confirmation mail is sent)",
    tag: "Account",
    permission: null,
    body: signUpBody,
    status: 202,
  });
  d.route("post", "/auth/confirm-email", {
    summary: "Confirm a sign-up: makes the account and its team",
    tag: "Account",
    permission: null,
    body: tokenBody,
    response: sessionInfoSchema,
    status: 201,
  });
  d.route("post", "/auth/password-reset/request", {
    summary: "Ask for a password-reset mail",
    tag: "Account",
    permission: null,
    body: resetRequestBody,
    status: 202,
  });
  d.route("post", "/auth/password-reset/complete", {
    summary: "Set a new password with a reset link",
    tag: "Account",
    permission: null,
    body: resetCompleteBody,
    response: ok,
  });
  d.route("get", "/account", {
    summary: "The signed-in user's account",
    tag: "Account",
    permission: "signed-in",
    response: userSchema,
  });
  d.route("patch", "/account", {
    summary: "Change the account's name",
    tag: "Account",
    permission: "signed-in",
    body: updateAccountBody,
    response: userSchema,
  });
  d.route("post", "/account/password", {
    summary: "Change the password",
    tag: "Account",
    permission: "signed-in",
    body: changePasswordBody,
    status: 204,
  });

  d.route("get", "/invitations/:token", {
    summary: "What an invitation link offers",
    tag: "Teams",
    permission: null,
    response: invitationPreviewSchema,
  });
  d.route("post", "/invitations/:token/accept", {
    summary: "Accept an invitation",
    tag: "Teams",
    permission: null,
    body: acceptInvitationBody,
    response: sessionInfoSchema,
  });
  d.route("get", "/teams/:teamId", {
    summary: "A team and the caller's role in it",
    tag: "Teams",
    permission: "team:read",
    response: teamSchema,
  });
  d.route("get", "/teams/:teamId/members", {
    summary: "Members of a team",
    tag: "Teams",
    permission: "team:read",
    response: z.array(memberSchema),
  });
  d.route("patch", "/teams/:teamId/members/:userId", {
    summary: "Change a member's role",
    tag: "Teams",
    permission: "team:manage-members",
    body: changeRoleBody,
    response: memberSchema,
  });
  d.route("delete", "/teams/:teamId/members/:userId", {
    summary: "Remove a member",
    tag: "Teams",
    permission: "team:manage-members",
    status: 204,
  });
  d.route("get", "/teams/:teamId/invitations", {
    summary: "Open invitations",
    tag: "Teams",
    permission: "team:manage-members",
    response: z.array(invitationSchema),
  });
  d.route("post", "/teams/:teamId/invitations", {
    summary: "Invite someone by e-mail",
    tag: "Teams",
    permission: "team:manage-members",
    body: inviteBody,
    response: invitationSchema,
    status: 201,
  });
  d.route("delete", "/teams/:teamId/invitations/:invitationId", {
    summary: "Withdraw an invitation",
    tag: "Teams",
    permission: "team:manage-members",
    status: 204,
  });

  d.route("get", "/teams/:teamId/projects", {
    summary: "A team's projects",
    tag: "Projects",
    permission: "project:read",
    response: z.array(projectSchema),
  });
  d.route("post", "/teams/:teamId/projects", {
    summary: "Start a project",
    tag: "Projects",
    permission: "project:create",
    body: createProjectBody,
    response: projectSchema,
    status: 201,
  });
  d.route("get", "/projects/:projectId", {
    summary: "A project",
    tag: "Projects",
    permission: "project:read",
    response: projectSchema,
  });
  d.route("patch", "/projects/:projectId", {
    summary: "Change a project's settings",
    tag: "Projects",
    permission: "project:edit",
    body: updateProjectBody,
    response: projectSchema,
  });
  d.route("delete", "/projects/:projectId", {
    summary: "Delete a project and everything in it",
    tag: "Projects",
    permission: "project:delete",
    status: 204,
  });
  d.route("get", "/outbox", {
    summary: "Mail the local fake mail server caught (development)",
    tag: "Service",
    permission: "signed-in",
    response: z.array(outboxMessageSummarySchema),
  });
  d.route("get", "/outbox/:id", {
    summary: "One caught mail",
    tag: "Service",
    permission: "signed-in",
    response: outboxMessageSchema,
  });

  d.route("post", "/projects/:projectId/layers", {
    summary: "Upload a layer file (processed in the background; poll the layer)",
    tag: "Layers",
    permission: "layer:edit",
    form: uploadLayerFields,
    response: layerSchema,
    status: 202,
  });
  d.route("get", "/projects/:projectId/layers", {
    summary: "A project's layers",
    tag: "Layers",
    permission: "project:read",
    response: z.array(layerSchema),
  });
  d.route("get", "/layers/:layerId", {
    summary: "A layer and its progress (long-poll with waitMs)",
    tag: "Layers",
    permission: "project:read",
    query: layerPollQuery,
    response: layerSchema,
  });
  d.route("delete", "/layers/:layerId", {
    summary: "Delete a layer, its features and its file",
    tag: "Layers",
    permission: "layer:edit",
    status: 204,
  });
  d.route("get", "/layers/:layerId/features", {
    summary: "A layer's features in a bounding box (GeoJSON)",
    tag: "Layers",
    permission: "project:read",
    query: z.object({ bbox: z.string().optional(), limit: z.number().int().optional() }),
    response: z.record(z.string(), z.unknown()),
  });
  d.route("get", "/layers/:layerId/fields/:field/values", {
    summary: "A field's distinct values with counts and suggested classes",
    tag: "Layers",
    permission: "project:read",
    response: fieldValuesSchema,
  });
  d.route("put", "/layers/:layerId/mapping", {
    summary: "Map a layer's values to surface classes (cover) or soil groups (soil)",
    tag: "Layers",
    permission: "layer:edit",
    body: z.union([coverMappingBody, soilMappingBody]),
    response: layerSchema,
  });
}
