import 'server-only';
import { and, desc, eq, gte, inArray, isNull, ne } from 'drizzle-orm';
import { db, type Transaction } from '@/db';
import { brewDayEntries, brewDays, recipeVersions, users, type BrewDay, type BrewDayEntry } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import type { RecipeDocument, RecipeStats } from '@/lib/brewing';
import { uniqueViolation } from '@/lib/db-errors';
import { AppError, invalidInput } from '@/lib/errors';
import { fieldsOfDay, loadOwnBrewDay, measuredColumns } from './brew-days';
import {
  LIVE_FIELD_LABELS,
  liveSteps,
  liveValueKey,
  sameLiveValue,
  type LiveConflict,
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
type Exec = typeof db | Transaction;

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
    liveStateOf(db, day),
  ]);
  return {
    day,
    document: version.document as RecipeDocument,
    stats: version.stats as RecipeStats,
    versionNumber: version.number,
    state,
  };
}

/** What brew-day mode shows as saved: each field's value, who saved it and when, the ticked steps and open conflicts. */
export async function getLiveStateById(viewer: Viewer, id: string): Promise<LiveState> {
  const { day } = await loadOwnBrewDay(viewer, id, 'run brew-day mode for');
  return liveStateOf(db, day);
}

type Target = BrewDayEntry['kind'];
/** The last saved write to one field or step: its idempotency key, when, and by whom. */
type LastSaved = { key: string; at: Date; by: string | null };

const nameKey = (kind: Target, name: string) => `${kind}:${name}`;

async function lastSavedOf(exec: Exec, brewDayId: string): Promise<Map<string, LastSaved>> {
  const rows = await exec
    .selectDistinctOn([brewDayEntries.kind, brewDayEntries.name], {
      kind: brewDayEntries.kind,
      name: brewDayEntries.name,
      key: brewDayEntries.idempotencyKey,
      at: brewDayEntries.createdAt,
      by: users.name,
    })
    .from(brewDayEntries)
    .innerJoin(users, eq(users.id, brewDayEntries.authorId))
    .where(and(eq(brewDayEntries.brewDayId, brewDayId), eq(brewDayEntries.outcome, 'saved')))
    .orderBy(brewDayEntries.kind, brewDayEntries.name, desc(brewDayEntries.createdAt));
  return new Map(rows.map((r) => [nameKey(r.kind, r.name), { key: r.key, at: r.at, by: r.by }]));
}

/** The value a write (or a kept conflict) asked for, from its stored request. */
function enteredOf(entry: Pick<BrewDayEntry, 'kind' | 'name' | 'request'>): LiveValue | boolean {
  const request = entry.request as { value?: unknown; checked?: unknown };
  if (entry.kind === 'step') return request.checked === true;
  return (parseLiveFieldValue(entry.name as LiveField, request.value).data ?? null) as LiveValue;
}

function savedOf(day: BrewDay, kind: Target, name: string): LiveValue | boolean {
  return kind === 'step' ? name in day.checkedSteps : liveValueOf(day, name as LiveField);
}

function sameAs(a: LiveValue | boolean, b: LiveValue | boolean): boolean {
  if (typeof a === 'boolean' || typeof b === 'boolean') return a === b;
  return sameLiveValue(a, b);
}

function tokenOf(saved: LiveValue | boolean, last: LastSaved | undefined): string {
  const value = typeof saved === 'boolean' ? String(saved) : liveValueKey(saved);
  return `${last?.key ?? 'none'}|${value}`;
}

type ConflictRow = Pick<BrewDayEntry, 'id' | 'kind' | 'name' | 'request' | 'idempotencyKey' | 'createdAt'> & {
  by: string | null;
};

/** A kept conflict beside what the server holds now, as every device is shown it. */
function conflictView(day: BrewDay, row: ConflictRow, last: LastSaved | undefined): LiveConflict {
  const saved = savedOf(day, row.kind, row.name);
  const common = {
    id: row.id,
    enteredBy: row.by,
    enteredAt: row.createdAt.toISOString(),
    enteredKey: row.idempotencyKey,
    savedBy: last?.by ?? null,
    savedAt: last ? last.at.toISOString() : null,
    savedToken: tokenOf(saved, last),
  };
  return row.kind === 'step'
    ? { kind: 'step', stepId: row.name, ...common, entered: enteredOf(row) as boolean, saved: saved as boolean }
    : {
        kind: 'field',
        field: row.name as LiveField,
        ...common,
        entered: enteredOf(row) as LiveValue,
        saved: saved as LiveValue,
      };
}

const conflictColumns = {
  id: brewDayEntries.id,
  kind: brewDayEntries.kind,
  name: brewDayEntries.name,
  request: brewDayEntries.request,
  idempotencyKey: brewDayEntries.idempotencyKey,
  createdAt: brewDayEntries.createdAt,
  by: users.name,
};

function openConflicts(exec: Exec, brewDayId: string) {
  return exec
    .select(conflictColumns)
    .from(brewDayEntries)
    .innerJoin(users, eq(users.id, brewDayEntries.authorId))
    .where(
      and(
        eq(brewDayEntries.brewDayId, brewDayId),
        eq(brewDayEntries.outcome, 'conflict'),
        isNull(brewDayEntries.resolvedAt),
      ),
    )
    .orderBy(brewDayEntries.createdAt);
}

async function liveStateOf(exec: Exec, day: BrewDay): Promise<LiveState> {
  const [last, open] = await Promise.all([lastSavedOf(exec, day.id), openConflicts(exec, day.id)]);
  const fields = Object.fromEntries(
    LIVE_FIELDS.map((f) => {
      const value = liveValueOf(day, f);
      const saved = value === null ? undefined : last.get(nameKey('field', f));
      return [f, { value, savedAt: saved ? saved.at.toISOString() : null, savedBy: saved?.by ?? null }];
    }),
  ) as Record<LiveField, LiveFieldState>;
  const stepRevisions: Record<string, string> = {};
  for (const [key, saved] of last) if (key.startsWith('step:')) stepRevisions[key.slice(5)] = saved.key;
  return {
    brewDayId: day.id,
    fields,
    checkedSteps: day.checkedSteps,
    stepRevisions,
    conflicts: open.map((row) => conflictView(day, row, last.get(nameKey(row.kind, row.name)))),
  };
}

function describe(value: LiveValue): string {
  if (value === null) return 'empty';
  if (typeof value === 'number') return String(value);
  return value.method === 'refractometer' ? `${value.value} °Brix` : value.value.toFixed(3);
}

function requestOf(input: LiveEntryInput): unknown {
  if (input.kind === 'field')
    return { kind: 'field', field: input.field, value: input.value ?? null, knownValue: input.knownValue ?? null };
  if (input.kind === 'resolve')
    return { kind: 'resolve', conflictId: input.conflictId, keep: input.keep, savedToken: input.savedToken };
  // A tick kept from before ticks named what they follow is still told from a retry by what it had.
  return input.basedOn === undefined
    ? { kind: 'step', stepId: input.stepId, checked: input.checked }
    : { kind: 'step', stepId: input.stepId, checked: input.checked, basedOn: input.basedOn };
}

/** What one write decided, before its entry is kept. */
type Decision = {
  kind: Target;
  name: string;
  answer: Answer;
  outcome: 'saved' | 'conflict';
  changesValue: boolean;
  /** For a choice: the conflict it settles. */
  settles?: string;
};

type WriteContext = {
  tx: Transaction;
  day: BrewDay;
  viewer: Viewer;
  entryId: string;
  now: Date;
  steps: LiveStep[];
};

/**
 * Records one write from brew-day mode, exactly once per idempotency key. A field is written when
 * the server still holds the value the device last saw (or already holds the same value); a tick
 * when no other write changed the step since the one it follows. Otherwise nothing is overwritten:
 * the answer is a 409 naming both values, and the write is kept as a conflict that every device is
 * shown until the brewer chooses (a `resolve` write) or a later write agrees with it.
 */
export async function recordLiveEntry(viewer: Viewer, brewDayId: string, input: LiveEntryInput): Promise<Answer> {
  const { day: loaded } = await loadOwnBrewDay(viewer, brewDayId, 'run brew-day mode for');
  const [version] = await db
    .select({ document: recipeVersions.document, stats: recipeVersions.stats })
    .from(recipeVersions)
    .where(eq(recipeVersions.id, loaded.versionId));
  const request = requestOf(input);
  const steps = liveSteps(version.document as RecipeDocument, version.stats as RecipeStats, 'metric');
  try {
    return await db.transaction(async (tx) => {
      // One writer per brew day at a time, so a key and a field are checked and written together.
      const [day] = await tx.select().from(brewDays).where(eq(brewDays.id, loaded.id)).for('update');
      const [prior] = await tx
        .select()
        .from(brewDayEntries)
        .where(eq(brewDayEntries.idempotencyKey, input.idempotencyKey));
      if (prior) return replay(prior, viewer, day.id, request);

      const context: WriteContext = { tx, day, viewer, entryId: crypto.randomUUID(), now: new Date(), steps };
      const decision =
        input.kind === 'step'
          ? await decideStep(context, input)
          : input.kind === 'field'
            ? await decideField(context, input)
            : await decideChoice(context, input);
      const body = JSON.parse(JSON.stringify(decision.answer.body)) as unknown;
      await tx.insert(brewDayEntries).values({
        id: context.entryId,
        brewDayId: day.id,
        authorId: viewer.id,
        idempotencyKey: input.idempotencyKey,
        kind: decision.kind,
        name: decision.name,
        request,
        outcome: decision.outcome,
        changesValue: decision.changesValue,
        status: decision.answer.status,
        response: body,
        createdAt: context.now,
      });
      if (decision.outcome === 'saved') await settleConflicts(context, decision);
      return { status: decision.answer.status, body };
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

/**
 * Settles the conflicts a saved write ends: the one a choice names, and every open conflict on the
 * same field or step whose kept value the server now holds (the brewer entered it again, or chose it).
 */
async function settleConflicts({ tx, day, entryId, now }: WriteContext, decision: Decision): Promise<void> {
  const [fresh] = await tx.select().from(brewDays).where(eq(brewDays.id, day.id));
  const open = await tx
    .select({
      id: brewDayEntries.id,
      kind: brewDayEntries.kind,
      name: brewDayEntries.name,
      request: brewDayEntries.request,
    })
    .from(brewDayEntries)
    .where(
      and(
        eq(brewDayEntries.brewDayId, day.id),
        eq(brewDayEntries.kind, decision.kind),
        eq(brewDayEntries.name, decision.name),
        eq(brewDayEntries.outcome, 'conflict'),
        isNull(brewDayEntries.resolvedAt),
      ),
    );
  const current = savedOf(fresh, decision.kind, decision.name);
  const settled = open.filter((c) => c.id === decision.settles || sameAs(enteredOf(c), current)).map((c) => c.id);
  if (settled.length === 0) return;
  await tx
    .update(brewDayEntries)
    .set({ resolvedAt: now, resolvedByEntryId: entryId })
    .where(and(eq(brewDayEntries.brewDayId, day.id), inArray(brewDayEntries.id, settled)));
}

function stepTitle(steps: LiveStep[], stepId: string): string {
  return steps.find((s) => s.id === stepId)?.title ?? stepId;
}

function doneWord(checked: boolean): string {
  return checked ? 'done' : 'not done';
}

/**
 * Whether nothing changed a step since the write a tick follows: `null` (or none named, as a field
 * write without `knownValue` is taken to have seen it empty) means the step was never written, a key
 * one of this brew day's writes to the step (saved or kept as a conflict). A key the server does not
 * know cannot show that.
 */
async function unchangedSince(tx: Transaction, day: BrewDay, stepId: string, basedOn: string | null | undefined) {
  const onStep = and(
    eq(brewDayEntries.brewDayId, day.id),
    eq(brewDayEntries.kind, 'step'),
    eq(brewDayEntries.name, stepId),
  );
  const changes = and(onStep, eq(brewDayEntries.outcome, 'saved'), eq(brewDayEntries.changesValue, true));
  if (basedOn === null || basedOn === undefined) {
    const [any] = await tx.select({ id: brewDayEntries.id }).from(brewDayEntries).where(changes).limit(1);
    return !any;
  }
  const [base] = await tx
    .select({ at: brewDayEntries.createdAt })
    .from(brewDayEntries)
    .where(and(onStep, eq(brewDayEntries.idempotencyKey, basedOn)));
  if (!base) return false;
  // A change at the same instant as the base counts as after it: a needless question beats a lost tick.
  const [later] = await tx
    .select({ id: brewDayEntries.id })
    .from(brewDayEntries)
    .where(and(changes, gte(brewDayEntries.createdAt, base.at), ne(brewDayEntries.idempotencyKey, basedOn)))
    .limit(1);
  return !later;
}

async function decideStep(context: WriteContext, input: Extract<LiveEntryInput, { kind: 'step' }>): Promise<Decision> {
  const { tx, day, entryId, now, steps } = context;
  if (!steps.some((s) => s.id === input.stepId))
    throw new AppError('bad_request', 'step', `Please check these fields: stepId: No such step`, [
      { path: 'stepId', message: 'No such step in this recipe version' },
    ]);
  const current = input.stepId in day.checkedSteps;
  const base = { kind: 'step' as const, name: input.stepId };
  const saved = (changesValue: boolean): Decision => ({
    ...base,
    outcome: 'saved',
    changesValue,
    answer: {
      status: 201,
      body: { outcome: 'saved', kind: 'step', entryId, stepId: input.stepId, checked: input.checked, savedAt: now },
    },
  });
  if (current === input.checked) return saved(false);
  if (await unchangedSince(tx, day, input.stepId, input.basedOn)) {
    const checkedSteps = { ...day.checkedSteps };
    if (input.checked) checkedSteps[input.stepId] = now.toISOString();
    else delete checkedSteps[input.stepId];
    await tx.update(brewDays).set({ checkedSteps, updatedAt: now }).where(eq(brewDays.id, day.id));
    return saved(true);
  }
  const title = stepTitle(steps, input.stepId);
  const message = `“${title}” was marked ${doneWord(current)} from another device while you marked it ${doneWord(input.checked)}. Choose which to keep.`;
  return conflictDecision(base, 'checked', message, {
    entryId,
    stepId: input.stepId,
    yours: input.checked,
    theirs: current,
    conflict: await newConflictView(context, 'step', input.stepId, input),
  });
}

async function decideField(
  context: WriteContext,
  input: Extract<LiveEntryInput, { kind: 'field' }>,
): Promise<Decision> {
  const { tx, day, entryId, now } = context;
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
  const base = { kind: 'field' as const, name: field };
  if (sameLiveValue(current, incoming) || unchangedSinceSeen) {
    await writeField(tx, day, field, incoming, now);
    return {
      ...base,
      outcome: 'saved',
      changesValue: !sameLiveValue(current, incoming),
      answer: { status: 201, body: { outcome: 'saved', kind: 'field', entryId, field, value: incoming, savedAt: now } },
    };
  }
  const message = `${LIVE_FIELD_LABELS[field]} was saved as ${describe(current)} from another device while you entered ${describe(incoming)}. Choose which to keep.`;
  return conflictDecision(base, 'value', message, {
    entryId,
    field,
    yours: incoming,
    theirs: current,
    conflict: await newConflictView(context, 'field', field, input),
  });
}

/** A write kept as a conflict: a 409 naming the clashing field, with both values and the conflict as shown. */
function conflictDecision(
  base: Pick<Decision, 'kind' | 'name'>,
  path: 'checked' | 'value',
  message: string,
  details: Record<string, unknown>,
): Decision {
  return {
    ...base,
    outcome: 'conflict',
    changesValue: false,
    answer: { status: 409, body: { error: { code: 'conflict', message, fields: [{ path, message }], details } } },
  };
}

async function writeField(tx: Transaction, day: BrewDay, field: LiveField, value: LiveValue, now: Date) {
  const merged = brewDayFieldsSchema.safeParse({ ...fieldsOfDay(day), [field]: value });
  if (!merged.success) throw invalidInput(merged.error);
  await tx
    .update(brewDays)
    .set({ ...measuredColumns(merged.data), updatedAt: now })
    .where(eq(brewDays.id, day.id));
}

/** The conflict a write is about to be kept as, as the state read will show it. */
async function newConflictView(
  { tx, day, viewer, entryId, now }: WriteContext,
  kind: Target,
  name: string,
  input: LiveEntryInput,
): Promise<LiveConflict> {
  const last = (await lastSavedOf(tx, day.id)).get(nameKey(kind, name));
  const row: ConflictRow = {
    id: entryId,
    kind,
    name,
    request: requestOf(input),
    idempotencyKey: input.idempotencyKey,
    createdAt: now,
    by: viewer.name,
  };
  return conflictView(day, row, last);
}

/** The brewer's choice between a kept conflict's two values, made on any of their devices. */
async function decideChoice(
  context: WriteContext,
  input: Extract<LiveEntryInput, { kind: 'resolve' }>,
): Promise<Decision> {
  const { tx, day, entryId, now, steps } = context;
  const [row] = await tx
    .select({ ...conflictColumns, resolvedAt: brewDayEntries.resolvedAt })
    .from(brewDayEntries)
    .innerJoin(users, eq(users.id, brewDayEntries.authorId))
    .where(
      and(
        eq(brewDayEntries.id, input.conflictId),
        eq(brewDayEntries.brewDayId, day.id),
        eq(brewDayEntries.outcome, 'conflict'),
      ),
    );
  if (!row)
    throw new AppError('not_found', 'conflict', 'No such conflict on this brew day.', [
      { path: 'conflictId', message: 'No such conflict on this brew day' },
    ]);
  const view = conflictView(day, row, (await lastSavedOf(tx, day.id)).get(nameKey(row.kind, row.name)));
  const what = view.kind === 'step' ? `“${stepTitle(steps, view.stepId)}”` : LIVE_FIELD_LABELS[view.field];
  if (row.resolvedAt) {
    const message = `The choice for ${what} was already made on another device.`;
    throw new AppError('conflict', 'conflict', message, [{ path: 'conflictId', message }], { conflict: view });
  }
  if (view.savedToken !== input.savedToken) {
    const message = `${what} changed again on another device since this choice was shown; look again and choose.`;
    throw new AppError('conflict', 'conflict', message, [{ path: 'savedToken', message }], { conflict: view });
  }
  let changesValue = false;
  if (input.keep === 'entered' && !sameAs(view.entered, view.saved)) {
    changesValue = true;
    if (view.kind === 'step') {
      const checkedSteps = { ...day.checkedSteps };
      if (view.entered) checkedSteps[view.stepId] = now.toISOString();
      else delete checkedSteps[view.stepId];
      await tx.update(brewDays).set({ checkedSteps, updatedAt: now }).where(eq(brewDays.id, day.id));
    } else {
      await writeField(tx, day, view.field, view.entered, now);
    }
  }
  const kept = input.keep === 'entered' ? view.entered : view.saved;
  return {
    kind: row.kind,
    name: row.name,
    outcome: 'saved',
    changesValue,
    settles: row.id,
    answer: {
      status: 201,
      body: {
        outcome: 'saved',
        kind: 'resolve',
        entryId,
        conflictId: row.id,
        keep: input.keep,
        ...(view.kind === 'step' ? { stepId: view.stepId, checked: kept } : { field: view.field, value: kept }),
        savedAt: now,
      },
    },
  };
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
