import { recipeDocumentSchema, type RecipeDocument, type RecipeDocumentInput } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import { compareItems } from '@/lib/recipes/compare';
import { SECTION_TITLE } from '@/lib/recipes/fields';

/**
 * What one version of a recipe changed against another, in the words and units compare uses
 * (lib/recipes/compare.ts and its field labels): shown when someone saved a newer version while a
 * member was still editing an older one.
 */

interface ChangeGroup {
  /** The section, e.g. "Hops", "Mash". */
  title: string;
  /** One line per change, e.g. "Yeast: Clean ale yeast → Kveik", "Cascade (boil, 10 min) +5 g (25 g → 30 g)". */
  lines: string[];
}

export interface VersionChanges {
  groups: ChangeGroup[];
  notesChanged: boolean;
}

/** Defaults filled in, so a left-out default and the same value written out compare equal. */
function withDefaults(doc: RecipeDocumentInput): RecipeDocument {
  const parsed = recipeDocumentSchema.safeParse(doc);
  // Both sides are saved versions, so they parse; a document that does not is compared as it is.
  return parsed.success ? parsed.data : (doc as RecipeDocument);
}

export function compareVersions(
  base: RecipeDocumentInput,
  head: RecipeDocumentInput,
  units: UnitSystem,
): VersionChanges {
  const { sections, notesChanged } = compareItems(withDefaults(base), withDefaults(head), units);
  const groups = sections
    .map((s) => ({
      title: SECTION_TITLE[s.section],
      lines: s.items.filter((i) => i.status !== 'same').map((i) => i.summary),
    }))
    .filter((g) => g.lines.length > 0);
  return { groups, notesChanged };
}

export function hasChanges(changes: VersionChanges): boolean {
  return changes.groups.length > 0 || changes.notesChanged;
}
