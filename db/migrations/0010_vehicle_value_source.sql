ALTER TABLE "vehicles" ADD COLUMN "estimated_value_source" text;--> statement-breakpoint
-- A value entered before sources were kept came from the inspection when one holds it.
UPDATE "vehicles" SET "estimated_value_source" = 'The inspection: ' || "i"."actual_cash_value_source"
FROM "inspections" "i"
WHERE "i"."vehicle_id" = "vehicles"."id" AND "vehicles"."estimated_value_cents" IS NOT NULL
  AND "i"."actual_cash_value_cents" = "vehicles"."estimated_value_cents" AND "i"."actual_cash_value_source" IS NOT NULL;
