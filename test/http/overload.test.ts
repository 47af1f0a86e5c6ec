import { setImmediate as nextTurn } from 'node:timers/promises';
import { afterEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/app.js';
import { ERRORS } from '../../src/errors.js';
import { RETRY_AFTER_S } from '../../src/plugins/pool.js';
import { postJson, testApp } from '../helpers/app.js';

// Heavy work runs on worker threads: the event loop keeps answering while it runs, and a full
// queue answers 503 overloaded with Retry-After. Assertions are on order, never on time.

const EPOCH = '2026-12-01T00:00:00Z';
// Invented demo spacecraft and 100 invented stations spread over the globe.
const orbit = {
  centralBody: 'earth',
  elements: { epoch: EPOCH, semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 },
};
const STATIONS = Array.from({ length: 100 }, (_, i) => ({
  id: `site-${i}`, latitude: -80 + (160 * i) / 99, longitude: -180 + ((i * 137) % 360), altitude: 0.1, minElevation: 5,
}));
/** A 100-station, 31-day pass search: seconds of work. */
const bigSearch = (raan: number) => ({
  ...orbit,
  elements: { ...orbit.elements, raan },
  window: { start: EPOCH, stop: '2027-01-01T00:00:00Z' },
  stations: STATIONS,
});
/** A central-force track over 2000 radial periods, 100 000 samples (invented Kepler well, consistent units). */
const longTrack = (energy: number) => ({
  mass: 1,
  potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] },
  angularMomentum: 1,
  energy,
  track: { periods: 2000, samples: 100_000 },
});

let app: FastifyInstance | undefined;
afterEach(async () => { await app?.close(); app = undefined; });

/** Yield to the event loop until the pool holds `count` jobs; fails instead when `done()` turns true first. */
async function untilActive(server: FastifyInstance, count: number, done: () => boolean): Promise<void> {
  while (server.pool.stats().active < count) {
    if (done()) expect.fail(`a request finished before ${count} jobs were on the pool`);
    await nextTurn();
  }
}

// Seconds of real work per test on a quiet machine; the generous timeout only guards against a hang
// (these tests order events, they never time anything).
describe('worker pool under load', { timeout: 180_000 }, () => {
  it('GET /healthz answers while a 100-station, 31-day pass search runs on a worker thread', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1 } });
    const order: string[] = [];
    const heavy = postJson(app, '/v1/passes', bigSearch(40)).then((res) => { order.push('passes'); return res; });
    await untilActive(app, 1, () => order.length > 0);
    const health = await app.inject({ method: 'GET', url: '/healthz' });
    order.push('healthz');
    expect(health.statusCode).toBe(200);
    const search = await heavy;
    expect(search.statusCode, search.body).toBe(200);
    expect(search.json().passes.length).toBeGreaterThan(1000);
    expect(order).toEqual(['healthz', 'passes']);
  });

  it('small requests are answered inline while a 100 000-sample central-force track runs', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1 } });
    const order: string[] = [];
    const heavy = postJson(app, '/v1/central-force', longTrack(-0.5)).then((res) => { order.push('track'); return res; });
    await untilActive(app, 1, () => order.length > 0);
    const small = await postJson(app, '/v1/central-force', { ...longTrack(-0.5), track: undefined });
    order.push('analysis');
    expect(small.statusCode, small.body).toBe(200);
    expect(app.pool.stats().active).toBe(1); // the analysis did not use the pool
    const track = await heavy;
    expect(track.statusCode, track.body).toBe(200);
    expect(track.json().track.sampleCount).toBe(100_000);
    expect(order).toEqual(['analysis', 'track']);
  });

  it('with 1 thread and a queue of 1, a third heavy request answers 503 overloaded with Retry-After; the others finish', async () => {
    app = await testApp({ config: { WORKER_THREADS: 1, WORKER_QUEUE_LIMIT: 1 } });
    let finished = 0;
    const send = (energy: number) => postJson(app!, '/v1/central-force', longTrack(energy)).then((res) => { finished++; return res; });
    const first = send(-0.5);
    await untilActive(app, 1, () => finished > 0);
    const second = send(-0.45);
    await untilActive(app, 2, () => finished > 0);
    const refused = await postJson(app, '/v1/central-force', longTrack(-0.4));
    expect(finished).toBe(0);
    expect(refused.statusCode).toBe(503);
    expect(refused.headers['retry-after']).toBe(String(RETRY_AFTER_S));
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    const problem = refused.json();
    expect(problem).toMatchObject({ type: '/problems/overloaded', status: 503, title: ERRORS.overloaded.title });
    expect(problem.requestId).toMatch(/^[0-9a-f]{8}-[0-9a-z]+$/); // made by the service (no x-request-id sent)
    const [a, b] = await Promise.all([first, second]);
    expect([a.statusCode, b.statusCode]).toEqual([200, 200]);
    // Nothing was stored for the refused scenario: sent again with room in the queue, it is solved.
    const retried = await postJson(app, '/v1/central-force', longTrack(-0.4));
    expect(retried.statusCode).toBe(200);
    expect(retried.headers['x-cache']).toBe('miss');
  });

  it('a throw inside the worker answers 500 internal with the request id (and never hangs)', async () => {
    app = await buildApp({ logger: false, config: { WORKER_THREADS: 1 } });
    // A route only this test has: it sends the pool a malformed job (geodetic without earthFixed; a
    // j2-secular track, which always goes to a thread at this size), which runJob refuses by throwing in the worker.
    app.get('/test/broken-job', async () => {
      const epochsTT = Float64Array.from({ length: 5000 }, (_, i) => 852_076_869.184 + i);
      await app!.pool.solve({
        kind: 'track',
        input: { body: { name: 'earth', gm: 398_600.4418, sources: {} }, model: 'j2-secular', r0: [7000, 0, 0], v0: [0, 7.5, 0], epochTT: 852_076_869.184, epochsTT },
        earthFixed: null,
        geodetic: true,
      });
      return { unreachable: true };
    });
    await app.ready();
    const res = await app.inject({ method: 'GET', url: '/test/broken-job', headers: { 'x-request-id': 'broken-1' } });
    expect(res.statusCode).toBe(500);
    expect(res.json()).toMatchObject({ type: '/problems/internal', status: 500, requestId: 'broken-1' });
    expect(app.pool.stats().completed).toBe(1);
  });
});
