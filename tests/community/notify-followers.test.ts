import { and, eq, inArray } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db, type Transaction } from '@/db';
import { memberFollows, notificationEmails, notificationPreferences, notifications } from '@/db/schema';
import { notifyRecipeCreated } from '@/lib/notifications/recipe-events';
import { createRecipeVia } from '../helpers/recipes';
import { createUser, signedInClient } from '../helpers/users';

/** Counts the statements a transaction is asked to run (each select, insert, update, delete or raw execute). */
function counting(tx: Transaction): { tx: Transaction; count: () => number } {
  let statements = 0;
  const counted = new Set(['select', 'insert', 'update', 'delete', 'execute']);
  const proxy = new Proxy(tx, {
    get(target, key, receiver) {
      const value = Reflect.get(target, key, receiver) as unknown;
      if (typeof key === 'string' && counted.has(key) && typeof value === 'function') {
        return (...args: unknown[]) => {
          statements++;
          return (value as (...a: unknown[]) => unknown).apply(target, args);
        };
      }
      return value;
    },
  });
  return { tx: proxy, count: () => statements };
}

/** An owner with a public recipe and `n` followers who start following after it was created. */
async function ownerWithFollowers(n: number) {
  const { user: owner, client } = await signedInClient();
  const saved = await createRecipeVia(client);
  const followers = await Promise.all(Array.from({ length: n }, () => createUser()));
  if (followers.length > 0) {
    await db.insert(memberFollows).values(followers.map((f) => ({ followerId: f.id, followeeId: owner.id })));
  }
  const recipe = {
    id: saved.recipe.id,
    slug: saved.recipe.slug,
    ownerId: owner.id,
    visibility: 'public',
    forkedFromVersionId: null,
  };
  return { owner, followers, recipe };
}

async function runCounted(recipe: Parameters<typeof notifyRecipeCreated>[1]): Promise<number> {
  return db.transaction(async (raw) => {
    const { tx, count } = counting(raw);
    await notifyRecipeCreated(tx, recipe);
    return count();
  });
}

describe('telling followers of a new recipe', () => {
  it('costs the same number of statements for 3 followers as for 40', async () => {
    const few = await ownerWithFollowers(3);
    const many = await ownerWithFollowers(40);
    const fewStatements = await runCounted(few.recipe);
    const manyStatements = await runCounted(many.recipe);
    expect(manyStatements).toBe(fewStatements);
    expect(manyStatements).toBeLessThanOrEqual(2);
  });

  it('tells each follower exactly once, never the owner, and e-mails only those who kept the kind on', async () => {
    const { owner, followers, recipe } = await ownerWithFollowers(6);
    const [quiet, ...rest] = followers;
    await db.insert(notificationPreferences).values({ userId: quiet.id, kind: 'new_recipe', email: false });
    const stranger = await createUser();

    await db.transaction((tx) => notifyRecipeCreated(tx, recipe));

    const everyone = [owner.id, stranger.id, ...followers.map((f) => f.id)];
    const bell = await db
      .select({ userId: notifications.userId, actorId: notifications.actorId, url: notifications.url })
      .from(notifications)
      .where(and(eq(notifications.recipeId, recipe.id), eq(notifications.kind, 'new_recipe')));
    expect(bell.map((row) => row.userId).sort()).toEqual(followers.map((f) => f.id).sort());
    expect(bell.every((row) => row.actorId === owner.id && row.url === `/recipes/${recipe.slug}`)).toBe(true);

    const queued = await db
      .select({ userId: notificationEmails.userId })
      .from(notificationEmails)
      .where(and(inArray(notificationEmails.userId, everyone), eq(notificationEmails.kind, 'new_recipe')));
    expect(queued.map((row) => row.userId).sort()).toEqual(rest.map((f) => f.id).sort());
  });

  it('tells nobody of a private recipe', async () => {
    const { followers, recipe } = await ownerWithFollowers(2);
    await db.transaction((tx) => notifyRecipeCreated(tx, { ...recipe, visibility: 'private' }));
    const bell = await db
      .select({ userId: notifications.userId })
      .from(notifications)
      .where(
        and(
          eq(notifications.recipeId, recipe.id),
          inArray(
            notifications.userId,
            followers.map((f) => f.id),
          ),
        ),
      );
    expect(bell).toEqual([]);
  });
});
