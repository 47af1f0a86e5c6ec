import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import type { PoolService } from '../../src/plugins/pool.js';
import { postJson, testApp } from '../helpers/app.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';

// Issue 13, defect 7: identical requests in flight share one computation (single flight by
// scenario hash). Computations are counted where they start: app.pool.solve (every solving route
// calls it once per computation, inline or on a thread) and the pool's finished-task count.

// Six invented stations: a two-day search over them goes to a worker thread (tens of ms at least).
const STATIONS = Array.from({ length: 6 }, (_, i) => ({ id: `site-${i}`, latitude: -60 + 24 * i, longitude: -170 + 61 * i, altitude: 0.1, minElevation: 5 }));
const SEARCH = { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-03T00:00:00Z' }, stations: STATIONS };
// 5000 Earth-fixed samples: also a worker-thread job, answered as a stream.
const TRACK = { ...DEMO_ORBIT, frame: 'itrf', grid: { start: EPOCH, stop: '2026-12-01T13:53:10Z', step: 10 } };

let app: FastifyInstance | undefined;
afterEach(async () => {
  await app?.close();
  app = undefined;
});

/** Wrap app.pool.solve: count the calls and hold each one until release() (so every request is in flight first). */
function holdSolves(target: FastifyInstance) {
  const pool: PoolService = target.pool;
  const real = pool.solve.bind(pool);
  let open: () => void = () => {};
  const gate = new Promise<void>((resolve) => { open = resolve; });
  const counter = { calls: 0, release: () => open() };
  pool.solve = async (job) => {
    counter.calls++;
    await gate;
    return real(job);
  };
  return counter;
}

/** Count cache lookups: a request that looked its hash up has passed validation and hashing; the flight is taken next, in the same turn. */
function countLookups(target: FastifyInstance) {
  const cache = target.answers.cache;
  const real = cache.get.bind(cache);
  const counter = { lookups: 0 };
  cache.get = (hash) => {
    counter.lookups++;
    return real(hash);
  };
  return counter;
}

async function until(check: () => boolean, what: string): Promise<void> {
  for (let i = 0; i < 6000 && !check(); i++) await sleep(10);
  if (!check()) throw new Error(`timed out waiting for ${what}`);
  await sleep(20); // the rest of that turn (microtasks) runs before this timer
}

describe('single flight by scenario hash', { timeout: 120_000 }, () => {
  it('100 identical concurrent pass searches: one computation on the pool, none refused, 100 identical answers', async () => {
    // One thread and a queue of 4: without sharing, 100 jobs would mostly be refused with 503.
    app = await testApp({ config: { WORKER_THREADS: 1, WORKER_QUEUE_LIMIT: 4 } });
    const answers = await Promise.all(Array.from({ length: 100 }, () => postJson(app!, '/v1/passes', SEARCH)));
    const statuses = answers.map((r) => r.statusCode);
    expect(statuses.filter((s) => s !== 200), answers.find((r) => r.statusCode !== 200)?.body.slice(0, 300)).toEqual([]);
    expect(new Set(answers.map((r) => r.body)).size).toBe(1);
    expect(JSON.parse(answers[0]!.body).passes.length).toBeGreaterThan(5);
    expect(app.pool.stats().completed).toBe(1);
    expect(app.answers.inFlight()).toBe(0);
  });

  it('streamed answers too: 50 identical 5000-sample Earth-fixed tracks (JSON and CSV apart) cost two computations; every body is identical to its kind', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1, WORKER_QUEUE_LIMIT: 4 } });
    const solves = holdSolves(app);
    const lookups = countLookups(app);
    const pending = [
      ...Array.from({ length: 25 }, () => postJson(app!, '/v1/track', TRACK)),
      ...Array.from({ length: 25 }, () => postJson(app!, '/v1/track', { ...TRACK, format: 'csv' })),
    ];
    await until(() => lookups.lookups >= 50, '50 requests in flight');
    solves.release();
    const answers = await Promise.all(pending);
    expect(answers.map((r) => r.statusCode).filter((s) => s !== 200)).toEqual([]);
    expect(solves.calls).toBe(2);
    expect(app.pool.stats().completed).toBe(2);
    const json = new Set(answers.slice(0, 25).map((r) => r.body));
    const csv = new Set(answers.slice(25).map((r) => r.body));
    expect([json.size, csv.size]).toEqual([1, 1]);
    expect(JSON.parse([...json][0]!).samples.length).toBe(5000);
    // RFC 4180 CSV: a header line, then one line per sample.
    expect([...csv][0]!.trimEnd().split('\n').length).toBe(5001);
    // A later request is a cache hit with the same bytes.
    const again = await postJson(app, '/v1/track', TRACK);
    expect(again.headers['x-cache']).toBe('hit');
    expect(again.body).toBe([...json][0]);
  });

  it('a failure is shared by every waiter, and not kept: the next request computes again', async () => {
    app = await testApp();
    const solves = holdSolves(app);
    const lookups = countLookups(app);
    // 100 samples over 99 years of a numerical J2 track: refused (422) by the work estimate.
    const doomed = { ...DEMO_ORBIT, model: 'numerical', forces: [{ kind: 'j2' }], grid: { start: EPOCH, stop: '2125-12-01T00:00:00Z', step: 99 * 365.25 * 864 } };
    const pending = Array.from({ length: 20 }, () => postJson(app!, '/v1/track', doomed));
    await until(() => lookups.lookups >= 20, '20 requests in flight');
    solves.release();
    const answers = await Promise.all(pending);
    expect(solves.calls).toBe(1);
    expect(answers.map((r) => r.statusCode)).toEqual(Array(20).fill(422));
    expect(new Set(answers.map((r) => JSON.parse(r.body).type))).toEqual(new Set(['/problems/integration-failed']));
    expect(new Set(answers.map((r) => JSON.parse(r.body).detail)).size).toBe(1);
    const later = await postJson(app, '/v1/track', doomed);
    expect(later.statusCode).toBe(422);
    expect(solves.calls).toBe(2);
  });

  it('different scenarios are not shared', async () => {
    app = await testApp();
    const solves = holdSolves(app);
    const lookups = countLookups(app);
    const pending = [0, 1, 2].map((k) => postJson(app!, '/v1/passes', { ...SEARCH, stations: DEMO_STATIONS.map((s) => ({ ...s, minElevation: s.minElevation + k })) }));
    await until(() => lookups.lookups >= 3, '3 requests in flight');
    solves.release();
    const answers = await Promise.all(pending);
    expect(answers.map((r) => r.statusCode)).toEqual([200, 200, 200]);
    expect(solves.calls).toBe(3);
    expect(new Set(answers.map((r) => r.headers.etag)).size).toBe(3);
  });

  it('the client that started the computation goes away: the one waiting with it still gets its answer', async () => {
    app = await testApp();
    const solves = holdSolves(app);
    const lookups = countLookups(app);
    await app.listen({ port: 0, host: '127.0.0.1' });
    const { port } = app.server.address() as AddressInfo;
    const body = JSON.stringify(SEARCH);
    const send = () => httpRequest({ host: '127.0.0.1', port, method: 'POST', path: '/v1/passes', headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) } });
    const first = send();
    first.on('error', () => {}); // destroyed below on purpose
    first.end(body);
    await until(() => lookups.lookups >= 1, 'the first request in flight');
    const second = send();
    const answered = new Promise<{ status: number; text: string }>((resolve, reject) => {
      second.on('response', (res) => {
        const parts: Buffer[] = [];
        res.on('data', (c: Buffer) => parts.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(parts).toString() }));
      });
      second.on('error', reject);
    });
    second.end(body);
    await until(() => lookups.lookups >= 2, 'the second request in flight');
    first.destroy();
    await sleep(100);
    solves.release();
    const { status, text } = await answered;
    expect(status, text.slice(0, 300)).toBe(200);
    expect(solves.calls).toBe(1);
    expect(JSON.parse(text).passes.length).toBeGreaterThan(0);
  });
});
