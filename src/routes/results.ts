// GET /v1/results/{scenarioHash}: a stored answer, byte for byte as first sent.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { ProblemError } from '../errors.js';
import { ifNoneMatchHits, etagOf } from '../plugins/answers.js';
import { Problem, ScenarioHash } from '../schemas/common.js';

const notStored = (hash: string) => new ProblemError('result-not-cached', `No answer is stored under ${hash} for you; send the scenario again to compute it.`);

const results: FastifyPluginAsyncZod = async (app) => {
  app.get('/v1/results/:scenarioHash', {
    schema: {
      tags: ['results'],
      summary: 'A cached answer by its scenario hash',
      description: 'Returns the answer stored under the hash, with the media type it was first sent with. Answers live as long as the cache has room for them (in-process LRU bounded in bytes, and the shared Redis tier when configured): a 404 means compute it again by sending the scenario. With API keys, a key reads only the scenarios it has sent (alone, or in a batch or job); others answer 404 as if not stored.',
      params: z.object({ scenarioHash: ScenarioHash }),
      response: { 304: z.undefined().describe('Not modified: the If-None-Match tag matches this hash'), 404: Problem.describe('Nothing stored under this hash') },
    },
  }, async (request, reply) => {
    const { scenarioHash } = request.params;
    // With keys, a caller reads only the scenarios it asked (OWASP API1); another caller's is as unknown as a missing one.
    const caller = request.callerId;
    if (caller !== null && !(await app.askers?.has(scenarioHash, caller))) throw notStored(scenarioHash);
    if (ifNoneMatchHits(request.headers['if-none-match'], scenarioHash)) {
      return reply.code(304).header('etag', etagOf(scenarioHash)).send(undefined);
    }
    const stored = await app.answers.cache.get(scenarioHash);
    if (!stored) throw notStored(scenarioHash);
    reply.header('cache-control', 'public, max-age=31536000, immutable');
    return app.answers.sendStored(request, reply, scenarioHash, stored, 'hit');
  });
};
export default results;
