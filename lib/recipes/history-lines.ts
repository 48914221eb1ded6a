import 'server-only';
import { inArray } from 'drizzle-orm';
import { readDatabase } from '@/db';
import { recipeVersions } from '@/db/schema';
import { recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing';
import type { UnitSystem } from '@/lib/brewing/units';
import { compareDocuments } from './compare';
import { historyLine } from './history';
import { getVersionsByRecipeId, type HistoryEntry } from './versions';

/**
 * The history timeline's "what moved" line for each version against the one before it. Versions
 * never change, so a pair's line is kept once made (per unit system) and only the versions of
 * pairs not yet kept are read and compared: a long history costs one attribution per new save.
 */

const KEPT_LINES = 5000;
const kept = new Map<string, string>();

function keep(key: string, line: string): void {
  if (kept.size >= KEPT_LINES) kept.delete(kept.keys().next().value!);
  kept.set(key, line);
}

/** Lines by version id (newest first in `versions`); the first version has none. */
async function getHistoryLines(
  versions: readonly { id: string; number: number }[],
  units: UnitSystem,
): Promise<Map<string, string>> {
  const byNumber = [...versions].sort((x, y) => x.number - y.number);
  const pairs = byNumber
    .slice(1)
    .map((v, i) => ({ before: byNumber[i].id, after: v.id, key: `${byNumber[i].id}>${v.id}:${units}` }));
  const lines = new Map<string, string>();
  const missing = pairs.filter((p) => {
    const line = kept.get(p.key);
    if (line !== undefined) lines.set(p.after, line);
    return line === undefined;
  });
  if (!missing.length) return lines;
  const ids = [...new Set(missing.flatMap((p) => [p.before, p.after]))];
  const rows = await readDatabase()
    .select({ id: recipeVersions.id, document: recipeVersions.document })
    .from(recipeVersions)
    .where(inArray(recipeVersions.id, ids));
  // Documents written by an older engine are read with today's defaults, as everywhere else.
  const docs = new Map<string, RecipeDocument>(rows.map((r) => [r.id, recipeDocumentSchema.parse(r.document)]));
  for (const p of missing) {
    const a = docs.get(p.before);
    const b = docs.get(p.after);
    if (!a || !b) continue;
    const line = historyLine(compareDocuments(a, b, { units }));
    keep(p.key, line);
    lines.set(p.after, line);
  }
  return lines;
}

/** Every version of a recipe, newest first, each with what moved since the version before it. */
export async function getHistoryByRecipeId({
  recipeId,
  units,
}: {
  recipeId: string;
  units: UnitSystem;
}): Promise<(HistoryEntry & { moved: string | null })[]> {
  const versions = await getVersionsByRecipeId({ recipeId });
  const lines = await getHistoryLines(versions, units);
  return versions.map((v) => ({ ...v, moved: lines.get(v.id) ?? null }));
}
