// State input frames (gcrf, icrf, eme2000, itrf) and input time systems (UTC, TAI, TT, GPS) over HTTP.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const EPOCH = '2026-12-01T06:30:00Z';
const ARCSEC = Math.PI / 648_000;

describe('state.frame', () => {
  it('Vallado 4th ed. Example 3-3 (from memory): r = (6524.834, 6862.875, 6448.296) km given as an itrf state comes back at 34.352496 deg, 46.446417 deg, 5085.22 km in the geodetic frame at its epoch', async () => {
    const res = await postJson(app, '/v1/track', {
      centralBody: 'earth',
      state: { epoch: EPOCH, frame: 'itrf', position: [6524.834, 6862.875, 6448.296], velocity: [-1.2, 2.5, 3.1] },
      grid: { times: [EPOCH] },
      frame: 'geodetic',
    });
    expect(res.statusCode, res.body).toBe(200);
    const s = res.json().samples[0];
    expect(s.epoch).toBe('2026-12-01T06:30:00.000000Z');
    expectClose(s.latitude, 34.352496, 1e-6, 'latitude deg');
    expectClose(s.longitude, 46.446417, 1e-6, 'longitude deg');
    expectClose(s.height, 5085.22, 0.005, 'height km');
  });

  it('itrf -> gcrf -> itrf: an itrf state asked back in the itrf frame at its epoch is the state given, to 1 mm and 1 um/s (ut1MinusUtc given)', async () => {
    const r = [-4400.594, 1932.87, 4760.712];
    const v = [-1.5, -6.9, 1.3]; // relative to the rotating Earth (an invented GNSS fix)
    const res = await postJson(app, '/v1/track', {
      centralBody: 'earth', ut1MinusUtc: 0.1,
      state: { epoch: EPOCH, frame: 'itrf', position: r, velocity: v },
      grid: { times: [EPOCH] }, frame: 'itrf',
    });
    expect(res.statusCode, res.body).toBe(200);
    const s = res.json().samples[0];
    for (let c = 0; c < 3; c++) {
      expectClose(s.position[c], r[c]!, 1e-6, `r[${c}] km`);
      expectClose(s.velocity[c], v[c]!, 1e-9, `v[${c}] km/s`);
    }
    // The inertial state is a rotation of it plus the Earth's rotation (same radius); a GCRF answer differs from the input.
    const inertial = (await postJson(app, '/v1/orbit', { centralBody: 'earth', ut1MinusUtc: 0.1, state: { epoch: EPOCH, frame: 'itrf', position: r, velocity: v } })).json();
    expectClose(Math.hypot(...(inertial.state.position as number[])), Math.hypot(...r), 1e-9, 'radius km');
    expect(Math.abs(inertial.state.position[0] - r[0]!)).toBeGreaterThan(100);
  });

  it('eme2000 is GCRF less the frame bias: the difference is the small rotation by xi0 = -0.0166170", eta0 = -0.0068192", da0 = -0.01460" (IERS Conventions 2003 sec. 5.4.4, shared reference README), and icrf is gcrf', async () => {
    const r = [7000, -1200, 300];
    const v = [0.5, 7.2, 1.1];
    const ask = (frame: string) => postJson(app, '/v1/orbit', { centralBody: 'earth', state: { epoch: EPOCH, frame, position: r, velocity: v } });
    const g = (await ask('eme2000')).json().state.position as number[];
    // r_GCRF = B^T r_EME2000 with B = I + [[0, da0, -xi0], [-da0, 0, -eta0], [xi0, eta0, 0]] to first order (IERS Conventions 2003 eq. 5.14, from memory).
    const [xi0, eta0, da0] = [-0.016617 * ARCSEC, -0.0068192 * ARCSEC, -0.0146 * ARCSEC];
    const want = [
      r[0]! - da0 * r[1]! + xi0 * r[2]!,
      da0 * r[0]! + r[1]! + eta0 * r[2]!,
      -xi0 * r[0]! - eta0 * r[1]! + r[2]!,
    ];
    for (let c = 0; c < 3; c++) expectClose(g[c]!, want[c]!, 1e-9, `r[${c}]`);
    expect(Math.hypot(g[0]! - r[0]!, g[1]! - r[1]!, g[2]! - r[2]!) * 1000).toBeGreaterThan(0.5); // the bias moves 7000 km by ~0.8 m
    const icrf = (await ask('icrf')).json().state.position;
    expect(icrf).toEqual(r);
  });

  it('an itrf state about another body is refused (422 unsupported-frame)', async () => {
    const res = await postJson(app, '/v1/orbit', { centralBody: 'mars', state: { epoch: EPOCH, frame: 'itrf', position: [4000, 0, 0], velocity: [0, 3, 0] } });
    expect(res.statusCode, res.body).toBe(422);
    expect(res.json().type).toContain('unsupported-frame');
  });

  it('an unknown frame is a 400 naming the field', async () => {
    const res = await postJson(app, '/v1/orbit', { centralBody: 'earth', state: { epoch: EPOCH, frame: 'j2000', position: [7000, 0, 0], velocity: [0, 7.5, 0] } });
    expect(res.statusCode).toBe(400);
    expect(res.json().errors[0].path).toBe('body.state.frame');
  });
});

describe('timeSystem', () => {
  // One instant, 2026-12-01T06:30:00 UTC, in each system. TAI - UTC = 37 s since 2017-01-01 (IERS
  // Leap_Second.dat, /work/shared/reference/iers); TT = TAI + 32.184 s (IAU 1991 Resolution A4);
  // GPS = TAI - 19 s (IS-GPS-200, from memory).
  const spellings = [
    { timeSystem: undefined, epoch: '2026-12-01T06:30:00Z', later: '2026-12-01T07:30:00Z' },
    { timeSystem: 'UTC', epoch: '2026-12-01T06:30:00.000000Z', later: '2026-12-01T07:30:00.000000Z' },
    { timeSystem: 'TAI', epoch: '2026-12-01T06:30:37', later: '2026-12-01T07:30:37' },
    { timeSystem: 'TT', epoch: '2026-12-01T06:31:09.184', later: '2026-12-01T07:31:09.184' },
    { timeSystem: 'GPS', epoch: '2026-12-01T06:30:18', later: '2026-12-01T07:30:18' },
    { timeSystem: 'GPS', epoch: '2026-335T06:30:18', later: '2026-335T07:30:18' }, // day-of-year form
  ];
  const ts = (system: string | undefined) => (system === undefined ? {} : { timeSystem: system });

  it('the same instant in UTC, TAI, TT and GPS gives one scenario hash and byte-identical answers (track: state epoch and grid)', async () => {
    const bodies = spellings.map((s) => ({
      centralBody: 'earth',
      state: { epoch: s.epoch, ...ts(s.timeSystem), position: [7000, 0, 0], velocity: [0, 6.5, 4.0] },
      grid: { start: s.epoch, stop: s.later, step: 600, ...ts(s.timeSystem) },
      frame: 'itrf',
    }));
    const answers = await Promise.all(bodies.map((b) => postJson(app, '/v1/track', b)));
    for (const a of answers) expect(a.statusCode, a.body).toBe(200);
    const hashes = new Set(answers.map((a) => a.json().scenarioHash));
    expect(hashes.size).toBe(1);
    expect(new Set(answers.map((a) => a.body)).size).toBe(1);
    expect(answers[0]!.json().samples[0].epoch).toBe('2026-12-01T06:30:00.000000Z');
    expect(answers[0]!.json().samples.at(-1).epoch).toBe('2026-12-01T07:30:00.000000Z');
  });

  it('... and for elements on /v1/orbit, a times grid, and a pass-search window', async () => {
    const el = { semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 };
    const orbits = await Promise.all(spellings.map((s) => postJson(app, '/v1/orbit', { centralBody: 'earth', elements: { ...el, epoch: s.epoch, ...ts(s.timeSystem) } })));
    expect(new Set(orbits.map((a) => a.json().scenarioHash)).size).toBe(1);
    expect(new Set(orbits.map((a) => a.body)).size).toBe(1);
    expect(orbits[0]!.json().epoch).toBe('2026-12-01T06:30:00.000000Z');

    const tracks = await Promise.all(spellings.map((s) => postJson(app, '/v1/track', {
      centralBody: 'earth', elements: { ...el, epoch: EPOCH }, grid: { times: [s.later, s.epoch], ...ts(s.timeSystem) },
    })));
    expect(new Set(tracks.map((a) => a.json().scenarioHash)).size).toBe(1);
    expect(new Set(tracks.map((a) => a.body)).size).toBe(1);

    const passes = await Promise.all(spellings.map((s) => postJson(app, '/v1/passes', {
      centralBody: 'earth', elements: { ...el, epoch: EPOCH },
      window: { start: s.epoch, stop: s.later, ...ts(s.timeSystem) },
      stations: [{ id: 'korrin-hill', latitude: 61.2, longitude: 24.9, altitude: 0.21 }],
    })));
    for (const a of passes) expect(a.statusCode, a.body).toBe(200);
    expect(new Set(passes.map((a) => a.json().scenarioHash)).size).toBe(1);
    expect(new Set(passes.map((a) => a.body)).size).toBe(1);
    expect(passes[0]!.json().window).toEqual({ start: '2026-12-01T06:30:00.000000Z', stop: '2026-12-01T07:30:00.000000Z' });
  });

  it('a different instant gives a different hash (TAI text read as UTC would be 37 s later)', async () => {
    const body = (epoch: string, system?: string) => ({ centralBody: 'earth', state: { epoch, ...ts(system), position: [7000, 0, 0], velocity: [0, 7.5, 0] } });
    const a = (await postJson(app, '/v1/orbit', body('2026-12-01T06:30:37', 'TAI'))).json();
    const b = (await postJson(app, '/v1/orbit', body('2026-12-01T06:30:37Z'))).json();
    expect(a.scenarioHash).not.toBe(b.scenarioHash);
    expect(a.epoch).toBe('2026-12-01T06:30:00.000000Z');
  });

  it('refuses epochs that do not fit their system, naming the field: a zone letter on a TAI epoch, UTC without one, second 60 outside a UTC leap second, an unknown system', async () => {
    const cases: Array<[unknown, string]> = [
      [{ epoch: '2026-12-01T06:30:37Z', timeSystem: 'TAI' }, 'body.state.epoch'],
      [{ epoch: '2026-12-01T06:30:00' }, 'body.state.epoch'],
      [{ epoch: '2026-12-01T23:59:60', timeSystem: 'TAI' }, 'body.state.epoch'],
      [{ epoch: '2026-12-01T06:30:00', timeSystem: 'UT1' }, 'body.state.timeSystem'],
    ];
    for (const [part, path] of cases) {
      const res = await postJson(app, '/v1/orbit', { centralBody: 'earth', state: { ...(part as object), position: [7000, 0, 0], velocity: [0, 7.5, 0] } });
      expect(res.statusCode, JSON.stringify(part)).toBe(400);
      expect(res.json().errors.map((e: { path: string }) => e.path)).toContain(path);
    }
    const grid = await postJson(app, '/v1/track', { centralBody: 'earth', state: { epoch: EPOCH, position: [7000, 0, 0], velocity: [0, 7.5, 0] }, grid: { times: [EPOCH, '2026-12-01T06:40:00'], timeSystem: 'GPS' } });
    expect(grid.statusCode).toBe(400);
    expect(grid.json().errors.map((e: { path: string }) => e.path)).toContain('body.grid.times.0');
  });

  it('the two-body endpoint reads its epoch and track grid in their time systems too', async () => {
    const pair = (epoch: string, system?: string) => ({
      epoch, ...ts(system),
      bodies: [
        { name: 'primary', mass: 3.1e24, position: [0, 0, 0], velocity: [0, 0, 0] },
        { name: 'companion', gm: 1300, position: [250_000, 0, 0], velocity: [0, 0.9, 0.05] },
      ],
      track: { grid: { start: epoch, stop: system === 'TT' ? '2026-12-01T07:31:09.184' : '2026-12-01T07:30:00Z', step: 900, ...ts(system) } },
    });
    const a = await postJson(app, '/v1/two-body', pair(EPOCH));
    const b = await postJson(app, '/v1/two-body', pair('2026-12-01T06:31:09.184', 'TT'));
    expect(a.statusCode, a.body).toBe(200);
    expect(b.json().scenarioHash).toBe(a.json().scenarioHash);
    expect(b.body).toBe(a.body);
  });
});
