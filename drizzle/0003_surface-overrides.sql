CREATE TABLE "surface_overrides" (
	"subcatchment_id" uuid NOT NULL,
	"station_from_m" double precision NOT NULL,
	"station_to_m" double precision NOT NULL,
	"surface_class_id" uuid NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	CONSTRAINT "surface_overrides_subcatchment_id_station_from_m_pk" PRIMARY KEY("subcatchment_id","station_from_m"),
	CONSTRAINT "surface_overrides_stations" CHECK ("surface_overrides"."station_from_m" >= 0 and "surface_overrides"."station_to_m" > "surface_overrides"."station_from_m")
);
--> statement-breakpoint
ALTER TABLE "surface_overrides" ADD CONSTRAINT "surface_overrides_subcatchment_id_subcatchments_id_fk" FOREIGN KEY ("subcatchment_id") REFERENCES "public"."subcatchments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "surface_overrides" ADD CONSTRAINT "surface_overrides_surface_class_id_surface_classes_id_fk" FOREIGN KEY ("surface_class_id") REFERENCES "public"."surface_classes"("id") ON DELETE no action ON UPDATE no action;