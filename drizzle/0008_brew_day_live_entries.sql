CREATE TYPE "public"."brew_day_entry_kind" AS ENUM('field', 'step');--> statement-breakpoint
CREATE TYPE "public"."brew_day_entry_outcome" AS ENUM('saved', 'conflict');--> statement-breakpoint
CREATE TABLE "brew_day_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"brew_day_id" uuid NOT NULL,
	"author_id" text NOT NULL,
	"idempotency_key" uuid NOT NULL,
	"kind" "brew_day_entry_kind" NOT NULL,
	"name" varchar(40) NOT NULL,
	"request" jsonb NOT NULL,
	"outcome" "brew_day_entry_outcome" NOT NULL,
	"status" smallint NOT NULL,
	"response" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "brew_days" ADD COLUMN "checked_steps" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "brew_day_entries" ADD CONSTRAINT "brew_day_entries_brew_day_id_brew_days_id_fk" FOREIGN KEY ("brew_day_id") REFERENCES "public"."brew_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brew_day_entries" ADD CONSTRAINT "brew_day_entries_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "brew_day_entries_key_idx" ON "brew_day_entries" USING btree ("idempotency_key");--> statement-breakpoint
CREATE INDEX "brew_day_entries_day_idx" ON "brew_day_entries" USING btree ("brew_day_id","created_at");