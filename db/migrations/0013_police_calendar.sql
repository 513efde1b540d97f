CREATE TABLE "police_notices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"agency" text NOT NULL,
	"person" text,
	"notified_at" timestamp with time zone NOT NULL,
	"report_number" text,
	"recorded_by_id" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "police_notices_vehicleId_unique" UNIQUE("vehicle_id")
);
--> statement-breakpoint
CREATE TABLE "calendar_feeds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	CONSTRAINT "calendar_feeds_userId_unique" UNIQUE("user_id"),
	CONSTRAINT "calendar_feeds_tokenHash_unique" UNIQUE("token_hash"),
	CONSTRAINT "calendar_feeds_expires_after_created" CHECK ("calendar_feeds"."expires_at" > "calendar_feeds"."created_at")
);
--> statement-breakpoint
ALTER TABLE "police_notices" ADD CONSTRAINT "police_notices_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "police_notices" ADD CONSTRAINT "police_notices_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calendar_feeds" ADD CONSTRAINT "calendar_feeds_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;