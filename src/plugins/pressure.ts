// Overload (@fastify/under-pressure): when the event loop is held longer than
// MAX_EVENT_LOOP_DELAY_MS, or the heap or RSS passes MAX_HEAP_USED_BYTES / MAX_RSS_BYTES, new
// requests answer 503 overloaded with Retry-After before the process degrades further, and
// /readyz names `load` as missing, so a balancer sends the work elsewhere. Health, readiness,
// /metrics, the docs and the page are still answered. The detail names what is over its limit,
// never the figures. While the app closes, new /v1 requests answer 503 shutting-down.
import { getHeapStatistics } from 'node:v8';
import fp from 'fastify-plugin';
import underPressure from '@fastify/under-pressure';
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { ProblemError } from '../errors.js';
import { INNER_REQUEST_HEADER } from './metrics.js';

/** Seconds an overloaded instance asks callers to wait. */
export const PRESSURE_RETRY_AFTER_S = 5;
const SAMPLE_MS = 250;
const WHAT: Record<string, string> = {
  eventLoopDelay: 'its event loop is held (MAX_EVENT_LOOP_DELAY_MS)',
  heapUsedBytes: 'its heap is nearly full (MAX_HEAP_USED_BYTES)',
  rssBytes: 'its memory is over its limit (MAX_RSS_BYTES)',
};

/** Answered even under pressure: everything outside /v1 (health, readiness, metrics, docs, page). */
const exempt = (request: FastifyRequest) => {
  const path = request.routeOptions.url ?? '';
  return !(path === '/v1' || path.startsWith('/v1/'));
};

export default fp(async function pressure(app: FastifyInstance) {
  const { MAX_EVENT_LOOP_DELAY_MS, MAX_HEAP_USED_BYTES, MAX_RSS_BYTES } = app.config;
  // Unset: 90 % of V8's heap limit (past the limit the process dies).
  const maxHeap = MAX_HEAP_USED_BYTES ?? Math.floor(getHeapStatistics().heap_size_limit * 0.9);
  await app.register(underPressure, {
    maxEventLoopDelay: MAX_EVENT_LOOP_DELAY_MS,
    maxHeapUsedBytes: maxHeap,
    maxRssBytes: MAX_RSS_BYTES,
    sampleInterval: SAMPLE_MS,
    retryAfter: PRESSURE_RETRY_AFTER_S,
    pressureHandler: async (request, _reply, type) => {
      if (exempt(request)) return;
      throw new ProblemError('overloaded', `this instance is under pressure: ${WHAT[type] ?? 'it is overloaded'}; retry after ${PRESSURE_RETRY_AFTER_S} s`, {
        headers: { 'retry-after': String(PRESSURE_RETRY_AFTER_S) },
      });
    },
  });
  // While closing, new /v1 requests (on connections still open) answer 503 shutting-down; readiness says closing.
  let closing = false;
  app.addHook('preClose', async () => { closing = true; });
  app.addHook('onRequest', async (request, reply) => {
    // Batch and job items in hand are work already accepted: they finish.
    if (!closing || exempt(request) || request.headers[INNER_REQUEST_HEADER] === app.jobMetrics.innerToken) return;
    reply.header('connection', 'close');
    throw new ProblemError('shutting-down', `this instance is shutting down and takes no new work; retry after ${PRESSURE_RETRY_AFTER_S} s`, {
      headers: { 'retry-after': String(PRESSURE_RETRY_AFTER_S) },
    });
  });
  app.readiness.set('load', async () => (app.isUnderPressure() ? 'under pressure (event loop delay or memory over its limit)' : null));
}, { name: 'pressure' });
