ALTER TABLE "vehicles" ADD COLUMN "inspected_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "vehicles" ADD COLUMN "inspected_by_id" uuid;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_inspected_by_id_users_id_fk" FOREIGN KEY ("inspected_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "vehicles_yard_closed" ON "vehicles" USING btree ("yard_id","closed_at" DESC NULLS LAST) WHERE "vehicles"."state" = 'closed';