/**
 * Tables of the geodata pipeline: layers and their features, the team's Surface catalog and
 * project overrides, attribute mappings, Rainfall tables, Design rules, subcatchments with their
 * flow path, regime breaks, surveyed elevations, surface overrides and computed results. Geometry
 * is EPSG:4326; stations, lengths and elevations are stored in metres (names say so) and shown in
 * project units.
 */
import { sql } from "drizzle-orm";
import {
  bigserial,
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
} from "drizzle-orm/pg-core";
import { LAYER_KINDS, LAYER_STATUSES } from "../../shared/schemas/layers";
import { SCENARIOS } from "../../shared/schemas/subcatchments";
import { geometry } from "./geometry";
import { projects, teams, users } from "./schema";

const id = () => uuid("id").primaryKey().defaultRandom();
const at = (name: string) => timestamp(name, { withTimezone: true });
const createdAt = () => at("created_at").notNull().defaultNow();
const updatedAt = () =>
  at("updated_at")
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date());
const projectRef = () =>
  uuid("project_id")
    .notNull()
    .references(() => projects.id, { onDelete: "cascade" });
const userRef = (name: string) => uuid(name).references(() => users.id, { onDelete: "set null" });

export const REGIME_BREAK_KINDS = ["sheet-end", "channel-start"] as const;

export const layerKindEnum = pgEnum("layer_kind", LAYER_KINDS);
export const layerStatusEnum = pgEnum("layer_status", LAYER_STATUSES);
export const scenarioEnum = pgEnum("scenario", SCENARIOS);
export const regimeBreakKindEnum = pgEnum("regime_break_kind", REGIME_BREAK_KINDS);

/** The team's Surface catalog: one row per class; `values` follows shared/schemas/catalog.ts. */
export const surfaceClasses = pgTable(
  "surface_classes",
  {
    id: id(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    /** Stable slug (e.g. "lawn-good"): what mappings suggest against and what exports print. */
    key: text("key").notNull(),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    values: jsonb("values").notNull(),
    /** The engineering core's default class it was seeded from, if any. */
    seededFrom: text("seeded_from"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [unique("surface_classes_team_key").on(t.teamId, t.key)],
);

/** A project's changes to a team class (partial `values`, same shape). */
export const projectSurfaceOverrides = pgTable(
  "project_surface_overrides",
  {
    projectId: projectRef(),
    surfaceClassId: uuid("surface_class_id")
      .notNull()
      .references(() => surfaceClasses.id, { onDelete: "cascade" }),
    values: jsonb("values").notNull(),
    note: text("note").notNull().default(""),
    updatedAt: updatedAt(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.surfaceClassId] })],
);

export const layers = pgTable(
  "layers",
  {
    id: id(),
    projectId: projectRef(),
    kind: layerKindEnum("kind").notNull(),
    name: text("name").notNull(),
    /** shapefile | kml | kmz | gpx | geojson | geotiff */
    format: text("format").notNull(),
    originalFilename: text("original_filename").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    /** Key of the original file in object storage. */
    objectKey: text("object_key"),
    status: layerStatusEnum("status").notNull().default("queued"),
    /** { stage, bytesReceived, bytesTotal, featuresDone, featuresTotal } */
    progress: jsonb("progress").notNull().default({}),
    /** { code, message, where? } when status is failed. */
    error: jsonb("error"),
    /** Repairs and other notes made while reading the file: [{ where, message }]. */
    notes: jsonb("notes").notNull().default([]),
    featureCount: integer("feature_count").notNull().default(0),
    /** Attribute names found in the file, in order. */
    fields: jsonb("fields").notNull().default([]),
    /** Cover: the field mapped to surface classes. Soil: the field holding the HSG. */
    mappingField: text("mapping_field"),
    /** Terrain: { width, height, crs, verticalUnit, nodata, bbox4326, pixelSize, ... } */
    terrain: jsonb("terrain"),
    bbox4326: jsonb("bbox_4326"),
    /**
     * Set by the process reading the file, every few seconds while it runs: a layer still
     * queued or processing whose heartbeat has stopped was interrupted (see ingest-sweep.ts).
     */
    ingestHeartbeatAt: at("ingest_heartbeat_at"),
    /** How many times reading the file has started (an interrupted read is tried again once). */
    ingestAttempts: integer("ingest_attempts").notNull().default(0),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index().on(t.projectId, t.kind)],
);

export const layerFeatures = pgTable(
  "layer_features",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    layerId: uuid("layer_id")
      .notNull()
      .references(() => layers.id, { onDelete: "cascade" }),
    /** Position in the uploaded file (0-based), so messages can name the feature. */
    featureIndex: integer("feature_index").notNull(),
    geom: geometry("geom", "Geometry").notNull(),
    attributes: jsonb("attributes").notNull().default({}),
    /** Cover layers, after mapping. */
    surfaceClassId: uuid("surface_class_id").references(() => surfaceClasses.id, {
      onDelete: "set null",
    }),
    /** Soil layers, after mapping: A, B, C, D, A/D, B/D or C/D. */
    hsg: text("hsg"),
  },
  (t) => [
    unique("layer_features_layer_index").on(t.layerId, t.featureIndex),
    // Layer first, then geometry (btree_gist): a box query for one layer reads only that
    // layer's features, however many other projects keep in the same place.
    index("layer_features_layer_geom_gist").using("gist", t.layerId, t.geom),
  ],
);

/** Value → class (cover) or value → HSG (soil) for a layer's mapping field. */
export const attributeMappings = pgTable(
  "attribute_mappings",
  {
    layerId: uuid("layer_id")
      .notNull()
      .references(() => layers.id, { onDelete: "cascade" }),
    value: text("value").notNull(),
    surfaceClassId: uuid("surface_class_id").references(() => surfaceClasses.id, {
      onDelete: "set null",
    }),
    hsg: text("hsg"),
  },
  (t) => [primaryKey({ columns: [t.layerId, t.value] })],
);

/** IDF data of a project; `idf` follows the engineering core's idfSchema in `units`. */
export const rainfallTables = pgTable(
  "rainfall_tables",
  {
    id: id(),
    projectId: projectRef(),
    name: text("name").notNull(),
    units: text("units").notNull(),
    idf: jsonb("idf").notNull(),
    /** 2-year 24-hour depth (in or mm) for TR-55 sheet flow. */
    p2_24h: doublePrecision("p2_24h"),
    sourceNote: text("source_note").notNull().default(""),
    originalFilename: text("original_filename"),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index().on(t.projectId)],
);

/** One row per project: the engineering core's rules plus the pipeline's own choices. */
export const designRules = pgTable("design_rules", {
  projectId: uuid("project_id")
    .primaryKey()
    .references(() => projects.id, { onDelete: "cascade" }),
  /** shared/hydrology/rules.ts rulesSchema, in the project's units. */
  rules: jsonb("rules").notNull().default({}),
  /** Dual soil groups (A/D, B/D, C/D): "drained" takes the first letter, "undrained" D. */
  dualHsg: text("dual_hsg").notNull().default("undrained"),
  /** "end-to-end" or "10-85" for channel segment slopes. */
  channelSlope: text("channel_slope").notNull().default("end-to-end"),
  rainfallTableId: uuid("rainfall_table_id").references(() => rainfallTables.id, {
    onDelete: "set null",
  }),
  /** Spacing of the elevation profile, metres. */
  profileSpacingM: doublePrecision("profile_spacing_m").notNull().default(5),
  version: integer("version").notNull().default(1),
  updatedBy: userRef("updated_by"),
  updatedAt: updatedAt(),
});

export const subcatchments = pgTable(
  "subcatchments",
  {
    id: id(),
    projectId: projectRef(),
    name: text("name").notNull(),
    scenario: scenarioEnum("scenario").notNull().default("existing"),
    boundary: geometry("boundary", "Geometry"),
    outlet: geometry("outlet", "Point"),
    /** Channel segments' Manning n and section ({ manningN, section }), project units. */
    channel: jsonb("channel"),
    note: text("note").notNull().default(""),
    version: integer("version").notNull().default(1),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index().on(t.projectId),
    unique("subcatchments_project_name_scenario").on(t.projectId, t.name, t.scenario),
  ],
);

/** The longest flow path, divide → outlet; `version` guards against lost updates (409). */
export const flowPaths = pgTable(
  "flow_paths",
  {
    subcatchmentId: uuid("subcatchment_id")
      .primaryKey()
      .references(() => subcatchments.id, { onDelete: "cascade" }),
    geom: geometry("geom", "LineString").notNull(),
    version: integer("version").notNull().default(1),
    updatedBy: userRef("updated_by"),
    updatedAt: updatedAt(),
  },
  (t) => [check("flow_paths_version_positive", sql`${t.version} > 0`)],
);

export const regimeBreaks = pgTable(
  "regime_breaks",
  {
    subcatchmentId: uuid("subcatchment_id")
      .notNull()
      .references(() => subcatchments.id, { onDelete: "cascade" }),
    kind: regimeBreakKindEnum("kind").notNull(),
    stationM: doublePrecision("station_m").notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.subcatchmentId, t.kind] }),
    check("regime_breaks_station", sql`${t.stationM} >= 0`),
  ],
);

/** Surveyed elevations typed in by the engineer; they override terrain samples. */
export const elevationOverrides = pgTable(
  "elevation_overrides",
  {
    subcatchmentId: uuid("subcatchment_id")
      .notNull()
      .references(() => subcatchments.id, { onDelete: "cascade" }),
    stationM: doublePrecision("station_m").notNull(),
    elevationM: doublePrecision("elevation_m").notNull(),
    note: text("note").notNull().default(""),
  },
  (t) => [primaryKey({ columns: [t.subcatchmentId, t.stationM] })],
);

/**
 * Stretches of the flow path the engineer says are of another surface class than the cover
 * layer gives (stations in metres from the divide; the API keeps them from overlapping).
 */
export const surfaceOverrides = pgTable(
  "surface_overrides",
  {
    subcatchmentId: uuid("subcatchment_id")
      .notNull()
      .references(() => subcatchments.id, { onDelete: "cascade" }),
    stationFromM: doublePrecision("station_from_m").notNull(),
    stationToM: doublePrecision("station_to_m").notNull(),
    // No action (checked at the end of the statement, so a team's deletion still cascades):
    // the catalog refuses to delete a class an override uses (409, naming the subcatchment).
    surfaceClassId: uuid("surface_class_id")
      .notNull()
      .references(() => surfaceClasses.id, { onDelete: "no action" }),
    note: text("note").notNull().default(""),
  },
  (t) => [
    primaryKey({ columns: [t.subcatchmentId, t.stationFromM] }),
    check(
      "surface_overrides_stations",
      sql`${t.stationFromM} >= 0 and ${t.stationToM} > ${t.stationFromM}`,
    ),
  ],
);

/** The current travel-time sheet of a subcatchment (replaced at every compute). */
export const subcatchmentResults = pgTable("subcatchment_results", {
  subcatchmentId: uuid("subcatchment_id")
    .primaryKey()
    .references(() => subcatchments.id, { onDelete: "cascade" }),
  flowPathVersion: integer("flow_path_version").notNull(),
  sheet: jsonb("sheet").notNull(),
  computedBy: userRef("computed_by"),
  computedAt: at("computed_at").notNull().defaultNow(),
});
