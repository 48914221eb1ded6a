import { format, parseISO } from 'date-fns';
import Link from 'next/link';
import type { BrewDaySummary } from '@/lib/brew-days/brew-days';

/** Brew days as a list: date, brewer, version brewed, measured gravities, rating and photo thumbnails. */
/** `recipe`: on a recipe's page (names the brewer); `brewer`: on a brewer's list (names the recipe). */
export function BrewDayList({ days, show }: { days: BrewDaySummary[]; show: 'recipe' | 'brewer' }) {
  return (
    <ul className="mt-3 space-y-3">
      {days.map((d) => (
        <li key={d.id} className="kf-card flex flex-wrap items-start justify-between gap-3">
          <div className="min-w-0">
            <Link href={`/brew-days/${d.id}`} className="font-semibold">
              {show === 'recipe' ? `${d.brewerName}’s brew` : d.recipeTitle} on{' '}
              {format(parseISO(d.brewedOn), 'd MMM yyyy')}
            </Link>
            <p className="font-sans text-sm text-muted">
              Version {d.versionNumber} brewed
              {d.og !== null && <> · OG {d.og.toFixed(3)}</>}
              {d.fg !== null && <> · FG {d.fg.toFixed(3)}</>}
              {d.averageRating !== null && (
                <>
                  {' '}
                  · rated {d.averageRating.toFixed(1)} of 5 ({d.tastingCount}{' '}
                  {d.tastingCount === 1 ? 'tasting' : 'tastings'})
                </>
              )}
            </p>
          </div>
          {d.photoIds.length > 0 && (
            <div className="flex gap-2">
              {d.photoIds.map((id, i) => (
                // eslint-disable-next-line @next/next/no-img-element -- served by our own access-checked route
                <img
                  key={id}
                  src={`/api/photos/${id}/thumb`}
                  alt={`Photo ${i + 1} of this brew day`}
                  className="h-14 w-14 rounded object-cover"
                  loading="lazy"
                />
              ))}
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
