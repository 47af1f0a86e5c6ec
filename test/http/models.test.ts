import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { PassesAnswer } from '../../src/schemas/passes.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const demo = DEMO_ORBIT;
type Sample = { epoch: string; position: number[]; velocity: number[] };
const last = async (body: object): Promise<Sample> => {
  const res = await postJson(app, '/v1/track', body);
  expect(res.statusCode, res.body.slice(0, 300)).toBe(200);
  const samples = res.json().samples as Sample[];
  return samples[samples.length - 1]!;
};
/** Right ascension of the ascending node from a state: the direction of k x h (Curtis 3rd ed. Alg. 4.2). */
const nodeDeg = (s: Sample): number => {
  const [x, y, z] = s.position as [number, number, number];
  const [vx, vy, vz] = s.velocity as [number, number, number];
  const h = [y * vz - z * vy, z * vx - x * vz, x * vy - y * vx];
  return ((Math.atan2(h[0]!, -h[1]!) * 180) / Math.PI + 360) % 360;
};

describe('propagation models on /v1/track', () => {
  const oneDay = { grid: { times: [EPOCH, '2026-12-02T00:00:00Z'] } };

  it('numerical with no forces is Keplerian motion: within 1 m of the two-body answer after a day (two independent methods)', async () => {
    const kepler = await last({ ...demo, ...oneDay });
    const integrated = await last({ ...demo, ...oneDay, model: 'numerical', forces: [] });
    for (let c = 0; c < 3; c++) expectClose(integrated.position[c]!, kepler.position[c]!, 1e-3, `axis ${c}`);
  });

  it('j2-secular and numerical J2 agree on the node after two days within 0.05 deg (secular theory against integration)', async () => {
    const grid = { times: [EPOCH, '2026-12-03T00:00:00Z'] };
    const secular = await last({ ...demo, grid, model: 'j2-secular' });
    const integrated = await last({ ...demo, grid, model: 'numerical', forces: [{ kind: 'j2' }] });
    const kepler = await last({ ...demo, grid });
    // The node of a 97.6 deg LEO moves ~ +0.99 deg/day under J2 (sun-synchronous; common practice, no source).
    expectClose(nodeDeg(secular) - nodeDeg(kepler), 2 * 0.9856, 0.03, 'secular drift');
    // Short-period node terms (~J2 (R/a)^2 rad, 0.05 deg) and the spin axis (the integrator uses the true
    // pole, 0.15 deg from the GCRF z axis; the secular model the z axis) separate them slightly.
    expectClose(nodeDeg(integrated), nodeDeg(secular), 0.05, 'integrated node');
  });

  it('drag brings a 150 km orbit down: a 422 impact naming the time, unless the orbit stays up', async () => {
    const low = { centralBody: 'earth', elements: { epoch: EPOCH, semiMajorAxis: 6528.137, eccentricity: 0, inclination: 51.6, raan: 0, argPeriapsis: 0, trueAnomaly: 0 } };
    const res = await postJson(app, '/v1/track', { ...low, grid: { start: EPOCH, stop: '2026-12-05T00:00:00Z', step: 600 }, model: 'numerical', forces: [{ kind: 'drag', ballisticCoefficient: 50 }] });
    expect(res.statusCode).toBe(422);
    expect(res.json().type).toBe('/problems/impact');
    expect(res.json().detail).toMatch(/2026-12-0/);
  });

  it('refuses forces it does not know or that the body cannot have', async () => {
    const unknown = await postJson(app, '/v1/track', { ...demo, ...oneDay, model: 'numerical', forces: [{ kind: 'tides' }] });
    expect(unknown.statusCode).toBe(400);
    const marsDrag = await postJson(app, '/v1/track', { ...demo, centralBody: 'mars', elements: { ...demo.elements, semiMajorAxis: 4000 }, ...oneDay, model: 'numerical', forces: [{ kind: 'drag', ballisticCoefficient: 50 }] });
    expect(marsDrag.statusCode).toBe(422);
    expect(marsDrag.json().type).toBe('/problems/invalid-parameter');
    const unbound = await postJson(app, '/v1/track', { ...demo, elements: { ...demo.elements, semiMajorAxis: -9000, eccentricity: 1.8, trueAnomaly: 0 }, ...oneDay, model: 'j2-secular' });
    expect(unbound.statusCode).toBe(422);
  });
});

describe('propagation models on /v1/passes', () => {
  it('numerical J2 passes match j2-secular passes to within a few seconds over a day', async () => {
    const request = {
      ...demo,
      window: { start: EPOCH, stop: '2026-12-02T00:00:00Z' },
      stations: [{ id: 'oskel-fjord', latitude: 78.1, longitude: 15.3, altitude: 0.45, minElevation: 5 }],
    };
    const secular = PassesAnswer.parse((await postJson(app, '/v1/passes', { ...request, model: 'j2-secular' })).json());
    const integrated = PassesAnswer.parse((await postJson(app, '/v1/passes', { ...request, model: 'numerical', forces: [{ kind: 'j2' }] })).json());
    expect(integrated.passes.length).toBe(secular.passes.length);
    integrated.passes.forEach((p, i) => {
      // Short-period J2 terms the secular model leaves out move the spacecraft by a few km: a few seconds of AOS.
      expectClose(Date.parse(p.aos) / 1000, Date.parse(secular.passes[i]!.aos) / 1000, 15, `AOS ${i}`);
      expectClose(p.maxElevation, secular.passes[i]!.maxElevation, 1.5, `max elevation ${i}`);
    });
  });
});

describe('model j2-analytic on every endpoint that takes a model', () => {
  // The Molniya-like orbit of issue 11, started at periapsis.
  const molniya = { centralBody: 'earth', elements: { epoch: '2027-04-10T00:00:00Z', semiMajorAxis: 26_554, eccentricity: 0.74, inclination: 63.4, raan: 250, argPeriapsis: 270, trueAnomaly: 0 } };
  const firstAndDay = { grid: { times: ['2027-04-10T00:00:00Z', '2027-04-11T00:00:00Z'] } };

  it('/v1/track: the first sample is the given state (to the printed mm) and after a day it is within 2 km of numerical J2', async () => {
    const res = await postJson(app, '/v1/track', { ...molniya, ...firstAndDay, model: 'j2-analytic' });
    expect(res.statusCode, res.body.slice(0, 300)).toBe(200);
    const samples = res.json().samples as Sample[];
    const kepler = (await postJson(app, '/v1/track', { ...molniya, grid: { times: ['2027-04-10T00:00:00Z'] } })).json().samples[0] as Sample;
    for (let c = 0; c < 3; c++) expectClose(samples[0]!.position[c]!, kepler.position[c]!, 2e-3, `first sample axis ${c}`);
    const integrated = await last({ ...molniya, ...firstAndDay, model: 'numerical', forces: [{ kind: 'j2' }] });
    const gap = Math.hypot(...samples[1]!.position.map((x, c) => x - integrated.position[c]!));
    expect(gap, 'j2-analytic vs numerical J2 after a day, km').toBeLessThan(2);
  });

  it('/v1/passes, /v1/eclipses and /v1/batch accept it, and its passes agree with numerical J2 to a second', async () => {
    const request = { ...demo, window: { start: EPOCH, stop: '2026-12-02T00:00:00Z' }, stations: [{ id: 'oskel-fjord', latitude: 78.1, longitude: 15.3, altitude: 0.45, minElevation: 5 }] };
    const analytic = PassesAnswer.parse((await postJson(app, '/v1/passes', { ...request, model: 'j2-analytic' })).json());
    const integrated = PassesAnswer.parse((await postJson(app, '/v1/passes', { ...request, model: 'numerical', forces: [{ kind: 'j2' }] })).json());
    expect(analytic.passes.length).toBe(integrated.passes.length);
    expect(analytic.passes.length).toBeGreaterThan(3);
    analytic.passes.forEach((p, i) => expectClose(Date.parse(p.aos) / 1000, Date.parse(integrated.passes[i]!.aos) / 1000, 1, `AOS ${i}`));
    const eclipses = await postJson(app, '/v1/eclipses', { ...demo, window: { start: EPOCH, stop: '2026-12-01T06:00:00Z' }, model: 'j2-analytic' });
    expect(eclipses.statusCode, eclipses.body.slice(0, 300)).toBe(200);
    const batch = await postJson(app, '/v1/batch', { items: [{ kind: 'track', request: { ...demo, grid: { start: EPOCH, stop: '2026-12-01T01:00:00Z', step: 60 }, model: 'j2-analytic' } }] });
    expect(batch.statusCode).toBe(200);
    expect(JSON.parse(batch.body.trim().split('\n')[0]!).status).toBe(200);
  });

  it('refuses an orbit the theory does not cover with a 422 that says why', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, elements: { ...demo.elements, semiMajorAxis: 300_000, eccentricity: 0.97 }, grid: { times: [EPOCH] }, model: 'j2-analytic' });
    expect(res.statusCode).toBe(422);
    expect(res.json().type).toBe('/problems/invalid-parameter');
    expect(res.json().detail).toMatch(/j2-analytic.*eccentricit/);
  });
});
