// The job queue behind POST /v1/jobs: a job is a batch stored now and run later, its NDJSON lines
// kept for GET /v1/jobs/{id}/results. Two implementations: in-process (memory-queue.ts, the
// default) and BullMQ on Redis with separate worker processes (bullmq-queue.ts, when REDIS_URL is set).
import type { JobCounts } from '../plugins/metrics.js';
import type { BatchItem, JobStatus } from '../schemas/batch.js';

export interface JobRecord {
  readonly id: string;
  readonly label: string | null;
  readonly status: JobStatus;
  /** Items in the job. */
  readonly items: number;
  /** Lines written so far (answered or failed). */
  readonly done: number;
  /** Lines written with a problem. */
  readonly failed: number;
  /** Times a worker took the job. */
  readonly attempts: number;
  /** ISO 8601 UTC. */
  readonly createdAt: string;
  readonly startedAt: string | null;
  readonly finishedAt: string | null;
  /** Why a failed (or cancelled) job stopped. */
  readonly error: string | null;
  /** Who submitted the job (an opaque caller id, e.g. the API key's id); null when the service is open. Only that caller may read the job. */
  readonly owner: string | null;
  /** ISO 8601 UTC: the job fails (reason "deadline") if it is not done by then; null: no deadline. */
  readonly deadline: string | null;
  /** The earlier job this one is compared with (GET /v1/jobs/{id}/changes); null: none. */
  readonly compareTo: CompareTo | null;
  /** SHA-256 of the submitted body when it came with an Idempotency-Key; null otherwise. */
  readonly fingerprint: string | null;
  /** Submission order (unique, increasing): the list cursor. */
  readonly seq: number;
  /** Where the job's status is POSTed once it is done, failed or cancelled; null: no callback. */
  readonly callbackUrl: string | null;
}

/** What a job is compared with, and what counts as moved. */
export interface CompareTo {
  readonly job: string;
  readonly thresholdSeconds: number;
  readonly thresholdDegrees: number;
}

export interface NewJob {
  readonly label?: string | undefined;
  readonly items: readonly BatchItem[];
  /** The submitting caller (opaque; stored as given and returned in JobRecord.owner). Absent or null: open service. */
  readonly owner?: string | null | undefined;
  /** ms since 1970. */
  readonly deadlineMs?: number | undefined;
  readonly compareTo?: CompareTo | undefined;
  /** With `fingerprint`: a second enqueue with the same (owner, key) answers the job stored first (whatever its body; the caller compares fingerprints). */
  readonly idempotencyKey?: string | undefined;
  readonly fingerprint?: string | undefined;
  readonly callbackUrl?: string | undefined;
}

/** One NDJSON line of a batch (ending with a newline) and whether it carries a problem. */
export interface LineOut {
  readonly line: Buffer;
  readonly failed: boolean;
}

/** Runs a job's items from index `from` on, yielding their lines in input order; stops early when `signal` aborts. */
export type RunLines = (job: { readonly id: string; readonly items: readonly BatchItem[]; readonly owner?: string | null }, from: number, signal: AbortSignal) => AsyncIterable<LineOut>;

export interface JobEvents {
  stalled(): void;
  done(durationS: number): void;
  /** The job reached done, failed or cancelled (in-process queue only; queue workers report their own). */
  finished?(job: JobRecord): void;
}

export interface JobPage {
  readonly jobs: readonly JobRecord[];
  /** Pass as `cursor` for the next (older) page; null on the last page. */
  readonly next: string | null;
}

export interface JobQueue {
  /** Store the job and queue it (or answer the job stored first under the same idempotency key). QueueUnavailableError when it cannot be taken now. */
  enqueue(job: NewJob): Promise<JobRecord>;
  /** The job's record; undefined for an unknown (or expired) id. QueueUnavailableError when the store does not answer. */
  get(id: string): Promise<JobRecord | undefined>;
  /** The caller's jobs, newest first, at most `limit`, older than `cursor` when given. */
  list(owner: string | null, limit: number, cursor?: string): Promise<JobPage>;
  /** Cancel a queued or running job: it stops after the items being solved; lines written stay readable. Answers the record as it stands (a finished job is left as it is). */
  cancel(id: string): Promise<JobRecord | undefined>;
  /** The lines of a job, in input order (all of them once done; those written so far otherwise). */
  results(id: string): AsyncIterable<Buffer>;
  /** Readiness: resolves when the queue can take and look up jobs now; QueueUnavailableError (a short reason) when not. */
  ping(): Promise<void>;
  /** One line by index; undefined when not written (yet). */
  line(id: string, index: number): Promise<Buffer | undefined>;
  /** Jobs by state, for /metrics (queue-wide with Redis). */
  counts(): Promise<JobCounts>;
  /** Report stalls and the duration (first start to done) of each job done, from any worker. */
  watch(events: JobEvents): void;
  /** Stop running jobs in this process (work in hand is stopped or handed back); before the app closes. */
  stop(): Promise<void>;
  /** Release connections. */
  close(): Promise<void>;
}

/** The queue cannot take or look up jobs now; the caller may retry after `retryAfterS`. */
export class QueueUnavailableError extends Error {
  constructor(message: string, readonly retryAfterS: number, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'QueueUnavailableError';
  }
}

/** The job is larger than the queue could ever keep (JOBS_MAX_BYTES): a retry cannot succeed. */
export class JobTooLargeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'JobTooLargeError';
  }
}

/** Job ids are random UUIDs (crypto.randomUUID); anything else is an unknown id, never a key lookup. */
export const JOB_ID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/** The reason a cancelled job carries (status cancelled rather than failed). */
export const CANCELLED_REASON = 'cancelled by the caller';

/** Why a job past its deadline failed. */
export const deadlineReason = (deadline: string, done: number, items: number) =>
  `deadline ${deadline} passed with ${done} of ${items} items done`;

export const jobLinks = (id: string) => ({ self: `/v1/jobs/${id}`, results: `/v1/jobs/${id}/results`, archive: `/v1/jobs/${id}/archive`, changes: `/v1/jobs/${id}/changes` });
