// POST /v1/orbit: elements, apsides, period and conserved quantities of an orbit.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { solverProblem } from '../errors.js';
import { jsonAnswer } from '../plugins/answers.js';
import { problemResponses } from '../schemas/common.js';
import { resolveBody } from '../api/body.js';
import { orbitSolverInput, toOrbitAnswer } from '../api/orbit.js';
import { OrbitAnswer, OrbitRequest } from '../schemas/orbit.js';
import { solveOrbit } from '../solver/conic/orbit.js';

const orbit: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/orbit', {
    schema: {
      tags: ['orbits'],
      summary: 'Solve an orbit: elements, apsides, period, energy, angular momentum, J2 rates',
      body: OrbitRequest,
      response: { 200: OrbitAnswer, ...problemResponses },
    },
  }, async (request, reply) =>
    app.answers.respond(request, reply, 'orbit', request.body, (hash) => {
      const body = resolveBody(request.body.centralBody);
      const { epochTT, input } = orbitSolverInput(request.body);
      const solved = solveOrbit(body, input);
      if (!solved.ok) throw solverProblem(solved);
      return jsonAnswer(toOrbitAnswer(solved.value, body, epochTT, hash));
    }),
  );
};
export default orbit;
