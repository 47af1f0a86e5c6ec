// POST /v1/track: an orbit propagated over a time grid; JSON, CSV, CCSDS OEM, GeoJSON or an SVG map, streamed.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { solverProblem } from '../errors.js';
import { epochsForFormat, TailBytes, TRACK_FORMATS, trackNeeds, trackProduct, trackTail } from '../formats/track-output.js';
import { TAIL_ARENA_STATES_MAX, TAIL_ARENAS } from '../formats/chunk-pool.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { resolveBody } from '../api/body.js';
import { gridEpochs } from '../api/grid.js';
import { initialState } from '../api/orbit.js';
import { utcScenario } from '../api/epoch.js';
import { earthOrientationDiagnostics, forSpan, frameOptions, inputSpan, Span, withTableDigest } from '../api/earth-orientation.js';
import { trackJob, trackProductInput } from '../api/track.js';
import { problemResponses } from '../schemas/common.js';
import { TrackAnswer, TrackRequest } from '../schemas/track.js';

const track: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/track', {
    schema: {
      tags: ['orbits'],
      operationId: 'propagateTrack', summary: 'Propagate an orbit over a time grid (JSON, CSV, CCSDS OEM, GeoJSON ground track or SVG ground-track map)',
      description: 'Samples the orbit at each epoch of the grid with the chosen model and reports, in diagnostics, the drift of the integrals its dynamics conserve (none for drag, third bodies and radiation pressure). ' +
        `Answers stream; at most MAX_TRACK_SAMPLES samples (default 100000), beyond that a 422 names the maximum. ` +
        'Accuracy degrades with the propagation span and the model chosen: two-body ignores every perturbation.',
      body: TrackRequest,
      response: {
        200: {
          description: 'The track',
          content: {
            'application/json': { schema: TrackAnswer },
            'text/csv': { schema: z.string().describe('RFC 4180 CSV: epoch_utc,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s') },
            'text/plain': { schema: z.string().describe('CCSDS 502.0-B-3 Orbit Ephemeris Message (KVN)') },
            'application/geo+json': { schema: z.string().describe('RFC 7946 FeatureCollection: the WGS-84 ground track, a LineString or a MultiLineString split at the antimeridian; height in metres') },
            'image/svg+xml': { schema: z.string().describe('Standalone SVG: the ground track on an equirectangular world map (Natural Earth coastlines), split at the antimeridian, start and end marked') },
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    // Epochs in canonical UTC first: the same instant in any time system or spelling is one scenario.
    const req = utcScenario(request.body);
    const format = chooseFormat(request, req.format, TRACK_FORMATS);
    const needs = trackNeeds(format, req.frame, req.centralBody === 'earth');
    // With an EOP table in force its digest is part of the scenario (a new table, a new answer).
    const eop = app.eop.current();
    return app.answers.respondStream(request, reply, 'track', withTableDigest({ ...req, format }, req.centralBody, eop), async (hash) => {
      const body = resolveBody(req.centralBody);
      const frame = frameOptions(req.ut1MinusUtc, eop);
      const start = initialState(body, req, frame);
      if (!start.ok) throw solverProblem(start);
      // A long CSV or JSON track's regular grid is written at the start of the arena the solver
      // thread is lent (the states follow it, then the last records): memory written before is not
      // faulted in again.
      let arena: Buffer | null = null;
      const lend = (n: number): Float64Array | undefined => {
        if (!trackTail(format, req.frame, n) || n > TAIL_ARENA_STATES_MAX) return undefined;
        arena = TAIL_ARENAS.acquire();
        return new Float64Array(arena.buffer, arena.byteOffset, n);
      };
      const epochs = epochsForFormat(format, gridEpochs(req.grid, app.config.MAX_TRACK_SAMPLES, lend));
      // The epochs that used the Earth orientation (read before the grid's buffer moves to the worker, unless it is shared in the arena).
      const samples = new Span().addAll(epochs);
      const used = inputSpan(req, start.value);
      if (needs.earthFixed || needs.teme) used.addAll(epochs);
      // Propagation and frame conversion run on a worker thread for long grids (the grid's buffer
      // moves there and comes back, or is shared in the arena; the EOP table cut to its rows); formatting stays here, in
      // chunks, but for the last records of a long CSV or JSON answer: the thread that computed the
      // track writes them while this one checks and writes the first. Every request sharing this
      // computation shares those bytes.
      const job = trackJob(req, body, start.value, epochs, needs, samples.empty ? frame : forSpan(frame, samples.lo, samples.hi));
      const plan = trackTail(format, req.frame, epochs.length);
      arena ??= plan ? TAIL_ARENAS.acquire() : null;
      const solving = plan ? app.pool.trackWithTail(job, plan, arena!.buffer as SharedArrayBuffer) : { result: app.pool.solve(job), tail: undefined };
      const tail = solving.tail ? new TailBytes(solving.tail, arena, TAIL_ARENAS) : undefined;
      const result = await solving.result;
      if (!result.ok) throw solverProblem(result);
      tail?.holds(result.value.track.epochsTT, result.value.track.states);
      const input = trackProductInput(req, format, hash, body, start.value, result.value, earthOrientationDiagnostics(eop, used, req.ut1MinusUtc));
      return () => trackProduct(input, tail);
    });
  });
};
export default track;
