// Liveness and readiness. Readiness fails while the app is closing.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { SOLVER_VERSION } from '../solver/core/version.js';

const Health = z.object({ status: z.enum(['ok', 'closing']), solverVersion: z.string() });

const health: FastifyPluginAsyncZod = async (app) => {
  let closing = false;
  app.addHook('preClose', async () => { closing = true; });

  app.get('/healthz', { schema: { tags: ['service'], summary: 'Liveness', response: { 200: Health } } }, async () => ({
    status: 'ok' as const,
    solverVersion: SOLVER_VERSION,
  }));

  app.get('/readyz', { schema: { tags: ['service'], summary: 'Readiness: 200 when the service takes requests, 503 while closing', response: { 200: Health, 503: Health } } }, async (_req, reply) =>
    reply.code(closing ? 503 : 200).send({ status: closing ? 'closing' : 'ok', solverVersion: SOLVER_VERSION }),
  );
};
export default health;
