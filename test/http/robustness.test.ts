import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { FastifyInstance } from 'fastify';
import { testApp } from '../helpers/app.js';

// Hostile but well-formed input: extreme numbers, epochs at the calendar edges and inside a leap
// second, every model. No request a client can send may answer 5xx or a broken stream.
let app: FastifyInstance;
beforeAll(async () => { app = await testApp({ config: { MAX_TRACK_SAMPLES: 2000 } }); });
afterAll(async () => { await app.close(); });

const num = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.constantFrom(0, -0, 1e-300, 1e300, -1, 1, 6378.137, 1e6, 0.9999999999, 1.0000000001),
  fc.integer({ min: -1_000_000, max: 1_000_000 }),
);
const epoch = fc.constantFrom('2026-12-01T00:00:00Z', '1972-01-01T00:00:00Z', '2199-12-31T23:59:59.999Z', '2016-12-31T23:59:60.5Z');
const vec = fc.tuple(num, num, num);
const orbit = fc.oneof(
  fc.record({ centralBody: fc.constantFrom('earth', 'moon', 'sun'), state: fc.record({ epoch, position: vec, velocity: vec }) }),
  fc.record({
    centralBody: fc.constantFrom('earth', 'mars'),
    elements: fc.record({ epoch, semiMajorAxis: num, eccentricity: fc.oneof(num, fc.double({ min: 0, max: 3, noNaN: true })), inclination: fc.double({ min: 0, max: 180, noNaN: true }), raan: num, argPeriapsis: num, trueAnomaly: num }),
  }),
);
const ask = fc.constantFrom('orbit', 'track', 'track-j2', 'track-numerical', 'passes');

describe('hostile numbers', () => {
  it('never answer 5xx, and every error is a problem document', async () => {
    await fc.assert(fc.asyncProperty(orbit, ask, fc.integer({ min: 1, max: 100_000 }), async (o, kind, step) => {
      let url = '/v1/orbit';
      let body: Record<string, unknown> = { ...o };
      if (kind.startsWith('track')) {
        url = '/v1/track';
        body = { ...o, grid: { start: '2026-12-01T00:00:00Z', stop: '2026-12-02T00:00:00Z', step } };
        if (kind === 'track-j2') body.model = 'j2-secular';
        if (kind === 'track-numerical') body = { ...body, model: 'numerical', forces: [{ kind: 'j2' }, { kind: 'drag', ballisticCoefficient: 50 }, { kind: 'third-body', body: 'moon' }] };
      } else if (kind === 'passes') {
        url = '/v1/passes';
        body = { ...o, window: { start: '2026-12-01T00:00:00Z', stop: '2026-12-01T12:00:00Z' }, stations: [{ id: 'a', latitude: 10, longitude: 20, altitude: 0 }] };
      }
      const res = await app.inject({ method: 'POST', url, payload: body });
      expect(res.statusCode, `${url} ${JSON.stringify(body)}: ${res.body.slice(0, 200)}`).toBeLessThan(500);
      if (res.statusCode >= 400) expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    }), { numRuns: 200, seed: 20_261_201 });
  }, 120_000);
});
