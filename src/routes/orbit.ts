// POST /v1/orbit: elements, apsides, period and conserved quantities of an orbit.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { solverProblem } from '../errors.js';
import { z } from 'zod';
import { orbitSvg, SVG_MEDIA_TYPE } from '../formats/svg/index.js';
import { assertFinite } from '../api/finite.js';
import { jsonAnswer } from '../plugins/answers.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { problemResponses } from '../schemas/common.js';
import { resolveBody } from '../api/body.js';
import { utcScenario } from '../api/epoch.js';
import { earthOrientationDiagnostics, frameOptions, Span, withTableDigest } from '../api/earth-orientation.js';
import { orbitPlotInput, orbitSolverInput, toOrbitAnswer } from '../api/orbit.js';
import { catalogInitialState, elementSetAge, meanElementsAnswer } from '../api/catalog.js';
import { earthFixedNodeSpans, ephemerisInitialState, ephemerisOrbit } from '../api/ephemeris.js';
import { epochTT as epochTTOf } from '../api/epoch.js';
import { OrbitAnswer, OrbitRequest, PLOT_FORMATS } from '../schemas/orbit.js';
import { solveOrbit } from '../solver/conic/orbit.js';

const orbit: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/orbit', {
    schema: {
      tags: ['orbits'],
      operationId: 'solveOrbit', summary: 'Solve an orbit: elements, apsides, period, energy, angular momentum, J2 rates (JSON or SVG)',
      body: OrbitRequest,
      response: {
        200: {
          description: 'The orbit (JSON) or its plot (SVG)',
          content: {
            'application/json': { schema: OrbitAnswer },
            'image/svg+xml': { schema: z.string().describe('Standalone SVG: the orbit in its plane with the body to scale, periapsis, apoapsis, line of nodes and the position at the epoch') },
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    // Epochs in canonical UTC first: the same instant in any time system or spelling is one scenario.
    const { format: asked, ...req } = utcScenario(request.body);
    const format = chooseFormat(request, asked, PLOT_FORMATS);
    // JSON answers keep the scenario (and hash) they had before the format field existed.
    // With an EOP table in force its digest is part of the scenario (a new table, a new answer).
    const eop = app.eop.current();
    const scenario = withTableDigest(format === 'json' ? req : { ...req, format }, req.centralBody, eop);
    return app.answers.respond(request, reply, 'orbit', scenario, (hash) => {
      const body = resolveBody(req.centralBody);
      // A catalogue orbit: the osculating state at the element epoch from SGP4, with the mean elements as given.
      const catalog = catalogInitialState(body, req, '');
      if (catalog && !catalog.ok) throw solverProblem(catalog);
      const frame = frameOptions(req.ut1MinusUtc, eop);
      // An ephemeris: the osculating orbit of its first node (GCRF).
      const eph = ephemerisOrbit(req, body, frame);
      const first = eph ? ephemerisInitialState(eph) : catalog?.ok ? catalog.value : undefined;
      const { epochTT, input } = first ? { epochTT: first.epochTT, input: { r: first.r, v: first.v } } : orbitSolverInput(req, body, frame);
      const used = new Span();
      if (req.state?.frame === 'itrf' || req.state?.frame === 'teme') used.add(epochTT);
      if (eph) for (const [lo, hi] of earthFixedNodeSpans(eph)) used.add(lo).add(hi);
      const earthOrientation = earthOrientationDiagnostics(eop, used, req.ut1MinusUtc);
      const solved = solveOrbit(body, input);
      if (!solved.ok) throw solverProblem(solved);
      const set = catalog?.ok ? catalog.value.set : undefined;
      const answer = {
        ...toOrbitAnswer(solved.value, body, epochTT, hash),
        ...(set ? { meanElements: meanElementsAnswer(set) } : {}),
        ...(set && req.ageAt !== undefined ? { elementSetAge: elementSetAge(set, epochTTOf(req.ageAt)) } : {}),
        ...(earthOrientation ? { diagnostics: { earthOrientation } } : {}),
      };
      assertFinite(answer); // the plot is drawn from the answer: the same check for both formats
      return format === 'json' ? jsonAnswer(answer) : { contentType: SVG_MEDIA_TYPE, body: Buffer.from(orbitSvg(orbitPlotInput(answer))) };
    });
  });
};
export default orbit;
