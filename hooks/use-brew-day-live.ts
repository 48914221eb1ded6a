'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from 'react';
import type { LiveConflict, LiveState, LiveValue } from '@/lib/brew-days/live-steps';
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
/** How often the saved state is read while online, so a value or conflict from another device shows. */
const POLL_MS = 20_000;

type Saved =
  | { outcome: 'saved'; kind: 'field'; field: LiveField; value: LiveValue; savedAt: string }
  | { outcome: 'saved'; kind: 'step'; stepId: string; checked: boolean; savedAt: string }
  | ({ outcome: 'saved'; kind: 'resolve'; conflictId: string; savedAt: string } & (
      { field: LiveField; value: LiveValue } | { stepId: string; checked: boolean }
    ));

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

/** A step ticked or unticked in a copy of the state. */
function withStep(state: LiveState, stepId: string, checked: boolean, at: string, key: string): LiveState {
  const checkedSteps = { ...state.checkedSteps };
  if (checked) checkedSteps[stepId] ??= at;
  else delete checkedSteps[stepId];
  return { ...state, checkedSteps, stepRevisions: { ...state.stepRevisions, [stepId]: key } };
}

function withSaved(state: LiveState, saved: Saved, key: string): LiveState {
  const conflicts = state.conflicts.filter((c) => saved.kind !== 'resolve' || c.id !== saved.conflictId);
  const base = { ...state, conflicts };
  if ('field' in saved)
    return {
      ...base,
      fields: { ...base.fields, [saved.field]: { value: saved.value, savedAt: saved.savedAt, savedBy: null } },
    };
  return withStep(base, saved.stepId, saved.checked, saved.savedAt, key);
}

/**
 * Brew-day mode's link to the server: the saved state (read through the service worker, so a kept
 * copy answers offline, and read again every little while so another device's values and conflicts
 * show) and the outbox of writes waiting in IndexedDB, sent in order whenever the connection is
 * there, each with its own idempotency key so a retry never saves twice.
 */
export function useBrewDayLive(brewDayId: string, initialState: LiveState) {
  const queryClient = useQueryClient();
  const online = useSyncExternalStore(
    subscribeOnline,
    () => navigator.onLine,
    () => true,
  );
  const { data: server = initialState, refetch } = useQuery({
    queryKey: brewDayLiveKeys.state(brewDayId),
    queryFn: async (): Promise<LiveState> => {
      const res = await fetch(`/api/brew-days/${brewDayId}/live`, { cache: 'no-store' });
      if (!res.ok) throw new Error('Could not load the brew day.');
      return (await res.json()) as LiveState;
    },
    initialData: initialState,
    staleTime: 10_000,
    refetchInterval: online ? POLL_MS : false,
  });
  const [items, setItems] = useState<OutboxItem[]>([]);
  const [sending, setSending] = useState(false);
  /** The last try found no way through (a phone can say it is online behind a dead connection). */
  const [unreachable, setUnreachable] = useState(false);
  const [storageError, setStorageError] = useState<string | null>(null);
  const flushing = useRef(false);

  const reload = useCallback(async () => {
    setItems(await listOutbox(brewDayId));
  }, [brewDayId]);

  // A read already on its way was answered before this write: cancel it first, or it would land
  // after this change and take it back (and a conflict this device entered would be forgotten).
  const update = useCallback(
    async (change: (state: LiveState) => LiveState) => {
      await queryClient.cancelQueries({ queryKey: brewDayLiveKeys.state(brewDayId) });
      queryClient.setQueryData<LiveState>(brewDayLiveKeys.state(brewDayId), (old) => change(old ?? initialState));
    },
    [queryClient, brewDayId, initialState],
  );

  const flush = useCallback(async () => {
    if (flushing.current) return;
    flushing.current = true;
    setSending(true);
    let answered = false;
    try {
      for (const item of await listOutbox(brewDayId)) {
        if (item.state !== 'waiting') continue;
        const result = await requestJson<Saved>(`/api/brew-days/${brewDayId}/live`, 'POST', item.request);
        setUnreachable(result.status === 0);
        // No connection, the server briefly down, or signed out: keep it waiting and try later.
        if (
          !result.ok &&
          (result.status === 0 || result.status === 401 || result.status === 429 || result.status >= 500)
        )
          break;
        answered = true;
        if (result.ok) {
          await removeFromOutbox(item.idempotencyKey);
          await update((state) => withSaved(state, result.data, item.idempotencyKey));
          continue;
        }
        const details = result.details as { conflict?: LiveConflict } | undefined;
        const isConflict =
          result.status === 409 && result.fields.some((f) => f.path === 'value' || f.path === 'checked');
        // The server keeps the conflict and lists it for every device; it shows here at once.
        const conflict = details?.conflict;
        if (isConflict && conflict)
          await update((state) => ({
            ...state,
            conflicts: [...state.conflicts.filter((c) => c.id !== conflict.id), conflict],
          }));
        await updateOutboxItem({ ...item, state: isConflict ? 'conflict' : 'refused', message: result.message });
      }
    } catch {
      setStorageError('This browser would not keep readings for later; stay online until they are saved.');
    } finally {
      flushing.current = false;
      setSending(false);
      await reload().catch(() => undefined);
      if (answered) void refetch();
    }
  }, [brewDayId, update, reload, refetch]);

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

  // A conflict settled on another device is no longer listed: this device's copy of it goes too.
  const openKeys = server.conflicts.map((c) => c.enteredKey).join(',');
  useEffect(() => {
    const stale = items.filter((i) => i.state === 'conflict' && !openKeys.split(',').includes(i.idempotencyKey));
    if (stale.length === 0) return;
    void Promise.all(stale.map((i) => removeFromOutbox(i.idempotencyKey)))
      .then(reload)
      .catch(() => undefined);
  }, [openKeys, items, reload]);

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
      const last = items
        .filter((i) => i.state === 'waiting' && i.request.kind === 'field' && i.request.field === field)
        .at(-1)?.request;
      const knownValue = last && last.kind === 'field' ? last.value : server.fields[field].value;
      return enqueue({ idempotencyKey: newKey(), kind: 'field', field, value, knownValue });
    },
    [items, server, enqueue],
  );

  /** A tick or untick, naming the write it follows: this device's own tick still waiting, or the last one saved. */
  const tickStep = useCallback(
    (stepId: string, checked: boolean) => {
      const last = items
        .filter((i) => i.state === 'waiting' && i.request.kind === 'step' && i.request.stepId === stepId)
        .at(-1);
      const basedOn = last?.idempotencyKey ?? server.stepRevisions[stepId] ?? null;
      return enqueue({ idempotencyKey: newKey(), kind: 'step', stepId, checked, basedOn });
    },
    [items, server, enqueue],
  );

  /** The brewer's choice between a conflict's two values, sent like any other write (and kept while offline). */
  const choose = useCallback(
    (conflict: LiveConflict, keep: 'entered' | 'saved') =>
      enqueue({
        idempotencyKey: newKey(),
        kind: 'resolve',
        conflictId: conflict.id,
        keep,
        savedToken: conflict.savedToken,
      }),
    [enqueue],
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
    choose,
    discard,
    sendNow: flush,
  };
}
