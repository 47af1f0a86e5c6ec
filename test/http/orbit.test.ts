import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { OrbitAnswer } from '../../src/schemas/orbit.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

// Curtis, Orbital Mechanics for Engineering Students, 3rd ed., Example 4.3 (from memory).
const curtisState = {
  centralBody: { name: 'earth-curtis', gm: 398600, radius: 6378 },
  state: { epoch: '2026-12-01T00:00:00Z', position: [-6045, -3490, 2500], velocity: [-3.457, 6.618, 2.533] },
};

describe('POST /v1/orbit', () => {
  it('answers the Curtis state-vector example to its printed precision, and the answer matches its schema', async () => {
    const res = await postJson(app, '/v1/orbit', curtisState);
    expect(res.statusCode, res.body).toBe(200);
    const a = OrbitAnswer.parse(res.json());
    // h = 58310 km^2/s, i = 153.2, RAAN = 255.3, e = 0.1712, omega = 20.07, nu = 28.45 deg,
    // rp = 7284 km, ra = 10290 km, a = 8788 km (Curtis 3rd ed. Ex. 4.3, from memory).
    expectClose(a.specificAngularMomentum.magnitude, 58310, 5, 'h'); // printed to four significant figures
    expectClose(a.elements.inclination, 153.2, 0.05, 'i');
    expectClose(a.elements.raan, 255.3, 0.05, 'raan');
    expectClose(a.elements.eccentricity, 0.1712, 5e-5, 'e');
    expectClose(a.elements.argPeriapsis, 20.07, 0.005, 'omega');
    expectClose(a.elements.trueAnomaly, 28.45, 0.005, 'nu');
    // The book carries rounded intermediate values: allow one unit of the last printed digit.
    expectClose(a.apsides.periapsis.radius, 7284, 1, 'rp');
    expectClose(a.apsides.apoapsis!.radius, 10290, 10, 'ra');
    expectClose(a.elements.semiMajorAxis!, 8788, 1, 'a');
    // Kepler's third law T = 2 pi sqrt(a^3 / mu) (common practice, no source); the recalled printed period is not reliable enough to test.
    expectClose(a.period!, 2 * Math.PI * Math.sqrt(a.elements.semiMajorAxis! ** 3 / 398600), 1e-6, 'T');
    expect(a.orbitType).toBe('elliptic');
    expect(a.scenarioHash).toMatch(/^[0-9a-f]{64}$/);
    expect(res.headers.etag).toBe(`"${a.scenarioHash}"`);
  });

  it('answers the demo spacecraft by elements, with J2 rates that call it sun-synchronous', async () => {
    const res = await postJson(app, '/v1/orbit', {
      centralBody: 'earth',
      elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 },
    });
    expect(res.statusCode, res.body).toBe(200);
    const a = OrbitAnswer.parse(res.json());
    expect(a.j2).not.toBeNull();
    // A sun-synchronous RAAN rate is 360 deg per tropical year = 0.9856 deg/day (common practice, no source).
    expectClose(a.j2!.raanRate, 0.9856, 0.01, 'raan rate');
    expect(a.j2!.sunSynchronous).toBe(true);
    expect(a.apsides.periapsis.altitude).toBeGreaterThan(500);
    // Just past periapsis (nu = 10 deg) the apoapsis comes about half a period later and the next periapsis almost a period later.
    const t = (iso: string | null) => Date.parse(iso!) / 1000;
    const sinceEpoch = (iso: string | null) => t(iso) - t('2026-12-01T00:00:00Z');
    expectClose(sinceEpoch(a.apsides.apoapsis!.nextPassage), a.period! / 2 - a.period! * (10 / 360), 60, 'to apoapsis');
    expect(sinceEpoch(a.apsides.periapsis.nextPassage)).toBeGreaterThan(sinceEpoch(a.apsides.apoapsis!.nextPassage));
  });

  it('gives the same bytes and hash whatever the key order, serves the second from the cache, and answers 304 to If-None-Match', async () => {
    const first = await postJson(app, '/v1/orbit', curtisState);
    const reordered = {
      state: { velocity: [-3.457, 6.618, 2.533], position: [-6045, -3490, 2500.0], frame: 'gcrf', epoch: '2026-12-01T00:00:00Z' },
      centralBody: { radius: 6378, gm: 398600, name: 'earth-curtis' },
    };
    // Sent as raw text: JSON.stringify would print 2500.0 as 2500 and the test could not fail.
    const rawText = JSON.stringify(reordered).replace('2500]', '2500.0]').replace('398600,', '398600.000,');
    expect(rawText).toContain('2500.0]');
    const second = await app.inject({ method: 'POST', url: '/v1/orbit', payload: rawText, headers: { 'content-type': 'application/json' } });
    expect(second.statusCode).toBe(200);
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    expect(second.headers['x-cache']).toBe('hit');
    const etag = String(first.headers.etag);
    const notModified = await postJson(app, '/v1/orbit', curtisState, { 'if-none-match': etag });
    expect(notModified.statusCode).toBe(304);
    expect(notModified.body).toBe('');
    const stored = await app.inject({ url: `/v1/results/${etag.replaceAll('"', '')}` });
    expect(stored.statusCode).toBe(200);
    expect(stored.rawPayload.equals(first.rawPayload)).toBe(true);
  });

  it('a hash never computed answers a 404 problem', async () => {
    const res = await app.inject({ url: `/v1/results/${'0'.repeat(64)}` });
    expect(res.statusCode).toBe(404);
    expect(res.json().type).toBe('/problems/result-not-cached');
    const bad = await app.inject({ url: '/v1/results/not-a-hash' });
    expect(bad.statusCode).toBe(400);
  });

  it('malformed JSON answers 400 problem+json', async () => {
    const res = await app.inject({ method: 'POST', url: '/v1/orbit', payload: '{"state": [1, 2', headers: { 'content-type': 'application/json' } });
    expect(res.statusCode).toBe(400);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.json().type).toBe('/problems/malformed-json');
  });

  it('a body that breaks the schema lists each offending field by its path', async () => {
    const res = await postJson(app, '/v1/orbit', {
      centralBody: 'pluto-ish',
      state: { epoch: '2026-02-30T00:00:00Z', position: [1, 2], velocity: [0, 7.5, 0], extra: 1 },
    });
    expect(res.statusCode).toBe(400);
    const problem = res.json();
    expect(problem.type).toBe('/problems/validation-failed');
    const paths = problem.errors.map((e: { path: string }) => e.path);
    expect(paths).toEqual(expect.arrayContaining(['body.centralBody', 'body.state.epoch', 'body.state.position']));
    expect(problem.detail).toMatch(/day 30 does not exist/);
  });

  it('both or neither of state and elements is a 400 naming the rule', async () => {
    const res = await postJson(app, '/v1/orbit', { centralBody: 'earth' });
    expect(res.statusCode).toBe(400);
    expect(res.json().detail).toMatch(/exactly one of state, elements, tle, omm and ephemeris/);
  });

  it('physically meaningless inputs answer 422 naming the reason', async () => {
    const cases: Array<[unknown, string]> = [
      [{ state: { epoch: '2026-12-01T00:00:00Z', position: [0, 0, 0], velocity: [0, 7.5, 0] } }, '/problems/zero-position'],
      [{ state: { epoch: '2026-12-01T00:00:00Z', position: [7000, 0, 0], velocity: [3, 0, 0] } }, '/problems/rectilinear-motion'],
      [{ elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 7000, eccentricity: 1.5, inclination: 10, raan: 0, argPeriapsis: 0, trueAnomaly: 0 } }, '/problems/semi-major-axis-sign'],
      [{ elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: -7000, eccentricity: 1.5, inclination: 10, raan: 0, argPeriapsis: 0, trueAnomaly: 150 } }, '/problems/anomaly-beyond-asymptote'],
      [{ elements: { epoch: '1969-07-20T20:17:00Z', semiMajorAxis: 7000, eccentricity: 0.1, inclination: 10, raan: 0, argPeriapsis: 0, trueAnomaly: 0 } }, '/problems/epoch-out-of-range'], // before UTC's leap-second form (1972)
    ];
    for (const [body, type] of cases) {
      const res = await postJson(app, '/v1/orbit', body);
      expect(res.headers['content-type'], JSON.stringify(body)).toMatch(/application\/problem\+json/);
      expect(res.json().type, JSON.stringify(body)).toBe(type);
      expect(res.statusCode).toBeLessThan(500);
    }
  });

  it('a parabola and a hyperbola have no period and no apoapsis', async () => {
    const parabola = await postJson(app, '/v1/orbit', {
      elements: { epoch: '2026-12-01T00:00:00Z', semiLatusRectum: 14000, eccentricity: 1, inclination: 30, raan: 10, argPeriapsis: 20, trueAnomaly: -30 },
    });
    expect(parabola.statusCode, parabola.body).toBe(200);
    const p = OrbitAnswer.parse(parabola.json());
    expect(p.orbitType).toBe('parabolic');
    expect(p.period).toBeNull();
    expect(p.apsides.apoapsis).toBeNull();
    expect(p.elements.semiMajorAxis).toBeNull();
    // Parabolic speed is the escape speed: specific energy 0 (vis-viva; common practice, no source).
    expectClose(p.specificEnergy, 0, 1e-9, 'energy');
    expect(p.apsides.periapsis.nextPassage).not.toBeNull(); // nu < 0: periapsis ahead
  });
});

describe('POST /v1/orbit at the edges of the calendar', () => {
  it('a passage after 2199 is reported as null, never as a date past year 9999', async () => {
    // a = 1e9 km about the Earth: period ~ 5e9 s ~ 160 years (Kepler's third law; common practice, no source).
    const res = await postJson(app, '/v1/orbit', {
      elements: { epoch: '2150-01-01T00:00:00Z', semiMajorAxis: 1e9, eccentricity: 0.5, inclination: 10, raan: 0, argPeriapsis: 0, trueAnomaly: 1 },
    });
    expect(res.statusCode).toBe(200);
    const a = OrbitAnswer.parse(res.json());
    expect(a.apsides.periapsis.nextPassage).toBeNull();
    expect(a.period!).toBeGreaterThan(1e9);
  });
});
