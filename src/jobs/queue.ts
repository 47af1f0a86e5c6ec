// The job queue behind POST /v1/jobs: a job is a batch stored now and run later, its NDJSON lines
// kept for GET /v1/jobs/{id}/results. Two implementations: in-process (memory-queue.ts, the
// default) and Redis with separate worker processes (redis-queue.ts, when REDIS_URL is set).
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
  /** Why a failed job failed. */
  readonly error: string | null;
  /** Who submitted the job (an opaque caller id, e.g. the API key's id); null when the service is open. Only that caller may read the job. */
  readonly owner: string | null;
}

export interface NewJob {
  readonly label?: string | undefined;
  readonly items: readonly BatchItem[];
  /** The submitting caller (opaque; stored as given and returned in JobRecord.owner). Absent or null: open service. */
  readonly owner?: string | null | undefined;
}

/** One NDJSON line of a batch (ending with a newline) and whether it carries a problem. */
export interface LineOut {
  readonly line: Buffer;
  readonly failed: boolean;
}

/** Runs a job's items from index `from` on, yielding their lines in input order; stops early when `signal` aborts. */
export type RunLines = (job: { readonly id: string; readonly items: readonly BatchItem[] }, from: number, signal: AbortSignal) => AsyncIterable<LineOut>;

export interface JobQueue {
  /** Store the job and queue it. QueueUnavailableError when it cannot be taken now. */
  enqueue(job: NewJob): Promise<JobRecord>;
  /** The job's record; undefined for an unknown (or expired) id. QueueUnavailableError when the store does not answer. */
  get(id: string): Promise<JobRecord | undefined>;
  /** The lines of a job, in input order (call once its status is done). */
  results(id: string): AsyncIterable<Buffer>;
  /** Readiness: resolves when the queue can take and look up jobs now; QueueUnavailableError (a short reason) when not. */
  ping(): Promise<void>;
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

/** Job ids are random UUIDs (crypto.randomUUID); anything else is an unknown id, never a key lookup. */
export const JOB_ID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

export const jobLinks = (id: string) => ({ self: `/v1/jobs/${id}`, results: `/v1/jobs/${id}/results` });
