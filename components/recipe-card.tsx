import Link from 'next/link';
import { formatDistanceToNow } from 'date-fns';
import type { RecipeCard as Card } from '@/lib/recipes/listing';
import { statsLine } from '@/lib/format';
import { SrmSwatch } from './srm-swatch';

const VISIBILITY_BADGE = { public: null, unlisted: 'unlisted', private: 'private' } as const;

export function RecipeCard({ card }: { card: Card }) {
  const badge = VISIBILITY_BADGE[card.visibility];
  return (
    <li className="kf-card flex gap-4">
      <SrmSwatch srm={card.srm} size="lg" />
      <div className="min-w-0 flex-1">
        <h3 className="text-lg font-semibold leading-snug">
          <Link href={`/recipes/${card.slug}`}>{card.title}</Link>
          {badge && <span className="ml-2 rounded bg-line px-1.5 py-0.5 font-sans text-xs font-normal">{badge}</span>}
          {card.hidden && (
            <span className="ml-2 rounded bg-danger/10 px-1.5 py-0.5 font-sans text-xs font-normal text-danger">
              hidden by moderators
            </span>
          )}
        </h3>
        <p className="font-sans text-sm text-muted">
          by <Link href={`/members/${card.ownerHandle}`}>{card.ownerName}</Link>
          {card.styleName && <> · {card.styleName}</>} · updated{' '}
          {formatDistanceToNow(card.updatedAt, { addSuffix: true })}
        </p>
        <p className="kf-data mt-1 text-sm">{statsLine(card)}</p>
        <p className="mt-1 font-sans text-xs text-muted">
          {card.headNumber} version{card.headNumber === 1 ? '' : 's'} · {card.forkCount} fork
          {card.forkCount === 1 ? '' : 's'} · {card.starCount} star
          {card.starCount === 1 ? '' : 's'}
        </p>
      </div>
    </li>
  );
}
