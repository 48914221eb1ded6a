'use client';

import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from 'react';
import type { LiveStep } from '@/lib/brew-days/live-steps';

// Brew-day mode's timers, kept in localStorage so a reload (or a phone that slept) keeps counting
// from when each timer was started, and the hop additions each step calls at its minute.

interface TimerState {
  /** Epoch ms when the timer last started running; null while paused or not started. */
  startedAt: number | null;
  /** Time already run before `startedAt`. */
  elapsedMs: number;
}

interface TimerStore {
  timers: Record<string, TimerState>;
  /** Announcements already made (`<step>:<announcement>`), so each is made once. */
  announced: string[];
}

export interface Announcement {
  id: string;
  stepTitle: string;
  text: string;
}

const EMPTY: TimerStore = { timers: {}, announced: [] };
const snapshots = new Map<string, TimerStore>();
const listeners = new Map<string, Set<() => void>>();

function read(key: string): TimerStore {
  let snap = snapshots.get(key);
  if (!snap) {
    try {
      const parsed = JSON.parse(localStorage.getItem(key) ?? 'null') as TimerStore | null;
      snap = parsed && typeof parsed === 'object' && parsed.timers ? parsed : EMPTY;
    } catch {
      snap = EMPTY;
    }
    snapshots.set(key, snap);
  }
  return snap;
}

function write(key: string, next: TimerStore): void {
  snapshots.set(key, next);
  try {
    localStorage.setItem(key, JSON.stringify(next));
  } catch {
    // Storage full or refused: the timers still run for this visit.
  }
  for (const l of listeners.get(key) ?? []) l();
}

export function elapsedMs(timer: TimerState | undefined, now: number): number {
  if (!timer) return 0;
  return timer.elapsedMs + (timer.startedAt === null ? 0 : Math.max(0, now - timer.startedAt));
}

/** Due announcements of every timed step: its additions at their minutes, and the end of the timer. */
function dueAnnouncements(steps: LiveStep[], store: TimerStore, now: number): Announcement[] {
  const due: Announcement[] = [];
  for (const step of steps) {
    const timer = store.timers[step.id];
    if (!timer || step.timerMin === null) continue;
    const ran = elapsedMs(timer, now);
    for (const a of step.announcements) {
      const id = `${step.id}:${a.id}`;
      if (ran >= a.atMin * 60_000 && !store.announced.includes(id))
        due.push({ id, stepTitle: step.title, text: a.text });
    }
    const endId = `${step.id}:end`;
    if (ran >= step.timerMin * 60_000 && !store.announced.includes(endId))
      due.push({ id: endId, stepTitle: step.title, text: `Time is up: ${step.title}` });
  }
  return due;
}

export function useBrewDayTimers(brewDayId: string, steps: LiveStep[], onAnnounce: (a: Announcement[]) => void) {
  const key = `kettlefork-brew-day-timers:${brewDayId}`;
  const subscribe = useCallback(
    (l: () => void) => {
      const set = listeners.get(key) ?? new Set();
      set.add(l);
      listeners.set(key, set);
      return () => set.delete(l);
    },
    [key],
  );
  const store = useSyncExternalStore(
    subscribe,
    () => read(key),
    () => EMPTY,
  );
  const [now, setNow] = useState(() => Date.now());
  const announce = useRef(onAnnounce);
  useEffect(() => {
    announce.current = onAnnounce;
  }, [onAnnounce]);

  const running = Object.values(store.timers).some((t) => t.startedAt !== null);
  useEffect(() => {
    if (!running) return;
    const tick = () => {
      const t = Date.now();
      setNow(t);
      const current = read(key);
      const due = dueAnnouncements(steps, current, t);
      if (due.length) {
        write(key, { ...current, announced: [...current.announced, ...due.map((d) => d.id)] });
        announce.current(due);
      }
    };
    const timer = setInterval(tick, 250);
    return () => clearInterval(timer);
  }, [running, key, steps]);

  const setTimer = useCallback(
    (stepId: string, next: TimerState | null) => {
      const current = read(key);
      const timers = { ...current.timers };
      if (next) timers[stepId] = next;
      else delete timers[stepId];
      // A reset timer calls its additions again when it is run again.
      const announced = next ? current.announced : current.announced.filter((id) => !id.startsWith(`${stepId}:`));
      write(key, { timers, announced });
      setNow(Date.now());
    },
    [key],
  );

  const start = useCallback(
    (stepId: string) => {
      const t = read(key).timers[stepId];
      if (t?.startedAt) return;
      setTimer(stepId, { startedAt: Date.now(), elapsedMs: t?.elapsedMs ?? 0 });
    },
    [key, setTimer],
  );
  const pause = useCallback(
    (stepId: string) => {
      const t = read(key).timers[stepId];
      if (!t || t.startedAt === null) return;
      setTimer(stepId, { startedAt: null, elapsedMs: elapsedMs(t, Date.now()) });
    },
    [key, setTimer],
  );
  const reset = useCallback((stepId: string) => setTimer(stepId, null), [setTimer]);

  return { timers: store.timers, announced: store.announced, now, start, pause, reset };
}
