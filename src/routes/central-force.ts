// POST /v1/central-force: effective-potential analysis of motion in a general central potential
// (JSON), or a plot of it (SVG); optionally the track r(t), phi(t).
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { ProblemError, solverProblem } from '../errors.js';
import { centralForceSvg } from '../formats/svg/index.js';
import { jsonAnswer } from '../plugins/answers.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { centralForceProblem, toCentralForceAnswer } from '../api/central-force.js';
import { assertFinite } from '../api/finite.js';
import { CENTRAL_FORCE_FORMATS, CentralForceAnswer, CentralForceRequest, SVG_MEDIA_TYPE } from '../schemas/central-force.js';
import { problemResponses } from '../schemas/common.js';

const OVERFLOW = 'the numbers overflow double precision (or lose all meaning) for this input: rescale the units';

const centralForce: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/central-force', {
    schema: {
      tags: ['orbits'],
      operationId: 'solveCentralForce', summary: 'General central force: effective potential, turning points, circular orbits, radial period, apsidal angle, track (JSON, or SVG plots of U_eff and r(phi))',
      description: 'Analyses motion in U(r) = sum of terms through U_eff = U + l^2 / (2 m r^2). Works in any consistent unit system ' +
        '(numbers are used as given); angles in the answer (apsidalAngle, precessionPerOrbit, track phi) are degrees. ' +
        'An energy below every value of U_eff answers 422 energy-below-minimum; parameters outside their physical range that the ' +
        'schema cannot see answer 422 invalid-parameter.',
      body: CentralForceRequest,
      response: {
        200: {
          description: 'The analysis (JSON) or its plot (SVG)',
          content: {
            'application/json': { schema: CentralForceAnswer },
            'image/svg+xml': { schema: z.string().describe('Standalone SVG: U_eff(r), U(r), the energy level, turning points and circular orbits; with a track, also the path r(phi) in the plane') },
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    const req = request.body;
    const format = chooseFormat(request, req.format, CENTRAL_FORCE_FORMATS);
    // The track's start defaults by the input form; filled here so that both spellings hash alike.
    const track = req.track ? { ...req.track, start: req.track.start ?? (req.initial ? 'initial' as const : 'periapsis' as const) } : undefined;
    const scenario = { ...req, format, ...(track ? { track } : {}) };
    return app.answers.respond(request, reply, 'central-force', scenario, async (hash) => {
      const problem = centralForceProblem(req);
      if (!problem.ok) throw solverProblem(problem);
      const max = app.config.MAX_TRACK_SAMPLES;
      // One job: the analysis, then the track when one was asked (within the sample
      // limit). A job with a track runs on a worker thread. Failures are reported in the order
      // below: analysis, then the sample limit, then the track.
      const solved = await app.pool.solve({
        kind: 'central-force',
        problem: problem.value,
        options: {
          samples: req.samples,
          ...(req.rMin !== undefined ? { rMin: req.rMin } : {}),
          ...(req.rMax !== undefined ? { rMax: req.rMax } : {}),
        },
        track: track && track.samples <= max
          ? { samples: track.samples, start: track.start, ...(track.periods !== undefined ? { periods: track.periods } : { duration: track.duration! }) }
          : null,
      });
      const analysis = solved.analysis;
      if (!analysis.ok) throw solverProblem(analysis);

      if (format === 'svg' && analysis.value.effectivePotential.length < 2) throw new ProblemError('invalid-parameter', OVERFLOW);

      let solvedTrack = null;
      if (track) {
        if (track.samples > max) throw new ProblemError('too-many-samples', `${track.samples} track samples asked; the maximum is ${max}`);
        const run = solved.track;
        if (run === null) throw new Error('the central-force job returned no track although one was asked');
        if (!run.ok) throw solverProblem(run);
        solvedTrack = { start: track.start, value: run.value };
      }
      const answer = toCentralForceAnswer(analysis.value, solvedTrack, req.units, hash);
      assertFinite(answer); // the plot is drawn from the same numbers: one check for both formats
      if (format === 'svg') {
        const path = solvedTrack && { ...solvedTrack.value, periapsis: analysis.value.periapsis, apoapsis: analysis.value.apoapsis };
        return { body: Buffer.from(centralForceSvg(problem.value.terms, analysis.value, path, { units: req.units })), contentType: SVG_MEDIA_TYPE };
      }
      return jsonAnswer(answer);
    });
  });
};
export default centralForce;
