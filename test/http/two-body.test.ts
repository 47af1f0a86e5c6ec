import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import fc from 'fast-check';
import { TwoBodyAnswer } from '../../src/schemas/two-body.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose, expectRelClose, expectVecClose } from '../helpers/approx.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp({ config: { MAX_TRACK_SAMPLES: 2000 } }); });
afterAll(async () => { await app.close(); });

const EPOCH = '2026-12-01T00:00:00Z';
// Published GM values, km^3/s^2: Earth 398600.4418, Moon 4902.800 (from memory); mean Earth-Moon
// distance 384 400 km (common practice, no source).
const GM_EARTH = 398_600.4418;
const GM_MOON = 4902.8;
const EARTH_MOON_KM = 384_400;
// CODATA 2018 G = 6.67430e-11 m^3 kg^-1 s^-2 = 6.67430e-20 km^3 kg^-1 s^-2 (from memory).
const G_KM = 6.6743e-20;

type V = [number, number, number];
const vsub = (a: readonly number[], b: readonly number[]): V => [a[0]! - b[0]!, a[1]! - b[1]!, a[2]! - b[2]!];
const vscale = (a: readonly number[], k: number): V => [a[0]! * k, a[1]! * k, a[2]! * k];
const vadd = (a: readonly number[], b: readonly number[]): V => [a[0]! + b[0]!, a[1]! + b[1]!, a[2]! + b[2]!];
const vdot = (a: readonly number[], b: readonly number[]): number => a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]!;
const vcross = (a: readonly number[], b: readonly number[]): V => [a[1]! * b[2]! - a[2]! * b[1]!, a[2]! * b[0]! - a[0]! * b[2]!, a[0]! * b[1]! - a[1]! * b[0]!];
const vnorm = (a: readonly number[]): number => Math.sqrt(vdot(a, a));

/** Earth at the origin at rest; the Moon on +x with the circular relative speed, its velocity tilted 5 degrees. */
function earthMoon(moonBy: 'gm' | 'mass' = 'gm') {
  const speed = Math.sqrt((GM_EARTH + GM_MOON) / EARTH_MOON_KM); // circular speed sqrt(mu/r), Curtis 3rd ed. sec. 2.6 (from memory)
  const tilt = (5 * Math.PI) / 180;
  return {
    epoch: EPOCH,
    bodies: [
      { name: 'earth', gm: GM_EARTH, position: [0, 0, 0], velocity: [0, 0, 0] },
      {
        name: 'moon',
        ...(moonBy === 'gm' ? { gm: GM_MOON } : { mass: GM_MOON / G_KM }),
        position: [EARTH_MOON_KM, 0, 0],
        velocity: [0, speed * Math.cos(tilt), speed * Math.sin(tilt)],
      },
    ],
  };
}

/** An invented pair, both bodies moving and away from the origin, on an eccentric inclined orbit. */
const invented = {
  epoch: EPOCH,
  bodies: [
    { name: 'primary', mass: 3.1e24, position: [12_000, -5_000, 800], velocity: [1.2, -0.4, 0.3] },
    { name: 'companion', mass: 4.4e23, position: [160_000, 90_000, -20_000], velocity: [0.9, 0.1, 0.6] },
  ],
};

async function solve(body: unknown): Promise<TwoBodyAnswer> {
  const res = await postJson(app, '/v1/two-body', body);
  expect(res.statusCode, res.body).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  return TwoBodyAnswer.parse(res.json());
}

describe('POST /v1/two-body', () => {
  it('puts the Earth-Moon barycentre about 4670 km from the Earth\'s centre, and the answer matches its schema', async () => {
    const a = await solve(earthMoon());
    // Barycentre about 4670 km from the Earth's centre (common practice, no source).
    const fromEarth = vnorm(a.barycenter.position);
    expectClose(fromEarth, 4670, 5, 'barycentre distance (km)');
    // r_cm = (m1 r1 + m2 r2) / M (Goldstein, Classical Mechanics, 3rd ed., sec. 3.1; from memory): here 384400 m2/M.
    expectRelClose(fromEarth, (EARTH_MOON_KM * GM_MOON) / (GM_EARTH + GM_MOON), 1e-14, 'r m2/M');
    expectRelClose(a.totalGm, GM_EARTH + GM_MOON, 1e-15, 'mu = G(m1 + m2)');
    // Earth's mass about 5.972e24 kg, the Moon's about 7.342e22 kg (common practice, no source).
    expectRelClose(a.bodies[0].mass, 5.972e24, 1e-3, 'Earth mass');
    expectRelClose(a.bodies[1].mass, 7.342e22, 1e-3, 'Moon mass');
    expectRelClose(a.totalMass, (GM_EARTH + GM_MOON) / G_KM, 1e-14, 'M = mu / G');
    expectRelClose(a.reducedMass, (GM_EARTH * GM_MOON) / (GM_EARTH + GM_MOON) / G_KM, 1e-14, 'reduced mass m1 m2 / M');
    expect(a.gravitationalConstant.value).toBe(G_KM);
    expect(a.gravitationalConstant.unit).toBe('km^3 kg^-1 s^-2');
    expect(a.gravitationalConstant.source).toMatch(/CODATA 2018/);
    // The relative orbit is the /v1/orbit answer for r = r2 - r1 with mu = G(m1 + m2), under the same hash.
    expect(a.relativeOrbit.scenarioHash).toBe(a.scenarioHash);
    expect(a.relativeOrbit.centralBody).toMatchObject({ name: 'earth+moon', gm: a.totalGm, radius: null });
    expectVecClose(a.relativeState.position, [EARTH_MOON_KM, 0, 0], 1e-9, 'r');
    expectVecClose(a.relativeOrbit.state.position, a.relativeState.position, 0, 'orbit state r');
    // Circular relative speed: e = 0, a = r, inclination 5 deg (the tilt of the velocity).
    expect(a.relativeOrbit.orbitType).toBe('circular');
    expectRelClose(a.relativeOrbit.elements.semiMajorAxis!, EARTH_MOON_KM, 1e-12, 'a');
    expectClose(a.relativeOrbit.elements.inclination, 5, 1e-12, 'i');
    expect(a.tracks).toBeNull();
  });

  it('gives momenta about the barycentre that sum to zero, and energy and angular momentum equal to the reduced mass times the relative values (Goldstein 3rd ed. sec. 3.1)', async () => {
    const a = await solve(invented);
    const [p, c] = invented.bodies;
    const [m1, m2] = [p!.mass, c!.mass];
    const M = m1 + m2;
    // Barycentre by hand: r_cm = (m1 r1 + m2 r2) / M, v_cm likewise.
    expectVecClose(a.barycenter.position, vscale(vadd(vscale(p!.position, m1), vscale(c!.position, m2)), 1 / M), 1e-9, 'r_cm');
    expectVecClose(a.barycenter.velocity, vscale(vadd(vscale(p!.velocity, m1), vscale(c!.velocity, m2)), 1 / M), 1e-15, 'v_cm');
    const [b1, b2] = a.bodies;
    // Total momentum about the barycentre: m1 v1' + m2 v2' = 0; mass moment m1 r1' + m2 r2' = 0.
    expectVecClose(vadd(vscale(b1.velocity, m1), vscale(b2.velocity, m2)), [0, 0, 0], 1e-15 * M, 'momentum');
    expectVecClose(vadd(vscale(b1.position, m1), vscale(b2.position, m2)), [0, 0, 0], 1e-10 * M, 'mass moment');
    expectVecClose(vsub(b2.position, b1.position), vsub(c!.position, p!.position), 1e-9, 'r2 - r1');

    // Integrals computed here from the inputs, independently of the service.
    const r = vsub(c!.position, p!.position);
    const v = vsub(c!.velocity, p!.velocity);
    const mu = G_KM * M;
    const reduced = (m1 * m2) / M;
    const eps = vdot(v, v) / 2 - mu / vnorm(r); // vis-viva specific energy, Curtis 3rd ed. sec. 2.6 (from memory)
    const energy = reduced * eps; // E = m_red eps in the barycentre frame (Goldstein 3rd ed. sec. 3.1)
    const momentum = vscale(vcross(r, v), reduced); // L = m_red r x v (Goldstein 3rd ed. sec. 3.1)
    const { energy: E, angularMomentum: L } = a.conserved;
    expect(E.unit).toBe('kg km^2/s^2');
    expect(L.unit).toBe('kg km^2/s');
    expectRelClose(E.fromRelativeMotion, energy, 1e-13, 'E from the relative motion');
    expectRelClose(E.fromBodies, energy, 1e-12, 'E from the bodies');
    expectVecClose(L.fromRelativeMotion, momentum, 1e-13 * vnorm(momentum), 'L from the relative motion');
    expectVecClose(L.fromBodies, momentum, 1e-12 * vnorm(momentum), 'L from the bodies');
    expect(E.relativeDifference).toBeLessThan(1e-12);
    expect(L.relativeDifference).toBeLessThan(1e-12);
    // Sum over the bodies by hand: 1/2 m1 |v1'|^2 + 1/2 m2 |v2'|^2 - G m1 m2 / |r|.
    const direct = 0.5 * m1 * vdot(b1.velocity, b1.velocity) + 0.5 * m2 * vdot(b2.velocity, b2.velocity) - (G_KM * m1 * m2) / vnorm(r);
    expectRelClose(direct, energy, 1e-12, 'E summed here from the answer\'s body states');
    // The relative orbit's specific energy is eps itself.
    expectRelClose(a.relativeOrbit.specificEnergy, eps, 1e-13, 'specific energy');
  });

  it('splits the semi-major axis as a1 + a2 = a with a1/a2 = m2/m1, and one period 2 pi sqrt(a^3 / (G M))', async () => {
    const a = await solve(invented);
    const [m1, m2] = [invented.bodies[0]!.mass, invented.bodies[1]!.mass];
    expect(a.relativeOrbit.orbitType).toBe('elliptic');
    const axis = a.relativeOrbit.elements.semiMajorAxis!;
    const [a1, a2] = [a.bodies[0].semiMajorAxis!, a.bodies[1].semiMajorAxis!];
    expectRelClose(a1 + a2, axis, 1e-15, 'a1 + a2 = a');
    expectRelClose(a1 / a2, m2 / m1, 1e-14, 'a1/a2 = m2/m1');
    // Kepler's third law T = 2 pi sqrt(a^3 / mu), Curtis 3rd ed. eq. 2.83 (from memory), mu = G (m1 + m2).
    const period = 2 * Math.PI * Math.sqrt(axis ** 3 / (G_KM * (m1 + m2)));
    expectRelClose(a.relativeOrbit.period!, period, 1e-13, 'T');
    expectRelClose(a.bodies[0].period!, period, 1e-13, 'T1');
    expectRelClose(a.bodies[1].period!, period, 1e-13, 'T2');
    // Vis-viva: a = -mu / (2 eps) from the inputs (Curtis 3rd ed. sec. 2.7, from memory).
    const r = vsub(invented.bodies[1]!.position, invented.bodies[0]!.position);
    const v = vsub(invented.bodies[1]!.velocity, invented.bodies[0]!.velocity);
    const mu = G_KM * (m1 + m2);
    expectRelClose(axis, -mu / (2 * (vdot(v, v) / 2 - mu / vnorm(r))), 1e-12, 'a by vis-viva');
  });

  it('reports no semi-major axis or period for an unbound pair', async () => {
    const a = await solve({
      epoch: EPOCH,
      bodies: [{ gm: GM_EARTH, position: [0, 0, 0], velocity: [0, 0, 0] }, { gm: 1e-6, position: [7000, 0, 0], velocity: [0, 12, 1] }],
    });
    // 12 km/s at 7000 km exceeds the escape speed sqrt(2 mu / r) = 10.7 km/s (common practice, no source).
    expect(a.relativeOrbit.orbitType).toBe('hyperbolic');
    expect(a.relativeOrbit.period).toBeNull();
    for (const b of a.bodies) {
      expect(b.semiMajorAxis).toBeNull();
      expect(b.period).toBeNull();
    }
    expect(a.bodies[0].name).toBeNull();
    expect(a.relativeOrbit.centralBody.name).toBe('body1+body2');
  });

  it('gives the same relative orbit whether a mass comes as kg or as GM (within the conversion by G)', async () => {
    const byGm = await solve(earthMoon('gm'));
    const byMass = await solve(earthMoon('mass'));
    expect(byMass.scenarioHash).not.toBe(byGm.scenarioHash); // a different request, so a different scenario
    expectRelClose(byMass.totalGm, byGm.totalGm, 1e-15, 'mu');
    expectRelClose(byMass.bodies[1].gm, GM_MOON, 1e-15, 'G m = GM');
    expectRelClose(byMass.bodies[1].mass, GM_MOON / G_KM, 0, 'mass echoed as given');
    const [e1, e2] = [byGm.relativeOrbit.elements, byMass.relativeOrbit.elements];
    expectRelClose(e2.semiMajorAxis!, e1.semiMajorAxis!, 1e-14, 'a');
    expectClose(e2.eccentricity, e1.eccentricity, 1e-14, 'e');
    expectClose(e2.inclination, e1.inclination, 1e-12, 'i');
    expectRelClose(byMass.relativeOrbit.period!, byGm.relativeOrbit.period!, 1e-14, 'T');
    expectVecClose(byMass.barycenter.position, byGm.barycenter.position, 1e-9, 'r_cm');
  });

  it('answers both bodies\' tracks about the barycentre, with m1 r1 + m2 r2 = 0 at every sample and r2 - r1 equal to the /v1/track of the relative orbit', async () => {
    const scenario = earthMoon();
    const grid = { start: EPOCH, stop: '2026-12-29T00:00:00Z', step: 3 * 3600 };
    const a = await solve({ ...scenario, track: { grid } });
    const tracks = a.tracks!;
    expect(tracks.origin).toBe('barycenter');
    expect(tracks.sampleCount).toBe(28 * 8 + 1);
    const [t1, t2] = tracks.bodies;
    expect(t1.name).toBe('earth');
    expect(t2.samples).toHaveLength(tracks.sampleCount);
    const [m1, m2] = [a.bodies[0].mass, a.bodies[1].mass];
    const M = m1 + m2;
    // Printed with 6 decimals (km) and 9 (km/s): the sums vanish to that rounding (Goldstein 3rd ed. sec. 3.1).
    t1.samples.forEach((s1, i) => {
      const s2 = t2.samples[i]!;
      expect(s2.epoch).toBe(s1.epoch);
      expectVecClose(vadd(vscale(s1.position, m1), vscale(s2.position, m2)), [0, 0, 0], 1e-6 * M, `m1 r1 + m2 r2 at ${i}`);
      expectVecClose(vadd(vscale(s1.velocity, m1), vscale(s2.velocity, m2)), [0, 0, 0], 1e-9 * M, `m1 v1 + m2 v2 at ${i}`);
      // Circular relative orbit: the Earth stays a1 from the barycentre.
      expectClose(vnorm(s1.position), a.bodies[0].semiMajorAxis!, 2e-6, `|r1| at ${i}`);
    });
    expectVecClose(t1.samples[0]!.position, a.bodies[0].position, 1e-6, 'first sample is the epoch state');
    // The relative motion propagated by /v1/track about a point of GM = G(m1 + m2).
    const relative = await postJson(app, '/v1/track', {
      centralBody: { name: 'pair', gm: a.totalGm },
      state: { epoch: EPOCH, position: a.relativeState.position, velocity: a.relativeState.velocity },
      grid,
    });
    expect(relative.statusCode, relative.body).toBe(200);
    const samples = relative.json().samples as Array<{ position: V; velocity: V }>;
    samples.forEach((s, i) => {
      expectVecClose(vsub(t2.samples[i]!.position, t1.samples[i]!.position), s.position, 2e-6, `r2 - r1 at ${i}`);
      expectVecClose(vsub(t2.samples[i]!.velocity, t1.samples[i]!.velocity), s.velocity, 2e-9, `v2 - v1 at ${i}`);
    });
    // Half a sidereal month (about 13.66 days; common practice, no source) on, the Earth is on the other side.
    const half = t1.samples[Math.round((a.relativeOrbit.period! / 2) / (3 * 3600))]!;
    expect(vdot(half.position, a.bodies[0].position)).toBeLessThan(0);
    expect(tracks.diagnostics.energyRelativeDrift).toBeLessThan(1e-12);
  });

  it('refuses a track grid over MAX_TRACK_SAMPLES with 422 naming the maximum', async () => {
    const res = await postJson(app, '/v1/two-body', { ...earthMoon(), track: { grid: { start: EPOCH, stop: '2026-12-02T00:00:00Z', step: 1 } } });
    expect(res.statusCode).toBe(422);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.json().type).toBe('/problems/too-many-samples');
    expect(res.json().detail).toMatch(/maximum is 2000/);
  });

  it('serves the same scenario byte for byte from the cache, whatever the key order, and answers 304 to If-None-Match', async () => {
    const body = { ...invented, track: { grid: { times: [EPOCH, '2026-12-02T00:00:00Z'] } } };
    const first = await postJson(app, '/v1/two-body', body);
    expect(first.statusCode).toBe(200);
    const reordered = {
      track: { grid: { times: [EPOCH, '2026-12-02T00:00:00Z'] } },
      frame: 'gcrf',
      bodies: invented.bodies.map((b) => ({ velocity: b.velocity, position: b.position, mass: b.mass, name: b.name })),
      epoch: EPOCH,
    };
    const second = await postJson(app, '/v1/two-body', reordered);
    expect(second.statusCode).toBe(200);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    const etag = String(first.headers.etag);
    expect(etag).toBe(`"${first.json().scenarioHash}"`);
    const notModified = await postJson(app, '/v1/two-body', body, { 'if-none-match': etag });
    expect(notModified.statusCode).toBe(304);
    expect(notModified.body).toBe('');
    const stored = await app.inject({ url: `/v1/results/${etag.replaceAll('"', '')}` });
    expect(stored.statusCode).toBe(200);
    expect(stored.rawPayload.equals(first.rawPayload)).toBe(true);
    // Without the track it is another scenario.
    const plain = await postJson(app, '/v1/two-body', invented);
    expect(plain.headers.etag).not.toBe(etag);
  });

  it('refuses bad bodies with 400 naming the rule, and impossible pairs with 422 naming the reason', async () => {
    const [earth, moon] = earthMoon().bodies as unknown as [Record<string, unknown>, Record<string, unknown>];
    const { gm: _gm, ...moonNoGm } = moon;
    const pair = (b1: unknown, b2: unknown) => ({ epoch: EPOCH, bodies: [b1, b2] });
    const cases: Array<[string, unknown, string, RegExp?]> = [
      ['both mass and gm', pair(earth, { ...moon, mass: 7e22 }), '/problems/validation-failed', /exactly one of mass \(kg\) and gm/],
      ['neither mass nor gm', pair(earth, moonNoGm), '/problems/validation-failed', /exactly one of mass \(kg\) and gm/],
      ['zero mass', pair(earth, { ...moonNoGm, mass: 0 }), '/problems/validation-failed', /bodies\.1\.mass/],
      ['negative GM', pair({ ...earth, gm: -398600 }, moon), '/problems/validation-failed', /bodies\.0\.gm/],
      ['one body', { epoch: EPOCH, bodies: [earth] }, '/problems/validation-failed'],
      ['three bodies', { epoch: EPOCH, bodies: [earth, moon, moon] }, '/problems/validation-failed'],
      ['unknown key', { ...pair(earth, moon), centralBody: 'earth' }, '/problems/validation-failed'],
      ['faster than light', pair(earth, { ...moon, velocity: [0, 3e5, 0] }), '/problems/validation-failed', /bodies\.1\.velocity\.1/],
      ['not inertial gcrf', { ...pair(earth, moon), frame: 'itrf' }, '/problems/validation-failed'],
      ['coincident bodies', pair(earth, { ...moon, position: [0, 0, 0] }), '/problems/zero-position'],
      ['rectilinear relative motion', pair(earth, { ...moon, velocity: [-1, 0, 0] }), '/problems/rectilinear-motion'],
      ['no relative motion', pair({ ...earth, velocity: [0, 1, 0] }, { ...moon, velocity: [0, 1, 0] }), '/problems/rectilinear-motion'],
      // Hostile: the periapsis speed of 1e-30 kg bodies 1e18 km apart moving at 1e-300 km/s overflows a double.
      ['overflowing scenario', pair({ mass: 1e-30, position: [0, 0, 0], velocity: [0, 0, 0] }, { mass: 1e-30, position: [1e18, 0, 0], velocity: [0, 1e-300, 0] }), '/problems/non-finite-result'],
    ];
    for (const [name, body, type, detail] of cases) {
      const res = await postJson(app, '/v1/two-body', body);
      expect(res.headers['content-type'], name).toMatch(/application\/problem\+json/);
      const problem = res.json();
      expect(problem.type, `${name}: ${problem.detail}`).toBe(type);
      expect(res.statusCode, name).toBe(type === '/problems/validation-failed' ? 400 : 422);
      if (detail) expect(problem.detail, name).toMatch(detail);
    }
  });

  it('never answers 500 to random pairs and track epochs, and every 200 matches the schema with m1 r1 + m2 r2 = 0 (fast-check)', async () => {
    const big = (m: number) => fc.double({ min: -m, max: m, noNaN: true });
    const vec = (m: number) => fc.tuple(big(m), big(m), big(m));
    const member = fc.record({
      gm: fc.double({ min: 1e-49, max: 1e30, noNaN: true }),
      position: vec(1e18),
      velocity: vec(299_792),
    });
    const epoch = fc.integer({ min: Date.parse('1972-01-01T00:00:00Z'), max: Date.parse('2199-12-31T00:00:00Z') }).map((ms) => new Date(ms).toISOString());
    await fc.assert(
      fc.asyncProperty(member, member, fc.option(fc.array(epoch, { minLength: 1, maxLength: 3 })), async (b1, b2, times) => {
        const res = await postJson(app, '/v1/two-body', { epoch: EPOCH, bodies: [b1, b2], ...(times ? { track: { grid: { times } } } : {}) });
        expect([200, 422], res.body).toContain(res.statusCode);
        if (res.statusCode !== 200) return;
        const a = TwoBodyAnswer.parse(res.json());
        const moment = vadd(vscale(a.bodies[0].position, b1.gm), vscale(a.bodies[1].position, b2.gm));
        const scale = b1.gm * vnorm(a.bodies[0].position) + b2.gm * vnorm(a.bodies[1].position);
        expectVecClose(moment, [0, 0, 0], 1e-12 * scale, 'G m1 r1 + G m2 r2');
        if (!times) return;
        const [t1, t2] = a.tracks!.bodies;
        t1.samples.forEach((s1, i) => {
          const s2 = t2.samples[i]!;
          const sampleScale = b1.gm * vnorm(s1.position) + b2.gm * vnorm(s2.position);
          // Printed to 1e-6 km: the rounding adds up to (G m1 + G m2) 5e-7 per component.
          const sum = vadd(vscale(s1.position, b1.gm), vscale(s2.position, b2.gm));
          expectVecClose(sum, [0, 0, 0], 1e-12 * sampleScale + (b1.gm + b2.gm) * 1e-6, `track moment at ${i}`);
        });
      }),
      { numRuns: 60 },
    );
  });
});

