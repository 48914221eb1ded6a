CREATE TYPE "public"."proposal_status" AS ENUM('open', 'accepted', 'declined', 'changes_requested', 'withdrawn');--> statement-breakpoint
ALTER TYPE "public"."notification_kind" ADD VALUE 'proposal';--> statement-breakpoint
ALTER TYPE "public"."notification_kind" ADD VALUE 'proposal_decision';--> statement-breakpoint
ALTER TYPE "public"."report_target" ADD VALUE 'proposal';--> statement-breakpoint
CREATE TABLE "proposal_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"proposal_id" uuid NOT NULL,
	"author_id" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "proposals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"source_recipe_id" uuid NOT NULL,
	"fork_recipe_id" uuid NOT NULL,
	"proposer_id" text NOT NULL,
	"proposed_version_id" uuid NOT NULL,
	"base_version_id" uuid NOT NULL,
	"status" "proposal_status" DEFAULT 'open' NOT NULL,
	"title" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"decision_comment" text DEFAULT '' NOT NULL,
	"decided_by_id" text,
	"decided_at" timestamp with time zone,
	"accepted_version_id" uuid,
	"hidden_at" timestamp with time zone,
	"hidden_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "proposal_comments" ADD CONSTRAINT "proposal_comments_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_comments" ADD CONSTRAINT "proposal_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_source_recipe_id_recipes_id_fk" FOREIGN KEY ("source_recipe_id") REFERENCES "public"."recipes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_fork_recipe_id_recipes_id_fk" FOREIGN KEY ("fork_recipe_id") REFERENCES "public"."recipes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_proposer_id_users_id_fk" FOREIGN KEY ("proposer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_proposed_version_id_recipe_versions_id_fk" FOREIGN KEY ("proposed_version_id") REFERENCES "public"."recipe_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_base_version_id_recipe_versions_id_fk" FOREIGN KEY ("base_version_id") REFERENCES "public"."recipe_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_decided_by_id_users_id_fk" FOREIGN KEY ("decided_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_accepted_version_id_recipe_versions_id_fk" FOREIGN KEY ("accepted_version_id") REFERENCES "public"."recipe_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "proposal_comments_proposal_idx" ON "proposal_comments" USING btree ("proposal_id","created_at");--> statement-breakpoint
CREATE INDEX "proposals_source_idx" ON "proposals" USING btree ("source_recipe_id","created_at");--> statement-breakpoint
CREATE INDEX "proposals_fork_idx" ON "proposals" USING btree ("fork_recipe_id","created_at");--> statement-breakpoint
CREATE INDEX "proposals_proposer_idx" ON "proposals" USING btree ("proposer_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "proposals_one_live_key" ON "proposals" USING btree ("fork_recipe_id","source_recipe_id") WHERE "proposals"."status" in ('open', 'changes_requested');