// Byte-identity guard: every scenario of test/helpers/answer-digests.ts (every solving endpoint and
// every format it offers, a batch, GET /v1/bodies, problem answers) must answer exactly the bytes
// whose SHA-256 is stored in test/fixtures/answer-digests.json. Speed work (memos, buffer pools,
// streaming) must leave this green without touching the table.
//
// When answers change on purpose (a model fix, a new field, another number format), the change
// must come with a SOLVER_VERSION bump in src/solver/core/version.ts (so no cache serves the old
// bytes) and a reason in the commit message; then regenerate the table with
//   npm run -s answers:digests
// and commit it with the change. The table records the version it was made with: a table of
// another version fails here with that instruction, and a changed answer under the same version
// fails as an unannounced change.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { SOLVER_VERSION } from '../../src/solver/core/version.js';
import { answerDigests, SCENARIOS, type Digest } from '../helpers/answer-digests.js';
import { testApp } from '../helpers/app.js';

interface Table { solverVersion: string; answers: Record<string, Digest> }
const table = JSON.parse(readFileSync(new URL('../fixtures/answer-digests.json', import.meta.url), 'utf8')) as Table;

let app: FastifyInstance;
let seen: Awaited<ReturnType<typeof answerDigests>>;
beforeAll(async () => {
  app = await testApp();
  // Three sends each: solved, then from the cache (and any faster path in front of it).
  seen = await answerDigests(app, 3);
}, 120_000);
afterAll(async () => app?.close());

describe('answers are byte-identical to the stored table', () => {
  it('the table was made with this solver version', () => {
    expect(table.solverVersion, `SOLVER_VERSION is ${SOLVER_VERSION}: regenerate the table (npm run -s answers:digests) with the change that bumped it`).toBe(SOLVER_VERSION);
  });

  it('the table covers every scenario and nothing else', () => {
    expect(Object.keys(table.answers).sort()).toEqual(Object.keys(SCENARIOS).sort());
  });

  it('every endpoint and format is covered, with answers that are not problems', () => {
    const ok = Object.entries(seen.digests).filter(([, d]) => d.status === 200);
    const pairs = new Set(ok.map(([name, d]) => `${SCENARIOS[name]!.url} ${d.contentType.split(';')[0]}`));
    for (const pair of [
      '/v1/bodies application/json', '/v1/orbit application/json', '/v1/orbit image/svg+xml',
      '/v1/track application/json', '/v1/track text/csv', '/v1/track text/plain', '/v1/track application/geo+json', '/v1/track image/svg+xml',
      '/v1/passes application/json', '/v1/passes image/svg+xml',
      '/v1/eclipses application/json', '/v1/eclipses text/csv', '/v1/eclipses image/svg+xml',
      '/v1/two-body application/json', '/v1/central-force application/json', '/v1/central-force image/svg+xml',
      '/v1/batch application/x-ndjson',
    ]) expect([...pairs], pair).toContain(pair);
  });

  it('a repeated request answers the same bytes as the first (cache and memo paths)', () => {
    expect(seen.repeated).toEqual([]);
  });

  it.each(Object.keys(SCENARIOS))('%s', (name) => {
    const stored = table.answers[name];
    expect(stored, `${name} is not in the table: regenerate it (npm run -s answers:digests)`).toBeDefined();
    expect(seen.digests[name], `${name} changed under SOLVER_VERSION ${SOLVER_VERSION}: bump the version, give a reason, regenerate the table`).toEqual(stored);
  });
});
