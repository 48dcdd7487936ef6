/**
 * Subcatchments as the API answers them, and the SQL that reads and writes their geometry
 * (GeoJSON ↔ PostGIS in EPSG:4326). Stations and elevations are stored in metres and answered
 * in the project's length unit.
 */
import { and, asc, eq, sql } from "drizzle-orm";
import { pathLengthsM, type LonLat } from "../../shared/geo";
import { ftFromM, mFromFt } from "../../shared/hydrology/units";
import type { Subcatchment } from "../../shared/schemas/subcatchments";
import type { DbOrTx } from "../db/client";
import {
  elevationOverrides,
  flowPaths,
  regimeBreaks,
  subcatchmentResults,
  subcatchments,
  surfaceOverrides,
} from "../db/schema-geodata";
import { HttpError, invalidInput } from "../http/errors";

export type Units = "us" | "si";
export type FlowLine = NonNullable<Subcatchment["flowPath"]>["geometry"];

/** A LineString's positions as [lon, lat] (a third value, elevation, is dropped). */
export const lonLats = (line: FlowLine): LonLat[] =>
  line.coordinates.map((c) => [c[0], c[1]] as const);
export const toProjectLength = (units: Units, m: number) => (units === "si" ? m : ftFromM(m));
export const toMetres = (units: Units, v: number) => (units === "si" ? v : mFromFt(v));

/** SQL for a GeoJSON geometry in EPSG:4326. */
export const geomFromJson = (geometry: object) =>
  sql`ST_SetSRID(ST_GeomFromGeoJSON(${JSON.stringify(geometry)}), 4326)`;

/** PostGIS must find a boundary valid; else 422 with its reason (e.g. a self-intersection). */
export async function checkBoundary(db: DbOrTx, boundary: object, field = "boundary") {
  const result = await db.execute<{ valid: boolean; reason: string }>(
    sql`select ST_IsValid(g) as valid, ST_IsValidReason(g) as reason from (select ${geomFromJson(boundary)} as g) s`,
  );
  const row = result.rows[0];
  if (row && !row.valid) {
    throw invalidInput(
      { [field]: `The boundary is not a valid polygon: ${row.reason}.` },
      "The boundary is not a valid polygon.",
    );
  }
}

export const staleSubcatchment = (version: number) =>
  new HttpError(
    409,
    "stale_version",
    `This subcatchment was changed by someone else (version ${version}); reload it and apply your edit again.`,
  );

/**
 * Writes the subcatchment's own fields (name, scenario, boundary, outlet, channel, note) only
 * if it is still at the version the caller read, and takes the next version: one conditional
 * UPDATE, so of several edits made from one version exactly one lands and the others get 409
 * (PostgreSQL re-checks the WHERE on the row a concurrent writer left). An empty change only
 * checks the version.
 */
export async function writeSubcatchmentFields(
  db: DbOrTx,
  id: string,
  sentVersion: number,
  set: Record<string, unknown>,
): Promise<number> {
  const same = and(eq(subcatchments.id, id), eq(subcatchments.version, sentVersion));
  const [row] =
    Object.keys(set).length === 0
      ? await db.select({ version: subcatchments.version }).from(subcatchments).where(same)
      : await db
          .update(subcatchments)
          .set({ ...set, version: sql`${subcatchments.version} + 1` })
          .where(same)
          .returning({ version: subcatchments.version });
  if (row) return row.version;
  const [current] = await db
    .select({ version: subcatchments.version })
    .from(subcatchments)
    .where(eq(subcatchments.id, id));
  throw staleSubcatchment(current?.version ?? 0);
}

export async function loadSubcatchment(
  db: DbOrTx,
  id: string,
  units: Units,
): Promise<Subcatchment | undefined> {
  const [row] = await db
    .select({
      s: subcatchments,
      boundary: sql<string | null>`ST_AsGeoJSON(${subcatchments.boundary}, 15)`,
      outlet: sql<string | null>`ST_AsGeoJSON(${subcatchments.outlet}, 15)`,
    })
    .from(subcatchments)
    .where(eq(subcatchments.id, id));
  if (!row) return undefined;
  const [path] = await db
    .select({
      geometry: sql<string>`ST_AsGeoJSON(${flowPaths.geom}, 15)`,
      version: flowPaths.version,
      updatedAt: flowPaths.updatedAt,
    })
    .from(flowPaths)
    .where(eq(flowPaths.subcatchmentId, id));
  const breaks = await db.select().from(regimeBreaks).where(eq(regimeBreaks.subcatchmentId, id));
  const elevations = await db
    .select()
    .from(elevationOverrides)
    .where(eq(elevationOverrides.subcatchmentId, id))
    .orderBy(asc(elevationOverrides.stationM));
  const stretches = await db
    .select()
    .from(surfaceOverrides)
    .where(eq(surfaceOverrides.subcatchmentId, id))
    .orderBy(asc(surfaceOverrides.stationFromM));
  const [result] = await db
    .select({ version: subcatchmentResults.flowPathVersion })
    .from(subcatchmentResults)
    .where(eq(subcatchmentResults.subcatchmentId, id));
  const breakAt = (kind: "sheet-end" | "channel-start") => {
    const b = breaks.find((x) => x.kind === kind);
    return b ? toProjectLength(units, b.stationM) : null;
  };
  const s = row.s;
  const line = path ? (JSON.parse(path.geometry) as FlowLine) : null;
  return {
    id: s.id,
    projectId: s.projectId,
    name: s.name,
    scenario: s.scenario,
    boundary: row.boundary ? JSON.parse(row.boundary) : null,
    outlet: row.outlet ? JSON.parse(row.outlet) : null,
    channel: (s.channel as Subcatchment["channel"]) ?? null,
    note: s.note,
    version: s.version,
    flowPath:
      path && line
        ? {
            geometry: line,
            version: path.version,
            lengthM: pathLengthsM(lonLats(line)).totalM,
            updatedAt: path.updatedAt.toISOString(),
          }
        : null,
    breaks: { sheetEnd: breakAt("sheet-end"), channelStart: breakAt("channel-start") },
    elevations: elevations.map((e) => ({
      station: toProjectLength(units, e.stationM),
      elevation: toProjectLength(units, e.elevationM),
      note: e.note,
    })),
    surfaceOverrides: stretches.map((o) => ({
      stationFrom: toProjectLength(units, o.stationFromM),
      stationTo: toProjectLength(units, o.stationToM),
      surfaceClassId: o.surfaceClassId,
      note: o.note,
    })),
    lengthUnit: units === "si" ? "m" : "ft",
    computedVersion: result?.version ?? null,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
  };
}
