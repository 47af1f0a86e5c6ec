// POST /v1/jobs, GET /v1/jobs/{id}, GET /v1/jobs/{id}/results: a batch stored now and run later
// (nightly recalculation). Without REDIS_URL the jobs run in this process, one at a time, and are
// kept in memory; with it they are stored in Redis and run by separate queue workers
// (src/queue-worker.ts), and this process only enqueues and reads.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { ProblemError } from '../errors.js';
import { MemoryJobQueue } from '../jobs/memory-queue.js';
import { jobLinks, QueueUnavailableError, type JobQueue, type JobRecord } from '../jobs/queue.js';
import { RedisJobQueue } from '../jobs/redis-queue.js';
import { appRunner } from '../jobs/runner.js';
import { BatchLine, JobAccepted, JobAnswer, JobId, JobRequest, NDJSON_MEDIA_TYPE } from '../schemas/batch.js';
import { Problem, problemResponses } from '../schemas/common.js';
import { sendNdjson } from './batch.js';

/** Seconds a client polling an unfinished job's results is asked to wait. */
const RESULTS_RETRY_AFTER_S = 10;

/** Queue failures are 503 queue-unavailable with Retry-After, never a 500. */
async function queued<T>(work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (error) {
    if (error instanceof QueueUnavailableError) {
      throw new ProblemError('queue-unavailable', error.message, { headers: { 'retry-after': String(error.retryAfterS) } });
    }
    throw error;
  }
}

const toAnswer = (job: JobRecord): JobAnswer => ({
  id: job.id,
  label: job.label,
  status: job.status,
  counts: { items: job.items, done: job.done, failed: job.failed },
  attempts: job.attempts,
  createdAt: job.createdAt,
  startedAt: job.startedAt,
  finishedAt: job.finishedAt,
  error: job.error,
  links: jobLinks(job.id),
});

const Params = z.object({ id: JobId });
const unavailable = Problem.describe('queue-unavailable: the queue\'s store does not answer, or the in-process queue is full; see Retry-After');

const jobs: FastifyPluginAsyncZod = async (app) => {
  const config = app.config;
  const queue: JobQueue = config.REDIS_URL
    ? new RedisJobQueue(config.REDIS_URL, { prefix: config.JOB_KEY_PREFIX, ttlS: config.JOB_RESULT_TTL_S })
    : new MemoryJobQueue(appRunner(app), { maxKept: config.JOBS_MAX_KEPT, ttlS: config.JOB_RESULT_TTL_S });
  // The in-process queue stops before the app closes (its items run on this app); connections close last.
  app.addHook('preClose', async () => queue.stop());
  app.addHook('onClose', async () => queue.close());
  app.readiness.set('job-queue', async () => {
    try {
      await queue.ping();
      return null;
    } catch (error) {
      return error instanceof QueueUnavailableError ? error.message : 'does not answer';
    }
  });

  const find = async (id: string): Promise<JobRecord> => {
    const job = await queued(queue.get(id));
    if (!job) throw new ProblemError('job-not-found', `no job ${id}: never submitted, expired after JOB_RESULT_TTL_S, or dropped from the in-process queue`);
    return job;
  };

  app.post('/v1/jobs', {
    schema: {
      tags: ['batch'],
      summary: 'Queue a batch to run later; poll its status, then read its NDJSON results',
      description: 'Takes the same items as POST /v1/batch (plus an optional label) and answers 202 at once with the job id and a Location header. ' +
        'The job runs the items exactly as POST /v1/batch does and keeps the lines for GET /v1/jobs/{id}/results for JOB_RESULT_TTL_S (default 7 days). ' +
        'Without REDIS_URL jobs run in the service process one at a time and live in memory (at most JOBS_MAX_KEPT, default 100; lost on restart); ' +
        'with REDIS_URL they are stored in Redis and run by separate queue workers, survive restarts, and a job whose worker dies resumes on another one. ' +
        'When the queue cannot take the job the answer is 503 queue-unavailable with Retry-After.',
      body: JobRequest,
      response: { 202: JobAccepted.describe('Queued'), ...problemResponses, 503: unavailable },
    },
  }, async (request, reply) => {
    const { label, items } = request.body;
    const max = config.BATCH_MAX_ITEMS;
    if (items.length > max) throw new ProblemError('limit-exceeded', `the job holds ${items.length} items; the maximum is ${max} (BATCH_MAX_ITEMS): split it into several jobs`);
    const job = await queued(queue.enqueue({ label, items }));
    request.log.info({ job: job.id, items: job.items }, 'job queued');
    return reply.code(202).header('location', `/v1/jobs/${job.id}`).send({ id: job.id, status: 'queued' as const, links: jobLinks(job.id) });
  });

  app.get('/v1/jobs/:id', {
    schema: {
      tags: ['batch'],
      summary: 'Status of a job: queued, running, done or failed, with counts and timestamps',
      params: Params,
      response: { 200: JobAnswer, 404: Problem.describe('job-not-found'), 503: unavailable },
    },
  }, async (request, reply) => reply.header('cache-control', 'no-store').send(toAnswer(await find(request.params.id))));

  app.get('/v1/jobs/:id/results', {
    schema: {
      tags: ['batch'],
      summary: 'The NDJSON lines of a done job, in input order (the same lines as POST /v1/batch)',
      description: 'Only a job whose status is done has results: while it is queued or running the answer is 409 job-not-done with Retry-After ' +
        '(a partial file is never served, so what you read is always the whole result); a failed job answers 409 with the reason.',
      params: Params,
      response: {
        200: { description: 'One JSON object per line, one line per item, in input order', content: { [NDJSON_MEDIA_TYPE]: { schema: BatchLine } } },
        404: Problem.describe('job-not-found'),
        409: Problem.describe('job-not-done'),
        503: unavailable,
      },
    },
  }, async (request, reply) => {
    const job = await find(request.params.id);
    if (job.status === 'failed') throw new ProblemError('job-not-done', `job ${job.id} failed and has no results: ${job.error ?? 'no reason recorded'}`);
    if (job.status !== 'done') {
      throw new ProblemError('job-not-done', `job ${job.id} is ${job.status} (${job.done} of ${job.items} items done); retry after ${RESULTS_RETRY_AFTER_S} s`, {
        headers: { 'retry-after': String(RESULTS_RETRY_AFTER_S) },
      });
    }
    return sendNdjson(reply, queue.results(job.id));
  });
};
export default jobs;
