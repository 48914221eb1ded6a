import 'server-only';
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import { db } from '@/db';
import {
  brewDays,
  brewReadings,
  photos,
  recipeVersions,
  recipes,
  tastings,
  users,
  type BrewDay,
  type Recipe,
} from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import type { RecipeDocument, RecipeStats } from '@/lib/brewing';
import { AppError, type FieldIssue } from '@/lib/errors';
import { canView } from '@/lib/recipes/access';
import { getVersionById } from '@/lib/recipes/versions';
import { compareWithPrediction, gravityFromEntry, originalBrix, type GravityEntry, type Outcome } from './measure';
import { photoVisibleTo } from './photo-visibility';
import type { BrewDayFields, CreateBrewDayInput, ReadingInput, TastingInput } from './schemas';
import { requireId } from '@/lib/validation/ids';

type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;

function fieldError(path: string, message: string): AppError {
  return new AppError('bad_request', 'brew day', `Please check these fields: ${path}: ${message}`, [{ path, message }]);
}

/** Pre-boil gravity, OG and FG as corrected SG, or field messages for the ones that cannot be. */
function resolveGravities(fields: BrewDayFields) {
  const issues: FieldIssue[] = [];
  const resolve = (
    key: 'preBoilGravity' | 'og' | 'fg',
    entry: GravityEntry | null,
    afterOg: boolean,
    ogBrix: number | null,
  ) => {
    if (!entry) return null;
    const result = gravityFromEntry(entry, { afterOg, ogBrix });
    if ('error' in result) {
      issues.push({ path: `${key}.value`, message: result.error });
      return null;
    }
    return result.gravity;
  };
  const preBoil = resolve('preBoilGravity', fields.preBoilGravity, false, null);
  const og = resolve('og', fields.og, false, null);
  const fg = resolve('fg', fields.fg, true, originalBrix(fields.og, og));
  if (og !== null && fg !== null && fg > og) issues.push({ path: 'fg.value', message: 'FG cannot be above the OG' });
  if (issues.length) {
    throw new AppError(
      'bad_request',
      'brew day',
      `Please check these fields: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`,
      issues,
    );
  }
  return { preBoilGravity: preBoil, og, fg };
}

/** The columns a brew day's fields are stored in (gravities corrected, typed entries kept beside them). */
export function measuredColumns(fields: BrewDayFields) {
  const gravities = resolveGravities(fields);
  const entries: Record<string, GravityEntry> = {};
  if (fields.preBoilGravity) entries.preBoil = fields.preBoilGravity;
  if (fields.og) entries.og = fields.og;
  if (fields.fg) entries.fg = fields.fg;
  return {
    brewedOn: fields.brewedOn,
    strikeTempC: fields.strikeTempC,
    mashTempC: fields.mashTempC,
    mashPh: fields.mashPh,
    preBoilVolumeL: fields.preBoilVolumeL,
    postBoilVolumeL: fields.postBoilVolumeL,
    fermenterVolumeL: fields.fermenterVolumeL,
    pitchTempC: fields.pitchTempC,
    packagedOn: fields.packagedOn,
    packaging: fields.packaging,
    kegPressureKPa: fields.kegPressureKPa,
    primingSugarG: fields.primingSugarG,
    notes: fields.notes,
    gravityEntries: entries,
    ...gravities,
  };
}

/**
 * A stored brew day back as the fields the form sends. A gravity kept without its typed entry (an
 * older row) reads as the hydrometer reading it was stored as, which corrects to itself.
 */
export function fieldsOfDay(day: BrewDay): BrewDayFields {
  const entries = day.gravityEntries as { preBoil?: GravityEntry; og?: GravityEntry; fg?: GravityEntry };
  const entry = (typed: GravityEntry | undefined, sg: number | null): GravityEntry | null =>
    typed ?? (sg === null ? null : { method: 'hydrometer', value: sg, sampleTempC: null });
  return {
    brewedOn: day.brewedOn,
    strikeTempC: day.strikeTempC,
    mashTempC: day.mashTempC,
    mashPh: day.mashPh,
    preBoilVolumeL: day.preBoilVolumeL,
    preBoilGravity: entry(entries.preBoil, day.preBoilGravity),
    postBoilVolumeL: day.postBoilVolumeL,
    fermenterVolumeL: day.fermenterVolumeL,
    og: entry(entries.og, day.og),
    pitchTempC: day.pitchTempC,
    fg: entry(entries.fg, day.fg),
    packagedOn: day.packagedOn,
    packaging: day.packaging,
    kegPressureKPa: day.kegPressureKPa,
    primingSugarG: day.primingSugarG,
    notes: day.notes,
  } as BrewDayFields;
}

/** Logs a brew of one exact version the viewer can see. */
export async function createBrewDay(viewer: Viewer, input: CreateBrewDayInput): Promise<{ id: string }> {
  const { recipe, version } = await getVersionById(viewer, input.versionId);
  if (recipe.hiddenAt && recipe.ownerId !== viewer.id)
    throw new AppError('forbidden', 'recipe', 'Moderators hid this recipe; it cannot be brewed from here.');
  const [row] = await db
    .insert(brewDays)
    .values({ recipeId: recipe.id, versionId: version.id, brewerId: viewer.id, ...measuredColumns(input) })
    .returning({ id: brewDays.id });
  return row;
}

/** The brew day and its recipe, if the viewer may see the recipe (404 otherwise). */
async function loadVisible(viewer: MaybeViewer, id: string): Promise<{ day: BrewDay; recipe: Recipe }> {
  requireId(id, 'brew day');
  const [row] = await db
    .select({ day: brewDays, recipe: recipes })
    .from(brewDays)
    .innerJoin(recipes, eq(recipes.id, brewDays.recipeId))
    .where(eq(brewDays.id, id));
  if (!row || !canView(row.recipe, viewer)) throw new AppError('not_found', 'brew day');
  return row;
}

/** For writes only the brewer may make; anyone else who can see it gets a 403, anyone who cannot a 404. */
export async function loadOwnBrewDay(
  viewer: Viewer,
  id: string,
  what: string,
): Promise<{ day: BrewDay; recipe: Recipe }> {
  const loaded = await loadVisible(viewer, id);
  if (loaded.day.brewerId !== viewer.id)
    throw new AppError('forbidden', 'brew day', `Only the brewer can ${what} this brew day.`);
  return loaded;
}

export { loadVisible as loadVisibleBrewDay };

/** The brewer corrects or completes a brew day (FG and packaging come weeks later). */
export async function updateBrewDay(viewer: Viewer, id: string, fields: BrewDayFields): Promise<void> {
  const { day } = await loadOwnBrewDay(viewer, id, 'change');
  const columns = measuredColumns(fields);
  const [early] = await db
    .select({ takenOn: brewReadings.takenOn })
    .from(brewReadings)
    .where(and(eq(brewReadings.brewDayId, day.id), sql`${brewReadings.takenOn} < ${columns.brewedOn}`))
    .limit(1);
  if (early) throw fieldError('brewedOn', `Brew date cannot be after a reading already recorded (${early.takenOn})`);
  await db
    .update(brewDays)
    .set({ ...columns, updatedAt: new Date() })
    .where(eq(brewDays.id, day.id));
}

/** A fermentation reading on a brew day of the viewer's own. */
export async function addReading(viewer: Viewer, brewDayId: string, input: ReadingInput): Promise<{ id: string }> {
  const { day } = await loadOwnBrewDay(viewer, brewDayId, 'add readings to');
  if (input.takenOn < day.brewedOn)
    throw fieldError('takenOn', `Reading date cannot be before the brew date (${day.brewedOn})`);
  let gravity: number | null = null;
  if (input.value !== null && input.method) {
    const ogEntry = (day.gravityEntries as { og?: GravityEntry }).og ?? null;
    // Every fermentation reading comes after the OG, so alcohol may be present.
    const result = gravityFromEntry(
      { method: input.method, value: input.value, sampleTempC: input.sampleTempC },
      { afterOg: true, ogBrix: originalBrix(ogEntry, day.og) },
    );
    if ('error' in result) throw fieldError('value', result.error);
    gravity = result.gravity;
  }
  const [row] = await db
    .insert(brewReadings)
    .values({
      brewDayId: day.id,
      takenOn: input.takenOn,
      method: input.value !== null ? input.method : null,
      rawValue: input.value,
      sampleTempC: input.sampleTempC,
      gravity,
      beerTempC: input.beerTempC,
      note: input.note,
    })
    .returning({ id: brewReadings.id });
  return row;
}

/** A tasting note by anyone signed in who can see the brew day. */
export async function addTasting(viewer: Viewer, brewDayId: string, input: TastingInput): Promise<{ id: string }> {
  const { day } = await loadVisible(viewer, brewDayId);
  if (input.tastedOn < day.brewedOn)
    throw fieldError('tastedOn', `Tasting date cannot be before the brew date (${day.brewedOn})`);
  const [row] = await db
    .insert(tastings)
    .values({ brewDayId: day.id, tasterId: viewer.id, ...input })
    .returning({ id: tastings.id });
  return row;
}

export interface BrewDayView {
  day: BrewDay;
  recipe: { id: string; slug: string; title: string; ownerId: string };
  version: { id: string; number: number; document: RecipeDocument; stats: RecipeStats };
  brewer: { id: string; name: string; handle: string };
  readings: (typeof brewReadings.$inferSelect)[];
  tastings: (typeof tastings.$inferSelect & { tasterName: string; tasterHandle: string })[];
  photos: { id: string; caption: string; width: number; height: number; uploaderId: string; createdAt: Date }[];
  outcome: Outcome;
  canEdit: boolean;
  canModeratePhotos: boolean;
}

export async function getBrewDayById(viewer: MaybeViewer, id: string): Promise<BrewDayView> {
  const { day, recipe } = await loadVisible(viewer, id);
  const [[version], [brewer], readings, tastingRows, photoRows] = await Promise.all([
    db.select().from(recipeVersions).where(eq(recipeVersions.id, day.versionId)),
    db.select({ id: users.id, name: users.name, handle: users.handle }).from(users).where(eq(users.id, day.brewerId)),
    db
      .select()
      .from(brewReadings)
      .where(eq(brewReadings.brewDayId, day.id))
      .orderBy(asc(brewReadings.takenOn), asc(brewReadings.createdAt)),
    db
      .select({ tasting: tastings, tasterName: users.name, tasterHandle: users.handle })
      .from(tastings)
      .innerJoin(users, eq(users.id, tastings.tasterId))
      .where(eq(tastings.brewDayId, day.id))
      .orderBy(asc(tastings.tastedOn), asc(tastings.createdAt)),
    db
      .select({
        id: photos.id,
        caption: photos.caption,
        width: photos.width,
        height: photos.height,
        uploaderId: photos.uploaderId,
        createdAt: photos.createdAt,
      })
      .from(photos)
      .where(and(eq(photos.brewDayId, day.id), photoVisibleTo(viewer)))
      .orderBy(asc(photos.createdAt)),
  ]);
  const { document, stats } = version;
  const isBrewer = Boolean(viewer && viewer.id === day.brewerId);
  return {
    day,
    recipe: { id: recipe.id, slug: recipe.slug, title: recipe.title, ownerId: recipe.ownerId },
    version: { id: version.id, number: version.number, document, stats },
    brewer: { id: brewer.id, name: brewer.name ?? brewer.handle, handle: brewer.handle },
    readings,
    tastings: tastingRows.map((t) => ({
      ...t.tasting,
      tasterName: t.tasterName ?? t.tasterHandle,
      tasterHandle: t.tasterHandle,
    })),
    photos: photoRows,
    outcome: compareWithPrediction(day, document, stats),
    canEdit: isBrewer,
    canModeratePhotos: isBrewer || Boolean(viewer && hasRole(viewer, 'moderator')),
  };
}

export interface BrewDaySummary {
  id: string;
  brewedOn: string;
  versionNumber: number;
  recipeSlug: string;
  recipeTitle: string;
  brewerName: string;
  brewerHandle: string;
  og: number | null;
  fg: number | null;
  averageRating: number | null;
  tastingCount: number;
  photoIds: string[];
}

const THUMBS_PER_SUMMARY = 4;

async function summaries(where: ReturnType<typeof eq>, viewer: MaybeViewer, limit = 100): Promise<BrewDaySummary[]> {
  const rows = await db
    .select({
      day: { id: brewDays.id, brewedOn: brewDays.brewedOn, og: brewDays.og, fg: brewDays.fg },
      recipe: recipes,
      versionNumber: recipeVersions.number,
      brewerName: users.name,
      brewerHandle: users.handle,
      averageRating: sql<
        number | null
      >`(select avg(${tastings.rating})::float from ${tastings} where ${tastings.brewDayId} = ${brewDays.id})`,
      tastingCount: sql<number>`(select count(*)::int from ${tastings} where ${tastings.brewDayId} = ${brewDays.id})`,
    })
    .from(brewDays)
    .innerJoin(recipes, eq(recipes.id, brewDays.recipeId))
    .innerJoin(recipeVersions, eq(recipeVersions.id, brewDays.versionId))
    .innerJoin(users, eq(users.id, brewDays.brewerId))
    .where(where)
    .orderBy(desc(brewDays.brewedOn), desc(brewDays.createdAt))
    .limit(limit);
  const visible = rows.filter((r) => canView(r.recipe, viewer));
  const ids = visible.map((r) => r.day.id);
  const photoRows = ids.length
    ? await db
        .select({ id: photos.id, brewDayId: photos.brewDayId })
        .from(photos)
        .where(and(inArray(photos.brewDayId, ids), photoVisibleTo(viewer)))
        .orderBy(asc(photos.createdAt))
    : [];
  const thumbs = new Map<string, string[]>();
  for (const p of photoRows) {
    const list = thumbs.get(p.brewDayId) ?? [];
    if (list.length < THUMBS_PER_SUMMARY) list.push(p.id);
    thumbs.set(p.brewDayId, list);
  }
  return visible.map((r) => ({
    id: r.day.id,
    brewedOn: r.day.brewedOn,
    versionNumber: r.versionNumber,
    recipeSlug: r.recipe.slug,
    recipeTitle: r.recipe.title,
    brewerName: r.brewerName ?? r.brewerHandle,
    brewerHandle: r.brewerHandle,
    og: r.day.og,
    fg: r.day.fg,
    averageRating: r.averageRating,
    tastingCount: r.tastingCount,
    photoIds: thumbs.get(r.day.id) ?? [],
  }));
}

/** Brew days of a recipe across all its versions, newest first. */
export async function getBrewDaysByRecipeId({
  recipeId,
  viewer,
}: {
  recipeId: string;
  viewer: MaybeViewer;
}): Promise<BrewDaySummary[]> {
  return summaries(eq(brewDays.recipeId, recipeId), viewer);
}

/** A brewer's brew days of recipes the viewer can see, newest first. */
export async function getBrewDaysByBrewerId({
  brewerId,
  viewer,
}: {
  brewerId: string;
  viewer: MaybeViewer;
}): Promise<BrewDaySummary[]> {
  return summaries(eq(brewDays.brewerId, brewerId), viewer);
}
