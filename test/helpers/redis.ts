import { Redis } from 'ioredis';

export const REDIS_URL = 'redis://127.0.0.1:6379';

/**
 * Whether the Redis at 127.0.0.1:6379 answers. Without it the Redis tests are skipped with a
 * visible notice, except under CI=true, where a missing Redis fails the run.
 */
export async function redisAvailable(): Promise<boolean> {
  const client = new Redis(REDIS_URL, { lazyConnect: true, connectTimeout: 1000, maxRetriesPerRequest: 0, enableOfflineQueue: false, retryStrategy: () => null });
  client.on('error', () => {});
  try {
    await client.connect();
    return (await client.ping()) === 'PONG';
  } catch {
    if (process.env.CI === 'true') throw new Error(`CI=true but no Redis answers at ${REDIS_URL}: the Redis tests cannot be skipped in CI`);
    console.warn(`NOTICE: no Redis at ${REDIS_URL}; the Redis cache tests are skipped`);
    return false;
  } finally {
    client.disconnect();
  }
}
