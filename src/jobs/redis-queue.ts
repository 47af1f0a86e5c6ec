// The Redis job queue (REDIS_URL set): API replicas only enqueue and read (RedisJobQueue); separate
// worker processes (src/queue-worker.ts, RedisJobWorker) take jobs, run their items and store the lines.
//
// Keys, all under the prefix P (JOB_KEY_PREFIX):
//   P queue                 list of job ids waiting (LPUSH in, taken from the right: first in, first out)
//   P job:{id}              hash: status, counts, timestamps, attempts, owner (the worker attempt running it),
//                           submitter (JobRecord.owner: the caller that submitted the job; absent when open)
//   P job:{id}:items        the items, JSON (deleted once the job finishes)
//   P job:{id}:lines        list of the NDJSON lines written so far, in input order
//   P workers               set of worker ids
//   P worker:{w}            heartbeat of worker w, expires after heartbeatTtlS unless refreshed
//   P processing:{w}        list of the job ids worker w has taken (normally at most one)
// Job keys expire JOB_RESULT_TTL_S after submission or the last line written.
//
// Taking a job is BLMOVE queue -> processing:{w}, so a job is always in exactly one list. Recovery:
// when a worker's heartbeat key has expired (the process died or hung), any other worker moves
// the ids in its processing list back to the front of the queue and marks them queued; the next
// worker resumes each job after the lines already stored (nothing stored is lost). Lines are
// appended by a script that checks the job's owner and the line index, so a worker that was
// presumed dead but comes back can never write into a job that another worker now runs, and no
// line is ever written twice. A job taken more than maxAttempts times is failed ("abandoned").
// A worker that stops on a signal hands its job back at once instead of waiting for recovery.
import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import { setTimeout as sleep } from 'node:timers/promises';
import { Redis } from 'ioredis';
import { z } from 'zod';
import { BatchItem, type JobStatus } from '../schemas/batch.js';
import { JOB_ID_PATTERN, QueueUnavailableError, type JobQueue, type JobRecord, type NewJob, type RunLines } from './queue.js';

/** Seconds a refused client is asked to wait when Redis does not answer. */
export const QUEUE_RETRY_AFTER_S = 5;

class Keys {
  constructor(readonly prefix: string) {}
  readonly queue = () => `${this.prefix}queue`;
  readonly workers = () => `${this.prefix}workers`;
  readonly job = (id: string) => `${this.prefix}job:${id}`;
  readonly items = (id: string) => `${this.prefix}job:${id}:items`;
  readonly lines = (id: string) => `${this.prefix}job:${id}:lines`;
  readonly heartbeat = (worker: string) => `${this.prefix}worker:${worker}`;
  readonly processing = (worker: string) => `${this.prefix}processing:${worker}`;
}

// Scripts run atomically in Redis (Lua). Job keys are named from the prefix inside REQUEUE: a
// single Redis, not a cluster.

/** KEYS job, processing, lines, items; ARGV id, owner, now, maxAttempts, ttl, workerId -> {state, linesStored}. */
const CLAIM = `
if redis.call('EXISTS', KEYS[1]) == 0 then redis.call('LREM', KEYS[2], 0, ARGV[1]) return {'gone', 0} end
local status = redis.call('HGET', KEYS[1], 'status')
if status == 'done' or status == 'failed' then redis.call('LREM', KEYS[2], 0, ARGV[1]) return {status, 0} end
local owner = redis.call('HGET', KEYS[1], 'owner')
if status == 'running' and owner and string.sub(owner, 1, #ARGV[6] + 1) ~= ARGV[6] .. '#' then
  redis.call('LREM', KEYS[2], 0, ARGV[1]) return {'busy', 0}
end
local attempts = redis.call('HINCRBY', KEYS[1], 'attempts', 1)
if attempts > tonumber(ARGV[4]) then
  redis.call('HSET', KEYS[1], 'status', 'failed', 'finishedAt', ARGV[3], 'error',
    'abandoned after ' .. ARGV[4] .. ' attempts: each worker that took the job stopped before it finished')
  redis.call('HDEL', KEYS[1], 'owner')
  redis.call('DEL', KEYS[4])
  redis.call('LREM', KEYS[2], 0, ARGV[1])
  return {'abandoned', 0}
end
redis.call('HSET', KEYS[1], 'status', 'running', 'owner', ARGV[2])
redis.call('HSETNX', KEYS[1], 'startedAt', ARGV[3])
redis.call('EXPIRE', KEYS[1], ARGV[5]) redis.call('EXPIRE', KEYS[3], ARGV[5]) redis.call('EXPIRE', KEYS[4], ARGV[5])
return {'ok', redis.call('LLEN', KEYS[3])}
`;

/** KEYS job, lines, items; ARGV owner, index, line, failed (1|0), ttl -> 1, or -1 not the owner, -2 wrong index. */
const APPEND = `
if redis.call('HGET', KEYS[1], 'owner') ~= ARGV[1] then return -1 end
if redis.call('LLEN', KEYS[2]) ~= tonumber(ARGV[2]) then return -2 end
redis.call('RPUSH', KEYS[2], ARGV[3])
redis.call('HINCRBY', KEYS[1], 'done', 1)
if ARGV[4] == '1' then redis.call('HINCRBY', KEYS[1], 'failed', 1) end
redis.call('EXPIRE', KEYS[1], ARGV[5]) redis.call('EXPIRE', KEYS[2], ARGV[5]) redis.call('EXPIRE', KEYS[3], ARGV[5])
return 1
`;

/** KEYS job, lines, items, processing; ARGV owner, id, now, ttl, status, error -> 1, or 0 not the owner. */
const FINISH = `
if redis.call('HGET', KEYS[1], 'owner') ~= ARGV[1] then redis.call('LREM', KEYS[4], 0, ARGV[2]) return 0 end
redis.call('HSET', KEYS[1], 'status', ARGV[5], 'finishedAt', ARGV[3], 'error', ARGV[6])
redis.call('HDEL', KEYS[1], 'owner')
redis.call('DEL', KEYS[3])
redis.call('EXPIRE', KEYS[1], ARGV[4]) redis.call('EXPIRE', KEYS[2], ARGV[4])
redis.call('LREM', KEYS[4], 0, ARGV[2])
return 1
`;

/** KEYS heartbeat, processing, queue, workers; ARGV workerId, job key prefix, force (1|0) -> jobs requeued, or -1 when the worker is alive. */
const REQUEUE = `
if ARGV[3] ~= '1' and redis.call('EXISTS', KEYS[1]) == 1 then return -1 end
local moved = 0
while true do
  local id = redis.call('LMOVE', KEYS[2], KEYS[3], 'LEFT', 'RIGHT')
  if not id then break end
  local job = ARGV[2] .. id
  if redis.call('HGET', job, 'status') == 'running' then
    redis.call('HSET', job, 'status', 'queued')
    redis.call('HDEL', job, 'owner')
  end
  moved = moved + 1
end
redis.call('SREM', KEYS[4], ARGV[1])
redis.call('DEL', KEYS[1])
return moved
`;

const count = (value: string | undefined) => (value ? Number(value) : 0);
const orNull = (value: string | undefined) => (value ? value : null);

function toRecord(id: string, h: Record<string, string>): JobRecord {
  return {
    id,
    label: orNull(h.label),
    status: (h.status ?? 'queued') as JobStatus,
    items: count(h.items),
    done: count(h.done),
    failed: count(h.failed),
    attempts: count(h.attempts),
    createdAt: h.createdAt ?? '',
    startedAt: orNull(h.startedAt),
    finishedAt: orNull(h.finishedAt),
    error: orNull(h.error),
    owner: orNull(h.submitter),
  };
}

export interface RedisQueueOptions {
  /** Key prefix (JOB_KEY_PREFIX). */
  readonly prefix: string;
  /** Seconds job keys are kept after submission or the last progress (JOB_RESULT_TTL_S). */
  readonly ttlS: number;
  /** Per-command timeout, ms (default 2000): past it the request answers 503 queue-unavailable. */
  readonly commandTimeoutMs?: number;
}

const unavailable = (error: unknown) =>
  // The client's own message stays in `cause` (logged), never in the answer.
  new QueueUnavailableError(`the job queue's store does not answer; retry after ${QUEUE_RETRY_AFTER_S} s`, QUEUE_RETRY_AFTER_S, { cause: error });

/** The API side: store and queue jobs, read their status and lines. Never runs a job. */
export class RedisJobQueue implements JobQueue {
  readonly #redis: Redis;
  readonly #keys: Keys;
  readonly #ttlS: number;

  constructor(url: string, options: RedisQueueOptions) {
    this.#keys = new Keys(options.prefix);
    this.#ttlS = options.ttlS;
    // Commands wait for the connection at start, but fail (503) instead of piling up while Redis is down.
    this.#redis = new Redis(url, { maxRetriesPerRequest: 0, commandTimeout: options.commandTimeoutMs ?? 2000, connectTimeout: 2000 });
    this.#redis.on('error', () => {}); // reported to the caller as 503 on each command
  }

  async enqueue(job: NewJob): Promise<JobRecord> {
    const id = randomUUID();
    const record: JobRecord = {
      id, label: job.label ?? null, status: 'queued', items: job.items.length, done: 0, failed: 0, attempts: 0,
      createdAt: new Date().toISOString(), startedAt: null, finishedAt: null, error: null, owner: job.owner ?? null,
    };
    const k = this.#keys;
    const fields: Record<string, string | number> = { status: 'queued', items: record.items, done: 0, failed: 0, attempts: 0, createdAt: record.createdAt };
    if (record.label !== null) fields.label = record.label;
    if (record.owner !== null) fields.submitter = record.owner;
    try {
      const results = await this.#redis.multi()
        .hset(k.job(id), fields)
        .expire(k.job(id), this.#ttlS)
        .set(k.items(id), JSON.stringify(job.items), 'EX', this.#ttlS)
        .lpush(k.queue(), id)
        .exec();
      const failed = results?.find(([error]) => error);
      if (!results || failed) throw failed?.[0] ?? new Error('transaction aborted');
    } catch (error) {
      throw unavailable(error);
    }
    return record;
  }

  async get(id: string): Promise<JobRecord | undefined> {
    if (!JOB_ID_PATTERN.test(id)) return undefined;
    let h: Record<string, string>;
    try {
      h = await this.#redis.hgetall(this.#keys.job(id));
    } catch (error) {
      throw unavailable(error);
    }
    return Object.keys(h).length === 0 ? undefined : toRecord(id, h);
  }

  async *results(id: string, pageSize = 256): AsyncGenerator<Buffer> {
    const key = this.#keys.lines(id);
    for (let start = 0; ; start += pageSize) {
      const page = await this.#redis.lrangeBuffer(key, start, start + pageSize - 1);
      yield* page;
      if (page.length < pageSize) return;
    }
  }

  async ping(): Promise<void> {
    try {
      await this.#redis.ping();
    } catch (error) {
      throw unavailable(error);
    }
  }

  async stop(): Promise<void> {}

  async close(): Promise<void> {
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

export interface RedisWorkerOptions {
  readonly prefix: string;
  readonly ttlS: number;
  /** Default: host-pid-random. */
  readonly workerId?: string;
  /** How often the heartbeat is refreshed, ms (default 5000). */
  readonly heartbeatMs?: number;
  /** Seconds without a heartbeat after which the worker counts as dead and its jobs are requeued (default 30). */
  readonly heartbeatTtlS?: number;
  /** Seconds one blocking wait for a job lasts before the worker looks around again (default 2). */
  readonly blockS?: number;
  /** Times a job may be taken before it is failed as abandoned (default 5). */
  readonly maxAttempts?: number;
  /** Least time between two recovery sweeps, ms (default 5000). */
  readonly recoverEveryMs?: number;
  readonly log?: WorkerLog;
}

const RedisItems = z.array(BatchItem);

function parseJson(text: string | null): unknown {
  try {
    return text === null ? undefined : JSON.parse(text);
  } catch {
    return undefined;
  }
}

/** A queue worker: takes jobs one at a time, runs their items with `run`, stores the lines. */
export class RedisJobWorker {
  readonly id: string;
  readonly #keys: Keys;
  readonly #run: RunLines;
  readonly #opts: Required<Omit<RedisWorkerOptions, 'workerId' | 'log'>>;
  readonly #log: WorkerLog;
  readonly #redis: Redis;
  /** Blocking commands hold their connection: BLMOVE gets its own. */
  readonly #blocking: Redis;
  #heartbeat: NodeJS.Timeout | undefined;
  #lastRecovery = 0;
  #stopping = false;
  #current: AbortController | undefined;
  #loop: Promise<void> | undefined;
  #attempt = 0;

  constructor(url: string, run: RunLines, options: RedisWorkerOptions) {
    this.id = options.workerId ?? `${hostname()}-${process.pid}-${randomUUID().slice(0, 8)}`;
    this.#keys = new Keys(options.prefix);
    this.#run = run;
    this.#opts = {
      prefix: options.prefix,
      ttlS: options.ttlS,
      heartbeatMs: options.heartbeatMs ?? 5000,
      heartbeatTtlS: options.heartbeatTtlS ?? 30,
      blockS: options.blockS ?? 2,
      maxAttempts: options.maxAttempts ?? 5,
      recoverEveryMs: options.recoverEveryMs ?? 5000,
    };
    this.#log = options.log ?? silent;
    this.#redis = new Redis(url, { maxRetriesPerRequest: 1, commandTimeout: 10_000 });
    this.#blocking = new Redis(url, { maxRetriesPerRequest: 1 });
    this.#redis.on('error', (error) => this.#log.warn({ err: error }, 'queue worker: Redis connection error'));
    this.#blocking.on('error', () => {}); // the same outage, reported once above
  }

  /** Take and run jobs until stop(). Redis outages are waited out; nothing here throws. */
  run(): Promise<void> {
    this.#loop ??= this.#work();
    return this.#loop;
  }

  /** Stop: the job in hand stops after the items being solved and goes back to the front of the queue. */
  async stop(): Promise<void> {
    this.#stopping = true;
    this.#current?.abort();
    this.#blocking.disconnect(); // ends a blocking wait at once
    await this.#loop;
    clearInterval(this.#heartbeat);
    try {
      const k = this.#keys;
      const moved = await this.#redis.eval(REQUEUE, 4, k.heartbeat(this.id), k.processing(this.id), k.queue(), k.workers(), this.id, k.job(''), '1');
      if (Number(moved) > 0) this.#log.info({ worker: this.id, jobs: moved }, 'queue worker: handed its job back to the queue');
    } catch (error) {
      this.#log.warn({ err: error, worker: this.id }, 'queue worker: could not hand its job back; another worker recovers it once the heartbeat expires');
    }
    this.#redis.disconnect();
  }

  /**
   * Stop at once without handing anything back, as a crashed process would: the job stays in this
   * worker's processing list until the heartbeat expires and another worker recovers it.
   */
  kill(): void {
    this.#stopping = true;
    clearInterval(this.#heartbeat);
    this.#current?.abort();
    this.#redis.disconnect();
    this.#blocking.disconnect();
  }

  /** Requeue the jobs of every worker whose heartbeat has expired; returns how many. */
  async recover(): Promise<number> {
    this.#lastRecovery = Date.now();
    const k = this.#keys;
    let moved = 0;
    for (const worker of await this.#redis.smembers(k.workers())) {
      if (worker === this.id) continue;
      const n = Number(await this.#redis.eval(REQUEUE, 4, k.heartbeat(worker), k.processing(worker), k.queue(), k.workers(), worker, k.job(''), '0'));
      if (n > 0) {
        this.#log.warn({ worker: this.id, deadWorker: worker, jobs: n }, 'queue worker: requeued the jobs of a worker whose heartbeat expired');
        moved += n;
      }
    }
    return moved;
  }

  async #beat(): Promise<void> {
    await this.#redis.multi()
      .set(this.#keys.heartbeat(this.id), new Date().toISOString(), 'EX', this.#opts.heartbeatTtlS)
      .sadd(this.#keys.workers(), this.id)
      .exec();
  }

  async #work(): Promise<void> {
    let backoffMs = 500;
    this.#heartbeat = setInterval(() => {
      this.#beat().catch((error) => this.#log.warn({ err: error }, 'queue worker: heartbeat failed'));
    }, this.#opts.heartbeatMs);
    this.#heartbeat.unref();
    while (!this.#stopping) {
      try {
        await this.#beat();
        if (Date.now() - this.#lastRecovery >= this.#opts.recoverEveryMs) await this.recover();
        // A job already in this worker's list (a run cut short by a Redis outage) comes first.
        const k = this.#keys;
        const id = (await this.#redis.lindex(k.processing(this.id), -1))
          ?? (await this.#blocking.blmove(k.queue(), k.processing(this.id), 'RIGHT', 'LEFT', this.#opts.blockS));
        if (id !== null) await this.#runJob(id);
        backoffMs = 500;
      } catch (error) {
        if (this.#stopping) break;
        this.#log.warn({ err: error, worker: this.id, retryInMs: backoffMs }, 'queue worker: Redis failed; waiting');
        await sleep(backoffMs);
        backoffMs = Math.min(backoffMs * 2, 10_000);
      }
    }
  }

  async #runJob(id: string): Promise<void> {
    const k = this.#keys;
    const owner = `${this.id}#${++this.#attempt}`;
    const now = () => new Date().toISOString();
    const [state, stored] = (await this.#redis.eval(CLAIM, 4, k.job(id), k.processing(this.id), k.lines(id), k.items(id),
      id, owner, now(), this.#opts.maxAttempts, this.#opts.ttlS, this.id)) as [string, number];
    if (state !== 'ok') {
      this.#log.info({ worker: this.id, job: id, state }, 'queue worker: job not run');
      return;
    }
    const finish = (status: 'done' | 'failed', error: string) =>
      this.#redis.eval(FINISH, 4, k.job(id), k.lines(id), k.items(id), k.processing(this.id), owner, id, now(), this.#opts.ttlS, status, error);
    const parsed = RedisItems.safeParse(parseJson(await this.#redis.get(k.items(id))));
    if (!parsed.success) {
      await finish('failed', 'the stored items are missing or unreadable');
      return;
    }
    this.#log.info({ worker: this.id, job: id, from: stored, items: parsed.data.length }, 'queue worker: running job');
    const controller = new AbortController();
    this.#current = controller;
    try {
      let index = stored;
      for await (const out of this.#run({ id, items: parsed.data }, stored, controller.signal)) {
        const written = Number(await this.#redis.eval(APPEND, 3, k.job(id), k.lines(id), k.items(id), owner, index, out.line, out.failed ? '1' : '0', this.#opts.ttlS));
        if (written !== 1) {
          // Another worker took the job over (this one was presumed dead): stop without writing.
          this.#log.warn({ worker: this.id, job: id, index, written }, 'queue worker: job taken over by another worker; stopping it here');
          await this.#redis.lrem(k.processing(this.id), 0, id);
          return;
        }
        index++;
      }
      if (controller.signal.aborted) return; // stopping: stop() hands the job back
      await finish('done', '');
      this.#log.info({ worker: this.id, job: id }, 'queue worker: job done');
    } finally {
      this.#current = undefined;
    }
  }
}
