import Link from 'next/link';
import type { Recipe } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { getProposalsByRecipeId, getProposalTargets } from '@/lib/proposals/proposals';
import { isOwner } from '@/lib/recipes/access';
import { ProposalList } from './proposal-list';
import { ProposeForm } from './propose-form';

/**
 * The recipe page's section: changes offered to this recipe by its forks, and (on a fork) the ones
 * it offered upstream, with "Propose to the original" for the fork's owner.
 */
/** The section's data; `any` says whether the recipe has proposals at all, so an empty list is not queried. */
export async function loadRecipeProposals(viewer: Viewer | null, recipe: Recipe, any: boolean) {
  const owner = isOwner(recipe, viewer);
  const [items, targets] = await Promise.all([
    any ? getProposalsByRecipeId({ viewer, recipeId: recipe.id }) : Promise.resolve([]),
    owner && recipe.forkedFromVersionId && !recipe.hiddenAt
      ? getProposalTargets(viewer, recipe.id)
      : Promise.resolve([]),
  ]);
  return { items, targets };
}

export function RecipeProposals({
  viewer,
  version,
  proposals: { items, targets },
}: {
  viewer: Viewer | null;
  version: { id: string; number: number };
  proposals: Awaited<ReturnType<typeof loadRecipeProposals>>;
}) {
  if (items.length === 0 && targets.length === 0) return null;
  const openCount = items.filter((p) => p.status === 'open' || p.status === 'changes_requested').length;
  const incoming = items.filter((p) => p.direction === 'incoming');
  const outgoing = items.filter((p) => p.direction === 'outgoing');
  return (
    <section aria-labelledby="proposals-title" className="mt-10">
      <h2 id="proposals-title" className="text-xl font-semibold">
        Proposals ({openCount} open)
      </h2>
      {targets.length > 0 && (
        <div className="mt-3">
          <ProposeForm
            versionId={version.id}
            number={version.number}
            targets={targets.map((t) => ({ recipeId: t.recipeId, title: t.title, ownerName: t.ownerName }))}
          />
        </div>
      )}
      {incoming.length > 0 && (
        <>
          <h3 className="mt-4 font-semibold">Offered to this recipe</h3>
          <ProposalList items={incoming} empty="" />
        </>
      )}
      {outgoing.length > 0 && (
        <>
          <h3 className="mt-4 font-semibold">Offered from this fork</h3>
          <ProposalList items={outgoing} empty="" />
        </>
      )}
      {viewer && (
        <p className="mt-3 font-sans text-sm">
          <Link href="/proposals">All your proposals</Link>
        </p>
      )}
    </section>
  );
}
