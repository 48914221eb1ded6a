import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { users } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { signedInClient } from '../helpers/users';
import { textOf } from './helpers';
import type { FieldIssue } from '@/lib/errors';

const valid = {
  name: 'Settled Brewer',
  bio: 'Lagers and **patience**.',
  units: 'us',
  defaultBatchVolumeL: 23,
  defaultEfficiencyPct: 75,
  emailChoices: {
    fork: true,
    comment: true,
    reply: true,
    star: false,
    brewed: true,
    new_recipe: false,
    proposal: true,
    proposal_decision: true,
  },
};

describe('member settings', () => {
  it('saves profile, units, brewhouse defaults and e-mail choices together, shown on the member page', async () => {
    const { client, user } = await signedInClient();
    const res = await client.put<{ settings: typeof valid }>('/api/me/settings', valid);
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject(valid);
    const [row] = await db.select().from(users).where(eq(users.id, user.id));
    expect(row).toMatchObject({
      name: 'Settled Brewer',
      units: 'us',
      defaultBatchVolumeL: 23,
      defaultEfficiencyPct: 75,
    });
    expect((await client.me())?.handle).toBe(user.handle);
    const page = await (await new TestClient().fetch(`/members/${user.handle}`)).text();
    expect(textOf(page)).toContain('Settled Brewer');
    expect(page).toContain('<strong>patience</strong>');
    expect((await client.fetch('/settings')).status).toBe(200);
  });

  it('refuses bad input with a message per field and changes nothing', async () => {
    const { client, user } = await signedInClient();
    const res = await client.put<{ error: { fields: FieldIssue[] } }>('/api/me/settings', {
      ...valid,
      name: '',
      units: 'imperial',
      defaultBatchVolumeL: 0,
      defaultEfficiencyPct: 140,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f) => f.path).sort()).toEqual([
      'defaultBatchVolumeL',
      'defaultEfficiencyPct',
      'name',
      'units',
    ]);
    const [row] = await db.select().from(users).where(eq(users.id, user.id));
    expect(row.name).toBe(user.name);
    expect((await new TestClient().put('/api/me/settings', valid)).status).toBe(401);
    expect((await new TestClient().fetch('/settings')).status).toBe(307);
  });
});
