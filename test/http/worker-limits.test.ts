import { setTimeout as sleep } from 'node:timers/promises';
import { afterEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { parseLines } from '../helpers/batch.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

// Issue 13, deadlines and worker threads: a heavy task past REQUEST_DEADLINE_S is stopped (its
// thread replaced) and answers 504 deadline-exceeded; a worker thread that dies under its task (here
// of its heap limit, WORKER_MAX_HEAP_MB) answers 503 worker-failed with Retry-After, and the pool
// replaces the thread. Assertions are on outcomes, never on time.

// Invented stations spread over the globe.
const stations = (n: number) => Array.from({ length: n }, (_, i) => ({ id: `site-${i}`, latitude: -60 + (120 * i) / Math.max(1, n - 1), longitude: -170 + ((i * 67) % 340), altitude: 0.1, minElevation: 0 }));
/** A pass search over `days` and `n` stations: more than a day or four stations goes to a worker thread. */
const search = (days: number, n: number, extra: object = {}) => ({
  ...DEMO_ORBIT,
  window: { start: EPOCH, stop: new Date(Date.parse(EPOCH) + days * 86_400_000).toISOString() },
  stations: stations(n),
  ...extra,
});

let app: FastifyInstance | undefined;
afterEach(async () => {
  await app?.close();
  app = undefined;
});

/** A central-force track of two samples (invented Kepler well, consistent units): a worker-thread job of milliseconds. */
const tiny = (energy: number) => ({ mass: 1, potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 1, energy, track: { duration: 1, samples: 2 } });
/**
 * Ten million radial periods of a Kepler well: 8.4 s of worker time measured on the project's
 * machine, far past a 1 s deadline on any machine (a 31-day 100-station pass search, used here
 * before, can end inside a second on a quiet machine).
 */
const HEAVY = { ...tiny(-0.3), track: { periods: 10_000_000, samples: 1000 } };

/**
 * A tiny worker-thread job (a new scenario each try) until one answers 200. The first also
 * starts the thread; with a deadline a thread still starting on a loaded machine may cost a try
 * (504), after which the next thread starts while this waits.
 */
async function warm(server: FastifyInstance, tag: number): Promise<void> {
  let status = 0;
  for (let i = 0; i < 8 && status !== 200; i++) {
    if (i > 0) await sleep(2000);
    status = (await postJson(server, '/v1/central-force', tiny(-0.3 - 0.001 * (tag + i)))).statusCode;
  }
  expect(status).toBe(200);
}

describe('REQUEST_DEADLINE_S', { timeout: 180_000 }, () => {
  it('a heavy task past the deadline answers 504 deadline-exceeded; the thread is replaced and the next heavy request answered', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1, REQUEST_DEADLINE_S: 1 } });
    await warm(app, 1);
    const done = app.pool.stats().completed;
    const res = await postJson(app, '/v1/central-force', HEAVY);
    expect(res.statusCode, res.body.slice(0, 300)).toBe(504);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.json()).toMatchObject({ type: '/problems/deadline-exceeded', status: 504 });
    expect(res.json().detail).toMatch(/REQUEST_DEADLINE_S/);
    // Nothing was stored: the same request is computed again (and stopped again), never a cached 200.
    expect((await postJson(app, '/v1/central-force', HEAVY)).statusCode).toBe(504);
    await warm(app, 9);
    expect(app.pool.stats()).toMatchObject({ threads: 1, active: 0 });
    expect(app.pool.stats().completed).toBeGreaterThan(done);
  });

  it('per batch item: the item past the deadline is a 504 deadline-exceeded line, the others are answered', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1, REQUEST_DEADLINE_S: 1, BATCH_CONCURRENCY: 1 } });
    await warm(app, 1);
    // The item past the deadline comes last: its stopped thread is replaced after it, and a job
    // waiting for the new thread spends that wait from its own deadline (queueing counts).
    const res = await postJson(app, '/v1/batch', { items: [
      { id: 'small', kind: 'central-force', request: tiny(-0.25) },
      { id: 'orbit', kind: 'orbit', request: DEMO_ORBIT },
      { id: 'big', kind: 'central-force', request: HEAVY },
    ] });
    expect(res.statusCode).toBe(200);
    const lines = parseLines(res.rawPayload);
    expect(lines.map((l) => [l.id, l.status]), JSON.stringify(lines.map((l) => l.problem?.detail))).toEqual([['small', 200], ['orbit', 200], ['big', 504]]);
    expect(lines[2]!.problem).toMatchObject({ type: '/problems/deadline-exceeded' });
  });
});

describe('WORKER_MAX_HEAP_MB', { timeout: 180_000 }, () => {
  it('a worker thread that runs out of heap mid-task: 503 worker-failed with Retry-After, then a new thread answers', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1, WORKER_MAX_HEAP_MB: 24 } });
    await warm(app, 1);
    // Pointing samples every second of 7 days over 20 stations (about 370,000, under the 500,000 limit): objects far over 24 MiB.
    const res = await postJson(app, '/v1/passes', search(7, 20, { pointing: { step: 1 } }));
    expect(res.statusCode, res.body.slice(0, 300)).toBe(503);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.json()).toMatchObject({ type: '/problems/worker-failed', status: 503 });
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect(res.body).not.toMatch(/heap|ERR_WORKER/i); // the client learns no internals
    await warm(app, 7);
    expect(app.pool.stats()).toMatchObject({ threads: 1, active: 0 });
  });

  it('is read from the environment and bounded', async () => {
    const { loadConfig } = await import('../../src/config.js');
    expect(loadConfig({ WORKER_MAX_HEAP_MB: '256' }).WORKER_MAX_HEAP_MB).toBe(256);
    expect(() => loadConfig({ WORKER_MAX_HEAP_MB: '1' })).toThrow(/WORKER_MAX_HEAP_MB/);
  });
});
