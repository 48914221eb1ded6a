import Link from 'next/link';
import type { BrewDaySummary } from '@/lib/brew-days/brew-days';
import { BrewDayList } from './brew-day-list';

/** A member page's section: their brew days of recipes the viewer can see (`own`: the member is reading). */
export function MemberBrewDays({ own, days }: { own: boolean; days: BrewDaySummary[] }) {
  return (
    <section aria-labelledby="member-brew-days-title">
      <h2 id="member-brew-days-title" className="mt-8 text-xl font-semibold">
        Brew days
      </h2>
      {own && (
        <p className="mt-1 font-sans text-sm">
          <Link href="/brew-days">Your brew days and your measured efficiency and attenuation</Link>
        </p>
      )}
      {days.length === 0 ? (
        <p className="mt-2 text-muted">No brew days logged yet.</p>
      ) : (
        <BrewDayList days={days} show="brewer" />
      )}
    </section>
  );
}
