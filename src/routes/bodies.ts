// GET /v1/bodies: the built-in central bodies with their constants and published sources.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { bodiesAnswer } from '../api/body.js';
import { assertFinite } from '../api/finite.js';
import { BodiesAnswer } from '../schemas/body.js';

const bodies: FastifyPluginAsyncZod = async (app) => {
  const answer = bodiesAnswer();
  assertFinite(answer); // built once from the constants: a non-finite one would stop the start
  app.get('/v1/bodies', {
    schema: { tags: ['service'], operationId: 'listBodies', summary: 'Built-in central bodies', description: 'GM, radius, J2, rotation rate and flattening of each built-in body, each value with its published source.', response: { 200: BodiesAnswer } },
  }, async () => answer);
};
export default bodies;
