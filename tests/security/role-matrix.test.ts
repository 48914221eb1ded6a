import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { comments, photos, recipes, reports, type User } from '@/db/schema';
import { unsubscribeToken } from '@/lib/notifications/unsubscribe-token';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, type Saved } from '../helpers/recipes';
import { mutatingRouteKeys } from '../helpers/routes';
import { createUser, signedInClient, uniqueEmail } from '../helpers/users';
import { forkVia, proposalFrom, proposalTo } from '../proposals/helpers';

/**
 * Every mutating route × anonymous, member, owner, moderator and admin → the expected status.
 * The routes are found by scanning app/api for exported POST/PUT/PATCH/DELETE handlers, so a new
 * route without a row here fails this test.
 */

const ROLES = ['anonymous', 'member', 'owner', 'moderator', 'admin'] as const;
type Role = (typeof ROLES)[number];
type Expected = Record<Role, number>;

interface World {
  owner: { user: User; client: TestClient };
  clients: Record<Role, TestClient>;
}

interface Request {
  path: string;
  body?: unknown;
  raw?: { contentType: string; body: string };
}

interface Row {
  /** Prepares fresh fixtures owned by the world's owner, so each call acts on its own rows. */
  prepare(w: World): Promise<Request>;
  expect: Expected;
}

const all = (status: number): Expected => ({
  anonymous: status,
  member: status,
  owner: status,
  moderator: status,
  admin: status,
});
const signedIn = (status: number, others: Partial<Expected> = {}): Expected => ({
  anonymous: 401,
  member: status,
  owner: status,
  moderator: status,
  admin: status,
  ...others,
});
const ownerOnly = (ok: number, notOwner = 403): Expected => ({
  anonymous: 401,
  member: notOwner,
  owner: ok,
  moderator: notOwner,
  admin: notOwner,
});
const ownerOrModerator = (ok: number): Expected => ({
  anonymous: 401,
  member: 403,
  owner: ok,
  moderator: ok,
  admin: ok,
});
const moderators = (ok: number): Expected => ({ anonymous: 401, member: 403, owner: 403, moderator: ok, admin: ok });

const recipeOf = (w: World) => createRecipeVia(w.owner.client);

async function brewDayOf(w: World): Promise<{ recipe: Saved; brewDayId: string }> {
  const recipe = await recipeOf(w);
  const res = await w.owner.client.post<{ id: string }>('/api/brew-days', {
    versionId: recipe.version.id,
    brewedOn: '2026-02-01',
  });
  if (res.status !== 201) throw new Error(`brew day: ${res.status} ${JSON.stringify(res.body)}`);
  return { recipe, brewDayId: res.body.id };
}

async function commentOf(w: World): Promise<string> {
  // Written straight to the database: the owner's own comment budget is for the rows that post one.
  const recipe = await recipeOf(w);
  const [row] = await db
    .insert(comments)
    .values({ recipeId: recipe.recipe.id, authorId: w.owner.user.id, body: 'A comment' })
    .returning({ id: comments.id });
  return row.id;
}

const ROWS: Record<string, Row> = {
  'POST /api/accounts': {
    prepare: async () => ({
      path: '/api/accounts',
      body: { name: 'Matrix Brewer', email: uniqueEmail('matrix'), password: 'copper kettle hop stand' },
    }),
    expect: all(201),
  },
  // next-auth's own handler: a sign-out without its CSRF token is sent back to the confirmation page.
  'POST /api/auth/[...nextauth]': {
    prepare: async () => ({
      path: '/api/auth/signout',
      raw: { contentType: 'application/x-www-form-urlencoded', body: '' },
    }),
    expect: all(302),
  },
  'POST /api/stats': { prepare: async () => ({ path: '/api/stats', body: { document: paleAle() } }), expect: all(200) },
  'POST /api/import': { prepare: async () => ({ path: '/api/import', body: { text: '' } }), expect: signedIn(400) },
  'POST /api/recipes': {
    prepare: async () => ({ path: '/api/recipes', body: { document: paleAle(), visibility: 'private' } }),
    expect: signedIn(201),
  },
  'PATCH /api/recipes/[id]': {
    prepare: async (w) => ({ path: `/api/recipes/${(await recipeOf(w)).recipe.id}`, body: { visibility: 'unlisted' } }),
    expect: ownerOnly(200),
  },
  'POST /api/recipes/[id]/versions': {
    prepare: async (w) => {
      const r = await recipeOf(w);
      return {
        path: `/api/recipes/${r.recipe.id}/versions`,
        body: { document: paleAle(), baseVersionId: r.version.id, message: 'More hops' },
      };
    },
    expect: ownerOnly(201),
  },
  'POST /api/recipes/[id]/restore': {
    prepare: async (w) => {
      const r = await recipeOf(w);
      return {
        path: `/api/recipes/${r.recipe.id}/restore`,
        body: { versionId: r.version.id, baseVersionId: r.version.id },
      };
    },
    expect: ownerOnly(201),
  },
  'POST /api/versions/[id]/fork': {
    prepare: async (w) => ({
      path: `/api/versions/${(await recipeOf(w)).version.id}/fork`,
      body: { title: 'A fork', visibility: 'private' },
    }),
    expect: signedIn(201),
  },
  'PUT /api/admin/users/[id]/role': {
    prepare: async () => ({ path: `/api/admin/users/${(await createUser()).id}/role`, body: { role: 'moderator' } }),
    expect: { anonymous: 401, member: 403, owner: 403, moderator: 403, admin: 200 },
  },
  'PUT /api/users/[id]/suspension': {
    prepare: async () => ({
      path: `/api/users/${(await createUser()).id}/suspension`,
      body: { suspended: true, reason: 'Matrix' },
    }),
    expect: moderators(200),
  },
  'POST /api/brew-days': {
    prepare: async (w) => ({
      path: '/api/brew-days',
      body: { versionId: (await recipeOf(w)).version.id, brewedOn: '2026-02-01' },
    }),
    expect: signedIn(201),
  },
  'PATCH /api/brew-days/[id]': {
    prepare: async (w) => ({
      path: `/api/brew-days/${(await brewDayOf(w)).brewDayId}`,
      body: { brewedOn: '2026-02-02' },
    }),
    expect: ownerOnly(200),
  },
  'POST /api/brew-days/[id]/readings': {
    prepare: async (w) => ({
      path: `/api/brew-days/${(await brewDayOf(w)).brewDayId}/readings`,
      body: { takenOn: '2026-02-03', beerTempC: 18 },
    }),
    expect: ownerOnly(201),
  },
  'POST /api/brew-days/[id]/live': {
    prepare: async (w) => ({
      path: `/api/brew-days/${(await brewDayOf(w)).brewDayId}/live`,
      body: { idempotencyKey: crypto.randomUUID(), kind: 'step', stepId: 'boil', checked: true },
    }),
    expect: ownerOnly(201),
  },
  'PUT /api/brew-days/[id]/plan': {
    prepare: async (w) => ({
      path: `/api/brew-days/${(await brewDayOf(w)).brewDayId}/plan`,
      body: { pourOn: '2099-03-01', carbonation: 'burst' },
    }),
    expect: ownerOnly(200),
  },
  'POST /api/brew-days/[id]/tastings': {
    prepare: async (w) => ({
      path: `/api/brew-days/${(await brewDayOf(w)).brewDayId}/tastings`,
      body: { tastedOn: '2026-03-01', overall: 'Crisp', rating: 4 },
    }),
    expect: signedIn(201),
  },
  'POST /api/brew-days/[id]/photos': {
    // Not an image: refused after the access check, and only the brewer gets that far.
    prepare: async (w) => ({
      path: `/api/brew-days/${(await brewDayOf(w)).brewDayId}/photos`,
      raw: { contentType: 'multipart/form-data; boundary=x', body: '--x--\r\n' },
    }),
    expect: ownerOnly(400),
  },
  'DELETE /api/photos/[id]': {
    prepare: async (w) => {
      const { brewDayId } = await brewDayOf(w);
      const [photo] = await db
        .insert(photos)
        .values({
          brewDayId,
          uploaderId: w.owner.user.id,
          displayKey: `matrix/${crypto.randomUUID()}`,
          thumbKey: `matrix/${crypto.randomUUID()}`,
          width: 10,
          height: 10,
          storedBytes: 10,
        })
        .returning({ id: photos.id });
      return { path: `/api/photos/${photo.id}` };
    },
    expect: ownerOrModerator(200),
  },
  'POST /api/recipes/[id]/comments': {
    prepare: async (w) => ({
      path: `/api/recipes/${(await recipeOf(w)).recipe.id}/comments`,
      body: { body: 'Nice one' },
    }),
    expect: signedIn(201),
  },
  'PATCH /api/comments/[id]': {
    prepare: async (w) => ({ path: `/api/comments/${await commentOf(w)}`, body: { body: 'Edited' } }),
    expect: ownerOnly(200),
  },
  'DELETE /api/comments/[id]': {
    prepare: async (w) => ({ path: `/api/comments/${await commentOf(w)}` }),
    expect: ownerOrModerator(200),
  },
  'PUT /api/recipes/[id]/star': {
    prepare: async (w) => ({ path: `/api/recipes/${(await recipeOf(w)).recipe.id}/star` }),
    expect: signedIn(200),
  },
  'DELETE /api/recipes/[id]/star': {
    prepare: async (w) => ({ path: `/api/recipes/${(await recipeOf(w)).recipe.id}/star` }),
    expect: signedIn(200),
  },
  'POST /api/follows': {
    prepare: async (w) => ({ path: '/api/follows', body: { type: 'recipe', id: (await recipeOf(w)).recipe.id } }),
    expect: signedIn(201),
  },
  'DELETE /api/follows': {
    prepare: async (w) => ({ path: '/api/follows', body: { type: 'recipe', id: (await recipeOf(w)).recipe.id } }),
    expect: signedIn(200),
  },
  'POST /api/reports': {
    prepare: async (w) => ({
      path: '/api/reports',
      body: { targetType: 'recipe', targetId: (await recipeOf(w)).recipe.id, reason: 'spam', note: '' },
    }),
    // Nobody reports their own recipe.
    expect: signedIn(201, { owner: 400 }),
  },
  'POST /api/moderation/reports/[id]': {
    prepare: async (w) => {
      const reporter = await createUser();
      const r = await recipeOf(w);
      const [report] = await db
        .insert(reports)
        .values({
          reporterId: reporter.id,
          targetType: 'recipe',
          targetId: r.recipe.id,
          targetOwnerId: w.owner.user.id,
          recipeId: r.recipe.id,
          reason: 'spam',
        })
        .returning({ id: reports.id });
      return { path: `/api/moderation/reports/${report.id}`, body: { action: 'dismiss' } };
    },
    expect: moderators(200),
  },
  'POST /api/moderation/comments/[id]': {
    prepare: async (w) => {
      const id = await commentOf(w);
      await db.update(comments).set({ status: 'held' }).where(eq(comments.id, id));
      return { path: `/api/moderation/comments/${id}`, body: { action: 'approve' } };
    },
    expect: moderators(200),
  },
  'POST /api/moderation/restore': {
    prepare: async (w) => {
      const r = await recipeOf(w);
      await db.update(recipes).set({ hiddenAt: new Date(), hiddenReason: 'Matrix' }).where(eq(recipes.id, r.recipe.id));
      return {
        path: '/api/moderation/restore',
        body: { targetType: 'recipe', targetId: r.recipe.id, reason: 'Mistake' },
      };
    },
    expect: moderators(200),
  },
  'POST /api/notifications/read': {
    prepare: async () => ({ path: '/api/notifications/read', body: {} }),
    expect: signedIn(200),
  },
  'PUT /api/me/settings': {
    prepare: async () => ({
      path: '/api/me/settings',
      body: {
        name: 'Matrix Brewer',
        bio: '',
        units: 'metric',
        defaultBatchVolumeL: 20,
        defaultEfficiencyPct: 72,
        emailChoices: {
          fork: true,
          comment: true,
          reply: true,
          star: true,
          brewed: true,
          new_recipe: true,
          proposal: true,
          proposal_decision: true,
        },
      },
    }),
    expect: signedIn(200),
  },
  'PUT /api/me/brewhouse': {
    prepare: async () => ({
      path: '/api/me/brewhouse',
      body: {
        boilOffLPerHour: 3.5,
        trubLossL: null,
        grainAbsorptionLPerKg: 0.9,
        mashWaterLPerKg: null,
        waterReport: null,
      },
    }),
    expect: signedIn(200),
  },
  'POST /api/proposals': {
    prepare: async (w) => {
      const source = await createRecipeVia((await signedInClient()).client);
      const fork = await forkVia(w.owner.client, source.version.id);
      return { path: '/api/proposals', body: { versionId: fork.version.id, title: 'A proposal', description: '' } };
    },
    expect: ownerOnly(201),
  },
  'PATCH /api/proposals/[id]': {
    prepare: async (w) => ({
      path: `/api/proposals/${(await proposalFrom(w.owner.client)).id}`,
      body: { title: 'Reworded' },
    }),
    expect: ownerOnly(200),
  },
  'POST /api/proposals/[id]/withdraw': {
    prepare: async (w) => ({ path: `/api/proposals/${(await proposalFrom(w.owner.client)).id}/withdraw` }),
    expect: ownerOnly(201),
  },
  'POST /api/proposals/[id]/accept': {
    prepare: async (w) => {
      const p = await proposalTo(w.owner.client);
      return { path: `/api/proposals/${p.id}/accept`, body: { sourceHeadVersionId: p.source.version.id } };
    },
    expect: ownerOnly(201),
  },
  'POST /api/proposals/[id]/decision': {
    prepare: async (w) => ({
      path: `/api/proposals/${(await proposalTo(w.owner.client)).id}/decision`,
      body: { decision: 'declined', comment: 'Not for this one.' },
    }),
    expect: ownerOnly(201),
  },
  'POST /api/proposals/[id]/comments': {
    prepare: async (w) => ({
      path: `/api/proposals/${(await proposalTo(w.owner.client)).id}/comments`,
      body: { body: 'Tried it?' },
    }),
    expect: signedIn(201),
  },
  'POST /api/unsubscribe': {
    prepare: async (w) => ({
      path: `/api/unsubscribe?token=${encodeURIComponent(unsubscribeToken(w.owner.user.id, 'star'))}`,
    }),
    expect: all(200),
  },
};

describe('role matrix of every mutating route', () => {
  const world = {} as World;

  beforeAll(async () => {
    const owner = await signedInClient('member');
    const member = await signedInClient('member');
    const moderator = await signedInClient('moderator');
    const admin = await signedInClient('admin');
    world.owner = owner;
    world.clients = {
      anonymous: new TestClient(),
      member: member.client,
      owner: owner.client,
      moderator: moderator.client,
      admin: admin.client,
    };
  });

  it('has a row for every mutating route in app/api, and no row for a route that is gone', () => {
    const routes = mutatingRouteKeys();
    expect(routes.length).toBeGreaterThan(20);
    expect(
      routes.filter((r) => !(r in ROWS)),
      'routes without a row',
    ).toEqual([]);
    expect(
      Object.keys(ROWS).filter((r) => !routes.includes(r)),
      'rows without a route',
    ).toEqual([]);
  });

  for (const [key, row] of Object.entries(ROWS)) {
    it(key, async () => {
      const [method] = key.split(' ');
      const got: Partial<Expected> = {};
      for (const role of ROLES) {
        const req = await row.prepare(world);
        const client = role === 'anonymous' ? new TestClient() : world.clients[role];
        const res = req.raw
          ? await client.fetch(req.path, {
              method,
              headers: { 'content-type': req.raw.contentType },
              body: req.raw.body,
            })
          : await client.json(method, req.path, req.body);
        got[role] = res.status;
      }
      expect(got).toEqual(row.expect);
    });
  }
});
