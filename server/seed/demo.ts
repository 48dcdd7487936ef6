import { eq, sql } from "drizzle-orm";
import type { Role } from "../../shared/roles";
import { hashPassword } from "../auth/password";
import type { Db } from "../db/client";
import { memberships, projects, seedRuns, teams, users } from "../db/schema";
import { ensureTeamCatalog } from "../geodata/catalog-seed";

export const DEMO_SEED_NAME = "demo-v1";
export const DEMO_PASSWORD = "rillmark-demo";
export const DEMO_TEAM_NAME = "Marrow Creek Civil (invented demo team)";
export const DEMO_PROJECT = {
  name: "Harrow Hill Terraces (invented demo)",
  description: "Invented demo project: a fictional hillside development. All data is synthetic.",
  units: "us",
  designReturnPeriodYears: 25,
} as const;

export interface DemoAccount {
  role: Role;
  email: string;
  name: string;
}

/** One invented person per role; all share DEMO_PASSWORD. */
export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { role: "engineer", email: "engineer@demo.rillmark.test", name: "Ines Okafor (demo engineer)" },
  { role: "owner", email: "owner@demo.rillmark.test", name: "Tomas Reyes (demo owner)" },
  { role: "admin", email: "admin@demo.rillmark.test", name: "Priya Lund (demo admin)" },
  { role: "gis", email: "gis@demo.rillmark.test", name: "Mateo Varga (demo GIS specialist)" },
  { role: "reviewer", email: "reviewer@demo.rillmark.test", name: "Hana Sato (demo reviewer)" },
  { role: "viewer", email: "viewer@demo.rillmark.test", name: "Owen Brandt (demo viewer)" },
];

// Serialises concurrent first starts (two servers, test projects) on one database.
const SEED_LOCK_KEY = 0x5345_4544; // "SEED"

/**
 * Create the demo team, its accounts and its project, once per database. The seed_runs row
 * makes every later start skip it, so whatever users changed or deleted stays as they left it.
 * An account someone already created with a demo address is left untouched (and joins the team).
 * Returns true when it ran now.
 */
export async function seedDemo(db: Db): Promise<boolean> {
  // Cheap check first: later starts skip the password hashing entirely.
  const [seen] = await db.select().from(seedRuns).where(eq(seedRuns.name, DEMO_SEED_NAME));
  if (seen) return false;
  const hashes = await Promise.all(DEMO_ACCOUNTS.map(() => hashPassword(DEMO_PASSWORD)));
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${SEED_LOCK_KEY})`);
    const [done] = await tx.select().from(seedRuns).where(eq(seedRuns.name, DEMO_SEED_NAME));
    if (done) return false;

    const [team] = await tx.insert(teams).values({ name: DEMO_TEAM_NAME }).returning();
    if (!team) throw new Error("demo team insert returned no row");
    await ensureTeamCatalog(tx, team.id);
    let engineerId: string | null = null;
    for (const [i, account] of DEMO_ACCOUNTS.entries()) {
      await tx
        .insert(users)
        .values({ email: account.email, name: account.name, passwordHash: hashes[i] ?? "" })
        .onConflictDoNothing({ target: users.email });
      const [user] = await tx
        .select({ id: users.id })
        .from(users)
        .where(eq(users.email, account.email));
      if (!user) throw new Error(`demo account ${account.email} missing after insert`);
      await tx.insert(memberships).values({ teamId: team.id, userId: user.id, role: account.role });
      if (account.role === "engineer") engineerId = user.id;
    }
    await tx
      .insert(projects)
      .values({ ...DEMO_PROJECT, teamId: team.id, isDemo: true, createdBy: engineerId });
    await tx.insert(seedRuns).values({ name: DEMO_SEED_NAME });
    return true;
  });
}

/** The one line `npm start` prints once the server listens. */
export function readyLine(url: string): string {
  const [first, ...others] = DEMO_ACCOUNTS;
  if (!first) return `Rillmark is running at ${url}`;
  return (
    `Rillmark is running at ${url} — sign in as ${first.email} (password ${DEMO_PASSWORD}); ` +
    `other demo accounts: ${others.map((a) => a.email).join(", ")}`
  );
}
