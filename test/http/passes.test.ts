import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { PassesAnswer } from '../../src/schemas/passes.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const demo = { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-02T00:00:00Z' }, stations: DEMO_STATIONS };
const ms = (iso: string) => Date.parse(iso);

describe('POST /v1/passes', () => {
  it('answers passes in AOS order with AOS < TCA < LOS, durations that match, and elevations above the limit', async () => {
    const res = await postJson(app, '/v1/passes', demo);
    expect(res.statusCode, res.body).toBe(200);
    const answer = PassesAnswer.parse(res.json());
    // A 97.6 deg sun-synchronous orbit passes a 78 deg N station on most of its ~15 revolutions a day
    // and a 61 deg N station several times (common practice, no source).
    const count = (id: string) => answer.passes.filter((p) => p.station === id).length;
    expect(count('oskel-fjord')).toBeGreaterThanOrEqual(10);
    expect(count('korrin-hill')).toBeGreaterThanOrEqual(3);
    for (let i = 0; i < answer.passes.length; i++) {
      const p = answer.passes[i]!;
      if (i > 0) expect(ms(p.aos)).toBeGreaterThanOrEqual(ms(answer.passes[i - 1]!.aos));
      expect(ms(p.aos)).toBeLessThanOrEqual(ms(p.tca));
      expect(ms(p.tca)).toBeLessThanOrEqual(ms(p.los));
      expectClose(p.duration * 1000, ms(p.los) - ms(p.aos), 2, 'duration');
      expect(p.maxElevation).toBeGreaterThan(p.station === 'korrin-hill' ? 5 : 0);
      // At 550 km the horizon is ~2700 km away (sqrt((R+h)^2 - R^2); common practice, no source).
      expect(p.rangeTca).toBeLessThan(2800);
      expect(p.rangeTca).toBeGreaterThan(540);
    }
  });

  it('the pointing track starts and ends on the elevation limit and carries the Doppler shift of the carrier', async () => {
    const carrier = 2.2e9;
    const res = await postJson(app, '/v1/passes', { ...demo, stations: [demo.stations[0]], pointing: { step: 5, carrierFrequency: carrier } });
    const answer = PassesAnswer.parse(res.json());
    const full = answer.passes.filter((p) => !p.startsBeforeWindow && !p.endsAfterWindow);
    expect(full.length).toBeGreaterThan(0);
    for (const p of full) {
      const track = p.pointing!;
      expectClose(track[0]!.elevation, 5, 0.01, 'elevation at AOS');
      expectClose(track[track.length - 1]!.elevation, 5, 0.01, 'elevation at LOS');
      expect(Math.max(...track.map((s) => s.elevation))).toBeLessThanOrEqual(p.maxElevation + 1e-6);
      for (const s of track) {
        // Doppler to first order: f_r = f (1 - rdot / c), c = 299792.458 km/s (SI definition of the metre).
        expectClose(s.dopplerFactor, 1 - s.rangeRate / 299_792.458, 1e-15, 'factor');
        expectClose(s.dopplerShift!, carrier * (s.dopplerFactor - 1), 1e-3, 'shift');
      }
      // Approaching before TCA, receding after (common practice, no source).
      expect(track[0]!.rangeRate).toBeLessThan(0);
      expect(track[track.length - 1]!.rangeRate).toBeGreaterThan(0);
    }
  });

  it('a geostationary spacecraft is visible all window long from below it and never from the far side', async () => {
    // a = 42164.17 km circular equatorial (from GM and the sidereal day; common practice, no source).
    const geo = {
      ...demo,
      elements: { epoch: EPOCH, semiMajorAxis: 42164.17, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 0 },
      window: { start: EPOCH, stop: '2026-12-01T12:00:00Z' },
    };
    const probe = await postJson(app, '/v1/track', { centralBody: 'earth', elements: geo.elements, grid: { times: [EPOCH] }, frame: 'geodetic' });
    const subLongitude = probe.json().samples[0].longitude as number;
    const res = await postJson(app, '/v1/passes', {
      ...geo,
      stations: [
        { id: 'below', latitude: 0, longitude: subLongitude, altitude: 0, minElevation: 10 },
        { id: 'far-side', latitude: 0, longitude: subLongitude + 180, altitude: 0, minElevation: 0 },
      ],
    });
    const answer = PassesAnswer.parse(res.json());
    expect(answer.passes.map((p) => p.station)).toEqual(['below']);
    expect(answer.passes[0]).toMatchObject({ startsBeforeWindow: true, endsAfterWindow: true });
    expectClose(answer.passes[0]!.maxElevation, 90, 0.5, 'zenith');
  });

  it('refuses bad requests with problems naming the reason', async () => {
    const cases: Array<[unknown, number, string]> = [
      [{ ...demo, window: { start: EPOCH, stop: '2027-01-15T00:00:00Z' } }, 422, '/problems/window-too-long'],
      [{ ...demo, window: { start: '2026-12-02T00:00:00Z', stop: EPOCH } }, 400, '/problems/validation-failed'],
      [{ ...demo, stations: [demo.stations[0], demo.stations[0]] }, 422, '/problems/invalid-parameter'],
      [{ ...demo, stations: Array.from({ length: 101 }, (_, i) => ({ ...demo.stations[0], id: `s${i}` })) }, 400, '/problems/validation-failed'],
      [{ ...demo, stations: [{ ...demo.stations[0], horizonMask: [{ azimuth: 360, elevation: 5 }] }] }, 400, '/problems/validation-failed'],
      [{ ...demo, centralBody: 'moon', elements: { ...demo.elements, semiMajorAxis: 2000 } }, 422, '/problems/unsupported-frame'],
      [{ ...demo, elements: { ...demo.elements, semiMajorAxis: 6500, eccentricity: 0.1 } }, 422, '/problems/impact'],
    ];
    for (const [body, status, type] of cases) {
      const res = await postJson(app, '/v1/passes', body);
      expect(res.statusCode, type).toBe(status);
      expect(res.json().type, JSON.stringify(res.json())).toBe(type);
    }
  });

  it('caches by scenario: same bytes, 304 on If-None-Match', async () => {
    const first = await postJson(app, '/v1/passes', demo);
    const second = await postJson(app, '/v1/passes', demo);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    expect((await postJson(app, '/v1/passes', demo, { 'if-none-match': String(first.headers.etag) })).statusCode).toBe(304);
  });
});
