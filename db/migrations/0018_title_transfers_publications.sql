CREATE TABLE "title_transfers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"seller_name" text NOT NULL,
	"buyer_kind" text NOT NULL,
	"buyer_name" text NOT NULL,
	"buyer_address" text NOT NULL,
	"buyer_id_type" text,
	"buyer_id_number" text,
	"price_cents" integer NOT NULL,
	"sale_date" date NOT NULL,
	"odometer" integer,
	"odometer_unreadable" boolean DEFAULT false NOT NULL,
	"gvwr_lb" integer,
	"self_propelled" boolean DEFAULT true NOT NULL,
	"due_cents" integer,
	"applied_cents" integer,
	"surplus_cents" integer,
	"shortfall_cents" integer,
	"signature_file_id" uuid,
	"signer_name" text,
	"signed_at" timestamp with time zone,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "title_transfers_price" CHECK ("title_transfers"."price_cents" >= 0),
	CONSTRAINT "title_transfers_signed_has_image" CHECK (("title_transfers"."signed_at" is null) = ("title_transfers"."signature_file_id" is null))
);
--> statement-breakpoint
CREATE TABLE "publications" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"newspaper" text NOT NULL,
	"days" date[] NOT NULL,
	"proof_file_id" uuid,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "title_transfers" ADD CONSTRAINT "title_transfers_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "title_transfers" ADD CONSTRAINT "title_transfers_signature_file_id_files_id_fk" FOREIGN KEY ("signature_file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "title_transfers" ADD CONSTRAINT "title_transfers_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publications" ADD CONSTRAINT "publications_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publications" ADD CONSTRAINT "publications_proof_file_id_files_id_fk" FOREIGN KEY ("proof_file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publications" ADD CONSTRAINT "publications_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "title_transfers_vehicle" ON "title_transfers" USING btree ("vehicle_id");--> statement-breakpoint
CREATE INDEX "publications_vehicle" ON "publications" USING btree ("vehicle_id");