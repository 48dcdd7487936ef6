import { asc, eq } from "drizzle-orm";
import type { SessionInfo } from "../../shared/schemas/auth";
import type { DbOrTx } from "../db/client";
import { memberships, teams, users } from "../db/schema";
import { unauthenticated } from "../http/errors";

/** What the client knows about the signed-in person: who they are and their teams and roles. */
export async function sessionInfo(db: DbOrTx, userId: string): Promise<SessionInfo> {
  const [user] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.id, userId));
  if (!user) throw unauthenticated();
  const teamRows = await db
    .select({ teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(teams.name), asc(teams.id));
  return { user, memberships: teamRows };
}
