CREATE TABLE "user_yards" (
	"user_id" uuid NOT NULL,
	"yard_id" uuid NOT NULL,
	CONSTRAINT "user_yards_user_id_yard_id_pk" PRIMARY KEY("user_id","yard_id")
);
--> statement-breakpoint
ALTER TABLE "yard_spaces" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "all_yards" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "current_yard_id" uuid;--> statement-breakpoint
ALTER TABLE "user_yards" ADD CONSTRAINT "user_yards_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user_yards" ADD CONSTRAINT "user_yards_yard_id_yards_id_fk" FOREIGN KEY ("yard_id") REFERENCES "public"."yards"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_current_yard_id_yards_id_fk" FOREIGN KEY ("current_yard_id") REFERENCES "public"."yards"("id") ON DELETE set null ON UPDATE no action;