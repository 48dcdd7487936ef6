/**
 * Reading the Surface catalog: team classes as stored, and a project's view with its overrides
 * merged value by value (an overridden value carries the source the project gave it).
 */
import { asc, eq } from "drizzle-orm";
import type { SurfaceClassDto, SurfaceValues } from "../../shared/schemas/catalog";
import type { DbOrTx } from "../db/client";
import { projectSurfaceOverrides, surfaceClasses } from "../db/schema-geodata";
import { ensureTeamCatalog } from "./catalog-seed";

type ClassRow = typeof surfaceClasses.$inferSelect;

export function toSurfaceClassDto(row: ClassRow): SurfaceClassDto {
  return {
    id: row.id,
    teamId: row.teamId,
    key: row.key,
    name: row.name,
    description: row.description,
    values: row.values as SurfaceValues,
    seededFrom: row.seededFrom,
  };
}

export async function teamClasses(db: DbOrTx, teamId: string): Promise<SurfaceClassDto[]> {
  await ensureTeamCatalog(db, teamId);
  const rows = await db
    .select()
    .from(surfaceClasses)
    .where(eq(surfaceClasses.teamId, teamId))
    .orderBy(asc(surfaceClasses.name), asc(surfaceClasses.id));
  return rows.map(toSurfaceClassDto);
}

/** Team classes with the project's overrides merged in; `override` shows what the project set. */
export async function projectClasses(
  db: DbOrTx,
  teamId: string,
  projectId: string,
): Promise<SurfaceClassDto[]> {
  const classes = await teamClasses(db, teamId);
  const overrides = await db
    .select()
    .from(projectSurfaceOverrides)
    .where(eq(projectSurfaceOverrides.projectId, projectId));
  const byClass = new Map(overrides.map((o) => [o.surfaceClassId, o]));
  return classes.map((cls) => {
    const o = byClass.get(cls.id);
    if (!o) return { ...cls, override: null };
    const values = o.values as Partial<SurfaceValues>;
    return { ...cls, values: { ...cls.values, ...values }, override: { values, note: o.note } };
  });
}
