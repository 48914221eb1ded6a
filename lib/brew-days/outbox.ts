import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { LiveValue } from './live-steps';
import { liveEntrySchema, type LiveField } from './schemas';

// Brew-day mode's outbox in the browser's IndexedDB: every reading and ticked step waits here until
// the server has answered it, so nothing entered without a connection is lost on a reload.

export type OutboxRequest =
  | { idempotencyKey: string; kind: 'field'; field: LiveField; value: LiveValue; knownValue: LiveValue }
  | { idempotencyKey: string; kind: 'step'; stepId: string; checked: boolean; basedOn: string | null }
  | { idempotencyKey: string; kind: 'resolve'; conflictId: string; keep: 'entered' | 'saved'; savedToken: string };

export interface OutboxItem {
  idempotencyKey: string;
  brewDayId: string;
  request: OutboxRequest;
  createdAt: number;
  /**
   * waiting: not answered yet; conflict: kept by the server beside another device's value (the
   * server's state lists it until the brewer chooses; kept here to say which value this device
   * entered); refused: the server said no.
   */
  state: 'waiting' | 'conflict' | 'refused';
  message: string | null;
}

interface OutboxDb extends DBSchema {
  outbox: { key: string; value: OutboxItem; indexes: { byBrewDay: string } };
}

export const OUTBOX_DATABASE = 'kettlefork-brew-day';

let opened: Promise<IDBPDatabase<OutboxDb>> | null = null;

function outboxDb(): Promise<IDBPDatabase<OutboxDb>> {
  opened ??= openDB<OutboxDb>(OUTBOX_DATABASE, 1, {
    upgrade(db) {
      db.createObjectStore('outbox', { keyPath: 'idempotencyKey' }).createIndex('byBrewDay', 'brewDayId');
    },
    // Another tab is deleting the outbox (signing out): let go, so it can.
    blocking() {
      void closeOutbox();
    },
  });
  return opened;
}

/** Closes this tab's connection, so the outbox can be deleted. */
export async function closeOutbox(): Promise<void> {
  const db = opened;
  opened = null;
  if (db) (await db.catch(() => null))?.close();
}

/** How many writes wait unsent on this device, across every brew day; null when there is no outbox yet. */
export async function countUnsent(): Promise<number | null> {
  if (indexedDB.databases && !(await indexedDB.databases()).some((d) => d.name === OUTBOX_DATABASE)) return null;
  const items = await (await outboxDb()).getAll('outbox');
  return items.filter((i) => i.state === 'waiting').length;
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
