import { format } from 'date-fns';
import type { Metadata } from 'next';
import Link from 'next/link';
import { BrewDayList } from '@/components/brew-days/brew-day-list';
import { ReportButton } from '@/components/community/report-button';
import { CompareView } from '@/components/compare-view';
import { Markdown } from '@/components/markdown';
import {
  AcceptForm,
  DecisionForm,
  ProposalCommentForm,
  ProposerActions,
} from '@/components/proposals/proposal-actions';
import { ProposalStatusBadge } from '@/components/proposals/proposal-status';
import { getViewer } from '@/lib/auth/session';
import { isLive } from '@/lib/proposals/access';
import { getProposalView } from '@/lib/proposals/proposals';
import { effectSentence } from '@/lib/recipes/attribution';
import { orNotFound } from '@/lib/recipes/pages';

export const metadata: Metadata = { title: 'Proposal' };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ all?: string }> };

export default async function ProposalPage({ params, searchParams }: Props) {
  const { id } = await params;
  const { all } = await searchParams;
  const viewer = await getViewer();
  const view = await orNotFound(() => getProposalView(viewer, id));
  const { proposal, proposer, source, fork, proposed, base } = view;
  const live = isLive(proposal);
  return (
    <article>
      {proposal.hidden && (
        <p
          role="status"
          className="mb-6 rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger"
        >
          Moderators hid this proposal{proposal.hiddenReason ? `: ${proposal.hiddenReason}` : '.'} Only its author and
          the moderators can see it.
        </p>
      )}
      <header>
        <p className="font-sans text-sm text-muted">
          Proposal to <Link href={`/recipes/${source.slug}`}>{source.title}</Link> by {source.ownerName}
        </p>
        <div className="mt-1 flex flex-wrap items-center gap-3">
          <h1 className="text-3xl font-semibold">{proposal.title}</h1>
          <ProposalStatusBadge status={proposal.status} />
        </div>
        <p className="mt-2 font-sans text-sm text-muted">
          <Link href={`/members/${proposer.handle}`}>{proposer.name}</Link> offers{' '}
          {proposed ? (
            <Link href={`/recipes/${fork.slug}/v/${proposed.number}`}>
              version {proposed.number} of {fork.title}
            </Link>
          ) : (
            'a version of a fork you cannot see now'
          )}
          , forked from version {base.number} · opened {format(proposal.createdAt, 'd MMM yyyy')}
        </p>
        {view.can.report && (
          <div className="mt-2">
            <ReportButton targetType="proposal" targetId={proposal.id} />
          </div>
        )}
      </header>

      {proposal.description && <Markdown source={proposal.description} className="mt-6 max-w-3xl" />}

      {proposal.status === 'accepted' && view.accepted && (
        <p role="status" className="mt-6 rounded-md border border-bine/40 bg-bine/10 p-3 font-sans text-sm">
          Accepted as{' '}
          <Link href={`/recipes/${source.slug}/v/${view.accepted.number}`}>
            version {view.accepted.number} of {source.title}
          </Link>
          , crediting {proposer.name}. <Link href={`/recipes/${source.slug}/history`}>See the history</Link>
        </p>
      )}
      {(proposal.status === 'declined' || proposal.status === 'changes_requested') && (
        <div role="status" className="mt-6 rounded-md border border-caution/40 bg-caution/5 p-3 font-sans text-sm">
          <p className="font-semibold">
            {proposal.status === 'declined'
              ? `${source.ownerName} declined this proposal`
              : `${source.ownerName} asked for changes`}
          </p>
          {proposal.decisionComment && <Markdown source={proposal.decisionComment} className="mt-1" />}
        </div>
      )}
      {proposal.status === 'withdrawn' && (
        <p className="mt-6 font-sans text-sm text-muted">{proposer.name} withdrew this proposal.</p>
      )}
      {view.blocked && (
        <p
          role="alert"
          className="mt-6 rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger"
        >
          {view.blocked}
        </p>
      )}

      {view.headMoved && proposed && (proposal.status === 'open' || proposal.status === 'changes_requested') && (
        <section aria-labelledby="three-way-title" className="mt-8 kf-card">
          <h2 id="three-way-title" className="text-xl font-semibold">
            {source.title} has moved on since the fork
          </h2>
          <p className="mt-1 font-sans text-sm">
            The fork came from version {base.number}; the recipe is now at version {source.headNumber}. Fields changed
            on only one side merge by themselves
            {view.fromTheirs.length ? ` (${view.fromTheirs.length} from the proposal)` : ''};{' '}
            {view.conflicts.length === 0
              ? 'no field was changed on both sides.'
              : `${view.conflicts.length} ${view.conflicts.length === 1 ? 'field was' : 'fields were'} changed on both sides and need a choice when accepting.`}
          </p>
          {view.conflicts.length > 0 && (
            <div className="mt-3 overflow-x-auto">
              <table className="kf-data w-full border-collapse font-sans text-sm">
                <thead>
                  <tr className="border-b border-line text-left text-muted">
                    <th scope="col" className="py-1.5 pr-3">
                      Field
                    </th>
                    <th scope="col" className="py-1.5 pr-3">
                      When forked (v{base.number})
                    </th>
                    <th scope="col" className="py-1.5 pr-3">
                      Now (v{source.headNumber})
                    </th>
                    <th scope="col" className="py-1.5">
                      Proposed
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {view.conflictViews.map((c) => (
                    <tr key={c.path} className="border-b border-line/50 align-top">
                      <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                        {c.label}
                      </th>
                      {[c.base, c.ours, c.theirs].map((v, i) => (
                        <td key={i} className="max-w-xs whitespace-pre-wrap py-1.5 pr-3">
                          {v}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          {view.fromTheirs.length > 0 && (
            <p className="mt-3 font-sans text-sm text-muted">
              From the proposal without asking: {view.fromTheirsWords.join('; ')}.
            </p>
          )}
        </section>
      )}

      {(view.can.accept || view.can.decide || view.can.update) && (
        <section aria-label="Decide on this proposal" className="mt-8 grid gap-4 lg:grid-cols-2">
          {view.can.accept && (
            <AcceptForm
              proposalId={proposal.id}
              headVersionId={source.headVersionId}
              headNumber={source.headNumber}
              conflicts={view.conflictViews}
            />
          )}
          {view.can.decide && <DecisionForm proposalId={proposal.id} />}
          {view.can.update && <ProposerActions proposalId={proposal.id} newerVersions={view.newerVersions} />}
        </section>
      )}

      {view.comparison && proposed && (
        <section aria-labelledby="compare-title" className="mt-10">
          <h2 id="compare-title" className="text-2xl font-semibold">
            {view.compareFrom.id === source.headVersionId ? 'What changes' : 'What it changed'}: version{' '}
            {view.compareFrom.number} of {source.title} → the proposal
          </h2>
          <div className="mt-4">
            <CompareView
              a={{
                title: source.title,
                slug: source.slug,
                number: view.compareFrom.number,
                ownerName: source.ownerName,
              }}
              b={{ title: fork.title, slug: fork.slug, number: proposed.number, ownerName: fork.ownerName }}
              comparison={view.comparison}
              showUnchanged={all === '1'}
              effects={view.comparison.attribution.map((a) =>
                effectSentence(a, live ? 'Accepting this changes' : 'This proposal changed', view.comparison!.units),
              )}
            />
          </div>
          {all !== '1' && (
            <p className="mt-4 font-sans text-sm">
              <Link href={`/proposals/${proposal.id}?all=1`}>Show unchanged ingredients too</Link>
            </p>
          )}
        </section>
      )}

      {proposed && (
        <section aria-labelledby="proposal-brews-title" className="mt-10">
          <h2 id="proposal-brews-title" className="text-xl font-semibold">
            Brews of the proposed version ({view.brewDays.length})
          </h2>
          {view.brewDays.length === 0 ? (
            <p className="mt-2 font-sans text-sm text-muted">
              Nobody has logged a brew of version {proposed.number} of {fork.title} yet.
            </p>
          ) : (
            <BrewDayList days={view.brewDays} show="recipe" />
          )}
        </section>
      )}

      <section aria-labelledby="discussion-title" className="mt-10 max-w-3xl">
        <h2 id="discussion-title" className="text-xl font-semibold">
          Discussion ({view.comments.length})
        </h2>
        {view.comments.length === 0 && <p className="mt-2 font-sans text-sm text-muted">No comments yet.</p>}
        <ol className="mt-3 space-y-3">
          {view.comments.map((c) => (
            <li key={c.id} id={`comment-${c.id}`} className="kf-card">
              <p className="font-sans text-sm text-muted">
                <Link href={`/members/${c.authorHandle}`}>{c.authorName}</Link> ·{' '}
                {format(c.createdAt, 'd MMM yyyy, HH:mm')}
              </p>
              <Markdown source={c.body} className="mt-1" />
            </li>
          ))}
        </ol>
        {view.can.comment ? (
          <ProposalCommentForm proposalId={proposal.id} />
        ) : (
          <p className="mt-3 font-sans text-sm">
            <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/proposals/${proposal.id}`)}`}>Sign in</Link> to
            join the discussion.
          </p>
        )}
      </section>
    </article>
  );
}
