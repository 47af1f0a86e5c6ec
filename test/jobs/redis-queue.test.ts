import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { Redis } from 'ioredis';
import type { LineOut, RunLines } from '../../src/jobs/queue.js';
import { RedisJobQueue, RedisJobWorker, type RedisWorkerOptions } from '../../src/jobs/redis-queue.js';
import { appRunner } from '../../src/jobs/runner.js';
import { JobAnswer } from '../../src/schemas/batch.js';
import { Problem } from '../../src/schemas/common.js';
import { postJson, testApp } from '../helpers/app.js';
import { answerBytes, GOOD, parseLines, rawLines, until } from '../helpers/batch.js';
import { DEMO_ORBIT } from '../helpers/demo.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

const available = await redisAvailable();
// Each run (and each test) has its own key prefix, so parallel runs and old keys never meet.
const runPrefix = `apsides:test:${randomUUID()}:`;
let testNumber = 0;

/** Six orbit items, one of them bad (a hyperbola with a positive semi-major axis). */
const ITEMS = Array.from({ length: 6 }, (_, i) => ({
  id: `sat-${i}`,
  kind: 'orbit',
  request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, raan: 20 * i + Math.random(), eccentricity: i === 3 ? 1.5 : 0.0012 } },
}));

/** The first `after` lines pass at once; the rest wait until `release()` (or until the worker is stopped). */
function stalling(inner: RunLines, after: number) {
  let release: () => void = () => {};
  const released = new Promise<void>((resolve) => { release = resolve; });
  const run: RunLines = async function* (job, from, signal): AsyncGenerator<LineOut> {
    let n = from;
    for await (const out of inner(job, from, signal)) {
      if (n++ >= after) {
        await Promise.race([released, new Promise<void>((resolve) => signal.addEventListener('abort', () => resolve(), { once: true }))]);
        if (signal.aborted) return;
      }
      yield out;
    }
  };
  return { run, release: () => release() };
}

describe.skipIf(!available)('Redis job queue (real Redis at 127.0.0.1:6379)', () => {
  let redis: Redis;
  let solver: FastifyInstance; // the queue workers' own app (no REDIS_URL: it only solves)
  let prefix: string;
  let apiA: FastifyInstance;
  let apiB: FastifyInstance;
  const workers: RedisJobWorker[] = [];

  const worker = (run: RunLines, options: Partial<RedisWorkerOptions> = {}) => {
    const w = new RedisJobWorker(REDIS_URL, run, { prefix, ttlS: 600, blockS: 1, recoverEveryMs: 0, ...options });
    workers.push(w);
    return w;
  };
  const status = async (id: string) => JobAnswer.parse((await apiB.inject({ url: `/v1/jobs/${id}` })).json());
  const submit = async (items: unknown[]) => {
    const res = await postJson(apiA, '/v1/jobs', { label: 'redis test', items });
    expect(res.statusCode, res.body).toBe(202);
    return res.json().id as string;
  };

  beforeAll(async () => {
    redis = new Redis(REDIS_URL);
    solver = await testApp();
  });
  afterAll(async () => {
    let cursor = '0';
    do {
      const [next, keys] = await redis.scan(cursor, 'MATCH', `${runPrefix}*`, 'COUNT', 1000);
      if (keys.length > 0) await redis.del(...keys);
      cursor = next;
    } while (cursor !== '0');
    redis.disconnect();
    await solver.close();
  });

  // Two API replicas on the same Redis, with a fresh prefix per test.
  const replicas = async () => {
    prefix = `${runPrefix}${++testNumber}:`;
    apiA = await testApp({ config: { REDIS_URL, JOB_KEY_PREFIX: prefix } });
    apiB = await testApp({ config: { REDIS_URL, JOB_KEY_PREFIX: prefix } });
  };
  const teardown = async () => {
    for (const w of workers.splice(0)) await w.stop();
    await apiA.close();
    await apiB.close();
  };

  it('one replica enqueues, a worker runs the job, another replica reads the status and the results', async () => {
    await replicas();
    const id = await submit(ITEMS);
    // No worker yet: the job waits in the queue, as stored.
    expect(await status(id)).toMatchObject({ status: 'queued', counts: { items: 6, done: 0, failed: 0 }, attempts: 0, label: 'redis test' });
    const early = await apiB.inject({ url: `/v1/jobs/${id}/results` });
    expect(early.statusCode).toBe(409);
    expect(early.headers['retry-after']).toBeDefined();
    expect(await redis.lrange(`${prefix}queue`, 0, -1)).toEqual([id]);

    const w = worker(appRunner(solver));
    const loop = w.run();
    await until('job done', async () => (await status(id)).status === 'done');
    const job = await status(id);
    expect(job).toMatchObject({ status: 'done', counts: { items: 6, done: 6, failed: 1 }, attempts: 1, error: null });
    expect(job.startedAt).not.toBeNull();

    const results = await apiB.inject({ url: `/v1/jobs/${id}/results` });
    expect(results.statusCode).toBe(200);
    const lines = parseLines(results.rawPayload);
    expect(lines.map((l) => [l.index, l.id, l.status])).toEqual(ITEMS.map((item, i) => [i, item.id, i === 3 ? 422 : 200]));
    // Each answer is byte for byte what the endpoint answers alone (on a third app, computed afresh).
    const fresh = await testApp();
    const raw = rawLines(results.rawPayload);
    for (const i of [0, 5]) expect(answerBytes(raw[i]!).equals((await postJson(fresh, '/v1/orbit', ITEMS[i]!.request)).rawPayload), `line ${i}`).toBe(true);
    await fresh.close();
    // Finished: the items are deleted, the record and lines carry a TTL, nothing is left in a list.
    expect(await redis.exists(`${prefix}job:${id}:items`)).toBe(0);
    expect(await redis.ttl(`${prefix}job:${id}`)).toBeGreaterThan(0);
    expect(await redis.ttl(`${prefix}job:${id}:lines`)).toBeGreaterThan(0);
    expect(await redis.llen(`${prefix}processing:${w.id}`)).toBe(0);
    await w.stop();
    await loop;
    await teardown();
  });

  it('a crashed worker\'s job is recovered by another worker and resumes after the lines already stored', async () => {
    await replicas();
    const id = await submit(ITEMS);
    const stall = stalling(appRunner(solver), 2);
    const doomed = worker(stall.run, { heartbeatMs: 60_000 });
    void doomed.run();
    await until('two lines stored', async () => (await status(id)).counts.done === 2);
    const stored = await redis.lrangeBuffer(`${prefix}job:${id}:lines`, 0, -1);
    // The process dies: nothing is handed back, and its heartbeat lapses (deleted here rather than waited for).
    doomed.kill();
    await redis.del(`${prefix}worker:${doomed.id}`);
    expect(await redis.lrange(`${prefix}processing:${doomed.id}`, 0, -1)).toEqual([id]);
    expect((await status(id)).status).toBe('running');

    const rescuer = worker(appRunner(solver));
    void rescuer.run();
    await until('job done', async () => (await status(id)).status === 'done');
    expect(await status(id)).toMatchObject({ status: 'done', counts: { items: 6, done: 6, failed: 1 }, attempts: 2 });
    const results = await apiA.inject({ url: `/v1/jobs/${id}/results` });
    const raw = rawLines(results.rawPayload);
    expect(parseLines(results.rawPayload).map((l) => l.index)).toEqual([0, 1, 2, 3, 4, 5]);
    // Nothing already stored was lost or rewritten.
    expect(raw[0]!.equals(stored[0]!.subarray(0, -1))).toBe(true);
    expect(raw[1]!.equals(stored[1]!.subarray(0, -1))).toBe(true);
    expect(await redis.exists(`${prefix}processing:${doomed.id}`)).toBe(0);
    expect(await redis.sismember(`${prefix}workers`, doomed.id)).toBe(0);
    await teardown();
  });

  it('a worker presumed dead that comes back cannot write into the job another worker took over', async () => {
    await replicas();
    const id = await submit(ITEMS);
    const stall = stalling(appRunner(solver), 2);
    const zombie = worker(stall.run, { heartbeatMs: 60_000 });
    void zombie.run();
    await until('two lines stored', async () => (await status(id)).counts.done === 2);
    await redis.del(`${prefix}worker:${zombie.id}`); // its heartbeat lapsed while it hung
    const rescuer = worker(appRunner(solver));
    void rescuer.run();
    await until('job done', async () => (await status(id)).status === 'done');
    stall.release(); // the hung worker wakes up and tries to write line 2 again
    await until('zombie gave the job up', async () => (await redis.llen(`${prefix}processing:${zombie.id}`)) === 0);
    expect(await redis.llen(`${prefix}job:${id}:lines`)).toBe(6);
    const lines = parseLines((await apiB.inject({ url: `/v1/jobs/${id}/results` })).rawPayload);
    expect(lines.map((l) => l.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect((await status(id)).attempts).toBe(2);
    await teardown();
  });

  it('a worker that stops on a signal hands its job back at once; the next worker finishes it', async () => {
    await replicas();
    const id = await submit(ITEMS);
    const stall = stalling(appRunner(solver), 1);
    const leaving = worker(stall.run, { heartbeatMs: 60_000 });
    const loop = leaving.run();
    await until('one line stored', async () => (await status(id)).counts.done === 1);
    await leaving.stop();
    await loop;
    expect(await status(id)).toMatchObject({ status: 'queued', counts: { done: 1 } });
    expect(await redis.lrange(`${prefix}queue`, 0, -1)).toEqual([id]);
    expect(await redis.exists(`${prefix}worker:${leaving.id}`)).toBe(0);
    const next = worker(appRunner(solver));
    void next.run();
    await until('job done', async () => (await status(id)).status === 'done');
    expect(parseLines((await apiA.inject({ url: `/v1/jobs/${id}/results` })).rawPayload).map((l) => l.index)).toEqual([0, 1, 2, 3, 4, 5]);
    await teardown();
  });

  it('keeps the submitting caller as the job\'s owner, apart from the worker attempt that runs it', async () => {
    await replicas();
    const queue = new RedisJobQueue(REDIS_URL, { prefix, ttlS: 600 });
    const mine = await queue.enqueue({ items: ITEMS.slice(0, 1) as never, owner: 'key-a' });
    const open = await queue.enqueue({ items: ITEMS.slice(0, 1) as never });
    expect(mine.owner).toBe('key-a');
    await queue.ping();
    expect((await queue.get(mine.id))?.owner).toBe('key-a');
    expect((await queue.get(open.id))?.owner).toBeNull();
    const w = worker(appRunner(solver));
    void w.run();
    await until('both done', async () => (await queue.get(mine.id))?.status === 'done' && (await queue.get(open.id))?.status === 'done');
    expect((await queue.get(mine.id))?.owner).toBe('key-a');
    await queue.close();
    await teardown();
  });

  it('a job taken more times than maxAttempts is failed as abandoned, and its results answer 409 with the reason', async () => {
    await replicas();
    const id = await submit(ITEMS.slice(0, 2));
    for (let attempt = 1; attempt <= 2; attempt++) {
      const stall = stalling(appRunner(solver), 0);
      const w = worker(stall.run, { heartbeatMs: 60_000, maxAttempts: 2 });
      void w.run();
      await until(`attempt ${attempt} running`, async () => (await status(id)).attempts === attempt);
      w.kill();
      await redis.del(`${prefix}worker:${w.id}`);
    }
    const last = worker(appRunner(solver), { maxAttempts: 2 });
    void last.run();
    await until('job failed', async () => (await status(id)).status === 'failed');
    expect((await status(id)).error).toMatch(/abandoned after 2 attempts/);
    const res = await apiB.inject({ url: `/v1/jobs/${id}/results` });
    expect(res.statusCode).toBe(409);
    expect(Problem.parse(res.json()).detail).toMatch(/abandoned/);
    await teardown();
  });
});

describe('Redis job queue that cannot be reached', () => {
  it('POST /v1/jobs and GET /v1/jobs/{id} answer 503 queue-unavailable with Retry-After, never a 500', async () => {
    // Port 1 on loopback: nothing listens there.
    const app = await testApp({ config: { REDIS_URL: 'redis://127.0.0.1:1', JOB_KEY_PREFIX: `${runPrefix}down:` } });
    const post = await postJson(app, '/v1/jobs', { items: [{ kind: 'orbit', request: GOOD.orbit }] });
    expect(post.statusCode, post.body).toBe(503);
    expect(post.headers['retry-after']).toBe('5');
    expect(Problem.parse(post.json()).type).toBe('/problems/queue-unavailable');
    const get = await app.inject({ url: `/v1/jobs/${randomUUID()}` });
    expect(get.statusCode).toBe(503);
    expect(get.headers['retry-after']).toBe('5');
    // The Redis client's own words (ECONNREFUSED, stack overflows ...) stay in the logs.
    expect(Problem.parse(get.json()).detail).toBe('the job queue\'s store does not answer; retry after 5 s');
    // The synchronous batch does not need the queue.
    expect((await postJson(app, '/v1/batch', { items: [{ kind: 'orbit', request: GOOD.orbit }] })).statusCode).toBe(200);
    // Readiness names the missing dependency instead of answering ok.
    const ready = await app.inject({ url: '/readyz' });
    expect(ready.statusCode).toBe(503);
    expect(ready.json()).toMatchObject({ status: 'not-ready', missing: ['job-queue'] });
    await app.close();
  });
});
