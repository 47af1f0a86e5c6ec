import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';
import { parseOemKvn } from '../helpers/oem-kvn.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp({ config: { MAX_TRACK_SAMPLES: 5000 } }); });
afterAll(async () => { await app.close(); });

// Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Example 2-4 (from memory):
// 40 min after r = (1131.340, -2282.343, 6672.423) km, v = (-5.64305, 4.30333, 2.42879) km/s,
// r = (-4219.7527, 4363.0292, -3958.7666) km, v = (3.689866, -1.916735, -6.112511) km/s (mu = 398600.4418).
const vallado = {
  centralBody: { name: 'earth', gm: 398600.4418, radius: 6378.137 },
  state: { epoch: EPOCH, position: [1131.34, -2282.343, 6672.423], velocity: [-5.64305, 4.30333, 2.42879] },
};
const demo = { ...DEMO_ORBIT, object: { name: 'PLOVER-7', id: '2026-900A' } };

describe('POST /v1/track', () => {
  it('reproduces Vallado Example 2-4 forty minutes on (JSON), with conservation diagnostics near machine precision', async () => {
    const res = await postJson(app, '/v1/track', { ...vallado, grid: { times: [EPOCH, '2026-12-01T00:40:00Z'] } });
    expect(res.statusCode, res.body).toBe(200);
    const answer = res.json();
    expect(answer.sampleCount).toBe(2);
    const last = answer.samples[1];
    expect(last.epoch).toBe('2026-12-01T00:40:00.000000Z');
    const wantR = [-4219.7527, 4363.0292, -3958.7666];
    const wantV = [3.689866, -1.916735, -6.112511];
    for (let c = 0; c < 3; c++) {
      expectClose(last.position[c], wantR[c]!, 1e-3, `r[${c}]`); // printed to 0.1 m; the answer prints 1 mm
      expectClose(last.velocity[c], wantV[c]!, 1e-6, `v[${c}]`);
    }
    expect(answer.diagnostics.energyRelativeDrift).toBeLessThan(1e-12);
    expect(answer.diagnostics.angularMomentumRelativeDrift).toBeLessThan(1e-12);
  });

  it('the first sample of a grid starting at the epoch is the /v1/orbit state', async () => {
    const orbit = (await postJson(app, '/v1/orbit', { centralBody: demo.centralBody, elements: demo.elements })).json();
    const trk = (await postJson(app, '/v1/track', { ...demo, grid: { start: EPOCH, stop: '2026-12-01T00:10:00Z', step: 60 } })).json();
    expect(trk.sampleCount).toBe(11);
    for (let c = 0; c < 3; c++) {
      expectClose(trk.samples[0].position[c], orbit.state.position[c], 5e-7, 'position');
      expectClose(trk.samples[0].velocity[c], orbit.state.velocity[c], 5e-10, 'velocity');
    }
  });

  it('a grid ends exactly at stop and may run backwards', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, grid: { start: '2026-12-01T00:10:00Z', stop: EPOCH, step: 240 } });
    const epochs = res.json().samples.map((s: { epoch: string }) => s.epoch);
    expect(epochs).toEqual(['2026-12-01T00:10:00.000000Z', '2026-12-01T00:06:00.000000Z', '2026-12-01T00:02:00.000000Z', '2026-12-01T00:00:00.000000Z']);
  });

  it('CSV is RFC 4180 with a header row naming units and CRLF line ends; Accept chooses it', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, grid: { start: EPOCH, stop: '2026-12-01T00:05:00Z', step: 60 } }, { accept: 'text/csv' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const lines = res.body.split('\r\n');
    expect(lines[0]).toBe('epoch_utc,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s');
    expect(lines).toHaveLength(1 + 6 + 1); // header, 6 records, empty after the final CRLF
    expect(lines[1]!.split(',')).toHaveLength(7);
  });

  it('the CCSDS OEM parses back to the same numbers as the JSON answer', async () => {
    const grid = { times: ['2026-12-01T00:03:00Z', EPOCH, '2026-12-01T00:01:30.5Z'] };
    const json = (await postJson(app, '/v1/track', { ...demo, grid })).json();
    const res = await postJson(app, '/v1/track', { ...demo, grid, format: 'oem' });
    expect(res.statusCode).toBe(200);
    const oem = parseOemKvn(res.body);
    expect(oem.header.CCSDS_OEM_VERS).toBe('3.0');
    const seg = oem.segments[0]!;
    expect(seg.meta).toMatchObject({ OBJECT_NAME: 'PLOVER-7', OBJECT_ID: '2026-900A', CENTER_NAME: 'EARTH', REF_FRAME: 'GCRF', TIME_SYSTEM: 'UTC' });
    // The OEM is in increasing time order; the JSON keeps the order asked for.
    expect(seg.epochs).toEqual(['2026-12-01T00:00:00.000000', '2026-12-01T00:01:30.500000', '2026-12-01T00:03:00.000000']);
    const byEpoch = new Map(json.samples.map((s: { epoch: string; position: number[]; velocity: number[] }) => [s.epoch.slice(0, -1), [...s.position, ...s.velocity]]));
    seg.epochs.forEach((epoch, i) => expect(seg.states.slice(6 * i, 6 * i + 6)).toEqual(byEpoch.get(epoch)));
  });

  it('the same scenario is served from the cache byte for byte, and If-None-Match answers 304', async () => {
    const body = { ...demo, grid: { start: EPOCH, stop: '2026-12-01T01:00:00Z', step: 10 }, format: 'csv' };
    const first = await postJson(app, '/v1/track', body);
    const second = await postJson(app, '/v1/track', body);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    const notModified = await postJson(app, '/v1/track', body, { 'if-none-match': String(first.headers.etag) });
    expect(notModified.statusCode).toBe(304);
    // The format is part of the scenario: the JSON of the same grid has another hash.
    const asJson = await postJson(app, '/v1/track', { ...body, format: 'json' });
    expect(asJson.headers.etag).not.toBe(first.headers.etag);
  });

  it('more samples than the maximum answer 422 naming the maximum', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, grid: { start: EPOCH, stop: '2026-12-02T00:00:00Z', step: 1 } });
    expect(res.statusCode).toBe(422);
    expect(res.json().type).toBe('/problems/too-many-samples');
    expect(res.json().detail).toMatch(/maximum is 5000/);
  });

  it('an Accept header that admits no format answers 406', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, grid: { times: [EPOCH] } }, { accept: 'image/png' });
    expect(res.statusCode).toBe(406);
    expect(res.json().type).toBe('/problems/not-acceptable');
  });

  it('a trajectory that meets the body is refused unless passThroughBody is set, even when no sample is below the surface', async () => {
    // a = 8000 km, e = 0.25: periapsis radius 6000 km < 6378.137 km. At nu = -60 deg, r = 6667 km and the
    // periapsis passage is about 742 s ahead (Kepler's equation by hand; common practice, no source).
    const falling = { centralBody: 'earth', elements: { epoch: EPOCH, semiMajorAxis: 8000, eccentricity: 0.25, inclination: 30, raan: 0, argPeriapsis: 0, trueAnomaly: -60 } };
    const early = await postJson(app, '/v1/track', { ...falling, grid: { start: EPOCH, stop: '2026-12-01T00:02:00Z', step: 60 } });
    expect(early.statusCode, 'still above the surface for two minutes').toBe(200);
    // Two samples symmetric about periapsis, both at 6667 km: the dip between them is found all the same.
    const across = { ...falling, grid: { times: [EPOCH, '2026-12-01T00:24:44Z'] } };
    const refused = await postJson(app, '/v1/track', across);
    expect(refused.statusCode).toBe(422);
    expect(refused.json().type).toBe('/problems/impact');
    const allowed = await postJson(app, '/v1/track', { ...across, passThroughBody: true });
    expect(allowed.statusCode).toBe(200);
    const radii = allowed.json().samples.map((x: { position: number[] }) => Math.hypot(...x.position));
    for (const r of radii) expect(r).toBeGreaterThan(6378.137);
  });

  it('a grid that is neither regular nor a list is a 400 naming the rule', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, grid: { start: EPOCH, step: 60 } });
    expect(res.statusCode).toBe(400);
    expect(res.json().detail).toMatch(/start, stop and step/);
  });
});

describe('POST /v1/track in Earth-fixed frames', () => {
  const grid = { start: EPOCH, stop: '2026-12-01T01:40:00Z', step: 300 };

  it('itrf is a rotation of gcrf: same radius at every sample, different components', async () => {
    const gcrf = (await postJson(app, '/v1/track', { ...demo, grid })).json();
    const itrf = (await postJson(app, '/v1/track', { ...demo, grid, frame: 'itrf' })).json();
    expect(itrf.frame).toBe('itrf');
    gcrf.samples.forEach((s: { position: number[] }, i: number) => {
      expectClose(Math.hypot(...itrf.samples[i].position), Math.hypot(...s.position), 2e-6, `radius ${i}`);
    });
    expect(Math.abs(itrf.samples[0].position[0] - gcrf.samples[0].position[0])).toBeGreaterThan(100);
  });

  it('geodetic samples map back onto the itrf positions through the WGS-84 ellipsoid formulas', async () => {
    const itrf = (await postJson(app, '/v1/track', { ...demo, grid, frame: 'itrf' })).json();
    const geo = (await postJson(app, '/v1/track', { ...demo, grid, frame: 'geodetic' })).json();
    // x = (N + h) cos(lat) cos(lon), y = (N + h) cos(lat) sin(lon), z = (N (1 - e^2) + h) sin(lat),
    // N = a / sqrt(1 - e^2 sin^2 lat); WGS-84 a = 6378.137 km, 1/f = 298.257223563
    // (Vallado 4th ed. eq. 3-14 and NIMA TR8350.2 Table 3.1; from memory).
    const a = 6378.137;
    const f = 1 / 298.257223563;
    const e2 = f * (2 - f);
    geo.samples.forEach((s: { latitude: number; longitude: number; height: number }, i: number) => {
      const lat = (s.latitude * Math.PI) / 180;
      const lon = (s.longitude * Math.PI) / 180;
      const n = a / Math.sqrt(1 - e2 * Math.sin(lat) ** 2);
      const xyz = [(n + s.height) * Math.cos(lat) * Math.cos(lon), (n + s.height) * Math.cos(lat) * Math.sin(lon), (n * (1 - e2) + s.height) * Math.sin(lat)];
      // 7 decimals of a degree is ~1 cm on the ground.
      for (let c = 0; c < 3; c++) expectClose(xyz[c]!, itrf.samples[i].position[c], 3e-5, `sample ${i} axis ${c}`);
    });
  });

  it('GeoJSON is an RFC 7946 FeatureCollection whose lines never jump across the antimeridian', async () => {
    const res = await postJson(app, '/v1/track', { ...demo, grid: { ...grid, step: 60 } }, { accept: 'application/geo+json' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/geo\+json/);
    const doc = res.json();
    expect(doc.type).toBe('FeatureCollection');
    const geometry = doc.features[0].geometry;
    const lines: number[][][] = geometry.type === 'LineString' ? [geometry.coordinates] : geometry.coordinates;
    expect(geometry.type).toBe('MultiLineString'); // a polar orbit crosses the antimeridian within 100 min
    for (const line of lines) {
      for (let i = 1; i < line.length; i++) expect(Math.abs(line[i]![0]! - line[i - 1]![0]!)).toBeLessThan(180);
      for (const [lon, lat] of line) {
        expect(Math.abs(lon!)).toBeLessThanOrEqual(180);
        expect(Math.abs(lat!)).toBeLessThanOrEqual(90);
      }
    }
  });

  it('Earth-fixed output for another body, and an OEM of geodetic samples, answer 422', async () => {
    const mars = await postJson(app, '/v1/track', { ...demo, centralBody: 'mars', elements: { ...demo.elements, semiMajorAxis: 4000 }, grid, frame: 'geodetic' });
    expect(mars.statusCode).toBe(422);
    expect(mars.json().type).toBe('/problems/unsupported-frame');
    const oem = await postJson(app, '/v1/track', { ...demo, grid, frame: 'geodetic', format: 'oem' });
    expect(oem.statusCode).toBe(422);
  });
});

describe('POST /v1/track diagnostics: the conserved quantity of the model', () => {
  const day = { grid: { start: EPOCH, stop: '2026-12-02T00:00:00Z', step: 600 } };
  it('numerical J2 reports the J2 energy integral at integration error (the two-body energy it printed before swung by ~1e-3), drag reports none', async () => {
    const j2 = (await postJson(app, '/v1/track', { ...demo, ...day, model: 'numerical', forces: [{ kind: 'j2' }] })).json();
    expect(j2.diagnostics.conservedQuantity).toBe('j2');
    expect(j2.diagnostics.energyRelativeDrift).toBeLessThan(1e-9);
    expect(j2.diagnostics.meaning).toMatch(/integration error/);
    const drag = (await postJson(app, '/v1/track', { ...demo, ...day, model: 'numerical', forces: [{ kind: 'j2' }, { kind: 'drag', ballisticCoefficient: 100 }] })).json();
    expect(drag.diagnostics).toMatchObject({ conservedQuantity: 'none', energyRelativeDrift: null, energyDriftVsPotential: null, angularMomentumRelativeDrift: null });
    expect(drag.diagnostics.meaning).toMatch(/drag/);
    const kepler = (await postJson(app, '/v1/track', { ...demo, ...day })).json();
    expect(kepler.diagnostics.conservedQuantity).toBe('two-body');
  });
});
