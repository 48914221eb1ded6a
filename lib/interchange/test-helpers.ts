import { readFileSync } from 'node:fs';
import { demoForks, demoRecipes, type DemoRecipe } from '@/db/seed/recipes';
import { recipeDocumentSchema, type RecipeDocument, type RecipeDocumentInput } from '@/lib/brewing/schema';

/** The invented example pale ale the engine's tests use, checked. */
export function examplePaleAle(): RecipeDocument {
  return recipeDocumentSchema.parse(
    JSON.parse(readFileSync(new URL('../brewing/examples/pale-ale.json', import.meta.url), 'utf8')),
  );
}

export function example(name: string): string {
  return readFileSync(new URL(`./examples/${name}`, import.meta.url), 'utf8');
}

/**
 * Every document the demo seed saves, version by version, built without the database: each demo
 * recipe's chain of changes, then each fork from the version it was forked from.
 */
export function seededDocuments(): { key: string; document: RecipeDocument }[] {
  const out: { key: string; document: RecipeDocument }[] = [];
  const versions = new Map<string, RecipeDocumentInput[]>();
  const replay = (key: string, start: RecipeDocumentInput, steps: DemoRecipe['versions']) => {
    const chain = [structuredClone(start)];
    for (const step of steps ?? []) {
      const next = structuredClone(chain[chain.length - 1]);
      step.change(next);
      chain.push(next);
    }
    versions.set(key, chain);
    chain.forEach((doc, i) => out.push({ key: `${key} v${i + 1}`, document: recipeDocumentSchema.parse(doc) }));
  };
  for (const r of demoRecipes) replay(r.key, r.document, r.versions);
  for (const f of demoForks) {
    const source = versions.get(f.from)?.[f.fromVersion - 1];
    if (!source) throw new Error(`no version ${f.fromVersion} of ${f.from}`);
    replay(f.key, { ...recipeDocumentSchema.parse(source), title: f.title }, f.versions);
  }
  return out;
}
