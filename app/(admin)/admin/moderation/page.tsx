import { format } from 'date-fns';
import type { Metadata } from 'next';
import Link from 'next/link';
import { Markdown } from '@/components/markdown';
import { hasRole } from '@/lib/auth/roles';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { listHeldComments, listOpenReports, type QueueItem } from '@/lib/moderation/reports';
import { REASON_LABELS, TARGET_LABELS } from '@/lib/moderation/words';
import { HeldCommentActions } from './_components/held-comment-actions';
import { ReportActions } from './_components/report-actions';
import { canSuspend } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Moderation queue' };

function Context({ item }: { item: QueueItem }) {
  return (
    <div className="mt-3 rounded-md border border-line bg-paper p-3">
      {item.recipe && (
        <p className="font-sans text-sm">
          {item.targetType === 'comment' || item.targetType === 'photo' ? 'On the recipe ' : 'Recipe '}
          <Link href={`/recipes/${item.recipe.slug}`}>{item.recipe.title}</Link>
          {item.recipe.hidden && (
            <span className="ml-2 text-danger">
              hidden{item.recipe.hiddenReason ? `: ${item.recipe.hiddenReason}` : ''}
            </span>
          )}
        </p>
      )}
      {item.comment && (
        <>
          <p className="mt-2 font-sans text-xs uppercase tracking-wide text-muted">
            The comment ({item.comment.state})
          </p>
          <Markdown source={item.comment.body || '(deleted by its author)'} />
        </>
      )}
      {item.recipe && (item.targetType === 'recipe' || item.targetType === 'version') && item.recipe.notes && (
        <>
          <p className="mt-2 font-sans text-xs uppercase tracking-wide text-muted">Recipe notes</p>
          <Markdown source={item.recipe.notes} />
        </>
      )}
      {item.targetType === 'member' && (
        <>
          <p className="mt-2 font-sans text-xs uppercase tracking-wide text-muted">Their bio</p>
          {item.bio ? <Markdown source={item.bio} /> : <p className="text-muted">(no bio)</p>}
        </>
      )}
      {item.targetType === 'photo' && (
        <p className="font-sans text-sm text-muted">Photo {item.targetId} on a brew day of this recipe.</p>
      )}
      {item.targetType === 'proposal' && (
        <p className="font-sans text-sm">
          <Link href={`/proposals/${item.targetId}`}>Read the reported proposal</Link> to this recipe.
        </p>
      )}
    </div>
  );
}

export default async function ModerationPage() {
  const viewer = await requirePageViewer('/admin/moderation', 'moderator');
  const [items, held] = await Promise.all([listOpenReports(), listHeldComments()]);
  return (
    <div className="max-w-4xl">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-semibold">Moderation queue</h1>
          <p className="mt-1 font-sans text-sm text-muted">
            Open reports, oldest first, and comments held for review. Every action is written to the moderation log.
          </p>
        </div>
        {hasRole(viewer, 'admin') && (
          <Link href="/admin/moderation/log" className="kf-btn-quiet font-sans text-sm">
            Moderation log
          </Link>
        )}
      </div>

      <section aria-labelledby="reports-heading">
        <h2 id="reports-heading" className="mt-8 text-2xl font-semibold">
          Reports ({items.length})
        </h2>
        {items.length === 0 && <p className="kf-card mt-3">No open reports. All clear.</p>}
        <ul className="mt-3 space-y-6">
          {items.map((item) => (
            <li key={`${item.targetType}-${item.targetId}`} className="kf-card" data-testid="report-item">
              <h3 className="text-lg font-semibold">
                {item.reports.length} {item.reports.length === 1 ? 'report' : 'reports'} on a{' '}
                {TARGET_LABELS[item.targetType]}
                {item.owner && (
                  <span className="font-sans text-sm font-normal text-muted">
                    {' '}
                    by <Link href={`/members/${item.owner.handle}`}>{item.owner.name}</Link> (@{item.owner.handle},{' '}
                    {item.owner.role}
                    {item.owner.suspended ? ', suspended' : ''})
                  </span>
                )}
              </h3>
              <Context item={item} />
              <ul className="mt-3 space-y-2 font-sans text-sm">
                {item.reports.map((r) => (
                  <li key={r.id}>
                    <strong>{REASON_LABELS[r.reason]}</strong> — reported by {r.reporterName} on{' '}
                    {format(r.createdAt, 'd MMM yyyy, HH:mm')}
                    {r.note && <p className="mt-1 whitespace-pre-wrap text-muted">“{r.note}”</p>}
                  </li>
                ))}
              </ul>
              <ReportActions
                reportId={item.reports[0].id}
                targetType={item.targetType}
                canSuspend={Boolean(item.owner && !item.owner.suspended && canSuspend(viewer, item.owner))}
              />
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="held-heading">
        <h2 id="held-heading" className="mt-10 text-2xl font-semibold">
          Comments held for review ({held.length})
        </h2>
        <p className="mt-1 font-sans text-sm text-muted">
          A new member’s comments with links wait here until a moderator publishes them.
        </p>
        {held.length === 0 && <p className="kf-card mt-3">Nothing is waiting.</p>}
        <ul className="mt-3 space-y-4">
          {held.map((c) => (
            <li key={c.id} className="kf-card">
              <p className="font-sans text-sm text-muted">
                <Link href={`/members/${c.author.handle}`}>{c.author.name}</Link> (joined{' '}
                {format(c.author.joinedAt, 'd MMM yyyy')}) on{' '}
                <Link href={`/recipes/${c.recipe.slug}`}>{c.recipe.title}</Link>,{' '}
                {format(c.createdAt, 'd MMM yyyy, HH:mm')}
              </p>
              <Markdown source={c.body} className="mt-2" />
              <HeldCommentActions commentId={c.id} />
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
