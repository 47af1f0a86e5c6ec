// Jobs: a batch stored now and run later (nightly recalculation). POST /v1/jobs, GET /v1/jobs
// (the caller's, newest first), GET and DELETE /v1/jobs/{id}, GET .../results (NDJSON),
// .../results/{index} (one line), .../changes (against compareTo). Without REDIS_URL the jobs run
// in this process, one at a time, and are kept in memory; with it they are BullMQ jobs on Redis,
// run by separate queue workers (src/queue-worker.ts), and this process only enqueues and reads.
import { createHash } from 'node:crypto';
import type { FastifyRequest } from 'fastify';
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import canonicalize from 'canonicalize';
import { z } from 'zod';
import { ProblemError } from '../errors.js';
import { BullJobQueue } from '../jobs/bullmq-queue.js';
import { itemChanges, lineId } from '../jobs/changes.js';
import { MemoryJobQueue } from '../jobs/memory-queue.js';
import { jobLinks, JobTooLargeError, QueueUnavailableError, type JobQueue, type JobRecord } from '../jobs/queue.js';
import { appRunner } from '../jobs/runner.js';
import { toAnswer } from '../jobs/answer.js';
import { callbackRefusal, callbackSettings, type CallbackSender } from '../jobs/callback.js';
import { archiveEntries, archiveStream } from '../jobs/archive.js';
import { lineProduct } from '../jobs/products.js';
import { chooseFormat } from '../plugins/negotiate.js';
import {
  BatchLine, IDEMPOTENCY_KEY_PATTERN, JobAccepted, JobAnswer, JobId, JobList, JobListQuery, JobRequest, NDJSON_MEDIA_TYPE,
} from '../schemas/batch.js';
import { problemAnswer, problemResponses } from '../schemas/common.js';
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
    if (error instanceof JobTooLargeError) throw new ProblemError('limit-exceeded', error.message);
    throw error;
  }
}

declare module 'fastify' {
  interface FastifyInstance {
    /** Completion callbacks of in-process jobs (`idle()` waits for pending deliveries). */
    jobCallbacks: CallbackSender;
  }
}

/** Results (and the archive) exist for a done or cancelled job: 409 job-not-done otherwise. */
function finishedOrThrow(job: JobRecord): void {
  if (job.status === 'failed') throw new ProblemError('job-not-done', `job ${job.id} failed and has no results: ${job.error ?? 'no reason recorded'}`);
  if (job.status !== 'done' && job.status !== 'cancelled') {
    throw new ProblemError('job-not-done', `job ${job.id} is ${job.status} (${job.done} of ${job.items} items done); retry after ${RESULTS_RETRY_AFTER_S} s`, {
      headers: { 'retry-after': String(RESULTS_RETRY_AFTER_S) },
    });
  }
}

/** The caller that owns the jobs it submits (the API key's id); null: the open service. */
const callerOf = (request: FastifyRequest): string | null => request.callerId;

const Params = z.object({ id: JobId });
const unavailable = problemAnswer('queue-unavailable: the queue\'s store does not answer, or the in-process queue is full; see Retry-After');
const notFound = problemAnswer('job-not-found');

const jobs: FastifyPluginAsyncZod = async (app) => {
  const config = app.config;
  const queue: JobQueue = config.REDIS_URL
    ? new BullJobQueue(config.REDIS_URL, { prefix: config.JOB_KEY_PREFIX, ttlS: config.JOB_RESULT_TTL_S, attempts: config.JOB_ATTEMPTS, backoffMs: config.JOB_BACKOFF_MS })
    : new MemoryJobQueue(appRunner(app), { maxKept: config.JOBS_MAX_KEPT, maxBytes: config.JOBS_MAX_BYTES, ttlS: config.JOB_RESULT_TTL_S });
  app.jobMetrics.counts(() => queue.counts());
  const callbacks = app.jobCallbacks;
  // In-process jobs finish here; queue workers send the callbacks of the jobs they run (src/queue-worker.ts).
  queue.watch({
    stalled: () => app.jobMetrics.stalled(),
    done: (s) => app.jobMetrics.done(s),
    finished: (job) => { if (job.callbackUrl) void callbacks.send(job.callbackUrl, toAnswer(job), { job: job.id }); },
  });

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

  /** The job, if it exists and the caller owns it: another caller's job is as unknown as a missing one. */
  const find = async (request: FastifyRequest, id: string): Promise<JobRecord> => {
    const job = await queued(queue.get(id));
    if (!job || job.owner !== callerOf(request)) {
      throw new ProblemError('job-not-found', `no job ${id}: never submitted, expired after JOB_RESULT_TTL_S, or dropped from the in-process queue`);
    }
    return job;
  };

  app.post('/v1/jobs', {
    schema: {
      tags: ['batch'],
      operationId: 'submitJob', summary: 'Queue a batch to run later; poll its status, then read its NDJSON results',
      description: 'Takes the same items as POST /v1/batch (plus an optional label, deadline and compareTo) and answers 202 at once with the job id and a Location header. ' +
        'The job runs the items exactly as POST /v1/batch does and keeps the lines for GET /v1/jobs/{id}/results for JOB_RESULT_TTL_S (default 7 days). ' +
        'Without REDIS_URL jobs run in the service process one at a time and live in memory (at most JOBS_MAX_KEPT, default 100; lost on restart); ' +
        'with REDIS_URL they are BullMQ jobs run by separate queue workers, survive restarts, and a job whose worker dies resumes on another one after the lines already stored. ' +
        'With an Idempotency-Key header (1 to 200 visible ASCII characters), the same key with the same body answers the job stored first (202, its current status); the same key with another body answers 409 idempotency-conflict. ' +
        'When the queue cannot take the job the answer is 503 queue-unavailable with Retry-After.',
      headers: z.object({ 'idempotency-key': z.string().regex(IDEMPOTENCY_KEY_PATTERN).optional().describe('Your key for this submission: a repeat with the same body answers the same job') }),
      body: JobRequest,
      response: { 202: JobAccepted.describe('Queued'), ...problemResponses, 409: problemAnswer('idempotency-conflict'), 422: problemAnswer('limit-exceeded (more than BATCH_MAX_ITEMS items, or, in process, items larger than JOBS_MAX_BYTES), job-not-comparable, callback-not-allowed'), 503: unavailable },
    },
  }, async (request, reply) => {
    const { label, items, deadline, compareTo, thresholdSeconds, thresholdDegrees, callbackUrl } = request.body;
    const owner = callerOf(request);
    const max = config.BATCH_MAX_ITEMS;
    if (items.length > max) throw new ProblemError('limit-exceeded', `the job holds ${items.length} items; the maximum is ${max} (BATCH_MAX_ITEMS): split it into several jobs`);
    const deadlineMs = deadline === undefined ? undefined : Date.parse(deadline);
    if (deadlineMs !== undefined && deadlineMs > Date.now() + config.JOB_MAX_DEADLINE_S * 1000) {
      throw new ProblemError('limit-exceeded', `the deadline is more than ${config.JOB_MAX_DEADLINE_S} s ahead (JOB_MAX_DEADLINE_S)`);
    }
    if (callbackUrl !== undefined) {
      const refusal = callbackRefusal(callbackUrl, callbackSettings(config));
      if (refusal) throw new ProblemError('callback-not-allowed', refusal);
    }
    if (compareTo !== undefined) {
      const earlier = await queued(queue.get(compareTo));
      if (!earlier || earlier.owner !== owner) throw new ProblemError('job-not-comparable', `compareTo: no job ${compareTo} of yours (never submitted, or expired after JOB_RESULT_TTL_S)`);
    }
    const key = request.headers['idempotency-key'];
    const fingerprint = key === undefined ? undefined : createHash('sha256').update(canonicalize(request.body) ?? '').digest('hex');
    const job = await queued(queue.enqueue({
      label, items, owner, deadlineMs, idempotencyKey: key, fingerprint, callbackUrl,
      compareTo: compareTo === undefined ? undefined : { job: compareTo, thresholdSeconds, thresholdDegrees },
    }));
    if (fingerprint !== undefined && job.fingerprint !== fingerprint) {
      throw new ProblemError('idempotency-conflict', `Idempotency-Key "${key}" was used for job ${job.id} with another body; send that body again, or use a new key`);
    }
    request.log.info({ job: job.id, items: job.items }, 'job queued');
    return reply.code(202).header('location', `/v1/jobs/${job.id}`).send({ id: job.id, status: job.status, links: jobLinks(job.id) });
  });

  app.get('/v1/jobs', {
    schema: {
      tags: ['batch'],
      operationId: 'listJobs', summary: 'Your jobs, newest first, a page at a time',
      description: 'Every job you submitted that is still kept (JOB_RESULT_TTL_S), whatever its status: failed jobs stay here with their reason (the dead letters) until they expire. Pass `next` as `cursor` for the older page.',
      querystring: JobListQuery,
      response: { 200: JobList, 503: unavailable },
    },
  }, async (request, reply) => {
    const { limit, cursor } = request.query;
    const page = await queued(queue.list(callerOf(request), limit, cursor));
    const now = Date.now();
    return reply.header('cache-control', 'no-store').send({ jobs: page.jobs.map((j) => toAnswer(j, now)), next: page.next });
  });

  app.get('/v1/jobs/:id', {
    schema: {
      tags: ['batch'],
      operationId: 'getJob', summary: 'Status of a job: queued, running, done, failed or cancelled, with counts, progress and timestamps',
      params: Params,
      response: { 200: JobAnswer, 404: notFound, 503: unavailable },
    },
  }, async (request, reply) => reply.header('cache-control', 'no-store').send(toAnswer(await find(request, request.params.id))));

  app.delete('/v1/jobs/:id', {
    schema: {
      tags: ['batch'],
      operationId: 'cancelJob', summary: 'Cancel a queued or running job',
      description: 'A queued job never starts; a running one stops after the items being solved. The lines written before stay readable (results, results/{index}). A job already done, failed or cancelled answers 409 job-finished.',
      params: Params,
      response: { 200: JobAnswer, 404: notFound, 409: problemAnswer('job-finished'), 503: unavailable },
    },
  }, async (request, reply) => {
    const job = await find(request, request.params.id);
    if (job.status === 'done' || job.status === 'failed' || job.status === 'cancelled') {
      throw new ProblemError('job-finished', `job ${job.id} is already ${job.status}; nothing to cancel`);
    }
    const cancelled = await queued(queue.cancel(job.id));
    request.log.info({ job: job.id }, 'job cancelled');
    return reply.header('cache-control', 'no-store').send(toAnswer(cancelled ?? job));
  });

  app.get('/v1/jobs/:id/results', {
    schema: {
      tags: ['batch'],
      operationId: 'getJobResults', summary: 'The NDJSON lines of a done job, in input order (the same lines as POST /v1/batch)',
      description: 'A done job has all its lines; a cancelled one the lines written before it stopped. While it is queued or running the answer is 409 job-not-done with Retry-After ' +
        '(a partial file of a running job is never served); a failed job answers 409 with the reason (its lines written stay readable one by one, results/{index}).',
      params: Params,
      response: {
        200: { description: 'One JSON object per line, one line per item, in input order', content: { [NDJSON_MEDIA_TYPE]: { schema: BatchLine } } },
        404: notFound,
        409: problemAnswer('job-not-done'),
        503: unavailable,
      },
    },
  }, async (request, reply) => {
    const job = await find(request, request.params.id);
    finishedOrThrow(job);
    return sendNdjson(reply, queue.results(job.id));
  });

  app.get('/v1/jobs/:id/results/:index', {
    schema: {
      tags: ['batch'],
      operationId: 'getJobItem', summary: 'One item of a job, as soon as it is written: its product in its own media type (CSV, OEM, GeoJSON, SVG), or its line (JSON)',
      description: 'For an item that asked for a format other than JSON and was answered, the default answer (no Accept, or an Accept that prefers it) is the product itself, byte for byte what the endpoint answers alone, ' +
        'with the item\'s scenario hash as ETag; `Accept: application/json` answers the item\'s line instead. For a JSON item, and for an item that failed, the answer is its line (application/json), the same bytes as in the NDJSON results.',
      params: z.object({ id: JobId, index: z.coerce.number().int().min(0).max(1_000_000) }),
      response: {
        200: {
          description: 'The item\'s product, or its line (one JSON object)',
          content: {
            'application/json': { schema: BatchLine },
            'text/csv': { schema: z.string().describe('CSV product') },
            'text/plain': { schema: z.string().describe('CCSDS OEM product (KVN)') },
            'application/geo+json': { schema: z.unknown().describe('GeoJSON product') },
            'image/svg+xml': { schema: z.string().describe('SVG product') },
          },
        },
        404: problemAnswer('job-not-found, item-not-written'),
        406: problemAnswer('not-acceptable: Accept admits neither the product\'s media type nor application/json'),
        503: unavailable,
      },
    },
  }, async (request, reply) => {
    const job = await find(request, request.params.id);
    const { index } = request.params;
    const line = index < job.items ? await queued(queue.line(job.id, index)) : undefined;
    if (!line) throw new ProblemError('item-not-written', `job ${job.id} has ${job.items} items, ${job.done} written; item ${index} is not written`);
    reply.header('cache-control', 'no-store').header('vary', 'accept');
    const product = lineProduct(line);
    if (product && product.format !== 'json') {
      const bare = product.mediaType.split(';')[0]!.trim();
      const choice = chooseFormat(request, undefined, [['product', bare], ['line', 'application/json']] as const);
      if (choice === 'product') {
        const hash = /"scenarioHash":"([0-9a-f]{64})"/.exec(line.subarray(0, 400).toString('latin1'))?.[1];
        if (hash) reply.header('etag', `"${hash}"`);
        return reply.type(product.mediaType).send(product.bytes as never);
      }
    }
    return reply.type('application/json; charset=utf-8').send(line.subarray(0, line.length - 1) as never); // bytes as stored: not serialised
  });

  app.get('/v1/jobs/:id/archive', {
    schema: {
      tags: ['batch'],
      operationId: 'getJobArchive', summary: 'Every item\'s product of a done (or cancelled) job as one .tar.gz, with a manifest',
      description: 'A gzip-compressed tar (POSIX ustar) holding job-<id>/manifest.json (the job; per item its index, id, kind, status, scenario hash, format, media type, file name and size) ' +
        'and one file per item in input order: <index>-<item id or kind>.<format> (json, csv, oem, geojson, svg) for an answered item, <index>-<item id or kind>.problem.json for a failed one ' +
        '(item ids are reduced to letters, digits, ".", "_", "-" and 60 characters). The products are the endpoints\' own bytes. ' +
        'Bounded: the files together hold at most JOB_ARCHIVE_MAX_BYTES (default 512 MiB) before compression, else 422 limit-exceeded (read the items one by one: results/{index}). ' +
        'A queued or running job answers 409 job-not-done with Retry-After; a failed one 409 with the reason.',
      params: Params,
      response: {
        200: { description: 'The archive', content: { 'application/gzip': { schema: z.string().describe('tar.gz bytes') } } },
        404: notFound,
        409: problemAnswer('job-not-done'),
        422: problemAnswer('limit-exceeded'),
        503: unavailable,
      },
    },
  }, async (request, reply) => {
    const job = await find(request, request.params.id);
    finishedOrThrow(job);
    const { entries, bytes } = await queued(archiveEntries(job, queue.results(job.id)));
    if (bytes > config.JOB_ARCHIVE_MAX_BYTES) {
      throw new ProblemError('limit-exceeded', `the archive of job ${job.id} would hold ${bytes} bytes; the maximum is ${config.JOB_ARCHIVE_MAX_BYTES} (JOB_ARCHIVE_MAX_BYTES): read the items one by one (results/{index})`);
    }
    return reply
      .type('application/gzip')
      .header('content-disposition', `attachment; filename="job-${job.id}.tar.gz"`)
      .header('cache-control', 'no-store')
      .send(archiveStream(job, entries, queue.results(job.id)) as never); // a stream: not serialised
  });

  app.get('/v1/jobs/:id/changes', {
    schema: {
      tags: ['batch'],
      operationId: 'getJobChanges', summary: 'What moved since the earlier job (compareTo), item by item, as NDJSON',
      description: 'For a done job submitted with compareTo: one line per item, matched with the earlier job\'s item of the same id. ' +
        'change "passes": per station the passes that appeared, vanished, or moved by more than thresholdSeconds (AOS, TCA or LOS) or thresholdDegrees (maximum elevation); ' +
        'change "track": the largest position difference, km, over the sample epochs both tracks share; "unchanged", "status" (the item answered differently: a problem on one side), ' +
        '"new-item" (no such id before) or "not-compared" (no id, another kind, or a kind that is not compared).',
      params: Params,
      response: {
        200: { description: 'One JSON object per item, in input order', content: { [NDJSON_MEDIA_TYPE]: { schema: z.object({ index: z.number().int(), id: z.string().nullable(), kind: z.string(), change: z.string() }) } } },
        404: notFound,
        409: problemAnswer('job-not-done'),
        422: problemAnswer('job-not-comparable'),
        503: unavailable,
      },
    },
  }, async (request, reply) => {
    const job = await find(request, request.params.id);
    if (!job.compareTo) throw new ProblemError('job-not-comparable', `job ${job.id} was submitted without compareTo`);
    if (job.status !== 'done') throw new ProblemError('job-not-done', `job ${job.id} is ${job.status}; changes are listed once it is done`, { headers: { 'retry-after': String(RESULTS_RETRY_AFTER_S) } });
    const compare = job.compareTo;
    const earlier = await queued(queue.get(compare.job));
    if (!earlier || earlier.owner !== job.owner) throw new ProblemError('job-not-comparable', `the earlier job ${compare.job} has expired`);
    // The earlier job's item ids -> line index (the first line with that id), read from the line heads.
    const byId = new Map<string, number>();
    let i = 0;
    for await (const line of queue.results(earlier.id)) {
      const id = lineId(line);
      if (id !== null && !byId.has(id)) byId.set(id, i);
      i++;
    }
    async function* changes(): AsyncGenerator<Buffer> {
      for await (const raw of queue.results(job.id)) {
        const after = JSON.parse(raw.toString('utf8')) as BatchLine;
        const at = after.id === null ? undefined : byId.get(after.id);
        const old = at === undefined ? undefined : await queue.line(earlier!.id, at);
        const before = old ? (JSON.parse(old.toString('utf8')) as BatchLine) : undefined;
        yield Buffer.from(`${JSON.stringify(itemChanges(after, before, compare))}\n`);
      }
    }
    return sendNdjson(reply.header('cache-control', 'no-store'), changes());
  });
};
export default jobs;
