// The request memo in the app (src/plugins/memo.ts): a repeated request is answered from the cache
// before validation, with the same bytes and headers as the full path; every input of the answer
// is part of the key; the key check, rate limits and conditional requests stay in front of it.
// Expected behaviour: RFC 9110 sec. 13.1.2 (If-None-Match), RFC 6750 (Bearer), RFC 6585 (429);
// that a memo never changes an answer: common practice, no source.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { newKey } from '../../src/auth/keys.js';
import { SHORTCUT_BODY } from '../../src/plugins/body.js';
import { testApp } from '../helpers/app.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

const ORBIT = JSON.stringify(DEMO_ORBIT);
const TRACK = JSON.stringify({ ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:10:00Z', step: 60 } });
const send = (app: FastifyInstance, url: string, body: string, headers: Record<string, string> = {}) =>
  app.inject({ method: 'POST', url, payload: body, headers: { 'content-type': 'application/json', ...headers } });
const hits = (app: FastifyInstance) => app.requestMemo!.stats().hits;

describe('request memo, open service', () => {
  let app: FastifyInstance;
  beforeAll(async () => { app = await testApp(); });
  afterAll(async () => app.close());

  it('a repeated request is a memo hit with the same bytes and answer headers as the cache hit before it', async () => {
    const first = await send(app, '/v1/orbit', ORBIT);
    expect(first.statusCode).toBe(200);
    expect(first.headers['x-cache']).toBe('miss');
    const before = hits(app);
    const second = await send(app, '/v1/orbit', ORBIT);
    expect(hits(app)).toBe(before + 1);
    expect(second.statusCode).toBe(200);
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    for (const h of ['etag', 'content-location', 'content-type', 'content-length']) expect(second.headers[h], h).toBe(first.headers[h]);
    expect(second.headers['x-cache']).toBe('hit');
  });

  it('a memo hit takes the body before it is parsed: the route never sees a scenario, the answer is the same', async () => {
    const bodies: unknown[] = [];
    const probe = await testApp({}, (a) => a.addHook('onResponse', async (request) => { bodies.push(request.body); }));
    try {
      const first = await send(probe, '/v1/orbit', ORBIT);
      const second = await send(probe, '/v1/orbit', ORBIT);
      expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
      expect(bodies[0]).toEqual(DEMO_ORBIT); // parsed on the full path
      expect(bodies[1]).toBe(SHORTCUT_BODY); // taken by the memo, never parsed nor validated
    } finally {
      await probe.close();
    }
  });

  it('a body that differs only in spacing or key order is not a memo hit, but the same scenario (cache hit, same bytes)', async () => {
    const base = await send(app, '/v1/orbit', ORBIT);
    const spaced = ORBIT.replace(':', ': ');
    const reordered = JSON.stringify({ elements: DEMO_ORBIT.elements, centralBody: DEMO_ORBIT.centralBody });
    for (const body of [spaced, reordered]) {
      const before = hits(app);
      const res = await send(app, '/v1/orbit', body);
      expect(hits(app)).toBe(before); // the first time these bytes are seen
      expect(res.headers['x-cache']).toBe('hit');
      expect(res.rawPayload.equals(base.rawPayload)).toBe(true);
    }
  });

  it('the Accept header is part of the key: JSON and SVG of one body never share an entry', async () => {
    const json = await send(app, '/v1/orbit', ORBIT, { accept: 'application/json' });
    const svg = await send(app, '/v1/orbit', ORBIT, { accept: 'image/svg+xml' });
    const svgAgain = await send(app, '/v1/orbit', ORBIT, { accept: 'image/svg+xml' });
    const jsonAgain = await send(app, '/v1/orbit', ORBIT, { accept: 'application/json' });
    expect(json.headers['content-type']).toMatch(/^application\/json/);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(svgAgain.rawPayload.equals(svg.rawPayload)).toBe(true);
    expect(jsonAgain.rawPayload.equals(json.rawPayload)).toBe(true);
    expect(svg.headers.etag).not.toBe(json.headers.etag);
  });

  it('the route is part of the key: the same bytes to another endpoint are that endpoint\'s answer', async () => {
    const track = await send(app, '/v1/track', TRACK);
    await send(app, '/v1/track', TRACK);
    const orbitOfTrackBody = await send(app, '/v1/orbit', TRACK);
    expect(track.statusCode).toBe(200);
    expect(orbitOfTrackBody.statusCode).toBe(400); // grid is not a field of /v1/orbit
  });

  it('If-None-Match on the fast path: 304 with the ETag, no body', async () => {
    const first = await send(app, '/v1/orbit', ORBIT);
    const before = hits(app);
    const res = await send(app, '/v1/orbit', ORBIT, { 'if-none-match': String(first.headers.etag) });
    expect(hits(app)).toBe(before + 1);
    expect(res.statusCode).toBe(304);
    expect(res.headers.etag).toBe(first.headers.etag);
    expect(res.rawPayload.length).toBe(0);
  });

  it('a request answered with a problem is never remembered', async () => {
    const bad = JSON.stringify({ ...DEMO_ORBIT, elements: { ...DEMO_ORBIT.elements, eccentricity: 1.5, semiMajorAxis: 7000 } });
    const first = await send(app, '/v1/orbit', bad);
    expect(first.statusCode).toBeGreaterThanOrEqual(400);
    const before = hits(app);
    const again = await send(app, '/v1/orbit', bad);
    expect(again.statusCode).toBe(first.statusCode);
    expect(hits(app)).toBe(before);
  });

  it('an answer no longer cached falls through to the full path and is solved again', async () => {
    const small = await testApp({ config: { CACHE_MAX_BYTES: 0 } });
    try {
      const first = await send(small, '/v1/orbit', ORBIT);
      const again = await send(small, '/v1/orbit', ORBIT);
      expect(again.statusCode).toBe(200);
      expect(again.headers['x-cache']).toBe('miss');
      expect(again.rawPayload.equals(first.rawPayload)).toBe(true);
    } finally {
      await small.close();
    }
  });
});

describe('request memo behind the key check and the rate limits', () => {
  let app: FastifyInstance;
  let alpha: string;
  let beta: string;
  beforeAll(async () => {
    const a = await newKey('alpha');
    const b = await newKey('beta');
    alpha = a.key;
    beta = b.key;
    app = await testApp({ config: { API_KEYS: `${a.entry},${b.entry}`, RATE_LIMIT_PER_MIN: 4, RATE_LIMIT_HEAVY_PER_MIN: 100 } });
  });
  afterAll(async () => app.close());

  it('a memo hit still needs a valid key; the caller\'s key id is part of the key; the budget still counts', async () => {
    const ok = await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${alpha}` });
    expect(ok.statusCode).toBe(200);
    const again = await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${alpha}` });
    expect(again.statusCode).toBe(200);
    expect(app.requestMemo!.stats().hits).toBe(1);
    // The same bytes without a key, or with a wrong one: refused before the memo is looked at.
    expect((await send(app, '/v1/orbit', ORBIT)).statusCode).toBe(401);
    expect((await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${alpha.slice(0, -2)}xx` })).statusCode).toBe(401);
    expect(app.requestMemo!.stats().hits).toBe(1);
    // Another caller's identical request is its own entry (a cache hit, not alpha's memo entry).
    const other = await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${beta}` });
    expect(other.statusCode).toBe(200);
    expect(app.requestMemo!.stats().hits).toBe(1);
    expect(other.rawPayload.equals(ok.rawPayload)).toBe(true);
    // alpha's budget of 4 cheap requests a minute: two used; the third and fourth pass, the fifth is refused even though the memo holds it.
    expect((await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${alpha}` })).statusCode).toBe(200);
    expect((await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${alpha}` })).statusCode).toBe(200);
    const refused = await send(app, '/v1/orbit', ORBIT, { authorization: `Bearer ${alpha}` });
    expect(refused.statusCode).toBe(429);
    expect(app.requestMemo!.stats().hits).toBe(3);
  });
});
