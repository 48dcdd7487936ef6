import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { connectDatabase, type Database } from "../../server/db/client";
import { runMigrations } from "../../server/db/migrate";
import { memberships, projects, teams, users } from "../../server/db/schema";
import { DEMO_ACCOUNTS, DEMO_PROJECT, DEMO_TEAM_NAME, seedDemo } from "../../server/seed/demo";

// The demo uses fixed addresses, so it gets a database of its own (created and dropped here)
// instead of the shared test database that other files and the e2e server use.
const adminUrl = process.env.DATABASE_URL ?? "";
const name = `rillmark_seed_${randomUUID().slice(0, 8)}_test`;
const seedUrl = (() => {
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
})();

async function run(url: string, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

let database: Database;
beforeAll(async () => {
  await run(adminUrl, `CREATE DATABASE "${name}"`);
  // Like the real database: later migrations use PostGIS geometry columns.
  await run(seedUrl, "CREATE EXTENSION IF NOT EXISTS postgis");
  await runMigrations(seedUrl);
  database = connectDatabase(seedUrl, 2);
});
afterAll(async () => {
  await database.pool.end();
  await run(adminUrl, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
});

describe("demo seed", () => {
  it("creates the invented team with one account per role and the invented project", async () => {
    expect(await seedDemo(database.db)).toBe(true);
    const { db } = database;
    const [team] = await db.select().from(teams).where(eq(teams.name, DEMO_TEAM_NAME));
    expect(team).toBeDefined();
    const members = await db
      .select({ email: users.email, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, team?.id ?? ""));
    expect(members.sort((a, b) => a.email.localeCompare(b.email))).toEqual(
      DEMO_ACCOUNTS.map((a) => ({ email: a.email, role: a.role })).sort((a, b) =>
        a.email.localeCompare(b.email),
      ),
    );
    const [project] = await db
      .select()
      .from(projects)
      .where(eq(projects.teamId, team?.id ?? ""));
    expect(project).toMatchObject({ ...DEMO_PROJECT, isDemo: true });
    expect(project?.description).toMatch(/invented/i);
  });

  it("runs once: a later start leaves what users changed or deleted as it is", async () => {
    const { db } = database;
    await db.update(projects).set({ name: "Renamed by a user" }).where(eq(projects.isDemo, true));
    await db.delete(users).where(eq(users.email, "viewer@demo.rillmark.test"));
    expect(await seedDemo(db)).toBe(false);
    const demo = await db.select().from(projects).where(eq(projects.isDemo, true));
    expect(demo.map((p) => p.name)).toEqual(["Renamed by a user"]);
    const viewer = await db
      .select()
      .from(users)
      .where(eq(users.email, "viewer@demo.rillmark.test"));
    expect(viewer).toEqual([]);
  });
});
