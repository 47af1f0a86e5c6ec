import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import fc from 'fast-check';
import { Redis } from 'ioredis';
import { Problem } from '../../src/schemas/common.js';
import { OrbitAnswer } from '../../src/schemas/orbit.js';
import { PassesAnswer } from '../../src/schemas/passes.js';
import { TrackAnswer } from '../../src/schemas/track.js';
import { postJson, testApp } from '../helpers/app.js';
import { GOOD } from '../helpers/batch.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';
import { deleteKeys, runPrefix } from '../helpers/jobs.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

// Hostile bodies and URLs a careless or malicious client sends. Every answer is a small problem
// document from the error table, never a 5xx. Expected behaviour: RFC 9457 (problem details),
// RFC 9110 sec. 15.5 (4xx meanings); the limits are the service's own (docs/errors.md).
let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const LONE = '\ud800';
const problemOf = (res: { statusCode: number; headers: Record<string, unknown>; json: () => unknown }) => {
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  return Problem.parse(res.json());
};

describe('lone UTF-16 surrogates in free text', () => {
  const cases: [string, string, unknown, string][] = [
    ['a custom body name', '/v1/orbit', { centralBody: { name: `x${LONE}`, gm: 398600.4418 }, elements: DEMO_ORBIT.elements }, 'body.centralBody.name'],
    ['a station id', '/v1/passes', { ...GOOD.passes, stations: [{ ...DEMO_STATIONS[0], id: LONE }] }, 'body.stations.0.id'],
    ['a built-in body name', '/v1/orbit', { centralBody: `earth${LONE}`, elements: DEMO_ORBIT.elements }, 'body.centralBody'],
    ['a central-force unit label', '/v1/central-force', { ...GOOD['central-force'], units: { radius: `m${'\udc00'}`, energy: 'J' } }, 'body.units.radius'],
    ['a batch item', '/v1/batch', { items: [{ kind: 'orbit', request: GOOD.orbit }, { kind: 'orbit', id: LONE, request: GOOD.orbit }] }, 'body.items.1.id'],
    ['a key of a batch item request', '/v1/batch', { items: [{ kind: 'orbit', request: { ...GOOD.orbit, [LONE]: 1 } }] }, 'body.items.0.request.\ufffd'],
  ];
  for (const [what, url, body, path] of cases) {
    it(`in ${what} answers 400 validation-failed naming the field, never 500`, async () => {
      const res = await postJson(app, url, body);
      expect(res.statusCode, res.body).toBe(400);
      const problem = problemOf(res);
      expect(problem.type).toBe('/problems/validation-failed');
      expect(problem.errors?.map((e) => e.path)).toContain(path);
    });
  }

  it('a well-formed pair (an emoji) is ordinary text', async () => {
    const res = await postJson(app, '/v1/orbit', { centralBody: { name: 'pebble \ud83e\udea8', gm: 398600.4418 }, elements: DEMO_ORBIT.elements });
    expect(res.statusCode, res.body).toBe(200);
  });
});

describe('error amplification', () => {
  it('500 000 bad epochs answer a short 400 listing 20 issues with the total count', async () => {
    const body = JSON.stringify({ ...DEMO_ORBIT, grid: { times: new Array(500_000).fill(1) } });
    expect(body.length).toBeLessThan(1024 * 1024);
    const res = await app.inject({ method: 'POST', url: '/v1/track', payload: body, headers: { 'content-type': 'application/json' } });
    expect(res.statusCode).toBe(400);
    expect(res.body.length).toBeLessThan(16 * 1024);
    const problem = problemOf(res);
    expect(problem.errors).toHaveLength(20);
    expect(problem.errorCount).toBeGreaterThanOrEqual(20);
    expect(problem.errors![0]!.path).toBe('body.grid.times.0');
  });

  it('long bad strings are echoed clipped to 200 characters', async () => {
    const long = 'y'.repeat(100_000);
    const res = await postJson(app, '/v1/track', { ...DEMO_ORBIT, grid: { times: [long, EPOCH] } });
    expect(res.statusCode).toBe(400);
    expect(res.body.length).toBeLessThan(4 * 1024);
    const problem = problemOf(res);
    for (const e of problem.errors!) expect(e.message.length).toBeLessThanOrEqual(201);
  });

  it('a batch of 200 000 empty items answers a short 400, not one issue per item', async () => {
    const body = JSON.stringify({ items: new Array(200_000).fill({}) });
    const res = await app.inject({ method: 'POST', url: '/v1/batch', payload: body, headers: { 'content-type': 'application/json' } });
    expect(res.statusCode).toBe(400);
    expect(res.body.length).toBeLessThan(16 * 1024);
    expect(problemOf(res).errors!.length).toBeLessThanOrEqual(20);
  });
});

describe('deep nesting', () => {
  const deep = (n: number) => `${'['.repeat(n)}${']'.repeat(n)}`;
  for (const url of ['/v1/batch', '/v1/jobs', '/v1/orbit']) {
    it(`${url}: nesting 10 000 deep inside items[].request answers 400 json-too-deep at parse time`, async () => {
      const payload = `{"items":[{"kind":"orbit","request":{"centralBody":${deep(10_000)}}}]}`;
      const res = await app.inject({ method: 'POST', url, payload, headers: { 'content-type': 'application/json' } });
      expect(res.statusCode, res.body.slice(0, 300)).toBe(400);
      expect(problemOf(res).type).toBe('/problems/json-too-deep');
    });
  }

  it('brackets inside strings do not count as nesting', async () => {
    const res = await postJson(app, '/v1/orbit', { centralBody: { name: '['.repeat(60), gm: 398600.4418 }, elements: DEMO_ORBIT.elements });
    expect(res.statusCode, res.body).toBe(200);
  });
});

describe('deep nesting with the Redis job queue', async () => {
  const ok = await redisAvailable();
  it.skipIf(!ok)('POST /v1/jobs: 10 000 deep inside items[].request is 400 json-too-deep (not 503 with Retry-After) and nothing is queued; 60 deep is queued', { timeout: 30_000 }, async () => {
    const prefix = runPrefix('deep-jobs');
    const queued = await testApp({ config: { REDIS_URL, JOB_KEY_PREFIX: `${prefix}jobs:`, CACHE_KEY_PREFIX: `${prefix}answer:`, ASKERS_KEY_PREFIX: `${prefix}askers:`, RATE_LIMIT_KEY_PREFIX: `${prefix}rl:` } });
    const redis = new Redis(REDIS_URL);
    try {
      const nested = (n: number) => `{"items":[{"kind":"orbit","request":{"centralBody":${'['.repeat(n)}${']'.repeat(n)}}}]}`;
      const deep = await queued.inject({ method: 'POST', url: '/v1/jobs', payload: nested(10_000), headers: { 'content-type': 'application/json' } });
      expect(deep.statusCode, deep.body.slice(0, 300)).toBe(400);
      expect(problemOf(deep).type).toBe('/problems/json-too-deep');
      expect(deep.headers['retry-after']).toBeUndefined();
      // Under MAX_JSON_DEPTH (64) the body parses and is queued as it is (the item gets its
      // endpoint's 400 as its line when a worker runs it): stored in Redis, never a Redis error.
      const shallow = await queued.inject({ method: 'POST', url: '/v1/jobs', payload: nested(60), headers: { 'content-type': 'application/json' } });
      expect(shallow.statusCode, shallow.body.slice(0, 300)).toBe(202);
      const list = await queued.inject({ url: '/v1/jobs' });
      expect(list.statusCode).toBe(200);
      expect(list.json().jobs.map((j: { id: string }) => j.id)).toEqual([shallow.json().id]);
    } finally {
      await queued.close();
      await deleteKeys(redis, prefix);
      redis.disconnect();
    }
  });
});

describe('router errors and request ids', () => {
  it('a 10 000-character path segment answers 414 uri-too-long without echoing it', async () => {
    const res = await app.inject({ url: `/v1/results/${'a'.repeat(10_000)}` });
    expect(res.statusCode).toBe(414);
    expect(res.body.length).toBeLessThan(1024);
    expect(problemOf(res).type).toBe('/problems/uri-too-long');
  });

  it('a bad percent-encoding answers 400 malformed-url as a problem', async () => {
    const res = await app.inject({ url: '/v1/results/%' });
    expect(res.statusCode).toBe(400);
    expect(problemOf(res).type).toBe('/problems/malformed-url');
  });

  it('an unknown route is a problem whose instance and detail are clipped', async () => {
    const res = await app.inject({ url: `/v1/${'z'.repeat(5000)}/x` });
    expect(res.statusCode).toBe(404);
    expect(res.body.length).toBeLessThan(2048);
  });

  it('a plain short x-request-id is kept; a 10 kB or odd one is replaced', async () => {
    const kept = await app.inject({ url: '/v1/nothing', headers: { 'x-request-id': 'nightly-run:42/7' } });
    expect(problemOf(kept).requestId).toBe('nightly-run:42/7');
    const long = await app.inject({ url: '/v1/nothing', headers: { 'x-request-id': 'r'.repeat(10_000) } });
    const odd = await app.inject({ url: '/v1/nothing', headers: { 'x-request-id': 'a b<script>' } });
    for (const res of [long, odd]) {
      const id = problemOf(res).requestId;
      expect(id.length).toBeLessThanOrEqual(128);
      expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-z]+$/);
    }
  });
});

describe('heavy work decided by its size', () => {
  it('a numerical track of 100 samples over 99 years answers 422 before any integration', async () => {
    const res = await postJson(app, '/v1/track', {
      ...DEMO_ORBIT, model: 'numerical', forces: [{ kind: 'j2' }],
      grid: { start: EPOCH, stop: '2125-12-01T00:00:00Z', step: 99 * 365.25 * 864 },
    });
    expect(res.statusCode, res.body).toBe(422);
    const problem = problemOf(res);
    expect(problem.type).toBe('/problems/integration-failed');
    expect(problem.detail).toMatch(/orbits.*integrator steps/);
    expect(app.pool.stats().completed).toBe(0); // no thread was asked
  });
});

describe('non-finite results are refused, never printed as null', () => {
  // JSON has no NaN or Infinity (RFC 8259 sec. 6): a serialiser writes null, which a client reads
  // as "no value". Every answer is checked before it is sent; a non-finite number is a 422 naming
  // the field. The bodies below are the ones that answered 200 with nulls before the check.
  const day = { start: EPOCH, stop: '2026-12-02T00:00:00Z' };
  const cases: [string, string, unknown, string, string | null][] = [
    ['semiMajorAxis 5e-324 (velocity overflows)', '/v1/orbit', { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, semiMajorAxis: 5e-324 } }, '/problems/non-finite-result', 'answer.state.velocity.0'],
    ['the same orbit as an SVG plot', '/v1/orbit', { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, semiMajorAxis: 5e-324 }, format: 'svg' }, '/problems/non-finite-result', 'answer.state.velocity.0'],
    ['carrierFrequency 1e308 (the Doppler shift overflows)', '/v1/passes', { ...DEMO_ORBIT, window: day, stations: [DEMO_STATIONS[0]], pointing: { step: 60, carrierFrequency: 1e308 } }, '/problems/non-finite-result', 'answer.passes.0.pointing.0.dopplerShift'],
    // span / 5e-324 is Infinity: the sample count is refused before any allocation, naming the step.
    ['grid.step 5e-324', '/v1/track', { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:10:00Z', step: 5e-324 } }, '/problems/too-many-samples', 'body.grid.step'],
    ['grid.step 5e-324 on a zero-length span is one sample', '/v1/track', { ...DEMO_ORBIT, grid: { start: EPOCH, stop: EPOCH, step: 5e-324 } }, '', null],
  ];
  for (const [what, url, body, type, path] of cases) {
    it(`${what}: ${type || '200 with one sample'}`, async () => {
      const res = await postJson(app, url, body);
      if (type === '') {
        expect(res.statusCode, res.body).toBe(200);
        expect(res.json().sampleCount).toBe(1);
        expect(res.json().samples).toHaveLength(1);
        return;
      }
      expect(res.statusCode, res.body).toBe(422);
      const problem = problemOf(res);
      expect(problem.type).toBe(type);
      if (path !== null) {
        expect(problem.errors?.map((e) => e.path)).toEqual([path]);
        if (type === '/problems/non-finite-result') expect(problem.detail).toContain(path);
      }
    });
  }

  // Extreme but schema-valid numbers in the fields above: each answer is a coded 4xx problem, or a
  // 200 whose numbers are all numbers (the answer schemas hold z.number() where a value is
  // promised; the sample count is the number of samples and at least one).
  const extreme = fc.oneof(
    fc.constantFrom(5e-324, 1e-320, 1e-300, 1e-30, 1e-6, 1e6, 1e30, 1e100, 1e300, 1.7976931348623157e308),
    fc.double({ min: 5e-324, max: 1.7976931348623157e308, noNaN: true }),
  );
  const problemOrNumbers = (res: { statusCode: number; body: string; headers: Record<string, unknown>; json: () => unknown }, label: string): unknown => {
    expect(res.statusCode, `${label}: ${res.body.slice(0, 300)}`).toBeLessThan(500);
    if (res.statusCode !== 200) {
      expect(res.statusCode, label).toBeGreaterThanOrEqual(400);
      problemOf(res);
      return null;
    }
    return res.json();
  };

  it('semiMajorAxis: a 200 orbit answer parses with OrbitAnswer (no null state, energy or mean motion)', async () => {
    await fc.assert(fc.asyncProperty(extreme, async (a) => {
      const body = { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, semiMajorAxis: a } };
      const answer = problemOrNumbers(await postJson(app, '/v1/orbit', body), `a = ${a}`);
      if (answer !== null) OrbitAnswer.parse(answer);
    }), { numRuns: 60, seed: 20_261_202 });
  });

  it('grid.step: a 200 track has sampleCount = samples.length >= 1, every number a number (JSON) and every CSV field a decimal', async () => {
    await fc.assert(fc.asyncProperty(extreme, fc.constantFrom('json', 'csv'), async (step, format) => {
      const body = { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:10:00Z', step }, format };
      const res = await postJson(app, '/v1/track', body);
      if (res.statusCode !== 200 || format === 'json') {
        const answer = problemOrNumbers(res, `step ${step}`);
        if (answer === null) return;
        const track = TrackAnswer.parse(answer);
        expect(track.sampleCount).toBe(track.samples.length);
        expect(track.sampleCount).toBeGreaterThanOrEqual(1);
        return;
      }
      const records = res.body.trim().split('\r\n').slice(1);
      expect(records.length).toBeGreaterThanOrEqual(1);
      for (const r of records) for (const f of r.split(',').slice(1)) expect(f).toMatch(/^-?\d+\.\d+$/);
    }), { numRuns: 60, seed: 20_261_203 });
  });

  it('carrierFrequency: every pointing sample of a 200 pass answer has a numeric Doppler shift', async () => {
    await fc.assert(fc.asyncProperty(extreme, async (f) => {
      const body = { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-01T12:00:00Z' }, stations: [DEMO_STATIONS[0]], pointing: { step: 120, carrierFrequency: f } };
      const answer = problemOrNumbers(await postJson(app, '/v1/passes', body), `f = ${f}`);
      if (answer === null) return;
      const passes = PassesAnswer.parse(answer).passes;
      for (const p of passes) for (const s of p.pointing ?? []) expect(typeof s.dopplerShift).toBe('number');
    }), { numRuns: 25, seed: 20_261_204 });
  }, 60_000);
});
