/**
 * Roles and what each may do. The server checks these on every route; the client uses the same
 * table only to hide controls a role cannot use (the server stays the authority).
 */
export const ROLES = ["owner", "admin", "engineer", "gis", "reviewer", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  admin: "Admin",
  engineer: "Engineer",
  gis: "GIS specialist",
  reviewer: "Reviewer",
  viewer: "Viewer",
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  owner: "Everything an admin can do, and can manage other owners.",
  admin: "Invites people, sets roles, keeps the surface catalog and design rules.",
  engineer: "Edits geometry, computes, submits for sign-off.",
  gis: "Uploads layers and maps their attributes to surface classes.",
  reviewer: "Comments, returns for changes, signs off.",
  viewer: "Reads and exports.",
};

const ALL: readonly Role[] = ROLES;
const MANAGERS: readonly Role[] = ["owner", "admin"];

export const PERMISSIONS = {
  "team:read": ALL,
  "team:manage-members": MANAGERS,
  "project:read": ALL,
  "project:create": ["owner", "admin", "engineer"],
  "project:edit": ["owner", "admin", "engineer"],
  "project:delete": MANAGERS,
  // The local Outbox shows everyone their own mail; managers also see their team's invitations.
  "outbox:read-team-mail": MANAGERS,
  // Geodata: GIS staff bring layers; engineers own geometry, rules and computing.
  "layer:edit": ["owner", "admin", "gis"],
  "catalog:edit": MANAGERS,
  "project-data:edit": ["owner", "admin", "engineer"],
  "geometry:edit": ["owner", "admin", "engineer"],
  "compute:run": ["owner", "admin", "engineer"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/** Only an owner may grant, change or remove the owner role. */
export function canAssignRole(actor: Role, target: Role): boolean {
  if (!can(actor, "team:manage-members")) return false;
  return target !== "owner" || actor === "owner";
}
