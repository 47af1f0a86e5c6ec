// The solver pool on the main thread: small jobs run inline, heavy ones in worker threads
// (piscina), so the event loop keeps answering health checks and small requests while a long
// track, pass search or radial integration runs. The queue in front of the threads is bounded:
// beyond it solve() rejects at once with PoolOverloadedError instead of piling up work.
// Threads start on first use (or on start()), so an app that never solves a heavy job never
// spawns one.
import { createRequire } from 'node:module';
import { MessageChannel, receiveMessageOnPort, type Transferable } from 'node:worker_threads';
import { pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import type { TrackTailTask, WorkerSettings } from './worker.js';
import { fromWire, payloadTransfer, refusedBeforeWork, runJob, runsInline, type Job, type JobResult, type TrackJob, type TrackJobResult, type TrackTail } from './jobs.js';
import type { Outcome } from '../solver/core/result.js';

/** The queue in front of the threads is full (or the pool is closing): try again later. */
export class PoolOverloadedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PoolOverloadedError';
  }
}

/** A job threw in its worker (a programmer error) or the worker died under it. */
export class WorkerFailedError extends Error {
  constructor(kind: string, cause: unknown) {
    super(`the ${kind} job failed in its worker thread: ${cause instanceof Error ? cause.message : String(cause)}`, { cause });
    this.name = 'WorkerFailedError';
  }
}

/** A job ran past its deadline: its thread was stopped (and replaced), the job dropped. */
export class DeadlineExceededError extends Error {
  constructor(readonly deadlineMs: number) {
    super(`the job ran longer than its deadline of ${deadlineMs / 1000} s and was stopped`);
    this.name = 'DeadlineExceededError';
  }
}

/** The worker thread died under the job (not a throw: the thread itself exited); the pool starts a new one. */
export class WorkerDiedError extends Error {
  constructor(kind: string, cause: unknown) {
    super(`the worker thread running the ${kind} job stopped before it finished`, { cause });
    this.name = 'WorkerDiedError';
  }
}

export interface SolverPoolOptions {
  /** Worker threads (>= 1). */
  readonly threads: number;
  /** Jobs that may wait for a thread; one more is refused (0: none wait once all threads are busy). */
  readonly queueLimit: number;
  /** Milliseconds close() waits for running and queued jobs before it stops the threads (default 30 000). */
  readonly closeTimeoutMs?: number;
  /** Milliseconds a job may take in a thread (queueing included); past it the thread is stopped and replaced. Unset: no deadline. */
  readonly deadlineMs?: number;
  /** Heap (V8 old generation), MiB, of each thread; a job that needs more ends its thread (WorkerDiedError). Unset: Node's default. */
  readonly maxHeapMb?: number;
  /** Linux nice increment of each thread over the process (0-19; default 0: the process priority). */
  readonly nice?: number;
  /** Told when a thread dies with no job in hand (piscina's 'error' event; unheard it would throw). */
  readonly onIdleWorkerError?: (error: unknown) => void;
}

export interface PoolStats {
  readonly threads: number;
  /** Jobs sent to the pool and not yet settled (running + queued). */
  readonly active: number;
  /** Jobs waiting for a thread. */
  readonly queued: number;
  /** Jobs the threads have finished (successfully or not). */
  readonly completed: number;
}

/**
 * The worker entry and the Node options that load it. From source (tests, `npm run dev`) this
 * module is a .ts file and the worker needs the tsx loader; from dist/ it is plain JavaScript and
 * the worker inherits the process options.
 */
function workerEntry(): { filename: string; execArgv?: string[] } {
  const here = import.meta.url;
  if (!here.endsWith('.ts')) return { filename: new URL('./worker.js', here).href };
  const tsxLoader = pathToFileURL(createRequire(here).resolve('tsx')).href;
  return { filename: new URL('./worker.ts', here).href, execArgv: ['--import', tsxLoader] };
}

/** piscina's refusals when its queue is full (5.x wording; test/http/overload.test.ts pins them). */
/** Node's error for a worker thread stopped at its resourceLimits (the thread is gone; piscina starts another). */
const WORKER_OUT_OF_MEMORY = 'ERR_WORKER_OUT_OF_MEMORY';

const QUEUE_FULL = new Set(['Task queue is at limit', 'No task queue available and all Workers are busy']);

/** The promise itself, marked as handled: a rejection nobody waits for (an answer refused before it streams) is no unhandled rejection. */
function handled<T>(p: Promise<T>): Promise<T> {
  p.catch(() => undefined);
  return p;
}

export class SolverPool {
  readonly #options: SolverPoolOptions;
  #piscina: Piscina | undefined;
  #active = 0;
  #closing = false;

  constructor(options: SolverPoolOptions) {
    if (!Number.isInteger(options.threads) || options.threads < 1) throw new RangeError('threads must be an integer >= 1');
    if (!Number.isInteger(options.queueLimit) || options.queueLimit < 0) throw new RangeError('queueLimit must be an integer >= 0');
    if (options.nice !== undefined && !(Number.isInteger(options.nice) && options.nice >= 0 && options.nice <= 19)) throw new RangeError('nice must be an integer 0-19');
    this.#options = options;
  }

  /** Start the threads now rather than on the first heavy job. */
  start(): void {
    if (this.#closing || this.#piscina) return;
    const { threads, queueLimit, closeTimeoutMs = 30_000, maxHeapMb, nice = 0, onIdleWorkerError } = this.#options;
    this.#piscina = new Piscina({
      ...workerEntry(),
      minThreads: threads,
      maxThreads: threads,
      idleTimeout: Infinity,
      maxQueue: queueLimit,
      closeTimeout: closeTimeoutMs,
      recordTiming: false,
      workerData: { nice } satisfies WorkerSettings,
      ...(maxHeapMb !== undefined ? { resourceLimits: { maxOldGenerationSizeMb: maxHeapMb } } : {}),
    });
    this.#piscina.on('error', (error: unknown) => onIdleWorkerError?.(error));
  }

  /**
   * A job sure to break a limit is refused at once (its failure is the result); a small job runs
   * inline at once; a heavy one in a worker thread, behind the bounded queue.
   */
  solve<J extends Job>(job: J): Promise<JobResult<J>> {
    const refused = refusedBeforeWork(job);
    if (refused) return Promise.resolve(refused as JobResult<J>);
    if (runsInline(job)) {
      try {
        return Promise.resolve(runJob(job));
      } catch (error) {
        return Promise.reject(error);
      }
    }
    return this.inWorker(job);
  }

  /**
   * Run a job in a worker thread whatever its size. A track job's input.epochsTT buffer is transferred
   * to the thread (the caller's array is emptied; the result carries it back).
   */
  async inWorker<J extends Job>(job: J, options: { deadlineMs?: number } = {}): Promise<JobResult<J>> {
    return fromWire<J>(job.kind, await this.#run(job.kind, job, payloadTransfer(job), options.deadlineMs));
  }

  /**
   * A long CSV or JSON track in a worker thread, whose last records (tail.from..n-1) the same
   * thread writes once it has sent the track: `result` settles as soon as the track is computed,
   * `tail` when its records are written. `tail` rejects when the track failed or the thread could
   * not write them (stopped at the deadline, died): the caller then writes them itself. `arena`:
   * shared memory the thread writes the records into when they fit (a thread that failed may
   * still be writing it: never reuse it then). A job sure to break a limit is refused as solve()
   * refuses it (its failure is the result).
   */
  trackWithTail(job: TrackJob, tail: TrackTail, arena?: SharedArrayBuffer): { result: Promise<Outcome<TrackJobResult>>; tail: Promise<Buffer[]> } {
    const refused = refusedBeforeWork(job);
    if (refused) return { result: Promise.resolve(refused), tail: handled(Promise.reject(new Error('the track was refused'))) };
    const { port1, port2 } = new MessageChannel();
    const task: TrackTailTask = { kind: 'track-tail', job, tail, port: port2, ...(arena ? { arena } : {}) };
    const bytes = this.#run(job.kind, task, [...payloadTransfer(job), port2]);
    const result = new Promise<Outcome<TrackJobResult>>((resolve, reject) => {
      let settled = false;
      const take = (wire: unknown): void => {
        settled = true;
        port1.close();
        resolve(fromWire<TrackJob>('track', wire));
      };
      port1.once('message', take);
      // The thread sends the track before it writes the records, but the two messages travel on
      // different ports: when the task settles first, the track is already in this port's queue.
      const ended = (error: unknown): void => {
        if (settled) return;
        const sent = receiveMessageOnPort(port1);
        if (sent) return take(sent.message);
        settled = true;
        port1.close();
        reject(error ?? new WorkerFailedError(job.kind, 'the thread ended without sending the track'));
      };
      bytes.then(() => ended(undefined), ended);
    });
    const records = bytes.then((parts) => {
      if (!Array.isArray(parts)) throw new Error('the track failed: no records');
      return (parts as Uint8Array[]).map((u) => Buffer.from(u.buffer, u.byteOffset, u.byteLength));
    });
    return { result, tail: handled(records) };
  }

  /** One task on a thread: the pool's queue, deadline and error mapping. */
  async #run(kind: Job['kind'], task: unknown, transferList: readonly Transferable[], deadlineMsOption?: number): Promise<unknown> {
    if (this.#closing) throw new PoolOverloadedError('the service is shutting down');
    this.start();
    this.#active++;
    const deadlineMs = deadlineMsOption ?? this.#options.deadlineMs;
    // Aborting a running task makes piscina stop its thread and start a fresh one.
    const deadline = deadlineMs === undefined ? undefined : AbortSignal.timeout(deadlineMs);
    try {
      return await this.#piscina!.run(task, { transferList: [...transferList], ...(deadline ? { signal: deadline } : {}) });
    } catch (error) {
      // Messages stay free of internals (thread and queue sizes): they reach the client.
      if (error instanceof Error && QUEUE_FULL.has(error.message)) throw new PoolOverloadedError('the solver queue is full');
      if (deadline?.aborted) throw new DeadlineExceededError(deadlineMs!);
      if (error instanceof Error && error.name === 'AbortError') throw new PoolOverloadedError('the service is shutting down');
      if (error instanceof Error && (/^worker exited with code/.test(error.message) || (error as NodeJS.ErrnoException).code === WORKER_OUT_OF_MEMORY)) {
        throw new WorkerDiedError(kind, error);
      }
      throw new WorkerFailedError(kind, error);
    } finally {
      this.#active--;
    }
  }

  stats(): PoolStats {
    return {
      threads: this.#options.threads,
      active: this.#active,
      queued: this.#piscina?.queueSize ?? 0,
      completed: this.#piscina?.completed ?? 0,
    };
  }

  /** Refuse new jobs, let running and queued ones finish (up to closeTimeoutMs), stop the threads. */
  async close(): Promise<void> {
    this.#closing = true;
    const piscina = this.#piscina;
    this.#piscina = undefined;
    if (piscina) await piscina.close();
  }
}
