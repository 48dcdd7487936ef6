/**
 * The demo area's basemap (roads, streams, buildings, contours, place labels), loaded from
 * demo-geo/out/basemap.geojson at start and served as vector tiles. It is not project data: the
 * same invented map sits under every project; a real site points the basemap at a self-hosted
 * style or PMTiles archive by configuration instead.
 */
import { bigserial, index, jsonb, pgTable, text } from "drizzle-orm/pg-core";
import { geometry } from "./geometry";

export const BASEMAP_KINDS = ["roads", "streams", "buildings", "contours", "places"] as const;

export const basemapFeatures = pgTable(
  "basemap_features",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    /** The source-layer the feature is drawn in: one of BASEMAP_KINDS. */
    kind: text("kind").notNull(),
    name: text("name"),
    /** Everything else a style needs (road class, contour elevation and index, place kind). */
    properties: jsonb("properties").notNull().default({}),
    geom: geometry("geom", "Geometry").notNull(),
  },
  (t) => [index("basemap_features_geom_gist").using("gist", t.geom), index().on(t.kind)],
);
