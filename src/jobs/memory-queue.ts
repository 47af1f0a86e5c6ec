// The in-process job queue (default, no REDIS_URL): jobs run one at a time in this process and
// their lines are kept in memory. At most `maxKept` jobs are kept (JOBS_MAX_KEPT): a new job drops
// the oldest finished ones first, and when every kept job is unfinished the new one is refused.
// Finished jobs are also dropped `ttlS` (JOB_RESULT_TTL_S) after their last progress. Nothing
// survives a restart: a job running when the service stops is marked failed; use Redis to keep jobs.
import { randomUUID } from 'node:crypto';
import type { BatchItem, JobStatus } from '../schemas/batch.js';
import { JOB_ID_PATTERN, QueueUnavailableError, type JobQueue, type JobRecord, type NewJob, type RunLines } from './queue.js';

export interface MemoryQueueOptions {
  /** Jobs kept, finished or not (>= 1). */
  readonly maxKept: number;
  /** Seconds a finished job is kept after its last progress. */
  readonly ttlS: number;
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
}

const finished = (status: JobStatus) => status === 'done' || status === 'failed';

export class MemoryJobQueue implements JobQueue {
  readonly #run: RunLines;
  readonly #options: MemoryQueueOptions;
  readonly #now: () => number;
  /** Insertion order is submission order: the first finished job met is the oldest. */
  readonly #jobs = new Map<string, MemoryJob>();
  readonly #waiting: string[] = [];
  readonly #abort = new AbortController();
  #running: Promise<void> | undefined;

  constructor(run: RunLines, options: MemoryQueueOptions) {
    if (!Number.isInteger(options.maxKept) || options.maxKept < 1) throw new RangeError('maxKept must be an integer >= 1');
    this.#run = run;
    this.#options = options;
    this.#now = options.now ?? Date.now;
  }

  async enqueue(job: NewJob): Promise<JobRecord> {
    if (this.#abort.signal.aborted) throw new QueueUnavailableError('the service is stopping and takes no new jobs', RETRY_AFTER_S);
    this.#prune();
    for (const [id, kept] of this.#jobs) {
      if (this.#jobs.size < this.#options.maxKept) break;
      if (finished(kept.record.status)) this.#jobs.delete(id);
    }
    if (this.#jobs.size >= this.#options.maxKept) {
      throw new QueueUnavailableError(`the in-process queue holds ${this.#jobs.size} unfinished jobs (JOBS_MAX_KEPT ${this.#options.maxKept}); retry after ${RETRY_AFTER_S} s`, RETRY_AFTER_S);
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
    };
    this.#jobs.set(id, { record, items: job.items, lines: [], touchedMs: this.#now() });
    this.#waiting.push(id);
    this.#pump();
    return record;
  }

  async get(id: string): Promise<JobRecord | undefined> {
    this.#prune();
    return JOB_ID_PATTERN.test(id) ? this.#jobs.get(id)?.record : undefined;
  }

  async *results(id: string): AsyncGenerator<Buffer> {
    const job = this.#jobs.get(id);
    if (!job) return;
    // The array only grows, and only while running: a done job's lines are fixed.
    for (const line of job.lines) yield line;
  }

  async ping(): Promise<void> {
    if (this.#abort.signal.aborted) throw new QueueUnavailableError('the in-process queue is stopping', RETRY_AFTER_S);
  }

  async stop(): Promise<void> {
    this.#abort.abort();
    await this.#running;
  }

  async close(): Promise<void> {
    await this.stop();
  }

  /** Drop finished jobs past their time to live. */
  #prune(): void {
    const oldest = this.#now() - this.#options.ttlS * 1000;
    for (const [id, job] of this.#jobs) if (finished(job.record.status) && job.touchedMs < oldest) this.#jobs.delete(id);
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
    update({ status: 'running', startedAt: iso(), attempts: 1 });
    const signal = this.#abort.signal;
    try {
      for await (const out of this.#run({ id, items: job.items }, 0, signal)) {
        job.lines.push(out.line);
        update({ done: job.record.done + 1, failed: job.record.failed + (out.failed ? 1 : 0) });
      }
      if (job.record.done < job.record.items) {
        update({ status: 'failed', finishedAt: iso(), error: `the service stopped after ${job.record.done} of ${job.record.items} items; the in-process queue does not keep jobs across restarts: submit it again` });
      } else {
        update({ status: 'done', finishedAt: iso() });
      }
    } catch (error) {
      update({ status: 'failed', finishedAt: iso(), error: `the job stopped: ${error instanceof Error ? error.message : String(error)}` });
    } finally {
      job.items = undefined;
    }
  }
}
