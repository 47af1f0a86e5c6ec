// POST /v1/track: an orbit propagated over a time grid; JSON, CSV or CCSDS OEM, streamed.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { ProblemError, solverProblem } from '../errors.js';
import { columnCsvChunks, csvChunks, CSV_MEDIA_TYPE } from '../formats/csv.js';
import { GEOJSON_MEDIA_TYPE, groundTrackGeoJson } from '../formats/geojson.js';
import { oemChunks, OEM_MEDIA_TYPE } from '../formats/oem.js';
import { JSON_MEDIA_TYPE, STATE_FIELDS, trackJsonChunks } from '../formats/track-json.js';
import { firstUnprintable, PRINTABLE_LIMIT } from '../formats/track-table.js';
import { chooseFormat } from '../plugins/negotiate.js';
import { resolveBody } from '../schemas/body.js';
import { DEG_PER_RAD, problemResponses } from '../schemas/common.js';
import type { CentralBody } from '../solver/bodies/bodies.js';
import { initialState } from '../schemas/initial-state.js';
import { gridEpochs } from '../schemas/grid.js';
import { diagnosticsOf, TRACK_FORMATS, TrackAnswer, TrackRequest } from '../schemas/track.js';
import type { Track } from '../solver/propagation/track.js';

/** Increasing order without repeats (an OEM needs strictly increasing epochs). */
function increasing(epochs: Float64Array): Float64Array {
  const sorted = Float64Array.from(epochs).sort();
  let n = 0;
  for (let i = 0; i < sorted.length; i++) if (i === 0 || sorted[i]! > sorted[n - 1]!) sorted[n++] = sorted[i]!;
  return sorted.subarray(0, n);
}

const GEODETIC_CSV = [
  { header: 'latitude_deg', decimals: 7 },
  { header: 'longitude_deg', decimals: 7 },
  { header: 'height_km', decimals: 6 },
];
const GEODETIC_FIELDS = [
  { key: 'latitude', from: 0, count: 1, decimals: 7 },
  { key: 'longitude', from: 1, count: 1, decimals: 7 },
  { key: 'height', from: 2, count: 1, decimals: 6 },
];

/** WGS-84 latitude, longitude (rad -> deg, in place) and height (km): radians to degrees at the edge. */
function geodeticDegrees(g: Float64Array): Float64Array {
  for (let i = 0; i < g.length; i += 3) {
    g[i] = g[i]! * DEG_PER_RAD;
    g[i + 1] = g[i + 1]! * DEG_PER_RAD;
  }
  return g;
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
            'application/geo+json': { schema: z.string().describe('RFC 7946 FeatureCollection: the WGS-84 ground track, a LineString or a MultiLineString split at the antimeridian; height in metres') },
          },
        },
        ...problemResponses,
      },
    },
  }, async (request, reply) => {
    const req = request.body;
    const format = chooseFormat(request, req.format, TRACK_FORMATS);
    const earthOnly = req.frame !== 'gcrf' || format === 'geojson';
    if (earthOnly && req.centralBody !== 'earth') {
      throw new ProblemError('unsupported-frame', `frame ${req.frame}${format === 'geojson' ? ' and GeoJSON' : ''} need the built-in centralBody "earth"`);
    }
    if (format === 'oem' && req.frame === 'geodetic') {
      throw new ProblemError('unsupported-frame', 'an OEM carries Cartesian states: choose frame gcrf or itrf');
    }
    const head = (hash: string, body: CentralBody, inertial: Track) => ({
      scenarioHash: hash,
      model: req.model,
      forces: req.forces,
      frame: req.frame,
      centralBody: { name: body.name, gm: body.gm, radius: body.radius ?? null },
      object: req.object,
      sampleCount: inertial.epochsTT.length,
      // Conservation is checked on the inertial states, whatever the output frame.
      diagnostics: diagnosticsOf(inertial.drift),
    });
    return app.answers.respondStream(request, reply, 'track', { ...req, format }, async (hash) => {
      const body = resolveBody(req.centralBody);
      const start = initialState(body, req);
      if (!start.ok) throw solverProblem(start);
      let grid = gridEpochs(req.grid, app.config.MAX_TRACK_SAMPLES);
      if (format === 'oem') grid = increasing(grid);
      const earthFixed = req.frame !== 'gcrf' || format === 'geojson';
      const wantGeodetic = req.frame === 'geodetic' || format === 'geojson';
      // Propagation and frame conversion run on a worker thread for long grids (the grid's buffer
      // moves there and comes back as inertial.epochsTT); formatting stays here, in chunks.
      const result = await app.pool.solve({
        kind: 'track',
        input: { body, model: req.model, forces: req.forces, r0: start.value.r, v0: start.value.v, epochTT: start.value.epochTT, epochsTT: grid, passThroughBody: req.passThroughBody },
        earthFixed: earthFixed ? { dut1: req.ut1MinusUtc } : null,
        geodetic: wantGeodetic,
      });
      if (!result.ok) throw solverProblem(result);
      const inertial: Track = result.value.track;
      const epochsTT = inertial.epochsTT;
      const states = result.value.earthFixed ?? inertial.states;
      const table = { epochsTT, states };
      const bad = firstUnprintable(states);
      if (bad >= 0) throw new ProblemError('limit-exceeded', `sample ${Math.floor(bad / 6)} reaches ${states[bad]} km or km/s; tracks print values below ${PRINTABLE_LIMIT} in magnitude`);
      if (wantGeodetic) {
        const geodetic = geodeticDegrees(result.value.geodetic!);
        if (format === 'geojson') {
          const samples = Array.from(epochsTT, (t, i) => ({ tt: t, latitudeDeg: geodetic[3 * i]!, longitudeDeg: geodetic[3 * i + 1]!, heightKm: geodetic[3 * i + 2]! }));
          return { contentType: GEOJSON_MEDIA_TYPE, chunks: groundTrackGeoJson(samples, { name: req.object.name, includeHeight: true }) };
        }
        if (format === 'csv') return { contentType: CSV_MEDIA_TYPE, chunks: columnCsvChunks(epochsTT, geodetic, GEODETIC_CSV) };
        return { contentType: JSON_MEDIA_TYPE, chunks: trackJsonChunks(head(hash, body, inertial), epochsTT, geodetic, GEODETIC_FIELDS) };
      }
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
            refFrame: req.frame === 'itrf' ? 'ITRF' : 'GCRF',
            comments: [
              `model ${req.model}, GM ${body.gm} km**3/s**2; scenario ${hash}`,
              ...(req.frame === 'itrf' ? [`Earth-fixed: IAU precession-nutation and Earth rotation, polar motion neglected, UT1-UTC ${req.ut1MinusUtc} s`] : []),
              'CREATION_DATE is the epoch of the initial state, so that one scenario always gives the same bytes',
            ],
          }),
        };
      }
      return { contentType: JSON_MEDIA_TYPE, chunks: trackJsonChunks(head(hash, body, inertial), epochsTT, states, STATE_FIELDS) };
    });
  });
};
export default track;
