import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { CentralForceAnswer } from '../../src/schemas/central-force.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose, expectRelClose } from '../helpers/approx.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp({ config: { MAX_TRACK_SAMPLES: 1000 } }); });
afterAll(async () => { await app.close(); });

const URL = '/v1/central-force';

// Invented, checkable Kepler ellipse in arbitrary consistent units: U = k/r with k = -mu m.
// E = -mu m / (2a) and l^2 = m^2 mu a (1 - e^2) (Goldstein, Classical Mechanics, 3rd ed., sec. 3.7, from memory).
const [M, MU, A, ECC] = [2.5, 1.5, 4, 0.3];
const KEPLER_E = (-MU * M) / (2 * A);
const KEPLER_L = M * Math.sqrt(MU * A * (1 - ECC * ECC));
const keplerTerms = [{ kind: 'power', coefficient: -MU * M, exponent: -1 }];
const kepler = { mass: M, potential: { terms: keplerTerms }, angularMomentum: KEPLER_L, energy: KEPLER_E };
/** Kepler's third law T = 2 pi sqrt(a^3 / mu) (Goldstein 3rd ed. sec. 3.8, from memory). */
const KEPLER_T = 2 * Math.PI * Math.sqrt(A ** 3 / MU);

async function answer(body: unknown, headers: Record<string, string> = {}): Promise<CentralForceAnswer> {
  const res = await postJson(app, URL, body, headers);
  expect(res.statusCode, res.body).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  return CentralForceAnswer.parse(res.json());
}

describe('POST /v1/central-force: physics through HTTP', () => {
  it('Kepler ellipse: turning points a(1 - e), a(1 + e), apsidal angle 180 deg, no precession, radial period = Kepler period', async () => {
    const a = await answer(kepler);
    expect(a.scenarioHash).toMatch(/^[0-9a-f]{64}$/);
    expect(a.mass).toBe(M);
    expect(a.angularMomentum).toBe(KEPLER_L);
    expect(a.energy).toBe(KEPLER_E);
    expect(a.motion).toBe('bound');
    expect(a.rectilinear).toBe(false);
    // Apsides r = a(1 -+ e) (Goldstein 3rd ed. sec. 3.7, from memory).
    expect(a.turningPoints).toHaveLength(2);
    expectRelClose(a.turningPoints[0]!, A * (1 - ECC), 1e-12, 'inner turning point');
    expectRelClose(a.turningPoints[1]!, A * (1 + ECC), 1e-12, 'outer turning point');
    expectRelClose(a.periapsis!, A * (1 - ECC), 1e-12, 'periapsis');
    expectRelClose(a.apoapsis!, A * (1 + ECC), 1e-12, 'apoapsis');
    // Closed orbit: apsidal angle pi (Bertrand's theorem; Goldstein 3rd ed. sec. 3.6, from memory), reported in degrees.
    expectClose(a.apsidalAngle!, 180, 1e-9, 'apsidal angle, deg');
    expectClose(a.precessionPerOrbit!, 0, 1e-9, 'precession per orbit, deg');
    expectRelClose(a.radialPeriod!, KEPLER_T, 1e-12, 'radial period');
    // One stable circular orbit at the semi-latus rectum p = l^2 / (m^2 mu) = a (1 - e^2), where
    // radial and angular frequencies are equal (Goldstein 3rd ed. secs. 3.6-3.7, from memory).
    expect(a.circularOrbits).toHaveLength(1);
    const c = a.circularOrbits[0]!;
    expect(c.stable).toBe(true);
    expectRelClose(c.radius, A * (1 - ECC * ECC), 1e-12, 'circular radius');
    expectRelClose(c.frequencyRatio!, 1, 1e-12, 'frequency ratio');
    expectClose(c.apsidalAngle!, 180, 1e-9, 'near-circular apsidal angle, deg');
    expect(a.allowedRegions).toEqual([{ inner: a.periapsis, outer: a.apoapsis, innerEnd: 'turning-point', outerEnd: 'turning-point', motion: 'bound' }]);
    expect(a.analysedRegion).toBe(0);
    expect(a.track).toBeNull();
    // Samples are U = k/r and U_eff = U + l^2/(2 m r^2) (Goldstein 3rd ed. sec. 3.3, from memory), ascending in r.
    expect(a.effectivePotential).toHaveLength(400); // the solver's default sample count
    for (const s of a.effectivePotential.filter((_, i) => i % 50 === 0)) {
      expectRelClose(s.u, (-MU * M) / s.r, 1e-14, `U(${s.r})`);
      expectRelClose(s.uEff, (-MU * M) / s.r + KEPLER_L ** 2 / (2 * M * s.r * s.r), 1e-13, `U_eff(${s.r})`, Math.abs(KEPLER_E));
    }
    expect(a.effectivePotential.every((s, i, all) => i === 0 || s.r > all[i - 1]!.r)).toBe(true);
    expect(a.units).toEqual({ radius: 'consistent units', energy: 'consistent units' });
  });

  it('isotropic harmonic oscillator U = k r^2 / 2: apsidal angle 90 deg, precession -180 deg, radial period pi sqrt(m/k)', async () => {
    const [m, k, l, E] = [0.5, 8, 0.3, 2];
    const a = await answer({ mass: m, potential: { terms: [{ kind: 'power', coefficient: k / 2, exponent: 2 }] }, angularMomentum: l, energy: E });
    expect(a.motion).toBe('bound');
    // Bertrand's theorem: closed orbits, centred ellipses, r returns to periapsis twice per turn (Goldstein 3rd ed. sec. 3.6, from memory).
    expectClose(a.apsidalAngle!, 90, 1e-9, 'apsidal angle, deg');
    expectClose(a.precessionPerOrbit!, -180, 1e-9, 'precession per orbit, deg');
    // r has half the period 2 pi sqrt(m/k) of the Cartesian oscillation (Goldstein 3rd ed. sec. 3.6, from memory).
    expectRelClose(a.radialPeriod!, Math.PI * Math.sqrt(m / k), 1e-12, 'radial period');
    // E = k r^2 / 2 + l^2 / (2 m r^2) solved as a quadratic in r^2 (common practice, no source).
    const root = Math.sqrt(E * E - (k * l * l) / m);
    expectRelClose(a.periapsis!, Math.sqrt((E - root) / k), 1e-13, 'periapsis');
    expectRelClose(a.apoapsis!, Math.sqrt((E + root) / k), 1e-13, 'apoapsis');
  });

  it('Kepler plus beta / r^2 precesses: apsidal angle pi l / sqrt(l^2 + 2 m beta), in degrees', async () => {
    const [m, k, l, beta, E] = [1.3, 2, 0.9, 0.01, -0.5];
    const a = await answer({
      mass: m,
      potential: { terms: [{ kind: 'power', coefficient: -k, exponent: -1 }, { kind: 'power', coefficient: beta, exponent: -2 }] },
      angularMomentum: l,
      energy: E,
    });
    // Landau & Lifshitz, Mechanics, 3rd ed., sec. 15, problem 3 (from memory).
    const apsidalDeg = (180 * l) / Math.sqrt(l * l + 2 * m * beta);
    expectRelClose(a.apsidalAngle!, apsidalDeg, 1e-12, 'apsidal angle, deg');
    expectRelClose(a.precessionPerOrbit!, 2 * apsidalDeg - 360, 1e-9, 'precession per orbit, deg');
  });

  it('the initial form gives the same answer as the equivalent angularMomentum + energy', async () => {
    // The state at true anomaly 60 deg of the Kepler ellipse: r = p / (1 + e cos nu), v_r = (mu/h) e sin nu,
    // v_t = (mu/h)(1 + e cos nu) with h = sqrt(mu p) (Curtis, Orbital Mechanics for Engineering Students, 3rd ed., ch. 2, from memory).
    const nu = Math.PI / 3;
    const p = A * (1 - ECC * ECC);
    const h = Math.sqrt(MU * p);
    const initial = { radius: p / (1 + ECC * Math.cos(nu)), radialVelocity: (MU / h) * ECC * Math.sin(nu), tangentialVelocity: (MU / h) * (1 + ECC * Math.cos(nu)) };
    const byState = await answer({ mass: M, potential: { terms: keplerTerms }, initial });
    const byConstants = await answer(kepler);
    expect(byState.scenarioHash).not.toBe(byConstants.scenarioHash);
    expectRelClose(byState.angularMomentum, byConstants.angularMomentum, 1e-14, 'l');
    expectRelClose(byState.energy, byConstants.energy, 1e-14, 'E');
    expect(byState.motion).toBe(byConstants.motion);
    expect(byState.turningPoints).toHaveLength(byConstants.turningPoints.length);
    byState.turningPoints.forEach((r, i) => expectRelClose(r, byConstants.turningPoints[i]!, 1e-12, `turning point ${i}`));
    expectRelClose(byState.radialPeriod!, byConstants.radialPeriod!, 1e-12, 'radial period');
    expectRelClose(byState.apsidalAngle!, byConstants.apsidalAngle!, 1e-12, 'apsidal angle');
    expectClose(byState.precessionPerOrbit!, byConstants.precessionPerOrbit!, 1e-9, 'precession');
    expectRelClose(byState.circularOrbits[0]!.radius, byConstants.circularOrbits[0]!.radius, 1e-12, 'circular radius');
  });

  it('a track on request: Kepler r(t) and phi(t) over one radial period, energy drift near the integration tolerance', async () => {
    const a = await answer({ ...kepler, track: { periods: 1, samples: 5 } });
    const track = a.track!;
    expect(track.start).toBe('periapsis');
    expect(track.sampleCount).toBe(5);
    expect(track.reachedCentre).toBe(false);
    const s = track.samples;
    expectRelClose(s[4]!.t, KEPLER_T, 1e-12, 'track span = radial period');
    // From periapsis: r = a (1 - e cos E) with Kepler's equation M = E - e sin E, and the true anomaly
    // from tan(nu/2) = sqrt((1 + e)/(1 - e)) tan(E/2) (Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., sec. 2.2 and Alg. 2, from memory).
    let Ea = Math.PI / 2; // mean anomaly pi/2 at t = T/4
    for (let i = 0; i < 30; i++) Ea -= (Ea - ECC * Math.sin(Ea) - Math.PI / 2) / (1 - ECC * Math.cos(Ea));
    expectRelClose(s[1]!.r, A * (1 - ECC * Math.cos(Ea)), 1e-10, 'r(T/4)');
    expectClose(s[1]!.phi, (2 * Math.atan(Math.sqrt((1 + ECC) / (1 - ECC)) * Math.tan(Ea / 2)) * 180) / Math.PI, 1e-7, 'phi(T/4), deg');
    expectRelClose(s[2]!.r, A * (1 + ECC), 1e-10, 'apoapsis at T/2');
    expectClose(s[2]!.phi, 180, 1e-7, 'phi(T/2), deg');
    expectClose(s[2]!.rDot, 0, 1e-9, 'rDot at apoapsis');
    expectRelClose(s[4]!.r, A * (1 - ECC), 1e-10, 'periapsis at T');
    expectClose(s[4]!.phi, 360, 1e-7, 'phi(T): a closed orbit, deg');
    // Measured 4.3e-14 relative (1.2e-13 absolute) at the solver's default tolerance 1e-13; bound with margin.
    expect(track.energyDriftRelative).toBeLessThan(1e-11);
    expect(track.energyDrift).toBeLessThan(1e-11 * Math.abs(KEPLER_E));
  });

  it('a track from an initial state starts there, by duration', async () => {
    const initial = { radius: 3.5, radialVelocity: -0.2, tangentialVelocity: 0.7 };
    const a = await answer({ mass: M, potential: { terms: keplerTerms }, initial, track: { duration: 12.5, samples: 6 } });
    const s = a.track!.samples;
    expect(a.track!.start).toBe('initial');
    expect(s[0]).toEqual({ t: 0, r: 3.5, rDot: -0.2, phi: 0 });
    expect(s[5]!.t).toBe(12.5);
    expect(a.track!.energyDriftRelative).toBeLessThan(1e-11);
    // With r decreasing at the start the mass approaches periapsis first (common practice, no source).
    expect(s[1]!.r).toBeLessThan(3.5);
  });
});

describe('POST /v1/central-force: formats', () => {
  const svgBody = { ...kepler, units: { radius: 'AU', energy: 'J' } };

  it('format svg answers image/svg+xml: a standalone plot with the axis labels in the caller\'s units', async () => {
    const res = await postJson(app, URL, { ...svgBody, format: 'svg' });
    expect(res.statusCode, res.body).toBe(200);
    expect(res.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(res.body.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(res.body.trimEnd().endsWith('</svg>')).toBe(true);
    expect(res.body).toContain('>r (AU)</text>');
    expect(res.body).toContain('>energy (J)</text>');
    expect(res.body).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('Accept: image/svg+xml chooses the same plot (same scenario, same bytes and ETag)', async () => {
    const byField = await postJson(app, URL, { ...svgBody, format: 'svg' });
    const byAccept = await postJson(app, URL, svgBody, { accept: 'image/svg+xml' });
    expect(byAccept.statusCode).toBe(200);
    expect(byAccept.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(byAccept.rawPayload.equals(byField.rawPayload)).toBe(true);
    expect(byAccept.headers.etag).toBe(byField.headers.etag);
  });

  it('the default plot labels its axes "consistent units"; without format or Accept the answer is JSON', async () => {
    const svg = await postJson(app, URL, { ...kepler, format: 'svg' });
    expect(svg.body).toContain('>r (consistent units)</text>');
    expect(svg.body).toContain('>energy (consistent units)</text>');
    const json = await postJson(app, URL, kepler);
    expect(json.headers['content-type']).toMatch(/^application\/json/);
    const anyType = await postJson(app, URL, kepler, { accept: '*/*' });
    expect(anyType.headers['content-type']).toMatch(/^application\/json/);
  });

  it('an Accept header admitting neither JSON nor SVG is a 406 problem', async () => {
    const res = await postJson(app, URL, kepler, { accept: 'text/csv' });
    expect(res.statusCode).toBe(406);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.json().type).toBe('/problems/not-acceptable');
  });
});

describe('POST /v1/central-force: scenario hash and cache', () => {
  const scenario = { ...kepler, potential: { terms: [{ kind: 'yukawa', coefficient: 2, range: 3 }] }, energy: -0.2, angularMomentum: 1.1 };

  it('the same scenario twice gives the same bytes, the second from the cache; If-None-Match answers 304', async () => {
    const first = await postJson(app, URL, scenario);
    expect(first.statusCode, first.body).toBe(200);
    expect(first.headers['x-cache']).toBe('miss');
    const second = await postJson(app, URL, scenario);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    const etag = String(first.headers.etag);
    expect(etag).toBe(`"${CentralForceAnswer.parse(first.json()).scenarioHash}"`);
    const notModified = await postJson(app, URL, scenario, { 'if-none-match': etag });
    expect(notModified.statusCode).toBe(304);
    expect(notModified.body).toBe('');
    const stored = await app.inject({ url: `/v1/results/${etag.replaceAll('"', '')}` });
    expect(stored.rawPayload.equals(first.rawPayload)).toBe(true);
  });

  it('defaults spelled out hash alike: samples 400, units, track start, gaussian center 0', async () => {
    const terse = { mass: 1, potential: { terms: [{ kind: 'gaussian', depth: 1, width: 2 }, { kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 0.8, energy: -0.4, track: { periods: 1 } };
    const spelled = {
      energy: -0.4,
      angularMomentum: 0.8,
      potential: { terms: [{ kind: 'gaussian', width: 2, depth: 1.0, center: 0 }, { exponent: -1, coefficient: -1, kind: 'power' }] },
      mass: 1,
      samples: 400,
      units: { radius: 'consistent units', energy: 'consistent units' },
      format: 'json',
      track: { periods: 1, samples: 201, start: 'periapsis' },
    };
    const a = await postJson(app, URL, terse);
    expect(a.statusCode, a.body).toBe(200);
    const b = await postJson(app, URL, spelled);
    expect(b.headers.etag).toBe(a.headers.etag);
    expect(b.headers['x-cache']).toBe('hit');
    expect(b.rawPayload.equals(a.rawPayload)).toBe(true);
  });
});

describe('POST /v1/central-force: errors', () => {
  const base = { mass: 1, potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 1, energy: -0.3 };

  it('bodies that break the schema answer 400 problem+json naming the field or rule', async () => {
    const cases: Array<[unknown, string, RegExp]> = [
      [{ ...base, mass: 0 }, 'body.mass', /mass/],
      [{ ...base, mass: -2 }, 'body.mass', /mass/],
      [{ ...base, potential: { terms: [] } }, 'body.potential.terms', /terms/],
      [{ mass: 1, angularMomentum: 1, energy: -0.3 }, 'body.potential', /potential/],
      [{ ...base, potential: { terms: [{ kind: 'cubic', coefficient: 1 }] } }, 'body.potential.terms.0.kind', /kind/],
      [{ ...base, potential: { terms: [{ kind: 'yukawa', coefficient: 1, range: 0 }] } }, 'body.potential.terms.0.range', /range/],
      [{ ...base, potential: { terms: [{ kind: 'power', coefficient: 1, exponent: 21 }] } }, 'body.potential.terms.0.exponent', /exponent/],
      [{ ...base, potential: { terms: [{ kind: 'power', coefficient: 1, exponent: -1, range: 2 }] } }, 'body.potential.terms.0', /range/],
      [{ ...base, initial: { radius: 1, radialVelocity: 0, tangentialVelocity: 1 } }, 'body.initial', /exactly one of \(angularMomentum and energy\) or initial/],
      [{ mass: 1, potential: base.potential }, 'body.initial', /exactly one of \(angularMomentum and energy\) or initial/],
      [{ mass: 1, potential: base.potential, angularMomentum: 1 }, 'body.energy', /angularMomentum and energy go together/],
      [{ mass: 1, potential: base.potential, initial: { radius: 0, radialVelocity: 0, tangentialVelocity: 1 } }, 'body.initial.radius', /radius/],
      [{ ...base, rMin: 2, rMax: 1 }, 'body.rMax', /rMax must exceed rMin/],
      [{ ...base, samples: 1 }, 'body.samples', /samples/],
      [{ ...base, samples: 10_001 }, 'body.samples', /samples/],
      [{ ...base, track: { periods: 1, duration: 3 } }, 'body.track.periods', /exactly one of periods and duration/],
      [{ ...base, track: { samples: 10 } }, 'body.track.periods', /exactly one of periods and duration/],
      [{ ...base, track: { duration: 0 } }, 'body.track.duration', /duration/],
      [{ ...base, track: { periods: 1, start: 'initial' } }, 'body.track.start', /needs initial/],
      [{ ...base, format: 'png' }, 'body.format', /format/],
      [{ ...base, colour: 'red' }, 'body', /colour/],
    ];
    for (const [body, path, detail] of cases) {
      const res = await postJson(app, URL, body);
      const label = JSON.stringify(body);
      expect(res.statusCode, label).toBe(400);
      expect(res.headers['content-type'], label).toMatch(/application\/problem\+json/);
      const problem = res.json();
      expect(problem.type, label).toBe('/problems/validation-failed');
      expect(problem.errors.map((e: { path: string }) => e.path), label).toContain(path);
      expect(problem.detail, label).toMatch(detail);
    }
  });

  it('a non-finite number (1e999 parses to Infinity) is a 400 from the schema', async () => {
    const res = await app.inject({
      method: 'POST',
      url: URL,
      payload: '{"mass": 1e999, "potential": {"terms": [{"kind": "power", "coefficient": -1, "exponent": -1}]}, "angularMomentum": 1, "energy": -0.3}',
      headers: { 'content-type': 'application/json' },
    });
    expect(res.statusCode).toBe(400);
    expect(res.json().type).toBe('/problems/validation-failed');
    expect(res.json().errors.map((e: { path: string }) => e.path)).toContain('body.mass');
  });

  it('an energy below the minimum of U_eff is 422 energy-below-minimum', async () => {
    // Kepler U_eff = -k/r + l^2/(2 m r^2) has its minimum -m k^2 / (2 l^2) = -0.5 here (Goldstein 3rd ed. sec. 3.3, from memory).
    for (const format of ['json', 'svg']) {
      const res = await postJson(app, URL, { ...base, energy: -0.6, format });
      expect(res.statusCode).toBe(422);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.json().type).toBe('/problems/energy-below-minimum');
      expect(res.json().detail).toMatch(/below the minimum/);
    }
  });

  it('out-of-range combinations the schema cannot see are 422 with a code naming the reason', async () => {
    const cases: Array<[unknown, string]> = [
      // U = r^-20 overflows at the initial radius 1e-300.
      [{ mass: 1, potential: { terms: [{ kind: 'power', coefficient: 1, exponent: -20 }] }, initial: { radius: 1e-300, radialVelocity: 0, tangentialVelocity: 1 } }, '/problems/invalid-parameter'],
      // A sample range of 600 decades: U_eff overflows (the answer would hold infinities).
      [{ ...base, rMin: 1e-300, rMax: 1e300 }, '/problems/non-finite-result'],
      [{ ...base, rMin: 1e-300, rMax: 1e300, format: 'svg' }, '/problems/non-finite-result'],
      // Periods of motion that has none: E > 0 in a Kepler well escapes.
      [{ ...base, energy: 0.5, track: { periods: 2 } }, '/problems/no-radial-period'],
      // More track samples than the service limit (1000 in this test app).
      [{ ...base, track: { periods: 1, samples: 1001 } }, '/problems/too-many-samples'],
    ];
    for (const [body, type] of cases) {
      const res = await postJson(app, URL, body);
      const label = JSON.stringify(body);
      expect(res.statusCode, label).toBe(422);
      expect(res.headers['content-type'], label).toMatch(/application\/problem\+json/);
      expect(res.json().type, label).toBe(type);
    }
  });

  it('hostile but valid inputs never answer 500: either a parseable answer or a problem', async () => {
    const power = (coefficient: number, exponent: number) => ({ kind: 'power', coefficient, exponent });
    const bodies: unknown[] = [
      { mass: 5e-324, potential: { terms: [power(-5e-324, -1)] }, angularMomentum: 5e-324, energy: -5e-324 },
      { mass: 1e-300, potential: { terms: [power(-1, -1)] }, angularMomentum: 1e300, energy: 1 },
      { mass: 1e300, potential: { terms: [power(-1, -1)] }, angularMomentum: 1e300, energy: -1e-300 },
      { mass: 1, potential: { terms: [power(1e308, 20)] }, angularMomentum: 1, energy: 1e308 },
      { mass: 1, potential: { terms: [power(0, 0)] }, angularMomentum: 0, energy: 0 },
      { mass: 1, potential: { terms: [power(0, -1)] }, angularMomentum: 0, energy: 0, format: 'svg' },
      { mass: 1, potential: { terms: [power(5, 0)] }, angularMomentum: 1, energy: 6, track: { duration: 1 } },
      { mass: 1, potential: { terms: [{ kind: 'gaussian', depth: 1, center: 1, width: 1e-300 }] }, angularMomentum: 0, energy: -0.5 },
      { mass: 1, potential: { terms: [{ kind: 'yukawa', coefficient: 1, range: 1e-300 }] }, angularMomentum: 1, energy: 1, format: 'svg' },
      { mass: 1, potential: { terms: [{ kind: 'logarithmic', coefficient: -1e300, scale: 1e-300 }] }, angularMomentum: 1e-300, energy: 1e300 },
      { mass: 1, potential: { terms: [power(-1, -1)] }, initial: { radius: 1, radialVelocity: 1e200, tangentialVelocity: 1e200 } },
      { mass: 1, potential: { terms: [power(-1, -3)] }, angularMomentum: 1, energy: 1, track: { duration: 1 } },
      { mass: 1, potential: { terms: [power(-1, -1)] }, angularMomentum: 0, energy: -0.5, track: { duration: 100 } },
    ];
    for (const body of bodies) {
      const res = await postJson(app, URL, body);
      const label = JSON.stringify(body);
      expect(res.statusCode, `${label}: ${res.body.slice(0, 300)}`).toBeLessThan(500);
      if (res.statusCode === 200) {
        if (String(res.headers['content-type']).startsWith('image/svg+xml')) expect(res.body, label).not.toMatch(/NaN|Infinity|undefined/);
        else CentralForceAnswer.parse(res.json());
      } else {
        expect(res.statusCode, label).toBe(422);
        expect(res.headers['content-type'], label).toMatch(/application\/problem\+json/);
      }
    }
  });
});
