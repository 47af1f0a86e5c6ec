// POST /v1/track: an orbit propagated over a time grid; JSON, CSV or CCSDS OEM, streamed.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { solverProblem } from '../errors.js';
import { csvChunks, CSV_MEDIA_TYPE } from '../formats/csv.js';
import { oemChunks, OEM_MEDIA_TYPE } from '../formats/oem.js';
import { JSON_MEDIA_TYPE, trackJsonChunks } from '../formats/track-json.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { resolveBody } from '../schemas/body.js';
import { problemResponses } from '../schemas/common.js';
import { initialState } from '../schemas/initial-state.js';
import { gridEpochs } from '../schemas/grid.js';
import { TRACK_FORMATS, TrackAnswer, TrackRequest } from '../schemas/track.js';
import { propagateTrack, type Track } from '../solver/track.js';

/** Increasing order without repeats (an OEM needs strictly increasing epochs). */
function increasing(epochs: Float64Array): Float64Array {
  const sorted = Float64Array.from(epochs).sort();
  let n = 0;
  for (let i = 0; i < sorted.length; i++) if (i === 0 || sorted[i]! > sorted[n - 1]!) sorted[n++] = sorted[i]!;
  return sorted.subarray(0, n);
}

const track: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/track', {
    schema: {
      tags: ['orbits'],
      summary: 'Propagate an orbit over a time grid (JSON, CSV or CCSDS OEM)',
      description: 'Samples the orbit at each epoch of the grid with the chosen model and reports conservation diagnostics. ' +
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
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    const req = request.body;
    const format = chooseFormat(request, req.format, TRACK_FORMATS.map(([f, type]) => [f, f === 'oem' ? 'text/plain' : type] as const));
    return app.answers.respondStream(request, reply, 'track', { ...req, format }, (hash) => {
      const body = resolveBody(req.centralBody);
      const start = initialState(body, req);
      if (!start.ok) throw solverProblem(start);
      let epochsTT = gridEpochs(req.grid, app.config.MAX_TRACK_SAMPLES);
      if (format === 'oem') epochsTT = increasing(epochsTT);
      const result = propagateTrack({ body, model: req.model, r0: start.value.r, v0: start.value.v, epochTT: start.value.epochTT, epochsTT, passThroughBody: req.passThroughBody });
      if (!result.ok) throw solverProblem(result);
      const table: Track = result.value;
      if (format === 'csv') return { contentType: CSV_MEDIA_TYPE, chunks: csvChunks(table) };
      if (format === 'oem') {
        return {
          contentType: OEM_MEDIA_TYPE,
          chunks: oemChunks(table, {
            creationEpochTT: start.value.epochTT,
            originator: 'apsides',
            objectName: req.object.name,
            objectId: req.object.id,
            centerName: body.name.toUpperCase(),
            refFrame: 'GCRF',
            comments: [
              `model ${req.model}, GM ${body.gm} km**3/s**2; scenario ${hash}`,
              'CREATION_DATE is the epoch of the initial state, so that one scenario always gives the same bytes',
            ],
          }),
        };
      }
      const head = {
        scenarioHash: hash,
        model: req.model,
        frame: req.frame,
        centralBody: { name: body.name, gm: body.gm, radius: body.radius ?? null },
        object: req.object,
        sampleCount: table.epochsTT.length,
        diagnostics: {
          energyRelativeDrift: table.drift.energy,
          energyDriftVsPotential: table.drift.energyVsPotential,
          angularMomentumRelativeDrift: table.drift.angularMomentumVector,
        },
      };
      return { contentType: JSON_MEDIA_TYPE, chunks: trackJsonChunks(head, table) };
    });
  });
};
export default track;
