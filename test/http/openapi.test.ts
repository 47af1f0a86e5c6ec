// The generated OpenAPI document is one a client generator can use well (OpenAPI 3.1.0,
// https://spec.openapis.org/oas/v3.1.0; problem documents per RFC 9457 section 3 and its media type
// application/problem+json, section 6.1): one operationId per operation, named component schemas,
// every error answer a problem document, the shared answers (304/401/406/413/429/503) declared, and
// summaries that name every format an operation produces.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { testApp } from '../helpers/app.js';

interface Operation {
  operationId?: string;
  summary?: string;
  requestBody?: { content: Record<string, { schema: { $ref?: string } }> };
  responses: Record<string, { content?: Record<string, { schema: { $ref?: string } }>; headers?: Record<string, unknown> }>;
}
let app: FastifyInstance;
let doc: { paths: Record<string, Record<string, Operation>>; components: { schemas: Record<string, Record<string, unknown>> } };
let operations: [string, Operation][];

beforeAll(async () => {
  app = await testApp();
  doc = (await app.inject({ url: '/openapi.json' })).json();
  operations = Object.entries(doc.paths).flatMap(([path, ops]) => Object.entries(ops).map(([m, op]) => [`${m.toUpperCase()} ${path}`, op] as [string, Operation]));
});
afterAll(async () => { await app.close(); });

/** Media type -> the name a summary uses for it. */
const FORMAT_NAMES: Record<string, string> = {
  'application/json': 'JSON', 'text/csv': 'CSV', 'text/plain': 'OEM', 'application/geo+json': 'GeoJSON',
  'image/svg+xml': 'SVG', 'application/x-ndjson': 'NDJSON',
};
const COMPUTED = ['POST /v1/orbit', 'POST /v1/track', 'POST /v1/passes', 'POST /v1/eclipses', 'POST /v1/two-body', 'POST /v1/central-force'];

describe('the OpenAPI document', () => {
  it('gives every operation a unique operationId, and lists /problems/{code} and /metrics', () => {
    const ids = operations.map(([, op]) => op.operationId);
    expect(ids.every((id) => typeof id === 'string' && /^[a-z][A-Za-z]+$/.test(id))).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
    expect(doc.paths['/problems/{code}']?.get?.operationId).toBe('getProblemType');
    expect(doc.paths['/metrics']?.get?.responses['200']?.content).toHaveProperty(['text/plain']);
  });

  it('declares every 4xx and 5xx answer as application/problem+json with the Problem schema', () => {
    let seen = 0;
    for (const [name, op] of operations) {
      for (const [status, response] of Object.entries(op.responses)) {
        // GET /readyz answers its readiness document whatever the status (load balancers read it).
        if (Number(status) < 400 || name === 'GET /readyz') continue;
        seen++;
        expect(Object.keys(response.content ?? {}), `${name} ${status}`).toEqual(['application/problem+json']);
        expect(response.content!['application/problem+json']!.schema.$ref, `${name} ${status}`).toBe('#/components/schemas/Problem');
      }
    }
    expect(seen).toBeGreaterThan(100);
    const problem = doc.components.schemas.Problem as { properties: { status: Record<string, number> } };
    expect(problem.properties.status).toMatchObject({ type: 'integer', minimum: 100, maximum: 599, example: 422 });
  });

  it('documents 304, 401, 406, 413, 429 and 503 on the computed answers, with Retry-After where it is sent', () => {
    for (const name of COMPUTED) {
      const op = operations.find(([n]) => n === name)![1];
      for (const status of ['200', '304', '400', '401', '406', '413', '422', '429', '503']) expect(op.responses, `${name} ${status}`).toHaveProperty([status]);
      expect(op.responses['304']!.content, name).toBeUndefined();
      expect(op.responses['429']!.headers).toHaveProperty(['retry-after']);
      expect(op.responses['503']!.headers).toHaveProperty(['retry-after']);
    }
  });

  it('names the request and answer schemas as components', () => {
    for (const name of COMPUTED) {
      const op = operations.find(([n]) => n === name)![1];
      expect(op.requestBody!.content['application/json']!.schema.$ref, name).toMatch(/^#\/components\/schemas\/[A-Z]\w+Request$/);
      expect(op.responses['200']!.content!['application/json']!.schema.$ref, name).toMatch(/^#\/components\/schemas\/[A-Z]\w+Answer$/);
    }
    // One name per type: no leftover request-side duplicates, nothing unreferenced.
    const text = JSON.stringify(doc.paths) + JSON.stringify(doc.components);
    for (const component of Object.keys(doc.components.schemas)) {
      expect(component.endsWith('Input') && component.slice(0, -5) in doc.components.schemas, component).toBe(false);
      expect(text.includes(`"#/components/schemas/${component}"`), component).toBe(true);
    }
  });

  it('names in each summary every format the operation answers in', () => {
    for (const [name, op] of operations) {
      const ok = op.responses['200'] ?? op.responses['202'];
      const types = Object.keys(ok?.content ?? {});
      if (types.length < 2) continue;
      for (const type of types) expect(op.summary, `${name}: ${type}`).toContain(FORMAT_NAMES[type]);
    }
  });
});
