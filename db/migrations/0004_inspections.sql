CREATE TABLE "inspection_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"inspection_id" uuid NOT NULL,
	"item_code" text NOT NULL,
	"status" text NOT NULL,
	"note" text,
	"updated_by_id" uuid NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "inspection_items_one_per_code" UNIQUE("inspection_id","item_code"),
	CONSTRAINT "inspection_items_status" CHECK ("inspection_items"."status" in ('ok', 'worn', 'broken', 'not_checked'))
);
--> statement-breakpoint
CREATE TABLE "inspection_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"inspection_id" uuid NOT NULL,
	"item_code" text,
	"part" text NOT NULL,
	"quantity" integer NOT NULL,
	"unit_price_cents" integer NOT NULL,
	"labour_hundredths" integer NOT NULL,
	"labour_rate_cents" integer NOT NULL,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "inspection_lines_part" CHECK (length(btrim("inspection_lines"."part")) between 1 and 120),
	CONSTRAINT "inspection_lines_quantity" CHECK ("inspection_lines"."quantity" between 1 and 99),
	CONSTRAINT "inspection_lines_price" CHECK ("inspection_lines"."unit_price_cents" between 0 and 5000000),
	CONSTRAINT "inspection_lines_hours" CHECK ("inspection_lines"."labour_hundredths" between 0 and 4000),
	CONSTRAINT "inspection_lines_rate" CHECK ("inspection_lines"."labour_rate_cents" >= 0)
);
--> statement-breakpoint
CREATE TABLE "inspection_photos" (
	"file_id" uuid NOT NULL,
	"inspection_id" uuid NOT NULL,
	"item_code" text NOT NULL,
	CONSTRAINT "inspection_photos_file_id_pk" PRIMARY KEY("file_id")
);
--> statement-breakpoint
CREATE TABLE "inspections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"started_by_id" uuid NOT NULL,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"safety_acknowledged_by_id" uuid,
	"safety_acknowledged_at" timestamp with time zone,
	"wheel_refitted" boolean,
	"lug_torque_ft_lbf" integer,
	"actual_cash_value_cents" integer,
	"actual_cash_value_source" text,
	"salvage_value_cents" integer,
	"salvage_value_source" text,
	"values_entered_by_id" uuid,
	"values_entered_at" timestamp with time zone,
	"finished_by_id" uuid,
	"finished_at" timestamp with time zone,
	CONSTRAINT "inspections_acv_range" CHECK ("inspections"."actual_cash_value_cents" is null or "inspections"."actual_cash_value_cents" between 1 and 100000000),
	CONSTRAINT "inspections_salvage_range" CHECK ("inspections"."salvage_value_cents" is null or "inspections"."salvage_value_cents" between 0 and "inspections"."actual_cash_value_cents"),
	CONSTRAINT "inspections_values_sourced" CHECK (("inspections"."actual_cash_value_cents" is null) = ("inspections"."actual_cash_value_source" is null)),
	CONSTRAINT "inspections_salvage_sourced" CHECK (("inspections"."salvage_value_cents" is null) = ("inspections"."salvage_value_source" is null)),
	CONSTRAINT "inspections_values_together" CHECK (("inspections"."actual_cash_value_cents" is null) = ("inspections"."salvage_value_cents" is null)),
	CONSTRAINT "inspections_torque_range" CHECK ("inspections"."lug_torque_ft_lbf" is null or "inspections"."lug_torque_ft_lbf" between 20 and 400),
	CONSTRAINT "inspections_finished_by" CHECK (("inspections"."finished_at" is null) = ("inspections"."finished_by_id" is null))
);
--> statement-breakpoint
ALTER TABLE "inspection_items" ADD CONSTRAINT "inspection_items_inspection_id_inspections_id_fk" FOREIGN KEY ("inspection_id") REFERENCES "public"."inspections"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspection_items" ADD CONSTRAINT "inspection_items_updated_by_id_users_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspection_lines" ADD CONSTRAINT "inspection_lines_inspection_id_inspections_id_fk" FOREIGN KEY ("inspection_id") REFERENCES "public"."inspections"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspection_lines" ADD CONSTRAINT "inspection_lines_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspection_photos" ADD CONSTRAINT "inspection_photos_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspection_photos" ADD CONSTRAINT "inspection_photos_inspection_id_inspections_id_fk" FOREIGN KEY ("inspection_id") REFERENCES "public"."inspections"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_started_by_id_users_id_fk" FOREIGN KEY ("started_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_safety_acknowledged_by_id_users_id_fk" FOREIGN KEY ("safety_acknowledged_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_values_entered_by_id_users_id_fk" FOREIGN KEY ("values_entered_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_finished_by_id_users_id_fk" FOREIGN KEY ("finished_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "inspection_lines_inspection" ON "inspection_lines" USING btree ("inspection_id","created_at");--> statement-breakpoint
CREATE INDEX "inspection_photos_item" ON "inspection_photos" USING btree ("inspection_id","item_code");--> statement-breakpoint
CREATE UNIQUE INDEX "inspections_one_open" ON "inspections" USING btree ("vehicle_id") WHERE "inspections"."finished_at" is null;--> statement-breakpoint
CREATE INDEX "inspections_vehicle" ON "inspections" USING btree ("vehicle_id","started_at");