CREATE TABLE "outbound_attachments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"message_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"filename" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"content" "bytea",
	"file_id" uuid,
	CONSTRAINT "outbound_attachments_one_source" CHECK (("outbound_attachments"."content" is null) <> ("outbound_attachments"."file_id" is null))
);
--> statement-breakpoint
CREATE TABLE "outbound_messages" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vehicle_id" uuid,
	"queued_by_id" uuid,
	"purpose" text NOT NULL,
	"to_address" text NOT NULL,
	"to_name" text,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"html" text,
	"language" text DEFAULT 'en' NOT NULL,
	"message_id" text NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"claim_token" uuid,
	"lease_until" timestamp with time zone,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"smtp_response" text,
	"retried_by_id" uuid,
	"retried_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	CONSTRAINT "outbound_messages_messageId_unique" UNIQUE("message_id"),
	CONSTRAINT "outbound_messages_sending_has_lease" CHECK ("outbound_messages"."status" <> 'sending' or ("outbound_messages"."lease_until" is not null and "outbound_messages"."claim_token" is not null)),
	CONSTRAINT "outbound_messages_sent_at" CHECK (("outbound_messages"."status" = 'sent') = ("outbound_messages"."sent_at" is not null)),
	CONSTRAINT "outbound_messages_attempts" CHECK ("outbound_messages"."attempts" >= 0)
);
--> statement-breakpoint
ALTER TABLE "outbound_attachments" ADD CONSTRAINT "outbound_attachments_message_id_outbound_messages_id_fk" FOREIGN KEY ("message_id") REFERENCES "public"."outbound_messages"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbound_attachments" ADD CONSTRAINT "outbound_attachments_file_id_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbound_messages" ADD CONSTRAINT "outbound_messages_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbound_messages" ADD CONSTRAINT "outbound_messages_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbound_messages" ADD CONSTRAINT "outbound_messages_queued_by_id_users_id_fk" FOREIGN KEY ("queued_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbound_messages" ADD CONSTRAINT "outbound_messages_retried_by_id_users_id_fk" FOREIGN KEY ("retried_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "outbound_attachments_message" ON "outbound_attachments" USING btree ("message_id","position");--> statement-breakpoint
CREATE INDEX "outbound_messages_company_created" ON "outbound_messages" USING btree ("company_id","created_at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "outbound_messages_due" ON "outbound_messages" USING btree ("next_attempt_at") WHERE "outbound_messages"."status" in ('queued', 'sending');--> statement-breakpoint
CREATE INDEX "outbound_messages_vehicle" ON "outbound_messages" USING btree ("vehicle_id");