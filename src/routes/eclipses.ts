// POST /v1/eclipses: when the spacecraft is in the Earth's shadow (and the Moon's, when asked), with the beta angle.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { ProblemError, solverProblem } from '../errors.js';
import { CSV_MEDIA_TYPE } from '../formats/csv.js';
import { ECLIPSES_CSV_HEADER, eclipsesCsv } from '../formats/eclipses-csv.js';
import { eclipsesSvg, SVG_MEDIA_TYPE } from '../formats/svg/index.js';
import { jsonAnswer } from '../plugins/answers.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { resolveBody } from '../api/body.js';
import { eclipseSearchJob, toEclipsesAnswer } from '../api/eclipses.js';
import { initialState } from '../api/orbit.js';
import { utcScenario } from '../api/epoch.js';
import { earthOrientationDiagnostics, frameOptions, inputSpan, withTableDigest } from '../api/earth-orientation.js';
import { problemResponses } from '../schemas/common.js';
import { ECLIPSE_FORMATS, EclipsesAnswer, EclipsesRequest } from '../schemas/eclipses.js';

const eclipses: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/eclipses', {
    schema: {
      tags: ['orbits'],
      operationId: 'findEclipses', summary: 'Eclipses: penumbra and umbra entry and exit, depth, beta angle, node local time of sun-synchronous orbits (JSON, CSV or an SVG timeline)',
      description: 'Searches the window for every interval in which the spacecraft sees the solar disc partly or wholly hidden by the Earth ' +
        '(conical shadow, spherical Earth of the equatorial radius, spherical Sun; Montenbruck & Gill 2000 sec. 3.4.2), and by the Moon when asked. ' +
        'Entries and exits are refined to 0.01 s; an eclipse shorter than the scan step is not missed. No atmosphere: real sunlight fades over a few seconds around the computed entry.',
      body: EclipsesRequest,
      response: {
        200: {
          description: 'The eclipses (JSON, CSV or SVG)',
          content: {
            'application/json': { schema: EclipsesAnswer },
            'text/csv': { schema: z.string().describe(`RFC 4180 CSV, one row per eclipse in time order: ${ECLIPSES_CSV_HEADER}`) },
            'image/svg+xml': { schema: z.string().describe('Standalone SVG: a timeline of sunlight, penumbra and umbra, one row per UTC day (a second lane for the Moon\'s shadow when asked)') },
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    // Epochs in canonical UTC first: the same instant in any time system or spelling is one scenario.
    const { format: asked, ...req } = utcScenario(request.body);
    const format = chooseFormat(request, asked, ECLIPSE_FORMATS);
    if (req.centralBody !== 'earth') throw new ProblemError('unsupported-frame', 'eclipses need the built-in centralBody "earth"');
    // JSON answers keep the scenario (and hash) of a request without the format field.
    // With an EOP table in force its digest is part of the scenario (a new table, a new answer).
    const eop = app.eop.current();
    const scenario = withTableDigest(format === 'json' ? req : { ...req, format }, req.centralBody, eop);
    return app.answers.respond(request, reply, 'eclipses', scenario, async (hash) => {
      const body = resolveBody(req.centralBody);
      const frame = frameOptions(req.ut1MinusUtc, eop);
      const start = initialState(body, req, frame);
      if (!start.ok) throw solverProblem(start);
      // Long windows run on a worker thread; the propagator is rebuilt there from this state.
      const job = eclipseSearchJob(req, body, start.value, frame);
      const found = await app.pool.solve(job);
      if (!found.ok) throw solverProblem(found);
      // The Earth orientation enters the node's local time at the window start.
      const used = inputSpan(req, start.value).add(job.startTT);
      const answer = toEclipsesAnswer(req, hash, found.value, start.value, earthOrientationDiagnostics(eop, used, req.ut1MinusUtc));
      if (format === 'json') return jsonAnswer(answer);
      if (format === 'svg') return { contentType: SVG_MEDIA_TYPE, body: Buffer.from(eclipsesSvg(answer)) };
      return { contentType: CSV_MEDIA_TYPE, body: Buffer.from(eclipsesCsv(answer.eclipses, answer.moonEclipses)) };
    });
  });
};

export default eclipses;
