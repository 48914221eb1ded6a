'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from 'react';
import type { LiveState, LiveValue } from '@/lib/brew-days/live-steps';
import {
  addToOutbox,
  listOutbox,
  removeFromOutbox,
  updateOutboxItem,
  type OutboxItem,
  type OutboxRequest,
} from '@/lib/brew-days/outbox';
import type { LiveField } from '@/lib/brew-days/schemas';
import { requestJson } from '@/lib/http/client';

const brewDayLiveKeys = { state: (id: string) => ['brew-day-live', id] as const };

/** While anything waits, sending is tried again this often (and at once when the connection returns). */
const RETRY_MS = 15_000;

type Saved =
  | { outcome: 'saved'; kind: 'field'; field: LiveField; value: LiveValue; savedAt: string }
  | { outcome: 'saved'; kind: 'step'; stepId: string; checked: boolean; savedAt: string };

function subscribeOnline(onChange: () => void): () => void {
  window.addEventListener('online', onChange);
  window.addEventListener('offline', onChange);
  return () => {
    window.removeEventListener('online', onChange);
    window.removeEventListener('offline', onChange);
  };
}

function newKey(): string {
  return crypto.randomUUID();
}

/**
 * Brew-day mode's link to the server: the saved state (read through the service worker, so a kept
 * copy answers offline) and the outbox of writes waiting in IndexedDB, sent in order whenever the
 * connection is there, each with its own idempotency key so a retry never saves twice.
 */
export function useBrewDayLive(brewDayId: string, initialState: LiveState) {
  const queryClient = useQueryClient();
  const { data: server = initialState, refetch } = useQuery({
    queryKey: brewDayLiveKeys.state(brewDayId),
    queryFn: async (): Promise<LiveState> => {
      const res = await fetch(`/api/brew-days/${brewDayId}/live`, { cache: 'no-store' });
      if (!res.ok) throw new Error('Could not load the brew day.');
      return (await res.json()) as LiveState;
    },
    initialData: initialState,
    staleTime: 10_000,
  });
  const [items, setItems] = useState<OutboxItem[]>([]);
  const online = useSyncExternalStore(
    subscribeOnline,
    () => navigator.onLine,
    () => true,
  );
  const [sending, setSending] = useState(false);
  /** The last try found no way through (a phone can say it is online behind a dead connection). */
  const [unreachable, setUnreachable] = useState(false);
  const [storageError, setStorageError] = useState<string | null>(null);
  const flushing = useRef(false);

  const reload = useCallback(async () => {
    setItems(await listOutbox(brewDayId));
  }, [brewDayId]);

  const applySaved = useCallback(
    (saved: Saved) => {
      queryClient.setQueryData<LiveState>(brewDayLiveKeys.state(brewDayId), (old) => {
        const base = old ?? initialState;
        if (saved.kind === 'field')
          return { ...base, fields: { ...base.fields, [saved.field]: { value: saved.value, savedAt: saved.savedAt } } };
        const checkedSteps = { ...base.checkedSteps };
        if (saved.checked) checkedSteps[saved.stepId] ??= saved.savedAt;
        else delete checkedSteps[saved.stepId];
        return { ...base, checkedSteps };
      });
    },
    [queryClient, brewDayId, initialState],
  );

  const flush = useCallback(async () => {
    if (flushing.current) return;
    flushing.current = true;
    setSending(true);
    let conflicted = false;
    try {
      for (const item of await listOutbox(brewDayId)) {
        if (item.state !== 'waiting') continue;
        const result = await requestJson<Saved>(`/api/brew-days/${brewDayId}/live`, 'POST', item.request);
        setUnreachable(result.status === 0);
        if (result.ok) {
          await removeFromOutbox(item.idempotencyKey);
          applySaved(result.data);
          continue;
        }
        // No connection, the server briefly down, or signed out: keep it waiting and try later.
        if (result.status === 0 || result.status === 401 || result.status === 429 || result.status >= 500) break;
        const isConflict = result.status === 409 && result.fields.some((f) => f.path === 'value');
        conflicted ||= isConflict;
        await updateOutboxItem({ ...item, state: isConflict ? 'conflict' : 'refused', message: result.message });
      }
    } catch {
      setStorageError('This browser would not keep readings for later; stay online until they are saved.');
    } finally {
      flushing.current = false;
      setSending(false);
      await reload().catch(() => undefined);
      if (conflicted) void refetch();
    }
  }, [brewDayId, applySaved, reload, refetch]);

  useEffect(() => {
    const resume = () => {
      void flush();
      void refetch();
    };
    // Sending also reads the outbox, so what waits from an earlier visit shows at once.
    resume();
    window.addEventListener('online', resume);
    return () => window.removeEventListener('online', resume);
  }, [flush, refetch]);

  const waiting = items.filter((i) => i.state === 'waiting').length;
  useEffect(() => {
    if (waiting === 0) return;
    const timer = setInterval(() => {
      if (navigator.onLine) void flush();
    }, RETRY_MS);
    return () => clearInterval(timer);
  }, [waiting, flush]);

  const enqueue = useCallback(
    async (request: OutboxRequest): Promise<string | null> => {
      try {
        const stored = await addToOutbox(brewDayId, request);
        if (!stored.ok) return stored.message;
        await reload();
        if (navigator.onLine) void flush();
        return null;
      } catch {
        setStorageError('This browser would not keep readings for later; stay online until they are saved.');
        return 'Could not keep this on the device';
      }
    },
    [brewDayId, reload, flush],
  );

  /** A field's new value, based on the value this device last knew (the saved one, or one still waiting). */
  const enterField = useCallback(
    (field: LiveField, value: LiveValue) => {
      const pending = items.filter((i) => i.request.kind === 'field' && i.request.field === field);
      const last = pending.at(-1)?.request;
      const knownValue = last && last.kind === 'field' ? last.value : server.fields[field].value;
      return enqueue({ idempotencyKey: newKey(), kind: 'field', field, value, knownValue });
    },
    [items, server, enqueue],
  );

  const tickStep = useCallback(
    (stepId: string, checked: boolean) => enqueue({ idempotencyKey: newKey(), kind: 'step', stepId, checked }),
    [enqueue],
  );

  /** After a conflict: send this device's value again, now knowing the other one, or let it go. */
  const keepMine = useCallback(
    async (item: OutboxItem) => {
      if (item.request.kind !== 'field') return;
      const theirs = server.fields[item.request.field].value;
      await removeFromOutbox(item.idempotencyKey);
      await enqueue({ ...item.request, idempotencyKey: newKey(), knownValue: theirs });
    },
    [server, enqueue],
  );

  const discard = useCallback(
    async (item: OutboxItem) => {
      await removeFromOutbox(item.idempotencyKey);
      await reload();
    },
    [reload],
  );

  return {
    server,
    items,
    online,
    unreachable,
    sending,
    storageError,
    enterField,
    tickStep,
    keepMine,
    discard,
    sendNow: flush,
  };
}
