import { sql } from "drizzle-orm";
import type { Tx } from "../db/client";
import { ReadError, type ReadNote } from "../geodata/readers/types";

/**
 * Inserts the features, batch by batch, inside the caller's transaction. Each batch is one
 * statement over a JSON array (json_array_elements) made by the reader thread; PostGIS builds
 * the geometry. Elevations (KML altitude, GPX) are dropped: the terrain layer gives elevations.
 */
export async function insertFeatures(
  tx: Tx,
  layerId: string,
  batches: readonly Uint8Array[],
  onBatch: (batchesDone: number) => Promise<void>,
): Promise<void> {
  const decoder = new TextDecoder();
  for (const [k, bytes] of batches.entries()) {
    const batch = decoder.decode(bytes);
    await tx.execute(sql`
      insert into layer_features (layer_id, feature_index, geom, attributes)
      select ${layerId}::uuid, (f ->> 'i')::int,
             ST_Force2D(ST_SetSRID(ST_GeomFromGeoJSON(f ->> 'g'), 4326)), (f -> 'a')::jsonb
      from json_array_elements(${batch}::json) as f`);
    await onBatch(k + 1);
  }
}

interface InvalidRow extends Record<string, unknown> {
  id: string;
  feature_index: number;
  reason: string;
  repairable: boolean;
}

// A repair is unambiguous when PostGIS's ST_MakeValid keeps the feature polygonal (nothing
// collapses to a line or point) and encloses the same area as the ring as drawn: a duplicate
// vertex, a ring touching itself at a point, a hole touching its shell. A bow-tie or a hole
// outside its shell changes the area (the drawn rings' signed areas cancel or add), so which
// polygon was meant is a guess and the feature is rejected instead. Relative tolerance 1e-9:
// the two areas come from the same vertices and differ only by rounding when nothing moved.
const AREA_TOLERANCE = 1e-9;

/**
 * PostGIS validity for polygon layers: repairs what is unambiguous (noted per feature) and
 * throws a ReadError naming the first feature that cannot be repaired.
 */
export async function repairOrRejectPolygons(
  tx: Tx,
  layerId: string,
  fileName: string,
): Promise<ReadNote[]> {
  const result = await tx.execute<InvalidRow>(sql`
    with bad as (
      select id, feature_index, geom, ST_IsValidReason(geom) as reason, ST_MakeValid(geom) as fixed
      from layer_features
      where layer_id = ${layerId}::uuid and not ST_IsValid(geom)
    )
    select id::text, feature_index, reason,
           (GeometryType(fixed) in ('POLYGON', 'MULTIPOLYGON')
             and abs(ST_Area(fixed) - ST_Area(geom))
                 <= ${AREA_TOLERANCE} * greatest(ST_Area(fixed), ST_Area(geom))
             and ST_Area(fixed) > 0) as repairable
    from bad
    order by feature_index`);
  const rows = result.rows;
  const refused = rows.filter((r) => !r.repairable);
  const first = refused[0];
  if (first) {
    const others = refused.length > 1 ? ` (and ${refused.length - 1} more feature(s))` : "";
    throw new ReadError(
      422,
      "invalid-polygon",
      `${fileName}: feature ${first.feature_index + 1} is not a valid polygon (${first.reason})` +
        `${others}, and repairing it would mean guessing its shape. Fix it in the source file ` +
        "and upload again.",
      `feature ${first.feature_index + 1}`,
    );
  }
  if (rows.length === 0) return [];
  await tx.execute(sql`
    update layer_features set geom = ST_CollectionExtract(ST_MakeValid(geom), 3)
    where layer_id = ${layerId}::uuid and not ST_IsValid(geom)`);
  return rows.map((r) => ({
    where: `feature ${r.feature_index + 1}`,
    message: `repaired an invalid polygon (${r.reason}); its area is unchanged`,
  }));
}

/** The layer's extent, [west, south, east, north], or null without features. */
export async function featureBbox(tx: Tx, layerId: string): Promise<number[] | null> {
  const result = await tx.execute<{ w: number | null; s: number; e: number; n: number }>(sql`
    select ST_XMin(x) as w, ST_YMin(x) as s, ST_XMax(x) as e, ST_YMax(x) as n
    from (select ST_Extent(geom) as x from layer_features where layer_id = ${layerId}::uuid) t`);
  const row = result.rows[0];
  return row && row.w !== null ? [row.w, row.s, row.e, row.n] : null;
}
