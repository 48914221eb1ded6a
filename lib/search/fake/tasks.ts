/**
 * The task queue: every write is enqueued, answered with a summarized task, then
 * processed one at a time in order on a later turn of the event loop
 * (enqueued → processing → succeeded | failed).
 */
import { badRequest, FakeApiError, type ErrorBody } from './errors';

export type TaskStatus = 'enqueued' | 'processing' | 'succeeded' | 'failed';

export type TaskType =
  | 'indexCreation'
  | 'indexUpdate'
  | 'indexDeletion'
  | 'documentAdditionOrUpdate'
  | 'documentDeletion'
  | 'settingsUpdate';

export interface TaskView {
  uid: number;
  batchUid: number | null;
  indexUid: string | null;
  status: TaskStatus;
  type: TaskType;
  canceledBy: null;
  details: Record<string, unknown>;
  error: ErrorBody | null;
  duration: string | null;
  enqueuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export interface EnqueuedTaskView {
  taskUid: number;
  indexUid: string | null;
  status: TaskStatus;
  type: TaskType;
  enqueuedAt: string;
}

/** The work a task does when processed; it returns details to merge into the task, or throws FakeApiError. */
export type TaskWork = () => Record<string, unknown>;

interface QueuedTask {
  view: TaskView;
  /** Dropped once processed, so finished tasks do not hold their documents. */
  work: TaskWork | null;
  startedMs: number;
}

function isoDuration(ms: number): string {
  return `PT${(ms / 1000).toFixed(3)}S`;
}

const TASK_STATUSES = new Set(['enqueued', 'processing', 'succeeded', 'failed', 'canceled']);

export class TaskQueue {
  private readonly tasks: QueuedTask[] = [];
  private nextToProcess = 0;
  private scheduled = false;
  private closed = false;

  enqueue(indexUid: string | null, type: TaskType, details: Record<string, unknown>, work: TaskWork): EnqueuedTaskView {
    const uid = this.tasks.length;
    const view: TaskView = {
      uid,
      batchUid: null,
      indexUid,
      status: 'enqueued',
      type,
      canceledBy: null,
      details,
      error: null,
      duration: null,
      enqueuedAt: new Date().toISOString(),
      startedAt: null,
      finishedAt: null,
    };
    this.tasks.push({ view, work, startedMs: 0 });
    this.schedule();
    return { taskUid: uid, indexUid, status: 'enqueued', type, enqueuedAt: view.enqueuedAt };
  }

  get(uid: number): TaskView | undefined {
    return this.tasks[uid]?.view;
  }

  /** Whether tasks for `indexUid` are still waiting or running. */
  isBusy(indexUid: string): boolean {
    return this.tasks.slice(this.nextToProcess).some((task) => task.view.indexUid === indexUid);
  }

  /** `GET /tasks`: newest first, with `limit`, `from` and comma-separated `uids`, `statuses`, `types`, `indexUids`. */
  list(params: URLSearchParams): Record<string, unknown> {
    const limit = Number(params.get('limit') ?? 20);
    const from = params.has('from') ? Number(params.get('from')) : null;
    if (!Number.isInteger(limit) || limit < 0)
      throw badRequest('invalid_task_limit', 'Invalid value in parameter `limit`: expected a positive integer.');
    const statuses = listParam(params, 'statuses');
    if (statuses?.some((status) => !TASK_STATUSES.has(status))) {
      throw badRequest('invalid_task_statuses', 'Invalid value in parameter `statuses`.');
    }
    const filters: Array<[string[] | null, (view: TaskView) => string]> = [
      [listParam(params, 'uids'), (view) => String(view.uid)],
      [statuses, (view) => view.status],
      [listParam(params, 'types'), (view) => view.type],
      [listParam(params, 'indexUids'), (view) => view.indexUid ?? ''],
    ];
    const matching = this.tasks
      .map((task) => task.view)
      .filter((view) => filters.every(([allowed, pick]) => !allowed || allowed.includes(pick(view))))
      .reverse();
    const startAt = from === null ? 0 : matching.findIndex((view) => view.uid <= from);
    const page = startAt < 0 ? [] : matching.slice(startAt, startAt + limit + 1);
    return {
      results: page.slice(0, limit),
      total: matching.length,
      limit,
      from: page[0]?.uid ?? null,
      next: page.length > limit ? page[limit].uid : null,
    };
  }

  close(): void {
    this.closed = true;
  }

  private schedule(): void {
    if (this.scheduled || this.closed) return;
    this.scheduled = true;
    setImmediate(() => this.startNext());
  }

  private startNext(): void {
    this.scheduled = false;
    const task = this.tasks[this.nextToProcess];
    if (!task || this.closed) return;
    task.view.status = 'processing';
    task.view.startedAt = new Date().toISOString();
    task.startedMs = performance.now();
    setImmediate(() => this.finish(task));
  }

  private finish(task: QueuedTask): void {
    try {
      Object.assign(task.view.details, task.work?.());
      task.view.status = 'succeeded';
    } catch (error) {
      task.view.status = 'failed';
      task.view.error = (
        error instanceof FakeApiError ? error : new FakeApiError(500, 'internal', String(error), 'internal')
      ).toBody();
    }
    task.work = null;
    task.view.finishedAt = new Date().toISOString();
    task.view.duration = isoDuration(performance.now() - task.startedMs);
    this.nextToProcess++;
    if (this.nextToProcess < this.tasks.length) this.schedule();
  }
}

function listParam(params: URLSearchParams, name: string): string[] | null {
  const raw = params.get(name);
  if (raw === null || raw === '*') return null;
  return raw.split(',').map((item) => item.trim());
}
