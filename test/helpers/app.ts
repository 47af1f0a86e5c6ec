import type { FastifyInstance } from 'fastify';
import { buildApp, type BuildOptions } from '../../src/app.js';

/**
 * A quiet app for inject-based tests; no rate limits and no event-loop-delay refusals unless the
 * test sets them (test/http/limits.test.ts and edge.test.ts do): a test that holds the loop on
 * purpose must not make the next test's request a 503.
 */
export async function testApp(options: BuildOptions = {}, beforeReady?: (app: FastifyInstance) => void): Promise<FastifyInstance> {
  const app = await buildApp({ logger: false, ...options, config: { RATE_LIMIT_PER_MIN: 0, RATE_LIMIT_HEAVY_PER_MIN: 0, MAX_EVENT_LOOP_DELAY_MS: 0, ...options.config } });
  beforeReady?.(app); // hooks a test adds (they cannot be added once the app is ready)
  await app.ready();
  return app;
}

export async function postJson(app: FastifyInstance, url: string, payload: unknown, headers: Record<string, string> = {}) {
  return app.inject({ method: 'POST', url, payload: payload as object, headers: { 'content-type': 'application/json', ...headers } });
}
