/**
 * A project's layers as one Mapbox Vector Tile, built by PostGIS in one query: each source-layer
 * is ST_AsMVT over ST_AsMVTGeom (Web Mercator, 4096 units, 64 units of buffer, clipped), and the
 * concatenated layers make the tile. Features are found through the (layer_id, geom) GiST index
 * with the tile's envelope (plus the buffer) transformed to 4326.
 *
 * Source-layers (the map desk's contract):
 *   cover          featureId, layerId, classId, classKey, className, colour (null class: unmapped)
 *                  from zoom POLYGON_LAYERS_MIN_ZOOM up
 *   soil           featureId, layerId, hsg (from the same zoom)
 *   channel        featureId, layerId
 *   boundary       featureId, layerId        (layers of kind "boundary")
 *   subcatchments  id, name, scenario        (their boundaries)
 * Vector features of layers carry their row id as the MVT feature id (for hover state).
 */
import { sql, type SQL } from "drizzle-orm";
import type { Db } from "../db/client";
import { executePrepared } from "../db/prepared";
import type { TileCoords } from "./coords";

/** Bump when the tile's content changes shape, so clients drop tiles cached under old ETags. */
export const PROJECT_TILE_FORMAT = 1;

const EXTENT = 4096;
const BUFFER = 64;

/**
 * Cover and soil polygons are served from this zoom up (a view about 5 km wide at 1280 px). A
 * site's cover can hold 100,000 digitized polygons; below this zoom one tile would carry tens of
 * thousands of them, megabytes that take a PostGIS core hundreds of milliseconds to cut. The
 * map shows those layers from here and says so below it (docs/map-tiles.md).
 */
export const POLYGON_LAYERS_MIN_ZOOM = 15;

/**
 * Below this zoom, features whose bounding box is under a quarter of a tile pixel are left out
 * before they are reprojected: they would snap to nothing anyway.
 */
const DETAIL_ZOOM = 17;

/** The one query that builds a tile (exported so the bench can EXPLAIN it). */
export function projectTileQuery(projectId: string, t: TileCoords): SQL {
  // Degrees per tile pixel (256 px tiles) at this zoom; the size filter compares with a quarter.
  const minSizeDeg = t.z >= DETAIL_ZOOM ? 0 : 360 / 2 ** t.z / 256 / 4;
  return sql`
    with bounds as (
      select ST_TileEnvelope(${t.z}::int, ${t.x}::int, ${t.y}::int) as env,
             ST_Transform(
               ST_TileEnvelope(${t.z}::int, ${t.x}::int, ${t.y}::int,
                 margin => ${BUFFER / EXTENT}::float8), 4326) as env4326
    ),
    project_layers as (
      select id, kind from layers
      where project_id = ${projectId}::uuid and status = 'ready'
        and (kind in ('channel', 'boundary')
             or (kind in ('cover', 'soil') and ${t.z}::int >= ${POLYGON_LAYERS_MIN_ZOOM}::int))
    ),
    features as (
      -- Per layer (a lateral join): a layer left out at this zoom is never scanned, and each
      -- layer's features are found through the (layer_id, geom) GiST index.
      select f.id, f.layer_id, l.kind, f.surface_class_id, f.hsg,
             ST_AsMVTGeom(ST_Transform(f.geom, 3857), b.env, ${EXTENT}, ${BUFFER}, true) as geom
      from project_layers l
      cross join bounds b
      join lateral (
        select * from layer_features lf
        where lf.layer_id = l.id and lf.geom && b.env4326
          and (${minSizeDeg}::float8 = 0
               or ST_GeometryType(lf.geom) in ('ST_Point', 'ST_MultiPoint')
               or greatest(ST_XMax(lf.geom) - ST_XMin(lf.geom), ST_YMax(lf.geom) - ST_YMin(lf.geom))
                  >= ${minSizeDeg}::float8)
        offset 0 -- keeps the subquery per layer (not flattened into one scan of every layer)
      ) f on true
    ),
    cover as (
      select f.id as mvt_id, f.id as "featureId", f.layer_id::text as "layerId",
             c.id::text as "classId", c.key as "classKey", c.name as "className",
             coalesce(o.values->>'colour', c.values->>'colour') as colour, f.geom
      from features f
      left join surface_classes c on c.id = f.surface_class_id
      left join project_surface_overrides o
        on o.project_id = ${projectId}::uuid and o.surface_class_id = c.id
      where f.kind = 'cover' and f.geom is not null
    ),
    soil as (
      select f.id as mvt_id, f.id as "featureId", f.layer_id::text as "layerId", f.hsg, f.geom
      from features f where f.kind = 'soil' and f.geom is not null
    ),
    channel as (
      select f.id as mvt_id, f.id as "featureId", f.layer_id::text as "layerId", f.geom
      from features f where f.kind = 'channel' and f.geom is not null
    ),
    boundary as (
      select f.id as mvt_id, f.id as "featureId", f.layer_id::text as "layerId", f.geom
      from features f where f.kind = 'boundary' and f.geom is not null
    ),
    subs as (
      select * from (
        select s.id::text as id, s.name, s.scenario::text as scenario,
               ST_AsMVTGeom(ST_Transform(s.boundary, 3857), b.env, ${EXTENT}, ${BUFFER}, true)
                 as geom
        from subcatchments s cross join bounds b
        where s.project_id = ${projectId}::uuid and s.boundary is not null
          and s.boundary && b.env4326
      ) q where q.geom is not null
    )
    select coalesce((select ST_AsMVT(cover, 'cover', ${EXTENT}, 'geom', 'mvt_id') from cover), '')
        || coalesce((select ST_AsMVT(soil, 'soil', ${EXTENT}, 'geom', 'mvt_id') from soil), '')
        || coalesce((select ST_AsMVT(channel, 'channel', ${EXTENT}, 'geom', 'mvt_id') from channel), '')
        || coalesce((select ST_AsMVT(boundary, 'boundary', ${EXTENT}, 'geom', 'mvt_id') from boundary), '')
        || coalesce((select ST_AsMVT(subs, 'subcatchments', ${EXTENT}, 'geom') from subs), '')
        as tile`;
}

export async function projectTile(db: Db, projectId: string, t: TileCoords): Promise<Uint8Array> {
  const rows = await executePrepared<{ tile: Buffer | null }>(
    db,
    "project-tile",
    projectTileQuery(projectId, t),
  );
  const tile = rows[0]?.tile;
  return tile ? new Uint8Array(tile.buffer, tile.byteOffset, tile.byteLength) : new Uint8Array();
}

/**
 * What the project's tiles are made of, as one short string: it changes whenever a layer, a
 * mapping (it touches its layer), a surface class's name or colour, a project override or a
 * subcatchment boundary changes, or when one of them is added or removed (the counts).
 */
export async function projectTileVersion(
  db: Db,
  projectId: string,
  teamId: string,
): Promise<string> {
  const result = await db.execute<{ v: string }>(sql`
    select concat_ws('|',
      (select count(*) || '/' || coalesce(max(updated_at)::text, '') from layers
        where project_id = ${projectId}::uuid),
      (select count(*) || '/' || coalesce(max(updated_at)::text, '') from subcatchments
        where project_id = ${projectId}::uuid),
      (select count(*) || '/' || coalesce(max(updated_at)::text, '') from surface_classes
        where team_id = ${teamId}::uuid),
      (select count(*) || '/' || coalesce(max(updated_at)::text, '') from project_surface_overrides
        where project_id = ${projectId}::uuid)) as v`);
  return result.rows[0]?.v ?? "";
}
