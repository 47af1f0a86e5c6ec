// EOP_FILE over HTTP: the IERS finals2000A excerpt of test/fixtures (Bulletin A columns, IERS Rapid
// Service / Prediction Centre) as the service's table; GCRF -> ITRF through the service against the
// IAU 2006/2000A transformation computed independently with ERFA (test/fixtures/erfa-gcrs-itrs.json,
// scripts/erfa-reference.py, which reads and interpolates the same excerpt itself), the request's
// ut1MinusUtc winning, epochs outside the table, the table in the scenario hash, /readyz, reloads,
// and the worker threads.
import { copyFileSync, mkdtempSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { buildApp } from '../../src/app.js';

const FINALS = new URL('../fixtures/finals2000A-2025-2027.txt', import.meta.url).pathname;
interface Case { utc: string; eop: boolean; ut1MinusUtc: number; gcrsToItrs: number[] }
const CASES = (JSON.parse(readFileSync(new URL('../fixtures/erfa-gcrs-itrs.json', import.meta.url), 'utf8')) as { cases: Case[] }).cases;

let plain: FastifyInstance;
let withTable: FastifyInstance;
beforeAll(async () => {
  plain = await testApp();
  withTable = await testApp({ config: { EOP_FILE: FINALS } });
});
afterAll(async () => { await Promise.all([plain.close(), withTable.close()]); });

// Invented directions of a LEO (7000 km) and a GEO (42164 km) position; velocities plausible, unused by the check.
const POSITIONS: [string, number[], number[]][] = [
  ['LEO', [4200, -3900, 3800].map((x) => x * 7000 / Math.hypot(4200, 3900, 3800)), [4.1, 5.2, -3.0]],
  ['GEO', [30_000, 29_000, 1200].map((x) => x * 42_164 / Math.hypot(30_000, 29_000, 1200)), [-2.1, 2.2, 0.01]],
];
const itrfAt = async (app: FastifyInstance, utc: string, r: number[], v: number[], extra: object = {}) => {
  const res = await postJson(app, '/v1/track', { centralBody: 'earth', state: { epoch: utc, position: r, velocity: v }, grid: { times: [utc] }, frame: 'itrf', ...extra });
  expect(res.statusCode, res.body).toBe(200);
  return res.json();
};
const times = (m: number[], r: number[]): number[] => [0, 1, 2].map((i) => m[3 * i]! * r[0]! + m[3 * i + 1]! * r[1]! + m[3 * i + 2]! * r[2]!);
const dist = (a: readonly number[], b: readonly number[]): number => Math.hypot(a[0]! - b[0]!, a[1]! - b[1]!, a[2]! - b[2]!);

describe('GCRF -> ITRF through the service against IAU 2006/2000A (ERFA)', () => {
  it.each(CASES.filter((c) => c.eop))('with EOP_FILE (the finals2000A excerpt) at $utc: within 0.1 m at LEO and 0.5 m at GEO', async (c) => {
    for (const [orbit, r, v] of POSITIONS) {
      const a = await itrfAt(withTable, c.utc, r, v);
      const d = dist(a.samples[0].position, times(c.gcrsToItrs, r)) * 1000;
      expect(d, orbit).toBeLessThan(orbit === 'LEO' ? 0.1 : 0.5);
      expect(a.diagnostics.earthOrientation).toMatchObject({ source: 'EOP_FILE', ut1MinusUtc: 'table', outsideTable: false });
    }
  });

  it.each(CASES.filter((c) => !c.eop))('without EOP_FILE (UT1 = UTC, no polar motion) at $utc: within 0.1 m at LEO and 0.5 m at GEO, and no diagnostics', async (c) => {
    for (const [orbit, r, v] of POSITIONS) {
      const a = await itrfAt(plain, c.utc, r, v);
      expect(dist(a.samples[0].position, times(c.gcrsToItrs, r)) * 1000, orbit).toBeLessThan(orbit === 'LEO' ? 0.1 : 0.5);
      expect(a.diagnostics.earthOrientation).toBeUndefined();
    }
  });

  it('the table matters: without it a GEO position at 2026-03-01 is metres off the reference with the table (polar motion ~0.1-0.4")', async () => {
    const c = CASES.find((x) => x.eop && x.utc.startsWith('2026-03-01'))!;
    const [, r, v] = POSITIONS[1]!;
    const a = await itrfAt(plain, c.utc, r, v);
    expect(dist(a.samples[0].position, times(c.gcrsToItrs, r)) * 1000).toBeGreaterThan(5);
  });
});

describe('which value wins, and epochs outside the table', () => {
  const [, r, v] = POSITIONS[0]!;
  const utc = '2026-08-26T06:00:00Z';
  it('a request\'s ut1MinusUtc wins over the table for UT1 (polar motion still from the table)', async () => {
    const c = CASES.find((x) => x.utc === utc)!;
    const same = await itrfAt(withTable, utc, r, v, { ut1MinusUtc: c.ut1MinusUtc });
    const table = await itrfAt(withTable, utc, r, v);
    expect(same.diagnostics.earthOrientation.ut1MinusUtc).toBe('request');
    expect(dist(same.samples[0].position, table.samples[0].position)).toBeLessThan(2e-6);
    // 0.5 s more of UT1 turns the Earth by 7.29e-5 rad/s x 0.5 s: ~0.25 km at this radius off the pole.
    const other = await itrfAt(withTable, utc, r, v, { ut1MinusUtc: c.ut1MinusUtc + 0.5 });
    expect(dist(other.samples[0].position, table.samples[0].position)).toBeGreaterThan(0.15);
  });

  it('with the table, Vallado 4th ed. Ex. 3-3 (from memory: r = (6524.834, 6862.875, 6448.296) km -> 34.352496 deg, 46.446417 deg, 5085.22 km) given as an itrf state comes back in geodetic, and itrf -> gcrf -> itrf to 1 mm', async () => {
    const r3 = [6524.834, 6862.875, 6448.296];
    const state = { epoch: utc, frame: 'itrf', position: r3, velocity: [-1.2, 2.5, 3.1] };
    const g = (await postJson(withTable, '/v1/track', { centralBody: 'earth', state, grid: { times: [utc] }, frame: 'geodetic' })).json();
    expect(Math.abs(g.samples[0].latitude - 34.352496)).toBeLessThan(1e-6);
    expect(Math.abs(g.samples[0].longitude - 46.446417)).toBeLessThan(1e-6);
    expect(Math.abs(g.samples[0].height - 5085.22)).toBeLessThan(0.005);
    expect(g.diagnostics.earthOrientation.outsideTable).toBe(false);
    const back = (await postJson(withTable, '/v1/track', { centralBody: 'earth', state, grid: { times: [utc] }, frame: 'itrf' })).json();
    expect(dist(back.samples[0].position, r3)).toBeLessThan(1e-6);
    // The inertial state differs from the no-table one: the table entered the conversion.
    const [a, b] = await Promise.all([withTable, plain].map(async (app) => (await postJson(app, '/v1/orbit', { centralBody: 'earth', state })).json()));
    expect(dist(a.state.position, b.state.position)).toBeGreaterThan(1e-3);
    expect(a.diagnostics.earthOrientation.source).toBe('EOP_FILE');
    expect(b.diagnostics).toBeUndefined();
  });

  it('epochs outside the table: UT1-UTC, polar motion and dX, dY 0, with a warning in the diagnostics (never silently)', async () => {
    const out = await itrfAt(withTable, '2030-01-01T00:00:00Z', r, v);
    const none = await itrfAt(plain, '2030-01-01T00:00:00Z', r, v);
    expect(out.samples[0].position).toEqual(none.samples[0].position);
    const d = out.diagnostics.earthOrientation;
    expect(d.outsideTable).toBe(true);
    expect(d.warning).toMatch(/outside the EOP table \(2025-01-01 to 2027-/);
    expect(d.warning).toMatch(/UT1-UTC are taken as 0/);
  });

  it('passes and eclipses carry the table in their diagnostics; passes move by milliseconds with it', async () => {
    const req = {
      centralBody: 'earth', elements: { epoch: '2026-08-26T00:00:00Z', semiMajorAxis: 6878.137, eccentricity: 0.001, inclination: 97.4, raan: 30, argPeriapsis: 0, trueAnomaly: 0 },
      window: { start: '2026-08-26T00:00:00Z', stop: '2026-08-27T00:00:00Z' },
      stations: [{ id: 'fjell-north', latitude: 69.6, longitude: 18.9, altitude: 0.1, minElevation: 5 }],
    };
    const a = (await postJson(withTable, '/v1/passes', req)).json();
    const b = (await postJson(plain, '/v1/passes', req)).json();
    expect(a.diagnostics.earthOrientation.predicted).toBe(false);
    expect(b.diagnostics).toBeUndefined();
    expect(a.passes.length).toBe(b.passes.length);
    const shift = Math.max(...a.passes.map((p: { aos: string }, i: number) => Math.abs(Date.parse(p.aos) - Date.parse(b.passes[i].aos))));
    expect(shift).toBeLessThan(200); // UT1-UTC 0.007 s and ~0.2" of pole: metres on the ground
    const e = (await postJson(withTable, '/v1/eclipses', { centralBody: 'earth', elements: req.elements, window: req.window })).json();
    expect(e.diagnostics.earthOrientation.source).toBe('EOP_FILE');
  });
});

describe('the table in the scenario hash, /readyz, reloads and worker threads', () => {
  let dir: string;
  beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'apsides-eop-')); });
  afterAll(() => { rmSync(dir, { recursive: true, force: true }); });
  const req = { centralBody: 'earth', state: { epoch: '2026-03-01T00:00:00Z', position: [7000, 0, 0], velocity: [0, 7.5, 0] }, grid: { times: ['2026-03-01T00:00:00Z'] }, frame: 'itrf' };

  it('a different table gives a different scenario hash (and answer); no table keeps the hash of today', async () => {
    const file = join(dir, 'other.txt');
    // The same excerpt with the pole of 2026-03-01 moved by 0.1" (bytes 19-27 of that row).
    const lines = readFileSync(FINALS, 'utf8').split('\n').map((l) => (Number(l.slice(7, 15)) === 61100 ? `${l.slice(0, 18)}${(Number(l.slice(18, 27)) + 0.1).toFixed(6).padStart(9)}${l.slice(27)}` : l));
    writeFileSync(file, lines.join('\n'));
    const other = await testApp({ config: { EOP_FILE: file } });
    try {
      const [p, t, o] = await Promise.all([plain, withTable, other].map((app) => postJson(app, '/v1/track', req)));
      const hashes = [p, t, o].map((x) => x!.json().scenarioHash);
      expect(new Set(hashes).size).toBe(3);
      expect(dist(t!.json().samples[0].position, o!.json().samples[0].position)).toBeGreaterThan(1e-3);
      expect(p!.json().diagnostics.earthOrientation).toBeUndefined();
    } finally {
      await other.close();
    }
  });

  it('/readyz reports the table\'s last observed and predicted dates; none without EOP_FILE', async () => {
    const r = (await withTable.inject('/readyz')).json();
    expect(r.status).toBe('ok');
    expect(r.earthOrientation).toMatchObject({ file: FINALS, firstDate: '2025-01-01', lastObservedDate: '2026-09-17', lastReloadError: null });
    expect(r.earthOrientation.lastPredictedDate).toMatch(/^2027-/);
    expect((await plain.inject('/readyz')).json().earthOrientation).toBeUndefined();
  });

  it('reloads without a restart (reload(), and a changed modification time), keeps the old table when the new file is bad, and never serves an answer of the old table', async () => {
    const file = join(dir, 'live.txt');
    copyFileSync(FINALS, file);
    const app = await testApp({ config: { EOP_FILE: file, EOP_CHECK_INTERVAL_S: 1 } });
    try {
      const first = await postJson(app, '/v1/track', req);
      const again = await postJson(app, '/v1/track', req);
      expect(again.headers['x-cache']).toBe('hit');
      // A shorter table (the first 500 rows): picked up by the periodic check.
      writeFileSync(file, readFileSync(FINALS, 'utf8').split('\n').slice(0, 500).join('\n'));
      utimesSync(file, new Date(), new Date(Date.now() + 5000));
      const deadline = Date.now() + 15_000;
      let ready = (await app.inject('/readyz')).json();
      while (ready.earthOrientation.days !== 500 && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 200));
        ready = (await app.inject('/readyz')).json();
      }
      expect(ready.earthOrientation.days).toBe(500);
      const after = await postJson(app, '/v1/track', req);
      expect(after.json().scenarioHash).not.toBe(first.json().scenarioHash);
      expect(after.headers['x-cache']).toBe('miss');
      // A bad file: the table in force stays, /readyz says why.
      writeFileSync(file, 'not a finals2000A file\n');
      expect(await app.eop.reload()).toBe(false);
      ready = (await app.inject('/readyz')).json();
      expect(ready.earthOrientation.days).toBe(500);
      expect(ready.earthOrientation.lastReloadError).toMatch(/line 1/);
      expect((await postJson(app, '/v1/track', req)).json().scenarioHash).toBe(after.json().scenarioHash);
    } finally {
      await app.close();
    }
  });

  it('a bad EOP_FILE stops the start with a message naming the file and the line', async () => {
    const file = join(dir, 'bad.txt');
    writeFileSync(file, readFileSync(FINALS, 'utf8').split('\n').map((l, i) => (i === 3 ? `${l.slice(0, 7)}99999.00${l.slice(15)}` : l)).join('\n'));
    await expect(buildApp({ logger: false, config: { EOP_FILE: file } })).rejects.toThrow(/EOP_FILE .*bad\.txt.*line 4/);
    await expect(buildApp({ logger: false, config: { EOP_FILE: join(dir, 'missing.txt') } })).rejects.toThrow(/EOP_FILE/);
  });

  it('worker threads get the same table: a long Earth-fixed track (on a thread) agrees with a short one (inline) at the same epochs', async () => {
    const long = { ...req, grid: { start: '2026-03-01T00:00:00Z', stop: '2026-03-02T00:00:00Z', step: 20 } };
    const short = { ...req, grid: { times: ['2026-03-01T06:00:00Z', '2026-03-01T18:00:00Z'] } };
    const a = (await postJson(withTable, '/v1/track', long)).json();
    const b = (await postJson(withTable, '/v1/track', short)).json();
    expect(withTable.pool.stats().completed).toBeGreaterThan(0);
    for (const [k, i] of [[0, 6 * 180], [1, 18 * 180]] as const) {
      expect(a.samples[i].epoch).toBe(b.samples[k].epoch);
      expect(dist(a.samples[i].position, b.samples[k].position)).toBeLessThan(2e-6);
    }
    const none = (await postJson(plain, '/v1/track', short)).json();
    expect(dist(none.samples[0].position, b.samples[0].position)).toBeGreaterThan(1e-3);
  });
});
