/**
 * Everything a compute needs, read in one go: the flow path and its version, breaks, surveyed
 * points, surface overrides, the subcatchment's fields, the project's rules, rainfall and catalog, and the layer
 * features near the path (the project's layers first, then each one's features in the path's box
 * through the (layer_id, geom) GiST index: never the whole layer, never another project's).
 */
import { and, asc, desc, eq, sql, type SQL } from "drizzle-orm";
import type { Geometry } from "geojson";
import type {
  HsgCode,
  LonLat,
  PolygonRings,
  SurfaceOverride,
  ValuedPolygon,
} from "../../../shared/geo";
import { HSG_CODES } from "../../../shared/geo";
import type { IdfInput } from "../../../shared/hydrology";
import type { SurfaceValues } from "../../../shared/schemas/catalog";
import type { LayerKind } from "../../../shared/schemas/layers";
import type { DesignRules } from "../../../shared/schemas/design-rules";
import type { SurfaceParams } from "../../../shared/sheet/rows";
import type { ProjectRow } from "../../auth/guards";
import type { Db } from "../../db/client";
import {
  elevationOverrides,
  flowPaths,
  layers,
  rainfallTables,
  regimeBreaks,
  subcatchments,
  surfaceOverrides,
} from "../../db/schema-geodata";
import { projectClasses } from "../catalog-store";
import { loadDesignRules } from "../design-rules-store";
import { projectFeaturesNear } from "../project-features";

export interface RainfallChoice {
  readonly id: string;
  readonly name: string;
  readonly sourceNote: string;
  readonly units: string;
  readonly p2_24h: number | null;
  readonly idf: IdfInput;
}

export interface ComputeData {
  readonly project: ProjectRow;
  readonly subcatchment: { id: string; name: string; scenario: string; channel: unknown };
  readonly boundary: Geometry | null;
  readonly path: LonLat[] | null;
  readonly pathVersion: number;
  readonly breaks: { sheetEndM: number | null; channelStartM: number | null };
  readonly surveyed: { stationM: number; elevationM: number }[];
  /** Stretches the engineer gave another surface class, in station order. */
  readonly surfaceOverrides: SurfaceOverride[];
  readonly rules: DesignRules;
  readonly rainfall: RainfallChoice | null;
  readonly rainfallProblem: string | null;
  readonly classes: Map<string, SurfaceParams>;
  readonly cover: ValuedPolygon<string | null>[];
  readonly soil: ValuedPolygon<HsgCode | null>[];
  readonly channelLines: LonLat[][];
  readonly terrain: { objectKey: string; info: unknown; name: string } | null;
}

const toLonLat = (c: number[]): LonLat => [c[0] ?? Number.NaN, c[1] ?? Number.NaN];

/** Polygon parts of a geometry (a multipolygon gives several entries with one featureId). */
export function polygonParts(g: Geometry): PolygonRings[] {
  if (g.type === "Polygon") return [g.coordinates.map((r) => r.map(toLonLat))];
  if (g.type === "MultiPolygon") return g.coordinates.map((p) => p.map((r) => r.map(toLonLat)));
  if (g.type === "GeometryCollection") return g.geometries.flatMap(polygonParts);
  return [];
}

function lineParts(g: Geometry): LonLat[][] {
  if (g.type === "LineString") return [g.coordinates.map(toLonLat)];
  if (g.type === "MultiLineString") return g.coordinates.map((l) => l.map(toLonLat));
  if (g.type === "Polygon" || g.type === "MultiPolygon") {
    return polygonParts(g).flatMap((rings) => rings.map((r) => [...r]));
  }
  return [];
}

const isHsg = (v: string | null): v is HsgCode =>
  v !== null && (HSG_CODES as readonly string[]).includes(v);

interface FeatureRow extends Record<string, unknown> {
  id: string | number;
  surface_class_id: string | null;
  hsg: string | null;
  g: string;
}

/** The project's features of one kind whose box meets `box` (exported for an EXPLAIN test). */
export function featuresNearQuery(projectId: string, kind: LayerKind, box: SQL): SQL {
  return sql`
    select p.id, p.surface_class_id, p.hsg, ST_AsGeoJSON(p.geom, 15) as g
    from ${projectFeaturesNear(projectId, [kind], box)} p
    order by p.id`;
}

async function featuresNear(db: Db, projectId: string, kind: LayerKind, box: SQL) {
  const result = await db.execute<FeatureRow>(featuresNearQuery(projectId, kind, box));
  return result.rows.map((r) => ({
    id: Number(r.id),
    surfaceClassId: r.surface_class_id,
    hsg: r.hsg,
    geometry: JSON.parse(r.g) as Geometry,
  }));
}

export async function loadComputeData(
  db: Db,
  project: ProjectRow,
  subcatchmentId: string,
): Promise<ComputeData> {
  // Independent reads, side by side (a compute should answer in tens of milliseconds).
  const [[sub], [fp], breakRows, surveyed, overrides, rules, classRows, [terrain]] =
    await Promise.all([
      db
        .select({
          s: subcatchments,
          boundary: sql<string | null>`ST_AsGeoJSON(${subcatchments.boundary}, 15)`,
        })
        .from(subcatchments)
        .where(eq(subcatchments.id, subcatchmentId)),
      db
        .select({ g: sql<string>`ST_AsGeoJSON(${flowPaths.geom}, 15)`, version: flowPaths.version })
        .from(flowPaths)
        .where(eq(flowPaths.subcatchmentId, subcatchmentId)),
      db.select().from(regimeBreaks).where(eq(regimeBreaks.subcatchmentId, subcatchmentId)),
      db
        .select({
          stationM: elevationOverrides.stationM,
          elevationM: elevationOverrides.elevationM,
        })
        .from(elevationOverrides)
        .where(eq(elevationOverrides.subcatchmentId, subcatchmentId))
        .orderBy(asc(elevationOverrides.stationM)),
      db
        .select({
          stationFromM: surfaceOverrides.stationFromM,
          stationToM: surfaceOverrides.stationToM,
          surfaceClassId: surfaceOverrides.surfaceClassId,
        })
        .from(surfaceOverrides)
        .where(eq(surfaceOverrides.subcatchmentId, subcatchmentId))
        .orderBy(asc(surfaceOverrides.stationFromM)),
      loadDesignRules(db, project.id),
      projectClasses(db, project.teamId, project.id),
      db
        .select({ objectKey: layers.objectKey, info: layers.terrain, name: layers.name })
        .from(layers)
        .where(
          and(
            eq(layers.projectId, project.id),
            eq(layers.kind, "terrain"),
            eq(layers.status, "ready"),
          ),
        )
        .orderBy(desc(layers.createdAt))
        .limit(1),
    ]);
  if (!sub) throw new Error(`subcatchment ${subcatchmentId} vanished`);
  const path = fp
    ? (JSON.parse(fp.g) as { coordinates: number[][] }).coordinates.map(toLonLat)
    : null;
  const { rainfall, rainfallProblem } = await chooseRainfall(db, project, rules.rainfallTableId);
  const classes = new Map<string, SurfaceParams>();
  for (const c of classRows) {
    classes.set(c.id, { id: c.id, key: c.key, name: c.name, values: c.values as SurfaceValues });
  }
  // Features whose box meets the path's box.
  const box = fp
    ? sql`(select ST_Envelope(geom) from flow_paths where subcatchment_id = ${subcatchmentId})`
    : sql`ST_GeomFromText('POLYGON EMPTY', 4326)`;
  const [coverRows, soilRows, channelRows] = await Promise.all([
    featuresNear(db, project.id, "cover", box),
    featuresNear(db, project.id, "soil", box),
    featuresNear(db, project.id, "channel", box),
  ]);
  const cover = coverRows.flatMap((f) =>
    polygonParts(f.geometry).map((rings) => ({
      featureId: f.id,
      rings,
      value: f.surfaceClassId && classes.has(f.surfaceClassId) ? f.surfaceClassId : null,
    })),
  );
  const soil = soilRows.flatMap((f) =>
    polygonParts(f.geometry).map((rings) => ({
      featureId: f.id,
      rings,
      value: isHsg(f.hsg) ? f.hsg : null,
    })),
  );
  const channelLines = channelRows.flatMap((f) => lineParts(f.geometry));
  const s = sub.s;
  return {
    project,
    subcatchment: { id: s.id, name: s.name, scenario: s.scenario, channel: s.channel },
    boundary: sub.boundary ? (JSON.parse(sub.boundary) as Geometry) : null,
    path,
    pathVersion: fp?.version ?? 0,
    breaks: {
      sheetEndM: breakRows.find((b) => b.kind === "sheet-end")?.stationM ?? null,
      channelStartM: breakRows.find((b) => b.kind === "channel-start")?.stationM ?? null,
    },
    surveyed,
    surfaceOverrides: overrides,
    rules,
    rainfall,
    rainfallProblem,
    classes,
    cover,
    soil,
    channelLines,
    terrain:
      terrain?.objectKey && terrain.info
        ? { objectKey: terrain.objectKey, info: terrain.info, name: terrain.name }
        : null,
  };
}

async function chooseRainfall(db: Db, project: ProjectRow, chosen: string | null) {
  const tables = await db
    .select()
    .from(rainfallTables)
    .where(eq(rainfallTables.projectId, project.id))
    .orderBy(asc(rainfallTables.createdAt));
  const table = chosen
    ? tables.find((t) => t.id === chosen)
    : tables.length === 1
      ? tables[0]
      : undefined;
  if (!table) {
    const problem =
      tables.length === 0
        ? "The project has no rainfall table: add one (IDF table or formulas)."
        : "The project has several rainfall tables: choose one in the design rules.";
    return { rainfall: null, rainfallProblem: problem };
  }
  if (table.units !== project.units) {
    return {
      rainfall: null,
      rainfallProblem: `Rainfall table "${table.name}" is in ${table.units === "si" ? "SI" : "US"} units but the project is not: enter it again in the project's units.`,
    };
  }
  return {
    rainfall: {
      id: table.id,
      name: table.name,
      sourceNote: table.sourceNote,
      units: table.units,
      p2_24h: table.p2_24h,
      idf: table.idf as IdfInput,
    },
    rainfallProblem: null,
  };
}
