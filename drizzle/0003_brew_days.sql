CREATE TYPE "public"."gravity_method" AS ENUM('hydrometer', 'refractometer');--> statement-breakpoint
CREATE TYPE "public"."packaging_method" AS ENUM('keg', 'bottles');--> statement-breakpoint
CREATE TABLE "brew_days" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"recipe_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"brewer_id" text NOT NULL,
	"brewed_on" date NOT NULL,
	"strike_temp_c" real,
	"mash_temp_c" real,
	"mash_ph" real,
	"pre_boil_volume_l" real,
	"pre_boil_gravity" real,
	"post_boil_volume_l" real,
	"fermenter_volume_l" real,
	"og" real,
	"pitch_temp_c" real,
	"fg" real,
	"gravity_entries" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"packaged_on" date,
	"packaging" "packaging_method",
	"keg_pressure_kpa" real,
	"priming_sugar_g" real,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "brew_readings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"brew_day_id" uuid NOT NULL,
	"taken_on" date NOT NULL,
	"method" "gravity_method",
	"raw_value" real,
	"sample_temp_c" real,
	"gravity" real,
	"beer_temp_c" real,
	"note" varchar(300) DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"brew_day_id" uuid NOT NULL,
	"uploader_id" text NOT NULL,
	"display_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"caption" varchar(200) DEFAULT '' NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"stored_bytes" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tastings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"brew_day_id" uuid NOT NULL,
	"taster_id" text NOT NULL,
	"tasted_on" date NOT NULL,
	"appearance" text DEFAULT '' NOT NULL,
	"aroma" text DEFAULT '' NOT NULL,
	"flavour" text DEFAULT '' NOT NULL,
	"mouthfeel" text DEFAULT '' NOT NULL,
	"overall" text DEFAULT '' NOT NULL,
	"rating" smallint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "brew_days" ADD CONSTRAINT "brew_days_recipe_id_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."recipes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brew_days" ADD CONSTRAINT "brew_days_version_id_recipe_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."recipe_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brew_days" ADD CONSTRAINT "brew_days_brewer_id_users_id_fk" FOREIGN KEY ("brewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brew_readings" ADD CONSTRAINT "brew_readings_brew_day_id_brew_days_id_fk" FOREIGN KEY ("brew_day_id") REFERENCES "public"."brew_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_brew_day_id_brew_days_id_fk" FOREIGN KEY ("brew_day_id") REFERENCES "public"."brew_days"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_uploader_id_users_id_fk" FOREIGN KEY ("uploader_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tastings" ADD CONSTRAINT "tastings_brew_day_id_brew_days_id_fk" FOREIGN KEY ("brew_day_id") REFERENCES "public"."brew_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tastings" ADD CONSTRAINT "tastings_taster_id_users_id_fk" FOREIGN KEY ("taster_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "brew_days_recipe_idx" ON "brew_days" USING btree ("recipe_id","brewed_on");--> statement-breakpoint
CREATE INDEX "brew_days_version_idx" ON "brew_days" USING btree ("version_id");--> statement-breakpoint
CREATE INDEX "brew_days_brewer_idx" ON "brew_days" USING btree ("brewer_id","brewed_on");--> statement-breakpoint
CREATE INDEX "brew_readings_day_idx" ON "brew_readings" USING btree ("brew_day_id","taken_on");--> statement-breakpoint
CREATE INDEX "photos_day_idx" ON "photos" USING btree ("brew_day_id");--> statement-breakpoint
CREATE INDEX "photos_uploader_idx" ON "photos" USING btree ("uploader_id");--> statement-breakpoint
CREATE INDEX "tastings_day_idx" ON "tastings" USING btree ("brew_day_id");--> statement-breakpoint
CREATE INDEX "tastings_taster_idx" ON "tastings" USING btree ("taster_id");