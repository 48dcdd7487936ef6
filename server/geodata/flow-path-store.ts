/**
 * Writes to a subcatchment's flow path under its version: the caller sends the version it read
 * (0 for a path not drawn yet); any other version means someone changed the path in between,
 * and the answer is 409 with nothing written. Breaks are stations along the path, so moving
 * them is a change of the path too and takes the next version.
 */
import { eq, sql } from "drizzle-orm";
import type { Tx } from "../db/client";
import { flowPaths } from "../db/schema-geodata";
import { HttpError } from "../http/errors";
import { geomFromJson } from "./subcatchment-store";

export const stalePath = (version: number) =>
  new HttpError(
    409,
    "stale_version",
    version === 0
      ? "This subcatchment has no flow path yet (version 0); reload it and apply your edit again."
      : `This flow path was changed by someone else (version ${version}); reload it and apply your edit again.`,
  );

/** The stored version, locked for this transaction (0 when there is no path). */
export async function lockedPathVersion(tx: Tx, subcatchmentId: string): Promise<number> {
  const [row] = await tx
    .select({ version: flowPaths.version })
    .from(flowPaths)
    .where(eq(flowPaths.subcatchmentId, subcatchmentId))
    .for("update");
  return row?.version ?? 0;
}

/** Checks the caller's version and answers the next one. */
export async function nextPathVersion(tx: Tx, subcatchmentId: string, sent: number) {
  const current = await lockedPathVersion(tx, subcatchmentId);
  if (current !== sent) throw stalePath(current);
  return current + 1;
}

export async function writeFlowPath(
  tx: Tx,
  subcatchmentId: string,
  geometry: object,
  sentVersion: number,
  userId: string,
): Promise<number> {
  const version = await nextPathVersion(tx, subcatchmentId, sentVersion);
  const geom = geomFromJson(geometry);
  if (version === 1) {
    // Two first drawings racing: the primary key refuses the second, answered as stale.
    const inserted = await tx
      .insert(flowPaths)
      .values({
        subcatchmentId,
        geom: sql`${geom}` as unknown as string,
        version,
        updatedBy: userId,
      })
      .onConflictDoNothing()
      .returning({ version: flowPaths.version });
    if (inserted.length === 0) throw stalePath(await lockedPathVersion(tx, subcatchmentId));
  } else {
    await tx
      .update(flowPaths)
      .set({ geom: sql`${geom}` as unknown as string, version, updatedBy: userId })
      .where(eq(flowPaths.subcatchmentId, subcatchmentId));
  }
  return version;
}

/** Bumps the version without touching the line (breaks moved). */
export async function touchFlowPath(
  tx: Tx,
  subcatchmentId: string,
  version: number,
  userId: string,
) {
  await tx
    .update(flowPaths)
    .set({ version, updatedBy: userId })
    .where(eq(flowPaths.subcatchmentId, subcatchmentId));
}

/** The line drawn the other way (outlet first becomes divide first). */
export async function reverseFlowPath(
  tx: Tx,
  subcatchmentId: string,
  sent: number,
  userId: string,
) {
  const version = await nextPathVersion(tx, subcatchmentId, sent);
  if (version === 1) throw stalePath(0);
  await tx
    .update(flowPaths)
    .set({
      geom: sql`ST_Reverse(${flowPaths.geom})` as unknown as string,
      version,
      updatedBy: userId,
    })
    .where(eq(flowPaths.subcatchmentId, subcatchmentId));
  return version;
}
