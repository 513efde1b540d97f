CREATE TABLE "owner_decisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"link_id" uuid NOT NULL,
	"choice" text NOT NULL,
	"sign_over_to" text,
	"full_name" text NOT NULL,
	"phone" text,
	"note" text,
	"ip" text NOT NULL,
	"user_agent" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "owner_links" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"code_hash" text NOT NULL,
	"created_by_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	"revoked_by_id" uuid,
	CONSTRAINT "owner_links_tokenHash_unique" UNIQUE("token_hash"),
	CONSTRAINT "owner_links_codeHash_unique" UNIQUE("code_hash"),
	CONSTRAINT "owner_links_expires_after_created" CHECK ("owner_links"."expires_at" > "owner_links"."created_at")
);
--> statement-breakpoint
ALTER TABLE "yards" ADD COLUMN "hours" text;--> statement-breakpoint
ALTER TABLE "vehicles" ADD COLUMN "owner_choice" text;--> statement-breakpoint
ALTER TABLE "vehicles" ADD COLUMN "owner_choice_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "owner_decisions" ADD CONSTRAINT "owner_decisions_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "owner_decisions" ADD CONSTRAINT "owner_decisions_link_id_owner_links_id_fk" FOREIGN KEY ("link_id") REFERENCES "public"."owner_links"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "owner_links" ADD CONSTRAINT "owner_links_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "owner_links" ADD CONSTRAINT "owner_links_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "owner_links" ADD CONSTRAINT "owner_links_revoked_by_id_users_id_fk" FOREIGN KEY ("revoked_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "owner_decisions_vehicle_at" ON "owner_decisions" USING btree ("vehicle_id","at");--> statement-breakpoint
CREATE INDEX "owner_links_vehicle" ON "owner_links" USING btree ("vehicle_id");