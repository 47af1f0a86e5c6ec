import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import { bullPrefix, BullJobQueue, BullJobWorker, QUEUE_NAME, type BullWorkerOptions } from '../../src/jobs/bullmq-queue.js';
import type { RunLines } from '../../src/jobs/queue.js';
import { appRunner } from '../../src/jobs/runner.js';
import { JobAnswer, JobList } from '../../src/schemas/batch.js';
import { Problem } from '../../src/schemas/common.js';
import { postJson, testApp } from '../helpers/app.js';
import { answerBytes, GOOD, parseLines, rawLines, until } from '../helpers/batch.js';
import { DEMO_ORBIT } from '../helpers/demo.js';
import { deleteKeys, runPrefix, stalling } from '../helpers/jobs.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

const available = await redisAvailable();
const RUN = runPrefix('bullmq');
let testNumber = 0;

/** Six orbit items, one of them bad (a hyperbola with a positive semi-major axis). */
const ITEMS = Array.from({ length: 6 }, (_, i) => ({
  id: `sat-${i}`,
  kind: 'orbit',
  request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, raan: 20 * i + Math.random(), eccentricity: i === 3 ? 1.5 : 0.0012 } },
}));

describe.skipIf(!available)('BullMQ job queue (real Redis at 127.0.0.1:6379)', () => {
  let redis: Redis;
  let solver: FastifyInstance; // the queue workers' own app (no REDIS_URL: it only solves)
  let prefix: string;
  let apiA: FastifyInstance;
  let apiB: FastifyInstance;
  let workers: BullJobWorker[] = [];

  const worker = (run: RunLines, options: Partial<BullWorkerOptions> = {}) => {
    const w = new BullJobWorker(REDIS_URL, run, { prefix, ttlS: 600, lockDurationMs: 5000, stalledIntervalMs: 1000, maxStalledCount: 5, drainDelayS: 1, ...options });
    workers.push(w);
    void w.run();
    return w;
  };
  const status = async (id: string) => {
    const res = await apiB.inject({ url: `/v1/jobs/${id}` });
    expect(res.statusCode, res.body).toBe(200);
    return JobAnswer.parse(res.json());
  };
  const submit = async (items: unknown[], extra: object = {}, headers: Record<string, string> = {}) => {
    const res = await postJson(apiA, '/v1/jobs', { label: 'bullmq test', items, ...extra }, headers);
    expect(res.statusCode, res.body).toBe(202);
    return res.json().id as string;
  };
  const bullState = async (id: string) => {
    const q = new Queue(QUEUE_NAME, { connection: redis, prefix: bullPrefix(prefix) });
    const state = await (await q.getJob(id))?.getState();
    return state;
  };

  beforeAll(async () => {
    redis = new Redis(REDIS_URL);
    solver = await testApp();
  });
  afterAll(async () => {
    await deleteKeys(redis, RUN);
    redis.disconnect();
    await solver.close();
  });

  // Two API replicas on the same Redis, with a fresh prefix per test.
  const replicas = async (config: object = {}) => {
    prefix = `${RUN}${++testNumber}:`;
    apiA = await testApp({ config: { REDIS_URL, JOB_KEY_PREFIX: prefix, ...config } });
    apiB = await testApp({ config: { REDIS_URL, JOB_KEY_PREFIX: prefix, ...config } });
  };
  const teardown = async () => {
    for (const w of workers) await w.stop();
    workers = [];
    await apiA.close();
    await apiB.close();
  };

  it('one replica enqueues, a worker runs the job, another replica reads status, results and one line', async () => {
    await replicas();
    const id = await submit(ITEMS);
    // No worker yet: the job waits, as stored.
    expect(await status(id)).toMatchObject({ status: 'queued', counts: { items: 6, done: 0, failed: 0 }, attempts: 0, label: 'bullmq test', progress: { fraction: 0, estimatedFinishAt: null } });
    const early = await apiB.inject({ url: `/v1/jobs/${id}/results` });
    expect(early.statusCode).toBe(409);
    expect(early.headers['retry-after']).toBeDefined();
    expect(await bullState(id)).toBe('waiting');

    worker(appRunner(solver));
    await until('job done', async () => (await status(id)).status === 'done');
    const job = await status(id);
    expect(job).toMatchObject({ status: 'done', counts: { items: 6, done: 6, failed: 1 }, attempts: 1, error: null, progress: { fraction: 1 } });
    expect(job.startedAt).not.toBeNull();
    expect(Date.parse(job.finishedAt!)).toBeGreaterThanOrEqual(Date.parse(job.startedAt!));

    const results = await apiB.inject({ url: `/v1/jobs/${id}/results` });
    expect(results.statusCode).toBe(200);
    const lines = parseLines(results.rawPayload);
    expect(lines.map((l) => [l.index, l.id, l.status])).toEqual(ITEMS.map((item, i) => [i, item.id, i === 3 ? 422 : 200]));
    // Each answer is byte for byte what the endpoint answers alone (on a third app, computed afresh).
    const fresh = await testApp();
    const raw = rawLines(results.rawPayload);
    for (const i of [0, 5]) expect(answerBytes(raw[i]!).equals((await postJson(fresh, '/v1/orbit', ITEMS[i]!.request)).rawPayload), `line ${i}`).toBe(true);
    await fresh.close();
    const one = await apiA.inject({ url: `/v1/jobs/${id}/results/5` });
    expect(one.statusCode).toBe(200);
    expect(one.rawPayload.equals(raw[5]!)).toBe(true);
    expect(Problem.parse((await apiA.inject({ url: `/v1/jobs/${id}/results/6` })).json()).type).toBe('/problems/item-not-written');
    // Every replica reports the queue-wide counts and, from BullMQ's event stream, the job's duration.
    await until('duration observed', async () => /^apsides_job_duration_seconds_count 1$/m.test((await apiB.inject({ url: '/metrics' })).body));
    expect((await apiA.inject({ url: '/metrics' })).body).toMatch(/^apsides_jobs\{state="completed"\} 1$/m);
    // Finished: the items are deleted, the lines carry a TTL.
    expect(await redis.exists(`${prefix}job:${id}:items`)).toBe(0);
    expect(await redis.ttl(`${prefix}job:${id}:lines`)).toBeGreaterThan(0);
    await teardown();
  });

  it('products per item through Redis: one item in its own media type and the archive, the endpoint\'s own bytes', async () => {
    await replicas();
    const track = { centralBody: 'earth', elements: ITEMS[0]!.request.elements, grid: { start: '2026-12-01T00:00:00Z', stop: '2026-12-01T00:10:00Z', step: 60 } };
    const id = await submit([{ id: 'csv', kind: 'track', request: { ...track, format: 'csv' } }, { id: 'oem', kind: 'track', request: { ...track, format: 'oem' } }]);
    worker(appRunner(solver));
    await until('job done', async () => (await status(id)).status === 'done');
    const fresh = await testApp();
    for (const [i, format] of ['csv', 'oem'].entries()) {
      const own = await postJson(fresh, '/v1/track', { ...track, format });
      const one = await apiB.inject({ url: `/v1/jobs/${id}/results/${i}` });
      expect(one.headers['content-type']).toBe(own.headers['content-type']);
      expect(one.rawPayload.equals(own.rawPayload), format).toBe(true);
    }
    await fresh.close();
    const archive = await apiA.inject({ url: `/v1/jobs/${id}/archive` });
    expect(archive.statusCode).toBe(200);
    expect(archive.rawPayload.subarray(0, 2).equals(Buffer.from([0x1f, 0x8b]))).toBe(true); // gzip magic (RFC 1952 sec. 2.3.1)
    await teardown();
  });

  it('a worker that stops on a signal hands its job back at once (long before its lock would lapse); the next worker resumes after the stored lines', async () => {
    await replicas();
    const id = await submit(ITEMS);
    const stall = stalling(appRunner(solver), 2);
    const leaving = worker(stall.run, { lockDurationMs: 60_000 });
    await until('two lines stored', async () => (await status(id)).counts.done === 2);
    const stored = await redis.lrangeBuffer(`${prefix}job:${id}:lines`, 0, -1);
    await leaving.stop();
    workers = workers.filter((w) => w !== leaving);
    // Back in the wait list now: with a 60 s lock, only the hand-over explains it.
    expect(await bullState(id)).toBe('waiting');
    expect(await status(id)).toMatchObject({ status: 'queued', counts: { done: 2 } });
    worker(appRunner(solver));
    await until('job done', async () => (await status(id)).status === 'done');
    const results = await apiA.inject({ url: `/v1/jobs/${id}/results` });
    const raw = rawLines(results.rawPayload);
    expect(parseLines(results.rawPayload).map((l) => l.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(raw[0]!.equals(stored[0]!.subarray(0, -1))).toBe(true);
    expect(raw[1]!.equals(stored[1]!.subarray(0, -1))).toBe(true);
    expect((await status(id)).attempts).toBe(2);
    await teardown();
  });

  it('a worker that lost its lock cannot write another line; the job stalls, is taken over and every line is written once', async () => {
    await replicas();
    const id = await submit(ITEMS);
    const stall = stalling(appRunner(solver), 2);
    worker(stall.run, { lockDurationMs: 60_000, skipStalledCheck: true } as never);
    await until('two lines stored', async () => (await status(id)).counts.done === 2);
    // Another holder's lock (as after a takeover), lapsing in 1.5 s so that the stall check then recovers the job.
    await redis.set(`${bullPrefix(prefix)}:${QUEUE_NAME}:${id}:lock`, 'another-worker', 'PX', 1500);
    stall.release(); // the first worker tries to write line 2: refused
    const rescuer = worker(appRunner(solver));
    await until('job done', async () => (await status(id)).status === 'done');
    expect(await redis.llen(`${prefix}job:${id}:lines`)).toBe(6);
    const lines = parseLines((await apiB.inject({ url: `/v1/jobs/${id}/results` })).rawPayload);
    expect(lines.map((l) => l.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(rescuer).toBeDefined();
    await until('stall counted', async () => /^apsides_jobs_stalled_total 1$/m.test((await apiA.inject({ url: '/metrics' })).body));
    await teardown();
  });

  it('keeps the submitting caller as the job\'s owner', async () => {
    await replicas();
    const queue = new BullJobQueue(REDIS_URL, { prefix, ttlS: 600, attempts: 1, backoffMs: 10 });
    const mine = await queue.enqueue({ items: ITEMS.slice(0, 1) as never, owner: 'key-a' });
    const open = await queue.enqueue({ items: ITEMS.slice(0, 1) as never });
    expect(mine.owner).toBe('key-a');
    expect((await queue.get(mine.id))?.owner).toBe('key-a');
    expect((await queue.get(open.id))?.owner).toBeNull();
    expect((await queue.list('key-a', 10)).jobs.map((j) => j.id)).toEqual([mine.id]);
    expect((await queue.list(null, 10)).jobs.map((j) => j.id)).toEqual([open.id]);
    await queue.close();
    await teardown();
  });

  it('GET /v1/jobs lists the caller\'s jobs newest first, a page at a time with a cursor', async () => {
    await replicas();
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push(await submit(ITEMS.slice(0, 1)));
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const res = await apiB.inject({ url: `/v1/jobs?limit=2${cursor ? `&cursor=${cursor}` : ''}` });
      expect(res.statusCode, res.body).toBe(200);
      const page = JobList.parse(res.json());
      expect(page.jobs.length).toBeLessThanOrEqual(2);
      seen.push(...page.jobs.map((j) => j.id));
      cursor = page.next;
    } while (cursor !== null);
    expect(seen).toEqual([...ids].reverse());
    await teardown();
  });

  it('cancel: a running job stops with its lines kept readable; a queued one never starts; a finished one answers 409', async () => {
    await replicas();
    const running = await submit(ITEMS);
    const waiting = await submit(ITEMS);
    const stall = stalling(appRunner(solver), 2);
    worker(stall.run);
    await until('two lines stored', async () => (await status(running)).counts.done === 2);
    for (const id of [waiting, running]) {
      const res = await apiB.inject({ method: 'DELETE', url: `/v1/jobs/${id}` });
      expect(res.statusCode, res.body).toBe(200);
      expect(JobAnswer.parse(res.json()).status).toBe('cancelled');
    }
    stall.release();
    await until('running job failed as cancelled', async () => (await bullState(running)) === 'failed');
    await until('waiting job dropped as cancelled', async () => (await bullState(waiting)) === 'failed');
    expect(await status(running)).toMatchObject({ status: 'cancelled', counts: { done: 2 }, error: 'cancelled by the caller' });
    expect(await status(waiting)).toMatchObject({ status: 'cancelled', counts: { done: 0 }, attempts: 1 });
    const lines = parseLines((await apiA.inject({ url: `/v1/jobs/${running}/results` })).rawPayload);
    expect(lines.map((l) => l.index)).toEqual([0, 1]);
    const again = await apiA.inject({ method: 'DELETE', url: `/v1/jobs/${running}` });
    expect(again.statusCode).toBe(409);
    expect(Problem.parse(again.json()).type).toBe('/problems/job-finished');
    await teardown();
  });

  it('a job past its deadline fails with the reason and stays listed as a dead letter; its lines stay readable one by one', async () => {
    await replicas();
    const id = await submit(ITEMS, { deadline: new Date(Date.now() + 1500).toISOString() });
    const stall = stalling(appRunner(solver), 1);
    worker(stall.run);
    await until('job failed', async () => (await status(id)).status === 'failed', 600);
    const job = await status(id);
    expect(job.error).toMatch(/^deadline .* passed with 1 of 6 items done$/);
    const listed = JobList.parse((await apiA.inject({ url: '/v1/jobs' })).json()).jobs.find((j) => j.id === id);
    expect(listed).toMatchObject({ status: 'failed', error: job.error });
    expect((await apiA.inject({ url: `/v1/jobs/${id}/results/0` })).statusCode).toBe(200);
    const results = await apiA.inject({ url: `/v1/jobs/${id}/results` });
    expect(results.statusCode).toBe(409);
    expect(Problem.parse(results.json()).detail).toMatch(/deadline/);
    await teardown();
  });

  it('a run that fails as a whole is retried with backoff (JOB_ATTEMPTS), then kept failed with its reason', async () => {
    await replicas({ JOB_ATTEMPTS: 2, JOB_BACKOFF_MS: 50 });
    const id = await submit(ITEMS);
    // A runner that breaks after one line, every time (as a Redis fault in the middle of a run would).
    const broken: RunLines = async function* (job, from, signal) {
      for await (const out of appRunner(solver)(job, from, signal)) {
        yield out;
        throw new Error('the solver store went away');
      }
    };
    worker(broken);
    await until('job failed', async () => (await status(id)).status === 'failed');
    // Two attempts, each resuming after the line the one before stored.
    expect(await status(id)).toMatchObject({ status: 'failed', attempts: 2, counts: { done: 2 }, error: 'the solver store went away' });
    await teardown();
  });

  it('Idempotency-Key: the same key and body answer the same job; another body with the key answers 409', async () => {
    await replicas();
    const key = randomUUID();
    const first = await submit(ITEMS, {}, { 'idempotency-key': key });
    const again = await submit(ITEMS, {}, { 'idempotency-key': key }); // same body, other replica would do the same
    expect(again).toBe(first);
    const other = await postJson(apiB, '/v1/jobs', { label: 'bullmq test', items: ITEMS.slice(0, 2) }, { 'idempotency-key': key });
    expect(other.statusCode).toBe(409);
    expect(Problem.parse(other.json()).type).toBe('/problems/idempotency-conflict');
    const list = JobList.parse((await apiA.inject({ url: '/v1/jobs' })).json());
    expect(list.jobs.map((j) => j.id)).toEqual([first]);
    await teardown();
  });
});

describe('BullMQ job queue that cannot be reached', () => {
  it('POST /v1/jobs and GET /v1/jobs/{id} answer 503 queue-unavailable with Retry-After, never a 500 or a hang', async () => {
    // Port 1 on loopback: nothing listens there.
    const app = await testApp({ config: { REDIS_URL: 'redis://127.0.0.1:1', JOB_KEY_PREFIX: `${RUN}down:` } });
    const post = await postJson(app, '/v1/jobs', { items: [{ kind: 'orbit', request: GOOD.orbit }] });
    expect(post.statusCode, post.body).toBe(503);
    expect(post.headers['retry-after']).toBe('5');
    expect(Problem.parse(post.json()).type).toBe('/problems/queue-unavailable');
    for (const url of [`/v1/jobs/${randomUUID()}`, '/v1/jobs']) {
      const get = await app.inject({ url });
      expect(get.statusCode, url).toBe(503);
      expect(get.headers['retry-after']).toBe('5');
    }
    // The synchronous batch does not need the queue.
    expect((await postJson(app, '/v1/batch', { items: [{ kind: 'orbit', request: GOOD.orbit }] })).statusCode).toBe(200);
    await app.close();
  });
});
