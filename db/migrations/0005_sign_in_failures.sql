CREATE TABLE "sign_in_failures" (
	"key" text PRIMARY KEY NOT NULL,
	"failures" integer NOT NULL,
	"last_failure_at" timestamp with time zone NOT NULL,
	"blocked_until" timestamp with time zone
);
--> statement-breakpoint
CREATE INDEX "sign_in_failures_last_failure_at" ON "sign_in_failures" USING btree ("last_failure_at");