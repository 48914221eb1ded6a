'use client';

import Link from 'next/link';
import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { Caution, CAUTIONS } from '@/components/brew-days/caution';
import { LiveConflicts } from '@/components/brew-days/live-conflicts';
import { LiveFieldInput, shownValue } from '@/components/brew-days/live-field';
import { useBrewDayLive } from '@/hooks/use-brew-day-live';
import { elapsedMs, useBrewDayTimers, type Announcement } from '@/hooks/use-brew-day-timers';
import { LIVE_FIELD_LABELS, type LiveCaution, type LiveState, type LiveStep } from '@/lib/brew-days/live-steps';
import type { OutboxItem } from '@/lib/brew-days/outbox';
import type { UnitSystem } from '@/lib/brewing/units';

const CAUTION_TEXT: Record<LiveCaution, string> = {
  hotLiquor: CAUTIONS.hotLiquor,
  boil: CAUTIONS.boil,
  chilling: CAUTIONS.chilling,
  lifting: CAUTIONS.lifting,
  pressure: CAUTIONS.pressureLimits,
};

function clock(ms: number): string {
  const total = Math.max(0, Math.ceil(ms / 1000));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const mm = String(m).padStart(h ? 2 : 1, '0');
  return `${h ? `${h}:` : ''}${mm}:${String(s).padStart(2, '0')}`;
}

const noSubscribe = () => () => undefined;

/** Three short beeps through Web Audio, and a buzz where the phone can. */
function alert(audio: AudioContext | null): void {
  navigator.vibrate?.([300, 150, 300, 150, 300]);
  if (!audio) return;
  const t0 = audio.currentTime;
  for (let i = 0; i < 3; i += 1) {
    const osc = audio.createOscillator();
    const gain = audio.createGain();
    const at = t0 + i * 0.3;
    osc.frequency.value = 880;
    gain.gain.setValueAtTime(0.0001, at);
    gain.gain.exponentialRampToValueAtTime(0.4, at + 0.02);
    gain.gain.exponentialRampToValueAtTime(0.0001, at + 0.2);
    osc.connect(gain).connect(audio.destination);
    osc.start(at);
    osc.stop(at + 0.22);
  }
}

type WakeState = 'asking' | 'on' | 'off' | 'refused';

/** Keeps the screen on while brew-day mode is open, asking again whenever the page comes back into view. */
function useWakeLock(): { supported: boolean; state: WakeState } {
  const supported = useSyncExternalStore(
    noSubscribe,
    () => 'wakeLock' in navigator,
    () => true,
  );
  const [state, setState] = useState<WakeState>('asking');
  useEffect(() => {
    if (!('wakeLock' in navigator)) return;
    let lock: WakeLockSentinel | null = null;
    let stopped = false;
    const acquire = () => {
      if (document.visibilityState !== 'visible' || (lock && !lock.released)) return;
      navigator.wakeLock.request('screen').then(
        (sentinel) => {
          if (stopped) return void sentinel.release();
          lock = sentinel;
          setState('on');
          sentinel.addEventListener('release', () => {
            if (!stopped) setState('off');
          });
        },
        () => setState('refused'),
      );
    };
    acquire();
    document.addEventListener('visibilitychange', acquire);
    return () => {
      stopped = true;
      document.removeEventListener('visibilitychange', acquire);
      void lock?.release();
    };
  }, []);
  return { supported, state };
}

/** Registers the brew-day service worker and hands it what this visit loaded, so the page opens offline. */
function useOfflineCopy(brewDayId: string): 'ready' | 'unavailable' | 'pending' {
  const [state, setState] = useState<'ready' | 'unavailable' | 'pending'>('pending');
  useEffect(() => {
    if (!('serviceWorker' in navigator)) return;
    let stopped = false;
    // Already controlled (a later visit, perhaps offline): the browser checks for a newer worker itself.
    const registered = navigator.serviceWorker.controller
      ? navigator.serviceWorker.ready
      : navigator.serviceWorker
          .register('/brew-day-sw.js', { scope: '/brew-days/' })
          .then(() => navigator.serviceWorker.ready);
    registered
      .then((registration) => {
        const built = performance
          .getEntriesByType('resource')
          .map((e) => e.name)
          .filter((name) => new URL(name).pathname.startsWith('/_next/static/'));
        const worker = registration.active;
        if (!worker) throw new Error('no active worker');
        return new Promise<void>((resolve) => {
          const channel = new MessageChannel();
          channel.port1.onmessage = () => resolve();
          worker.postMessage(
            { type: 'keep', urls: [location.pathname, `/api/brew-days/${brewDayId}/live`, ...built] },
            [channel.port2],
          );
        });
      })
      .then(() => {
        if (!stopped) setState('ready');
      })
      .catch(() => {
        if (!stopped) setState('unavailable');
      });
    return () => {
      stopped = true;
    };
  }, [brewDayId]);
  return state;
}

function describeItem(item: OutboxItem, steps: LiveStep[], units: UnitSystem): string {
  const r = item.request;
  if (r.kind === 'field') return `${LIVE_FIELD_LABELS[r.field]} ${shownValue(r.field, r.value, units)}`;
  if (r.kind === 'resolve')
    return `Your choice between two values: keep the ${r.keep === 'saved' ? 'saved' : 'other'} one`;
  const title = steps.find((s) => s.id === r.stepId)?.title ?? r.stepId;
  return `${r.checked ? 'Done' : 'Not done'}: ${title}`;
}

/**
 * Brew-day mode: the version's steps as a checklist with live timers, hop additions called at their
 * minute, readings entered where they are taken, and everything kept on the phone until saved.
 */
export function LiveBrewDay({
  brewDayId,
  title,
  versionNumber,
  steps,
  initialState,
  units,
}: {
  brewDayId: string;
  title: string;
  versionNumber: number;
  steps: LiveStep[];
  initialState: LiveState;
  units: UnitSystem;
}) {
  const live = useBrewDayLive(brewDayId, initialState);
  const wake = useWakeLock();
  const offlineCopy = useOfflineCopy(brewDayId);
  const audio = useRef<AudioContext | null>(null);
  const [calls, setCalls] = useState<Announcement[]>([]);
  const onAnnounce = useCallback((due: Announcement[]) => {
    setCalls((shown) => [...shown, ...due]);
    alert(audio.current);
  }, []);
  const timers = useBrewDayTimers(brewDayId, steps, onAnnounce);

  // A step is done as saved, or as the newest tick still waiting to be sent.
  const checked = new Set(Object.keys(live.server.checkedSteps));
  for (const item of live.items)
    if (item.request.kind === 'step' && item.state === 'waiting') {
      if (item.request.checked) checked.add(item.request.stepId);
      else checked.delete(item.request.stepId);
    }
  // A tick shows at once, before IndexedDB has it.
  const [ticking, setTicking] = useState<Record<string, boolean>>({});
  for (const [stepId, done] of Object.entries(ticking)) {
    if (done) checked.add(stepId);
    else checked.delete(stepId);
  }
  const firstOpen = steps.find((s) => !checked.has(s.id))?.id ?? steps[steps.length - 1].id;
  const [chosen, setChosen] = useState<string | null>(null);
  const currentId = chosen ?? firstOpen;
  const current = steps.find((s) => s.id === currentId) ?? steps[0];

  const startTimer = (stepId: string) => {
    // Sound may only start from a tap, so the audio context is made here.
    try {
      audio.current ??= new AudioContext();
      void audio.current.resume();
    } catch {
      audio.current = null;
    }
    timers.start(stepId);
  };

  const tick = async (step: LiveStep, done: boolean) => {
    setTicking((t) => ({ ...t, [step.id]: done }));
    await live.tickStep(step.id, done);
    setTicking((t) => {
      const rest = { ...t };
      delete rest[step.id];
      return rest;
    });
    if (done && step.id === currentId) {
      const next = steps.slice(steps.indexOf(step) + 1).find((s) => !checked.has(s.id));
      setChosen(next?.id ?? null);
    }
  };

  const waiting = live.items.filter((i) => i.state === 'waiting');
  const needsChoice = live.server.conflicts.length + live.items.filter((i) => i.state === 'refused').length;
  const timer = timers.timers[current.id];
  const ran = elapsedMs(timer, timers.now);
  const left = current.timerMin === null ? 0 : current.timerMin * 60_000 - ran;

  return (
    <div className="mx-auto max-w-xl pb-28 font-sans">
      <header className="sticky top-0 z-10 -mx-4 border-b border-line bg-paper/95 px-4 py-2">
        <p className="truncate text-sm">
          <Link href={`/brew-days/${brewDayId}`}>← {title}</Link>{' '}
          <span className="text-muted">· version {versionNumber}</span>
        </p>
        <div role="status" aria-live="polite" className="mt-1 text-sm" data-testid="sync-status">
          {!live.online ? (
            <span className="font-semibold text-caution">
              Offline. {waiting.length ? `${waiting.length} waiting on this phone` : 'Entries wait on this phone'} until
              the connection returns.
            </span>
          ) : waiting.length && live.unreachable ? (
            <span className="font-semibold text-caution">
              Kettlefork cannot be reached. {waiting.length} waiting on this phone; trying again.
            </span>
          ) : waiting.length ? (
            <span className="text-caution">
              {live.sending ? 'Sending' : 'Waiting to send'} {waiting.length}…
            </span>
          ) : (
            <span className="text-bine">Online · everything entered is saved</span>
          )}
          {needsChoice > 0 && <span className="ml-1 font-semibold text-danger">· {needsChoice} need your choice</span>}
        </div>
        <p className="text-xs text-muted">
          {!wake.supported
            ? 'This browser cannot keep the screen on: turn off auto-lock while you brew.'
            : wake.state === 'on'
              ? 'Screen kept on.'
              : wake.state === 'refused'
                ? 'The screen may dim: this browser refused to keep it on.'
                : 'Keeping the screen on when the page is in view.'}
          {offlineCopy === 'ready' && ' Kept for offline use.'}
          {offlineCopy === 'unavailable' && ' No offline copy in this browser.'}
        </p>
        {live.storageError && <p className="text-sm text-danger">{live.storageError}</p>}
      </header>

      {calls.length > 0 && (
        <div role="alert" className="sticky top-24 z-20 mt-3 space-y-2" data-testid="announcements">
          {calls.map((call) => (
            <div key={call.id} className="rounded-lg border-2 border-copper bg-card p-3 shadow">
              <p className="text-xs uppercase text-muted">{call.stepTitle}</p>
              <p className="text-2xl font-semibold">{call.text}</p>
              <button
                type="button"
                className="kf-btn mt-2 min-h-12 w-full text-lg"
                onClick={() => setCalls((shown) => shown.filter((c) => c.id !== call.id))}
              >
                Done
              </button>
            </div>
          ))}
        </div>
      )}

      <LiveConflicts
        conflicts={live.server.conflicts}
        items={live.items}
        steps={steps}
        units={units}
        onChoose={(conflict, keep) => void live.choose(conflict, keep)}
      />

      <section aria-labelledby="current-step" className="mt-4 rounded-xl border border-line bg-card p-4">
        <p className="text-xs uppercase tracking-wide text-muted">
          Step {steps.indexOf(current) + 1} of {steps.length}
          {checked.has(current.id) && ' · done'}
        </p>
        <h1 id="current-step" className="mt-1 font-serif text-3xl font-semibold leading-tight">
          {current.title}
        </h1>
        <p className="mt-2 text-lg">{current.detail}</p>
        {current.caution && <Caution>{CAUTION_TEXT[current.caution]}</Caution>}

        {current.timerMin !== null && (
          <div className="mt-4 text-center">
            <p
              className="kf-data text-7xl font-semibold tabular-nums"
              aria-label={`Time left ${clock(left)}`}
              data-testid="timer"
            >
              {clock(left)}
            </p>
            <div className="mt-3 grid grid-cols-2 gap-2">
              {timer?.startedAt ? (
                <button type="button" className="kf-btn min-h-14 text-xl" onClick={() => timers.pause(current.id)}>
                  Pause
                </button>
              ) : (
                <button type="button" className="kf-btn min-h-14 text-xl" onClick={() => startTimer(current.id)}>
                  {ran > 0 ? 'Resume' : 'Start timer'}
                </button>
              )}
              <button
                type="button"
                className="kf-btn-quiet min-h-14 text-xl"
                disabled={!timer}
                onClick={() => timers.reset(current.id)}
              >
                Reset
              </button>
            </div>
            {current.announcements.length > 0 && (
              <ol className="mt-3 space-y-1 text-left">
                {current.announcements.map((a) => {
                  const made = timers.announced.includes(`${current.id}:${a.id}`);
                  return (
                    <li key={a.id} className={made ? 'text-muted line-through' : ''}>
                      <span className="kf-data">{clock(a.atMin * 60_000)}</span> · {a.text}
                    </li>
                  );
                })}
              </ol>
            )}
          </div>
        )}

        {current.fields.length > 0 && (
          <div className="mt-4 space-y-3">
            {current.fields.map((field) => (
              <LiveFieldInput
                key={field}
                field={field}
                units={units}
                saved={live.server.fields[field]}
                pending={live.items.filter((i) => i.request.kind === 'field' && i.request.field === field)}
                onEnter={(value) => live.enterField(field, value)}
                conflicted={live.server.conflicts.some((c) => c.kind === 'field' && c.field === field)}
                onDiscard={(item) => void live.discard(item)}
              />
            ))}
          </div>
        )}
      </section>

      <section aria-labelledby="checklist-title" className="mt-6">
        <h2 id="checklist-title" className="font-serif text-xl font-semibold">
          The brew day
        </h2>
        <ol className="mt-2 divide-y divide-line rounded-xl border border-line bg-card">
          {steps.map((step) => {
            const done = checked.has(step.id);
            const pendingTick = live.items.some(
              (i) => i.state === 'waiting' && i.request.kind === 'step' && i.request.stepId === step.id,
            );
            return (
              <li key={step.id} className={`flex items-center gap-3 p-3 ${step.id === current.id ? 'bg-paper' : ''}`}>
                <input
                  type="checkbox"
                  className="h-8 w-8 shrink-0 accent-copper"
                  checked={done}
                  aria-label={`Done: ${step.title}`}
                  onChange={(e) => void tick(step, e.target.checked)}
                />
                <button
                  type="button"
                  className={`min-h-12 flex-1 text-left text-lg ${done ? 'text-muted line-through' : ''}`}
                  aria-current={step.id === current.id ? 'step' : undefined}
                  onClick={() => setChosen(step.id)}
                >
                  {step.title}
                  {pendingTick && <span className="ml-2 text-sm text-caution no-underline">waiting to send</span>}
                </button>
              </li>
            );
          })}
        </ol>
      </section>

      {live.items.length > 0 && (
        <section aria-labelledby="outbox-title" className="mt-6 rounded-xl border border-line bg-card p-3">
          <h2 id="outbox-title" className="font-semibold">
            Kept on this phone
          </h2>
          <ul className="mt-1 space-y-1 text-sm" data-testid="outbox">
            {live.items.map((item) => (
              <li key={item.idempotencyKey}>
                {describeItem(item, steps, units)} ·{' '}
                <span className={item.state === 'waiting' ? 'text-caution' : 'text-danger'}>
                  {item.state === 'waiting'
                    ? 'waiting to send'
                    : item.state === 'conflict'
                      ? 'two values: choose one above'
                      : `not saved: ${item.message}`}
                </span>
              </li>
            ))}
          </ul>
          {live.online && waiting.length > 0 && (
            <button type="button" className="kf-btn-quiet mt-2 min-h-12" onClick={() => void live.sendNow()}>
              Send now
            </button>
          )}
        </section>
      )}

      <nav className="fixed inset-x-0 bottom-0 z-10 border-t border-line bg-paper/95 p-3">
        <div className="mx-auto flex max-w-xl gap-2">
          <button
            type="button"
            className="kf-btn min-h-14 flex-1 text-xl"
            onClick={() => void tick(current, !checked.has(current.id))}
          >
            {checked.has(current.id) ? 'Mark not done' : 'Done, next step'}
          </button>
        </div>
      </nav>
    </div>
  );
}
