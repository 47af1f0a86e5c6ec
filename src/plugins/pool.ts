// app.pool: the solver pool (src/workers/pool.ts) shared by the solving routes. Small jobs run
// inline, heavy ones in worker threads; a full queue answers 503 overloaded with Retry-After.
// Threads start when the server listens (tests that inject start them on the first heavy job)
// and stop on close, after the jobs in hand finish.
import fp from 'fastify-plugin';
import type { FastifyInstance } from 'fastify';
import { ProblemError } from '../errors.js';
import type { Job, JobResult, TrackJob, TrackJobResult, TrackTail } from '../workers/jobs.js';
import type { Outcome } from '../solver/core/result.js';
import { DeadlineExceededError, PoolOverloadedError, SolverPool, WorkerDiedError, type PoolStats } from '../workers/pool.js';

/** Seconds a refused client is asked to wait (Retry-After). */
export const RETRY_AFTER_S = 2;

export interface PoolService {
  /** Solve a job inline or on a worker thread; ProblemError('overloaded') when the queue is full. */
  solve<J extends Job>(job: J): Promise<JobResult<J>>;
  /** A long CSV or JSON track and its last records from one thread (SolverPool.trackWithTail); result fails as solve() does, tail rejects when the records must be written here. */
  trackWithTail(job: TrackJob, tail: TrackTail, arena?: SharedArrayBuffer): { result: Promise<Outcome<TrackJobResult>>; tail: Promise<Buffer[]> };
  stats(): PoolStats;
}

declare module 'fastify' {
  interface FastifyInstance {
    pool: PoolService;
  }
}

export default fp(async function pool(app: FastifyInstance) {
  const deadlineS = app.config.REQUEST_DEADLINE_S;
  const solver = new SolverPool({
    threads: app.config.WORKER_THREADS,
    queueLimit: app.config.WORKER_QUEUE_LIMIT,
    maxHeapMb: app.config.WORKER_MAX_HEAP_MB,
    nice: app.config.WORKER_NICE,
    onIdleWorkerError: (error) => app.log.error({ err: error }, 'solver worker thread died with no job in hand; a new one takes its place'),
    ...(deadlineS !== undefined ? { deadlineMs: deadlineS * 1000 } : {}),
  });
  /** The pool's refusals as problems: a full queue, a deadline passed, a thread that died. */
  const asProblem = (error: unknown): unknown => {
    if (error instanceof PoolOverloadedError) {
      return new ProblemError('overloaded', `${error.message}; retry after ${RETRY_AFTER_S} s`, { headers: { 'retry-after': String(RETRY_AFTER_S) } });
    }
    if (error instanceof DeadlineExceededError) {
      return new ProblemError('deadline-exceeded', `${error.message} (REQUEST_DEADLINE_S); ask for less work: a shorter span, fewer samples or stations`);
    }
    if (error instanceof WorkerDiedError) {
      app.log.error({ err: error.cause }, 'solver worker thread died');
      return new ProblemError('worker-failed', `${error.message}; a new thread has taken its place: retry after ${RETRY_AFTER_S} s`, { headers: { 'retry-after': String(RETRY_AFTER_S) } });
    }
    return error;
  };
  const service: PoolService = {
    async solve(job) {
      try {
        return await solver.solve(job);
      } catch (error) {
        throw asProblem(error);
      }
    },
    trackWithTail(job, tail, arena) {
      const solving = solver.trackWithTail(job, tail, arena);
      return { result: solving.result.catch((error: unknown) => { throw asProblem(error); }), tail: solving.tail };
    },
    stats: () => solver.stats(),
  };
  app.decorate('pool', service);
  app.addHook('onListen', async () => {
    solver.start();
    app.log.info({ threads: app.config.WORKER_THREADS, queueLimit: app.config.WORKER_QUEUE_LIMIT }, 'solver pool started');
  });
  app.addHook('onClose', async () => solver.close());
}, { name: 'pool' });
