import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { FastifyInstance } from 'fastify';
import { Problem } from '../../src/schemas/common.js';
import { OrbitAnswer } from '../../src/schemas/orbit.js';
import { TrackAnswer } from '../../src/schemas/track.js';
import { PassesAnswer } from '../../src/schemas/passes.js';
import { EclipsesAnswer } from '../../src/schemas/eclipses.js';
import { TwoBodyAnswer } from '../../src/schemas/two-body.js';
import { CentralForceAnswer } from '../../src/schemas/central-force.js';
import { postJson, testApp } from '../helpers/app.js';
import { answerBytes, GOOD, parseLines, rawLines, type Kind } from '../helpers/batch.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const ANSWER_SCHEMAS = { orbit: OrbitAnswer, track: TrackAnswer, passes: PassesAnswer, eclipses: EclipsesAnswer, 'two-body': TwoBodyAnswer, 'central-force': CentralForceAnswer };
const KINDS = Object.keys(GOOD) as Kind[];

/** An orbit that no other test asks for, so that the first request of it is a cache miss. */
const freshOrbit = (tag: number) => ({ centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, raan: 100 + tag + Math.random() } });

describe('POST /v1/batch', () => {
  it('answers one NDJSON line per item in input order, ids echoed, every kind parsed by its own answer schema', async () => {
    const items = KINDS.map((kind, i) => ({ ...(i % 2 === 0 ? { id: `item-${kind}` } : {}), kind, request: GOOD[kind] }));
    const res = await postJson(app, '/v1/batch', { items });
    expect(res.statusCode, res.body).toBe(200);
    expect(res.headers['content-type']).toBe('application/x-ndjson');
    const lines = parseLines(res.rawPayload);
    expect(lines.map((l) => l.index)).toEqual(items.map((_, i) => i));
    expect(lines.map((l) => l.kind)).toEqual(KINDS);
    expect(lines.map((l) => l.id)).toEqual(items.map((item) => ('id' in item ? item.id : null)));
    for (const line of lines) {
      expect(line.status, JSON.stringify(line.problem)).toBe(200);
      const answer = ANSWER_SCHEMAS[line.kind].parse(line.answer);
      expect(line.scenarioHash).toBe((answer as { scenarioHash: string }).scenarioHash);
      expect(line.problem).toBeUndefined();
    }
  });

  it('a bad item next to good ones is that line\'s problem (400 schema, 422 physics); the others still answer', async () => {
    const items = [
      { id: 'good-1', kind: 'orbit', request: GOOD.orbit },
      { id: 'hyperbola-with-positive-a', kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, eccentricity: 1.5 } } },
      { id: 'good-2', kind: 'track', request: GOOD.track },
      { id: 'missing-fields', kind: 'passes', request: { centralBody: 'earth' } },
      { id: 'unknown-key', kind: 'two-body', request: { ...GOOD['two-body'], colour: 'blue' } },
      { id: 'good-3', kind: 'central-force', request: GOOD['central-force'] },
    ];
    const res = await postJson(app, '/v1/batch', { items });
    expect(res.statusCode).toBe(200);
    const lines = parseLines(res.rawPayload);
    expect(lines.map((l) => [l.id, l.status])).toEqual([
      ['good-1', 200], ['hyperbola-with-positive-a', 422], ['good-2', 200], ['missing-fields', 400], ['unknown-key', 400], ['good-3', 200],
    ]);
    const bad = lines[1]!;
    expect(bad.answer).toBeUndefined();
    expect(bad.scenarioHash).toBeUndefined();
    const problem = Problem.parse(bad.problem);
    expect(problem.type).toBe('/problems/semi-major-axis-sign');
    expect(problem.instance).toBe('/v1/orbit');
    expect(Problem.parse(lines[3]!.problem).errors?.map((e) => e.path)).toContain('body.window');
    expect(Problem.parse(lines[4]!.problem).type).toBe('/problems/validation-failed');
  });

  it('a line\'s answer byte-equals the endpoint\'s answer, and batches share the endpoints\' cache both ways', async () => {
    // Endpoint first, then the batch: the batch line is served from the cache, byte for byte.
    const first1 = freshOrbit(1);
    const alone = await postJson(app, '/v1/orbit', first1);
    expect(alone.headers['x-cache']).toBe('miss');
    const hitsBefore = app.answers.cache.stats().hits;
    const first = await postJson(app, '/v1/batch', { items: [{ kind: 'orbit', request: first1 }] });
    expect(app.answers.cache.stats().hits).toBe(hitsBefore + 1);
    expect(answerBytes(rawLines(first.rawPayload)[0]!).equals(alone.rawPayload)).toBe(true);

    // Batch first, then the endpoint (and a second batch): both served from the cache, byte for byte.
    const scenario = freshOrbit(2);
    const track = { ...GOOD.track, elements: scenario.elements };
    const batch1 = await postJson(app, '/v1/batch', { items: [{ kind: 'orbit', request: scenario }, { kind: 'track', request: track }] });
    const [orbitLine, trackLine] = rawLines(batch1.rawPayload);
    const orbitAlone = await postJson(app, '/v1/orbit', scenario);
    expect(orbitAlone.headers['x-cache']).toBe('hit');
    expect(answerBytes(orbitLine!).equals(orbitAlone.rawPayload)).toBe(true);
    // A track inside a batch is the JSON track (fixed decimals kept: spliced, never re-serialised).
    const trackAlone = await postJson(app, '/v1/track', track, { accept: 'application/json' });
    expect(trackAlone.headers['x-cache']).toBe('hit');
    expect(answerBytes(trackLine!).equals(trackAlone.rawPayload)).toBe(true);
    const hits = app.answers.cache.stats().hits;
    const batch2 = await postJson(app, '/v1/batch', { items: [{ kind: 'orbit', request: scenario }, { kind: 'track', request: track }] });
    expect(app.answers.cache.stats().hits).toBe(hits + 2);
    expect(batch2.rawPayload.equals(batch1.rawPayload)).toBe(true);
  });

  it('lines are the same whatever the concurrency, and come out in input order when early items are the slow ones', async () => {
    // Heavy items (a 10 000-sample track, a long pass search) first, light ones after.
    const items = [
      { kind: 'track', request: { ...GOOD.track, elements: { ...DEMO_ORBIT.elements, raan: 7 }, grid: { start: EPOCH, stop: '2026-12-07T22:39:00Z', step: 60 } } },
      { kind: 'passes', request: { ...GOOD.passes, window: { start: EPOCH, stop: '2026-12-03T00:00:00Z' } } },
      ...Array.from({ length: 10 }, (_, i) => ({ id: `light-${i}`, kind: 'orbit', request: freshOrbit(10 + i) })),
    ];
    const one = await testApp({ config: { BATCH_CONCURRENCY: 1 } });
    const eight = await testApp({ config: { BATCH_CONCURRENCY: 8 } });
    const [a, b] = await Promise.all([postJson(one, '/v1/batch', { items }), postJson(eight, '/v1/batch', { items })]);
    const [linesA, linesB] = [rawLines(a.rawPayload), rawLines(b.rawPayload)];
    expect(parseLines(b.rawPayload).map((l) => [l.index, l.status])).toEqual(items.map((_, i) => [i, 200]));
    expect(parseLines(b.rawPayload)[0]!.answer).toMatchObject({ sampleCount: 10_000 });
    expect(linesB.length).toBe(linesA.length);
    for (let i = 0; i < linesA.length; i++) expect(linesB[i]!.equals(linesA[i]!), `line ${i}`).toBe(true);
    await one.close();
    await eight.close();
  });

  it('for any mix of good and bad items and any concurrency, line i is item i with the status the endpoint answers alone', async () => {
    const pool = [
      { kind: 'orbit', request: GOOD.orbit },
      { kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, eccentricity: 1.5 } } },
      { kind: 'track', request: GOOD.track },
      { kind: 'two-body', request: GOOD['two-body'] },
      { kind: 'central-force', request: GOOD['central-force'] },
      { kind: 'central-force', request: { ...GOOD['central-force'], energy: -100 } },
      { kind: 'passes', request: { centralBody: 'earth' } },
    ] as const;
    const alone: number[] = [];
    for (const item of pool) alone.push((await postJson(app, `/v1/${item.kind}`, item.request, { accept: 'application/json' })).statusCode);
    expect(new Set(alone).size, `statuses alone: ${alone}`).toBeGreaterThan(2);
    const apps = new Map<number, FastifyInstance>();
    for (const c of [1, 2, 5]) apps.set(c, await testApp({ config: { BATCH_CONCURRENCY: c } }));
    await fc.assert(fc.asyncProperty(fc.array(fc.nat(pool.length - 1), { minLength: 1, maxLength: 8 }), fc.constantFrom(1, 2, 5), async (picks, c) => {
      const items = picks.map((p, i) => ({ id: `p${i}`, ...pool[p]! }));
      const lines = parseLines((await postJson(apps.get(c)!, '/v1/batch', { items })).rawPayload);
      expect(lines.map((l) => [l.index, l.id, l.kind, l.status])).toEqual(picks.map((p, i) => [i, `p${i}`, pool[p]!.kind, alone[p]]));
    }), { numRuns: 25 });
    for (const a of apps.values()) await a.close();
  });

  it('GET /healthz answers while a 300-item batch is being solved (assertions on order, not time)', async () => {
    const items = Array.from({ length: 300 }, (_, i) => ({ kind: 'orbit', request: freshOrbit(100 + i) }));
    const order: string[] = [];
    const big = postJson(app, '/v1/batch', { items }).then((res) => { order.push('batch'); return res; });
    const health = await app.inject({ url: '/healthz' });
    order.push('healthz');
    expect(health.statusCode).toBe(200);
    expect(parseLines((await big).rawPayload)).toHaveLength(300);
    expect(order).toEqual(['healthz', 'batch']);
  });

  it('hostile items (huge, zero, wrong types, other formats) never make a 500 line', async () => {
    const items = [
      { kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, semiMajorAxis: 1e308 } } },
      { kind: 'orbit', request: { centralBody: 'earth', state: { epoch: EPOCH, position: [0, 0, 0], velocity: [0, 0, 0] } } },
      { kind: 'orbit', request: { centralBody: { name: 'nothing', gm: 0 }, elements: DEMO_ORBIT.elements } },
      { kind: 'track', request: { ...GOOD.track, grid: { start: EPOCH, stop: EPOCH, step: 1e-300 } } },
      { kind: 'track', request: { ...GOOD.track, format: 'csv' } },
      { kind: 'track', request: { ...GOOD.track, format: 42 } },
      { kind: 'central-force', request: { ...GOOD['central-force'], format: 'svg' } },
      { kind: 'central-force', request: { ...GOOD['central-force'], mass: 1e-320, energy: -1e308 } },
      { kind: 'two-body', request: { ...GOOD['two-body'], track: { grid: 'tomorrow' } } },
      { kind: 'passes', request: { items: [] } },
      { kind: 'orbit', request: {} },
    ];
    const res = await postJson(app, '/v1/batch', { items });
    expect(res.statusCode).toBe(200);
    const lines = parseLines(res.rawPayload);
    expect(lines).toHaveLength(items.length);
    for (const line of lines) {
      expect(line.status, `${line.index}: ${JSON.stringify(line.problem)}`).toBeLessThan(500);
      if (line.status !== 200) expect(Problem.parse(line.problem).status).toBe(line.status);
    }
    // Zero position, zero GM, a grid that is not one, missing fields: refused, whatever the rest does.
    for (const i of [1, 2, 5, 8, 9, 10]) expect(lines[i]!.status, `item ${i}`).toBeGreaterThanOrEqual(400);
    expect(lines[5]!.status).toBe(400); // not a format name: the endpoint's own validation answers
    // Other formats of the endpoint are products of the line (test/http/job-products.test.ts checks their bytes).
    expect([lines[4]!.status, lines[4]!.format, lines[4]!.mediaType]).toEqual([200, 'csv', 'text/csv; charset=utf-8; header=present']);
    expect([lines[6]!.status, lines[6]!.format]).toEqual([200, 'svg']);
  });
});

describe('POST /v1/batch limits', () => {
  let small: FastifyInstance;
  beforeAll(async () => {
    small = await testApp({ config: { BATCH_MAX_ITEMS: 3, BATCH_MAX_TRACK_SAMPLES: 100, BATCH_MAX_ANSWER_BYTES: 4096, BODY_LIMIT_BYTES: 16_384 } });
  });
  afterAll(async () => { await small.close(); });

  it('more than BATCH_MAX_ITEMS items is a 422 limit-exceeded naming the maximum; no items is a 400', async () => {
    const item = { kind: 'orbit', request: GOOD.orbit };
    const over = await postJson(small, '/v1/batch', { items: [item, item, item, item] });
    expect(over.statusCode).toBe(422);
    expect(over.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(over.json().type).toBe('/problems/limit-exceeded');
    expect(over.json().detail).toMatch(/maximum is 3/);
    expect((await postJson(small, '/v1/batch', { items: [item, item, item] })).statusCode).toBe(200);
    const none = await postJson(small, '/v1/batch', { items: [] });
    expect(none.statusCode).toBe(400);
  });

  it('an envelope that is not a list of known kinds is a 400 naming the field; a body over BODY_LIMIT_BYTES is a 413', async () => {
    const res = await postJson(small, '/v1/batch', { items: [{ kind: 'orbit', request: GOOD.orbit }, { kind: 'ephemeris', request: {} }] });
    expect(res.statusCode).toBe(400);
    expect(res.json().errors.map((e: { path: string }) => e.path)).toContain('body.items.1.kind');
    const notObject = await postJson(small, '/v1/batch', { items: [{ kind: 'orbit', request: [1, 2] }] });
    expect(notObject.statusCode).toBe(400);
    const extra = await postJson(small, '/v1/batch', { items: [{ kind: 'orbit', request: GOOD.orbit, priority: 1 }] });
    expect(extra.statusCode).toBe(400);
    const huge = await postJson(small, '/v1/batch', { items: [{ id: 'x'.repeat(200), kind: 'orbit', request: { padding: 'y'.repeat(20_000) } }] });
    expect(huge.statusCode).toBe(413);
  });

  it('a track over BATCH_MAX_TRACK_SAMPLES is that item\'s 422 too-many-samples (track, two-body and central-force tracks); the others answer', async () => {
    const items = [
      { id: 'long', kind: 'track', request: { ...GOOD.track, grid: { start: EPOCH, stop: '2026-12-01T01:41:00Z', step: 60 } } },
      { id: 'ok', kind: 'track', request: { ...GOOD.track, grid: { start: EPOCH, stop: '2026-12-01T00:05:00Z', step: 60 } } },
      { id: 'pair', kind: 'two-body', request: { ...GOOD['two-body'], track: { grid: { times: Array.from({ length: 101 }, (_, i) => `2026-12-01T00:${String(i % 60).padStart(2, '0')}:${String(Math.floor(i / 60)).padStart(2, '0')}Z`) } } } },
    ];
    const res = await postJson(small, '/v1/batch', { items });
    const lines = parseLines(res.rawPayload);
    expect(lines.map((l) => [l.id, l.status])).toEqual([['long', 422], ['ok', 200], ['pair', 422]]);
    expect(lines[0]!.problem?.type).toBe('/problems/too-many-samples');
    expect(lines[0]!.problem?.detail).toMatch(/102 samples.*maximum is 100/);
    const radial = await postJson(small, '/v1/batch', { items: [{ kind: 'central-force', request: { ...GOOD['central-force'], track: { periods: 1 } } }] });
    // Without samples the central-force track has its default 201 samples.
    expect(parseLines(radial.rawPayload)[0]!.problem?.type).toBe('/problems/too-many-samples');
  });

  it('an answer over BATCH_MAX_ANSWER_BYTES is that item\'s 422 limit-exceeded with its scenario hash; the answer stays cached', async () => {
    const res = await postJson(small, '/v1/batch', { items: [{ kind: 'track', request: { ...GOOD.track, grid: { start: EPOCH, stop: '2026-12-01T01:00:00Z', step: 60 } } }] });
    const [line] = parseLines(res.rawPayload);
    expect(line!.status).toBe(422);
    expect(line!.problem?.type).toBe('/problems/limit-exceeded');
    expect(line!.scenarioHash).toMatch(/^[0-9a-f]{64}$/);
    const stored = await small.inject({ url: `/v1/results/${line!.scenarioHash}` });
    expect(stored.statusCode).toBe(200);
    expect(stored.rawPayload.length).toBeGreaterThan(4096);
    expect(TrackAnswer.parse(stored.json()).sampleCount).toBe(61);
  });
});
