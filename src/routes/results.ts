// GET /v1/results/{scenarioHash}: a stored answer, byte for byte as first sent.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { ProblemError } from '../errors.js';
import { ifNoneMatchHits, etagOf } from '../plugins/answers.js';
import { problemAnswer, ScenarioHash } from '../schemas/common.js';

const notStored = (hash: string) => new ProblemError('result-not-cached', `No answer is stored under ${hash} for you; send the scenario again to compute it.`);

const results: FastifyPluginAsyncZod = async (app) => {
  app.get('/v1/results/:scenarioHash', {
    schema: {
      tags: ['results'],
      operationId: 'getResult', summary: 'A stored answer by its scenario hash, in the format it was first sent in (JSON, CSV, OEM, GeoJSON or SVG)',
      description: 'Returns the answer stored under the hash, with the media type it was first sent with. Answers live as long as the cache has room for them (in-process LRU bounded in bytes, and the shared Redis tier when configured): a 404 means compute it again by sending the scenario. With API keys, a key reads only the scenarios it has sent (alone, or in a batch or job); others answer 404 as if not stored.',
      params: z.object({ scenarioHash: ScenarioHash }),
      response: {
        304: z.null().describe('Not modified: If-None-Match holds this hash; no body'),
        200: {
          description: 'The stored answer, byte for byte, in the media type it was first sent with: JSON, CSV, CCSDS OEM (text/plain), GeoJSON, SVG or NDJSON',
          content: {
            'application/json': { schema: z.record(z.string(), z.unknown()).describe('A JSON answer of any endpoint (its scenarioHash is this hash)') },
            'text/csv': { schema: z.string() },
            'text/plain': { schema: z.string().describe('CCSDS OEM (KVN)') },
            'application/geo+json': { schema: z.record(z.string(), z.unknown()) },
            'image/svg+xml': { schema: z.string() },
          },
        },
        404: problemAnswer('result-not-cached: nothing stored under this hash for you'),
      },
    },
  }, async (request, reply) => {
    const { scenarioHash } = request.params;
    // With keys, a caller reads only the scenarios it asked (OWASP API1); another caller's is as unknown as a missing one.
    const caller = request.callerId;
    if (caller !== null && !(await app.askers?.has(scenarioHash, caller))) throw notStored(scenarioHash);
    if (ifNoneMatchHits(request.headers['if-none-match'], scenarioHash)) {
      return reply.code(304).header('etag', etagOf(scenarioHash)).send(null);
    }
    const stored = await app.answers.cache.get(scenarioHash);
    if (!stored) throw notStored(scenarioHash);
    reply.header('cache-control', 'public, max-age=31536000, immutable');
    return app.answers.sendStored(request, reply, scenarioHash, stored, 'hit');
  });
};
export default results;
