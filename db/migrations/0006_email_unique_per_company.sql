DROP INDEX "users_email_lower";--> statement-breakpoint
CREATE UNIQUE INDEX "users_company_email_lower" ON "users" USING btree ("company_id",lower("email"));--> statement-breakpoint
CREATE INDEX "users_email_lower" ON "users" USING btree (lower("email"));