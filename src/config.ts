// Environment parsed once at start. A bad value stops the start with a message naming it.
import { availableParallelism } from 'node:os';
import { z } from 'zod';
import { parseKeyEntries } from './auth/keys.js';

const int = (def: number, min: number, max: number) => z.coerce.number().int().min(min).max(max).default(def);

export const Config = z.object({
  PORT: int(8080, 0, 65_535).describe('TCP port to listen on'),
  HOST: z.string().min(1).default('127.0.0.1').describe('Address to bind (0.0.0.0 in containers)'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CACHE_MAX_BYTES: int(64 * 1024 * 1024, 0, 16 * 1024 ** 3).describe('Bound of the in-process answer cache, bytes (0 disables it)'),
  REQUEST_MEMO_MAX_BYTES: int(8 * 1024 * 1024, 0, 1024 ** 3).describe('Bound of the request memo (exact request bytes -> scenario hash, so a repeated request is answered from the cache before validation), bytes (0 disables it)'),
  BODY_LIMIT_BYTES: int(1024 * 1024, 1024, 64 * 1024 * 1024).describe('Largest accepted request body, bytes'),
  MAX_TRACK_SAMPLES: int(100_000, 1, 10_000_000).describe('Largest number of samples in one track'),
  WORKER_THREADS: int(Math.max(1, availableParallelism() - 1), 1, 256).describe('Solver worker threads for heavy jobs (default: available parallelism minus one, at least 1)'),
  WORKER_MAX_HEAP_MB: int(1024, 16, 65_536).describe('Heap (V8 old generation), MiB, one solver worker thread may use; a task that needs more ends its thread: the request answers 503 worker-failed with Retry-After and a new thread takes its place'),
  WORKER_NICE: int(10, 0, 19).describe('Linux: how much lower the scheduling priority (nice) of the solver worker threads is than that of the thread answering requests, 0-19, so that on a busy machine health checks and small answers get the CPU before long computations; 0: the same priority. Elsewhere, or where the system refuses, the threads keep the process priority'),
  WORKER_QUEUE_LIMIT: int(64, 0, 100_000).describe('Heavy jobs that may wait for a worker thread; beyond it requests answer 503 overloaded with Retry-After'),
  REDIS_URL: z.string().url().optional().describe('Shared Redis for the cache tier and job queue; unset = embedded only'),
  BATCH_MAX_ITEMS: int(1000, 1, 100_000).describe('Most items in one POST /v1/batch or POST /v1/jobs body; more answers 422 limit-exceeded'),
  BATCH_CONCURRENCY: int(4, 1, 64).describe('Items of one batch or job solved at the same time (lines still come out in input order)'),
  BATCH_MAX_TRACK_SAMPLES: int(10_000, 1, 10_000_000).describe('Most samples in one track inside a batch or job (track grid, two-body track grid, central-force track samples); beyond it that item answers 422 too-many-samples'),
  BATCH_MAX_ANSWER_BYTES: int(4 * 1024 * 1024, 1024, 1024 ** 3).describe('Largest answer, bytes, one batch line carries; a larger answer becomes that item\'s 422 limit-exceeded (it stays cached under its scenario hash)'),
  JOBS_MAX_KEPT: int(100, 1, 100_000).describe('In-process job queue only: jobs kept (queued, running and finished); the oldest finished ones are dropped first, and when all are unfinished POST /v1/jobs answers 503 queue-unavailable'),
  JOB_ARCHIVE_MAX_BYTES: int(512 * 1024 * 1024, 1024, 64 * 1024 ** 3).describe('Largest GET /v1/jobs/{id}/archive, bytes of the products and problems it holds before compression; a larger archive answers 422 limit-exceeded (read the items one by one instead)'),
  JOB_CALLBACK_HOSTS: z.string().max(10_000).optional().describe('Job completion callbacks: the only hosts (comma-separated `host` or `host:port`) a callbackUrl may name; unset: callbacks are refused'),
  JOB_CALLBACK_SECRET: z.string().min(16).max(1000).optional().describe('HMAC-SHA256 key the callbacks are signed with (at least 16 characters); callbacks are refused without it'),
  JOB_CALLBACK_ATTEMPTS: int(5, 1, 50).describe('Attempts to deliver one callback'),
  JOB_CALLBACK_BACKOFF_MS: int(1000, 0, 3_600_000).describe('Wait before the second attempt of a callback, ms; doubled for each further one'),
  JOB_CALLBACK_TIMEOUT_MS: int(10_000, 100, 120_000).describe('Time one callback attempt may take, ms'),
  JOBS_MAX_BYTES: int(256 * 1024 * 1024, 1024, 64 * 1024 ** 3).describe('In-process job queue only: bytes of items waiting and result lines kept, all jobs together; past it the oldest finished jobs are dropped, then POST /v1/jobs answers 503 queue-unavailable with Retry-After, and a running job whose results would pass it fails'),
  JOB_RESULT_TTL_S: int(7 * 86_400, 60, 365 * 86_400).describe('Seconds a job record and its results are kept after the job was submitted or last made progress'),
  REQUEST_DEADLINE_S: z.coerce.number().positive().max(86_400).optional().describe('Seconds heavy work of one request (or one batch or job item) may take on a worker thread; past it the thread is stopped and the request answers 504 deadline-exceeded. Unset: no deadline'),
  MAX_JSON_DEPTH: int(64, 4, 1000).describe('Deepest nesting of objects and arrays accepted in a JSON body; deeper answers 400 json-too-deep before anything else looks at it'),
  HEADERS_TIMEOUT_S: int(15, 1, 3600).describe('Seconds a client has to send the request headers; past it the connection gets 408 request-timeout and is closed'),
  BODY_TIMEOUT_S: int(30, 1, 3600).describe('Seconds a client has to send the whole body once the headers are in; past it 408 request-timeout and the connection is closed'),
  KEEP_ALIVE_TIMEOUT_S: int(5, 1, 3600).describe('Seconds an idle keep-alive connection stays open'),
  SHUTDOWN_DEADLINE_S: int(30, 1, 3600).describe('On SIGTERM/SIGINT: seconds the service lets requests and batches in flight finish before it exits anyway'),
  CACHE_KEY_PREFIX: z.string().min(1).max(100).default('apsides:answer:').describe('Prefix of the answer keys in the shared Redis tier (REDIS_URL set)'),
  JOB_ATTEMPTS: int(3, 1, 100).describe('Redis queue: times a job is tried when its run fails as a whole (a Redis fault, a lost lock; item problems are lines, not failures); then it is failed (kept as a dead letter)'),
  JOB_BACKOFF_MS: int(1000, 0, 3_600_000).describe('Redis queue: delay before the first retry of a failed run, ms; doubled for each further retry (BullMQ exponential backoff)'),
  JOB_LOCK_MS: int(5000, 1000, 600_000).describe('Redis queue: BullMQ lockDuration, ms: a worker renews the lock of its job every half of it; a job whose lock lapses is stalled and taken over (BullMQ default 30000)'),
  JOB_STALLED_INTERVAL_MS: int(2000, 500, 600_000).describe('Redis queue: BullMQ stalledInterval, ms: how often each worker looks for stalled jobs (BullMQ default 30000)'),
  JOB_MAX_STALLED: int(5, 0, 1000).describe('Redis queue: BullMQ maxStalledCount: stalls (a worker died under the job) a job survives; one more and it fails (BullMQ default 1)'),
  JOB_MAX_DEADLINE_S: int(7 * 86_400, 1, 365 * 86_400).describe('Latest deadline a job may ask for, seconds after submission'),
  API_KEYS: z.string().optional().superRefine((text, ctx) => {
    try {
      if (text !== undefined) parseKeyEntries(text);
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: (error as Error).message });
    }
  }).describe('API keys, comma-separated entries id:scrypt:N:r:p:salt:hash from `npm run -s apikey -- <id>` (hashes only, never keys). Set: /v1 needs Authorization: Bearer <key>, jobs and stored results belong to their key. Unset: the service is open (a warning at start)'),
  METRICS_TOKEN: z.string().min(16).max(200).optional().describe('Bearer token that also opens GET /metrics (for a scraper without an API key); with neither API_KEYS nor this set, /metrics is open'),
  RATE_LIMIT_PER_MIN: int(1200, 0, 10_000_000).describe('Requests a minute under /v1 per API key (per client address when the service is open) for cheap work: reads and POST /v1/orbit; past it 429 rate-limited with Retry-After. 0: no limit'),
  RATE_LIMIT_HEAVY_PER_MIN: int(120, 0, 10_000_000).describe('Requests a minute per key (or address), counted apart, for heavy work: every POST under /v1 other than /v1/orbit (tracks, passes, batches, jobs, ...). 0: no limit'),
  RATE_LIMIT_WINDOW_S: int(60, 1, 3600).describe('Length of the rate-limit window, seconds; a window allows its share of the per-minute budgets (at least 1)'),
  RATE_LIMIT_KEY_PREFIX: z.string().min(1).max(100).default('apsides:ratelimit:').describe('Prefix of the rate-limit counters in Redis (REDIS_URL set: replicas share the counts)'),
  TRUST_PROXY: z.string().optional().describe('Unset: the client address is the connection\'s. Behind a load balancer: its address or CIDR list (comma-separated), or a hop count, so that X-Forwarded-For gives the client address that open-service rate limits count by'),
  CORS_ORIGINS: z.string().optional().describe('Origins (scheme://host[:port], comma-separated) whose browser pages may call the API; unset: no CORS headers (browsers allow same-origin only)'),
  COMPRESS_MIN_BYTES: int(1024, 0, 1024 ** 3).describe('Answers of at least this many bytes are compressed (br or gzip, as Accept-Encoding asks), streamed ones included; 0: never'),
  MAX_EVENT_LOOP_DELAY_MS: int(1000, 0, 600_000).describe('Event-loop delay, ms, past which /v1 requests answer 503 overloaded and /readyz fails; 0: not checked'),
  MAX_HEAP_USED_BYTES: z.coerce.number().int().min(0).optional().describe('Heap used, bytes, past which /v1 requests answer 503 overloaded; unset: 90 % of the V8 heap limit; 0: not checked'),
  MAX_RSS_BYTES: int(0, 0, 1024 ** 4).describe('Resident memory, bytes, past which /v1 requests answer 503 overloaded; 0: not checked (set it below the container limit)'),
  ASKERS_KEY_PREFIX: z.string().min(1).max(100).default('apsides:askers:').describe('Prefix of the Redis sets recording which keys asked each scenario (REDIS_URL set)'),
  EOP_FILE: z.string().min(1).optional().describe('Path of an IERS finals2000A file (finals2000A.all, .data or .daily): polar motion, UT1-UTC and the celestial pole offsets dX, dY are interpolated from it (linearly between the daily rows) for every Earth-fixed computation; a request\'s ut1MinusUtc still wins for UT1. Reloaded on SIGHUP and when its modification time changes (EOP_CHECK_INTERVAL_S); a bad file at start stops the start, a bad file on reload keeps the table in force. Unset: UT1 = UTC unless a request gives ut1MinusUtc, no polar motion, no dX, dY'),
  EOP_CHECK_INTERVAL_S: int(300, 0, 86_400).describe('Seconds between checks of EOP_FILE\'s modification time and size (a change reloads it); 0: only SIGHUP reloads'),
  JOB_KEY_PREFIX: z.string().min(1).max(100).default('apsides:jobs:').describe('Prefix of every Redis key of the job queue (REDIS_URL set)'),
});
export type Config = z.infer<typeof Config>;

/** Parse the environment; throws an Error whose message lists every bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = Config.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`invalid configuration:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** Defaults for tests and embedding: the same as an empty environment. */
export const defaultConfig = (): Config => Config.parse({});
