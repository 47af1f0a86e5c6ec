// OpenAPI 3.1 document generated from the Zod schemas of the routes; served at /openapi.json,
// with an interactive reference page at /docs.
import fp from 'fastify-plugin';
import swagger from '@fastify/swagger';
import swaggerUi from '@fastify/swagger-ui';
import type { FastifyInstance } from 'fastify';
import { jsonSchemaTransform, jsonSchemaTransformObject } from 'fastify-type-provider-zod';
import { SOLVER_VERSION } from '../solver/core/version.js';
import { tidyComponents, withSharedResponses } from './openapi-document.js';

export const API_DESCRIPTION = `Orbit solutions over HTTP: two-body reduction, orbital elements, apsides and period, general
central-force motion through the effective potential, propagated tracks and ground-station passes.
Every answer is deterministic and cached under the SHA-256 hash of its normalised scenario
(the ETag; If-None-Match answers 304; GET /v1/results/{scenarioHash} returns a stored answer).

Units: km, km/s, s, degrees, kg, km^3/s^2; epochs ISO 8601 UTC. The central-force endpoint works in
any consistent unit system. Errors are RFC 9457 problem details.

Cautions: these predictions are not for collision avoidance or any safety-of-flight decision
without independent validation; accuracy degrades with propagation span and with the force model
chosen; radio transmission toward a spacecraft needs licensing and frequency coordination. Defer to
licensed practice and local regulation.`;

export default fp(async function openapi(app: FastifyInstance) {
  await app.register(swagger, {
    openapi: {
      openapi: '3.1.0',
      info: { title: 'apsides', version: SOLVER_VERSION, description: API_DESCRIPTION },
      tags: [
        { name: 'orbits', description: 'Orbit solutions' },
        { name: 'results', description: 'Stored answers' },
        { name: 'batch', description: 'Many scenarios in one call, and queued jobs' },
        { name: 'service', description: 'Health and reference data' },
      ],
    },
    transform: withSharedResponses(jsonSchemaTransform),
    transformObject: (doc) => tidyComponents(jsonSchemaTransformObject(doc) as Record<string, unknown>) as ReturnType<typeof jsonSchemaTransformObject>,
  });
  await app.register(swaggerUi, {
    routePrefix: '/docs',
    uiConfig: { docExpansion: 'list', deepLinking: true, validatorUrl: null },
    // The reference page's bundle sets inline styles: allowed on /docs only (scripts stay same-origin).
    transformStaticCSP: (header: string) => header.replace("style-src 'self'", "style-src 'self' 'unsafe-inline'"),
  });
  app.get('/openapi.json', { schema: { hide: true } }, async () => app.swagger());
}, { name: 'openapi' });
