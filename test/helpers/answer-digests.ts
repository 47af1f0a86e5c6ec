// The byte-identity guard's scenarios: invented requests covering every solving endpoint and every
// format it offers (JSON, CSV, CCSDS OEM, GeoJSON, SVG), a few models, frames and options, a batch,
// GET /v1/bodies and problem answers. answerDigests() sends each through app.inject and keeps the
// status, the media type and the SHA-256 of the body bytes. test/http/answer-bytes.test.ts compares
// them with test/fixtures/answer-digests.json; `npm run -s answers:digests` rewrites that table.
import { createHash } from 'node:crypto';
import type { FastifyInstance } from 'fastify';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from './demo.js';
import { GOOD } from './batch.js';

export interface Sent {
  method: 'GET' | 'POST';
  url: string;
  body?: unknown;
  headers?: Record<string, string>;
}

export interface Digest {
  status: number;
  contentType: string;
  sha256: string;
  bytes: number;
}

const STATE_ORBIT = { centralBody: 'earth', state: { epoch: EPOCH, position: [-2436.45, -2436.45, 6891.037], velocity: [5.088611, -5.088611, 0] } };
const TRACK_GRID = { start: EPOCH, stop: '2026-12-01T01:40:00Z', step: 50 };
const WINDOW = { start: EPOCH, stop: '2026-12-02T00:00:00Z' };

const post = (url: string, body: unknown, headers?: Record<string, string>): Sent => ({ method: 'POST', url, body, ...(headers ? { headers } : {}) });

/** name -> request. Names are stable keys of the stored table: rename only with a regeneration. */
export const SCENARIOS: Record<string, Sent> = {
  'bodies': { method: 'GET', url: '/v1/bodies' },

  'orbit elements json': post('/v1/orbit', DEMO_ORBIT),
  'orbit state json': post('/v1/orbit', STATE_ORBIT),
  'orbit elements svg': post('/v1/orbit', { ...DEMO_ORBIT, format: 'svg' }),
  'orbit svg by accept': post('/v1/orbit', DEMO_ORBIT, { accept: 'image/svg+xml' }),
  'orbit moon hyperbolic json': post('/v1/orbit', { centralBody: 'moon', state: { epoch: EPOCH, position: [2500, 0, 0], velocity: [0, 2.5, 0.3] } }),

  'track gcrf json': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID }),
  'track gcrf csv': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, format: 'csv' }),
  'track csv by accept': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID }, { accept: 'text/csv' }),
  'track gcrf oem': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, format: 'oem', object: { name: 'PLOVER-7', id: '2026-900A' } }),
  'track itrf oem': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, format: 'oem', frame: 'itrf', ut1MinusUtc: 0.1 }),
  'track itrf csv': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, format: 'csv', frame: 'itrf' }),
  'track geodetic json': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, frame: 'geodetic' }),
  'track geodetic csv': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, format: 'csv', frame: 'geodetic' }),
  'track geojson': post('/v1/track', { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T03:00:00Z', step: 30 }, format: 'geojson' }),
  'track svg': post('/v1/track', { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T03:00:00Z', step: 30 }, format: 'svg' }),
  'track j2-secular csv': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, model: 'j2-secular', format: 'csv' }),
  'track j2-analytic json': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID, model: 'j2-analytic' }),
  'track numerical j2 drag json': post('/v1/track', { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:30:00Z', step: 120 }, model: 'numerical', forces: [{ kind: 'j2' }, { kind: 'drag', ballisticCoefficient: 80 }] }),
  'track state 10k csv': post('/v1/track', { ...STATE_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T02:46:39Z', step: 1 }, format: 'csv' }),
  'track state 10k json': post('/v1/track', { ...STATE_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T02:46:39Z', step: 1 }, format: 'json' }),

  'passes json': post('/v1/passes', { ...DEMO_ORBIT, window: WINDOW, stations: DEMO_STATIONS }),
  'passes svg': post('/v1/passes', { ...DEMO_ORBIT, window: WINDOW, stations: DEMO_STATIONS, format: 'svg' }),
  'passes pointing doppler json': post('/v1/passes', { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-01T12:00:00Z' }, stations: DEMO_STATIONS, pointing: { step: 10, carrierFrequency: 2.2e9 } }),
  'passes optical sun json': post('/v1/passes', { ...DEMO_ORBIT, window: WINDOW, stations: DEMO_STATIONS, refraction: 'optical', sunAvoidance: { angle: 20 }, twilightLimit: -12 }),
  'passes radio j2 json': post('/v1/passes', { ...DEMO_ORBIT, window: WINDOW, stations: [DEMO_STATIONS[0]], refraction: 'radio', model: 'j2-secular' }),

  'eclipses json': post('/v1/eclipses', { ...DEMO_ORBIT, window: WINDOW }),
  'eclipses csv': post('/v1/eclipses', { ...DEMO_ORBIT, window: WINDOW, format: 'csv' }),
  'eclipses svg': post('/v1/eclipses', { ...DEMO_ORBIT, window: WINDOW, format: 'svg' }),

  'two-body json': post('/v1/two-body', GOOD['two-body']),
  'two-body track json': post('/v1/two-body', { ...GOOD['two-body'], track: { grid: { start: EPOCH, stop: '2026-12-02T00:00:00Z', step: 3600 } } }),

  'central-force json': post('/v1/central-force', GOOD['central-force']),
  'central-force track json': post('/v1/central-force', { ...GOOD['central-force'], track: { periods: 2, samples: 101 } }),
  'central-force track svg': post('/v1/central-force', { ...GOOD['central-force'], track: { periods: 2, samples: 101 }, format: 'svg' }),

  'batch every kind': post('/v1/batch', { items: Object.entries(GOOD).map(([kind, body], i) => ({ id: `item-${i}`, kind, request: body })) }),

  'problem validation': post('/v1/orbit', { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, inclination: 200 } }),
  'problem eccentricity': post('/v1/orbit', { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, eccentricity: -1 } }),
  'problem epoch': post('/v1/orbit', { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, epoch: '2026-02-30T00:00:00Z' } }),
  'problem not acceptable': post('/v1/track', { ...DEMO_ORBIT, grid: TRACK_GRID }, { accept: 'application/pdf' }),
};

/** Problem answers carry the request id and path; the table keeps only what the request decides. */
function comparableBody(payload: Buffer, contentType: string): Buffer {
  if (!contentType.startsWith('application/problem+json')) return payload;
  const { requestId: _id, ...rest } = JSON.parse(payload.toString('utf8')) as Record<string, unknown>;
  return Buffer.from(JSON.stringify(rest));
}

async function digestOf(app: FastifyInstance, sent: Sent): Promise<Digest> {
  const res = await app.inject({
    method: sent.method,
    url: sent.url,
    ...(sent.body === undefined ? {} : { payload: JSON.stringify(sent.body) }),
    headers: { ...(sent.body === undefined ? {} : { 'content-type': 'application/json' }), ...sent.headers },
  });
  const contentType = String(res.headers['content-type'] ?? '');
  const body = comparableBody(res.rawPayload, contentType);
  return { status: res.statusCode, contentType, sha256: createHash('sha256').update(body).digest('hex'), bytes: body.length };
}

/**
 * Each scenario's status, media type and the SHA-256 of its body. Each is sent `repeats` times in a
 * row (the first solves, later ones come from the cache) and `repeated` lists the scenarios whose
 * later answers differed from the first.
 */
export async function answerDigests(app: FastifyInstance, repeats = 1): Promise<{ digests: Record<string, Digest>; repeated: string[] }> {
  const digests: Record<string, Digest> = {};
  const repeated: string[] = [];
  for (const [name, sent] of Object.entries(SCENARIOS)) {
    const first = await digestOf(app, sent);
    digests[name] = first;
    for (let i = 1; i < repeats; i++) {
      const again = await digestOf(app, sent);
      if (again.sha256 !== first.sha256 || again.status !== first.status || again.contentType !== first.contentType) repeated.push(`${name} (send ${i + 1})`);
    }
  }
  return { digests, repeated };
}
