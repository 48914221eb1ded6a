import type { Metadata } from 'next';
import { ProposalList } from '@/components/proposals/proposal-list';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getProposalsByMember } from '@/lib/proposals/proposals';

export const metadata: Metadata = { title: 'Proposals' };

export default async function ProposalsPage() {
  const viewer = await requirePageViewer('/proposals');
  const { incoming, outgoing } = await getProposalsByMember(viewer);
  return (
    <div className="max-w-3xl">
      <h1 className="text-3xl font-semibold">Proposals</h1>
      <p className="mt-1 font-sans text-sm text-muted">
        Changes brewers offered back to your recipes from their forks, and the ones you offered to others.
      </p>
      <section aria-labelledby="incoming-title" className="mt-8">
        <h2 id="incoming-title" className="text-xl font-semibold">
          To your recipes ({incoming.length})
        </h2>
        <ProposalList items={incoming} empty="Nobody has proposed a change to your recipes yet." />
      </section>
      <section aria-labelledby="outgoing-title" className="mt-8">
        <h2 id="outgoing-title" className="text-xl font-semibold">
          Yours to others ({outgoing.length})
        </h2>
        <ProposalList
          items={outgoing}
          empty="You have not proposed anything yet. Fork a recipe, improve it, then use “Propose to the original” on your fork’s page."
        />
      </section>
    </div>
  );
}
