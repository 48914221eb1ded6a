import {
  boolean,
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  real,
  smallint,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  varchar,
} from 'drizzle-orm/pg-core';
import type { BrewPlan } from '@/lib/brew-days/schedule';
import { recipeVersions, recipes, users } from '../schema';

export const gravityMethod = pgEnum('gravity_method', ['hydrometer', 'refractometer']);
export const packagingMethod = pgEnum('packaging_method', ['keg', 'bottles']);

/** What the brewer typed for one gravity (before correction), kept so a page can show "read 1.052 at 30 °C". */
export interface GravityEntry {
  method: 'hydrometer' | 'refractometer';
  /** SG for a hydrometer, °Brix for a refractometer. */
  value: number;
  /** Sample temperature of a hydrometer reading. */
  sampleTempC?: number | null;
}

// A brew of one exact recipe version: what was measured on the day and after. Gravities are
// stored corrected (SG); the typed entries are kept beside them in `gravityEntries`.
export const brewDays = pgTable(
  'brew_days',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    recipeId: uuid('recipe_id')
      .notNull()
      .references(() => recipes.id),
    versionId: uuid('version_id')
      .notNull()
      .references(() => recipeVersions.id),
    brewerId: text('brewer_id')
      .notNull()
      .references(() => users.id),
    brewedOn: date('brewed_on').notNull(),
    strikeTempC: real('strike_temp_c'),
    mashTempC: real('mash_temp_c'),
    mashPh: real('mash_ph'),
    preBoilVolumeL: real('pre_boil_volume_l'),
    preBoilGravity: real('pre_boil_gravity'),
    postBoilVolumeL: real('post_boil_volume_l'),
    fermenterVolumeL: real('fermenter_volume_l'),
    og: real('og'),
    pitchTempC: real('pitch_temp_c'),
    fg: real('fg'),
    gravityEntries: jsonb('gravity_entries')
      .$type<{ preBoil?: GravityEntry; og?: GravityEntry; fg?: GravityEntry }>()
      .notNull()
      .default({}),
    packagedOn: date('packaged_on'),
    packaging: packagingMethod('packaging'),
    kegPressureKPa: real('keg_pressure_kpa'),
    primingSugarG: real('priming_sugar_g'),
    notes: text('notes').notNull().default(''),
    /** The calendar from this brew day to the day it must pour (lib/brew-days/schedule.ts), when planned. */
    plan: jsonb('plan').$type<BrewPlan>(),
    /** Brew-day mode's checklist: step id → when it was ticked (ISO time). */
    checkedSteps: jsonb('checked_steps').$type<Record<string, string>>().notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('brew_days_recipe_idx').on(t.recipeId, t.brewedOn),
    index('brew_days_version_idx').on(t.versionId),
    index('brew_days_brewer_idx').on(t.brewerId, t.brewedOn),
  ],
);
export type BrewDay = typeof brewDays.$inferSelect;
export type NewBrewDay = typeof brewDays.$inferInsert;

export const brewDayEntryKind = pgEnum('brew_day_entry_kind', ['field', 'step']);
export const brewDayEntryOutcome = pgEnum('brew_day_entry_outcome', ['saved', 'conflict']);

// Every write from brew-day mode, keyed by the idempotency key the device made for it: a retry with
// the same key gets the answer kept here instead of writing again. A conflicting write is kept too,
// so both values stay on record while the brewer chooses; it stays open (every device is shown it)
// until a choice is saved or a later write agrees with it.
export const brewDayEntries = pgTable(
  'brew_day_entries',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    brewDayId: uuid('brew_day_id')
      .notNull()
      .references(() => brewDays.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    idempotencyKey: uuid('idempotency_key').notNull(),
    /** What it writes to (a choice between two values: what the conflict was on). */
    kind: brewDayEntryKind('kind').notNull(),
    /** The brew-day field (`og`, `mashPh`…) or the checklist step id. */
    name: varchar('name', { length: 40 }).notNull(),
    /** The request as sent, to tell a true retry from a different write reusing a key. */
    request: jsonb('request').notNull(),
    outcome: brewDayEntryOutcome('outcome').notNull(),
    /** The HTTP status and body answered the first time; a repeat gets exactly these. */
    status: smallint('status').notNull(),
    response: jsonb('response').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** Whether the write changed the stored value (false for a conflict, or a value the server already held). */
    changesValue: boolean('changes_value').notNull().default(true),
    /** A conflict is settled when the brewer chose, or a later write agreed with it; null while open. */
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    /** The entry that settled it: the choice, or the agreeing write. */
    resolvedByEntryId: uuid('resolved_by_entry_id'),
  },
  (t) => [
    uniqueIndex('brew_day_entries_key_idx').on(t.idempotencyKey),
    index('brew_day_entries_day_idx').on(t.brewDayId, t.createdAt),
  ],
);
export type BrewDayEntry = typeof brewDayEntries.$inferSelect;

// Fermentation readings over time; `gravity` is the corrected SG the chart plots.
export const brewReadings = pgTable(
  'brew_readings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    brewDayId: uuid('brew_day_id')
      .notNull()
      .references(() => brewDays.id, { onDelete: 'cascade' }),
    takenOn: date('taken_on').notNull(),
    method: gravityMethod('method'),
    rawValue: real('raw_value'),
    sampleTempC: real('sample_temp_c'),
    gravity: real('gravity'),
    beerTempC: real('beer_temp_c'),
    note: varchar('note', { length: 300 }).notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('brew_readings_day_idx').on(t.brewDayId, t.takenOn)],
);
export type BrewReading = typeof brewReadings.$inferSelect;

// Tasting notes by anyone who can see the brew day (the brewer or someone who tried the beer).
export const tastings = pgTable(
  'tastings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    brewDayId: uuid('brew_day_id')
      .notNull()
      .references(() => brewDays.id, { onDelete: 'cascade' }),
    tasterId: text('taster_id')
      .notNull()
      .references(() => users.id),
    tastedOn: date('tasted_on').notNull(),
    appearance: text('appearance').notNull().default(''),
    aroma: text('aroma').notNull().default(''),
    flavour: text('flavour').notNull().default(''),
    mouthfeel: text('mouthfeel').notNull().default(''),
    overall: text('overall').notNull().default(''),
    rating: smallint('rating').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('tastings_day_idx').on(t.brewDayId), index('tastings_taster_idx').on(t.tasterId)],
);
export type Tasting = typeof tastings.$inferSelect;

// Photo metadata; the bytes (a display JPEG and a thumbnail) live in the photo store under these keys.
export const photos = pgTable(
  'photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    brewDayId: uuid('brew_day_id')
      .notNull()
      .references(() => brewDays.id),
    uploaderId: text('uploader_id')
      .notNull()
      .references(() => users.id),
    displayKey: text('display_key').notNull(),
    thumbKey: text('thumb_key').notNull(),
    caption: varchar('caption', { length: 200 }).notNull().default(''),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    /** Bytes stored for both sizes together; the quota counts these. */
    storedBytes: integer('stored_bytes').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('photos_day_idx').on(t.brewDayId), index('photos_uploader_idx').on(t.uploaderId)],
);
export type Photo = typeof photos.$inferSelect;
