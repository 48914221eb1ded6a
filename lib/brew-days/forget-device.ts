import { deleteDB } from 'idb';
import { closeOutbox, OUTBOX_DATABASE } from './outbox';

// Signing out on a shared phone must leave nothing of the member's brew days behind for the next
// person: not the service worker's kept pages and reads, not the outbox of unsent readings and
// ticks, not the timers, not the tag that lets the worker answer offline.

const DELETE_WAIT_MS = 3_000;
const TIMER_PREFIX = 'kettlefork-brew-day-';

/** Asks the worker to empty its caches, then unregisters it; the page empties what it can reach itself too. */
async function forgetWorker(): Promise<void> {
  if (!('serviceWorker' in navigator)) return;
  const registrations = await navigator.serviceWorker.getRegistrations();
  for (const registration of registrations) {
    if (!new URL(registration.scope).pathname.startsWith('/brew-days/')) continue;
    const worker = registration.active ?? registration.waiting ?? registration.installing;
    if (worker) {
      await new Promise<void>((resolve) => {
        const channel = new MessageChannel();
        const timer = setTimeout(resolve, DELETE_WAIT_MS);
        channel.port1.onmessage = () => {
          clearTimeout(timer);
          resolve();
        };
        worker.postMessage({ type: 'forget' }, [channel.port2]);
      });
    }
    await registration.unregister();
  }
}

async function forgetCaches(): Promise<void> {
  if (!('caches' in window)) return;
  for (const name of await caches.keys()) if (name.startsWith('kettlefork-')) await caches.delete(name);
}

/** Deletes the outbox; another tab still holding it open is asked to let go, and is not waited on for long. */
async function forgetOutbox(): Promise<void> {
  if (!('indexedDB' in window)) return;
  await closeOutbox();
  await Promise.race([deleteDB(OUTBOX_DATABASE), new Promise<void>((resolve) => setTimeout(resolve, DELETE_WAIT_MS))]);
}

function forgetLocal(): void {
  try {
    for (const key of Object.keys(localStorage)) if (key.startsWith(TIMER_PREFIX)) localStorage.removeItem(key);
  } catch {
    // Storage switched off: nothing was kept there.
  }
  document.cookie = 'kf-offline-tag=; Max-Age=0; Path=/; SameSite=Lax';
}

/**
 * Removes every trace of brew-day mode from this browser. Each part is tried even when another
 * fails, so a browser that refuses one kind of storage still loses the rest.
 */
export async function forgetBrewDaysOnThisDevice(): Promise<void> {
  forgetLocal();
  await Promise.allSettled([forgetWorker().then(forgetCaches), forgetOutbox()]);
  await forgetCaches().catch(() => undefined);
}
