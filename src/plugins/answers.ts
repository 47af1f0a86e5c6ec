// The scenario -> cache -> solve pipeline shared by every solving route.
// Hash the normalised scenario; If-None-Match -> 304; cache hit -> stored bytes; miss -> produce, store, send.
import fp from 'fastify-plugin';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import type { AnswerCache, CachedAnswer } from '../cache/types.js';
import { scenarioHash, type ScenarioKind } from '../scenario/hash.js';

export interface AnswerService {
  readonly cache: AnswerCache;
  respond(
    request: FastifyRequest,
    reply: FastifyReply,
    kind: ScenarioKind,
    scenario: unknown,
    produce: (hash: string) => CachedAnswer | Promise<CachedAnswer>,
  ): Promise<FastifyReply>;
  sendStored(request: FastifyRequest, reply: FastifyReply, hash: string, answer: CachedAnswer, cacheState: 'hit' | 'miss'): FastifyReply;
}

declare module 'fastify' {
  interface FastifyInstance {
    answers: AnswerService;
  }
}

export const etagOf = (hash: string): string => `"${hash}"`;

/** RFC 9110 sec. 13.1.2: If-None-Match matches on `*` or any listed entity tag (weak comparison). */
export function ifNoneMatchHits(header: string | undefined, hash: string): boolean {
  if (!header) return false;
  if (header.trim() === '*') return true;
  return header.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etagOf(hash));
}

export const jsonAnswer = (value: unknown): CachedAnswer => ({
  body: Buffer.from(JSON.stringify(value)),
  contentType: 'application/json; charset=utf-8',
});

export default fp(async function answers(app: FastifyInstance, opts: { cache: AnswerCache }) {
  const { cache } = opts;

  const sendStored: AnswerService['sendStored'] = (request, reply, hash, answer, cacheState) =>
    reply
      .header('etag', etagOf(hash))
      .header('content-location', `/v1/results/${hash}`)
      .header('x-cache', cacheState)
      .type(answer.contentType)
      .send(answer.body);

  const service: AnswerService = {
    cache,
    sendStored,
    async respond(request, reply, kind, scenario, produce) {
      const hash = scenarioHash(kind, scenario);
      if (ifNoneMatchHits(request.headers['if-none-match'], hash)) {
        return reply.code(304).header('etag', etagOf(hash)).send();
      }
      const stored = await cache.get(hash);
      if (stored) return sendStored(request, reply, hash, stored, 'hit');
      const answer = await produce(hash);
      await cache.set(hash, answer);
      return sendStored(request, reply, hash, answer, 'miss');
    },
  };
  app.decorate('answers', service);
  app.addHook('onClose', async () => cache.close());
}, { name: 'answers' });
