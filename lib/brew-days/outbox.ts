import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { LiveValue } from './live-steps';
import { liveEntrySchema, type LiveField } from './schemas';

// Brew-day mode's outbox in the browser's IndexedDB: every reading and ticked step waits here until
// the server has answered it, so nothing entered without a connection is lost on a reload.

export type OutboxRequest =
  | { idempotencyKey: string; kind: 'field'; field: LiveField; value: LiveValue; knownValue: LiveValue }
  | { idempotencyKey: string; kind: 'step'; stepId: string; checked: boolean };

export interface OutboxItem {
  idempotencyKey: string;
  brewDayId: string;
  request: OutboxRequest;
  createdAt: number;
  /** waiting: not answered yet; conflict: another device saved a different value; refused: the server said no. */
  state: 'waiting' | 'conflict' | 'refused';
  message: string | null;
}

interface OutboxDb extends DBSchema {
  outbox: { key: string; value: OutboxItem; indexes: { byBrewDay: string } };
}

let opened: Promise<IDBPDatabase<OutboxDb>> | null = null;

function outboxDb(): Promise<IDBPDatabase<OutboxDb>> {
  opened ??= openDB<OutboxDb>('kettlefork-brew-day', 1, {
    upgrade(db) {
      db.createObjectStore('outbox', { keyPath: 'idempotencyKey' }).createIndex('byBrewDay', 'brewDayId');
    },
  });
  return opened;
}

/** Stores a write for later sending, after checking it with the same schema the server uses. */
export async function addToOutbox(
  brewDayId: string,
  request: OutboxRequest,
): Promise<{ ok: true; item: OutboxItem } | { ok: false; message: string }> {
  const parsed = liveEntrySchema.safeParse(request);
  if (!parsed.success) return { ok: false, message: parsed.error.issues[0]?.message ?? 'That value is not valid' };
  const item: OutboxItem = {
    idempotencyKey: request.idempotencyKey,
    brewDayId,
    request,
    createdAt: Date.now(),
    state: 'waiting',
    message: null,
  };
  await (await outboxDb()).put('outbox', item);
  return { ok: true, item };
}

/** A brew day's writes not yet settled, oldest first. */
export async function listOutbox(brewDayId: string): Promise<OutboxItem[]> {
  const items = await (await outboxDb()).getAllFromIndex('outbox', 'byBrewDay', brewDayId);
  return items.sort((a, b) => a.createdAt - b.createdAt);
}

export async function updateOutboxItem(item: OutboxItem): Promise<void> {
  await (await outboxDb()).put('outbox', item);
}

export async function removeFromOutbox(idempotencyKey: string): Promise<void> {
  await (await outboxDb()).delete('outbox', idempotencyKey);
}
