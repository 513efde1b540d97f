CREATE TABLE "history_heads" (
	"vehicle_id" uuid PRIMARY KEY NOT NULL,
	"seq" integer NOT NULL,
	"hash" text NOT NULL,
	"seal" text NOT NULL
);
--> statement-breakpoint
ALTER TABLE "history_heads" ADD CONSTRAINT "history_heads_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;