/**
 * Every query key in one place, so a feature can refresh data another feature shows (a renamed
 * account refreshes the session; an accepted invitation refreshes the memberships) without
 * importing that feature's code.
 */
export const queryKeys = {
  config: ["config"] as const,
  me: ["auth", "me"] as const,
  account: ["account"] as const,
  team: (teamId: string) => ["teams", teamId] as const,
  members: (teamId: string) => ["teams", teamId, "members"] as const,
  invitations: (teamId: string) => ["teams", teamId, "invitations"] as const,
  projects: (teamId: string) => ["teams", teamId, "projects"] as const,
  project: (projectId: string) => ["projects", projectId] as const,
  outbox: ["outbox"] as const,
  outboxMessage: (messageId: string) => ["outbox", messageId] as const,
  invitation: (token: string) => ["invitations", token] as const,
  // Geodata: a project's subcatchments, layers, rainfall and rules; a team's Surface catalog.
  subcatchments: (projectId: string) => ["projects", projectId, "subcatchments"] as const,
  /** The same list parsed with each result summary (under the list's key, so refreshed with it). */
  subcatchmentSummaries: (projectId: string) =>
    ["projects", projectId, "subcatchments", "with-results"] as const,
  subcatchment: (subcatchmentId: string) => ["subcatchments", subcatchmentId] as const,
  sheet: (subcatchmentId: string) => ["subcatchments", subcatchmentId, "sheet"] as const,
  layers: (projectId: string) => ["projects", projectId, "layers"] as const,
  layer: (layerId: string) => ["layers", layerId] as const,
  fieldValues: (layerId: string, field: string) => ["layers", layerId, "fields", field] as const,
  rainfallTables: (projectId: string) => ["projects", projectId, "rainfall-tables"] as const,
  designRules: (projectId: string) => ["projects", projectId, "design-rules"] as const,
  surfaceClasses: (teamId: string) => ["teams", teamId, "surface-classes"] as const,
  projectSurfaceClasses: (projectId: string) => ["projects", projectId, "surface-classes"] as const,
};
