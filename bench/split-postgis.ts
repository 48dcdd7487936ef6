/**
 * The PostGIS side of the split benchmark: the same polygons and path in temporary tables with
 * GiST indexes, and the queries a database-only split would use. Each returns the length per
 * (class, soil group) on the spheroid, ST_Length(ST_Intersection(…)::geography), the same
 * figure the flatbush split reports.
 */
import pg from "pg";
import type { HsgCode, LonLat, ValuedPolygon } from "../shared/geo/index";

export interface ClassLength {
  readonly cls: string | null;
  readonly hsg: string | null;
  readonly lengthM: number;
}

const wkt = (ring: readonly LonLat[]) => ring.map(([x, y]) => `${x} ${y}`).join(",");
const polygonWkt = (p: ValuedPolygon<unknown>) =>
  `POLYGON(${p.rings.map((ring) => `(${wkt(ring)})`).join(",")})`;

async function load(
  client: pg.Client,
  table: string,
  polygons: readonly ValuedPolygon<string>[],
): Promise<void> {
  await client.query(
    `CREATE TEMP TABLE ${table} (id integer PRIMARY KEY, value text, geom geometry(Polygon, 4326))`,
  );
  const BATCH = 10_000;
  for (let k = 0; k < polygons.length; k += BATCH) {
    const batch = polygons.slice(k, k + BATCH);
    await client.query(
      `INSERT INTO ${table} (id, value, geom)
       SELECT id, value, ST_GeomFromText(wkt, 4326)
       FROM unnest($1::integer[], $2::text[], $3::text[]) AS t(id, value, wkt)`,
      [batch.map((p) => p.featureId), batch.map((p) => p.value), batch.map(polygonWkt)],
    );
  }
  await client.query(`CREATE INDEX ON ${table} USING gist (geom)`);
  await client.query(`ANALYZE ${table}`);
}

/** Connects and loads cover, soil and path; the caller closes the client. */
export async function loadBenchData(
  databaseUrl: string,
  cover: readonly ValuedPolygon<string>[],
  soil: readonly ValuedPolygon<HsgCode>[],
  path: readonly LonLat[],
): Promise<pg.Client> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  await client.query("CREATE EXTENSION IF NOT EXISTS postgis");
  await load(client, "bench_cover", cover);
  await load(client, "bench_soil", soil);
  await client.query("CREATE TEMP TABLE bench_path (geom geometry(LineString, 4326))");
  await client.query("INSERT INTO bench_path VALUES (ST_GeomFromText($1, 4326))", [
    `LINESTRING(${wkt(path)})`,
  ]);
  return client;
}

/**
 * Ways to feed the path to the spatial join. The whole line makes one index probe whose box is
 * the path's box; cutting it first (into its segments, or into pieces of a few vertices) lets
 * the GiST index find only the polygons near each part.
 */
export const PATH_SOURCES = {
  "whole path": "SELECT geom FROM bench_path",
  "path cut into segments (ST_DumpSegments)":
    "SELECT (ST_DumpSegments(geom)).geom AS geom FROM bench_path",
  "path cut into ≤ 16-vertex pieces (ST_Subdivide)":
    "SELECT ST_Subdivide(geom, 16) AS geom FROM bench_path",
  "path cut into ≤ 64-vertex pieces (ST_Subdivide)":
    "SELECT ST_Subdivide(geom, 64) AS geom FROM bench_path",
  "path cut into ≤ 256-vertex pieces (ST_Subdivide)":
    "SELECT ST_Subdivide(geom, 256) AS geom FROM bench_path",
} as const;

export type PathSource = keyof typeof PATH_SOURCES;

/** Length per (cover class, soil group): cut by cover, then by soil, measured on the spheroid. */
export async function postgisClassLengths(
  client: pg.Client,
  source: PathSource,
): Promise<ClassLength[]> {
  const { rows } = await client.query<{ cls: string | null; hsg: string | null; length_m: number }>(
    `WITH parts AS (${PATH_SOURCES[source]}),
     by_cover AS (
       SELECT c.value AS cls, ST_Intersection(parts.geom, c.geom) AS geom
       FROM parts JOIN bench_cover c ON ST_Intersects(c.geom, parts.geom)
     )
     SELECT by_cover.cls, s.value AS hsg,
            sum(ST_Length(ST_Intersection(by_cover.geom, s.geom)::geography))::float8 AS length_m
     FROM by_cover JOIN bench_soil s ON ST_Intersects(s.geom, by_cover.geom)
     GROUP BY 1, 2`,
  );
  return rows.map((r) => ({ cls: r.cls, hsg: r.hsg, lengthM: r.length_m }));
}
