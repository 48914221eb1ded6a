import { Meilisearch, MeilisearchApiError } from 'meilisearch';
import { afterAll, beforeAll, expect } from 'vitest';
import { createFakeSearchServer, type FakeSearchServer } from '../../lib/search/fake';
import type { RecipeSearchDocument } from '../../lib/search/document';

export interface FakeHarness {
  server: FakeSearchServer;
  client: Meilisearch;
}

/** Starts a fake on a free loopback port and a real client pointed at it. */
export async function startFake(apiKey?: string): Promise<FakeHarness> {
  const server = await createFakeSearchServer({ port: 0, host: '127.0.0.1', apiKey });
  const client = new Meilisearch({ host: server.url, apiKey, defaultWaitOptions: { interval: 5, timeout: 5_000 } });
  return { server, client };
}

/**
 * One fake for the enclosing file or `describe` block: started before its tests (then `setup`,
 * such as an index's settings and documents, runs against it) and closed after them. The harness
 * is filled in place, so read `fake.client` inside tests and hooks.
 */
export function fakeAroundTests(
  options: { apiKey?: string; setup?: (fake: FakeHarness) => Promise<void> } = {},
): FakeHarness {
  const fake = {} as FakeHarness;
  beforeAll(async () => {
    Object.assign(fake, await startFake(options.apiKey));
    await options.setup?.(fake);
  });
  afterAll(async () => {
    await fake.server?.close();
  });
  return fake;
}

/** The engine's error a client call was refused with; fails the test when it was not refused. */
export async function apiError(promise: Promise<unknown>): Promise<MeilisearchApiError> {
  const error = await promise.then(
    () => null,
    (caught: unknown) => caught,
  );
  expect(error).toBeInstanceOf(MeilisearchApiError);
  return error as MeilisearchApiError;
}

/** A refusal's HTTP status and the engine's error code. */
export async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string | undefined }> {
  const error = await apiError(promise);
  return { status: error.response.status, code: error.cause?.code };
}

let counter = 0;

/** An invented recipe document; ids are uuid-shaped and unique per call. */
export function recipe(overrides: Partial<RecipeSearchDocument> = {}): RecipeSearchDocument {
  counter++;
  const id = `00000000-0000-4000-8000-${String(counter).padStart(12, '0')}`;
  return {
    id,
    slug: `recipe-${counter}`,
    title: `Test Brew ${counter}`,
    ownerId: 'owner-a',
    authorName: 'Ada Brewer',
    authorHandle: 'ada',
    styleCode: '18B',
    styleName: 'American Pale Ale',
    styleCategory: 'Pale American Ale',
    fermentables: ['Pale ale malt', 'Crystal 40'],
    hops: ['Cascade'],
    yeasts: ['Clean American ale yeast'],
    yeastKinds: ['clean ale'],
    notes: '',
    og: 1.052,
    fg: 1.011,
    abv: 5.4,
    ibu: 38,
    srm: 6,
    stars: 0,
    forks: 0,
    createdAt: 1_700_000_000_000 + counter,
    updatedAt: 1_700_000_000_000 + counter,
    visibility: 'public',
    hidden: false,
    headVersion: 1,
    ...overrides,
  };
}
