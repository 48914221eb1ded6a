import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recipes, type User } from '@/db/schema';
import { isListedFor, listedRecipeSql } from '@/lib/recipes/access';
import { createUser } from '../helpers/users';

const VISIBILITIES = ['public', 'unlisted', 'private'] as const;

describe('the listed-recipe rule in code and in SQL agree', () => {
  const viewers: Record<string, User | null> = { anonymous: null };
  let owner: User;
  const rows: { id: string; visibility: (typeof VISIBILITIES)[number]; hidden: boolean }[] = [];

  beforeAll(async () => {
    owner = await createUser();
    viewers.owner = owner;
    viewers.member = await createUser();
    viewers.moderator = await createUser({ role: 'moderator' });
    viewers.admin = await createUser({ role: 'admin' });
    for (const visibility of VISIBILITIES) {
      for (const hidden of [false, true]) {
        const [row] = await db
          .insert(recipes)
          .values({
            slug: `rule-${crypto.randomUUID()}`,
            ownerId: owner.id,
            title: 'Rule check',
            visibility,
            hiddenAt: hidden ? new Date() : null,
          })
          .returning({ id: recipes.id });
        rows.push({ id: row.id, visibility, hidden });
      }
    }
  });

  afterAll(async () => {
    for (const r of rows) await db.delete(recipes).where(eq(recipes.id, r.id));
  });

  it('on every visibility × hidden × viewer', async () => {
    const disagreements: string[] = [];
    for (const [name, viewer] of Object.entries(viewers)) {
      for (const r of rows) {
        const gate = { ownerId: owner.id, visibility: r.visibility, hiddenAt: r.hidden ? new Date() : null };
        const inCode = isListedFor(gate, viewer);
        const found = await db
          .select({ id: recipes.id })
          .from(recipes)
          .where(and(eq(recipes.id, r.id), listedRecipeSql(viewer)));
        if (inCode !== (found.length === 1))
          disagreements.push(`${name} × ${r.visibility}${r.hidden ? ' hidden' : ''}: code ${inCode}, SQL ${!inCode}`);
      }
    }
    expect(disagreements).toEqual([]);
    expect(rows).toHaveLength(6);
  });
});
