// Ephemeris orbits (ephemeris.oem, CCSDS 502.0-B-3 OEM in KVN) over HTTP: OEMs written here from an
// analytic two-body orbit (Kepler's equation by bisection, test/helpers/two-body-reference.ts) at
// 60 s nodes, OEMs from our own writer read back, coverage errors, malformed files, frames and time
// systems of the nodes, and every endpoint that takes an orbit.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { ellipseReference } from '../helpers/two-body-reference.js';


let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const MU = 398_600.4418; // km^3/s^2: the service's Earth GM (EGM-96/WGS-84 value, common practice)
// An invented orbit: a 500 x 900 km LEO at 51.6 deg.
const R0 = [6878.137, 0, 0];
const V0 = [0, 7.74 * Math.cos(51.6 * Math.PI / 180), 7.74 * Math.sin(51.6 * Math.PI / 180)];
const EPOCH = '2026-12-01T00:00:00Z';
const T0_MS = Date.parse(EPOCH);
const truth = (s: number) => ellipseReference(R0, V0, MU, s);
const accel = (r: readonly number[]): number[] => r.map((x) => (-MU / Math.hypot(r[0]!, r[1]!, r[2]!) ** 3) * x);

/** UTC calendar text of T0 + s (no zone letter, as OEM epochs are written), shifted by `offsetS` into another time system. */
const oemEpoch = (s: number, offsetS = 0): string => new Date(T0_MS + (s + offsetS) * 1000).toISOString().slice(0, -1);

interface Segment {
  readonly from: number; // s after T0
  readonly to: number;
  readonly step?: number;
  readonly frame?: string;
  readonly system?: string;
  readonly offsetS?: number; // the time system's offset from UTC, s
  readonly meta?: readonly string[];
  readonly accelerations?: boolean;
  /** Node states by time after T0 (default: the analytic orbit). */
  readonly state?: (s: number) => number[];
}

function segmentLines(g: Segment): string[] {
  const step = g.step ?? 60;
  const off = g.offsetS ?? 0;
  const lines = [
    'META_START', 'OBJECT_NAME = KESTREL-9', 'OBJECT_ID = 2099-077C', 'CENTER_NAME = EARTH',
    `REF_FRAME = ${g.frame ?? 'GCRF'}`, `TIME_SYSTEM = ${g.system ?? 'UTC'}`,
    `START_TIME = ${oemEpoch(g.from, off)}`, `STOP_TIME = ${oemEpoch(g.to, off)}`, ...(g.meta ?? []), 'META_STOP',
  ];
  for (let s = g.from; s <= g.to + 1e-9; s += step) {
    const x = g.state ? g.state(s) : [...truth(s).r, ...truth(s).v];
    const a = g.accelerations ? accel(x.slice(0, 3)) : [];
    lines.push([oemEpoch(s, off), ...x.map((c, i) => c.toFixed(i < 3 ? 6 : 9)), ...a.map((c) => c.toExponential(12))].join(' '));
  }
  return lines;
}

const HEADER = ['CCSDS_OEM_VERS = 2.0', 'COMMENT written by the test from an analytic two-body orbit', 'CREATION_DATE = 2026-11-30T12:00:00', 'ORIGINATOR = TEST DESK'];
const oemLines = (...segments: Segment[]): string[] => [...HEADER, ...segments.flatMap(segmentLines)];
const oem = (...segments: Segment[]): string => oemLines(...segments).join('\n');

const DAY = oem({ from: 0, to: 86_400 });
const dist = (a: readonly number[], b: readonly number[]): number => Math.hypot(a[0]! - b[0]!, a[1]! - b[1]!, a[2]! - b[2]!);
const at = (s: number): string => new Date(T0_MS + s * 1000).toISOString();

describe('/v1/track from an ephemeris', () => {
  it('between 60 s nodes the track is within 0.5 m of the analytic orbit (default Lagrange degree 7), and the diagnostics say how it was interpolated', async () => {
    const res = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: DAY }, grid: { start: at(30), stop: at(6 * 3600 + 30), step: 60 } });
    expect(res.statusCode, res.body).toBe(200);
    const a = res.json();
    expect(a.model).toBe('ephemeris');
    let worst = 0;
    a.samples.forEach((x: { position: number[] }, i: number) => { worst = Math.max(worst, dist(x.position, truth(30 + 60 * i).r)); });
    expect(worst * 1000).toBeLessThan(0.5);
    const d = a.diagnostics;
    expect(d.conservedQuantity).toBe('none');
    expect(d.interpolation.segments).toEqual([{
      start: '2026-12-01T00:00:00.000000Z', stop: '2026-12-02T00:00:00.000000Z', refFrame: 'GCRF', timeSystem: 'UTC', nodes: 1441,
      method: 'lagrange', degreeAsked: 7, degreeFromFile: false, degree: 7, nodesPerSample: 8, usesAccelerations: false,
    }]);
    // The estimate (the farthest node's term) is of the error, not below it.
    expect(d.interpolation.maxPositionErrorEstimate).toBeGreaterThan(worst * 0.5);
    expect(d.interpolation.maxPositionErrorEstimate).toBeLessThan(1e-3);
  });

  it('INTERPOLATION HERMITE with INTERPOLATION_DEGREE is honoured, with accelerations where the lines give them', async () => {
    const ask = async (g: Partial<Segment>) => {
      const res = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: oem({ from: 0, to: 7200, ...g }) }, grid: { start: at(30), stop: at(7200 - 30), step: 60 } });
      expect(res.statusCode, res.body).toBe(200);
      const a = res.json();
      let worst = 0;
      a.samples.forEach((x: { position: number[] }, i: number) => { worst = Math.max(worst, dist(x.position, truth(30 + 60 * i).r)); });
      return { worst, seg: a.diagnostics.interpolation.segments[0] };
    };
    const h = await ask({ meta: ['INTERPOLATION = HERMITE', 'INTERPOLATION_DEGREE = 5'] });
    expect(h.seg).toMatchObject({ method: 'hermite', degreeAsked: 5, degreeFromFile: true, degree: 5, nodesPerSample: 3, usesAccelerations: false });
    expect(h.worst * 1000).toBeLessThan(0.5);
    const ha = await ask({ meta: ['INTERPOLATION = HERMITE', 'INTERPOLATION_DEGREE = 5'], accelerations: true });
    expect(ha.seg).toMatchObject({ method: 'hermite', degree: 5, nodesPerSample: 2, usesAccelerations: true });
    expect(ha.worst * 1000).toBeLessThan(0.5);
    // A low degree is honoured too, and it shows: degree 1 is the chord, whose sag at 60 s is r (1 - cos(v h / 2r)) ~ 3.8 km here (common practice, no source).
    const lin = await ask({ meta: ['INTERPOLATION = LAGRANGE', 'INTERPOLATION_DEGREE = 1'] });
    expect(lin.seg).toMatchObject({ method: 'lagrange', degree: 1, nodesPerSample: 2 });
    expect(lin.worst).toBeGreaterThan(1);
  });

  it('samples outside the coverage, or in a gap between segments, answer 422 outside-coverage naming the coverage', async () => {
    const gap = oem({ from: 0, to: 3600 }, { from: 7200, to: 10_800 });
    const cases: [string, unknown][] = [
      [DAY, { times: [at(100), at(86_401)] }],
      [DAY, { times: [at(-1)] }],
      [gap, { start: at(3000), stop: at(8000), step: 600 }],
    ];
    for (const [text, grid] of cases) {
      const res = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: text }, grid });
      expect(res.statusCode, res.body).toBe(422);
      expect(res.json().type).toBe('/problems/outside-coverage');
      expect(res.json().detail).toMatch(/2026-12-01T00:00:00\.000000Z to 2026-12-0[12]T/);
    }
    const res = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: gap }, grid: { times: [at(5000)] } });
    expect(res.json().detail).toContain('2026-12-01T00:00:00.000000Z to 2026-12-01T01:00:00.000000Z, 2026-12-01T02:00:00.000000Z to 2026-12-01T03:00:00.000000Z');
    // Both sides of the gap answer.
    expect((await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: gap }, grid: { times: [at(3600), at(7200), at(9000)] } })).statusCode).toBe(200);
  });

  it('an OEM from our own writer (format oem) read back gives the same states at the nodes and the two-body orbit between them', async () => {
    const state = { epoch: EPOCH, position: R0, velocity: V0 };
    const written = await postJson(app, '/v1/track', { centralBody: 'earth', state, grid: { start: EPOCH, stop: at(7200), step: 60 }, format: 'oem' });
    expect(written.statusCode).toBe(200);
    const back = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: written.body }, grid: { start: EPOCH, stop: at(7200), step: 30 } });
    expect(back.statusCode, back.body).toBe(200);
    const direct = (await postJson(app, '/v1/track', { centralBody: 'earth', state, grid: { start: EPOCH, stop: at(7200), step: 30 } })).json();
    const b = back.json();
    b.samples.forEach((x: { position: number[]; velocity: number[] }, i: number) => {
      const tol = i % 2 === 0 ? 1e-6 : 5e-4; // nodes: the printed digits (1 mm); between: the interpolation (0.5 m)
      expect(dist(x.position, direct.samples[i].position), `sample ${i}`).toBeLessThan(tol);
    });
  });
});

describe('frames and time systems of the nodes', () => {
  const grid = { start: at(45), stop: at(3600 - 15), step: 120 };
  const gcrfTrack = async () => (await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: oem({ from: 0, to: 3600 }) }, grid })).json();

  it('the same instants in UTC, TAI, TT and GPS (offsets 37 s, 69.184 s, 18 s in late 2026; IERS Bulletin C, from memory) give the same states', async () => {
    const utc = await gcrfTrack();
    for (const [system, off] of [['TAI', 37], ['TT', 69.184], ['GPS', 18]] as const) {
      const res = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: oem({ from: 0, to: 3600, system, offsetS: off }) }, grid });
      expect(res.statusCode, res.body).toBe(200);
      const a = res.json();
      expect(a.diagnostics.interpolation.segments[0].timeSystem).toBe(system);
      a.samples.forEach((x: { position: number[] }, i: number) => expect(dist(x.position, utc.samples[i].position), `${system} ${i}`).toBeLessThan(2e-6));
    }
  });

  it('ITRF and TEME nodes (our own itrf and teme output, format oem) come back to the GCRF track to 1 mm', async () => {
    const state = { epoch: EPOCH, position: R0, velocity: V0 };
    const nodes = { start: EPOCH, stop: at(3600), step: 60 };
    const direct = (await postJson(app, '/v1/track', { centralBody: 'earth', state, grid, ut1MinusUtc: 0.12 })).json();
    for (const frame of ['itrf', 'teme']) {
      const written = await postJson(app, '/v1/track', { centralBody: 'earth', state, grid: nodes, frame, format: 'oem', ut1MinusUtc: 0.12 });
      expect(written.statusCode).toBe(200);
      expect(written.body).toMatch(new RegExp(`REF_FRAME +[=] ${frame.toUpperCase()}\n`));
      const back = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: written.body }, grid, ut1MinusUtc: 0.12 });
      expect(back.statusCode, back.body).toBe(200);
      back.json().samples.forEach((x: { position: number[] }, i: number) => expect(dist(x.position, direct.samples[i].position), `${frame} ${i}`).toBeLessThan(1e-3));
    }
  });

  it('EME2000 nodes are GCRF less the frame bias (first-order rotation by xi0 = -0.0166170", eta0 = -0.0068192", da0 = -0.01460"; IERS Conventions 2003 sec. 5.4.4)', async () => {
    const ARCSEC = Math.PI / 648_000;
    const [xi0, eta0, da0] = [-0.016617 * ARCSEC, -0.0068192 * ARCSEC, -0.0146 * ARCSEC];
    // r_EME2000 = B r_GCRF, B = I + [[0, da0, -xi0], [-da0, 0, -eta0], [xi0, eta0, 0]] to first order.
    const bias = (x: readonly number[]): number[] => [x[0]! + da0 * x[1]! - xi0 * x[2]!, -da0 * x[0]! + x[1]! - eta0 * x[2]!, xi0 * x[0]! + eta0 * x[1]! + x[2]!];
    const eme = oem({ from: 0, to: 3600, frame: 'EME2000', state: (s) => { const t = truth(s); return [...bias(t.r), ...bias(t.v)]; } });
    const a = (await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: eme }, grid })).json();
    const g = await gcrfTrack();
    // The nodes carry 0.5 mm of rounding per component; the bias itself is ~0.8 m at this radius.
    a.samples.forEach((x: { position: number[] }, i: number) => expect(dist(x.position, g.samples[i].position)).toBeLessThan(1e-5));
    const unbiased = (await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: eme.replace('REF_FRAME = EME2000', 'REF_FRAME = GCRF') }, grid })).json();
    expect(dist(unbiased.samples[0].position, g.samples[0].position)).toBeGreaterThan(5e-4);
  });
});

describe('passes, eclipses, orbit, batch from an ephemeris', () => {
  const stations = [
    { id: 'tarn-ridge', latitude: 47.1, longitude: 8.3, altitude: 0.5, minElevation: 5 },
    { id: 'salt-flat-east', latitude: -23.4, longitude: -68.2, altitude: 2.4, minElevation: 10 },
  ];
  const window = { start: EPOCH, stop: at(86_400) };

  it('passes from the OEM are within 0.05 s of the passes of the analytic orbit (AOS, LOS; TCA within 0.5 s: elevation is flat there)', async () => {
    const fromOem = await postJson(app, '/v1/passes', { centralBody: 'earth', ephemeris: { oem: DAY }, stations, window });
    expect(fromOem.statusCode, fromOem.body).toBe(200);
    const analytic = (await postJson(app, '/v1/passes', { centralBody: 'earth', state: { epoch: EPOCH, position: R0, velocity: V0 }, stations, window })).json();
    const e = fromOem.json();
    expect(e.model).toBe('ephemeris');
    expect(e.passes.length).toBe(analytic.passes.length);
    expect(e.passes.length).toBeGreaterThan(4);
    const dt = (a: string, b: string) => Math.abs(Date.parse(a) - Date.parse(b)) / 1000;
    e.passes.forEach((p: { station: string; aos: string; los: string; tca: string }, i: number) => {
      const q = analytic.passes[i];
      expect(p.station).toBe(q.station);
      expect(dt(p.aos, q.aos)).toBeLessThan(0.05);
      expect(dt(p.los, q.los)).toBeLessThan(0.05);
      expect(dt(p.tca, q.tca)).toBeLessThan(0.5);
    });
    expect(e.diagnostics.interpolation.segments[0].method).toBe('lagrange');
    expect(e.diagnostics.interpolation.maxPositionErrorEstimate).toBeLessThan(1e-3);
    expect(analytic.diagnostics).toBeUndefined();
  });

  it('a pass window beyond the coverage or across a gap is 422 outside-coverage naming the coverage', async () => {
    const short = oem({ from: 0, to: 3600 }, { from: 7200, to: 10_800 });
    for (const w of [{ start: EPOCH, stop: at(4000) }, { start: at(-60), stop: at(600) }, { start: at(1000), stop: at(9000) }]) {
      const res = await postJson(app, '/v1/passes', { centralBody: 'earth', ephemeris: { oem: short }, stations, window: w });
      expect(res.statusCode, res.body).toBe(422);
      expect(res.json().detail).toMatch(/coverage 2026-12-01T00:00:00\.000000Z to 2026-12-01T01:00:00\.000000Z, 2026-12-01T02:00:00\.000000Z to|outside the ephemeris coverage \(2026-12-01T00:00:00\.000000Z/);
    }
  });

  it('eclipses from the OEM match those of the analytic orbit to 0.05 s, with the interpolation in the diagnostics', async () => {
    const e = await postJson(app, '/v1/eclipses', { centralBody: 'earth', ephemeris: { oem: DAY }, window });
    expect(e.statusCode, e.body).toBe(200);
    const a = (await postJson(app, '/v1/eclipses', { centralBody: 'earth', state: { epoch: EPOCH, position: R0, velocity: V0 }, window })).json();
    const x = e.json();
    expect(x.eclipses.length).toBe(a.eclipses.length);
    x.eclipses.forEach((c: { start: string; stop: string }, i: number) => {
      expect(Math.abs(Date.parse(c.start) - Date.parse(a.eclipses[i].start))).toBeLessThan(50);
      expect(Math.abs(Date.parse(c.stop) - Date.parse(a.eclipses[i].stop))).toBeLessThan(50);
    });
    expect(x.diagnostics.interpolation.segments).toHaveLength(1);
  });

  it('/v1/orbit answers the osculating orbit of the first node', async () => {
    const e = (await postJson(app, '/v1/orbit', { centralBody: 'earth', ephemeris: { oem: DAY } })).json();
    const s = (await postJson(app, '/v1/orbit', { centralBody: 'earth', state: { epoch: EPOCH, position: R0, velocity: V0 } })).json();
    expect(e.epoch).toBe(s.epoch);
    expect(e.elements.semiMajorAxis).toBeCloseTo(s.elements.semiMajorAxis, 5);
    expect(e.period).toBeCloseTo(s.period, 4);
  });

  it('batch items take an ephemeris like the endpoint alone', async () => {
    const request = { centralBody: 'earth', ephemeris: { oem: oem({ from: 0, to: 1800 }) }, grid: { times: [at(90)] } };
    const res = await postJson(app, '/v1/batch', { items: [{ id: 'e', kind: 'track', request }, { id: 'bad', kind: 'track', request: { ...request, grid: { times: [at(1900)] } } }] });
    expect(res.statusCode).toBe(200);
    const lines = res.body.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines[0].status).toBe(200);
    expect(lines[0].answer).toEqual((await postJson(app, '/v1/track', request)).json());
    expect(lines[1].status).toBe(422);
  });

  it('the model is ephemeris: another model with an ephemeris, or ephemeris without one, is 422', async () => {
    const grid = { times: [at(90)] };
    const a = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: DAY }, grid, model: 'two-body' });
    expect(a.statusCode).toBe(422);
    expect(a.json().detail).toMatch(/interpolated \(model ephemeris\)/);
    const b = await postJson(app, '/v1/track', { centralBody: 'earth', state: { epoch: EPOCH, position: R0, velocity: V0 }, grid, model: 'ephemeris' });
    expect(b.statusCode).toBe(422);
    expect(b.json().detail).toMatch(/give the orbit as ephemeris\.oem/);
    const c = await postJson(app, '/v1/track', { centralBody: 'mars', ephemeris: { oem: DAY }, grid });
    expect(c.statusCode).toBe(422);
    const both = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: DAY }, state: { epoch: EPOCH, position: R0, velocity: V0 }, grid });
    expect(both.statusCode).toBe(400);
  });
});

describe('malformed OEMs: a clear 422 naming the line', () => {
  const base = oemLines({ from: 0, to: 600 });
  const firstData = base.findIndex((l) => l.startsWith('2026-12-01T00:00:00.000 '));
  const cases: [string, string[], string, number, RegExp][] = [
    ['missing META_STOP', base.filter((l) => l !== 'META_STOP'), '/problems/oem-malformed', firstData, /META_STOP is missing/],
    ['non-increasing epochs', [...base.slice(0, firstData + 2), base[firstData]!, ...base.slice(firstData + 3)], '/problems/oem-malformed', firstData + 3, /epochs must increase/],
    ['unknown frame', base.map((l) => (l === 'REF_FRAME = GCRF' ? 'REF_FRAME = MOD' : l)), '/problems/oem-unsupported', base.indexOf('REF_FRAME = GCRF') + 1, /REF_FRAME MOD/],
    ['7 numbers on a line', base.map((l, i) => (i === firstData + 4 ? `${l} 0.001` : l)), '/problems/oem-malformed', firstData + 5, /has 7 numbers/],
  ];
  for (const [what, lines, code, line, message] of cases) {
    it(`${what}: ${code} at line ${line}`, async () => {
      const res = await postJson(app, '/v1/track', { centralBody: 'earth', ephemeris: { oem: lines.join('\n') }, grid: { times: [at(60)] } });
      expect(res.statusCode, res.body).toBe(422);
      const p = res.json();
      expect(p.type).toBe(code);
      expect(p.detail).toContain(`line ${line}:`);
      expect(p.detail).toMatch(message);
      expect(p.errors[0].path).toBe('body.ephemeris.oem');
    });
  }
});
