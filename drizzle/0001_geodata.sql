CREATE TYPE "public"."layer_kind" AS ENUM('cover', 'soil', 'terrain', 'channel', 'boundary');--> statement-breakpoint
CREATE TYPE "public"."layer_status" AS ENUM('queued', 'processing', 'ready', 'failed');--> statement-breakpoint
CREATE TYPE "public"."regime_break_kind" AS ENUM('sheet-end', 'channel-start');--> statement-breakpoint
CREATE TYPE "public"."scenario" AS ENUM('existing', 'proposed');--> statement-breakpoint
CREATE TABLE "attribute_mappings" (
	"layer_id" uuid NOT NULL,
	"value" text NOT NULL,
	"surface_class_id" uuid,
	"hsg" text,
	CONSTRAINT "attribute_mappings_layer_id_value_pk" PRIMARY KEY("layer_id","value")
);
--> statement-breakpoint
CREATE TABLE "design_rules" (
	"project_id" uuid PRIMARY KEY NOT NULL,
	"rules" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"dual_hsg" text DEFAULT 'undrained' NOT NULL,
	"channel_slope" text DEFAULT 'end-to-end' NOT NULL,
	"rainfall_table_id" uuid,
	"profile_spacing_m" double precision DEFAULT 5 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "elevation_overrides" (
	"subcatchment_id" uuid NOT NULL,
	"station_m" double precision NOT NULL,
	"elevation_m" double precision NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	CONSTRAINT "elevation_overrides_subcatchment_id_station_m_pk" PRIMARY KEY("subcatchment_id","station_m")
);
--> statement-breakpoint
CREATE TABLE "flow_paths" (
	"subcatchment_id" uuid PRIMARY KEY NOT NULL,
	"geom" geometry(LineString,4326) NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "flow_paths_version_positive" CHECK ("flow_paths"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "layer_features" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"layer_id" uuid NOT NULL,
	"feature_index" integer NOT NULL,
	"geom" geometry(Geometry,4326) NOT NULL,
	"attributes" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"surface_class_id" uuid,
	"hsg" text,
	CONSTRAINT "layer_features_layer_index" UNIQUE("layer_id","feature_index")
);
--> statement-breakpoint
CREATE TABLE "layers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"kind" "layer_kind" NOT NULL,
	"name" text NOT NULL,
	"format" text NOT NULL,
	"original_filename" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"object_key" text,
	"status" "layer_status" DEFAULT 'queued' NOT NULL,
	"progress" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"error" jsonb,
	"notes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"feature_count" integer DEFAULT 0 NOT NULL,
	"fields" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"mapping_field" text,
	"terrain" jsonb,
	"bbox_4326" jsonb,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "project_surface_overrides" (
	"project_id" uuid NOT NULL,
	"surface_class_id" uuid NOT NULL,
	"values" jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "project_surface_overrides_project_id_surface_class_id_pk" PRIMARY KEY("project_id","surface_class_id")
);
--> statement-breakpoint
CREATE TABLE "rainfall_tables" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"units" text NOT NULL,
	"idf" jsonb NOT NULL,
	"p2_24h" double precision,
	"source_note" text DEFAULT '' NOT NULL,
	"original_filename" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "regime_breaks" (
	"subcatchment_id" uuid NOT NULL,
	"kind" "regime_break_kind" NOT NULL,
	"station_m" double precision NOT NULL,
	CONSTRAINT "regime_breaks_subcatchment_id_kind_pk" PRIMARY KEY("subcatchment_id","kind"),
	CONSTRAINT "regime_breaks_station" CHECK ("regime_breaks"."station_m" >= 0)
);
--> statement-breakpoint
CREATE TABLE "subcatchment_results" (
	"subcatchment_id" uuid PRIMARY KEY NOT NULL,
	"flow_path_version" integer NOT NULL,
	"sheet" jsonb NOT NULL,
	"computed_by" uuid,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "subcatchments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"scenario" "scenario" DEFAULT 'existing' NOT NULL,
	"boundary" geometry(Geometry,4326),
	"outlet" geometry(Point,4326),
	"channel" jsonb,
	"note" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "subcatchments_project_name_scenario" UNIQUE("project_id","name","scenario")
);
--> statement-breakpoint
CREATE TABLE "surface_classes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"key" text NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"values" jsonb NOT NULL,
	"seeded_from" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "surface_classes_team_key" UNIQUE("team_id","key")
);
--> statement-breakpoint
ALTER TABLE "attribute_mappings" ADD CONSTRAINT "attribute_mappings_layer_id_layers_id_fk" FOREIGN KEY ("layer_id") REFERENCES "public"."layers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attribute_mappings" ADD CONSTRAINT "attribute_mappings_surface_class_id_surface_classes_id_fk" FOREIGN KEY ("surface_class_id") REFERENCES "public"."surface_classes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_rules" ADD CONSTRAINT "design_rules_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_rules" ADD CONSTRAINT "design_rules_rainfall_table_id_rainfall_tables_id_fk" FOREIGN KEY ("rainfall_table_id") REFERENCES "public"."rainfall_tables"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_rules" ADD CONSTRAINT "design_rules_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "elevation_overrides" ADD CONSTRAINT "elevation_overrides_subcatchment_id_subcatchments_id_fk" FOREIGN KEY ("subcatchment_id") REFERENCES "public"."subcatchments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "flow_paths" ADD CONSTRAINT "flow_paths_subcatchment_id_subcatchments_id_fk" FOREIGN KEY ("subcatchment_id") REFERENCES "public"."subcatchments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "flow_paths" ADD CONSTRAINT "flow_paths_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "layer_features" ADD CONSTRAINT "layer_features_layer_id_layers_id_fk" FOREIGN KEY ("layer_id") REFERENCES "public"."layers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "layer_features" ADD CONSTRAINT "layer_features_surface_class_id_surface_classes_id_fk" FOREIGN KEY ("surface_class_id") REFERENCES "public"."surface_classes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "layers" ADD CONSTRAINT "layers_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "layers" ADD CONSTRAINT "layers_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_surface_overrides" ADD CONSTRAINT "project_surface_overrides_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_surface_overrides" ADD CONSTRAINT "project_surface_overrides_surface_class_id_surface_classes_id_fk" FOREIGN KEY ("surface_class_id") REFERENCES "public"."surface_classes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rainfall_tables" ADD CONSTRAINT "rainfall_tables_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rainfall_tables" ADD CONSTRAINT "rainfall_tables_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "regime_breaks" ADD CONSTRAINT "regime_breaks_subcatchment_id_subcatchments_id_fk" FOREIGN KEY ("subcatchment_id") REFERENCES "public"."subcatchments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subcatchment_results" ADD CONSTRAINT "subcatchment_results_subcatchment_id_subcatchments_id_fk" FOREIGN KEY ("subcatchment_id") REFERENCES "public"."subcatchments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subcatchment_results" ADD CONSTRAINT "subcatchment_results_computed_by_users_id_fk" FOREIGN KEY ("computed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subcatchments" ADD CONSTRAINT "subcatchments_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subcatchments" ADD CONSTRAINT "subcatchments_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "surface_classes" ADD CONSTRAINT "surface_classes_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "layer_features_geom_gist" ON "layer_features" USING gist ("geom");--> statement-breakpoint
CREATE INDEX "layers_project_id_kind_index" ON "layers" USING btree ("project_id","kind");--> statement-breakpoint
CREATE INDEX "rainfall_tables_project_id_index" ON "rainfall_tables" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "subcatchments_project_id_index" ON "subcatchments" USING btree ("project_id");