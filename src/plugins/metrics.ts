// GET /metrics: Prometheus text exposition (prom-client), one registry per app instance.
import { randomUUID } from 'node:crypto';
import fp from 'fastify-plugin';
import { z } from 'zod';
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

  // Jobs: the queue's counts by state (queue-wide with Redis: every replica reports the same), the
  // stalls seen and the time a done job took from its first start.
  let jobCounts: () => Promise<JobCounts> = async () => ({ queued: 0, active: 0, completed: 0, failed: 0 });
  new Gauge({
    name: 'apsides_jobs', help: 'Jobs by state (queued, active, completed, failed: failed includes cancelled)', labelNames: ['state'], registers: [registry],
    async collect() {
      try {
        const c = await jobCounts();
        for (const [state, n] of Object.entries(c)) this.set({ state }, n);
      } catch {
        // the queue's store does not answer: the gauge keeps its last values
      }
    },
  });
  const stalled = new Counter({ name: 'apsides_jobs_stalled_total', help: 'Jobs found stalled (their worker stopped renewing the lock) and put back in the queue', registers: [registry] });
  const jobDuration = new Histogram({
    name: 'apsides_job_duration_seconds', help: 'Time from a job\'s first start to done',
    buckets: [0.1, 0.5, 1, 5, 10, 30, 60, 300, 900, 3600, 14_400], registers: [registry],
  });
  const innerToken = randomUUID();
  app.decorate('jobMetrics', {
    innerToken,
    counts(source: () => Promise<JobCounts>) { jobCounts = source; },
    stalled() { stalled.inc(); },
    done(durationS: number) { jobDuration.observe(durationS); },
  });

  app.addHook('onResponse', async (request, reply) => {
    // Batch and job items run through app.inject: counted as jobs, not as requests to their endpoints.
    if (request.headers[INNER_REQUEST_HEADER] === innerToken) return;
    const route = request.routeOptions.url ?? 'unmatched';
    requests.inc({ method: request.method, route, status: String(reply.statusCode) });
    duration.observe({ method: request.method, route }, reply.elapsedTime / 1000);
  });

  app.get('/metrics', {
    schema: {
      tags: ['service'],
      operationId: 'getMetrics',
      summary: 'Prometheus text exposition: requests, durations, cache, worker pool and job counters (needs an API key or METRICS_TOKEN when keys are configured)',
      response: { 200: { description: 'Prometheus text format 0.0.4', content: { 'text/plain': { schema: z.string() } } } },
    },
  }, async (_request, reply) =>
    reply.type(registry.contentType).send(await registry.metrics()));
}, { name: 'metrics', dependencies: ['answers', 'pool'] });

/** Marks the requests a batch or job makes to run its items (value: JobMetrics.innerToken). */
export const INNER_REQUEST_HEADER = 'x-apsides-item';

export interface JobCounts {
  readonly queued: number;
  readonly active: number;
  readonly completed: number;
  readonly failed: number;
}

export interface JobMetrics {
  /** The value of INNER_REQUEST_HEADER on this app's item requests (random per app: a client cannot send it). */
  readonly innerToken: string;
  /** Where the job counts come from (the jobs plugin sets it). */
  counts(source: () => Promise<JobCounts>): void;
  stalled(): void;
  done(durationS: number): void;
}

declare module 'fastify' {
  interface FastifyInstance {
    jobMetrics: JobMetrics;
  }
}
