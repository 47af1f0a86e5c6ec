// POST /v1/two-body: two bodies -> barycentre, relative orbit, each body's orbit about the
// barycentre and the integrals; optionally both tracks about the barycentre (streamed JSON).
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { solverProblem } from '../errors.js';
import { JSON_MEDIA_TYPE, STATE_COLUMNS, STATE_FIELDS, trackJsonChunks } from '../formats/track-json.js';
import { assertPrintable, type TrackTable } from '../formats/track-table.js';
import { epochTT as toEpochTT, utcEpochs } from '../api/epoch.js';
import { assertFinite, assertFiniteTable } from '../api/finite.js';
import { gridEpochs } from '../api/grid.js';
import { trackDiagnostics } from '../api/track.js';
import { relativeCentralBody, toTwoBodyAnswer, trackNames, twoBodySolverInput } from '../api/two-body.js';
import { problemResponses } from '../schemas/common.js';
import { TwoBodyAnswer, TwoBodyRequest, type TwoBodyTracks } from '../schemas/two-body.js';
import { solveOrbit } from '../solver/conic/orbit.js';
import { bodyTracksAboutBarycentre, reduceTwoBody } from '../solver/conic/two-body.js';

interface Tracks {
  readonly head: Omit<TwoBodyTracks, 'bodies'>;
  readonly names: [string | null, string | null];
  readonly tables: [TrackTable, TrackTable];
}

/** The answer's JSON: the head as it is, then (when asked) both tracks, streamed sample by sample. */
function* answerChunks(head: Omit<TwoBodyAnswer, 'tracks'>, tracks: Tracks | null): Generator<string | Buffer> {
  if (!tracks) {
    yield JSON.stringify({ ...head, tracks: null });
    return;
  }
  const opening = JSON.stringify({ ...head, tracks: tracks.head });
  yield `${opening.slice(0, -2)},"bodies":[`; // drop the closing braces of tracks and of the answer
  yield* trackJsonChunks({ name: tracks.names[0] }, tracks.tables[0].epochsTT, tracks.tables[0].states, STATE_FIELDS);
  yield ',';
  yield* trackJsonChunks({ name: tracks.names[1] }, tracks.tables[1].epochsTT, tracks.tables[1].states, STATE_FIELDS);
  yield ']}}';
}

const twoBody: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/two-body', {
    schema: {
      tags: ['orbits'],
      operationId: 'reduceTwoBody', summary: 'Two-body reduction: barycentre, reduced mass, relative orbit, each body\'s orbit about the barycentre',
      description: 'Masses in kg or as GM (km^3/s^2), converted with G (CODATA 2018); the relative orbit is answered as POST /v1/orbit answers it. ' +
        'With `track`, both bodies\' tracks about the barycentre are appended (at most MAX_TRACK_SAMPLES samples, default 100000; beyond that a 422 names the maximum). ' +
        'Point masses: the bodies have no radius and no collision is detected.',
      body: TwoBodyRequest,
      response: { 200: TwoBodyAnswer, ...problemResponses },
    },
  }, async (request, reply) => {
    // Epochs in canonical UTC first: the same instant in any time system or spelling is one scenario.
    const { track: asked, ...rest } = request.body;
    const req = { ...utcEpochs(rest), ...(asked ? { track: { ...asked, grid: utcEpochs(asked.grid) } } : {}) };
    return app.answers.respondStream(request, reply, 'two-body', req, async (hash) => {
      const [b1, b2] = twoBodySolverInput(req);
      const reduced = reduceTwoBody(b1, b2);
      if (!reduced.ok) throw solverProblem(reduced);
      const red = reduced.value;
      const relativeBody = relativeCentralBody(req, red);
      const orbit = solveOrbit(relativeBody, { r: red.relative.r, v: red.relative.v });
      if (!orbit.ok) throw solverProblem(orbit);
      const epochTT = toEpochTT(req.epoch);
      const head = toTwoBodyAnswer(req, red, orbit.value, relativeBody, epochTT, hash);
      assertFinite(head, 'answer');

      let tracks: Tracks | null = null;
      if (req.track) {
        const epochsTT = gridEpochs(req.track.grid, app.config.MAX_TRACK_SAMPLES);
        // Long grids are propagated on a worker thread (counted against the bounded queue).
        const solved = await app.pool.solve({ kind: 'track', input: { body: relativeBody, model: 'two-body', r0: red.relative.r, v0: red.relative.v, epochTT, epochsTT }, earthFixed: null, geodetic: false });
        if (!solved.ok) throw solverProblem(solved);
        const relative = solved.value.track;
        const { body1, body2 } = bodyTracksAboutBarycentre(red, relative);
        assertFiniteTable(body1.states, STATE_COLUMNS, 'answer.tracks.bodies.0.samples');
        assertFiniteTable(body2.states, STATE_COLUMNS, 'answer.tracks.bodies.1.samples');
        assertPrintable(body1.states);
        assertPrintable(body2.states);
        tracks = {
          head: {
            origin: 'barycenter',
            frame: req.frame,
            sampleCount: epochsTT.length,
            diagnostics: trackDiagnostics(relative.conservation),
          },
          names: trackNames(req),
          tables: [body1, body2],
        };
        assertFinite(tracks.head, 'answer.tracks');
      }
      return () => ({ contentType: JSON_MEDIA_TYPE, chunks: answerChunks(head, tracks) });
    });
  });
};
export default twoBody;
