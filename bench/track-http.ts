// End to end: the HTTP answer of a 100,000-sample track (CSV and JSON) over a loopback socket,
// per sample, against the common baseline loop measured in the same run. The cache is off so
// every request is computed; the client only counts the bytes.
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import { buildApp } from '../src/app.js';
import { baselineLoop } from './baseline.js';
import type { BenchResult } from './types.js';

const SAMPLES = 100_000;
const ROUNDS = 5;
const BASELINE_N = 2_000_000;

const scenario = (format: 'csv' | 'json') => ({
  centralBody: 'earth',
  elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 },
  // 100,000 one-second samples (the stop is on the grid).
  grid: { start: '2026-12-01T00:00:00Z', stop: '2026-12-02T03:46:39Z', step: 1 },
  format,
});

/** POST and drain the answer; resolves with the status and the byte count. */
function post(port: number, body: string): Promise<{ status: number; bytes: number }> {
  return new Promise((resolve, reject) => {
    const req = httpRequest({ host: '127.0.0.1', port, path: '/v1/track', method: 'POST', headers: { 'content-type': 'application/json' } }, (res) => {
      let bytes = 0;
      res.on('data', (chunk: Buffer) => { bytes += chunk.length; });
      res.on('end', () => resolve({ status: res.statusCode ?? 0, bytes }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end(body);
  });
}

export async function benchTrackHttp(): Promise<BenchResult[]> {
  const app = await buildApp({ logger: false, config: { CACHE_MAX_BYTES: 0 } });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const { port } = app.server.address() as AddressInfo;
  let base = Infinity;
  const best: Record<string, number> = { csv: Infinity, json: Infinity };
  let bytes = 0;
  let sink = 0;
  for (let r = 0; r < ROUNDS; r++) {
    let t0 = process.hrtime.bigint();
    sink += baselineLoop(BASELINE_N);
    base = Math.min(base, Number(process.hrtime.bigint() - t0) / BASELINE_N);
    for (const format of ['csv', 'json'] as const) {
      t0 = process.hrtime.bigint();
      const res = await post(port, JSON.stringify(scenario(format)));
      const ns = Number(process.hrtime.bigint() - t0) / SAMPLES;
      if (res.status !== 200) throw new Error(`track answered ${res.status}`);
      bytes = res.bytes;
      best[format] = Math.min(best[format]!, ns);
    }
  }
  await app.close();
  return [
    { name: 'baseline: sin + cos', opsPerSecond: 1e9 / base, ratioToBaseline: 1, note: `sink ${sink.toExponential(2)}` },
    { name: 'HTTP track, 100k samples, CSV (per sample)', opsPerSecond: 1e9 / best.csv!, ratioToBaseline: best.csv! / base, note: `last answer ${bytes} bytes` },
    { name: 'HTTP track, 100k samples, JSON (per sample)', opsPerSecond: 1e9 / best.json!, ratioToBaseline: best.json! / base },
  ];
}
