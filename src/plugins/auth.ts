// Who is calling. With API_KEYS set, every request under /v1 needs `Authorization: Bearer <key>`
// (RFC 6750) with a listed key, and its id becomes request.callerId: jobs belong to it, and
// GET /v1/results/{hash} answers it only for scenarios it asked (app.askers). /metrics needs a key
// or METRICS_TOKEN (when either is configured). /healthz, /readyz, /docs, /openapi.json,
// /problems/* and the scenario page stay open. Without API_KEYS the service is open (a warning at
// start): callerId is null for everyone and nothing is owned.
import fp from 'fastify-plugin';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { ProblemError } from '../errors.js';
import { KeyVerifier, parseKeyEntries, sameSecret } from '../auth/keys.js';
import { MemoryAskers, SharedAskers, type AskerStore } from '../auth/askers.js';
import { INNER_REQUEST_HEADER } from './metrics.js';

/** On batch and job item requests (which carry the app's inner token): the id of the caller that sent the batch or job. */
export const CALLER_HEADER = 'x-apsides-caller';
const REALM = 'Bearer realm="apsides"';
/** Seconds a record of who asked a scenario is kept in Redis (as long as the shared answer tier keeps answers). */
const ASKERS_TTL_S = 7 * 86_400;
const SCENARIO_HASH = /^[0-9a-f]{64}$/;

/** The bearer token of an Authorization header, or undefined. */
function bearer(header: string | undefined): string | undefined {
  const m = header === undefined ? null : /^Bearer +(\S+) *$/i.exec(header);
  return m?.[1];
}

const unauthorized = (detail: string, invalid: boolean) => new ProblemError('unauthorized', detail, {
  headers: { 'www-authenticate': invalid ? `${REALM}, error="invalid_token"` : REALM },
});

export default fp(async function auth(app: FastifyInstance) {
  const { API_KEYS, METRICS_TOKEN, REDIS_URL, ASKERS_KEY_PREFIX } = app.config;
  const verifier = API_KEYS ? new KeyVerifier(parseKeyEntries(API_KEYS)) : undefined;
  // With Redis the record is shared, and kept also where no key is checked (a queue worker records
  // the scenarios of the jobs it runs for their owners).
  const askers: AskerStore | undefined = REDIS_URL ? new SharedAskers(REDIS_URL, ASKERS_KEY_PREFIX, ASKERS_TTL_S) : verifier ? new MemoryAskers() : undefined;
  if (verifier) app.log.info({ keys: verifier.size }, 'API keys required under /v1');
  else app.log.warn('API_KEYS is not set: the service is open to every caller (no keys; jobs and stored results are not owned)');

  app.decorateRequest('callerId', null);
  app.decorate('askers', askers);

  async function caller(request: FastifyRequest, token: string | undefined): Promise<string> {
    if (token === undefined) {
      throw unauthorized(request.headers.authorization === undefined ? 'this endpoint needs an API key: send Authorization: Bearer <key>' : 'the Authorization header is not "Bearer <key>"', false);
    }
    const id = await verifier!.verify(token, () => app.keyCheckBudget?.(request) ?? Promise.resolve());
    if (id === null) throw unauthorized('the API key is not valid', true);
    return id;
  }

  app.addHook('onRequest', async (request) => {
    // Batch and job items run through app.inject with the app's own token and their caller's id.
    if (request.headers[INNER_REQUEST_HEADER] === app.jobMetrics.innerToken) {
      const inner = request.headers[CALLER_HEADER];
      request.callerId = typeof inner === 'string' && inner !== '' ? inner : null;
      return;
    }
    // The route's own pattern when matched (a percent-encoded path cannot dodge the check).
    const path = request.routeOptions.url ?? request.url.split('?')[0] ?? '';
    if (path === '/metrics') {
      if (!verifier && !METRICS_TOKEN) return;
      const token = bearer(request.headers.authorization);
      if (METRICS_TOKEN && token !== undefined && sameSecret(token, METRICS_TOKEN)) return;
      if (!verifier) throw unauthorized(token === undefined ? '/metrics needs METRICS_TOKEN: send Authorization: Bearer <token>' : 'the token is not valid', token !== undefined);
      request.callerId = await caller(request, token);
      return;
    }
    if (verifier && (path === '/v1' || path.startsWith('/v1/'))) request.callerId = await caller(request, bearer(request.headers.authorization));
  });

  if (askers) {
    // A scenario answered (200, or 304 for the caller's own copy) to a caller is one it asked.
    app.addHook('onSend', async (request: FastifyRequest, reply: FastifyReply) => {
      if (request.callerId === null || request.method !== 'POST' || (reply.statusCode !== 200 && reply.statusCode !== 304)) return;
      const hash = String(reply.getHeader('etag') ?? '').replaceAll('"', '');
      if (SCENARIO_HASH.test(hash)) await askers.add(hash, request.callerId);
    });
    app.addHook('onClose', async () => askers.close());
  }
}, { name: 'auth' });

declare module 'fastify' {
  interface FastifyRequest {
    /** The API key's id; null when the service is open (no API_KEYS) or the route is open. */
    callerId: string | null;
  }
  interface FastifyInstance {
    /** Who asked which scenario; undefined when the service is open. */
    askers: AskerStore | undefined;
  }
}
