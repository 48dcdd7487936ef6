DROP INDEX "layer_features_geom_gist";--> statement-breakpoint
CREATE INDEX "layer_features_layer_geom_gist" ON "layer_features" USING gist ("layer_id","geom");