import 'server-only';
import { and, eq, max } from 'drizzle-orm';
import { db } from '@/db';
import { brewDayEntries, brewDays, recipeVersions, type BrewDay, type BrewDayEntry } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import type { RecipeDocument, RecipeStats } from '@/lib/brewing';
import { uniqueViolation } from '@/lib/db-errors';
import { AppError, invalidInput } from '@/lib/errors';
import { fieldsOfDay, loadOwnBrewDay, measuredColumns } from './brew-days';
import {
  LIVE_FIELD_LABELS,
  liveSteps,
  sameLiveValue,
  type LiveFieldState,
  type LiveState,
  type LiveStep,
  type LiveValue,
} from './live-steps';
import { brewDayFieldsSchema, LIVE_FIELDS, parseLiveFieldValue, type LiveEntryInput, type LiveField } from './schemas';

// Brew-day mode's reads and writes. Every write carries an idempotency key made on the device; the
// first answer to a key is kept in brew_day_entries and a repeat gets that same answer, so a
// reading sent again and again after a lost connection is saved exactly once.

export interface LiveBrewDay {
  day: BrewDay;
  document: RecipeDocument;
  stats: RecipeStats;
  versionNumber: number;
  state: LiveState;
}

type Answer = { status: number; body: unknown };

/** The value of one field as stored: the typed entry for a gravity, the number otherwise. */
function liveValueOf(day: BrewDay, field: LiveField): LiveValue {
  if (field === 'preBoilGravity' || field === 'og') {
    const fields = fieldsOfDay(day);
    return fields[field];
  }
  return day[field];
}

/** The brewer's own brew day with the exact version brewed and what is saved (brew-day mode is the brewer's alone). */
export async function getLiveBrewDayById(viewer: Viewer, id: string): Promise<LiveBrewDay> {
  const { day } = await loadOwnBrewDay(viewer, id, 'run brew-day mode for');
  const [[version], state] = await Promise.all([
    db
      .select({ document: recipeVersions.document, stats: recipeVersions.stats, number: recipeVersions.number })
      .from(recipeVersions)
      .where(eq(recipeVersions.id, day.versionId)),
    liveStateOf(day),
  ]);
  return {
    day,
    document: version.document as RecipeDocument,
    stats: version.stats as RecipeStats,
    versionNumber: version.number,
    state,
  };
}

/** What brew-day mode shows as saved: each field's value and when it was saved, and the ticked steps. */
export async function getLiveStateById(viewer: Viewer, id: string): Promise<LiveState> {
  const { day } = await loadOwnBrewDay(viewer, id, 'run brew-day mode for');
  return liveStateOf(day);
}

async function liveStateOf(day: BrewDay): Promise<LiveState> {
  const saved = await db
    .select({ name: brewDayEntries.name, at: max(brewDayEntries.createdAt) })
    .from(brewDayEntries)
    .where(
      and(eq(brewDayEntries.brewDayId, day.id), eq(brewDayEntries.kind, 'field'), eq(brewDayEntries.outcome, 'saved')),
    )
    .groupBy(brewDayEntries.name);
  const savedAt = new Map(saved.map((s) => [s.name, s.at]));
  const fields = Object.fromEntries(
    LIVE_FIELDS.map((f) => {
      const value = liveValueOf(day, f);
      const at = savedAt.get(f);
      return [f, { value, savedAt: value !== null && at ? new Date(at).toISOString() : null }];
    }),
  ) as Record<LiveField, LiveFieldState>;
  return { brewDayId: day.id, fields, checkedSteps: day.checkedSteps };
}

function describe(value: LiveValue): string {
  if (value === null) return 'empty';
  if (typeof value === 'number') return String(value);
  return value.method === 'refractometer' ? `${value.value} °Brix` : value.value.toFixed(3);
}

function requestOf(input: LiveEntryInput): unknown {
  return input.kind === 'field'
    ? { kind: 'field', field: input.field, value: input.value ?? null, knownValue: input.knownValue ?? null }
    : { kind: 'step', stepId: input.stepId, checked: input.checked };
}

/**
 * Records one write from brew-day mode, exactly once per idempotency key. A field is written when
 * the server still holds the value the device last saw (or already holds the same value); when
 * another device changed it meanwhile, nothing is overwritten: the answer is a 409 naming both
 * values, and the write is kept as a conflict.
 */
export async function recordLiveEntry(viewer: Viewer, brewDayId: string, input: LiveEntryInput): Promise<Answer> {
  const { day: loaded } = await loadOwnBrewDay(viewer, brewDayId, 'run brew-day mode for');
  const [version] = await db
    .select({ document: recipeVersions.document, stats: recipeVersions.stats })
    .from(recipeVersions)
    .where(eq(recipeVersions.id, loaded.versionId));
  const request = requestOf(input);
  try {
    return await db.transaction(async (tx) => {
      // One writer per brew day at a time, so a key and a field are checked and written together.
      const [day] = await tx.select().from(brewDays).where(eq(brewDays.id, loaded.id)).for('update');
      const [prior] = await tx
        .select()
        .from(brewDayEntries)
        .where(eq(brewDayEntries.idempotencyKey, input.idempotencyKey));
      if (prior) return replay(prior, viewer, day.id, request);

      const entryId = crypto.randomUUID();
      const now = new Date();
      let answer: Answer;
      let outcome: 'saved' | 'conflict' = 'saved';
      if (input.kind === 'step') {
        const steps: LiveStep[] = liveSteps(version.document as RecipeDocument, version.stats as RecipeStats, 'metric');
        if (!steps.some((s) => s.id === input.stepId))
          throw new AppError('bad_request', 'step', `Please check these fields: stepId: No such step`, [
            { path: 'stepId', message: 'No such step in this recipe version' },
          ]);
        const checkedSteps = { ...day.checkedSteps };
        if (input.checked) checkedSteps[input.stepId] ??= now.toISOString();
        else delete checkedSteps[input.stepId];
        await tx.update(brewDays).set({ checkedSteps, updatedAt: now }).where(eq(brewDays.id, day.id));
        answer = {
          status: 201,
          body: { outcome: 'saved', kind: 'step', entryId, stepId: input.stepId, checked: input.checked, savedAt: now },
        };
      } else {
        const field = input.field;
        const parsed = parseLiveFieldValue(field, input.value);
        if (!parsed.success) throw invalidInput(parsed.error);
        const incoming = parsed.data as LiveValue;
        const current = liveValueOf(day, field);
        const known =
          input.knownValue === undefined
            ? undefined
            : ((parseLiveFieldValue(field, input.knownValue).data ?? null) as LiveValue);
        const unchangedSinceSeen = known === undefined ? current === null : sameLiveValue(current, known);
        if (sameLiveValue(current, incoming) || unchangedSinceSeen) {
          const merged = brewDayFieldsSchema.safeParse({ ...fieldsOfDay(day), [field]: incoming });
          if (!merged.success) throw invalidInput(merged.error);
          await tx
            .update(brewDays)
            .set({ ...measuredColumns(merged.data), updatedAt: now })
            .where(eq(brewDays.id, day.id));
          answer = {
            status: 201,
            body: { outcome: 'saved', kind: 'field', entryId, field, value: incoming, savedAt: now },
          };
        } else {
          outcome = 'conflict';
          const message = `${LIVE_FIELD_LABELS[field]} was saved as ${describe(current)} from another device while you entered ${describe(incoming)}. Choose which to keep.`;
          answer = {
            status: 409,
            body: {
              error: {
                code: 'conflict',
                message,
                fields: [{ path: 'value', message }],
                details: { entryId, field, yours: incoming, theirs: current },
              },
            },
          };
        }
      }
      const body = JSON.parse(JSON.stringify(answer.body)) as unknown;
      await tx.insert(brewDayEntries).values({
        id: entryId,
        brewDayId: day.id,
        authorId: viewer.id,
        idempotencyKey: input.idempotencyKey,
        kind: input.kind,
        name: input.kind === 'field' ? input.field : input.stepId,
        request,
        outcome,
        status: answer.status,
        response: body,
        createdAt: now,
      });
      return { status: answer.status, body };
    });
  } catch (err) {
    // The same key sent twice at the same moment: the second waits, then finds the first's answer.
    if (!uniqueViolation(err)) throw err;
    const [prior] = await db
      .select()
      .from(brewDayEntries)
      .where(eq(brewDayEntries.idempotencyKey, input.idempotencyKey));
    if (!prior) throw err;
    return replay(prior, viewer, loaded.id, request);
  }
}

function replay(prior: BrewDayEntry, viewer: Viewer, brewDayId: string, request: unknown): Answer {
  if (prior.brewDayId !== brewDayId || prior.authorId !== viewer.id || !sameJson(prior.request, request))
    throw new AppError(
      'conflict',
      'idempotency key',
      'This idempotency key was already used for a different write; a new write needs a new key.',
      [{ path: 'idempotencyKey', message: 'Already used for a different write' }],
    );
  return { status: prior.status, body: prior.response };
}

/** JSON with object keys sorted: jsonb keeps its own key order, so a stored request is compared this way. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object')
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(',')}}`;
  return JSON.stringify(value ?? null);
}

function sameJson(a: unknown, b: unknown): boolean {
  return canonical(a) === canonical(b);
}
