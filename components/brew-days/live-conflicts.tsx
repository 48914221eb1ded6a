'use client';

import { shownValue } from '@/components/brew-days/live-field';
import { LIVE_FIELD_LABELS, type LiveConflict, type LiveStep } from '@/lib/brew-days/live-steps';
import type { OutboxItem } from '@/lib/brew-days/outbox';
import type { UnitSystem } from '@/lib/brewing/units';

function when(iso: string | null): string {
  if (!iso) return '';
  return new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
}

function byline(by: string | null, at: string | null): string {
  if (!at) return 'from the brew-day form';
  return `${by ? `by ${by} ` : ''}at ${when(at)}`;
}

/**
 * Every open conflict of the brew day, on every device signed in to it: both values, who entered
 * each and when, and a choice. Whichever device chooses first settles it for all of them.
 */
export function LiveConflicts({
  conflicts,
  items,
  steps,
  units,
  onChoose,
}: {
  conflicts: LiveConflict[];
  items: OutboxItem[];
  steps: LiveStep[];
  units: UnitSystem;
  onChoose: (conflict: LiveConflict, keep: 'entered' | 'saved') => void;
}) {
  if (conflicts.length === 0) return null;
  return (
    <section aria-labelledby="conflicts-title" className="mt-4 space-y-2" data-testid="conflicts">
      <h2 id="conflicts-title" className="font-sans font-semibold text-danger">
        {conflicts.length === 1 ? 'Two values need your choice' : `${conflicts.length} need your choice`}
      </h2>
      {conflicts.map((c) => {
        const here = items.some((i) => i.idempotencyKey === c.enteredKey);
        const chosen = items.find(
          (i) => i.state === 'waiting' && i.request.kind === 'resolve' && i.request.conflictId === c.id,
        );
        const show = (v: (typeof c)['entered']) =>
          c.kind === 'step' ? (v ? 'done' : 'not done') : shownValue(c.field, v as never, units);
        const what =
          c.kind === 'step'
            ? `“${steps.find((s) => s.id === c.stepId)?.title ?? c.stepId}”`
            : LIVE_FIELD_LABELS[c.field];
        const entered = show(c.entered);
        const saved = show(c.saved);
        return (
          <div
            key={c.id}
            role="group"
            aria-label={`${what}: two values`}
            className="rounded-lg border-2 border-caution bg-caution/10 p-3 font-sans"
            data-testid={`conflict-${c.kind === 'step' ? c.stepId : c.field}`}
          >
            <p className="font-semibold">
              {c.kind === 'step' ? `${what}: done or not done?` : `Two values for ${what}: which is right?`}
            </p>
            <p className="mt-1">
              Saved: <span className="kf-data font-semibold">{saved}</span>{' '}
              <span className="text-muted">{byline(c.savedBy, c.savedAt)}</span>
            </p>
            <p>
              Also entered: <span className="kf-data font-semibold">{entered}</span>{' '}
              <span className="text-muted">
                {byline(c.enteredBy, c.enteredAt)}
                {here ? ' on this device' : ' on another device'}
              </span>
            </p>
            {chosen ? (
              <p className="mt-2 text-caution">Your choice waits to be sent.</p>
            ) : (
              <div className="mt-2 grid grid-cols-1 gap-2 sm:grid-cols-2">
                <button type="button" className="kf-btn min-h-12" onClick={() => onChoose(c, 'saved')}>
                  Keep {saved}
                </button>
                <button type="button" className="kf-btn min-h-12" onClick={() => onChoose(c, 'entered')}>
                  Keep {entered}
                </button>
              </div>
            )}
          </div>
        );
      })}
    </section>
  );
}
