import type { RecipeDocumentInput } from '@/lib/brewing';
import type { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia, type Saved } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import type { FieldIssue } from '@/lib/errors';

export interface ApiError {
  error: {
    code: string;
    message: string;
    fields?: FieldIssue[];
    details?: { head?: { id: string; number: number } };
  };
}

export async function forkVia(
  client: TestClient,
  versionId: string,
  opts: { title?: string; visibility?: 'public' | 'unlisted' | 'private' } = {},
): Promise<Saved> {
  const res = await client.post<Saved>(`/api/versions/${versionId}/fork`, {
    title: opts.title ?? 'My take',
    visibility: opts.visibility ?? 'public',
  });
  if (res.status !== 201) throw new Error(`fork failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** The fork's document with a kveik yeast and a warm ferment instead of the clean ale yeast. */
export function kveikChange(doc: RecipeDocumentInput = paleAle()): RecipeDocumentInput {
  return {
    ...doc,
    yeasts: [{ name: 'Kveik', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 38 }],
    fermentation: { steps: [{ tempC: 32, days: 5 }] },
  };
}

export async function proposeVia(client: TestClient, versionId: string, body: Record<string, unknown> = {}) {
  return client.post<{ id: string } & Partial<ApiError>>('/api/proposals', {
    versionId,
    title: 'Kveik at 32 °C',
    description: 'Faster and fruitier.',
    ...body,
  });
}

/**
 * A source recipe of `owner`, forked by a fresh member who saves one change and proposes it back.
 * Returns the ids a test needs and the proposer's client.
 */
export async function proposalTo(
  owner: TestClient,
  opts: { document?: RecipeDocumentInput; proposal?: Record<string, unknown> } = {},
) {
  const source = await createRecipeVia(owner, { document: opts.document ?? paleAle() });
  const proposer = await signedInClient();
  const fork = await forkVia(proposer.client, source.version.id);
  const saved = await saveVia(
    proposer.client,
    fork.recipe.id,
    fork.version.id,
    kveikChange(opts.document),
    'Kveik instead',
  );
  if (saved.status !== 201) throw new Error(`save failed: ${saved.status} ${JSON.stringify(saved.body)}`);
  const proposal = await proposeVia(proposer.client, saved.body.version.id, opts.proposal);
  if (proposal.status !== 201) throw new Error(`propose failed: ${proposal.status} ${JSON.stringify(proposal.body)}`);
  return { id: proposal.body.id, source, fork, proposedVersion: saved.body.version, proposer };
}

/** `proposer` forks a fresh member's recipe, saves a change and proposes it. */
export async function proposalFrom(proposer: TestClient) {
  const other = await signedInClient();
  const source = await createRecipeVia(other.client);
  const fork = await forkVia(proposer, source.version.id);
  const saved = await saveVia(proposer, fork.recipe.id, fork.version.id, kveikChange(), 'Kveik instead');
  const proposal = await proposeVia(proposer, saved.body.version.id);
  if (proposal.status !== 201) throw new Error(`propose failed: ${proposal.status} ${JSON.stringify(proposal.body)}`);
  return { id: proposal.body.id, source, fork, proposedVersion: saved.body.version, owner: other };
}
