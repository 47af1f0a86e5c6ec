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
      for (const field of ['gm', 'radius', 'j2', 'rotationRate', 'flattening']) {
        if (b[field] !== null) expect(b.sources[field], `${b.name}.${field} source`).toBeTruthy();
      }
    }
    const earth = bodies.find((b) => b.name === 'earth')!;
    // WGS-84 / EGM-96 GM and WGS-84 equatorial radius (NIMA TR8350.2, 3rd ed., Table 3.1; from memory).
    expect(earth.gm).toBeCloseTo(398600.4418, 4);
    expect(earth.radius).toBeCloseTo(6378.137, 3);
  });
});
