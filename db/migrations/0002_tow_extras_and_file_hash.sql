ALTER TABLE "tows" ADD COLUMN "winching_units" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "tows" ADD COLUMN "dollies" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "tows" ADD COLUMN "after_hours" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "files" ADD COLUMN "sha256" text NOT NULL;