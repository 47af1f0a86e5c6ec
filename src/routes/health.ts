// Liveness and readiness. Readiness covers every dependency the instance needs (each plugin that
// has one adds a check to app.readiness: the job queue and its Redis, overload) and fails while
// the app is closing; the answer names what is missing.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { SOLVER_VERSION } from '../solver/core/version.js';

const Health = z.object({ status: z.enum(['ok', 'closing']), solverVersion: z.string() });
const Readiness = z.object({
  status: z.enum(['ok', 'closing', 'not-ready']),
  solverVersion: z.string(),
  checks: z.record(z.string(), z.string()).describe('Each dependency and "ok", or why it is not ready'),
  missing: z.array(z.string()).describe('The dependencies that are not ready (empty when status is ok)'),
  earthOrientation: z.object({
    file: z.string(),
    firstDate: z.string().describe('First day of the table (UTC date)'),
    lastObservedDate: z.string().nullable().describe('Last day whose polar motion and UT1-UTC are observed (IERS flag I)'),
    lastPredictedDate: z.string().describe('Last day of the table (predictions)'),
    days: z.number().int(),
    digest: z.string().describe('SHA-256 of the rows: part of every scenario hash about the Earth'),
    loadedAt: z.string(),
    lastReloadError: z.string().nullable().describe('Why the last reload failed (the table above stays in force), or null'),
  }).optional().describe('With EOP_FILE set: the IERS table in force'),
});

/** Seconds one readiness check may take before it counts as not ready. */
const CHECK_TIMEOUT_MS = 2000;

const health: FastifyPluginAsyncZod = async (app) => {
  let closing = false;
  app.addHook('preClose', async () => { closing = true; });

  app.get('/healthz', { schema: { tags: ['service'], operationId: 'getHealth', summary: 'Liveness', response: { 200: Health } } }, async () => ({
    status: 'ok' as const,
    solverVersion: SOLVER_VERSION,
  }));

  app.get('/readyz', {
    schema: {
      tags: ['service'],
      operationId: 'getReadiness', summary: 'Readiness: 200 when the service takes requests; 503 while closing, overloaded, or when a dependency (the job queue and its Redis) does not answer',
      response: { 200: Readiness, 503: Readiness },
    },
  }, async (_req, reply) => {
    const checks: Record<string, string> = {};
    await Promise.all([...app.readiness].map(async ([name, check]) => {
      let timer: NodeJS.Timeout | undefined;
      const timeout = new Promise<string>((resolve) => { timer = setTimeout(() => resolve(`no answer within ${CHECK_TIMEOUT_MS} ms`), CHECK_TIMEOUT_MS); });
      checks[name] = await Promise.race([check().then((r) => r ?? 'ok', (e: unknown) => (e instanceof Error ? e.message : String(e))), timeout]);
      clearTimeout(timer);
    }));
    const missing = Object.keys(checks).filter((name) => checks[name] !== 'ok').sort();
    const status = closing ? 'closing' as const : missing.length > 0 ? 'not-ready' as const : 'ok' as const;
    const eop = app.eop.status();
    return reply.code(status === 'ok' ? 200 : 503).header('cache-control', 'no-store').send({ status, solverVersion: SOLVER_VERSION, checks, missing, ...(eop ? { earthOrientation: eop } : {}) });
  });
};
export default health;

/** A readiness check: resolves null (or undefined) when ready, else a short reason. */
export type ReadinessCheck = () => Promise<string | null | undefined>;

declare module 'fastify' {
  interface FastifyInstance {
    readiness: Map<string, ReadinessCheck>;
  }
}
