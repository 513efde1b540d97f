CREATE TABLE "card_checkouts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"session_id" text NOT NULL,
	"amount_cents" integer NOT NULL,
	"idempotency_key" text NOT NULL,
	"request_hash" text NOT NULL,
	"started_by_id" uuid,
	"owner_link_id" uuid,
	"receipt_email" text,
	"receipt_language" text NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"refusal" text,
	"payment_id" uuid,
	"url" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"completed_at" timestamp with time zone,
	CONSTRAINT "card_checkouts_sessionId_unique" UNIQUE("session_id"),
	CONSTRAINT "card_checkouts_vehicle_key" UNIQUE("vehicle_id","idempotency_key"),
	CONSTRAINT "card_checkouts_amount_positive" CHECK ("card_checkouts"."amount_cents" > 0),
	CONSTRAINT "card_checkouts_started_by_someone" CHECK (("card_checkouts"."started_by_id" is null) <> ("card_checkouts"."owner_link_id" is null))
);
--> statement-breakpoint
CREATE TABLE "card_webhook_events" (
	"event_id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"session_id" text,
	"outcome" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "payments" ALTER COLUMN "taken_by_id" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "payments" ADD COLUMN "provider_reference" text;--> statement-breakpoint
ALTER TABLE "card_checkouts" ADD CONSTRAINT "card_checkouts_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "card_checkouts" ADD CONSTRAINT "card_checkouts_started_by_id_users_id_fk" FOREIGN KEY ("started_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "card_checkouts" ADD CONSTRAINT "card_checkouts_owner_link_id_owner_links_id_fk" FOREIGN KEY ("owner_link_id") REFERENCES "public"."owner_links"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "card_checkouts" ADD CONSTRAINT "card_checkouts_payment_id_payments_id_fk" FOREIGN KEY ("payment_id") REFERENCES "public"."payments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "card_checkouts_vehicle" ON "card_checkouts" USING btree ("vehicle_id");