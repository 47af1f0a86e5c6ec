// Request budgets per caller (@fastify/rate-limit): each API key (each client address when the
// service is open) gets RATE_LIMIT_PER_MIN requests a minute under /v1 for cheap work (reads,
// POST /v1/orbit) and, separately, RATE_LIMIT_HEAVY_PER_MIN for heavy work (every other POST under
// /v1: tracks, passes, batches, jobs, ...). Past a budget: 429 rate-limited (problem+json) with
// Retry-After and the RateLimit-Limit/-Remaining/-Reset headers. With REDIS_URL the counts live in
// Redis so that replicas share them; a Redis that does not answer lets requests through.
// Batch and job items are not counted (their batch or job was). 0 turns a budget off.
import { once } from 'node:events';
import { setTimeout as sleep } from 'node:timers/promises';
import fp from 'fastify-plugin';
import rateLimit from '@fastify/rate-limit';
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { Redis } from 'ioredis';
import { ProblemError } from '../errors.js';
import { INNER_REQUEST_HEADER } from './metrics.js';

/** Not rate limited: everything outside /v1 (health, readiness, docs, the page, problem types). */
const limited = (request: FastifyRequest) => {
  const path = request.routeOptions.url ?? '';
  return (path === '/v1' || path.startsWith('/v1/')) && request.headers[INNER_REQUEST_HEADER] !== request.server.jobMetrics.innerToken;
};
/** Heavy: a POST under /v1 other than the orbit summary. */
export const isHeavy = (request: FastifyRequest) => request.method === 'POST' && request.routeOptions.url !== '/v1/orbit';

export default fp(async function limits(app: FastifyInstance) {
  const { RATE_LIMIT_PER_MIN, RATE_LIMIT_HEAVY_PER_MIN, RATE_LIMIT_WINDOW_S, REDIS_URL, RATE_LIMIT_KEY_PREFIX } = app.config;
  if (RATE_LIMIT_PER_MIN === 0 && RATE_LIMIT_HEAVY_PER_MIN === 0) return;
  // A window's share of a per-minute budget (0 stays 0: no limit).
  const share = (perMin: number) => (perMin === 0 ? 0 : Math.max(1, Math.round((perMin * RATE_LIMIT_WINDOW_S) / 60)));
  const cheap = share(RATE_LIMIT_PER_MIN);
  const heavy = share(RATE_LIMIT_HEAVY_PER_MIN);
  const redis = REDIS_URL ? new Redis(REDIS_URL, { enableOfflineQueue: false, maxRetriesPerRequest: 0, commandTimeout: 250, connectTimeout: 2000 }) : undefined;
  redis?.on('error', () => {});
  // Wait (briefly) for the connection, so the first requests are counted too; a Redis that does not answer is let through.
  if (redis) {
    const waited = new AbortController();
    await Promise.race([once(redis, 'ready', { signal: waited.signal }), sleep(2000, undefined, { signal: waited.signal })]).catch(() => {});
    waited.abort();
  }
  const budget = (request: FastifyRequest) => (isHeavy(request) ? heavy : cheap);
  await app.register(rateLimit, {
    global: true,
    timeWindow: RATE_LIMIT_WINDOW_S * 1000,
    max: (request) => budget(request),
    allowList: (request) => !limited(request) || budget(request) === 0,
    // The key's id when a key was checked (the auth plugin runs first), else the client address.
    keyGenerator: (request) => `${isHeavy(request) ? 'heavy' : 'cheap'}:${request.callerId === null ? `ip:${request.ip}` : `key:${request.callerId}`}`,
    enableDraftSpec: true,
    skipOnError: true,
    ...(redis ? { redis, nameSpace: RATE_LIMIT_KEY_PREFIX } : {}),
    errorResponseBuilder: (request, context) => new ProblemError('rate-limited',
      `more than ${context.max} ${isHeavy(request) ? 'heavy requests (POST under /v1 other than /v1/orbit; RATE_LIMIT_HEAVY_PER_MIN)' : 'requests (RATE_LIMIT_PER_MIN)'} in ${RATE_LIMIT_WINDOW_S} s from this ${request.callerId === null ? 'address' : 'key'}; retry in ${context.after}`,
      { headers: { 'retry-after': String(Math.max(1, Math.ceil(context.ttl / 1000))) } }),
  });
  // Key checks that need scrypt (a key not seen before) count against the address's heavy budget:
  // random keys cannot make the service hash without end.
  if (heavy > 0) {
    const attempts = app.createRateLimit({ allowList: () => false, max: heavy, timeWindow: RATE_LIMIT_WINDOW_S * 1000, keyGenerator: (request) => `keycheck:ip:${request.ip}` });
    app.decorate('keyCheckBudget', async (request: FastifyRequest) => {
      const result = await attempts(request);
      if (!result.isAllowed && result.isExceeded) {
        throw new ProblemError('rate-limited', `more than ${heavy} checks of unknown API keys in ${RATE_LIMIT_WINDOW_S} s from this address; retry in ${result.ttlInSeconds} s`, {
          headers: { 'retry-after': String(Math.max(1, result.ttlInSeconds)) },
        });
      }
    });
  }
  if (redis) app.addHook('onClose', async () => { redis.disconnect(); });
}, { name: 'limits', dependencies: ['auth', 'metrics'] });

declare module 'fastify' {
  interface FastifyInstance {
    /** Counts a key check that needs scrypt against the client address; throws 429 past the budget. Set by the limits plugin (absent: no limit). */
    keyCheckBudget?: (request: FastifyRequest) => Promise<void>;
  }
}
