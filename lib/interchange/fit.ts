import type { z } from 'zod';
import { recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing/schema';
import { InterchangeError } from './types';
import { plain } from './units';

/**
 * Fitting an imported recipe to the editor's document schema. A file is refused only for
 * physical nonsense (a mash above boiling, more alpha acid than the hop weighs); a value that is
 * real but outside what the editor takes is brought to the nearest value it takes and listed
 * under "Assumed", and a step or ingredient that cannot be kept is left out and listed under
 * "Left out", with the reason.
 */

type Issue = z.core.$ZodIssue;

export interface FitLists {
  dropped: string[];
  guessed: string[];
  kept: string[];
}

/** Lists of steps whose entries are left out (rather than changed) when one of their values is out of range. */
const STEP_LISTS = ['mash.steps', 'fermentation.steps'] as const;
/** Lists whose entries are left out when a value cannot be brought into range (an amount of 0). */
const ITEM_LISTS = ['fermentables', 'hops', 'yeasts', 'water.salts', ...STEP_LISTS] as const;

/** Refuses values no brewery could have measured; called before the document is fitted. */
export function refuseNonsense(input: RecipeDocumentInput, describe: (path: string) => string): void {
  const refuse = (path: string, message: string) => {
    throw new InterchangeError(message, describe(path));
  };
  const pct = (value: number | undefined, path: string, what: string) => {
    if (value !== undefined && value > 100) refuse(path, `${what} of ${plain(value, 3)}% is more than the whole`);
  };
  if (!(input.batch.volumeL > 0)) refuse('batch.volumeL', 'a batch of no volume');
  pct(input.batch.efficiencyPct, 'batch.efficiencyPct', 'an efficiency');
  input.hops.forEach((h, i) => {
    pct(h.alphaPct, `hops.${i}.alphaPct`, 'an alpha acid');
    if (h.tempC !== undefined && (h.tempC > 100 || h.tempC < 0))
      refuse(`hops.${i}.tempC`, `a hop stand at ${plain(h.tempC, 1)} °C is outside liquid wort (0–100 °C)`);
  });
  input.mash.steps.forEach((s, i) => {
    if (s.tempC > 100 || s.tempC < 0)
      refuse(`mash.steps.${i}.tempC`, `a mash at ${plain(s.tempC, 1)} °C is outside liquid water (0–100 °C)`);
  });
  input.fermentation.steps.forEach((s, i) => {
    if (s.tempC > 100 || s.tempC < -10)
      refuse(`fermentation.steps.${i}.tempC`, `a fermentation at ${plain(s.tempC, 1)} °C is not possible`);
  });
}

/**
 * Brings a mapped document within the schema: values are changed (Assumed) or entries left out
 * (Left out); what cannot be fitted is refused, naming the file's element.
 */
export function fitToSchema(
  input: RecipeDocumentInput,
  lists: FitLists,
  describe: (path: string) => string,
): RecipeDocumentInput {
  const doc = structuredClone(input) as Record<string, unknown>;
  // Entries to leave out are only marked while fitting, so every path keeps naming the file's element.
  const leaveOut = new Map<string, Set<number>>();
  for (let pass = 0; pass < 20; pass++) {
    const parsed = recipeDocumentSchema.safeParse(doc);
    if (parsed.success) break;
    const open = parsed.error.issues.filter((issue) => !marked(leaveOut, issue.path));
    if (open.length === 0) break;
    let progressed = false;
    for (const issue of open) {
      if (marked(leaveOut, issue.path)) continue;
      if (fitIssue(doc, issue, leaveOut, lists, describe)) progressed = true;
      else refuseIssue(issue, open, describe);
    }
    if (!progressed) break;
  }
  for (const [list, indexes] of leaveOut) {
    const items = valueAt(doc, list.split('.')) as unknown[];
    for (const index of [...indexes].sort((a, b) => b - a)) items.splice(index, 1);
  }
  const parsed = recipeDocumentSchema.safeParse(doc);
  if (!parsed.success) refuseIssue(parsed.error.issues[0], parsed.error.issues, describe);
  return doc as RecipeDocumentInput;
}

function refuseIssue(issue: Issue, all: readonly Issue[], describe: (path: string) => string): never {
  const more = all.length > 1 ? ` (and ${all.length - 1} more problem${all.length > 2 ? 's' : ''})` : '';
  throw new InterchangeError(`${issue.message}${more}`, describe(issue.path.map(String).join('.')));
}

/** The list (`mash.steps`) and index an issue's path lies in, when it lies in one of `lists`. */
function entryOf(path: readonly PropertyKey[], lists: readonly string[]): { list: string; index: number } | null {
  for (const list of lists) {
    const parts = list.split('.');
    if (path.length > parts.length && parts.every((p, i) => path[i] === p) && typeof path[parts.length] === 'number')
      return { list, index: path[parts.length] as number };
  }
  return null;
}

function marked(leaveOut: Map<string, Set<number>>, path: readonly PropertyKey[]): boolean {
  const entry = entryOf(path, [...leaveOut.keys()]);
  return entry !== null && leaveOut.get(entry.list)!.has(entry.index);
}

function mark(leaveOut: Map<string, Set<number>>, list: string, index: number): void {
  if (!leaveOut.has(list)) leaveOut.set(list, new Set());
  leaveOut.get(list)!.add(index);
}

function valueAt(doc: unknown, path: readonly PropertyKey[]): unknown {
  let node = doc;
  for (const part of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PropertyKey, unknown>)[part];
  }
  return node;
}

function setAt(doc: unknown, path: readonly PropertyKey[], value: unknown): void {
  const parent = valueAt(doc, path.slice(0, -1)) as Record<PropertyKey, unknown>;
  if (value === undefined) delete parent[path[path.length - 1]];
  else parent[path[path.length - 1]] = value;
}

const LABELS: Record<string, string> = {
  'mash.steps': 'mash step',
  'fermentation.steps': 'fermentation step',
  fermentables: 'fermentable',
  hops: 'hop',
  yeasts: 'yeast',
  'water.salts': 'salt addition',
};

/** One issue fitted; false when it cannot be (the file is then refused). */
function fitIssue(
  doc: Record<string, unknown>,
  issue: Issue,
  leaveOut: Map<string, Set<number>>,
  lists: FitLists,
  describe: (path: string) => string,
): boolean {
  const path = issue.path;
  const where = describe(path.map(String).join('.'));
  const value = valueAt(doc, path);
  const step = entryOf(path, STEP_LISTS);
  const item = entryOf(path, ITEM_LISTS);
  const leaveEntryOut = (entry: { list: string; index: number }, reason: string) => {
    const entryValue = valueAt(doc, [...entry.list.split('.'), entry.index]);
    lists.dropped.push(`${where}: ${reason}; the ${LABELS[entry.list]} is left out`);
    lists.kept.push(`Left out ${LABELS[entry.list]}: ${describeEntry(entryValue)} (${reason})`);
    mark(leaveOut, entry.list, entry.index);
    return true;
  };

  if ((issue.code === 'too_big' || issue.code === 'too_small') && issue.origin === 'number') {
    const reason = `${plain(value as number, 4)} is outside what the editor takes (${issue.message})`;
    if (step) return leaveEntryOut(step, reason);
    const bound = issue.code === 'too_big' ? Number(issue.maximum) : Number(issue.minimum);
    if (!issue.inclusive) return item ? leaveEntryOut(item, reason) : false;
    setAt(doc, path, bound);
    lists.guessed.push(`${where}: ${reason}; used ${plain(bound, 4)}`);
    return true;
  }
  if (issue.code === 'too_big' && issue.origin === 'array') {
    const items = value as unknown[];
    const max = Number(issue.maximum);
    const list = path.map(String).join('.');
    for (let index = max; index < items.length; index++) {
      if (!leaveOut.get(list)?.has(index)) {
        lists.dropped.push(`${where}: entry ${index + 1} (${describeEntry(items[index])}); ${issue.message}`);
        mark(leaveOut, list, index);
      }
    }
    return true;
  }
  if (issue.code === 'too_big' && issue.origin === 'string') {
    setAt(doc, path, (value as string).slice(0, Number(issue.maximum)));
    lists.guessed.push(`${where}: shortened to ${String(issue.maximum)} characters`);
    return true;
  }
  if (issue.code === 'custom') {
    const field = path.map(String).join('.');
    if (/^hops\.\d+\.timeMin$/.test(field)) {
      // A boil or first-wort hop longer than the boil: it cannot be in the kettle longer than the boil runs.
      const boilTimeMin = (doc.batch as { boilTimeMin: number }).boilTimeMin;
      setAt(doc, path, boilTimeMin);
      lists.guessed.push(`${where}: ${issue.message}; used the boil time, ${plain(boilTimeMin, 2)} min`);
      return true;
    }
    if (/^yeasts\.\d+\.tempMaxC$/.test(field)) {
      setAt(doc, [...path.slice(0, -1), 'tempMinC'], undefined);
      setAt(doc, path, undefined);
      lists.dropped.push(`${where}: ${issue.message}; the yeast's temperature range is left out`);
      return true;
    }
    if (field === 'water.salts') {
      const salts = (doc.water as { salts: unknown[] }).salts;
      lists.dropped.push(`${where}: ${issue.message}; the salts are left out`);
      lists.kept.push(`Left out salts: ${salts.map(describeEntry).join(', ')}`);
      (doc.water as { salts: unknown[] }).salts = [];
      return true;
    }
  }
  return false;
}

/** A short description of a left-out entry for the notes, from its own values. */
function describeEntry(entry: unknown): string {
  if (entry === null || typeof entry !== 'object') return String(entry);
  const e = entry as Record<string, unknown>;
  const parts: string[] = [];
  if (typeof e.name === 'string') parts.push(e.name);
  if (typeof e.salt === 'string') parts.push(e.salt.replace(/_/g, ' '));
  if (typeof e.tempC === 'number') parts.push(`${plain(e.tempC, 1)} °C`);
  if (typeof e.timeMin === 'number') parts.push(`${plain(e.timeMin, 1)} min`);
  if (typeof e.days === 'number') parts.push(`${plain(e.days, 2)} days`);
  if (typeof e.amountKg === 'number') parts.push(`${plain(e.amountKg, 3)} kg`);
  if (typeof e.amountG === 'number') parts.push(`${plain(e.amountG, 2)} g`);
  if (typeof e.grams === 'number') parts.push(`${plain(e.grams, 2)} g`);
  return parts.join(', ');
}
