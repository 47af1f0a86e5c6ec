import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { testApp } from '../helpers/app.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

describe('service endpoints', () => {
  it('GET /healthz and /readyz answer ok', async () => {
    for (const url of ['/healthz', '/readyz']) {
      const res = await app.inject({ url });
      expect(res.statusCode, url).toBe(200);
      expect(res.json().status).toBe('ok');
    }
    expect((await app.inject({ url: '/readyz' })).json()).toMatchObject({ checks: { 'job-queue': 'ok' }, missing: [] });
  });

  it('GET /openapi.json lists every public route with its schemas', async () => {
    const doc = (await app.inject({ url: '/openapi.json' })).json();
    expect(doc.openapi).toBe('3.1.0');
    for (const path of ['/healthz', '/readyz', '/v1/bodies', '/v1/orbit', '/v1/two-body', '/v1/central-force', '/v1/track', '/v1/passes', '/v1/batch', '/v1/jobs', '/v1/jobs/{id}', '/v1/jobs/{id}/results', '/v1/results/{scenarioHash}']) {
      expect(doc.paths, path).toHaveProperty([path]);
    }
    const orbit = doc.paths['/v1/orbit'].post;
    expect(orbit.requestBody.content['application/json'].schema).toBeTruthy();
    expect(orbit.responses['200'].content['application/json'].schema).toBeTruthy();
    expect(doc.info.description).toMatch(/collision avoidance/);
  });

  it('GET /docs serves the interactive reference page', async () => {
    const res = await app.inject({ url: '/docs/' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
  });

  it('GET /metrics answers Prometheus text with request and cache figures', async () => {
    await app.inject({ url: '/healthz' });
    const res = await app.inject({ url: '/metrics' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/plain/);
    expect(res.body).toMatch(/apsides_http_requests_total\{method="GET",route="\/healthz",status="200"\} [1-9]/);
    expect(res.body).toMatch(/apsides_cache_entries \d+/);
    expect(res.body).toMatch(/apsides_pool_jobs\{state="queued"\} \d+/);
  });

  it('an unknown route answers a 404 problem', async () => {
    const res = await app.inject({ url: '/v1/nowhere' });
    expect(res.statusCode).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.json()).toMatchObject({ type: '/problems/not-found', status: 404 });
  });

  it('GET /problems/{code} describes a problem type, and 404s an unknown one', async () => {
    const ok = await app.inject({ url: '/problems/validation-failed' });
    expect(ok.statusCode).toBe(200);
    expect(ok.json()).toMatchObject({ code: 'validation-failed', status: 400 });
    const missing = await app.inject({ url: '/problems/no-such-thing' });
    expect(missing.statusCode).toBe(404);
    expect(missing.json().type).toBe('/problems/problem-type-unknown');
  });

  it('GET /v1/bodies lists the built-in bodies with a source for every value', async () => {
    const res = await app.inject({ url: '/v1/bodies' });
    expect(res.statusCode).toBe(200);
    const { bodies } = res.json() as { bodies: Array<Record<string, unknown> & { name: string; sources: Record<string, string> }> };
    const names = bodies.map((b) => b.name);
    for (const n of ['sun', 'mercury', 'venus', 'earth', 'moon', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune']) expect(names).toContain(n);
    for (const b of bodies) {
      for (const field of ['gm', 'radius', 'j2', 'rotationRateDegPerDay', 'flattening', 'heliocentricMeanMotionDegPerDay']) {
        if (b[field] !== null) expect(b.sources[field], `${b.name}.${field} source`).toBeTruthy();
      }
      // Every source names a field of the answer, and the GMs name their DE440 constant (or WGS 84's table).
      for (const key of Object.keys(b.sources)) expect(Object.keys(b), `${b.name} source ${key}`).toContain(key);
      expect(b.sources.gm, `${b.name}.gm source`).toMatch(/ephemeris constant GM[S1-9M]|Table 3\.1/);
      // The value itself is checked (the remark on planetary systems after the colon is not).
      expect(b.sources.gm!.split(': GM of the planetary system')[0]).not.toMatch(/from memory/);
    }
    const earth = bodies.find((b) => b.name === 'earth')!;
    // WGS 84 defining parameters (NIMA TR8350.2, 3rd ed., Table 3.1): GM = 3986004.418e8 m^3/s^2,
    // a = 6378137.0 m, omega = 7292115.0e-11 rad/s, here in deg/day.
    expect(earth.gm).toBe(398600.4418);
    expect(earth.radius).toBe(6378.137);
    expect(earth.rotationRateDegPerDay).toBeCloseTo(((7292115.0e-11 * 180) / Math.PI) * 86_400, 9);
    // WGCCRE 2015 (Archinal et al. 2018) prime-meridian rates W, deg/day: printed as published.
    const rate = (name: string) => bodies.find((x) => x.name === name)!.rotationRateDegPerDay;
    expect([rate('mars'), rate('uranus'), rate('neptune'), rate('moon')]).toEqual([350.89198226, -501.1600928, 541.1397757, 13.17635815]);
    // DE440 GMs (Park et al. 2021; the DE440 constants GMS and GM5), km^3/s^2.
    expect(bodies.find((x) => x.name === 'sun')!.gm).toBe(132_712_440_041.279419);
    expect(bodies.find((x) => x.name === 'jupiter')!.gm).toBe(126_712_764.1);
  });
});
