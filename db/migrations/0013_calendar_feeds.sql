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
ALTER TABLE "calendar_feeds" ADD CONSTRAINT "calendar_feeds_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;