// Passes, eclipses and batches from catalogue orbits. The pass check: AOS and LOS from
// /v1/passes against crossings found here from the /v1/track teme states, converted to the
// Earth-fixed frame and to elevations in this file from published formulas (GMST 1982,
// Vallado 4th ed. eq. 3-47; WGS-84 station position, Vallado 4th ed. eq. 3-7; from memory).
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { PLOVER_TLE } from '../helpers/tle.js';
import { until } from '../helpers/batch.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const DEG = Math.PI / 180;
const WINDOW = { start: '2026-12-01T00:00:00Z', stop: '2026-12-02T00:00:00Z' };
// An invented station at an invented site.
const HERON = { id: 'HERON', latitude: 47.1, longitude: 8.3, altitude: 0.5, minElevation: 5 };

/** GMST 1982 in rad from a UTC epoch in ms (UT1 = UTC, as the requests ask): Vallado 4th ed. eq. 3-47 (from memory). */
function gmst82(ms: number): number {
  const jd = ms / 86_400_000 + 2_440_587.5;
  const t = (jd - 2_451_545) / 36_525;
  const s = 67_310.548_41 + (876_600 * 3600 + 8_640_184.812_866) * t + 0.093_104 * t * t - 6.2e-6 * t ** 3;
  return (((s % 86_400) + 86_400) % 86_400) / 86_400 * 2 * Math.PI;
}

/** WGS-84 station position, km (a = 6378.137 km, f = 1/298.257223563; Vallado 4th ed. eq. 3-7, from memory). */
function station(latDeg: number, lonDeg: number, hKm: number): { r: number[]; up: number[] } {
  const a = 6378.137;
  const f = 1 / 298.257_223_563;
  const e2 = f * (2 - f);
  const lat = latDeg * DEG;
  const lon = lonDeg * DEG;
  const c = a / Math.sqrt(1 - e2 * Math.sin(lat) ** 2);
  const s = c * (1 - e2);
  return {
    r: [(c + hKm) * Math.cos(lat) * Math.cos(lon), (c + hKm) * Math.cos(lat) * Math.sin(lon), (s + hKm) * Math.sin(lat)],
    up: [Math.cos(lat) * Math.cos(lon), Math.cos(lat) * Math.sin(lon), Math.sin(lat)],
  };
}

async function elevations(times: string[]): Promise<number[]> {
  const res = await postJson(app, '/v1/track', { tle: PLOVER_TLE, grid: { times }, frame: 'teme' });
  expect(res.statusCode, res.body).toBe(200);
  const site = station(HERON.latitude, HERON.longitude, HERON.altitude);
  return res.json().samples.map((s: { epoch: string; position: number[] }) => {
    const th = gmst82(Date.parse(s.epoch));
    const [x, y, z] = s.position as [number, number, number];
    const p = [Math.cos(th) * x + Math.sin(th) * y, -Math.sin(th) * x + Math.cos(th) * y, z];
    const rho = p.map((v, i) => v - site.r[i]!);
    const n = Math.hypot(...rho);
    return Math.asin(rho.reduce((acc, v, i) => acc + v * site.up[i]!, 0) / n) / DEG;
  });
}

const iso = (ms: number): string => new Date(ms).toISOString();

describe('/v1/passes from a two-line set', () => {
  it('AOS and LOS within 0.01 s of crossings found from the teme track converted independently', async () => {
    const res = await postJson(app, '/v1/passes', { tle: PLOVER_TLE, stations: [HERON], window: WINDOW });
    expect(res.statusCode, res.body).toBe(200);
    const passes = res.json().passes as Array<{ aos: string; los: string }>;
    expect(passes.length).toBeGreaterThan(2);
    let worst = 0;
    expect(res.json().model).toBe('sgp4');
    for (const p of passes) {
      for (const [edge, rising] of [[p.aos, true], [p.los, false]] as const) {
        // 0.1 s samples over +-15 s of the answer's crossing, then the 5 deg crossing by linear interpolation.
        const t0 = Date.parse(edge) - 15_000;
        const times = Array.from({ length: 301 }, (_, k) => iso(t0 + 100 * k));
        const el = await elevations(times);
        const k = el.findIndex((e, i) => i > 0 && (rising ? el[i - 1]! < HERON.minElevation && e >= HERON.minElevation : el[i - 1]! >= HERON.minElevation && e < HERON.minElevation));
        expect(k, `${edge}: no crossing within 15 s`).toBeGreaterThan(0);
        const f = (HERON.minElevation - el[k - 1]!) / (el[k]! - el[k - 1]!);
        const crossing = t0 + 100 * (k - 1 + f);
        expect(Math.abs(crossing - Date.parse(edge)), `${edge}`).toBeLessThan(10); // ms
        worst = Math.max(worst, Math.abs(crossing - Date.parse(edge)));
      }
    }
    console.log(`passes from a TLE: ${passes.length} passes, worst AOS/LOS difference ${worst.toFixed(2)} ms (answers print 1 ms)`);
  });

  it('a pass search that meets an SGP4 error answers the passes before it and why it stopped (verification case 28872, decayed)', async () => {
    const ver = readFileSync(new URL('../fixtures/sgp4/SGP4-VER.TLE', import.meta.url), 'utf8').split('\n');
    const tle = { line1: ver.find((l) => l.startsWith('1 28872'))!.slice(0, 69), line2: ver.find((l) => l.startsWith('2 28872'))!.slice(0, 69) };
    // An invented station right under the track at 00:45 UTC, so that a pass comes before the decay.
    const under = (await postJson(app, '/v1/track', { tle, grid: { times: ['2005-11-29T00:45:00Z'] }, frame: 'geodetic' })).json().samples[0];
    const stations = [{ id: 'KESTREL', latitude: under.latitude, longitude: under.longitude, altitude: 0, minElevation: 0 }, HERON];
    const res = await postJson(app, '/v1/passes', { tle, stations, window: { start: '2005-11-29T00:30:00Z', stop: '2005-11-29T03:00:00Z' } });
    expect(res.statusCode, res.body).toBe(200);
    const a = res.json();
    expect(a.propagationStopped.code).toBe('sgp4-failed');
    expect(a.propagationStopped.reason).toMatch(/decayed/);
    const stop = Date.parse(a.propagationStopped.epoch);
    // The reference prints this case to 50 min after its epoch (2005-11-29T00:28:58.9 UTC) and stops before 55 min.
    expect(stop).toBeGreaterThan(Date.parse('2005-11-29T01:18:58Z'));
    expect(stop).toBeLessThan(Date.parse('2005-11-29T01:24:00Z'));
    expect(a.passes.length).toBeGreaterThanOrEqual(1);
    for (const p of a.passes) expect(Date.parse(p.los)).toBeLessThanOrEqual(stop);
    console.log(`decaying case: ${a.passes.length} passes before ${a.propagationStopped.epoch}`);
    const ecl = await postJson(app, '/v1/eclipses', { tle, window: { start: '2005-11-29T00:30:00Z', stop: '2005-11-29T03:00:00Z' } });
    expect(ecl.statusCode, ecl.body).toBe(200);
    expect(ecl.json().propagationStopped.epoch).toBe(a.propagationStopped.epoch);
    for (const e of ecl.json().eclipses) expect(Date.parse(e.stop)).toBeLessThanOrEqual(stop);
  });
});

describe('eclipses and batches with catalogue orbits', () => {
  it('an eclipse search from a TLE runs on sgp4 and reports no stop when none happens', async () => {
    const res = await postJson(app, '/v1/eclipses', { tle: PLOVER_TLE, window: WINDOW });
    expect(res.statusCode, res.body).toBe(200);
    expect(res.json().model).toBe('sgp4');
    expect(res.json().eclipses.length).toBeGreaterThan(10);
    expect(res.json().propagationStopped).toBeUndefined();
  });

  it('a batch takes tle and omm items like the endpoints do', async () => {
    const res = await postJson(app, '/v1/batch', {
      items: [
        { kind: 'orbit', request: { tle: PLOVER_TLE } },
        { kind: 'track', request: { tle: PLOVER_TLE, grid: { times: ['2026-12-01T00:00:00Z'] } } },
        { kind: 'orbit', request: { tle: { line1: PLOVER_TLE.line1.slice(0, 68), line2: PLOVER_TLE.line2 } } },
      ],
    });
    expect(res.statusCode, res.body).toBe(200);
    const lines = res.body.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines.length).toBe(3);
    expect(JSON.stringify(lines[0])).toContain('"meanElements"');
    expect(JSON.stringify(lines[2])).toContain('tle-malformed');
  });

  it('a queued job takes a tle item and answers it like the endpoint', async () => {
    const sub = await postJson(app, '/v1/jobs', { label: 'catalogue', items: [{ kind: 'orbit', request: { tle: PLOVER_TLE } }] });
    expect(sub.statusCode, sub.body).toBe(202);
    const id = sub.json().id as string;
    await until('job done', async () => (await app.inject({ url: `/v1/jobs/${id}` })).json().status === 'done');
    const lines = (await app.inject({ url: `/v1/jobs/${id}/results` })).body.trim().split('\n');
    expect(lines.length).toBe(1);
    const direct = (await postJson(app, '/v1/orbit', { tle: PLOVER_TLE })).json();
    expect(JSON.stringify(JSON.parse(lines[0]!))).toContain(`"scenarioHash":"${direct.scenarioHash}"`);
  });
});
