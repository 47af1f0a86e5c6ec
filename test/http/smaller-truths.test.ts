import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { parseOemKvn } from '../helpers/oem-kvn.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

// Smaller truths of issue 11 part 6: derived sums at their meaningful precision, one unit per
// angular rate, the OEM's CREATION_DATE from the request.
let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

describe('two-body totalMass', () => {
  it('is m1 + m2 at 15 significant digits: 5.2e11 kg + 3.1e9 kg prints 523100000000 (not 523100000000.00006)', async () => {
    const res = await postJson(app, '/v1/two-body', {
      epoch: EPOCH,
      bodies: [
        { name: 'Tamsin', mass: 5.2e11, position: [0, 0, 0], velocity: [0, 0, 0] },
        { name: 'Tamsin I', mass: 3.1e9, position: [1.2, 0, 0], velocity: [0, 0.00017, 0] },
      ],
    });
    expect(res.statusCode, res.body).toBe(200);
    expect(res.body).toContain('"totalMass":523100000000,');
    expect(res.json().totalMass).toBe(5.231e11);
  });
});

describe('custom bodies take their rotation rate in deg/day, as the answers print it', () => {
  it('rotationRateDegPerDay is read and echoed; the old deg/s rotationRate is an unknown key', async () => {
    const body = { gm: 42_828.375816, radius: 3396.19, rotationRateDegPerDay: 350.89198226 };
    const res = await postJson(app, '/v1/orbit', { centralBody: body, elements: { ...DEMO_ORBIT.elements, semiMajorAxis: 4000 } });
    expect(res.statusCode, res.body).toBe(200);
    expect(res.json().centralBody.rotationRateDegPerDay).toBe(350.89198226);
    const old = await postJson(app, '/v1/orbit', { centralBody: { gm: 42_828.375816, rotationRate: 0.004 }, elements: { ...DEMO_ORBIT.elements, semiMajorAxis: 4000 } });
    expect(old.statusCode).toBe(400);
  });
});

describe('OEM CREATION_DATE', () => {
  const track = { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:10:00Z', step: 300 }, format: 'oem' };
  it('is the creationDate of the request when given (part of the scenario), the initial epoch otherwise; bytes repeat', async () => {
    const plain = await postJson(app, '/v1/track', track);
    const again = await postJson(app, '/v1/track', track);
    expect(plain.statusCode, plain.body).toBe(200);
    expect(again.body).toBe(plain.body);
    expect(parseOemKvn(plain.body).header.CREATION_DATE).toBe('2026-12-01T00:00:00.000000');
    const dated = await postJson(app, '/v1/track', { ...track, creationDate: '2026-12-02T09:15:30.5+01:00' });
    expect(dated.statusCode, dated.body).toBe(200);
    expect(parseOemKvn(dated.body).header.CREATION_DATE).toBe('2026-12-02T08:15:30.500000');
    expect(dated.headers.etag).not.toBe(plain.headers.etag);
    // The same instant spelt otherwise is the same scenario.
    const same = await postJson(app, '/v1/track', { ...track, creationDate: '2026-12-02T08:15:30.500Z' });
    expect(same.headers.etag).toBe(dated.headers.etag);
    expect(same.body).toBe(dated.body);
    const bad = await postJson(app, '/v1/track', { ...track, creationDate: '2026-02-30T00:00:00Z' });
    expect(bad.json().type).toBe('/problems/invalid-epoch');
  });
});
