CREATE TABLE "gate_passes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"release_id" uuid NOT NULL,
	"disposition" text NOT NULL,
	"token_hash" text NOT NULL,
	"code_hash" text NOT NULL,
	"issued_by_id" uuid NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"used_at" timestamp with time zone,
	"used_by_id" uuid,
	CONSTRAINT "gate_passes_tokenHash_unique" UNIQUE("token_hash"),
	CONSTRAINT "gate_passes_codeHash_unique" UNIQUE("code_hash"),
	CONSTRAINT "gate_passes_expires_after_issued" CHECK ("gate_passes"."expires_at" > "gate_passes"."issued_at")
);
--> statement-breakpoint
CREATE TABLE "release_photos" (
	"release_id" uuid NOT NULL,
	"file_id" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "release_property" (
	"release_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"returned" boolean NOT NULL,
	"note" text
);
--> statement-breakpoint
CREATE TABLE "releases" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"claimant_kind" text,
	"claimant_name" text,
	"acting_for" text,
	"id_type" text,
	"id_number" text,
	"id_issuer" text,
	"id_expiry" date,
	"id_photo_file_id" uuid,
	"authority_kind" text,
	"authority_reference" text,
	"odometer" integer,
	"odometer_unreadable" boolean DEFAULT false NOT NULL,
	"handover_recorded_at" timestamp with time zone,
	"signature_file_id" uuid,
	"signer_name" text,
	"signed_at" timestamp with time zone,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "releases_signed_has_image" CHECK (("releases"."signed_at" is null) = ("releases"."signature_file_id" is null))
);
--> statement-breakpoint
ALTER TABLE "gate_passes" ADD CONSTRAINT "gate_passes_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gate_passes" ADD CONSTRAINT "gate_passes_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gate_passes" ADD CONSTRAINT "gate_passes_issued_by_id_users_id_fk" FOREIGN KEY ("issued_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gate_passes" ADD CONSTRAINT "gate_passes_used_by_id_users_id_fk" FOREIGN KEY ("used_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_photos" ADD CONSTRAINT "release_photos_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_photos" ADD CONSTRAINT "release_photos_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_property" ADD CONSTRAINT "release_property_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_property" ADD CONSTRAINT "release_property_item_id_property_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."property_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_id_photo_file_id_files_id_fk" FOREIGN KEY ("id_photo_file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_signature_file_id_files_id_fk" FOREIGN KEY ("signature_file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "gate_passes_vehicle" ON "gate_passes" USING btree ("vehicle_id");--> statement-breakpoint
CREATE UNIQUE INDEX "release_photos_file" ON "release_photos" USING btree ("file_id");--> statement-breakpoint
CREATE UNIQUE INDEX "release_property_item" ON "release_property" USING btree ("release_id","item_id");--> statement-breakpoint
CREATE UNIQUE INDEX "releases_vehicle" ON "releases" USING btree ("vehicle_id");