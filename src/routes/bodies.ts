// GET /v1/bodies: the built-in central bodies with their constants and published sources.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { BODIES, BODY_NAMES } from '../solver/bodies/bodies.js';
import { BodyDescription, describeBody } from '../schemas/body.js';
import { DEG_PER_RAD } from '../schemas/common.js';

const SECONDS_PER_DAY = 86_400;

const BodiesAnswer = z.object({ bodies: z.array(BodyDescription) });

const bodies: FastifyPluginAsyncZod = async (app) => {
  const answer: z.infer<typeof BodiesAnswer> = {
    bodies: BODY_NAMES.map((name) => {
      const body = BODIES[name];
      return {
        ...describeBody(body),
        heliocentricMeanMotion: body.heliocentricMeanMotion !== undefined ? body.heliocentricMeanMotion * DEG_PER_RAD * SECONDS_PER_DAY : null,
        sources: { ...body.sources },
      };
    }),
  };
  app.get('/v1/bodies', {
    schema: { tags: ['service'], summary: 'Built-in central bodies', description: 'GM, radius, J2, rotation rate and flattening of each built-in body, each value with its published source.', response: { 200: BodiesAnswer } },
  }, async () => answer);
};
export default bodies;
