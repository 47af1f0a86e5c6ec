// The job queue on BullMQ (REDIS_URL set): API replicas only enqueue and read (BullJobQueue);
// separate worker processes (src/queue-worker.ts, BullJobWorker) take jobs, run their items and
// store the lines. One BullMQ job per API job (see DEVELOPERS.md for why not a flow of item jobs).
//
// BullMQ does the queueing: the lock a worker holds on the job it runs (renewed every half lock
// duration), stall detection (a job whose lock lapsed goes back to wait; past maxStalledCount it
// fails), retries with exponential backoff, retention (removeOnComplete / removeOnFail by age) and
// the event stream dashboards read. Keys under P (JOB_KEY_PREFIX), besides BullMQ's own under
// `P bull:jobs:`:
//   P job:{id}:items   the items, JSON (deleted once the job finishes)
//   P job:{id}:lines   list of the NDJSON lines written so far, in input order
//   P job:{id}:meta    hash: failed (lines with a problem), bytes (sum of line bytes), startedAt
//   P job:{id}:cancel  present once the caller cancelled the job
//   P owner:{o}        sorted set of the owner's job ids by submission sequence (GET /v1/jobs)
//   P idem:{sha}       the job id stored under an (owner, Idempotency-Key)
//   P seq              submission sequence
// Our keys expire JOB_RESULT_TTL_S after submission or the last line written.
//
// A line is appended by a script that checks that the caller still holds the BullMQ lock of the
// job (its token) and that the line's index is the next one: a worker that lost the job (presumed
// dead, and the job taken over) can never write into it, and no line is ever written twice. A
// worker that takes the job (first time, retry or after a stall) resumes after the lines stored.
// A worker that stops on a signal moves its job back to the front of the wait list at once.
import { createHash, randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import { Queue, QueueEvents, UnrecoverableError, WaitingError, Worker, type Job } from 'bullmq';
import { Redis } from 'ioredis';
import { z } from 'zod';
import type { JobCounts } from '../plugins/metrics.js';
import { BatchItem, type JobStatus } from '../schemas/batch.js';
import {
  CANCELLED_REASON, deadlineReason, JOB_ID_PATTERN, QueueUnavailableError,
  type JobEvents, type JobPage, type JobQueue, type JobRecord, type NewJob, type RunLines,
} from './queue.js';

/** Seconds a refused client is asked to wait when Redis does not answer. */
export const QUEUE_RETRY_AFTER_S = 5;
/** The BullMQ queue's name (dashboards: prefix `${JOB_KEY_PREFIX}bull`, queue `jobs`). */
export const QUEUE_NAME = 'jobs';

export const bullPrefix = (prefix: string) => `${prefix}bull`;

/** What a BullMQ job carries (the items are stored beside it, so reading a status stays small). */
const JobData = z.object({
  label: z.string().nullable(),
  owner: z.string().nullable(),
  items: z.number().int(),
  deadlineMs: z.number().nullable(),
  compareTo: z.object({ job: z.string(), thresholdSeconds: z.number(), thresholdDegrees: z.number() }).nullable(),
  fingerprint: z.string().nullable(),
  seq: z.number().int(),
  callbackUrl: z.string().nullable().default(null),
});
type JobData = z.output<typeof JobData>;

export class Keys {
  constructor(readonly prefix: string) {}
  readonly items = (id: string) => `${this.prefix}job:${id}:items`;
  readonly lines = (id: string) => `${this.prefix}job:${id}:lines`;
  readonly meta = (id: string) => `${this.prefix}job:${id}:meta`;
  readonly cancel = (id: string) => `${this.prefix}job:${id}:cancel`;
  readonly owner = (owner: string | null) => `${this.prefix}owner:${owner === null ? '-' : createHash('sha256').update(owner).digest('hex')}`;
  readonly idempotency = (owner: string | null, key: string) => `${this.prefix}idem:${createHash('sha256').update(`${owner ?? ''}\u0000${key}`).digest('hex')}`;
  readonly seq = () => `${this.prefix}seq`;
  /** BullMQ's lock key of a job: holds the token of the worker running it. */
  readonly lock = (id: string) => `${bullPrefix(this.prefix)}:${QUEUE_NAME}:${id}:lock`;
}

/** KEYS lock, lines, meta, cancel; ARGV token, index, line, failed (1|0), ttl -> 1, or -1 lock not held, -2 wrong index, -3 cancelled. */
const APPEND = `
if redis.call('GET', KEYS[1]) ~= ARGV[1] then return -1 end
if redis.call('EXISTS', KEYS[4]) == 1 then return -3 end
if redis.call('LLEN', KEYS[2]) ~= tonumber(ARGV[2]) then return -2 end
redis.call('RPUSH', KEYS[2], ARGV[3])
if ARGV[4] == '1' then redis.call('HINCRBY', KEYS[3], 'failed', 1) end
redis.call('HINCRBY', KEYS[3], 'bytes', string.len(ARGV[3]))
redis.call('EXPIRE', KEYS[2], ARGV[5]) redis.call('EXPIRE', KEYS[3], ARGV[5])
return 1
`;

const unavailable = (error: unknown) =>
  new QueueUnavailableError(`the job queue's Redis does not answer; retry after ${QUEUE_RETRY_AFTER_S} s`, QUEUE_RETRY_AFTER_S, { cause: error });

/** Reject after `ms` (a command waiting for a Redis that is down must not hang the request). */
async function within<T>(ms: number, work: Promise<T>): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => { timer = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms); });
  try {
    return await Promise.race([work, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

const iso = (ms: number | undefined) => (ms ? new Date(ms).toISOString() : null);

function statusOf(state: string, failedReason: string | undefined, cancelled: boolean): JobStatus {
  if (state === 'completed') return 'done';
  if (state === 'failed') return failedReason === CANCELLED_REASON ? 'cancelled' : 'failed';
  if (cancelled) return 'cancelled';
  return state === 'active' ? 'running' : 'queued';
}

export interface BullQueueOptions {
  /** Key prefix (JOB_KEY_PREFIX). */
  readonly prefix: string;
  /** Seconds job keys are kept after submission or the last progress (JOB_RESULT_TTL_S). */
  readonly ttlS: number;
  /** Times a job is tried when its run throws (not for item problems, which are lines): JOB_ATTEMPTS. */
  readonly attempts: number;
  /** First retry delay, doubled each retry: JOB_BACKOFF_MS. */
  readonly backoffMs: number;
  /** Per-operation timeout, ms (default 2000): past it the request answers 503 queue-unavailable. */
  readonly commandTimeoutMs?: number;
}

/** The API side: store and queue jobs, read their status and lines. Never runs a job. */
export class BullJobQueue implements JobQueue {
  readonly #redis: Redis;
  readonly #queue: Queue;
  readonly #keys: Keys;
  readonly #opts: BullQueueOptions;
  readonly #timeoutMs: number;
  #events: QueueEvents | undefined;
  #eventsRedis: Redis | undefined;
  readonly #url: string;

  constructor(url: string, options: BullQueueOptions) {
    this.#url = url;
    this.#keys = new Keys(options.prefix);
    this.#opts = options;
    this.#timeoutMs = options.commandTimeoutMs ?? 2000;
    // Commands fail (503) instead of piling up while Redis is down.
    this.#redis = new Redis(url, { maxRetriesPerRequest: 0, commandTimeout: this.#timeoutMs, connectTimeout: 2000 });
    this.#redis.on('error', () => {}); // reported to the caller as 503 on each command
    this.#queue = new Queue(QUEUE_NAME, { connection: this.#redis, prefix: bullPrefix(options.prefix) });
    this.#queue.on('error', () => {});
  }

  /** The BullMQ queue (metrics read its counts and events). */
  get bull(): Queue { return this.#queue; }

  async #guard<T>(work: () => Promise<T>): Promise<T> {
    try {
      return await within(this.#timeoutMs, work());
    } catch (error) {
      throw error instanceof QueueUnavailableError ? error : unavailable(error);
    }
  }

  async enqueue(job: NewJob): Promise<JobRecord> {
    const owner = job.owner ?? null;
    const k = this.#keys;
    const ttl = this.#opts.ttlS;
    return this.#guard(async () => {
      const id = randomUUID();
      if (job.idempotencyKey !== undefined) {
        const slot = k.idempotency(owner, job.idempotencyKey);
        // The first request with the key claims it; another one answers the job stored under it.
        for (let tries = 0; tries < 20; tries++) {
          if (await this.#redis.set(slot, id, 'EX', ttl, 'NX')) break;
          const earlier = await this.#redis.get(slot);
          const record = earlier === null ? undefined : await this.#read(earlier);
          if (record) return record;
          await new Promise((resolve) => setTimeout(resolve, 25)); // being stored by the first request
        }
      }
      const seq = await this.#redis.incr(k.seq());
      const data: JobData = {
        label: job.label ?? null, owner, items: job.items.length, deadlineMs: job.deadlineMs ?? null,
        compareTo: job.compareTo ?? null, fingerprint: job.fingerprint ?? null, seq, callbackUrl: job.callbackUrl ?? null,
      };
      const stored = await this.#redis.multi()
        .set(k.items(id), JSON.stringify(job.items), 'EX', ttl)
        .hset(k.meta(id), { failed: 0, bytes: 0 })
        .expire(k.meta(id), ttl)
        .zadd(k.owner(owner), seq, id)
        .expire(k.owner(owner), ttl)
        .exec();
      const failed = stored?.find(([error]) => error);
      if (!stored || failed) throw failed?.[0] ?? new Error('transaction aborted');
      const added = await this.#queue.add('job', data, {
        jobId: id,
        attempts: this.#opts.attempts,
        backoff: { type: 'exponential', delay: this.#opts.backoffMs },
        removeOnComplete: { age: ttl },
        removeOnFail: { age: ttl },
      });
      return this.#toRecord(added, 'waiting', 0, {}, false);
    });
  }

  async get(id: string): Promise<JobRecord | undefined> {
    if (!JOB_ID_PATTERN.test(id)) return undefined;
    return this.#guard(() => this.#read(id));
  }

  async #read(id: string): Promise<JobRecord | undefined> {
    const job = await this.#queue.getJob(id);
    if (!job) return undefined;
    const k = this.#keys;
    const [state, read] = await Promise.all([
      job.getState(),
      this.#redis.multi().llen(k.lines(id)).hgetall(k.meta(id)).exists(k.cancel(id)).exec(),
    ]);
    if (state === 'unknown') return undefined;
    const [[, done], [, meta], [, cancelled]] = read as [[null, number], [null, Record<string, string>], [null, number]];
    return this.#toRecord(job, state, done, meta, cancelled === 1);
  }

  #toRecord(job: Job, state: string, done: number, meta: Record<string, string>, cancelled: boolean): JobRecord {
    const data = JobData.parse(job.data);
    return {
      id: job.id!,
      label: data.label,
      status: statusOf(state, job.failedReason, cancelled),
      items: data.items,
      done,
      failed: Number(meta.failed ?? 0),
      attempts: job.attemptsStarted ?? 0,
      createdAt: new Date(job.timestamp).toISOString(),
      startedAt: meta.startedAt ?? null,
      finishedAt: state === 'completed' || state === 'failed' ? iso(job.finishedOn) : null,
      error: state === 'failed' ? (job.failedReason || 'no reason recorded') : cancelled ? CANCELLED_REASON : null,
      owner: data.owner,
      deadline: data.deadlineMs === null ? null : new Date(data.deadlineMs).toISOString(),
      compareTo: data.compareTo,
      fingerprint: data.fingerprint,
      seq: data.seq,
      callbackUrl: data.callbackUrl,
    };
  }

  async list(owner: string | null, limit: number, cursor?: string): Promise<JobPage> {
    const key = this.#keys.owner(owner);
    return this.#guard(async () => {
      const jobs: JobRecord[] = [];
      let max = cursor === undefined ? '+inf' : `(${Number(cursor)}`;
      for (;;) {
        const ids = await this.#redis.zrevrangebyscore(key, max, '-inf', 'LIMIT', 0, limit + 1 - jobs.length);
        if (ids.length === 0) return { jobs, next: null };
        for (const id of ids) {
          const record = await this.#read(id);
          if (!record) { await this.#redis.zrem(key, id); continue; } // expired
          if (jobs.length === limit) return { jobs, next: String(jobs.at(-1)!.seq) };
          jobs.push(record);
        }
        const last = await this.#redis.zscore(key, ids.at(-1)!);
        if (last === null) return { jobs, next: null };
        max = `(${last}`;
      }
    });
  }

  async cancel(id: string): Promise<JobRecord | undefined> {
    if (!JOB_ID_PATTERN.test(id)) return undefined;
    return this.#guard(async () => {
      const record = await this.#read(id);
      if (!record || record.status === 'done' || record.status === 'failed' || record.status === 'cancelled') return record;
      // The worker sees the mark before its next line (or when it takes the job) and fails the job with CANCELLED_REASON.
      await this.#redis.set(this.#keys.cancel(id), '1', 'EX', this.#opts.ttlS);
      return this.#read(id);
    });
  }

  async *results(id: string, pageSize = 256): AsyncGenerator<Buffer> {
    const key = this.#keys.lines(id);
    for (let start = 0; ; start += pageSize) {
      const page = await this.#redis.lrangeBuffer(key, start, start + pageSize - 1);
      yield* page;
      if (page.length < pageSize) return;
    }
  }

  async line(id: string, index: number): Promise<Buffer | undefined> {
    return this.#guard(async () => (await this.#redis.lindexBuffer(this.#keys.lines(id), index)) ?? undefined);
  }

  async counts(): Promise<JobCounts> {
    return this.#guard(async () => {
      const c = await this.#queue.getJobCounts('waiting', 'delayed', 'prioritized', 'active', 'completed', 'failed');
      return { queued: (c.waiting ?? 0) + (c.delayed ?? 0) + (c.prioritized ?? 0), active: c.active ?? 0, completed: c.completed ?? 0, failed: c.failed ?? 0 };
    });
  }

  /** BullMQ's event stream (a connection of its own): every replica sees every worker's events. */
  watch(events: JobEvents): void {
    this.#eventsRedis ??= new Redis(this.#url, { maxRetriesPerRequest: null });
    this.#eventsRedis.on('error', () => {});
    this.#events ??= new QueueEvents(QUEUE_NAME, { connection: this.#eventsRedis, prefix: bullPrefix(this.#opts.prefix) });
    this.#events.on('error', () => {});
    this.#events.on('stalled', () => events.stalled());
    this.#events.on('completed', ({ returnvalue }) => {
      const durationS = Number((returnvalue as unknown as { durationS?: unknown } | null)?.durationS);
      if (Number.isFinite(durationS)) events.done(durationS);
    });
  }

  async ping(): Promise<void> {
    await this.#guard(() => this.#redis.ping());
  }

  async stop(): Promise<void> {}

  async close(): Promise<void> {
    // Bounded: closing waits for pending commands, which never answer while Redis is down.
    await within(this.#timeoutMs, Promise.all([this.#events?.close(), this.#queue.close()])).catch(() => {});
    this.#eventsRedis?.disconnect();
    this.#redis.disconnect();
  }
}

/** What the worker reports (pino's signature; app.log fits). */
export interface WorkerLog {
  info(obj: object, msg: string): void;
  warn(obj: object, msg: string): void;
  error(obj: object, msg: string): void;
}

const silent: WorkerLog = { info() {}, warn() {}, error() {} };

export interface BullWorkerOptions {
  readonly prefix: string;
  readonly ttlS: number;
  /** BullMQ lockDuration, ms (JOB_LOCK_MS): a job whose lock is not renewed for this long counts as stalled. */
  readonly lockDurationMs: number;
  /** BullMQ stalledInterval, ms (JOB_STALLED_INTERVAL_MS): how often this worker looks for stalled jobs. */
  readonly stalledIntervalMs: number;
  /** BullMQ maxStalledCount (JOB_MAX_STALLED): stalls a job survives; one more and it fails. */
  readonly maxStalledCount: number;
  /** Stored on each job it takes (BullMQ processedBy; dashboards show it). Default host-pid. */
  readonly name?: string;
  /** Seconds one blocking wait for a job lasts (BullMQ drainDelay, default 2). */
  readonly drainDelayS?: number;
  readonly log?: WorkerLog;
  /** Called once a job this worker ran (or failed) is done, failed or cancelled for good (completion callbacks). */
  readonly onFinished?: (id: string) => void;
}

const StoredItems = z.array(BatchItem);

/** A queue worker: one job at a time, its items run with `run`, the lines stored under the job's lock. */
export class BullJobWorker {
  readonly #keys: Keys;
  readonly #run: RunLines;
  readonly #opts: BullWorkerOptions;
  readonly #log: WorkerLog;
  readonly #redis: Redis;
  readonly #worker: Worker;
  readonly #stopping = new AbortController();

  constructor(url: string, run: RunLines, options: BullWorkerOptions) {
    this.#keys = new Keys(options.prefix);
    this.#run = run;
    this.#opts = options;
    this.#log = options.log ?? silent;
    this.#redis = new Redis(url, { maxRetriesPerRequest: null });
    this.#redis.on('error', (error) => this.#log.warn({ err: error }, 'queue worker: Redis connection error'));
    this.#worker = new Worker(QUEUE_NAME, (job, token, signal) => this.#process(job, token!, signal), {
      connection: new Redis(url, { maxRetriesPerRequest: null }),
      prefix: bullPrefix(options.prefix),
      name: options.name ?? `${hostname()}-${process.pid}`,
      autorun: false,
      concurrency: 1,
      lockDuration: options.lockDurationMs,
      stalledInterval: options.stalledIntervalMs,
      maxStalledCount: options.maxStalledCount,
      drainDelay: options.drainDelayS ?? 2,
    });
    this.#worker.on('error', (error) => this.#log.warn({ err: error }, 'queue worker: BullMQ error'));
    this.#worker.on('failed', (job, error) => {
      this.#log.warn({ job: job?.id, err: error.message }, 'queue worker: job failed');
      // A failure that will be retried leaves the job delayed or waiting; only a final one is reported.
      if (job?.id && options.onFinished) void job.getState().then((state) => { if (state === 'failed') options.onFinished!(job.id!); }, () => {});
    });
    this.#worker.on('completed', (job) => { if (job.id) options.onFinished?.(job.id); });
  }

  get id(): string { return this.#worker.id; }

  /** The BullMQ worker (events for tests and metrics). */
  get bull(): Worker { return this.#worker; }

  /** Take and run jobs until stop(). */
  run(): Promise<void> {
    return this.#worker.run();
  }

  /** Stop: the job in hand stops after the items being solved and goes back to the front of the queue. */
  async stop(): Promise<void> {
    this.#stopping.abort();
    await this.#worker.close();
    this.#redis.disconnect();
  }

  async #process(job: Job, token: string, lost: AbortSignal | undefined): Promise<{ done: number; failed: number; durationS: number }> {
    const k = this.#keys;
    const id = job.id!;
    const data = JobData.parse(job.data);
    const deadline = data.deadlineMs === null ? null : new Date(data.deadlineMs).toISOString();
    const [[, itemsText], [, done], [, cancelled]] = (await this.#redis.multi().get(k.items(id)).llen(k.lines(id)).exists(k.cancel(id)).exec()) as
      [[null, string | null], [null, number], [null, number]];
    if (cancelled === 1) throw new UnrecoverableError(CANCELLED_REASON);
    if (data.deadlineMs !== null && Date.now() > data.deadlineMs) throw new UnrecoverableError(deadlineReason(deadline!, done, data.items));
    const parsed = StoredItems.safeParse(itemsText === null ? undefined : JSON.parse(itemsText));
    if (!parsed.success) throw new UnrecoverableError('the stored items are missing or unreadable');
    await this.#redis.hsetnx(k.meta(id), 'startedAt', new Date().toISOString());
    this.#log.info({ worker: this.id, job: id, from: done, items: parsed.data.length, attempt: job.attemptsStarted }, 'queue worker: running job');

    const pastDeadline = new AbortController();
    const timer = data.deadlineMs === null ? undefined : setTimeout(() => pastDeadline.abort(), Math.max(0, data.deadlineMs - Date.now()));
    const signal = AbortSignal.any([this.#stopping.signal, pastDeadline.signal, ...(lost ? [lost] : [])]);
    let index = done;
    let reported = Date.now();
    try {
      for await (const out of this.#run({ id, items: parsed.data, owner: data.owner }, done, signal)) {
        const written = Number(await this.#redis.eval(APPEND, 4, k.lock(id), k.lines(id), k.meta(id), k.cancel(id),
          token, index, out.line, out.failed ? '1' : '0', this.#opts.ttlS));
        if (written === -3) throw new UnrecoverableError(CANCELLED_REASON);
        if (written === -1) throw new Error(`worker ${this.id} no longer holds the lock of job ${id} (taken over after a stall); it stops without writing`);
        if (written !== 1) throw new Error(`line ${index} of job ${id} is not the next one to write`);
        index++;
        if (Date.now() - reported > 1000) {
          reported = Date.now();
          void job.updateProgress({ done: index, items: data.items }).catch(() => {});
        }
      }
      if (this.#stopping.signal.aborted && index < data.items) {
        // Stopping on a signal: back to the front of the wait list now, not after the lock lapses.
        await job.moveToWait(token);
        this.#log.info({ worker: this.id, job: id, done: index }, 'queue worker: handed its job back to the queue');
        throw new WaitingError();
      }
      if (pastDeadline.signal.aborted && index < data.items) throw new UnrecoverableError(deadlineReason(deadline!, index, data.items));
      if (index < data.items) throw new Error(`job ${id} stopped after ${index} of ${data.items} items (lock lost)`);
      await this.#redis.multi().del(k.items(id)).expire(k.lines(id), this.#opts.ttlS).expire(k.meta(id), this.#opts.ttlS).exec();
      const meta = await this.#redis.hgetall(k.meta(id));
      const durationS = (Date.now() - Date.parse(meta.startedAt ?? '')) / 1000;
      this.#log.info({ worker: this.id, job: id, durationS }, 'queue worker: job done');
      return { done: index, failed: Number(meta.failed ?? 0), durationS };
    } finally {
      clearTimeout(timer);
    }
  }
}
