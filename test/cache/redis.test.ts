import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MemoryCache } from '../../src/cache/memory.js';
import { RedisCache, TieredCache } from '../../src/cache/redis.js';
import { postJson, testApp } from '../helpers/app.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

const available = await redisAvailable();
// Each run writes under its own prefix so parallel runs and old keys never meet.
const prefix = `apsides:test:${randomUUID()}:`;

describe.skipIf(!available)('Redis answer tier (real Redis at 127.0.0.1:6379)', () => {
  let shared: RedisCache;
  beforeAll(async () => {
    shared = new RedisCache(REDIS_URL, { keyPrefix: prefix, ttlSeconds: 120 });
    expect(await shared.ready()).toBe(true);
  });
  afterAll(async () => { await shared.close(); });

  it('stores and returns the exact bytes and media type', async () => {
    const body = Buffer.from([0, 1, 2, 10, 255, 10, 65]);
    await shared.set('h1', { body, contentType: 'text/csv; charset=utf-8' });
    const back = await shared.get('h1');
    expect(back?.contentType).toBe('text/csv; charset=utf-8');
    expect(back?.body.equals(body)).toBe(true);
    expect(await shared.get('never-stored')).toBeUndefined();
  });

  it('two replicas share answers: the second serves, byte for byte, what the first computed', async () => {
    const tiers = [new RedisCache(REDIS_URL, { keyPrefix: prefix }), new RedisCache(REDIS_URL, { keyPrefix: prefix })];
    for (const tier of tiers) expect(await tier.ready()).toBe(true);
    const replicaA = await testApp({ cache: new TieredCache(new MemoryCache(1 << 20), tiers[0]!) });
    const replicaB = await testApp({ cache: new TieredCache(new MemoryCache(1 << 20), tiers[1]!) });
    const scenario = { elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 7100 + Math.random(), eccentricity: 0.01, inclination: 45, raan: 10, argPeriapsis: 20, trueAnomaly: 30 } };
    const first = await postJson(replicaA, '/v1/orbit', scenario);
    expect(first.headers['x-cache']).toBe('miss');
    const second = await postJson(replicaB, '/v1/orbit', scenario);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    const byHash = await replicaB.inject({ url: `/v1/results/${first.json().scenarioHash}` });
    expect(byHash.statusCode).toBe(200);
    await replicaA.close();
    await replicaB.close();
  });
});

describe.skipIf(!available)('REDIS_URL in the configuration', () => {
  it('puts the shared tier behind the in-process cache of every replica', async () => {
    const replicas = [await testApp({ config: { REDIS_URL } }), await testApp({ config: { REDIS_URL } })];
    await new Promise((resolve) => setTimeout(resolve, 300)); // let both connect (a miss before that is allowed, not tested)
    const scenario = { elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 8000 + Math.random(), eccentricity: 0.1, inclination: 60, raan: 0, argPeriapsis: 0, trueAnomaly: 0 } };
    const first = await postJson(replicas[0]!, '/v1/orbit', scenario);
    const second = await postJson(replicas[1]!, '/v1/orbit', scenario);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    for (const app of replicas) await app.close();
  });
});

describe('Redis tier that cannot be reached', () => {
  it('answers are computed as usual: slower, never wrong, never an error', async () => {
    // Port 1 on loopback: nothing listens there, so every command fails at once.
    const down = new RedisCache('redis://127.0.0.1:1', { keyPrefix: prefix });
    const app = await testApp({ cache: new TieredCache(new MemoryCache(0), down) });
    const res = await postJson(app, '/v1/orbit', { elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 7000, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 0 } });
    expect(res.statusCode).toBe(200);
    expect(res.json().orbitType).toBe('circular');
    expect(down.stats().errors).toBeGreaterThan(0);
    await app.close();
  });
});
