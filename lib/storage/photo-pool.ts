import 'server-only';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { Piscina } from 'piscina';
import { AppError } from '@/lib/errors';

/**
 * Admission to a fixed number of running slots with a bounded line of waiters. A caller that finds
 * every slot taken and the line full is refused at once rather than queued without end.
 */
export class AdmissionGate {
  private running = 0;
  private readonly waiting: Array<() => void> = [];

  constructor(
    readonly slots: number,
    readonly maxWaiting: number,
  ) {}

  /** Resolves with a release function once a slot is ours; false when the line is full. */
  async enter(): Promise<(() => void) | false> {
    if (this.running < this.slots) {
      this.running += 1;
    } else if (this.waiting.length >= this.maxWaiting) {
      return false;
    } else {
      // The slot is handed over by release(), so `running` stays counted for the waiter.
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    }
    let released = false;
    return () => {
      if (released) return;
      released = true;
      const next = this.waiting.shift();
      if (next) next();
      else this.running -= 1;
    };
  }

  get load(): { running: number; waiting: number } {
    return { running: this.running, waiting: this.waiting.length };
  }
}

/** Worker threads per server process: one per core but one, which stays with the requests. */
const PHOTO_THREADS = Math.max(1, availableParallelism() - 1);
/** Uploads that may wait for a thread per server process; more are told to come back shortly. */
const PHOTO_QUEUE = 4;
/** Longest a thread may spend on one photo; then the thread is stopped and nothing is saved. */
const PHOTO_BUDGET_MS = 30_000;

export type PhotoType = 'jpeg' | 'png' | 'webp';

type TaskResult =
  { ok: true; display: Uint8Array; thumb: Uint8Array; width: number; height: number } | { ok: false; detail?: string };

interface PhotoWorkers {
  pool: Piscina;
  gate: AdmissionGate;
}

const shared = globalThis as unknown as { kfPhotoWorkers?: PhotoWorkers };

function photoWorkers(): PhotoWorkers {
  shared.kfPhotoWorkers ??= {
    // A plain .mjs file outside the Next bundle, found from the working directory the server runs in
    // (the checkout, for `next dev`, `next start` through scripts/serve.mjs and the tests alike).
    pool: new Piscina({
      filename: path.join(process.cwd(), 'lib', 'storage', 'photo-worker.mjs'),
      minThreads: 0,
      maxThreads: PHOTO_THREADS,
      idleTimeout: 60_000,
      // Photo threads run at a lower priority (a higher nice value), so on a busy machine the
      // request threads get the processor first and a photo only waits a little longer.
      niceIncrement: 10,
    }),
    gate: new AdmissionGate(PHOTO_THREADS, PHOTO_QUEUE),
  };
  return shared.kfPhotoWorkers;
}

function damaged(detail?: string): AppError {
  const message = `The photo is damaged or incomplete${detail ? ` (${detail})` : ''}; please upload the whole file.`;
  return new AppError('bad_request', 'photo', message, [{ path: 'photo', message }]);
}

const toBuffer = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);

/**
 * Runs the decode, resize and re-encode of one photo on a worker thread. Refuses with 503 (and
 * Retry-After) when every thread is busy and the line is full, and with 413 when one photo takes
 * longer than the budget; in both cases nothing has been stored.
 */
export async function processOnWorker(
  bytes: Uint8Array,
  type: PhotoType,
  workers: { pool: Pick<Piscina, 'run'>; gate: AdmissionGate } = photoWorkers(),
  budgetMs = PHOTO_BUDGET_MS,
): Promise<{ display: Buffer; thumb: Buffer; width: number; height: number }> {
  const release = await workers.gate.enter();
  if (!release) {
    throw new AppError(
      'unavailable',
      'photo',
      'Kettlefork is busy preparing other photos; nothing was saved. Please try again shortly.',
    );
  }
  let result: TaskResult;
  try {
    // The budget starts once a thread is ours, so time spent waiting in line does not count.
    result = await workers.pool.run({ bytes, type }, { signal: AbortSignal.timeout(budgetMs) });
  } catch (err) {
    if ((err as Error).name === 'AbortError') {
      const message = `The photo took longer than ${Math.round(budgetMs / 1000)} seconds to prepare, so nothing was saved; please upload a smaller picture (fewer pixels).`;
      throw new AppError('too_large', 'photo', message, [{ path: 'photo', message }]);
    }
    console.error('[photos] worker failed:', (err as Error).message);
    const message = 'We could not prepare this photo, so nothing was saved; please try a different file.';
    throw new AppError('bad_request', 'photo', message, [{ path: 'photo', message }]);
  } finally {
    release();
  }
  if (!result.ok) throw damaged(result.detail);
  return {
    display: toBuffer(result.display),
    thumb: toBuffer(result.thumb),
    width: result.width,
    height: result.height,
  };
}
