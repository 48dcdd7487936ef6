CREATE TABLE "basemap_features" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"kind" text NOT NULL,
	"name" text,
	"properties" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"geom" geometry(Geometry,4326) NOT NULL
);
--> statement-breakpoint
CREATE INDEX "basemap_features_geom_gist" ON "basemap_features" USING gist ("geom");--> statement-breakpoint
CREATE INDEX "basemap_features_kind_index" ON "basemap_features" USING btree ("kind");