ALTER TABLE "layers" ADD COLUMN "ingest_heartbeat_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "layers" ADD COLUMN "ingest_attempts" integer DEFAULT 0 NOT NULL;