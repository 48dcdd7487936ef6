/**
 * Surface overrides of a subcatchment's flow path: replaced as a whole under the path's version
 * (they are stations along the path, like the breaks), checked against the path's length and
 * the team's catalog, stored in metres.
 */
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { pathLengthsM } from "../../shared/geo";
import type { putSurfaceOverridesBody } from "../../shared/schemas/subcatchments";
import type { z } from "zod";
import type { DbOrTx, Tx } from "../db/client";
import { flowPaths, subcatchments, surfaceClasses, surfaceOverrides } from "../db/schema-geodata";
import { invalidInput } from "../http/errors";
import { nextPathVersion, touchFlowPath } from "./flow-path-store";
import {
  lonLats,
  toMetres,
  toProjectLength,
  type FlowLine,
  type Units,
} from "./subcatchment-store";

/** A stretch may end this far past the path (metres): a station read back in feet and sent again. */
const END_TOLERANCE_M = 0.001;

export interface SurfaceOverrideWrite {
  readonly subcatchmentId: string;
  readonly teamId: string;
  readonly units: Units;
  readonly body: z.output<typeof putSurfaceOverridesBody>;
  readonly userId: string;
}

export async function writeSurfaceOverrides(tx: Tx, w: SurfaceOverrideWrite): Promise<void> {
  const { subcatchmentId: id, units, body } = w;
  const version = await nextPathVersion(tx, id, body.version);
  if (version === 1) {
    throw invalidInput({ version: "Draw the flow path before giving a stretch of it a surface." });
  }
  const [path] = await tx
    .select({ g: sql<string>`ST_AsGeoJSON(${flowPaths.geom}, 15)` })
    .from(flowPaths)
    .where(eq(flowPaths.subcatchmentId, id));
  const totalM = path ? pathLengthsM(lonLats(JSON.parse(path.g) as FlowLine)).totalM : 0;
  const unit = units === "si" ? "m" : "ft";
  const total = toProjectLength(units, totalM).toFixed(2);

  const fields: Record<string, string> = {};
  const ids = [...new Set(body.entries.map((e) => e.surfaceClassId))];
  const known = ids.length
    ? await tx
        .select({ id: surfaceClasses.id })
        .from(surfaceClasses)
        .where(and(eq(surfaceClasses.teamId, w.teamId), inArray(surfaceClasses.id, ids)))
    : [];
  const teamIds = new Set(known.map((k) => k.id));
  const rows = body.entries.map((e, i) => {
    const fromM = toMetres(units, e.stationFrom);
    const toM = toMetres(units, e.stationTo);
    const where = `entries.${i}`;
    if (fromM >= totalM) {
      fields[`${where}.stationFrom`] =
        `Override ${i + 1} starts at ${e.stationFrom} ${unit}, at or past the end of the flow path (${total} ${unit}).`;
    } else if (toM > totalM + END_TOLERANCE_M) {
      fields[`${where}.stationTo`] =
        `Override ${i + 1} ends at ${e.stationTo} ${unit}, past the end of the flow path (${total} ${unit}).`;
    }
    if (!teamIds.has(e.surfaceClassId)) {
      fields[`${where}.surfaceClassId`] =
        `Override ${i + 1} names a surface class that is not in this team's Surface catalog.`;
    }
    return {
      subcatchmentId: id,
      stationFromM: fromM,
      stationToM: Math.min(toM, totalM),
      surfaceClassId: e.surfaceClassId,
      note: e.note,
    };
  });
  if (Object.keys(fields).length > 0) {
    throw invalidInput(fields, "Some surface overrides cannot be kept: see the marked entries.");
  }
  await tx.delete(surfaceOverrides).where(eq(surfaceOverrides.subcatchmentId, id));
  if (rows.length > 0) await tx.insert(surfaceOverrides).values(rows);
  await touchFlowPath(tx, id, version, w.userId);
}

/** The path drawn the other way: each stretch stays where it is on the ground. */
export async function reverseSurfaceOverrides(tx: Tx, subcatchmentId: string, totalM: number) {
  const rows = await tx
    .select()
    .from(surfaceOverrides)
    .where(eq(surfaceOverrides.subcatchmentId, subcatchmentId));
  if (rows.length === 0) return;
  await tx.delete(surfaceOverrides).where(eq(surfaceOverrides.subcatchmentId, subcatchmentId));
  // A stretch wholly past the end of a path redrawn shorter has no place on the reversed one.
  const flipped = rows
    .map((o) => ({
      ...o,
      stationFromM: Math.max(0, totalM - o.stationToM),
      stationToM: Math.max(0, totalM - o.stationFromM),
    }))
    .filter((o) => o.stationToM > o.stationFromM);
  if (flipped.length > 0) await tx.insert(surfaceOverrides).values(flipped);
}

/** Names of the subcatchments whose overrides use a class (the catalog refuses to delete it). */
export async function subcatchmentsOverridingWith(db: DbOrTx, surfaceClassId: string) {
  const rows = await db
    .selectDistinct({ name: subcatchments.name })
    .from(surfaceOverrides)
    .innerJoin(subcatchments, eq(subcatchments.id, surfaceOverrides.subcatchmentId))
    .where(eq(surfaceOverrides.surfaceClassId, surfaceClassId))
    .orderBy(asc(subcatchments.name));
  return rows.map((r) => r.name);
}
