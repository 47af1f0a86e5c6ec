// End to end: the HTTP answer of a 100,000-sample track (CSV and JSON) over a loopback socket,
// per sample, against the common baseline loop measured in the same run. The server runs in this
// process with its cache off (every request is computed); the client is a separate process that
// only counts the bytes, so its reading does not load the server's thread. Besides the wall time
// (the goal's figure), the server process's CPU time per request (main and worker threads, from
// the request to the end of its answer) is given against the baseline loop's CPU time: on a shared
// machine it moves less with the other processes' load than the wall time does.
import { spawn } from 'node:child_process';
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

// The client: POSTs the body `rounds` times and prints "<status> <bytes> <ns>" per request.
const CLIENT = `
const http = require('node:http');
const [port, rounds, body] = [Number(process.argv[1]), Number(process.argv[2]), process.argv[3]];
const once = () => new Promise((resolve, reject) => {
  const t0 = process.hrtime.bigint();
  const req = http.request({ host: '127.0.0.1', port, path: '/v1/track', method: 'POST', headers: { 'content-type': 'application/json' } }, (res) => {
    let bytes = 0;
    res.on('data', (c) => { bytes += c.length; });
    res.on('end', () => resolve(res.statusCode + ' ' + bytes + ' ' + (process.hrtime.bigint() - t0)));
  });
  req.on('error', reject);
  req.end(body);
});
(async () => { for (let i = 0; i < rounds; i++) console.log(await once()); })();
`;

function client(port: number, rounds: number, body: string): Promise<Array<{ status: number; bytes: number; ns: number }>> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['-e', CLIENT, String(port), String(rounds), body], { stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.on('data', (c: Buffer) => { out += c.toString(); });
    child.on('error', reject);
    child.on('close', () => resolve(out.trim().split('\n').map((line) => {
      const [status, bytes, ns] = line.split(' ').map(Number);
      return { status: status!, bytes: bytes!, ns: ns! };
    })));
  });
}

export async function benchTrackHttp(): Promise<BenchResult[]> {
  const app = await buildApp({ logger: false, config: { CACHE_MAX_BYTES: 0, MAX_EVENT_LOOP_DELAY_MS: 0 } });
  // CPU time of the server process (all its threads) for each request, microseconds.
  const cpuAtStart = new WeakMap<object, NodeJS.CpuUsage>();
  let lastCpuUs = 0;
  app.addHook('onRequest', async (request) => { cpuAtStart.set(request, process.cpuUsage()); });
  app.addHook('onResponse', async (request) => {
    const d = process.cpuUsage(cpuAtStart.get(request));
    lastCpuUs = d.user + d.system;
  });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const { port } = app.server.address() as AddressInfo;
  let base = Infinity;
  let baseCpu = Infinity;
  const best: Record<string, number> = { csv: Infinity, json: Infinity };
  const bestCpu: Record<string, number> = { csv: Infinity, json: Infinity };
  let bytes = 0;
  let sink = 0;
  for (let r = 0; r < ROUNDS; r++) {
    const t0 = process.hrtime.bigint();
    const c0 = process.cpuUsage();
    sink += baselineLoop(BASELINE_N);
    const c1 = process.cpuUsage(c0);
    base = Math.min(base, Number(process.hrtime.bigint() - t0) / BASELINE_N);
    baseCpu = Math.min(baseCpu, ((c1.user + c1.system) * 1000) / BASELINE_N);
    for (const format of ['csv', 'json'] as const) {
      // Two requests per round: the second one is measured (the first warms the path after the baseline loop).
      const runs = await client(port, 2, JSON.stringify(scenario(format)));
      const last = runs[runs.length - 1]!;
      if (last.status !== 200) throw new Error(`track answered ${last.status}`);
      bytes = last.bytes;
      best[format] = Math.min(best[format]!, last.ns / SAMPLES);
      bestCpu[format] = Math.min(bestCpu[format]!, (lastCpuUs * 1000) / SAMPLES);
    }
  }
  await app.close();
  return [
    { name: 'baseline: sin + cos', opsPerSecond: 1e9 / base, ratioToBaseline: 1, note: `sink ${sink.toExponential(2)}` },
    { name: 'HTTP track, 100k samples, CSV (per sample)', opsPerSecond: 1e9 / best.csv!, ratioToBaseline: best.csv! / base, note: `last answer ${bytes} bytes; client in its own process; server CPU ${(bestCpu.csv! / baseCpu).toFixed(1)} x baseline CPU` },
    { name: 'HTTP track, 100k samples, JSON (per sample)', opsPerSecond: 1e9 / best.json!, ratioToBaseline: best.json! / base, note: `server CPU ${(bestCpu.json! / baseCpu).toFixed(1)} x baseline CPU` },
  ];
}
