// Catalogue orbits over HTTP: tle and omm inputs, the sgp4 model and the teme frame on /v1/track.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { inventedTle, PLOVER_TLE, withChecksum } from '../helpers/tle.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const GRID = { start: '2026-12-01T00:00:00Z', stop: '2026-12-01T01:00:00Z', step: 600 };

// Case 00005 of the SGP4 verification set and its printed TEME states (Vallado et al., AIAA
// 2006-6753, SGP4-VER.TLE and tcppver.out; test/fixtures/README.md). Its epoch, 2000 day
// 179.78495062, is 2000-06-27 18:50:19.733568 UTC.
const fixture = (name: string): string => readFileSync(new URL(`../fixtures/sgp4/${name}`, import.meta.url), 'utf8');
const VER = fixture('SGP4-VER.TLE').split('\n');
const CASE5 = { line1: VER.find((l) => l.startsWith('1 00005'))!.slice(0, 69), line2: VER.find((l) => l.startsWith('2 00005'))!.slice(0, 69) };
const OUT = fixture('tcppver.out').split('\n');
const rows5 = OUT.slice(OUT.findIndex((l) => l.trim() === '5 xx') + 1, OUT.findIndex((l) => l.trim() === '4632 xx')).map((l) => l.trim().split(/\s+/).map(Number));

describe('/v1/track with a two-line set', () => {
  it('frame teme answers the reference TEME states of verification case 00005 (JSON prints 1 um and 1e-9 km/s; within 1 mm, 1 mm/s)', async () => {
    const epoch0 = Date.UTC(2000, 5, 27, 18, 50, 19, 733) + 0.568; // ms
    const times = rows5.map((r) => {
      const ms = epoch0 + r[0]! * 60_000;
      const whole = Math.floor(ms);
      const sub = Math.round((ms - whole) * 1e6); // nanoseconds past the millisecond
      return `${new Date(whole).toISOString().slice(0, 23)}${String(sub).padStart(6, '0')}Z`;
    });
    const res = await postJson(app, '/v1/track', { tle: CASE5, grid: { times }, frame: 'teme' });
    expect(res.statusCode, res.body).toBe(200);
    const a = res.json();
    expect(a.model).toBe('sgp4');
    expect(a.frame).toBe('teme');
    a.samples.forEach((s: { position: number[]; velocity: number[] }, i: number) => {
      const r = rows5[i]!;
      expect(Math.hypot(s.position[0]! - r[1]!, s.position[1]! - r[2]!, s.position[2]! - r[3]!), `t = ${r[0]} min`).toBeLessThan(1e-6);
      expect(Math.hypot(s.velocity[0]! - r[4]!, s.velocity[1]! - r[5]!, s.velocity[2]! - r[6]!)).toBeLessThan(1e-6);
    });
  });

  it('sgp4 is the default model of a tle; two-body then starts from the SGP4 state at the element epoch', async () => {
    const sgp4 = (await postJson(app, '/v1/track', { tle: PLOVER_TLE, grid: GRID })).json();
    const kepler = (await postJson(app, '/v1/track', { tle: PLOVER_TLE, grid: GRID, model: 'two-body' })).json();
    expect(sgp4.model).toBe('sgp4');
    expect(kepler.model).toBe('two-body');
    expect(kepler.samples[0].position).toEqual(sgp4.samples[0].position);
    expect(kepler.samples[0].velocity).toEqual(sgp4.samples[0].velocity);
    // An hour on, J2 and the mean-to-osculating terms part them by kilometres, not metres.
    const d = Math.hypot(...[0, 1, 2].map((c) => kepler.samples[6].position[c] - sgp4.samples[6].position[c]));
    expect(d).toBeGreaterThan(1);
  });

  it('model sgp4 without a catalogue orbit, and a tle about another body, are 422', async () => {
    const state = { epoch: '2026-12-01T00:00:00Z', position: [7000, 0, 0], velocity: [0, 7.5, 0] };
    const a = await postJson(app, '/v1/track', { state, grid: GRID, model: 'sgp4' });
    expect(a.statusCode).toBe(422);
    expect(a.json().detail).toMatch(/tle or omm/);
    const b = await postJson(app, '/v1/track', { tle: PLOVER_TLE, grid: GRID, centralBody: 'mars' });
    expect(b.statusCode).toBe(422);
  });

  it('an SGP4 error ends the track with 422 sgp4-failed naming the epoch and the reason (verification case 28872, decayed)', async () => {
    const line1 = VER.find((l) => l.startsWith('1 28872'))!.slice(0, 69);
    const line2 = VER.find((l) => l.startsWith('2 28872'))!.slice(0, 69);
    // Epoch 2005 day 333.02012661 = 2005-11-29T00:28:58.939 UTC; the reference prints to 50 min.
    const res = await postJson(app, '/v1/track', { tle: { line1, line2 }, grid: { start: '2005-11-29T00:30:00Z', stop: '2005-11-29T01:30:00Z', step: 60 } });
    expect(res.statusCode, res.body).toBe(422);
    expect(res.json().type).toBe('/problems/sgp4-failed');
    expect(res.json().detail).toMatch(/^SGP4 stopped at 2005-11-29T01:\d\d:00\.000000Z \(.* min from the element epoch\): satellite has decayed/);
  });

  it('the printed TEME state of case 00005 at its epoch, given as a teme state, is the gcrf state of the set at that epoch (to 1 mm, 1 mm/s: the file prints 8 decimals)', async () => {
    const epoch = '2000-06-27T18:50:19.733568Z';
    const r0 = rows5.find((r) => r[0] === 0)!;
    const fromTle = (await postJson(app, '/v1/track', { tle: CASE5, grid: { times: [epoch] } })).json().samples[0];
    const res = await postJson(app, '/v1/track', { centralBody: 'earth', state: { epoch, frame: 'teme', position: r0.slice(1, 4), velocity: r0.slice(4, 7) }, grid: { times: [epoch] } });
    expect(res.statusCode, res.body).toBe(200);
    const s = res.json().samples[0];
    expect(Math.hypot(...[0, 1, 2].map((c) => s.position[c] - fromTle.position[c]))).toBeLessThan(1e-6);
    expect(Math.hypot(...[0, 1, 2].map((c) => s.velocity[c] - fromTle.velocity[c]))).toBeLessThan(1e-6);
    // ... and asked back in teme it is the state given.
    const back = (await postJson(app, '/v1/track', { centralBody: 'earth', state: { epoch, frame: 'teme', position: r0.slice(1, 4), velocity: r0.slice(4, 7) }, grid: { times: [epoch] }, frame: 'teme' })).json().samples[0];
    expect(Math.hypot(...[0, 1, 2].map((c) => back.position[c] - r0[1 + c]!))).toBeLessThan(1e-6);
  });
});

describe('malformed two-line sets: a clear 422 naming line, columns and expectation, never a 500', () => {
  const { line1, line2 } = PLOVER_TLE;
  const post = (tle: object) => postJson(app, '/v1/track', { tle, grid: GRID });
  const cases: Array<[string, object, RegExp]> = [
    ['wrong checksum', { line1: line1.slice(0, 68) + String((Number(line1[68]) + 1) % 10), line2 }, /^line 1 checksum: expected \d, found \d/],
    ['wrong line number', { line1: withChecksum(`3${line1.slice(1)}`), line2 }, /line 1 column 1 \(line number\): expected 1, found "3"/],
    ['lines swapped', { line1: line2, line2: line1 }, /line 1 column 1 \(line number\): expected 1, found "2"/],
    ['non-numeric inclination', { line1, line2: withChecksum(`${line2.slice(0, 8)} 97.6x00${line2.slice(16)}`) }, /line 2 columns 9-16 \(inclination\): expected degrees/],
    ['broken BSTAR exponent', { line1: withChecksum(`${line1.slice(0, 53)}-11606-x${line1.slice(61)}`), line2 }, /line 1 columns 54-61 \(BSTAR\): expected a sign or blank, 5 digits/],
    ['a line of 68 characters', { line1: line1.slice(0, 68), line2 }, /line 1: expected 69 characters, found 68/],
    ['a line of 70 characters', { line1, line2: `${line2} ` }, /line 2: expected 69 characters, found 70/],
    ['year 57 is 1957, before the supported range', { line1: withChecksum(`${line1.slice(0, 18)}57${line1.slice(20)}`), line2 }, /"57" is 1957 \(57-99 -> 1957-1999\)/],
    ['satellite numbers differ', { line1, line2: withChecksum(`2 99902${line2.slice(7)}`) }, /line 2 columns 3-7 \(satellite number\): expected "99901" as on line 1/],
    ['eccentricity with a decimal point', { line1, line2: withChecksum(`${line2.slice(0, 26)}.001200${line2.slice(33)}`) }, /line 2 columns 27-33 \(eccentricity\)/],
  ];
  for (const [what, tle, detail] of cases) {
    it(what, async () => {
      const res = await post(tle);
      expect(res.statusCode, res.body).toBe(422);
      expect(res.json().type).toBe('/problems/tle-malformed');
      expect(res.json().detail).toMatch(detail);
      expect(res.json().errors[0].path).toMatch(/^body\.tle\.line[12]$/);
    });
  }

  it('reads "-11606-4" in the BSTAR columns as -0.11606e-4, year 56 as 2056 and Alpha-5 numbers', async () => {
    const t = inventedTle({ satnum: 'A0001', year: 56, day: 100.5, bstar: '-11606-4', inclination: 51.6, raan: 10, eccentricity: 0.001, argPerigee: 0, meanAnomaly: 0, meanMotion: 15.5 });
    const res = await postJson(app, '/v1/orbit', { tle: t });
    expect(res.statusCode, res.body).toBe(200);
    const m = res.json().meanElements;
    expect(m.bstar).toBe(-0.11606e-4);
    expect(m.epoch).toBe('2056-04-09T12:00:00.000000Z');
    expect(m.catalogNumber).toBe(100_001); // A = 10 (Alpha-5)
  });

  it('a line that is not a string, or too long, is a 400 validation problem', async () => {
    expect((await post({ line1: 5, line2 })).statusCode).toBe(400);
    expect((await post({ line1: 'x'.repeat(500), line2 })).statusCode).toBe(400);
  });
});

describe('/v1/track with an OMM', () => {
  const kvn = [
    'CCSDS_OMM_VERS = 3.0',
    'CREATION_DATE = 2026-11-30T12:00:00',
    'ORIGINATOR = INVENTED',
    'OBJECT_NAME = PLOVER-7',
    'OBJECT_ID = 2026-900A',
    'CENTER_NAME = EARTH',
    'REF_FRAME = TEME',
    'TIME_SYSTEM = UTC',
    'MEAN_ELEMENT_THEORY = SGP4',
    'COMMENT invented spacecraft',
    'EPOCH = 2026-12-01T00:00:00.000000',
    'MEAN_MOTION = 15.20000000 [rev/day]',
    'ECCENTRICITY = 0.0012',
    'INCLINATION = 97.6 [deg]',
    'RA_OF_ASC_NODE = 40.0',
    'ARG_OF_PERICENTER = 90.0',
    'MEAN_ANOMALY = 10.0',
    'EPHEMERIS_TYPE = 0',
    'CLASSIFICATION_TYPE = U',
    'NORAD_CAT_ID = 99901',
    'ELEMENT_SET_NO = 999',
    'REV_AT_EPOCH = 123',
    'BSTAR = 0.12345E-4',
    'MEAN_MOTION_DOT = 0.00001234',
    'MEAN_MOTION_DDOT = 0.0',
  ].join('\n');
  const json = Object.fromEntries(kvn.split('\n').filter((l) => l.includes(' = ')).map((l) => { const [k, v] = l.split(' = ') as [string, string]; return [k, v.replace(/\s*\[.*\]$/, '')]; }));
  const xml = `<?xml version="1.0" encoding="UTF-8"?>
<omm id="CCSDS_OMM_VERS" version="3.0"><header><CREATION_DATE>2026-11-30T12:00:00</CREATION_DATE><ORIGINATOR>INVENTED</ORIGINATOR></header>
<body><segment><metadata><OBJECT_NAME>PLOVER-7</OBJECT_NAME><OBJECT_ID>2026-900A</OBJECT_ID><CENTER_NAME>EARTH</CENTER_NAME><REF_FRAME>TEME</REF_FRAME><TIME_SYSTEM>UTC</TIME_SYSTEM><MEAN_ELEMENT_THEORY>SGP4</MEAN_ELEMENT_THEORY></metadata>
<data><meanElements><EPOCH>2026-12-01T00:00:00.000000</EPOCH><MEAN_MOTION units="rev/day">15.2</MEAN_MOTION><ECCENTRICITY>0.0012</ECCENTRICITY><INCLINATION units="deg">97.6</INCLINATION><RA_OF_ASC_NODE>40</RA_OF_ASC_NODE><ARG_OF_PERICENTER>90</ARG_OF_PERICENTER><MEAN_ANOMALY>10</MEAN_ANOMALY></meanElements>
<tleParameters><EPHEMERIS_TYPE>0</EPHEMERIS_TYPE><CLASSIFICATION_TYPE>U</CLASSIFICATION_TYPE><NORAD_CAT_ID>99901</NORAD_CAT_ID><ELEMENT_SET_NO>999</ELEMENT_SET_NO><REV_AT_EPOCH>123</REV_AT_EPOCH><BSTAR>0.12345E-4</BSTAR><MEAN_MOTION_DOT>0.00001234</MEAN_MOTION_DOT><MEAN_MOTION_DDOT>0</MEAN_MOTION_DDOT></tleParameters></data></segment></body></omm>`;

  it('KVN, XML and JSON forms of the same elements answer the track of the equivalent two-line set (to 1 mm)', async () => {
    const want = (await postJson(app, '/v1/track', { tle: PLOVER_TLE, grid: GRID, frame: 'teme' })).json();
    for (const omm of [kvn, xml, json]) {
      const res = await postJson(app, '/v1/track', { omm, grid: GRID, frame: 'teme' });
      expect(res.statusCode, res.body).toBe(200);
      const got = res.json();
      expect(got.model).toBe('sgp4');
      got.samples.forEach((s: { position: number[] }, i: number) => {
        expect(Math.hypot(...[0, 1, 2].map((c) => s.position[c]! - want.samples[i].position[c]))).toBeLessThan(1e-6);
      });
    }
  });

  it('refuses SGP and SGP4-XP elements, other frames and time systems by name (422 omm-unsupported)', async () => {
    for (const [key, value] of [['MEAN_ELEMENT_THEORY', 'SGP4-XP'], ['MEAN_ELEMENT_THEORY', 'SGP'], ['REF_FRAME', 'GCRF'], ['TIME_SYSTEM', 'TAI']] as const) {
      const res = await postJson(app, '/v1/track', { omm: { ...json, [key]: value }, grid: GRID });
      expect(res.statusCode, res.body).toBe(422);
      expect(res.json().type).toBe('/problems/omm-unsupported');
      expect(res.json().detail).toContain(value);
    }
  });

  it('malformed OMMs are 422 omm-malformed naming the line or keyword', async () => {
    const cases: Array<[unknown, RegExp]> = [
      [kvn.replace('ECCENTRICITY = 0.0012', 'ECCENTRICITY = zero'), /ECCENTRICITY: expected a number from 0 to 1/],
      [kvn.replace('MEAN_MOTION = 15.20000000 [rev/day]', ''), /MEAN_MOTION is missing/],
      [`${kvn}\nthis is not a keyword line`, /line 26: expected "KEYWORD = value"/],
      [`${kvn}\nEPOCH = 2026-12-02T00:00:00`, /EPOCH given a second time/],
      [xml.replace('</omm>', ''), /not well-formed XML/],
      [{ ...json, EPOCH: '2026-13-01T00:00:00' }, /EPOCH/],
    ];
    for (const [omm, detail] of cases) {
      const res = await postJson(app, '/v1/track', { omm, grid: GRID });
      expect(res.statusCode, res.body).toBe(422);
      expect(res.json().type).toBe('/problems/omm-malformed');
      expect(res.json().detail).toMatch(detail);
    }
  });
});

describe('/v1/orbit with a catalogue orbit', () => {
  it('answers the mean elements as given, the osculating state at the epoch (the track\'s first gcrf sample) and the age at ageAt', async () => {
    const res = await postJson(app, '/v1/orbit', { tle: { ...PLOVER_TLE, name: 'PLOVER-7' }, ageAt: '2026-12-03T12:00:00Z' });
    expect(res.statusCode, res.body).toBe(200);
    const a = res.json();
    const m = a.meanElements;
    // As written in the invented set (test/helpers/tle.ts): 15.2 rev/day = 15.2 x 360 / 86400 deg/s.
    expect(m).toMatchObject({ format: 'tle', theory: 'SGP4', name: 'PLOVER-7', catalogNumber: 99901, epoch: '2026-12-01T00:00:00.000000Z', revolutionsPerDay: 15.2, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, meanAnomaly: 10, bstar: 0.12345e-4, regime: 'near-earth' });
    expect(m.meanMotion).toBeCloseTo((15.2 * 360) / 86_400, 15);
    // Kozai mean motion 15.2 rev/day -> a = (mu / n^2)^(1/3) with mu = 398600.8 (WGS-72) is ~6936 km;
    // Brouwer's un-Kozai'd value differs by the J2 term, a few km (Vallado et al. 2006, initl).
    expect(Math.abs(m.semiMajorAxis - (398_600.8 / ((15.2 * 2 * Math.PI) / 86_400) ** 2) ** (1 / 3))).toBeLessThan(15);
    expect(a.elementSetAge).toEqual({ at: '2026-12-03T12:00:00.000000Z', days: 2.5 });
    const track = (await postJson(app, '/v1/track', { tle: PLOVER_TLE, grid: { times: ['2026-12-01T00:00:00Z'] } })).json();
    for (let c = 0; c < 3; c++) expect(a.state.position[c]).toBeCloseTo(track.samples[0].position[c], 5);
    // Osculating, not mean: the osculating eccentricity differs from the mean one.
    expect(a.elements.eccentricity).not.toBe(0.0012);
    expect(a.epoch).toBe('2026-12-01T00:00:00.000000Z');
  });

  it('ageAt without a catalogue orbit is a 400', async () => {
    const res = await postJson(app, '/v1/orbit', { elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 7000, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 0 }, ageAt: '2026-12-02T00:00:00Z' });
    expect(res.statusCode).toBe(400);
  });
});
