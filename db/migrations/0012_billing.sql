CREATE TABLE "cash_closeouts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"yard_id" uuid NOT NULL,
	"business_date" text NOT NULL,
	"opening_float_cents" integer NOT NULL,
	"recorded_cents" integer NOT NULL,
	"counted_cents" integer NOT NULL,
	"over_short_cents" integer NOT NULL,
	"note" text,
	"closed_by_id" uuid NOT NULL,
	"closed_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cash_closeouts_yard_date" UNIQUE("yard_id","business_date")
);
--> statement-breakpoint
CREATE TABLE "charge_adjustments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"amount_cents" integer NOT NULL,
	"reason" text NOT NULL,
	"status" text NOT NULL,
	"requested_by_id" uuid NOT NULL,
	"requested_at" timestamp with time zone DEFAULT now() NOT NULL,
	"decided_by_id" uuid,
	"decided_at" timestamp with time zone,
	"decline_reason" text,
	CONSTRAINT "charge_adjustments_amount_positive" CHECK ("charge_adjustments"."amount_cents" > 0)
);
--> statement-breakpoint
CREATE TABLE "payments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"method" text NOT NULL,
	"amount_cents" integer NOT NULL,
	"tendered_cents" integer,
	"change_cents" integer,
	"check_number" text,
	"terminal_reference" text,
	"reason" text,
	"idempotency_key" text NOT NULL,
	"request_hash" text NOT NULL,
	"due_before_cents" integer NOT NULL,
	"receipt_email" text,
	"taken_by_id" uuid NOT NULL,
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "payments_vehicle_key" UNIQUE("vehicle_id","idempotency_key"),
	CONSTRAINT "payments_amount_positive" CHECK ("payments"."amount_cents" > 0)
);
--> statement-breakpoint
ALTER TABLE "companies" ADD COLUMN "waiver_approval_limit_cents" integer DEFAULT 10000 NOT NULL;--> statement-breakpoint
ALTER TABLE "cash_closeouts" ADD CONSTRAINT "cash_closeouts_yard_id_yards_id_fk" FOREIGN KEY ("yard_id") REFERENCES "public"."yards"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cash_closeouts" ADD CONSTRAINT "cash_closeouts_closed_by_id_users_id_fk" FOREIGN KEY ("closed_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_adjustments" ADD CONSTRAINT "charge_adjustments_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_adjustments" ADD CONSTRAINT "charge_adjustments_requested_by_id_users_id_fk" FOREIGN KEY ("requested_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_adjustments" ADD CONSTRAINT "charge_adjustments_decided_by_id_users_id_fk" FOREIGN KEY ("decided_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payments" ADD CONSTRAINT "payments_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payments" ADD CONSTRAINT "payments_taken_by_id_users_id_fk" FOREIGN KEY ("taken_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "charge_adjustments_vehicle" ON "charge_adjustments" USING btree ("vehicle_id");--> statement-breakpoint
CREATE INDEX "payments_vehicle" ON "payments" USING btree ("vehicle_id");--> statement-breakpoint
CREATE INDEX "payments_taken_at" ON "payments" USING btree ("taken_at");