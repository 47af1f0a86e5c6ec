// examples/nightly-passes.ts against the service on a real socket: the CSV it writes holds exactly
// the passes the service answers for each spacecraft (same AOS/LOS text), in AOS order, as RFC 4180
// rows. The fleet and stations are the example's invented ones; the pass physics is checked in
// test/http/passes.test.ts and test/solver.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { FastifyInstance } from 'fastify';
import { CSV_HEADER, FLEET, STATIONS, nightlyPasses } from '../../examples/nightly-passes.js';
import { postJson, testApp } from '../helpers/app.js';

let app: FastifyInstance;
let baseUrl: string;
beforeAll(async () => {
  app = await testApp();
  await app.listen({ port: 0, host: '127.0.0.1' });
  baseUrl = `http://127.0.0.1:${(app.server.address() as AddressInfo).port}`;
});
afterAll(async () => { await app.close(); });

describe('examples/nightly-passes.ts', () => {
  it('writes every pass of the fleet over the stations, in AOS order', async () => {
    const start = '2026-12-01T00:00:00Z';
    const stop = '2026-12-03T00:00:00Z';
    const { csv, passes } = await nightlyPasses({ baseUrl, start, days: 2 });
    const lines = csv.split('\r\n');
    expect(lines.at(-1)).toBe('');
    expect(lines[0]).toBe(CSV_HEADER);
    const rows = lines.slice(1, -1).map((l) => l.split(','));
    expect(rows).toHaveLength(passes);
    expect(rows.every((r) => r.length === CSV_HEADER.split(',').length)).toBe(true);
    const aos = rows.map((r) => r[2]!);
    expect([...aos].sort()).toEqual(aos);

    const expected: string[] = [];
    for (const s of FLEET) {
      const res = await postJson(app, '/v1/passes', { centralBody: 'earth', elements: s.elements, stations: STATIONS, window: { start, stop } });
      expect(res.statusCode).toBe(200);
      for (const p of res.json().passes) {
        expect(p.aos >= '2026-12-01' && p.los <= '2026-12-03T00:00:00.000Z').toBe(true);
        expected.push(`${s.name} ${p.station} ${p.aos} ${p.los}`);
      }
    }
    expect(expected.length).toBeGreaterThan(10);
    expect(rows.map((r) => `${r[0]} ${r[1]} ${r[2]} ${r[4]}`).sort()).toEqual(expected.sort());
  });
});
