/**
 * Loads the invented demo basemap (demo-geo/out/basemap.geojson) into basemap_features, once per
 * database (seed_runs "basemap-v1"), in one transaction under an advisory lock, so two processes
 * starting together load it once. A new version of the file gets a new seed name.
 */
import { readFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { eq, sql } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "../db/client";
import { seedRuns } from "../db/schema";
import { BASEMAP_KINDS, basemapFeatures } from "../db/schema-basemap";

export const BASEMAP_SEED_NAME = "basemap-v1";
export const BASEMAP_FILE = fileURLToPath(
  new URL("../../demo-geo/out/basemap.geojson", import.meta.url),
);
// Any constant unique to this seed; other seeds take their own.
const LOCK_KEY = 7_311_402;

const featureSchema = z.object({
  type: z.literal("Feature"),
  properties: z.looseObject({ layer: z.enum(BASEMAP_KINDS), name: z.string().nullish() }),
  geometry: z.object({
    type: z.enum(["Point", "LineString", "Polygon", "MultiLineString", "MultiPolygon"]),
    coordinates: z.array(z.unknown()).min(1),
  }),
});
const fileSchema = z.object({
  type: z.literal("FeatureCollection"),
  features: z.array(z.unknown()),
});

/** The file's features, checked; an error names the feature (1-based) and what is wrong. */
export function parseBasemap(text: string): z.output<typeof featureSchema>[] {
  const file = fileSchema.parse(JSON.parse(text));
  return file.features.map((raw, k) => {
    const parsed = featureSchema.safeParse(raw);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      throw new Error(
        `basemap feature ${k + 1}: ${issue?.path.join(".") ?? ""} ${issue?.message ?? "invalid"}`,
      );
    }
    return parsed.data;
  });
}

export async function seedBasemap(db: Db, file = BASEMAP_FILE): Promise<{ ran: boolean }> {
  const [seen] = await db.select().from(seedRuns).where(eq(seedRuns.name, BASEMAP_SEED_NAME));
  if (seen) return { ran: false };
  const features = parseBasemap(await readFile(file, "utf8"));
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${LOCK_KEY})`);
    const [done] = await tx.select().from(seedRuns).where(eq(seedRuns.name, BASEMAP_SEED_NAME));
    if (done) return { ran: false };
    await tx.delete(basemapFeatures);
    const rows = features.map(({ properties: { layer, name, ...rest }, geometry }) => ({
      kind: layer,
      name: name ?? null,
      properties: rest,
      geometry: JSON.stringify(geometry),
    }));
    // One statement for the whole file: the rows go over as one JSON parameter.
    await tx.execute(sql`
      insert into basemap_features (kind, name, properties, geom)
      select r->>'kind', r->>'name', r->'properties',
             ST_SetSRID(ST_GeomFromGeoJSON(r->>'geometry'), 4326)
      from json_array_elements(${JSON.stringify(rows)}::json) r`);
    await tx.insert(seedRuns).values({ name: BASEMAP_SEED_NAME });
    return { ran: true };
  });
}
