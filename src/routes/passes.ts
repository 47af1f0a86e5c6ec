// POST /v1/passes: when a spacecraft rises and sets over each ground station, and where to point.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { ProblemError, solverProblem } from '../errors.js';
import { jsonAnswer } from '../plugins/answers.js';
import { resolveBody } from '../api/body.js';
import { initialState } from '../api/orbit.js';
import { passSearchJob, toPassesAnswer } from '../api/passes.js';
import { problemResponses } from '../schemas/common.js';
import { PassesAnswer, PassesRequest } from '../schemas/passes.js';

const passes: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/passes', {
    schema: {
      tags: ['orbits'],
      summary: 'Ground-station passes: AOS, TCA, LOS, maximum elevation, azimuths, optional pointing and Doppler',
      description: 'Searches the window for every interval in which the spacecraft is above each station\'s elevation limit and horizon mask. ' +
        'AOS/LOS are refined to better than 0.1 s and TCA by maximisation. Geometric elevation (no refraction). ' +
        'Pass predictions do not grant a licence to transmit: radio transmission needs licensing and frequency coordination.',
      body: PassesRequest,
      response: { 200: PassesAnswer, ...problemResponses },
    },
  }, async (request, reply) => {
    const req = request.body;
    if (req.centralBody !== 'earth') throw new ProblemError('unsupported-frame', 'ground-station passes need the built-in centralBody "earth"');
    return app.answers.respond(request, reply, 'passes', req, async (hash) => {
      const body = resolveBody(req.centralBody);
      const start = initialState(body, req);
      if (!start.ok) throw solverProblem(start);
      // The search runs on a worker thread unless the window and station list are small; the
      // propagator is rebuilt there from this state.
      const found = await app.pool.solve(passSearchJob(req, body, start.value));
      if (!found.ok) throw solverProblem(found);
      return jsonAnswer(toPassesAnswer(req, hash, found.value));
    });
  });
};

export default passes;
