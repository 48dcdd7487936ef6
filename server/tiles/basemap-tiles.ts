/**
 * The demo area's basemap as one Mapbox Vector Tile (see server/db/schema-basemap.ts), built by
 * PostGIS in one query like the project tiles. Source-layers and their properties:
 *   roads      name, class (collector | street | driveway)
 *   streams    name, class
 *   buildings  class
 *   contours   elevation (m), index (true every 5th metre)
 *   places     name, kind
 */
import { sql } from "drizzle-orm";
import type { Db } from "../db/client";
import { executePrepared } from "../db/prepared";
import type { TileCoords } from "./coords";

const EXTENT = 4096;
const BUFFER = 64;

export async function basemapTile(db: Db, t: TileCoords): Promise<Uint8Array> {
  const rows = await executePrepared<{ tile: Buffer | null }>(
    db,
    "basemap-tile",
    sql`
    with bounds as (
      select ST_TileEnvelope(${t.z}::int, ${t.x}::int, ${t.y}::int) as env,
             ST_Transform(
               ST_TileEnvelope(${t.z}::int, ${t.x}::int, ${t.y}::int,
                 margin => ${BUFFER / EXTENT}::float8), 4326) as env4326
    ),
    features as (
      select f.kind, f.name, f.properties,
             ST_AsMVTGeom(ST_Transform(f.geom, 3857), b.env, ${EXTENT}, ${BUFFER}, true) as geom
      from basemap_features f cross join bounds b
      where f.geom && b.env4326
    ),
    roads as (
      select name, properties->>'class' as class, geom
      from features where kind = 'roads' and geom is not null
    ),
    streams as (
      select name, properties->>'class' as class, geom
      from features where kind = 'streams' and geom is not null
    ),
    buildings as (
      select properties->>'class' as class, geom
      from features where kind = 'buildings' and geom is not null
    ),
    contours as (
      select (properties->>'elevation')::float8 as elevation,
             (properties->>'index')::boolean as index, geom
      from features where kind = 'contours' and geom is not null
    ),
    places as (
      select name, properties->>'kind' as kind, geom
      from features where kind = 'places' and geom is not null
    )
    select coalesce((select ST_AsMVT(roads, 'roads', ${EXTENT}, 'geom') from roads), '')
        || coalesce((select ST_AsMVT(streams, 'streams', ${EXTENT}, 'geom') from streams), '')
        || coalesce((select ST_AsMVT(buildings, 'buildings', ${EXTENT}, 'geom') from buildings), '')
        || coalesce((select ST_AsMVT(contours, 'contours', ${EXTENT}, 'geom') from contours), '')
        || coalesce((select ST_AsMVT(places, 'places', ${EXTENT}, 'geom') from places), '')
        as tile`,
  );
  const tile = rows[0]?.tile;
  return tile ? new Uint8Array(tile.buffer, tile.byteOffset, tile.byteLength) : new Uint8Array();
}
