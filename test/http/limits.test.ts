import { setTimeout as sleep } from 'node:timers/promises';
import { describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { Redis } from 'ioredis';
import { newKey } from '../../src/auth/keys.js';
import { postJson, testApp } from '../helpers/app.js';
import { GOOD, parseLines } from '../helpers/batch.js';
import { deleteKeys, runPrefix } from '../helpers/jobs.js';
import { REDIS_URL, redisAvailable } from '../helpers/redis.js';

// Expected behaviour: RFC 6585 sec. 4 (429 Too Many Requests, Retry-After), the IETF RateLimit
// header fields draft (draft-ietf-httpapi-ratelimit-headers: RateLimit-Limit, -Remaining, -Reset),
// RFC 9457 problem body.

const bearer = (key: string) => ({ authorization: `Bearer ${key}` });
const get = (app: FastifyInstance, headers: Record<string, string> = {}, remoteAddress = '127.0.0.1') =>
  app.inject({ url: '/v1/bodies', headers, remoteAddress });

describe('rate limits in process', () => {
  it('cheap budget: the limit counts down in the headers, then 429 problem with Retry-After, then recovery after the window', async () => {
    // 90 a minute in a 2 s window: 3 requests per window.
    const app = await testApp({ config: { RATE_LIMIT_PER_MIN: 90, RATE_LIMIT_HEAVY_PER_MIN: 60, RATE_LIMIT_WINDOW_S: 2 } });
    try {
      const remaining: string[] = [];
      for (let i = 0; i < 3; i++) {
        const res = await get(app);
        expect(res.statusCode).toBe(200);
        expect(res.headers['ratelimit-limit']).toBe('3');
        remaining.push(String(res.headers['ratelimit-remaining']));
      }
      expect(remaining).toEqual(['2', '1', '0']);
      const refused = await get(app);
      expect(refused.statusCode).toBe(429);
      expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(refused.json()).toMatchObject({ type: '/problems/rate-limited', status: 429 });
      const retryAfter = Number(refused.headers['retry-after']);
      expect(retryAfter).toBeGreaterThanOrEqual(1);
      expect(retryAfter).toBeLessThanOrEqual(2);
      expect(refused.headers['ratelimit-remaining']).toBe('0');
      // Health and docs are never limited.
      expect((await app.inject({ url: '/healthz' })).statusCode).toBe(200);
      await sleep(retryAfter * 1000 + 200);
      expect((await get(app)).statusCode).toBe(200);
    } finally {
      await app.close();
    }
  }, 20_000);

  it('heavy work has its own budget; batch items are not counted one by one', async () => {
    const app = await testApp({ config: { RATE_LIMIT_PER_MIN: 1, RATE_LIMIT_HEAVY_PER_MIN: 2 } });
    try {
      expect((await get(app)).statusCode).toBe(200);
      expect((await get(app)).statusCode).toBe(429);
      const items = Array.from({ length: 5 }, (_, i) => ({ id: `o${i}`, kind: 'orbit', request: { ...GOOD.orbit, elements: { ...GOOD.orbit.elements, inclination: 10 + i } } }));
      const batch = await postJson(app, '/v1/batch', { items });
      expect(batch.statusCode).toBe(200);
      expect(parseLines(batch.rawPayload).map((l) => l.status)).toEqual([200, 200, 200, 200, 200]);
      expect((await postJson(app, '/v1/track', GOOD.track)).statusCode).toBe(200);
      const third = await postJson(app, '/v1/track', GOOD.track);
      expect(third.statusCode).toBe(429);
      expect(third.json().detail).toMatch(/RATE_LIMIT_HEAVY_PER_MIN/);
    } finally {
      await app.close();
    }
  });

  it('open service: counted per client address', async () => {
    const app = await testApp({ config: { RATE_LIMIT_PER_MIN: 1 } });
    try {
      expect((await get(app, {}, '127.0.0.2')).statusCode).toBe(200);
      expect((await get(app, {}, '127.0.0.2')).statusCode).toBe(429);
      expect((await get(app, {}, '127.0.0.3')).statusCode).toBe(200);
    } finally {
      await app.close();
    }
  });

  it('with keys: counted per key, whatever the address', async () => {
    const [a, b] = await Promise.all([newKey('alpha'), newKey('bravo')]);
    const app = await testApp({ config: { API_KEYS: `${a!.entry},${b!.entry}`, RATE_LIMIT_PER_MIN: 1 } });
    try {
      expect((await get(app, bearer(a!.key), '127.0.0.2')).statusCode).toBe(200);
      expect((await get(app, bearer(a!.key), '127.0.0.3')).statusCode).toBe(429);
      expect((await get(app, bearer(b!.key), '127.0.0.2')).statusCode).toBe(200);
    } finally {
      await app.close();
    }
  });
});

describe('guessing keys', () => {
  it('checks of unknown keys (each a scrypt) count against the address\'s heavy budget; a known key still passes', async () => {
    const a = await newKey('alpha');
    const app = await testApp({ config: { API_KEYS: a.entry, RATE_LIMIT_HEAVY_PER_MIN: 2 } });
    try {
      const guess = (n: number) => get(app, bearer(`alpha.guess${n}xxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxx`), '127.0.0.4');
      expect((await guess(1)).statusCode).toBe(401);
      expect((await guess(2)).statusCode).toBe(401);
      const third = await guess(3);
      expect(third.statusCode).toBe(429);
      expect(third.json().type).toBe('/problems/rate-limited');
      expect(Number(third.headers['retry-after'])).toBeGreaterThan(0);
      expect((await get(app, bearer(a.key), '127.0.0.5')).statusCode).toBe(200);
    } finally {
      await app.close();
    }
  });
});

describe('rate limits shared through Redis', async () => {
  const ok = await redisAvailable();
  it.skipIf(!ok)('two replicas count one budget; the counters live under the prefix', async () => {
    const prefix = runPrefix('ratelimit');
    const config = {
      REDIS_URL, RATE_LIMIT_PER_MIN: 3, RATE_LIMIT_KEY_PREFIX: `${prefix}rl:`, CACHE_KEY_PREFIX: `${prefix}answer:`,
      JOB_KEY_PREFIX: `${prefix}jobs:`, ASKERS_KEY_PREFIX: `${prefix}askers:`,
    };
    const [one, two] = [await testApp({ config }), await testApp({ config })];
    const redis = new Redis(REDIS_URL);
    try {
      expect((await get(one)).statusCode).toBe(200);
      expect((await get(two)).statusCode).toBe(200);
      expect((await get(one)).statusCode).toBe(200);
      const refused = await get(two);
      expect(refused.statusCode).toBe(429);
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
      const [, keys] = await redis.scan('0', 'MATCH', `${prefix}rl:*`, 'COUNT', 1000);
      expect(keys.length).toBeGreaterThan(0);
    } finally {
      await one.close();
      await two.close();
      await deleteKeys(redis, prefix);
      redis.disconnect();
    }
  }, 30_000);
});
