import { spawn, type ChildProcess } from 'node:child_process';
import { createServer, type AddressInfo } from 'node:net';
import { setTimeout as sleep } from 'node:timers/promises';
import { describe, expect, it } from 'vitest';
import { Redis } from 'ioredis';
import { buildApp } from '../../src/app.js';
import { postJson, testApp } from '../helpers/app.js';
import { DEMO_ORBIT } from '../helpers/demo.js';
import { deleteKeys, runPrefix } from '../helpers/jobs.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

// Issue 13, defect 10: /readyz covers every dependency the instance needs (the job queue and its
// Redis, load) and names the one missing; it is 503 while the instance closes. Overload (the
// `load` check) is tested in test/http/edge.test.ts.

interface Readiness { status: string; checks: Record<string, string>; missing: string[] }

/** A TCP port nothing listens on (taken from the system, then released). */
async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

const prefixed = (prefix: string) => ({ CACHE_KEY_PREFIX: `${prefix}answer:`, JOB_KEY_PREFIX: `${prefix}jobs:`, ASKERS_KEY_PREFIX: `${prefix}askers:`, RATE_LIMIT_KEY_PREFIX: `${prefix}rl:` });

/** A Redis of this test's own (redis-server on a free port, no persistence), which it may stop. */
async function ownRedis(port: number): Promise<ChildProcess> {
  const child = spawn('redis-server', ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], { stdio: 'ignore' });
  const probe = new Redis(`redis://127.0.0.1:${port}`, { lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
  probe.on('error', () => {});
  for (let i = 0; i < 100; i++) {
    try {
      await probe.connect();
      if ((await probe.ping()) === 'PONG') break;
    } catch {
      await sleep(100);
    }
  }
  probe.disconnect();
  return child;
}

async function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  child.kill('SIGTERM');
  await exited;
}

describe('GET /readyz names what is missing', () => {
  it('in-process: ready, with each check listed', async () => {
    const app = await testApp();
    try {
      const res = await app.inject({ url: '/readyz' });
      expect(res.statusCode).toBe(200);
      expect(res.json<Readiness>()).toMatchObject({ status: 'ok', checks: { 'job-queue': 'ok', load: 'ok' }, missing: [] });
    } finally {
      await app.close();
    }
  });

  it('REDIS_URL where no Redis answers: 503 not-ready naming job-queue (no client internals); the job queue answers 503, orbits still 200', { timeout: 30_000 }, async () => {
    const app = await testApp({ config: { REDIS_URL: `redis://127.0.0.1:${await freePort()}`, ...prefixed(runPrefix('ready')) } });
    try {
      const res = await app.inject({ url: '/readyz' });
      expect(res.statusCode).toBe(503);
      const ready = res.json<Readiness>();
      expect(ready).toMatchObject({ status: 'not-ready', missing: ['job-queue'] });
      expect(ready.checks.load).toBe('ok');
      expect(ready.checks['job-queue']).not.toMatch(/ECONNREFUSED|stack|ioredis/i);
      expect((await app.inject({ url: '/healthz' })).statusCode).toBe(200);
      const job = await postJson(app, '/v1/jobs', { items: [{ kind: 'orbit', request: DEMO_ORBIT }] });
      expect(job.statusCode).toBe(503);
      expect(job.json()).toMatchObject({ type: '/problems/queue-unavailable' });
      expect(Number(job.headers['retry-after'])).toBeGreaterThan(0);
      // The shared cache tier down means slower, never an error.
      expect((await postJson(app, '/v1/orbit', DEMO_ORBIT)).statusCode).toBe(200);
    } finally {
      await app.close();
    }
  });

  it('a Redis that stops and comes back: ready, then 503 naming job-queue, then ready again', { timeout: 60_000 }, async () => {
    const port = await freePort();
    let redis = await ownRedis(port);
    const app = await testApp({ config: { REDIS_URL: `redis://127.0.0.1:${port}`, ...prefixed(runPrefix('ready-own')) } });
    try {
      expect((await app.inject({ url: '/readyz' })).statusCode).toBe(200);
      await stop(redis);
      const down = await app.inject({ url: '/readyz' });
      expect(down.statusCode).toBe(503);
      expect(down.json<Readiness>().missing).toEqual(['job-queue']);
      redis = await ownRedis(port);
      let back = 503;
      for (let i = 0; i < 100 && back !== 200; i++) {
        back = (await app.inject({ url: '/readyz' })).statusCode;
        if (back !== 200) await sleep(200);
      }
      expect(back).toBe(200);
    } finally {
      await app.close();
      await stop(redis);
    }
  });

  it('while the instance closes: 503 closing (health still answers)', { timeout: 30_000 }, async () => {
    const app = await buildApp({ logger: false, config: { RATE_LIMIT_PER_MIN: 0, RATE_LIMIT_HEAVY_PER_MIN: 0, MAX_EVENT_LOOP_DELAY_MS: 0 } });
    // Hold the close in its preClose stage, as a batch in flight does (a route plugin registered
    // after health, so readiness has turned to closing; the server still listens).
    let release: () => void = () => {};
    const held = new Promise<void>((resolve) => { release = resolve; });
    await app.register(async (child) => { child.addHook('preClose', async () => held); });
    await app.listen({ port: 0, host: '127.0.0.1' });
    const { port } = app.server.address() as AddressInfo;
    const base = `http://127.0.0.1:${port}`;
    expect((await fetch(`${base}/readyz`)).status).toBe(200);
    const closed = app.close();
    try {
      await sleep(50);
      const res = await fetch(`${base}/readyz`);
      expect(res.status).toBe(503);
      expect(await res.json()).toMatchObject({ status: 'closing' });
      expect((await fetch(`${base}/healthz`)).status).toBe(200);
    } finally {
      release();
      await closed;
    }
  });
});

describe('GET /readyz with the shared Redis', async () => {
  const ok = await redisAvailable();
  it.skipIf(!ok)('ready with the job queue on the Redis at 127.0.0.1:6379', { timeout: 30_000 }, async () => {
    const prefix = runPrefix('ready-shared');
    const app = await testApp({ config: { REDIS_URL, ...prefixed(prefix) } });
    const redis = new Redis(REDIS_URL);
    try {
      const res = await app.inject({ url: '/readyz' });
      expect(res.statusCode, res.body).toBe(200);
      expect(res.json<Readiness>().checks['job-queue']).toBe('ok');
    } finally {
      await app.close();
      await deleteKeys(redis, prefix);
      redis.disconnect();
    }
  });
});
