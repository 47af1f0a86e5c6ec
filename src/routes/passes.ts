// POST /v1/passes: when a spacecraft rises and sets over each ground station, and where to point.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { ProblemError, solverProblem } from '../errors.js';
import { z } from 'zod';
import { passesSvg, SVG_MEDIA_TYPE } from '../formats/svg/index.js';
import { assertFinite } from '../api/finite.js';
import { jsonAnswerInTurns } from '../plugins/answers.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { resolveBody } from '../api/body.js';
import { initialState } from '../api/orbit.js';
import { utcScenario } from '../api/epoch.js';
import { earthOrientationDiagnostics, frameOptions, inputSpan, withTableDigest } from '../api/earth-orientation.js';
import { passesAnswerParts, passSearchJob, toPassesAnswer } from '../api/passes.js';
import { problemResponses } from '../schemas/common.js';
import { PassesAnswer, PassesRequest } from '../schemas/passes.js';
import { PLOT_FORMATS } from '../schemas/orbit.js';

const passes: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/passes', {
    schema: {
      tags: ['orbits'],
      operationId: 'findPasses', summary: 'Ground-station passes: AOS, TCA, LOS, maximum elevation, azimuths, optional pointing and Doppler (JSON or SVG)',
      description: 'Searches the window for every interval in which the spacecraft is above each station\'s elevation limit and horizon mask. ' +
        'AOS/LOS are refined to better than 0.1 s and TCA by maximisation. Geometric elevations unless refraction (radio or optical) is asked. ' +
        'Pass predictions do not grant a licence to transmit: radio transmission needs licensing and frequency coordination.',
      body: PassesRequest,
      response: {
        200: {
          description: 'The passes (JSON) or their plots (SVG)',
          content: {
            'application/json': { schema: PassesAnswer },
            'image/svg+xml': { schema: z.string().describe('Standalone SVG: a timeline of the passes by station, then a sky plot per station (radius 90 - elevation) with the horizon mask, AOS, TCA and LOS') },
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    // Epochs in canonical UTC first: the same instant in any time system or spelling is one scenario.
    const { format: asked, ...body } = utcScenario(request.body);
    // refraction "none" is the default: it leaves the scenario (and its hash and bytes) as without the field.
    const { refraction, ...rest } = body;
    const req = refraction === 'none' ? rest : body;
    const format = chooseFormat(request, asked, PLOT_FORMATS);
    if (req.centralBody !== 'earth') throw new ProblemError('unsupported-frame', 'ground-station passes need the built-in centralBody "earth"');
    // JSON answers keep the scenario (and hash) they had before the format field existed.
    // With an EOP table in force its digest is part of the scenario (a new table, a new answer).
    const eop = app.eop.current();
    const scenario = withTableDigest(format === 'json' ? req : { ...req, format }, req.centralBody, eop);
    return app.answers.respond(request, reply, 'passes', scenario, async (hash) => {
      const body = resolveBody(req.centralBody);
      const frame = frameOptions(req.ut1MinusUtc, eop);
      const start = initialState(body, req, frame);
      if (!start.ok) throw solverProblem(start);
      // The search runs on a worker thread unless the window and station list are small; the
      // propagator is rebuilt there from this state.
      const job = passSearchJob(req, body, start.value, frame, format === 'svg');
      const found = await app.pool.solve(job);
      if (!found.ok) throw solverProblem(found);
      const used = inputSpan(req, start.value).add(job.startTT).add(job.stopTT);
      const eo = earthOrientationDiagnostics(eop, used, req.ut1MinusUtc);
      if (format === 'json') {
        // Built, checked and written in slices of the event loop: a month over a hundred stations is megabytes.
        const { head, count, pass } = passesAnswerParts(req, hash, found.value, start.value, eo);
        return jsonAnswerInTurns(head, 'passes', count, pass);
      }
      const answer = toPassesAnswer(req, hash, found.value, start.value, eo);
      assertFinite(answer); // the plots are drawn from the answer: the same check as the JSON answer's
      return { contentType: SVG_MEDIA_TYPE, body: Buffer.from(passesSvg(answer.window, req.stations, answer.passes)) };
    });
  });
};

export default passes;
