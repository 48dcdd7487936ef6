import { and, eq, isNull, sql } from "drizzle-orm";
import {
  layerProgressSchema,
  type Bbox,
  type Layer,
  type LayerError,
  type LayerNote,
  type LayerProblem,
  type LayerProgress,
} from "../../shared/schemas/layers";
import type { DbOrTx } from "../db/client";
import { layerFeatures, type layers } from "../db/schema-geodata";

export type LayerRow = typeof layers.$inferSelect;

const EMPTY_PROGRESS: LayerProgress = {
  stage: "received",
  bytesReceived: 0,
  bytesTotal: 0,
  featuresDone: 0,
  featuresTotal: 0,
};

function progressOf(raw: unknown): LayerProgress {
  const parsed = layerProgressSchema.safeParse({ ...EMPTY_PROGRESS, ...(raw as object) });
  return parsed.success ? parsed.data : EMPTY_PROGRESS;
}

const MAX_LISTED_VALUES = 50;

/**
 * Cover and soil layers need every feature mapped (to a class or an HSG) before a split can
 * use them; what is not mapped stays listed here until it is.
 */
export async function layerProblems(db: DbOrTx, row: LayerRow): Promise<LayerProblem[]> {
  if (row.status !== "ready" || (row.kind !== "cover" && row.kind !== "soil")) return [];
  const what = row.kind === "cover" ? "a surface class" : "a hydrologic soil group";
  if (!row.mappingField) {
    if (row.featureCount === 0) return [];
    return [
      {
        kind: "unmapped-values",
        values: [],
        featureCount: row.featureCount,
        message: `Choose the field that holds ${row.kind === "cover" ? "the cover" : "the HSG"}, then map its values to ${what}.`,
      },
    ];
  }
  const target =
    row.kind === "cover" ? isNull(layerFeatures.surfaceClassId) : isNull(layerFeatures.hsg);
  const value = sql<string>`coalesce(${layerFeatures.attributes} ->> ${row.mappingField}, '')`;
  const rows = await db
    .select({ value, count: sql<number>`count(*)::int` })
    .from(layerFeatures)
    .where(and(eq(layerFeatures.layerId, row.id), target))
    // By position: the field is a parameter, and two parameters never count as one expression.
    .groupBy(sql`1`)
    .orderBy(sql`2 desc, 1`);
  if (rows.length === 0) return [];
  const featureCount = rows.reduce((sum, r) => sum + r.count, 0);
  return [
    {
      kind: "unmapped-values",
      values: rows.slice(0, MAX_LISTED_VALUES).map((r) => r.value),
      featureCount,
      message: `${rows.length} value(s) of "${row.mappingField}" on ${featureCount} feature(s) have no ${what.replace(/^an? /, "")} yet.`,
    },
  ];
}

export async function toLayer(db: DbOrTx, row: LayerRow): Promise<Layer> {
  return {
    id: row.id,
    projectId: row.projectId,
    kind: row.kind,
    name: row.name,
    format: row.format,
    originalFilename: row.originalFilename,
    sizeBytes: row.sizeBytes,
    status: row.status,
    progress: progressOf(row.progress),
    error: (row.error as LayerError | null) ?? null,
    notes: (row.notes as LayerNote[]) ?? [],
    problems: await layerProblems(db, row),
    featureCount: row.featureCount,
    fields: (row.fields as string[]) ?? [],
    mappingField: row.mappingField,
    terrain: (row.terrain as Record<string, unknown> | null) ?? null,
    bbox4326: (row.bbox4326 as Bbox | null) ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
