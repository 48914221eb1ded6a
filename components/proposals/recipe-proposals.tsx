import Link from 'next/link';
import { SignedInOnly } from '@/components/viewer-gate';
import type { RecipeProposalsSection } from '@/lib/recipes/pages';
import { ProposalList } from './proposal-list';
import { ProposeForm } from './propose-form';

/**
 * The recipe page's section: changes offered to this recipe by its forks, and (on a fork) the ones
 * it offered upstream, with "Propose to the original" for the fork's owner.
 */
export function RecipeProposals({
  version,
  proposals: { items, targets },
}: {
  version: { id: string; number: number };
  proposals: RecipeProposalsSection;
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
      <SignedInOnly>
        <p className="mt-3 font-sans text-sm">
          <Link href="/proposals">All your proposals</Link>
        </p>
      </SignedInOnly>
    </section>
  );
}
