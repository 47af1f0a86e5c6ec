// GET /metrics: Prometheus text exposition (prom-client), one registry per app instance.
import fp from 'fastify-plugin';
import type { FastifyInstance } from 'fastify';
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';

export default fp(async function metrics(app: FastifyInstance) {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry });
  const requests = new Counter({ name: 'apsides_http_requests_total', help: 'HTTP requests answered', labelNames: ['method', 'route', 'status'], registers: [registry] });
  const duration = new Histogram({
    name: 'apsides_http_request_duration_seconds', help: 'Time to answer', labelNames: ['method', 'route'],
    buckets: [0.001, 0.005, 0.01, 0.05, 0.1, 0.5, 1, 5, 30], registers: [registry],
  });
  new Gauge({
    name: 'apsides_cache_entries', help: 'Answers held in the in-process cache', registers: [registry],
    collect() { this.set(app.answers.cache.stats().entries); },
  });
  new Gauge({
    name: 'apsides_cache_bytes', help: 'Bytes held in the in-process cache', registers: [registry],
    collect() { this.set(app.answers.cache.stats().bytes); },
  });
  new Gauge({
    name: 'apsides_cache_lookups', help: 'Cache lookups since start by result', labelNames: ['result'], registers: [registry],
    collect() { const s = app.answers.cache.stats(); this.set({ result: 'hit' }, s.hits); this.set({ result: 'miss' }, s.misses); },
  });

  new Gauge({
    name: 'apsides_pool_jobs', help: 'Heavy solver jobs on the worker pool by state', labelNames: ['state'], registers: [registry],
    collect() { const s = app.pool.stats(); this.set({ state: 'active' }, s.active); this.set({ state: 'queued' }, s.queued); this.set({ state: 'completed' }, s.completed); },
  });
  new Gauge({
    name: 'apsides_pool_threads', help: 'Worker threads of the solver pool', registers: [registry],
    collect() { this.set(app.pool.stats().threads); },
  });

  app.addHook('onResponse', async (request, reply) => {
    const route = request.routeOptions.url ?? 'unmatched';
    requests.inc({ method: request.method, route, status: String(reply.statusCode) });
    duration.observe({ method: request.method, route }, reply.elapsedTime / 1000);
  });

  app.get('/metrics', { schema: { hide: true } }, async (_request, reply) =>
    reply.type(registry.contentType).send(await registry.metrics()));
}, { name: 'metrics', dependencies: ['answers', 'pool'] });
