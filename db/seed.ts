import { sql } from 'drizzle-orm';
import { db, getPool } from './index';
import { recipes, users } from './schema';
import { seedBrewDays } from './seed/brew-days';
import { seedCommunity } from './seed/community';
import type { SeedContext } from './seed/context';
import { DEMO_PASSWORD, demoPeople } from './seed/people';
import { seedProposals } from './seed/proposals';
import { demoForks, demoRecipes } from './seed/recipes';
import { dateDemoWorld, planVersionDates } from './seed/timeline';
import { hashPassword } from '@/lib/auth/password';
import type { Viewer } from '@/lib/auth/session';
import { recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing';
import { createRecipe, forkRecipe, getVersionByNumber, saveVersion } from '@/lib/recipes/versions';
import { processSearchOutbox } from '@/lib/search/sync';

// Idempotent: running it again leaves an existing demo world as it is.
async function seedPeople(): Promise<Map<string, Viewer>> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const p of demoPeople) {
    await db
      .insert(users)
      .values({ ...p, passwordHash, emailVerified: new Date() })
      .onConflictDoNothing({ target: users.handle });
  }
  const rows = await db.select().from(users);
  return new Map(
    rows.map((u) => [
      u.handle,
      { id: u.id, name: u.name ?? u.handle, email: u.email, handle: u.handle, role: u.role, units: u.units },
    ]),
  );
}

async function saveChain(
  viewer: Viewer,
  recipeId: string,
  first: { id: string },
  start: RecipeDocumentInput,
  steps: { message: string; change: (d: RecipeDocumentInput) => void }[],
) {
  let doc = structuredClone(start);
  let base = first.id;
  const numbers = new Map<number, string>([[1, first.id]]);
  for (const step of steps) {
    doc = structuredClone(doc);
    step.change(doc);
    const saved = await saveVersion(viewer, recipeId, {
      document: recipeDocumentSchema.parse(doc),
      baseVersionId: base,
      message: step.message,
    });
    base = saved.version.id;
    numbers.set(saved.version.number, saved.version.id);
  }
  return numbers;
}

async function seedRecipes(people: Map<string, Viewer>): Promise<Map<string, string> | null> {
  const owner = (handle: string) => {
    const v = people.get(handle);
    if (!v) throw new Error(`no demo member ${handle}`);
    return v;
  };
  const [{ n }] = (
    await db.execute(
      sql`select count(*)::int as n from recipes r join users u on u.id = r.owner_id where u.email like '%@kettlefork.test' and u.handle = 'wren'`,
    )
  ).rows as { n: number }[];
  if (n > 0) return null;
  const ids = new Map<string, string>();
  for (const r of demoRecipes) {
    const viewer = owner(r.owner);
    const doc = recipeDocumentSchema.parse(r.document);
    const created = await createRecipe(viewer, {
      document: doc,
      visibility: r.visibility ?? 'public',
      message: 'First brew',
    });
    await saveChain(viewer, created.recipe.id, created.version, r.document, r.versions ?? []);
    ids.set(r.key, created.recipe.id);
  }
  for (const f of demoForks) {
    const viewer = owner(f.owner);
    const source = await getVersionByNumber(viewer, ids.get(f.from)!, f.fromVersion);
    const forked = await forkRecipe(viewer, source.version.id, { title: f.title, visibility: 'public' });
    const start = { ...source.version.document, title: f.title };
    await saveChain(viewer, forked.recipe.id, forked.version, start, f.versions);
    ids.set(f.key, forked.recipe.id);
  }
  return ids;
}

const people = await seedPeople();
const recipeIds = await seedRecipes(people);
if (recipeIds) {
  // The rest of the demo world is added once, together with the recipes it belongs to.
  const context: SeedContext = { people, recipes: recipeIds, versionDates: planVersionDates(demoRecipes, demoForks) };
  await seedCommunity(context);
  await seedBrewDays(context);
  await seedProposals(context);
  await dateDemoWorld(context, context.versionDates);
  await processSearchOutbox().catch((err: Error) => console.warn(`seed: search index not updated yet: ${err.message}`));
}
const [{ members }] = (await db.execute(sql`select count(*)::int as members from users`)).rows as { members: number }[];
const recipeCount = await db.$count(recipes);
console.log(`seed: ${members} members, ${recipeCount} recipes`);
await getPool().end();
