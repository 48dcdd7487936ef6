/**
 * The one way a compute reads layer features near a place: the project's ready layers of the
 * wanted kinds first, then each layer's features whose box meets the place, through the
 * (layer_id, geom) GiST index. Other projects' features in the same box are never read, so a
 * compute costs the same whatever other teams keep there (docs/decisions/007).
 */
import { sql, type SQL } from "drizzle-orm";
import type { LayerKind } from "../../shared/schemas/layers";

/**
 * Rows (kind, id, geom, surface_class_id, hsg) for a FROM clause. `box` is any geometry
 * expression in EPSG:4326; it is evaluated once, not per layer.
 */
export function projectFeaturesNear(projectId: string, kinds: readonly LayerKind[], box: SQL): SQL {
  return sql`(
    select l.kind, f.id, f.geom, f.surface_class_id, f.hsg
    from (select id, kind from layers
          where project_id = ${projectId}::uuid and status = 'ready'
            and kind::text in (${sql.join(
              kinds.map((k) => sql`${k}`),
              sql`, `,
            )})
          offset 0) l
    cross join lateral (
      select lf.id, lf.geom, lf.surface_class_id, lf.hsg from layer_features lf
      where lf.layer_id = l.id and lf.geom && ${box}
      offset 0 -- one index scan per layer, never one scan of every layer's features
    ) f
  )`;
}
