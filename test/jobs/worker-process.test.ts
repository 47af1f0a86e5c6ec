// Queue workers as separate processes on the real Redis: killed with SIGKILL mid-job, stopped with
// SIGTERM mid-job, two of them on one queue. Every item's line once, in input order, and byte for
// byte the answer the endpoint gives alone.
import { createHmac } from 'node:crypto';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { Redis } from 'ioredis';
import { JobAnswer } from '../../src/schemas/batch.js';
import { postJson, testApp } from '../helpers/app.js';
import { answerBytes, parseLines, rawLines, until } from '../helpers/batch.js';
import { DEMO_ORBIT } from '../helpers/demo.js';
import { deleteKeys, runPrefix } from '../helpers/jobs.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';
import { startWorker, type WorkerProcess } from '../helpers/worker-process.js';

const available = await redisAvailable();
const RUN = runPrefix('procs');
let testNumber = 0;

/** n orbit items no other run asks for (the raan carries a random part), ids sat-0... */
const orbitItems = (n: number) => Array.from({ length: n }, (_, i) => ({
  id: `sat-${i}`,
  kind: 'orbit',
  request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, raan: (i * 0.3) % 360 + Math.random() * 1e-3, inclination: 40 + (i % 50) } },
}));

describe.skipIf(!available)('queue worker processes (real Redis at 127.0.0.1:6379)', () => {
  let redis: Redis;
  let api: FastifyInstance;
  let fresh: FastifyInstance; // no Redis, no shared cache: the endpoint's own answer, computed here
  let prefix: string;
  let env: Record<string, string>;
  const procs: WorkerProcess[] = [];

  beforeAll(async () => {
    redis = new Redis(REDIS_URL);
    fresh = await testApp();
  }, 120_000);
  afterAll(async () => {
    for (const p of procs) if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill('SIGKILL');
    await deleteKeys(redis, RUN);
    redis.disconnect();
    await fresh.close();
  }, 120_000);

  const setup = async (extra: Record<string, string> = {}) => {
    prefix = `${RUN}${++testNumber}:`;
    env = { REDIS_URL, JOB_KEY_PREFIX: prefix, CACHE_KEY_PREFIX: `${prefix}answer:`, ...extra };
    api = await testApp({ config: { REDIS_URL, JOB_KEY_PREFIX: prefix, CACHE_KEY_PREFIX: `${prefix}answer:`, ...extra } });
  };
  const spawnWorker = () => {
    const p = startWorker(env);
    procs.push(p);
    return p;
  };
  const status = async (id: string) => JobAnswer.parse((await api.inject({ url: `/v1/jobs/${id}` })).json());
  const submit = async (items: unknown[]) => {
    const res = await postJson(api, '/v1/jobs', { items });
    expect(res.statusCode, res.body).toBe(202);
    return res.json().id as string;
  };

  /** Every line once, in input order, each answer byte-equal to the endpoint's own. */
  const checkResults = async (id: string, items: ReturnType<typeof orbitItems>, before: Buffer[] = []) => {
    const res = await api.inject({ url: `/v1/jobs/${id}/results` });
    expect(res.statusCode).toBe(200);
    expect(parseLines(res.rawPayload).map((l) => [l.index, l.id])).toEqual(items.map((item, i) => [i, item.id]));
    const raw = rawLines(res.rawPayload);
    for (let i = 0; i < before.length; i++) expect(raw[i]!.equals(before[i]!.subarray(0, -1)), `stored line ${i} kept`).toBe(true);
    for (let i = 0; i < items.length; i++) {
      const alone = await postJson(fresh, '/v1/orbit', items[i]!.request);
      expect(answerBytes(raw[i]!).equals(alone.rawPayload), `line ${i}`).toBe(true);
    }
  };

  /** The pid of the worker process running the job (BullMQ stores the worker's name, host-pid, on the job). */
  const holder = async (id: string) => Number((await redis.hget(`${prefix}bull:jobs:${id}`, 'pb'))?.split('-').at(-1));

  it('a worker killed with SIGKILL mid-job: the other worker takes the job over and every item comes out once, in order, as the endpoint answers it', async () => {
    await setup();
    const pair = [spawnWorker(), spawnWorker()];
    await Promise.all(pair.map((p) => p.started));
    const items = orbitItems(1000);
    const id = await submit(items);
    await until('a fifth of the job done', async () => (await status(id)).counts.done >= 200, 6000);
    const pid = await holder(id);
    const doomed = pair.find((p) => p.pid === pid)!;
    expect(doomed, `the job names its worker ${pid}`).toBeDefined();
    process.kill(pid, 'SIGKILL');
    await doomed.exited;
    const killedAt = Date.now();
    const before = await redis.lrangeBuffer(`${prefix}job:${id}:lines`, 0, -1);
    expect(before.length).toBeLessThan(1000);
    await until('taken over', async () => (await status(id)).counts.done > before.length, 6000);
    console.log(`SIGKILL takeover by the standby worker: ${((Date.now() - killedAt) / 1000).toFixed(1)} s after the kill; ${before.length} lines stored before`);
    await until('job done', async () => (await status(id)).status === 'done', 6000);
    expect(await holder(id)).not.toBe(pid);
    expect(await status(id)).toMatchObject({ counts: { items: 1000, done: 1000, failed: 0 }, attempts: 2 });
    await checkResults(id, items, before);
    const survivor = pair.find((p) => p !== doomed)!;
    survivor.child.kill('SIGTERM');
    expect((await survivor.exited)[0]).toBe(0);
    await api.close();
  }, 180_000);

  it('a worker stopped with SIGTERM mid-job hands the job back at once and exits; the next worker resumes it', async () => {
    await setup({ JOB_LOCK_MS: '60000' }); // a lapsed lock cannot explain a quick takeover
    const items = orbitItems(300);
    const id = await submit(items);
    const first = spawnWorker();
    await first.started;
    await until('some items done', async () => (await status(id)).counts.done >= 60, 6000);
    process.kill(first.pid, 'SIGTERM');
    const [code] = await first.exited;
    expect(code, first.stderr()).toBe(0);
    const job = await status(id);
    expect(job.status).toBe('queued');
    expect(job.counts.done).toBeLessThan(300);
    const before = await redis.lrangeBuffer(`${prefix}job:${id}:lines`, 0, -1);
    const second = spawnWorker();
    await until('job done', async () => (await status(id)).status === 'done', 6000);
    expect((await status(id)).attempts).toBe(2);
    await checkResults(id, items, before);
    second.child.kill('SIGTERM');
    await second.exited;
    await api.close();
  }, 120_000);

  it('two workers on one queue: every job done, no item twice', async () => {
    await setup();
    const jobs = [orbitItems(100), orbitItems(100), orbitItems(100), orbitItems(100)];
    const ids: string[] = [];
    for (const items of jobs) ids.push(await submit(items));
    const pair = [spawnWorker(), spawnWorker()];
    await Promise.all(pair.map((p) => p.started));
    await until('all done', async () => (await Promise.all(ids.map(status))).every((j) => j.status === 'done'), 6000);
    for (let j = 0; j < ids.length; j++) {
      expect(await redis.llen(`${prefix}job:${ids[j]}:lines`)).toBe(100);
      await checkResults(ids[j]!, jobs[j]!);
    }
    for (const p of pair) p.child.kill('SIGTERM');
    await Promise.all(pair.map((p) => p.exited));
    await api.close();
  }, 120_000);

  it('the worker that finishes a job POSTs its status to the callbackUrl, signed (HMAC-SHA256, RFC 2104, recomputed here)', async () => {
    const got: { headers: Record<string, unknown>; body: string }[] = [];
    const receiver = createServer((req, res) => {
      let body = '';
      req.on('data', (c: Buffer) => { body += c.toString('utf8'); });
      req.on('end', () => { got.push({ headers: req.headers, body }); res.writeHead(204).end(); });
    });
    await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
    const port = (receiver.address() as AddressInfo).port;
    const secret = 'worker process callback secret';
    await setup({ JOB_CALLBACK_HOSTS: `127.0.0.1:${port}`, JOB_CALLBACK_SECRET: secret });
    const res = await postJson(api, '/v1/jobs', { items: orbitItems(3), callbackUrl: `http://127.0.0.1:${port}/done` });
    expect(res.statusCode, res.body).toBe(202);
    const id = res.json().id as string;
    const worker = spawnWorker();
    await worker.started;
    await until('callback received', async () => got.length > 0, 6000);
    const body = JobAnswer.parse(JSON.parse(got[0]!.body));
    expect(body).toMatchObject({ id, status: 'done', counts: { items: 3, done: 3 } });
    const t = String(got[0]!.headers['apsides-signature-timestamp']);
    expect(got[0]!.headers['apsides-signature']).toBe(`sha256=${createHmac('sha256', secret).update(`${t}.${got[0]!.body}`).digest('hex')}`);
    worker.child.kill('SIGTERM');
    await worker.exited;
    expect(got).toHaveLength(1);
    await new Promise((resolve) => receiver.close(resolve));
    await api.close();
  }, 120_000);
});
