// Jobs on BullMQ with real worker processes (needs the Redis at REDIS_URL, default
// 127.0.0.1:6379; its own key prefix, deleted after): items per second of a 1,000-scenario job with
// 1 worker, of the same work as 2 jobs on 2 workers, of 1 job with 2 workers (one job runs on one
// worker), of the same job again answered from the cache, the takeover time after the worker
// holding a job is killed, and what one BullMQ job costs (1,000 empty jobs through one worker:
// the floor of a flow of item jobs).
import { randomUUID } from 'node:crypto';
import { Queue, Worker } from 'bullmq';
import { Redis } from 'ioredis';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../src/app.js';
import { bullPrefix } from '../src/jobs/bullmq-queue.js';
import { deleteKeys } from '../test/helpers/jobs.js';
import { startWorker, type WorkerProcess } from '../test/helpers/worker-process.js';
import { baselineLoop, nsPerIteration } from './baseline.js';
import type { BenchResult } from './types.js';

const REDIS_URL = process.env.REDIS_URL ?? 'redis://127.0.0.1:6379';
const N = 1000;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

const items = (n: number, tag: number) => Array.from({ length: n }, (_, i) => ({
  id: `sat-${i}`,
  kind: 'orbit',
  request: { centralBody: 'earth', elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6928.137 + tag, eccentricity: 0.0012, inclination: 97.6, raan: (i * 0.36) % 360, argPeriapsis: 90, trueAnomaly: 10 } },
}));

async function submit(api: FastifyInstance, body: unknown): Promise<string> {
  const res = await api.inject({ method: 'POST', url: '/v1/jobs', payload: body as object });
  if (res.statusCode !== 202) throw new Error(res.body);
  return res.json().id as string;
}
const status = async (api: FastifyInstance, id: string) => (await api.inject({ url: `/v1/jobs/${id}` })).json() as { status: string; counts: { done: number } };
async function waitDone(api: FastifyInstance, ids: string[]): Promise<void> {
  while (!(await Promise.all(ids.map((id) => status(api, id)))).every((j) => j.status === 'done')) await sleep(20);
}

/** Seconds from submission to done of the given jobs. */
async function timed(api: FastifyInstance, bodies: unknown[]): Promise<number> {
  const t0 = performance.now();
  const ids = await Promise.all(bodies.map((b) => submit(api, b)));
  await waitDone(api, ids);
  return (performance.now() - t0) / 1000;
}

export async function benchJobs(): Promise<BenchResult[]> {
  const base = nsPerIteration(baselineLoop, 2_000_000);
  const prefix = `apsides:bench:${randomUUID()}:`;
  const redis = new Redis(REDIS_URL);
  const env = { REDIS_URL, JOB_KEY_PREFIX: prefix, CACHE_KEY_PREFIX: `${prefix}answer:`, LOG_LEVEL: 'warn' };
  const api = await buildApp({ logger: false, config: { REDIS_URL, JOB_KEY_PREFIX: prefix, CACHE_KEY_PREFIX: `${prefix}answer:` } });
  await api.ready();
  const procs: WorkerProcess[] = [];
  const spawn = async () => {
    const p = startWorker({ ...env, LOG_LEVEL: 'info' });
    procs.push(p);
    await p.started;
    return p;
  };
  const out: BenchResult[] = [];
  const rate = (name: string, itemsDone: number, seconds: number, note?: string) => {
    const ops = itemsDone / seconds;
    out.push({ name, opsPerSecond: ops, ratioToBaseline: 1e9 / ops / base.ns, ...(note ? { note } : {}) });
  };
  try {
    const first = await spawn();
    rate('job of 1,000 orbits, 1 worker (items/s)', N, await timed(api, [{ items: items(N, 0) }]));
    rate('the same job again, from the cache (items/s)', N, await timed(api, [{ items: items(N, 0) }]));
    const second = await spawn();
    rate('1,000 orbits as 2 jobs of 500, 2 workers (items/s)', N, await timed(api, [{ items: items(N / 2, 1) }, { items: items(N / 2, 2) }]));
    rate('job of 1,000 orbits, 2 workers (items/s)', N, await timed(api, [{ items: items(N, 3) }]), 'one job runs on one worker');

    // Takeover: kill the worker holding a job, time until the other one writes the next line.
    const id = await submit(api, { items: items(N, 4) });
    while ((await status(api, id)).counts.done < 100) await sleep(10);
    const pid = Number((await redis.hget(`${bullPrefix(prefix)}:jobs:${id}`, 'pb'))?.split('-').at(-1));
    const victim = [first, second].find((p) => p.pid === pid)!;
    process.kill(pid, 'SIGKILL');
    await victim.exited;
    const killed = performance.now();
    const stored = (await status(api, id)).counts.done;
    while ((await status(api, id)).counts.done <= stored) await sleep(10);
    const takeoverS = (performance.now() - killed) / 1000;
    out.push({ name: 'takeover after SIGKILL (s, not a rate)', opsPerSecond: 1 / takeoverS, ratioToBaseline: (takeoverS * 1e9) / base.ns, note: `${takeoverS.toFixed(1)} s, JOB_LOCK_MS 5000, JOB_STALLED_INTERVAL_MS 2000` });
    await waitDone(api, [id]);

    // The floor of a flow of item jobs: 1,000 empty BullMQ jobs through one worker in this process.
    const q = new Queue('empty', { connection: new Redis(REDIS_URL), prefix: `${prefix}flow` });
    let done = 0;
    const w = new Worker('empty', async () => { done++; }, { connection: new Redis(REDIS_URL, { maxRetriesPerRequest: null }), prefix: `${prefix}flow`, concurrency: 4 });
    const t0 = performance.now();
    await q.addBulk(Array.from({ length: N }, (_, i) => ({ name: 'item', data: { i } })));
    while (done < N) await sleep(5);
    rate('1,000 empty BullMQ jobs, 1 in-process worker (jobs/s)', N, (performance.now() - t0) / 1000, 'per-item cost of a flow, before any solving');
    await w.close();
    await q.close();
  } finally {
    for (const p of procs) if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill('SIGTERM');
    await Promise.all(procs.map((p) => p.exited));
    await api.close();
    await deleteKeys(redis, prefix);
    redis.disconnect();
  }
  return out;
}
