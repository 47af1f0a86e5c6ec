import { execFile } from 'node:child_process';
import { scryptSync } from 'node:crypto';
import { Writable } from 'node:stream';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { Redis } from 'ioredis';
import { loadConfig } from '../../src/config.js';
import { newKey } from '../../src/auth/keys.js';
import { postJson, testApp } from '../helpers/app.js';
import { buildApp } from '../../src/app.js';
import { GOOD, parseLines, until } from '../helpers/batch.js';
import { deleteKeys, runPrefix } from '../helpers/jobs.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

// Expected behaviour: RFC 6750 sec. 2.1 (Authorization: Bearer), sec. 3 (WWW-Authenticate, with
// error="invalid_token" for a key that is not valid); RFC 7914 (scrypt) for the stored entries;
// OWASP API Security Top 10 (2023) API1, broken object level authorisation: another caller's
// object answers as if it did not exist (404).

const run = promisify(execFile);
const bearer = (key: string) => ({ authorization: `Bearer ${key}` });

describe('npm run -s apikey -- <id>', () => {
  it('prints one JSON line {id, key, entry}; the entry is scrypt of the secret with its own salt, never the key', async () => {
    const { stdout } = await run('npm', ['run', '-s', 'apikey', '--', 'ground-ops'], { cwd: process.cwd() });
    const lines = stdout.trim().split('\n');
    expect(lines).toHaveLength(1);
    const printed = JSON.parse(lines[0]!) as { id: string; key: string; entry: string };
    expect(Object.keys(printed).sort()).toEqual(['entry', 'id', 'key']);
    expect(printed.id).toBe('ground-ops');
    const [id, scheme, N, r, p, salt, hash] = printed.entry.split(':');
    expect([id, scheme]).toEqual(['ground-ops', 'scrypt']);
    const secret = printed.key.slice('ground-ops.'.length);
    expect(printed.key.startsWith('ground-ops.')).toBe(true);
    expect(printed.entry).not.toContain(secret);
    // Recomputed here with scrypt itself (RFC 7914 via node:crypto) from the entry's own parameters.
    const derived = scryptSync(secret, Buffer.from(salt!, 'base64url'), 32, { N: Number(N), r: Number(r), p: Number(p), maxmem: 64 * 1024 * 1024 });
    expect(derived.toString('base64url')).toBe(hash);
    const again = await newKey('ground-ops');
    expect(again.entry.split(':')[5]).not.toBe(salt); // a random salt per key
  }, 30_000);

  it('a bad id is refused with a message', async () => {
    await expect(run('npm', ['run', '-s', 'apikey', '--', 'no spaces'])).rejects.toMatchObject({ code: 2 });
  }, 30_000);
});

describe('API_KEYS in the configuration', () => {
  it('holds entries only: a plain key or a broken entry stops the start naming the entry, not its content', async () => {
    const good = await newKey('alpha');
    expect(loadConfig({ API_KEYS: `${good.entry}` }).API_KEYS).toBe(good.entry);
    expect(() => loadConfig({ API_KEYS: good.key })).toThrow(/API_KEYS entry 1.*plain keys are never accepted/);
    expect(() => loadConfig({ API_KEYS: `${good.entry},${good.entry}` })).toThrow(/entry 2 \(alpha\): the id appears twice/);
    expect(() => loadConfig({ API_KEYS: good.entry.replace(':16384:', ':1000:') })).toThrow(/out of range/);
  });
});

describe('without API_KEYS', () => {
  it('the service is open and says so at start', async () => {
    const lines: string[] = [];
    const stream = new Writable({ write(chunk, _enc, done) { lines.push(String(chunk)); done(); } });
    // Event-loop refusals off, as in testApp: a loaded machine must not turn this request into a 503.
    const app = await buildApp({ logger: { level: 'warn', stream }, config: { MAX_EVENT_LOOP_DELAY_MS: 0 } });
    await app.ready();
    const res = await postJson(app, '/v1/orbit', GOOD.orbit);
    expect(res.statusCode).toBe(200);
    expect((await app.inject({ url: '/metrics' })).statusCode).toBe(200);
    await app.close();
    expect(lines.some((l) => /"level":40/.test(l) && /API_KEYS is not set/.test(l))).toBe(true);
  });

  it('METRICS_TOKEN alone closes /metrics only', async () => {
    const app = await testApp({ config: { METRICS_TOKEN: 'scrape-token-0123456789' } });
    expect((await app.inject({ url: '/metrics' })).statusCode).toBe(401);
    expect((await app.inject({ url: '/metrics', headers: bearer('scrape-token-0123456789x') })).statusCode).toBe(401);
    expect((await app.inject({ url: '/metrics', headers: bearer('scrape-token-0123456789') })).statusCode).toBe(200);
    expect((await postJson(app, '/v1/orbit', GOOD.orbit)).statusCode).toBe(200);
    await app.close();
  });
});

describe('with API_KEYS', () => {
  let app: FastifyInstance;
  const keys: Record<string, string> = {};
  beforeAll(async () => {
    const made = await Promise.all(['alpha', 'bravo', 'charlie'].map((id) => newKey(id)));
    for (const k of made) keys[k.id] = k.key;
    app = await testApp({ config: { API_KEYS: made.map((k) => k.entry).join(','), METRICS_TOKEN: 'scrape-token-0123456789' } });
  });
  afterAll(async () => { await app.close(); });

  it('401 problem without a key, with WWW-Authenticate: Bearer', async () => {
    const res = await postJson(app, '/v1/orbit', GOOD.orbit);
    expect(res.statusCode).toBe(401);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.headers['www-authenticate']).toBe('Bearer realm="apsides"');
    expect(res.json()).toMatchObject({ type: '/problems/unauthorized', status: 401 });
    expect((await app.inject({ url: '/v1/bodies' })).statusCode).toBe(401);
    expect((await app.inject({ url: '/v1/jobs' })).statusCode).toBe(401);
    expect((await app.inject({ url: '/v1/no-such-route' })).statusCode).toBe(401);
  });

  it('401 invalid_token for a wrong secret, an unknown id, or another scheme', async () => {
    const wrong = `${keys.alpha!.slice(0, -3)}AAA`;
    for (const headers of [bearer(wrong), bearer('delta.abcdefabcdefabcdefabcdef'), bearer(keys.alpha!.slice(6))]) {
      const res = await postJson(app, '/v1/orbit', GOOD.orbit, headers);
      expect(res.statusCode).toBe(401);
      expect(res.headers['www-authenticate']).toBe('Bearer realm="apsides", error="invalid_token"');
    }
    const basic = await postJson(app, '/v1/orbit', GOOD.orbit, { authorization: `Basic ${Buffer.from('alpha:x').toString('base64')}` });
    expect(basic.statusCode).toBe(401);
  });

  it('a valid key is served; the scheme name is case-insensitive (RFC 9110 sec. 11.1)', async () => {
    expect((await postJson(app, '/v1/orbit', GOOD.orbit, bearer(keys.alpha!))).statusCode).toBe(200);
    expect((await postJson(app, '/v1/orbit', GOOD.orbit, { authorization: `bearer ${keys.alpha}` })).statusCode).toBe(200);
  });

  it('a percent-encoded path cannot dodge the key', async () => {
    const res = await app.inject({ url: '/%761/bodies' });
    expect(res.statusCode).not.toBe(200);
  });

  it('health, readiness, docs, the OpenAPI document, problem types and the page stay open', async () => {
    for (const url of ['/healthz', '/readyz', '/docs', '/docs/json', '/openapi.json', '/problems/unauthorized', '/', '/page.js']) {
      const res = await app.inject({ url });
      expect(res.statusCode, url).toBeLessThan(400);
    }
  });

  it('/metrics needs a key or METRICS_TOKEN', async () => {
    expect((await app.inject({ url: '/metrics' })).statusCode).toBe(401);
    expect((await app.inject({ url: '/metrics', headers: bearer('not-the-token-000000') })).statusCode).toBe(401);
    expect((await app.inject({ url: '/metrics', headers: bearer('scrape-token-0123456789') })).statusCode).toBe(200);
    expect((await app.inject({ url: '/metrics', headers: bearer(keys.bravo!) })).statusCode).toBe(200);
  });

  it('a job belongs to the key that submitted it: another key gets 404 for it and its results, and does not see it listed', async () => {
    const sub = await postJson(app, '/v1/jobs', { items: [{ id: 'a', kind: 'orbit', request: GOOD.orbit }] }, bearer(keys.alpha!));
    expect(sub.statusCode, sub.body).toBe(202);
    const id = (sub.json() as { id: string }).id;
    await until('job done', async () => (await app.inject({ url: `/v1/jobs/${id}`, headers: bearer(keys.alpha!) })).json().status === 'done');
    for (const url of [`/v1/jobs/${id}`, `/v1/jobs/${id}/results`, `/v1/jobs/${id}/results/0`]) {
      expect((await app.inject({ url, headers: bearer(keys.alpha!) })).statusCode, url).toBe(200);
      const other = await app.inject({ url, headers: bearer(keys.bravo!) });
      expect(other.statusCode, url).toBe(404);
      expect(other.json().type).toBe('/problems/job-not-found');
    }
    expect((await app.inject({ method: 'DELETE', url: `/v1/jobs/${id}`, headers: bearer(keys.bravo!) })).statusCode).toBe(404);
    const mine = (await app.inject({ url: '/v1/jobs', headers: bearer(keys.alpha!) })).json() as { jobs: { id: string }[] };
    const theirs = (await app.inject({ url: '/v1/jobs', headers: bearer(keys.bravo!) })).json() as { jobs: { id: string }[] };
    expect(mine.jobs.map((j) => j.id)).toContain(id);
    expect(theirs.jobs.map((j) => j.id)).not.toContain(id);
  });

  it('GET /v1/results/{hash} answers only keys that asked the scenario; the shared cache still serves the others', async () => {
    const scenario = { ...GOOD.orbit, elements: { ...GOOD.orbit.elements, inclination: 51.7 } };
    const first = await postJson(app, '/v1/orbit', scenario, bearer(keys.alpha!));
    expect(first.statusCode).toBe(200);
    const hash = String(first.headers.etag).replaceAll('"', '');
    expect((await app.inject({ url: `/v1/results/${hash}`, headers: bearer(keys.alpha!) })).statusCode).toBe(200);
    const stranger = await app.inject({ url: `/v1/results/${hash}`, headers: bearer(keys.bravo!) });
    expect(stranger.statusCode).toBe(404);
    expect(stranger.json().type).toBe('/problems/result-not-cached');
    // If-None-Match tells nothing to a stranger either.
    expect((await app.inject({ url: `/v1/results/${hash}`, headers: { ...bearer(keys.bravo!), 'if-none-match': `"${hash}"` } })).statusCode).toBe(404);
    const second = await postJson(app, '/v1/orbit', scenario, bearer(keys.bravo!));
    expect(second.statusCode).toBe(200);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.body).toBe(first.body);
    expect((await app.inject({ url: `/v1/results/${hash}`, headers: bearer(keys.bravo!) })).statusCode).toBe(200);
  });

  it('a scenario asked inside a batch counts as asked by the batch\'s key', async () => {
    const scenario = { ...GOOD.orbit, elements: { ...GOOD.orbit.elements, inclination: 63.4 } };
    const res = await postJson(app, '/v1/batch', { items: [{ id: 'x', kind: 'orbit', request: scenario }] }, bearer(keys.charlie!));
    expect(res.statusCode).toBe(200);
    const [line] = parseLines(res.rawPayload);
    const hash = line!.scenarioHash!;
    expect((await app.inject({ url: `/v1/results/${hash}`, headers: bearer(keys.charlie!) })).statusCode).toBe(200);
    expect((await app.inject({ url: `/v1/results/${hash}`, headers: bearer(keys.alpha!) })).statusCode).toBe(404);
  });

  it('a client cannot pose as a batch item to borrow another caller\'s identity', async () => {
    const res = await postJson(app, '/v1/orbit', GOOD.orbit, { 'x-apsides-item': 'guess', 'x-apsides-caller': 'alpha' });
    expect(res.statusCode).toBe(401);
  });
});

describe('who asked what, shared through Redis', async () => {
  const ok = await redisAvailable();
  it.skipIf(!ok)('a key that asked on one replica reads the result on another; a stranger does not', async () => {
    const prefix = runPrefix('askers');
    const made = await Promise.all(['alpha', 'bravo'].map((id) => newKey(id)));
    const config = {
      API_KEYS: made.map((k) => k.entry).join(','), REDIS_URL,
      ASKERS_KEY_PREFIX: `${prefix}askers:`, CACHE_KEY_PREFIX: `${prefix}answer:`, JOB_KEY_PREFIX: `${prefix}jobs:`,
    };
    const [one, two] = [await testApp({ config }), await testApp({ config })];
    const redis = new Redis(REDIS_URL);
    try {
      const scenario = { ...GOOD.orbit, elements: { ...GOOD.orbit.elements, inclination: 28.5 } };
      const res = await postJson(one, '/v1/orbit', scenario, bearer(made[0]!.key));
      expect(res.statusCode).toBe(200);
      const hash = String(res.headers.etag).replaceAll('"', '');
      expect(await redis.sismember(`${prefix}askers:${hash}`, 'alpha')).toBe(1);
      expect(await redis.ttl(`${prefix}askers:${hash}`)).toBeGreaterThan(0);
      const mine = await two.inject({ url: `/v1/results/${hash}`, headers: bearer(made[0]!.key) });
      expect(mine.statusCode).toBe(200);
      expect(mine.body).toBe(res.body);
      expect((await two.inject({ url: `/v1/results/${hash}`, headers: bearer(made[1]!.key) })).statusCode).toBe(404);
    } finally {
      await one.close();
      await two.close();
      await deleteKeys(redis, prefix);
      redis.disconnect();
    }
  }, 30_000);
});
