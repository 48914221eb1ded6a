ALTER TABLE "brew_day_entries" ADD COLUMN "changes_value" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "brew_day_entries" ADD COLUMN "resolved_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "brew_day_entries" ADD COLUMN "resolved_by_entry_id" uuid;--> statement-breakpoint
UPDATE "brew_day_entries" SET "changes_value" = false WHERE "outcome" = 'conflict';