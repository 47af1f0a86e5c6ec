// The typed client (apsides/client) against the service listening on a real socket: every
// operation of the OpenAPI document is called through it at least once (the test fails when an
// operation is added without a call here), answers arrive typed, problems as RFC 9457 documents.
// The scenario is the invented demo (test/helpers/demo.ts); correctness of the numbers is checked
// by the endpoint tests, this checks the client and the document agree with the service.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { FastifyInstance } from 'fastify';
import { gunzipSync } from 'node:zlib';
import { createApsidesClient, isProblem, type ApsidesClient } from '../../src/client/index.js';
import { DEMO_TWO_BODY } from '../../src/schemas/two-body.js';
import { testApp } from '../helpers/app.js';
import { DEMO_ORBIT as DEMO, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';

const DEMO_ORBIT = { ...DEMO, centralBody: 'earth' as const };

let app: FastifyInstance;
let client: ApsidesClient;
const called = new Set<string>();

beforeAll(async () => {
  app = await testApp();
  await app.listen({ port: 0, host: '127.0.0.1' });
  const { port } = app.server.address() as AddressInfo;
  client = createApsidesClient({ baseUrl: `http://127.0.0.1:${port}/` });
  // Which document operation each request was (method + the path template openapi-fetch filled in).
  client.use({ onRequest({ request, schemaPath }) { called.add(`${request.method} ${schemaPath}`); } });
});
afterAll(async () => { await app.close(); });

const DAY_LATER = '2026-12-02T00:00:00Z';

async function waitDone(id: string) {
  for (let i = 0; i < 200; i++) {
    const { data } = await client.GET('/v1/jobs/{id}', { params: { path: { id } } });
    if (data && data.status !== 'queued' && data.status !== 'running') return data;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`job ${id} did not finish`);
}

describe('apsides/client against a listening service', () => {
  it('service operations', async () => {
    const health = await client.GET('/healthz');
    expect(health.data?.status).toBe('ok');
    const ready = await client.GET('/readyz');
    expect(ready.data?.status).toBe('ok');
    const bodies = await client.GET('/v1/bodies');
    expect(bodies.data?.bodies.map((b) => b.name)).toContain('earth');
    const type = await client.GET('/problems/{code}', { params: { path: { code: 'validation-failed' } } });
    expect(type.data).toMatchObject({ code: 'validation-failed', status: 400 });
    const unknown = await client.GET('/problems/{code}', { params: { path: { code: 'no-such-code' } } });
    expect(unknown.response.status).toBe(404);
    expect(isProblem(unknown.error)).toBe(true);
    const metrics = await client.GET('/metrics', { parseAs: 'text' as const });
    expect(metrics.data).toMatch(/apsides_http_requests_total/);
  });

  it('orbit answers typed JSON, its SVG as text, the stored answer by hash, and a problem for a bad body', async () => {
    const orbit = await client.POST('/v1/orbit', { body: DEMO_ORBIT });
    expect(orbit.response.status).toBe(200);
    const hash = orbit.data!.scenarioHash;
    expect(orbit.data!.period).toBeGreaterThan(5000);
    const stored = await client.GET('/v1/results/{scenarioHash}', { params: { path: { scenarioHash: hash } } });
    expect(stored.data).toEqual(orbit.data);
    const svg = await client.POST('/v1/orbit', { body: { ...DEMO_ORBIT, format: 'svg' }, parseAs: 'text' as const });
    expect(svg.response.headers.get('content-type')).toMatch(/image\/svg\+xml/);
    expect(svg.data).toMatch(/^<svg|<\?xml/);
    const bad = await client.POST('/v1/orbit', { body: { centralBody: 'earth' } });
    expect(bad.response.status).toBe(400);
    expect(bad.response.headers.get('content-type')).toMatch(/application\/problem\+json/);
    expect(bad.error).toMatchObject({ type: '/problems/validation-failed', status: 400 });
  });

  it('track, passes, eclipses, two-body and central force', async () => {
    const grid = { start: EPOCH, stop: '2026-12-01T01:00:00Z', step: 600 };
    const track = await client.POST('/v1/track', { body: { ...DEMO_ORBIT, grid } });
    expect(track.data!.samples).toHaveLength(7);
    const csv = await client.POST('/v1/track', { body: { ...DEMO_ORBIT, grid, format: 'csv' as const }, parseAs: 'text' as const });
    expect(csv.data!.trim().split('\n').filter((l) => !l.startsWith('#'))).toHaveLength(8); // header + 7 rows
    const passes = await client.POST('/v1/passes', { body: { ...DEMO_ORBIT, stations: DEMO_STATIONS, window: { start: EPOCH, stop: DAY_LATER } } });
    expect(passes.data!.passes.length).toBeGreaterThan(0);
    const eclipses = await client.POST('/v1/eclipses', { body: { ...DEMO_ORBIT, window: { start: EPOCH, stop: DAY_LATER } } });
    expect(eclipses.data!.eclipses.length).toBeGreaterThan(0);
    const twoBody = await client.POST('/v1/two-body', { body: DEMO_TWO_BODY });
    expect(twoBody.data!.reducedMass).toBeGreaterThan(0);
    const centralForce = await client.POST('/v1/central-force', {
      body: { mass: 1, potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 1, energy: -0.25 },
    });
    expect(centralForce.data!.turningPoints.length).toBe(2);
  });

  it('batch and every job operation', async () => {
    const items = [{ id: 'plover-7', kind: 'orbit' as const, request: DEMO_ORBIT }];
    const batch = await client.POST('/v1/batch', { body: { items }, parseAs: 'text' as const });
    expect(JSON.parse(batch.data!.trim())).toMatchObject({ index: 0, id: 'plover-7', status: 200 });

    const first = await client.POST('/v1/jobs', { body: { items } });
    expect(first.response.status).toBe(202);
    const firstId = first.data!.id;
    await waitDone(firstId);
    const second = await client.POST('/v1/jobs', { body: { items, compareTo: firstId } });
    const id = second.data!.id;
    expect((await waitDone(id)).status).toBe('done');

    const list = await client.GET('/v1/jobs');
    expect(list.data!.jobs.map((j) => j.id)).toContain(id);
    const lines = await client.GET('/v1/jobs/{id}/results', { params: { path: { id } }, parseAs: 'text' as const });
    expect(lines.data!.trim().split('\n')).toHaveLength(1);
    const item = await client.GET('/v1/jobs/{id}/results/{index}', { params: { path: { id, index: 0 } } });
    expect(item.data).toMatchObject({ index: 0, status: 200 });
    const archive = await client.GET('/v1/jobs/{id}/archive', { params: { path: { id } }, parseAs: 'arrayBuffer' as const });
    expect(gunzipSync(Buffer.from(archive.data!)).toString('latin1')).toContain('manifest.json');
    const changes = await client.GET('/v1/jobs/{id}/changes', { params: { path: { id } }, parseAs: 'text' as const });
    expect(changes.response.status).toBe(200);
    const cancelled = await client.DELETE('/v1/jobs/{id}', { params: { path: { id } } });
    expect(cancelled.response.status).toBe(409); // a done job cannot be cancelled
    expect(cancelled.error).toMatchObject({ type: '/problems/job-finished' });
  });

  it('every operation of the document was called through the client', async () => {
    const doc = (await app.inject({ url: '/openapi.json' })).json() as { paths: Record<string, Record<string, unknown>> };
    const operations = Object.entries(doc.paths).flatMap(([path, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${path}`));
    expect(operations.length).toBeGreaterThan(15);
    expect([...called].sort()).toEqual(expect.arrayContaining(operations.sort()));
  });
});
