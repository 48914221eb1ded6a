import { addDays, parseISO } from 'date-fns';
import { createEvents, type DateArray, type EventAttributes } from 'ics';
import type { BrewPlan } from './schedule';

function dayArray(iso: string, plusDays = 0): DateArray {
  const d = addDays(parseISO(iso), plusDays);
  return [d.getFullYear(), d.getMonth() + 1, d.getDate()];
}

/**
 * The plan as an iCalendar file (RFC 5545), one all-day event per step, so it lands in a phone's
 * calendar. `uidBase` keeps the events' ids stable across exports of the same plan.
 */
export function planToIcs(plan: BrewPlan, input: { title: string; url: string; uidBase: string }): string {
  const events: EventAttributes[] = plan.events.map((e, i) => ({
    uid: `${input.uidBase}-${i}-${e.kind}@kettlefork`,
    title: `${e.title}: ${input.title}`,
    description: [e.detail, e.source ? `Length: ${e.source}.` : null, e.caution].filter(Boolean).join('\n'),
    start: dayArray(e.startOn),
    // All-day events end on the day after their last day (RFC 5545 §3.6.1).
    end: dayArray(e.endOn, 1),
    url: input.url,
    transp: 'TRANSPARENT',
    busyStatus: 'FREE',
    ...(e.kind === 'brew' || e.kind === 'package' || e.kind === 'dry_hop' || e.kind === 'spunding'
      ? { alarms: [{ action: 'display' as const, description: e.title, trigger: { hours: 12, before: true } }] }
      : {}),
  }));
  const { error, value } = createEvents(events, { productId: 'kettlefork/brew-plan', calName: input.title });
  if (error || !value) throw error ?? new Error('Calendar could not be written');
  return value;
}
