CREATE TABLE "companies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"phone" text,
	"address" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stock_counters" (
	"yard_id" uuid NOT NULL,
	"year" integer NOT NULL,
	"last" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "stock_counters_yard_year" UNIQUE("yard_id","year")
);
--> statement-breakpoint
CREATE TABLE "yard_spaces" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"yard_id" uuid NOT NULL,
	"row" text NOT NULL,
	"number" integer NOT NULL,
	"size" text DEFAULT 'standard' NOT NULL,
	CONSTRAINT "yard_spaces_position" UNIQUE("yard_id","row","number")
);
--> statement-breakpoint
CREATE TABLE "yards" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"name" text NOT NULL,
	"code" text NOT NULL,
	"address" text NOT NULL,
	"phone" text,
	"lat" double precision NOT NULL,
	"lng" double precision NOT NULL,
	"time_zone" text NOT NULL,
	"rule_set_id" uuid,
	"labour_rate_cents" integer DEFAULT 0 NOT NULL,
	"tow_rates" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "yards_code_unique" UNIQUE("code"),
	CONSTRAINT "yards_code_format" CHECK ("yards"."code" ~ '^[A-Z]{2,4}$')
);
--> statement-breakpoint
CREATE TABLE "app_settings" (
	"key" text PRIMARY KEY NOT NULL,
	"value" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sessions" (
	"sid" text PRIMARY KEY NOT NULL,
	"user_id" uuid,
	"data" jsonb NOT NULL,
	"expires_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" text NOT NULL,
	"password_hash" text NOT NULL,
	"active" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "vehicles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"yard_id" uuid NOT NULL,
	"stock_number" text NOT NULL,
	"vin" text,
	"vin_override_reason" text,
	"plate" text,
	"plate_state" text,
	"year" integer,
	"make" text,
	"model" text,
	"colour" text,
	"body" text,
	"vehicle_class" text DEFAULT 'standard' NOT NULL,
	"odometer" integer,
	"odometer_unreadable" boolean DEFAULT false NOT NULL,
	"keys" text DEFAULT 'unknown' NOT NULL,
	"keys_where" text,
	"drivable_as_found" boolean,
	"rolls" boolean,
	"steers" boolean,
	"brakes" boolean,
	"state" text DEFAULT 'arrival' NOT NULL,
	"disposition" text,
	"version" integer DEFAULT 1 NOT NULL,
	"space_id" uuid,
	"condition_notes" text,
	"checked_by_id" uuid,
	"rule_set_version_id" uuid,
	"owner_name" text,
	"estimated_value_cents" integer,
	"arrived_at" timestamp with time zone NOT NULL,
	"closed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "vehicles_stockNumber_unique" UNIQUE("stock_number"),
	CONSTRAINT "vehicles_closed_has_disposition" CHECK (("vehicles"."state" = 'closed') = ("vehicles"."disposition" is not null)),
	CONSTRAINT "vehicles_closed_has_no_space" CHECK ("vehicles"."state" <> 'closed' or "vehicles"."space_id" is null),
	CONSTRAINT "vehicles_version_positive" CHECK ("vehicles"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "tows" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"pickup_lat" double precision,
	"pickup_lng" double precision,
	"pickup_address" text,
	"reason" text NOT NULL,
	"reason_note" text,
	"requester_name" text,
	"requester_agency" text,
	"requester_reference" text,
	"called_at" timestamp with time zone,
	"hooked_at" timestamp with time zone,
	"arrived_at" timestamp with time zone NOT NULL,
	"truck" text,
	"driver" text,
	"straight_miles" double precision,
	"road_miles" double precision,
	"charge_cents" integer DEFAULT 0 NOT NULL,
	"charge_lines" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tows_vehicleId_unique" UNIQUE("vehicle_id")
);
--> statement-breakpoint
CREATE TABLE "holds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"agency" text,
	"case_number" text,
	"until" timestamp with time zone,
	"note" text,
	"set_by_id" uuid,
	"set_at" timestamp with time zone DEFAULT now() NOT NULL,
	"lifted_by_id" uuid,
	"lifted_at" timestamp with time zone,
	"lift_reason" text
);
--> statement-breakpoint
CREATE TABLE "files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"storage_key" text NOT NULL,
	"thumb_key" text,
	"mime" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer,
	"height" integer,
	"label" text,
	"uploaded_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "files_storageKey_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
CREATE TABLE "property_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"item" text NOT NULL,
	"location" text,
	"count" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "history_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"seq" integer NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_id" uuid,
	"actor_label" text NOT NULL,
	"kind" text NOT NULL,
	"from_state" text,
	"to_state" text,
	"reason" text,
	"before" jsonb,
	"after" jsonb,
	"prev_hash" text NOT NULL,
	"hash" text NOT NULL,
	CONSTRAINT "history_vehicle_seq" UNIQUE("vehicle_id","seq")
);
--> statement-breakpoint
CREATE TABLE "rule_set_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"rule_set_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"body" jsonb NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rule_set_versions_number" UNIQUE("rule_set_id","version")
);
--> statement-breakpoint
CREATE TABLE "rule_sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid,
	"slug" text NOT NULL,
	"name" text NOT NULL,
	"sample" text DEFAULT 'local' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rule_sets_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
ALTER TABLE "stock_counters" ADD CONSTRAINT "stock_counters_yard_id_yards_id_fk" FOREIGN KEY ("yard_id") REFERENCES "public"."yards"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "yard_spaces" ADD CONSTRAINT "yard_spaces_yard_id_yards_id_fk" FOREIGN KEY ("yard_id") REFERENCES "public"."yards"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "yards" ADD CONSTRAINT "yards_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_yard_id_yards_id_fk" FOREIGN KEY ("yard_id") REFERENCES "public"."yards"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_space_id_yard_spaces_id_fk" FOREIGN KEY ("space_id") REFERENCES "public"."yard_spaces"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_checked_by_id_users_id_fk" FOREIGN KEY ("checked_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tows" ADD CONSTRAINT "tows_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "holds" ADD CONSTRAINT "holds_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "holds" ADD CONSTRAINT "holds_set_by_id_users_id_fk" FOREIGN KEY ("set_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "holds" ADD CONSTRAINT "holds_lifted_by_id_users_id_fk" FOREIGN KEY ("lifted_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "files" ADD CONSTRAINT "files_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "files" ADD CONSTRAINT "files_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "property_items" ADD CONSTRAINT "property_items_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "history_events" ADD CONSTRAINT "history_events_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "history_events" ADD CONSTRAINT "history_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rule_set_versions" ADD CONSTRAINT "rule_set_versions_rule_set_id_rule_sets_id_fk" FOREIGN KEY ("rule_set_id") REFERENCES "public"."rule_sets"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rule_set_versions" ADD CONSTRAINT "rule_set_versions_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rule_sets" ADD CONSTRAINT "rule_sets_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sessions_expires_at" ON "sessions" USING btree ("expires_at");--> statement-breakpoint
CREATE INDEX "sessions_user_id" ON "sessions" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_lower" ON "users" USING btree (lower("email"));--> statement-breakpoint
CREATE UNIQUE INDEX "vehicles_space_occupied" ON "vehicles" USING btree ("space_id") WHERE "vehicles"."space_id" is not null;--> statement-breakpoint
CREATE INDEX "vehicles_yard_state" ON "vehicles" USING btree ("yard_id","state");--> statement-breakpoint
CREATE INDEX "vehicles_plate" ON "vehicles" USING btree ("plate");--> statement-breakpoint
CREATE INDEX "vehicles_vin" ON "vehicles" USING btree ("vin");--> statement-breakpoint
CREATE INDEX "holds_vehicle" ON "holds" USING btree ("vehicle_id");--> statement-breakpoint
CREATE INDEX "files_vehicle" ON "files" USING btree ("vehicle_id");--> statement-breakpoint
CREATE INDEX "property_items_vehicle" ON "property_items" USING btree ("vehicle_id");--> statement-breakpoint
CREATE INDEX "history_vehicle_at" ON "history_events" USING btree ("vehicle_id","at");