/**
 * Subcatchment figures for the lag method and the rational method: the area on the WGS84
 * ellipsoid (the geodata core's geodesic area), area-weighted CN and C from the cover × soil
 * intersection inside the boundary (PostGIS ST_Intersection, areas on the geography type), and
 * the average land slope from terrain samples on a grid over the boundary.
 */
import { createHash } from "node:crypto";
import { sql, type SQL } from "drizzle-orm";
import type { Geometry } from "geojson";
import {
  averageLandSlopePercent,
  gridOverPolygon,
  multiPolygonAreaM2,
  type LonLat,
} from "../../../shared/geo";
import { M2_PER_ACRE, M2_PER_HA } from "../../../shared/hydrology/units";
import { resolveHsg, type SurfaceParams } from "../../../shared/sheet/rows";
import type { HsgCode } from "../../../shared/geo";
import type { Db } from "../../db/client";
import { projectFeaturesNear } from "../project-features";
import type { TerrainSampler } from "../terrain";
import { polygonParts } from "./load";

export interface Figures {
  area: number | null;
  areaM2: number | null;
  cn: number | null;
  c: number | null;
  avgSlopePercent: number | null;
  notes: string[];
}

interface WeightRow extends Record<string, unknown> {
  kind: "cover-soil" | "cover";
  surface_class_id: string | null;
  hsg: string | null;
  area_m2: number | string;
}

const LAND_SLOPE_POINTS = 2500;

const pct = (part: number, whole: number) => `${((100 * part) / whole).toFixed(1)} %`;

type AreaRow = {
  kind: "cover-soil" | "cover";
  surface_class_id: string | null;
  hsg: string | null;
  area_m2: number;
};

/**
 * The intersection areas change only when the boundary or a cover or soil layer (its features
 * or its mapping) changes, and they are the slow part of a compute (GEOS intersections of
 * detailed polygons). They are kept per process under a key of exactly those inputs; the CN and
 * C are weighted afresh each time, so catalog edits apply at once.
 */
const AREA_CACHE = new Map<string, AreaRow[]>();
const AREA_CACHE_SIZE = 200;
/** Average land slope by terrain file and boundary (both fixed once stored). */
const LAND_SLOPE_CACHE = new Map<string, number>();

async function areaKey(db: Db, projectId: string, subcatchmentId: string): Promise<string> {
  const result = await db.execute<{ b: string | null; l: string | null }>(sql`
    select md5(ST_AsEWKB(boundary)::text) as b,
      (select string_agg(l.id::text || '@' || l.updated_at::text, ',' order by l.id)
       from layers l
       where l.project_id = ${projectId} and l.kind in ('cover', 'soil') and l.status = 'ready') as l
    from subcatchments where id = ${subcatchmentId}`);
  const row = result.rows[0];
  return `${subcatchmentId}|${row?.b ?? ""}|${row?.l ?? ""}`;
}

/**
 * Cover × soil pieces inside the boundary, area per (class, HSG); plus cover alone. Exported so
 * a test can EXPLAIN it: only the project's own layers' features may be read.
 */
export function coverSoilAreaQuery(projectId: string, subcatchmentId: string): SQL {
  const boundary = sql`(select boundary from subcatchments
    where id = ${subcatchmentId}::uuid and project_id = ${projectId}::uuid)`;
  return sql`
    with f as (
      select p.kind, p.surface_class_id, p.hsg, ST_Intersection(p.geom, b.g) as g
      from ${projectFeaturesNear(projectId, ["cover", "soil"], boundary)} p,
        (select ${boundary} as g) b
      where ST_Intersects(p.geom, b.g)),
    c as (select surface_class_id, g from f where kind = 'cover'),
    s as (select hsg, g from f where kind = 'soil')
    select 'cover-soil' as kind, c.surface_class_id, s.hsg,
      sum(ST_Area(ST_Intersection(c.g, s.g)::geography)) as area_m2
    from c join s on ST_Intersects(c.g, s.g)
    group by 2, 3
    union all
    select 'cover', c.surface_class_id, null, sum(ST_Area(c.g::geography)) from c group by 2`;
}

async function coverSoilAreas(db: Db, projectId: string, subcatchmentId: string) {
  const key = await areaKey(db, projectId, subcatchmentId);
  const cached = AREA_CACHE.get(key);
  if (cached) return cached;
  const result = await db.execute<WeightRow>(coverSoilAreaQuery(projectId, subcatchmentId));
  const rows = result.rows.map((r): AreaRow => ({ ...r, area_m2: Number(r.area_m2) }));
  if (AREA_CACHE.size >= AREA_CACHE_SIZE) {
    const oldest = AREA_CACHE.keys().next().value;
    if (oldest !== undefined) AREA_CACHE.delete(oldest);
  }
  AREA_CACHE.set(key, rows);
  return rows;
}

export async function subcatchmentFigures(
  db: Db,
  args: {
    projectId: string;
    subcatchmentId: string;
    units: "us" | "si";
    boundary: Geometry | null;
    classes: ReadonlyMap<string, SurfaceParams>;
    dualHsg: "drained" | "undrained";
    terrain: TerrainSampler | null;
    /** Identifies the terrain file (its object key), so the land slope can be kept. */
    terrainKey: string | null;
  },
): Promise<Figures> {
  const notes: string[] = [];
  const none: Figures = {
    area: null,
    areaM2: null,
    cn: null,
    c: null,
    avgSlopePercent: null,
    notes,
  };
  if (!args.boundary) {
    notes.push("No boundary: draw or upload one for the area, CN, C and land slope.");
    return none;
  }
  const parts = polygonParts(args.boundary);
  const areaM2 = multiPolygonAreaM2(parts);
  const area = areaM2 / (args.units === "si" ? M2_PER_HA : M2_PER_ACRE);
  const rows = await coverSoilAreas(db, args.projectId, args.subcatchmentId);
  // C: cover alone (the rational method's C does not depend on the soil group).
  let cSum = 0;
  let cArea = 0;
  let coverArea = 0;
  for (const r of rows) {
    if (r.kind !== "cover") continue;
    coverArea += r.area_m2;
    const cls = r.surface_class_id ? args.classes.get(r.surface_class_id) : undefined;
    const c = cls?.values.runoffC?.design;
    if (c !== undefined) {
      cSum += c * r.area_m2;
      cArea += r.area_m2;
    }
  }
  let cnSum = 0;
  let cnArea = 0;
  for (const r of rows) {
    if (r.kind !== "cover-soil" || r.hsg === null) continue;
    const cls = r.surface_class_id ? args.classes.get(r.surface_class_id) : undefined;
    const hsg = resolveHsg(r.hsg as HsgCode, args.dualHsg);
    const cn = cls && hsg ? cls.values.cn[hsg] : null;
    if (cn !== null && cn !== undefined) {
      cnSum += cn * r.area_m2;
      cnArea += r.area_m2;
    }
  }
  if (coverArea > areaM2 * 1.001) {
    notes.push("Cover polygons overlap inside the boundary: the overlaps are counted in each.");
  }
  if (cArea < areaM2 * 0.999) {
    notes.push(
      `C is weighted over ${pct(cArea, areaM2)} of the area (the rest has no mapped cover with a C).`,
    );
  }
  if (cnArea < areaM2 * 0.999) {
    notes.push(
      `CN is weighted over ${pct(cnArea, areaM2)} of the area (the rest has no mapped cover and soil with a CN).`,
    );
  }
  const slopeKey = `${args.terrainKey ?? ""}|${createHash("sha256")
    .update(JSON.stringify(parts[0] ?? []))
    .digest("hex")}`;
  let avgSlopePercent: number | null = LAND_SLOPE_CACHE.get(slopeKey) ?? null;
  if (avgSlopePercent === null) {
    avgSlopePercent = await landSlope(parts[0], args.terrain, notes);
    if (args.terrainKey !== null && avgSlopePercent !== null) {
      if (LAND_SLOPE_CACHE.size >= AREA_CACHE_SIZE) LAND_SLOPE_CACHE.clear();
      LAND_SLOPE_CACHE.set(slopeKey, avgSlopePercent);
    }
  }
  return {
    area,
    areaM2,
    cn: cnArea > 0 ? cnSum / cnArea : null,
    c: cArea > 0 ? cSum / cArea : null,
    avgSlopePercent,
    notes,
  };
}

/**
 * Terrain sampled on a grid over the boundary, slope by central differences, averaged (the grid
 * method of NEH 630 Ch 15 for the lag equation's average land slope [from memory]). About 2,500
 * points: every 2 m on a small subcatchment, wider spacing on a large one, which keeps a compute
 * fast; a finer grid changes the average little on real ground.
 */
async function landSlope(
  rings: readonly (readonly LonLat[])[] | undefined,
  terrain: TerrainSampler | null,
  notes: string[],
): Promise<number | null> {
  if (!rings || !terrain) {
    notes.push(
      "No terrain layer: the average land slope is unknown (the lag method uses the path's).",
    );
    return null;
  }
  const grid = gridOverPolygon(rings, 2, LAND_SLOPE_POINTS);
  const inside = grid.points.filter((p): p is LonLat => p !== null);
  const z = await terrain.elevationsM(inside);
  let k = 0;
  const elevationsM = grid.points.map((p) => (p === null ? null : (z[k++] ?? null)));
  const result = averageLandSlopePercent({ ...grid, elevationsM });
  if (!result)
    notes.push("The terrain does not cover the boundary: the average land slope is unknown.");
  return result ? result.slopePercent : null;
}
