import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';
import { parseOemKvn } from '../helpers/oem-kvn.js';
import { ellipseReference } from '../helpers/two-body-reference.js';

// The epoch printed beside a state is the epoch the state is at: every answer prints epochs to the
// microsecond and samples on the microsecond. Each check reads the printed epoch text with its own
// arithmetic (integer microseconds of one UTC day; no leap second inside the spans used) and
// recomputes the state there independently.
let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

/** Microseconds of the UTC day of a printed epoch "YYYY-MM-DDThh:mm:ss.ffffff[Z]" (exactly six digits). */
function microsOfDay(text: string): { day: string; us: number } {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2}):(\d{2})\.(\d{6})Z?$/.exec(text);
  expect(m, `${text} is printed to the microsecond`).not.toBeNull();
  const [h, min, s, us] = [Number(m![2]), Number(m![3]), Number(m![4]), Number(m![5])];
  return { day: m![1]!, us: ((h * 60 + min) * 60 + s) * 1_000_000 + us };
}
/** Seconds from `from` to `to` (same UTC day), from the printed digits. */
const secondsBetween = (from: string, to: string): number => {
  const [a, b] = [microsOfDay(from), microsOfDay(to)];
  expect(b.day).toBe(a.day);
  return (b.us - a.us) / 1e6;
};

// WGS-84 GM = 3986004.418e8 m^3/s^2 (NIMA TR8350.2, 3rd ed., Table 3.1), the built-in earth's GM.
const MU = 398_600.4418;
const T0 = '2026-12-01T00:00:00.123456Z';
const R0 = [6_878.137, 0, 0];
const V0 = [0, 4.8, 6.0];
// A step with a sub-microsecond part: start + k step falls between microseconds.
const GRID = { start: T0, stop: '2026-12-01T00:01:10.123456Z', step: 7.0000007 };
const ORBIT = { centralBody: 'earth', state: { epoch: T0, position: R0, velocity: V0 } };

/** Printed position (km, 6 decimals) and velocity (km/s, 9) against the two-body state at the printed epoch. */
function expectStateAt(epoch: string, r: readonly number[], v: readonly number[]): void {
  const ref = ellipseReference(R0, V0, MU, secondsBetween(T0, epoch));
  for (let i = 0; i < 3; i++) {
    // Half the last printed digit, plus a margin for the double of the epoch (about 1e-7 s x 7.7 km/s).
    expect(Math.abs(r[i]! - ref.r[i]!), `${epoch} position ${i}`).toBeLessThan(1.5e-6);
    expect(Math.abs(v[i]! - ref.v[i]!), `${epoch} velocity ${i}`).toBeLessThan(1.5e-9);
  }
}

describe('tracks: the state printed at an epoch is the state at that printed epoch', () => {
  it('JSON: an input epoch with microseconds keeps them, and every sample is at its printed epoch', async () => {
    const res = await postJson(app, '/v1/track', { ...ORBIT, grid: GRID });
    expect(res.statusCode, res.body).toBe(200);
    const samples = res.json().samples as { epoch: string; position: number[]; velocity: number[] }[];
    expect(samples[0]!.epoch).toBe(T0);
    expect(samples.length).toBe(11);
    // 7.0000007 s steps: the fourth sample is 21.0000021 s after the start, printed on the microsecond.
    expect(samples[3]!.epoch).toBe('2026-12-01T00:00:21.123458Z');
    for (const s of samples) expectStateAt(s.epoch, s.position, s.velocity);
  });

  it('CSV and OEM print the same epochs and states to the microsecond', async () => {
    const csv = await postJson(app, '/v1/track', { ...ORBIT, grid: GRID, format: 'csv' });
    expect(csv.statusCode, csv.body).toBe(200);
    const rows = csv.body.trim().split('\r\n').slice(1).map((l) => l.split(','));
    expect(rows.length).toBe(11);
    for (const [epoch, ...n] of rows) expectStateAt(epoch!, n.slice(0, 3).map(Number), n.slice(3).map(Number));

    const oem = await postJson(app, '/v1/track', { ...ORBIT, grid: GRID, format: 'oem' });
    expect(oem.statusCode, oem.body).toBe(200);
    const parsed = parseOemKvn(oem.body);
    const segment = parsed.segments[0]!;
    expect(segment.epochs.length).toBe(11);
    expect(segment.meta.START_TIME).toBe(T0.slice(0, -1));
    segment.epochs.forEach((epoch, i) => expectStateAt(epoch, segment.states.slice(6 * i, 6 * i + 3), segment.states.slice(6 * i + 3, 6 * i + 6)));
  });

  it('asked again at the printed epochs (a times grid), the service answers the same state bytes', async () => {
    const first = await postJson(app, '/v1/track', { ...ORBIT, grid: GRID, format: 'csv' });
    const epochs = first.body.trim().split('\r\n').slice(1).map((l) => l.split(',')[0]!);
    const again = await postJson(app, '/v1/track', { ...ORBIT, grid: { times: epochs }, format: 'csv' });
    expect(again.statusCode, again.body).toBe(200);
    expect(again.body).toBe(first.body);
  });

  it('input epochs finer than the microsecond are rounded to it: one scenario with the rounded spelling', async () => {
    const fine = await postJson(app, '/v1/orbit', { ...ORBIT, state: { ...ORBIT.state, epoch: '2026-12-01T00:00:00.1234565Z' } });
    const rounded = await postJson(app, '/v1/orbit', { ...ORBIT, state: { ...ORBIT.state, epoch: '2026-12-01T00:00:00.123457Z' } });
    expect(fine.statusCode, fine.body).toBe(200);
    expect(fine.json().scenarioHash).toBe(rounded.json().scenarioHash);
    expect(fine.body).toBe(rounded.body);
    expect(fine.json().epoch).toBe('2026-12-01T00:00:00.123457Z');
  });
});

// WGS-84 a = 6378.137 km, 1/f = 298.257223563 (NIMA TR8350.2, 3rd ed., Table 3.1); geodetic to
// Earth-fixed and the local east-north-up axes as in Vallado, 4th ed., sec. 3.2 and 4.4 (from memory).
function stationFrame(latDeg: number, lonDeg: number, heightKm: number) {
  const a = 6378.137;
  const f = 1 / 298.257223563;
  const e2 = f * (2 - f);
  const [phi, lam] = [(latDeg * Math.PI) / 180, (lonDeg * Math.PI) / 180];
  const n = a / Math.sqrt(1 - e2 * Math.sin(phi) ** 2);
  const site = [(n + heightKm) * Math.cos(phi) * Math.cos(lam), (n + heightKm) * Math.cos(phi) * Math.sin(lam), (n * (1 - e2) + heightKm) * Math.sin(phi)];
  const up = [Math.cos(phi) * Math.cos(lam), Math.cos(phi) * Math.sin(lam), Math.sin(phi)];
  const east = [-Math.sin(lam), Math.cos(lam), 0];
  const north = [-Math.sin(phi) * Math.cos(lam), -Math.sin(phi) * Math.sin(lam), Math.cos(phi)];
  return { site, up, east, north };
}
const dot = (p: readonly number[], q: readonly number[]) => p[0]! * q[0]! + p[1]! * q[1]! + p[2]! * q[2]!;

describe('passes: AOS, TCA, LOS and pointing are looked at from the printed epochs', () => {
  it('range, elevation and azimuth recomputed from the Earth-fixed track at each printed epoch agree', async () => {
    const station = DEMO_STATIONS[0]!;
    const window = { start: EPOCH, stop: '2026-12-01T12:00:00Z' };
    const res = await postJson(app, '/v1/passes', { ...DEMO_ORBIT, window, stations: [station], pointing: { step: 13.7 } });
    expect(res.statusCode, res.body).toBe(200);
    const passes = res.json().passes as {
      aos: string; tca: string; los: string; azimuthAos: number; azimuthTca: number; azimuthLos: number; maxElevation: number; rangeTca: number; duration: number;
      pointing: { epoch: string; azimuth: number; elevation: number; range: number }[];
    }[];
    expect(passes.length).toBeGreaterThan(0);
    const { site, up, east, north } = stationFrame(station.latitude, station.longitude, station.altitude);
    for (const p of passes) {
      // The search finds AOS and LOS to well under a millisecond: they are not on whole milliseconds.
      expect(Math.abs(secondsBetween(p.aos, p.los) - p.duration)).toBeLessThan(5e-7);
      const looks: { epoch: string; azimuth: number; elevation: number; range: number | null }[] = [
        { epoch: p.aos, azimuth: p.azimuthAos, elevation: NaN, range: null },
        { epoch: p.tca, azimuth: p.azimuthTca, elevation: p.maxElevation, range: p.rangeTca },
        { epoch: p.los, azimuth: p.azimuthLos, elevation: NaN, range: null },
        ...p.pointing,
      ];
      const track = await postJson(app, '/v1/track', { ...DEMO_ORBIT, grid: { times: looks.map((l) => l.epoch) }, frame: 'itrf' });
      expect(track.statusCode, track.body).toBe(200);
      const states = track.json().samples as { epoch: string; position: number[] }[];
      looks.forEach((l, i) => {
        expect(states[i]!.epoch).toBe(l.epoch);
        const rho = states[i]!.position.map((x, k) => x - site[k]!);
        const range = Math.sqrt(dot(rho, rho));
        const elevation = (Math.asin(dot(rho, up) / range) * 180) / Math.PI;
        const azimuth = ((Math.atan2(dot(rho, east), dot(rho, north)) * 180) / Math.PI + 360) % 360;
        // The track prints 1 mm; a 0.5 ms epoch error would move the range by metres.
        if (l.range !== null) expect(Math.abs(l.range - range), `${l.epoch} range`).toBeLessThan(2e-6);
        if (!Number.isNaN(l.elevation)) expect(Math.abs(l.elevation - elevation), `${l.epoch} elevation`).toBeLessThan(2e-5);
        expect(Math.abs(((l.azimuth - azimuth + 540) % 360) - 180), `${l.epoch} azimuth`).toBeLessThan(2e-5);
      });
    }
  }, 60_000);
});

describe('other epochs are printed to the microsecond too', () => {
  it('eclipses: start, stop and the umbra print six digits, and the duration is the printed span', async () => {
    const res = await postJson(app, '/v1/eclipses', { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-01T06:00:00Z' } });
    expect(res.statusCode, res.body).toBe(200);
    const eclipses = res.json().eclipses as { start: string; stop: string; umbraStart: string | null; umbraStop: string | null; duration: number }[];
    expect(eclipses.length).toBeGreaterThan(0);
    for (const e of eclipses) {
      for (const t of [e.start, e.stop, e.umbraStart, e.umbraStop]) if (t !== null) microsOfDay(t);
      if (microsOfDay(e.start).day === microsOfDay(e.stop).day) expect(Math.abs(secondsBetween(e.start, e.stop) - e.duration)).toBeLessThanOrEqual(1.01e-6);
    }
  });

  it('the orbit answer: its epoch and the next passages', async () => {
    const res = await postJson(app, '/v1/orbit', ORBIT);
    const orbit = res.json();
    expect(orbit.epoch).toBe(T0);
    microsOfDay(orbit.apsides.periapsis.nextPassage);
  });
});
