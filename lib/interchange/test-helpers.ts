import { readFileSync } from 'node:fs';
import { recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing/schema';

/** The invented example pale ale the engine's tests use, checked. */
export function examplePaleAle(): RecipeDocument {
  return recipeDocumentSchema.parse(
    JSON.parse(readFileSync(new URL('../brewing/examples/pale-ale.json', import.meta.url), 'utf8')),
  );
}

export function example(name: string): string {
  return readFileSync(new URL(`./examples/${name}`, import.meta.url), 'utf8');
}
