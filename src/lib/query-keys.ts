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
};
