import Link from 'next/link';
import type { getBrewDaysByRecipeId } from '@/lib/brew-days/brew-days';
import { SignedInOnly } from '@/components/viewer-gate';
import { BrewDayList } from './brew-day-list';

/** The recipe page's section: how it came out for everyone who brewed it, across all versions. */
export function RecipeBrewDays({
  days,
  brewHref,
}: {
  days: Awaited<ReturnType<typeof getBrewDaysByRecipeId>>;
  /** Where a signed-in reader logs a brew of this version (null while moderators hide the recipe). */
  brewHref: string | null;
}) {
  return (
    <section aria-labelledby="brew-days-title" className="mt-10">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="brew-days-title" className="text-xl font-semibold">
          Brew days ({days.length})
        </h2>
        {brewHref && (
          <SignedInOnly>
            <Link href={brewHref} className="kf-btn-quiet font-sans text-sm">
              Log a brew day
            </Link>
          </SignedInOnly>
        )}
      </div>
      {days.length === 0 ? (
        <p className="mt-2 font-sans text-sm text-muted">Nobody has logged a brew of this recipe yet.</p>
      ) : (
        <BrewDayList days={days} show="recipe" />
      )}
    </section>
  );
}
