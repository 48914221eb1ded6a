import type { ProposalStatus } from '@/db/schema';

const WORDS: Record<ProposalStatus, string> = {
  open: 'Open',
  accepted: 'Accepted',
  declined: 'Declined',
  changes_requested: 'Changes asked for',
  withdrawn: 'Withdrawn',
};

const STYLE: Record<ProposalStatus, string> = {
  open: 'border-copper text-copper-strong',
  accepted: 'border-bine text-bine',
  declined: 'border-danger text-danger',
  changes_requested: 'border-caution text-ink',
  withdrawn: 'border-line text-muted',
};

/** A proposal's state as a small labelled badge. */
export function ProposalStatusBadge({ status }: { status: ProposalStatus }) {
  return (
    <span className={`inline-block rounded-full border px-2 py-0.5 font-sans text-xs font-semibold ${STYLE[status]}`}>
      {WORDS[status]}
    </span>
  );
}
