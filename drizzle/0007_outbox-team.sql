ALTER TABLE "outbox_messages" ADD COLUMN "team_id" uuid;--> statement-breakpoint
ALTER TABLE "outbox_messages" ADD CONSTRAINT "outbox_messages_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "outbox_messages_team_id_index" ON "outbox_messages" USING btree ("team_id");