// The in-process job queue (default, no REDIS_URL): jobs run one at a time in this process and
// their lines are kept in memory. At most `maxKept` jobs are kept (JOBS_MAX_KEPT): a new job drops
// the oldest finished ones first, and when every kept job is unfinished the new one is refused.
// Finished jobs are also dropped `ttlS` (JOB_RESULT_TTL_S) after their last progress. Nothing
// survives a restart: a job running when the service stops is marked failed; use Redis to keep jobs.
// Memory is bounded in bytes too (`maxBytes`, JOBS_MAX_BYTES: the items waiting to run and the
// lines kept): past it the oldest finished jobs are dropped, a new job is refused when that is not
// enough, and a running job whose lines would pass it fails (its lines written stay readable).
import { randomUUID } from 'node:crypto';
import type { JobCounts } from '../plugins/metrics.js';
import type { BatchItem, JobStatus } from '../schemas/batch.js';
import {
  CANCELLED_REASON, deadlineReason, JOB_ID_PATTERN, JobTooLargeError, QueueUnavailableError,
  type JobEvents, type JobPage, type JobQueue, type JobRecord, type NewJob, type RunLines,
} from './queue.js';

export interface MemoryQueueOptions {
  /** Jobs kept, finished or not (>= 1). */
  readonly maxKept: number;
  /** Seconds a finished job is kept after its last progress. */
  readonly ttlS: number;
  /** Bytes of items and lines kept, all jobs together (Infinity: no bound). */
  readonly maxBytes?: number;
  /** Clock, ms since 1970 (tests). */
  readonly now?: () => number;
}

/** Seconds a refused client is asked to wait: about the time a batch of small items takes. */
const RETRY_AFTER_S = 30;

interface MemoryJob {
  record: JobRecord;
  items: readonly BatchItem[] | undefined;
  readonly lines: Buffer[];
  touchedMs: number;
  readonly deadlineMs: number | undefined;
  readonly idempotency: string | undefined;
  readonly abort: AbortController;
  /** Bytes this job holds: its items (as submitted JSON) until it has run, and its lines. */
  bytes: number;
}

export const finished = (status: JobStatus) => status === 'done' || status === 'failed' || status === 'cancelled';
const idempotencySlot = (owner: string | null | undefined, key: string) => `${owner ?? ''}\u0000${key}`;

export class MemoryJobQueue implements JobQueue {
  readonly #run: RunLines;
  readonly #options: MemoryQueueOptions;
  readonly #now: () => number;
  /** Insertion order is submission order: the first finished job met is the oldest. */
  readonly #jobs = new Map<string, MemoryJob>();
  readonly #idempotent = new Map<string, string>();
  readonly #waiting: string[] = [];
  readonly #abort = new AbortController();
  #running: Promise<void> | undefined;
  #seq = 0;
  #events: JobEvents | undefined;
  /** Bytes held by all kept jobs. */
  #bytes = 0;

  constructor(run: RunLines, options: MemoryQueueOptions) {
    if (!Number.isInteger(options.maxKept) || options.maxKept < 1) throw new RangeError('maxKept must be an integer >= 1');
    this.#run = run;
    this.#options = options;
    this.#now = options.now ?? Date.now;
  }

  async enqueue(job: NewJob): Promise<JobRecord> {
    if (this.#abort.signal.aborted) throw new QueueUnavailableError('the service is stopping and takes no new jobs', RETRY_AFTER_S);
    this.#prune();
    if (job.idempotencyKey !== undefined) {
      const earlier = this.#jobs.get(this.#idempotent.get(idempotencySlot(job.owner, job.idempotencyKey)) ?? '');
      if (earlier) return earlier.record;
    }
    // A job larger than the bound by itself is refused before anything stored is dropped for it.
    const itemBytes = Buffer.byteLength(JSON.stringify(job.items));
    if (itemBytes > (this.#options.maxBytes ?? Infinity)) {
      throw new JobTooLargeError(`the job's items take ${itemBytes} bytes; the in-process queue keeps at most ${this.#options.maxBytes} bytes of jobs and results (JOBS_MAX_BYTES): send fewer items per job`);
    }
    for (const [id, kept] of this.#jobs) {
      if (this.#jobs.size < this.#options.maxKept) break;
      if (finished(kept.record.status)) this.#drop(id);
    }
    if (this.#jobs.size >= this.#options.maxKept) {
      throw new QueueUnavailableError(`the in-process queue holds ${this.#jobs.size} unfinished jobs (JOBS_MAX_KEPT ${this.#options.maxKept}); retry after ${RETRY_AFTER_S} s`, RETRY_AFTER_S);
    }
    if (!this.#makeRoom(itemBytes)) {
      throw new QueueUnavailableError(`the in-process queue holds as many bytes of jobs and results as it may (JOBS_MAX_BYTES); retry after ${RETRY_AFTER_S} s, when finished jobs have been read and expire`, RETRY_AFTER_S);
    }
    const id = randomUUID();
    const record: JobRecord = {
      id,
      label: job.label ?? null,
      status: 'queued',
      items: job.items.length,
      done: 0,
      failed: 0,
      attempts: 0,
      createdAt: new Date(this.#now()).toISOString(),
      startedAt: null,
      finishedAt: null,
      error: null,
      owner: job.owner ?? null,
      deadline: job.deadlineMs === undefined ? null : new Date(job.deadlineMs).toISOString(),
      compareTo: job.compareTo ?? null,
      fingerprint: job.fingerprint ?? null,
      seq: ++this.#seq,
      callbackUrl: job.callbackUrl ?? null,
    };
    const idempotency = job.idempotencyKey === undefined ? undefined : idempotencySlot(job.owner, job.idempotencyKey);
    this.#jobs.set(id, { record, items: job.items, lines: [], touchedMs: this.#now(), deadlineMs: job.deadlineMs, idempotency, abort: new AbortController(), bytes: itemBytes });
    this.#bytes += itemBytes;
    if (idempotency !== undefined) this.#idempotent.set(idempotency, id);
    this.#waiting.push(id);
    this.#pump();
    return record;
  }

  async get(id: string): Promise<JobRecord | undefined> {
    this.#prune();
    return JOB_ID_PATTERN.test(id) ? this.#jobs.get(id)?.record : undefined;
  }

  async list(owner: string | null, limit: number, cursor?: string): Promise<JobPage> {
    this.#prune();
    const before = cursor === undefined ? Infinity : Number(cursor);
    const mine = [...this.#jobs.values()].map((j) => j.record).filter((r) => r.owner === owner && r.seq < before).reverse();
    const jobs = mine.slice(0, limit);
    return { jobs, next: mine.length > limit ? String(jobs.at(-1)!.seq) : null };
  }

  async cancel(id: string): Promise<JobRecord | undefined> {
    const job = JOB_ID_PATTERN.test(id) ? this.#jobs.get(id) : undefined;
    if (!job || finished(job.record.status)) return job?.record;
    const at = this.#waiting.indexOf(id);
    if (at >= 0) {
      this.#waiting.splice(at, 1);
      this.#release(job, Buffer.byteLength(JSON.stringify(job.items)));
      job.items = undefined;
      job.record = { ...job.record, status: 'cancelled', finishedAt: new Date(this.#now()).toISOString(), error: CANCELLED_REASON };
      job.touchedMs = this.#now();
      this.#events?.finished?.(job.record);
    } else {
      job.abort.abort(); // #runJob marks it cancelled when the items in hand are done
      await this.#running;
    }
    return job.record;
  }

  async *results(id: string): AsyncGenerator<Buffer> {
    const job = this.#jobs.get(id);
    if (!job) return;
    // The array only grows, and only while running: a finished job's lines are fixed.
    for (const line of job.lines) yield line;
  }

  async ping(): Promise<void> {
    if (this.#abort.signal.aborted) throw new QueueUnavailableError('the in-process queue is stopping', RETRY_AFTER_S);
  }

  async line(id: string, index: number): Promise<Buffer | undefined> {
    return this.#jobs.get(id)?.lines[index];
  }

  async counts(): Promise<JobCounts> {
    const c = { queued: 0, active: 0, completed: 0, failed: 0 };
    for (const { record } of this.#jobs.values()) {
      if (record.status === 'queued') c.queued++;
      else if (record.status === 'running') c.active++;
      else if (record.status === 'done') c.completed++;
      else c.failed++;
    }
    return c;
  }

  watch(events: JobEvents): void {
    this.#events = events;
  }

  async stop(): Promise<void> {
    this.#abort.abort();
    await this.#running;
  }

  async close(): Promise<void> {
    await this.stop();
  }

  #drop(id: string): void {
    const job = this.#jobs.get(id);
    if (job?.idempotency !== undefined) this.#idempotent.delete(job.idempotency);
    if (job) this.#bytes -= job.bytes;
    this.#jobs.delete(id);
  }

  #release(job: MemoryJob, bytes: number): void {
    job.bytes -= bytes;
    this.#bytes -= bytes;
  }

  /** Bytes held by all kept jobs (items waiting and lines). */
  get bytes(): number {
    return this.#bytes;
  }

  /** Drop the oldest finished jobs until `more` bytes fit under maxBytes; false when they cannot. */
  #makeRoom(more: number): boolean {
    const max = this.#options.maxBytes ?? Infinity;
    for (const [id, kept] of this.#jobs) {
      if (this.#bytes + more <= max) break;
      if (finished(kept.record.status)) this.#drop(id);
    }
    return this.#bytes + more <= max;
  }

  /** Drop finished jobs past their time to live. */
  #prune(): void {
    const oldest = this.#now() - this.#options.ttlS * 1000;
    for (const [id, job] of this.#jobs) if (finished(job.record.status) && job.touchedMs < oldest) this.#drop(id);
  }

  /** Start the next waiting job unless one is running. */
  #pump(): void {
    if (this.#running || this.#abort.signal.aborted) return;
    const id = this.#waiting.shift();
    if (id === undefined) return;
    this.#running = this.#runJob(id).finally(() => {
      this.#running = undefined;
      this.#pump();
    });
  }

  async #runJob(id: string): Promise<void> {
    const job = this.#jobs.get(id);
    if (!job?.items) return;
    const iso = () => new Date(this.#now()).toISOString();
    const update = (change: Partial<JobRecord>) => {
      job.record = { ...job.record, ...change };
      job.touchedMs = this.#now();
    };
    const pastDeadline = () => job.deadlineMs !== undefined && this.#now() > job.deadlineMs;
    update({ status: 'running', startedAt: iso(), attempts: 1 });
    // Stops on shutdown, on cancel, and at the deadline (checked before each line is kept).
    const stop = AbortSignal.any([this.#abort.signal, job.abort.signal]);
    const deadline = new AbortController();
    const signal = AbortSignal.any([stop, deadline.signal]);
    const timer = job.deadlineMs === undefined ? undefined : setTimeout(() => deadline.abort(), Math.max(0, job.deadlineMs - this.#now()));
    const itemBytes = Buffer.byteLength(JSON.stringify(job.items));
    let tooBig = false;
    try {
      if (!pastDeadline()) {
        for await (const out of this.#run({ id, items: job.items, owner: job.record.owner }, 0, signal)) {
          if (pastDeadline()) { deadline.abort(); break; }
          if (!this.#makeRoom(out.line.length)) { tooBig = true; break; }
          job.lines.push(out.line);
          job.bytes += out.line.length;
          this.#bytes += out.line.length;
          update({ done: job.record.done + 1, failed: job.record.failed + (out.failed ? 1 : 0) });
        }
      }
      const { done, items } = job.record;
      if (done === items) {
        update({ status: 'done', finishedAt: iso() });
        this.#events?.done((Date.parse(job.record.finishedAt!) - Date.parse(job.record.startedAt!)) / 1000);
      }
      else if (tooBig) update({ status: 'failed', finishedAt: iso(), error: `its results passed the bytes the in-process queue may hold (JOBS_MAX_BYTES) after ${done} of ${items} items; split the job, or run the service with REDIS_URL` });
      else if (job.abort.signal.aborted) update({ status: 'cancelled', finishedAt: iso(), error: CANCELLED_REASON });
      else if (deadline.signal.aborted || pastDeadline()) update({ status: 'failed', finishedAt: iso(), error: deadlineReason(job.record.deadline!, done, items) });
      else update({ status: 'failed', finishedAt: iso(), error: `the service stopped after ${done} of ${items} items; the in-process queue does not keep jobs across restarts: submit it again` });
    } catch (error) {
      update({ status: 'failed', finishedAt: iso(), error: `the job stopped: ${error instanceof Error ? error.message : String(error)}` });
    } finally {
      clearTimeout(timer);
      job.items = undefined;
      if (this.#jobs.get(id) === job) this.#release(job, itemBytes);
    }
    this.#events?.finished?.(job.record);
  }
}
