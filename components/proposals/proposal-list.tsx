import { formatDistanceToNow } from 'date-fns';
import Link from 'next/link';
import type { ProposalSummary } from '@/lib/proposals/proposals';
import { ProposalStatusBadge } from './proposal-status';

/** Proposals as a list: title, state, who offered which fork to which recipe, and when. */
export function ProposalList({ items, empty }: { items: ProposalSummary[]; empty: string }) {
  if (items.length === 0) return <p className="mt-2 font-sans text-sm text-muted">{empty}</p>;
  return (
    <ul className="mt-3 space-y-3">
      {items.map((p) => (
        <li key={p.id} className="kf-card">
          <div className="flex flex-wrap items-center gap-2">
            <Link href={`/proposals/${p.id}`} className="font-semibold">
              {p.title}
            </Link>
            <ProposalStatusBadge status={p.status} />
            {p.hidden && <span className="font-sans text-xs text-danger">Hidden by moderators</span>}
          </div>
          <p className="mt-1 font-sans text-sm text-muted">
            {p.proposerName} offers <Link href={`/recipes/${p.fork.slug}`}>{p.fork.title}</Link> to{' '}
            <Link href={`/recipes/${p.source.slug}`}>{p.source.title}</Link> · updated{' '}
            {formatDistanceToNow(p.updatedAt, { addSuffix: true })}
          </p>
        </li>
      ))}
    </ul>
  );
}
