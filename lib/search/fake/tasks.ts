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

  /** `GET /tasks`: newest first (oldest first with `reverse=true`), paged by `limit` and `from`, filtered as below. */
  list(params: URLSearchParams): Record<string, unknown> {
    const query = parseTaskQuery(params);
    const matching = this.tasks.map((task) => task.view).filter((view) => query.filters.every((keep) => keep(view)));
    if (!query.reverse) matching.reverse();
    const from = query.from;
    const startAt =
      from === null ? 0 : matching.findIndex((view) => (query.reverse ? view.uid >= from : view.uid <= from));
    const page = startAt < 0 ? [] : matching.slice(startAt, startAt + query.limit + 1);
    return {
      results: page.slice(0, query.limit),
      total: matching.length,
      limit: query.limit,
      from: page[0]?.uid ?? null,
      next: page.length > query.limit ? page[query.limit].uid : null,
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

const TASK_TYPES = [
  'documentAdditionOrUpdate',
  'documentEdition',
  'documentDeletion',
  'settingsUpdate',
  'indexCreation',
  'indexDeletion',
  'indexUpdate',
  'indexSwap',
  'taskCancelation',
  'taskDeletion',
  'dumpCreation',
  'snapshotCreation',
  'upgradeDatabase',
];

const DATE_FILTERS = [
  'afterEnqueuedAt',
  'beforeEnqueuedAt',
  'afterStartedAt',
  'beforeStartedAt',
  'afterFinishedAt',
  'beforeFinishedAt',
] as const;

const TASK_QUERY_PARAMETERS = [
  'limit',
  'from',
  'reverse',
  'uids',
  'batchUids',
  'canceledBy',
  'types',
  'statuses',
  'indexUids',
  ...DATE_FILTERS,
];

const INDEX_UID = /^[a-zA-Z0-9_-]{1,400}$/;
const RFC_3339 = /^\d{4}-\d{2}-\d{2}[Tt ]\d{2}:\d{2}:\d{2}(\.\d+)?([Zz]|[+-]\d{2}:\d{2})$/;
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

interface TaskQuery {
  limit: number;
  from: number | null;
  reverse: boolean;
  filters: Array<(view: TaskView) => boolean>;
}

function snake(name: string): string {
  return name.replace(/[A-Z]/g, (ch) => `_${ch.toLowerCase()}`);
}

const invalidParameter = (code: string, name: string, reason: string) =>
  badRequest(code, `Invalid value in parameter \`${name}\`: ${reason}`);

function naturalNumber(raw: string, name: string, code: string): number {
  const value = Number(raw);
  if (raw.trim() === '' || !Number.isInteger(value) || value < 0) {
    throw invalidParameter(code, name, `could not parse \`${raw}\` as a positive integer`);
  }
  return value;
}

/** A comma-separated list parameter; null when absent or `*` (no restriction). */
function listParam(params: URLSearchParams, name: string): string[] | null {
  const raw = params.get(name);
  if (raw === null || raw === '*') return null;
  return raw.split(',').map((item) => item.trim());
}

/**
 * A date bound: RFC 3339, or a calendar date, which for an `after…` bound means after that whole
 * day and for a `before…` bound means before it starts. Both bounds are exclusive.
 */
function dateBound(raw: string, name: (typeof DATE_FILTERS)[number]): number {
  const ms =
    RFC_3339.test(raw) || CALENDAR_DATE.test(raw)
      ? Date.parse(CALENDAR_DATE.test(raw) ? `${raw}T00:00:00Z` : raw)
      : NaN;
  if (Number.isNaN(ms)) {
    throw invalidParameter(
      `invalid_task_${snake(name)}`,
      name,
      `\`${raw}\` is an invalid date-time. It should follow the YYYY-MM-DD or RFC 3339 date-time format.`,
    );
  }
  return CALENDAR_DATE.test(raw) && name.startsWith('after') ? ms + 24 * 60 * 60 * 1000 : ms;
}

function parseTaskQuery(params: URLSearchParams): TaskQuery {
  for (const key of params.keys()) {
    if (!TASK_QUERY_PARAMETERS.includes(key)) {
      throw badRequest(
        'bad_request',
        `Unknown parameter \`${key}\`: expected one of ${TASK_QUERY_PARAMETERS.map((name) => `\`${name}\``).join(', ')}`,
      );
    }
  }
  const limitRaw = params.get('limit');
  const fromRaw = params.get('from');
  const reverseRaw = params.get('reverse');
  if (reverseRaw !== null && reverseRaw !== 'true' && reverseRaw !== 'false') {
    throw invalidParameter(
      'invalid_task_reverse',
      'reverse',
      `could not parse \`${reverseRaw}\` as a boolean, expected either \`true\` or \`false\``,
    );
  }
  const filters: TaskQuery['filters'] = [];
  const numbers = (name: string, code: string, pick: (view: TaskView) => number | null) => {
    const list = listParam(params, name);
    if (!list) return;
    const wanted = new Set(list.map((item, i) => naturalNumber(item, list.length > 1 ? `${name}[${i}]` : name, code)));
    filters.push((view) => {
      const value = pick(view);
      return value !== null && wanted.has(value);
    });
  };
  numbers('uids', 'invalid_task_uids', (view) => view.uid);
  numbers('batchUids', 'invalid_task_batch_uids', (view) => view.batchUid);
  numbers('canceledBy', 'invalid_task_canceled_by', () => null);

  const choice = (name: string, allowed: string[], noun: string, pick: (view: TaskView) => string | null) => {
    const list = listParam(params, name);
    if (!list) return;
    for (const item of list) {
      if (!allowed.includes(item)) {
        throw invalidParameter(
          `invalid_task_${snake(name)}`,
          name,
          `\`${item}\` is not a valid task ${noun}. Available ${noun === 'type' ? 'types' : 'statuses'} are ${allowed.map((value) => `\`${value}\``).join(', ')}.`,
        );
      }
    }
    filters.push((view) => list.includes(pick(view) ?? ''));
  };
  choice('types', TASK_TYPES, 'type', (view) => view.type);
  choice('statuses', [...TASK_STATUSES], 'status', (view) => view.status);

  const indexUids = listParam(params, 'indexUids');
  if (indexUids) {
    for (const uid of indexUids) {
      if (!INDEX_UID.test(uid)) {
        throw invalidParameter(
          'invalid_index_uid',
          'indexUids',
          `\`${uid}\` is not a valid index uid. Index uid can be an integer or a string containing only alphanumeric characters, hyphens (-) and underscores (_), and can not be more than 400 bytes.`,
        );
      }
    }
    filters.push((view) => indexUids.includes(view.indexUid ?? ''));
  }

  for (const name of DATE_FILTERS) {
    const raw = params.get(name);
    if (raw === null || raw === '*') continue;
    const bound = dateBound(raw, name);
    const field = name.endsWith('EnqueuedAt') ? 'enqueuedAt' : name.endsWith('StartedAt') ? 'startedAt' : 'finishedAt';
    const after = name.startsWith('after');
    filters.push((view) => {
      const at = view[field];
      if (at === null) return false;
      const ms = Date.parse(at);
      return after ? ms > bound : ms < bound;
    });
  }

  return {
    limit: limitRaw === null ? 20 : naturalNumber(limitRaw, 'limit', 'invalid_task_limit'),
    from: fromRaw === null ? null : naturalNumber(fromRaw, 'from', 'invalid_task_from'),
    reverse: reverseRaw === 'true',
    filters,
  };
}
