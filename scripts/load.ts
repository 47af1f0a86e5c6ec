// `npm run load`: load figures with autocannon against a server this script starts on 127.0.0.1
// (source under tsx, rate limits off, no Redis), each run bounded in time: cached and uncached
// orbit, uncached 10,000-sample tracks, uncached pass searches, then /healthz while 100,000-sample
// tracks and a 31-day 100-station pass search run. Prints a table (p50/p99/max ms, requests/s,
// errors, non-2xx) and the machine. Not a test: figures vary with the machine's load.
import { spawn } from 'node:child_process';
import { once } from 'node:events';
import { createRequire } from 'node:module';
import { cpus, loadavg, totalmem } from 'node:os';

interface Histogram { p50: number; p99: number; max: number; average: number }
interface Result { latency: Histogram; requests: { average: number; total: number }; errors: number; timeouts: number; non2xx: number; duration: number }
interface Request { method?: string; path?: string; headers?: Record<string, string>; body?: string; setupRequest?: (req: Request) => Request }
interface Options { url: string; connections: number; duration: number; requests?: Request[]; timeout?: number }
const autocannon = createRequire(import.meta.url)('autocannon') as (opts: Options) => Promise<Result>;

const JSON_HEADERS = { 'content-type': 'application/json', accept: 'application/json' };
const EPOCH = '2026-12-01T00:00:00Z';
// Invented demo spacecraft and stations (demo data only).
const elements = (n: number) => ({ epoch: EPOCH, semiMajorAxis: 6928.137 + (n % 100_000) * 1e-4, eccentricity: 0.0012, inclination: 97.6, raan: (n * 0.37) % 360, argPeriapsis: 90, trueAnomaly: 10 });
const stations = (k: number) => Array.from({ length: k }, (_, i) => ({ id: `site-${i}`, latitude: -60 + (120 * i) / Math.max(1, k - 1), longitude: (i * 37) % 360 - 180, altitude: 0.1, minElevation: 5 }));

let counter = 0;
/** A request whose body changes every time (a new scenario: never a cache hit). */
const fresh = (path: string, body: (n: number) => unknown): Request => ({
  method: 'POST', path, headers: JSON_HEADERS,
  setupRequest: (req) => ({ ...req, body: JSON.stringify(body(++counter)) }),
});
const fixed = (path: string, body: unknown): Request => ({ method: 'POST', path, headers: JSON_HEADERS, body: JSON.stringify(body) });

const trackBody = (samples: number) => (n: number) => ({ centralBody: 'earth', elements: elements(n), grid: { start: EPOCH, stop: new Date(Date.parse(EPOCH) + (samples - 1) * 10_000).toISOString().replace('.000', ''), step: 10 } });
const passBody = (days: number, k: number) => (n: number) => ({ centralBody: 'earth', elements: elements(n), window: { start: EPOCH, stop: new Date(Date.parse(EPOCH) + days * 86_400_000).toISOString().replace('.000', '') }, stations: stations(k) });

async function start(): Promise<{ origin: string; stop: () => Promise<void> }> {
  const env: NodeJS.ProcessEnv = { ...process.env, PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'warn', RATE_LIMIT_PER_MIN: '0', RATE_LIMIT_HEAVY_PER_MIN: '0', MAX_EVENT_LOOP_DELAY_MS: '0' };
  delete env.REDIS_URL;
  delete env.API_KEYS;
  const child = spawn(process.execPath, ['--import', 'tsx', 'src/server.ts'], { env: { ...env, LOG_LEVEL: 'info' }, stdio: ['ignore', 'pipe', 'inherit'] });
  let out = '';
  const origin = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not start: ${out}`)), 60_000);
    child.stdout!.on('data', (d) => {
      out += d.toString();
      const m = /listening at (http:\/\/127\.0\.0\.1:\d+)/.exec(out);
      if (m) { clearTimeout(timer); resolve(m[1]!); }
    });
  });
  child.stdout!.resume();
  return { origin, stop: async () => { child.kill('SIGTERM'); await once(child, 'exit'); } };
}

// autocannon in a process of its own, for the one figure that must not include this process's
// work: the /healthz client would otherwise share its event loop with the clients reading the
// 100,000-sample tracks and the pass search's answer, and time their parsing as server latency.
const CHILD = `
const autocannon = require(process.argv[1]);
autocannon(JSON.parse(process.argv[2])).then((r) => process.stdout.write(JSON.stringify(r)), (e) => { console.error(e); process.exit(1); });
`;
async function autocannonAlone(opts: Options): Promise<Result> {
  const child = spawn(process.execPath, ['-e', CHILD, createRequire(import.meta.url).resolve('autocannon'), JSON.stringify(opts)], { stdio: ['ignore', 'pipe', 'inherit'] });
  let out = '';
  child.stdout!.on('data', (d) => { out += d.toString(); });
  const [code] = await once(child, 'exit');
  if (code !== 0) throw new Error(`the autocannon process exited with ${String(code)}`);
  return JSON.parse(out) as Result;
}

const rows: string[] = [];
function row(name: string, r: Result): void {
  const line = `| ${name} | ${r.latency.p50} | ${r.latency.p99} | ${r.latency.max} | ${r.requests.average.toFixed(1)} | ${r.requests.total} | ${r.errors} (${r.timeouts} timeouts) | ${r.non2xx} |`;
  rows.push(line);
  console.log(line);
}

const { origin, stop } = await start();
try {
  console.log(`node ${process.version}, ${cpus().length} x ${cpus()[0]?.model ?? 'unknown cpu'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}, ${new Date().toISOString()}`);
  console.log('| run | p50 ms | p99 ms | max ms | req/s | requests | errors | non-2xx |\n|---|---|---|---|---|---|---|---|');
  const orbit = { centralBody: 'earth', elements: elements(0) };
  await fetch(`${origin}/v1/orbit`, { method: 'POST', headers: JSON_HEADERS, body: JSON.stringify(orbit) });
  row('orbit, cached (one scenario), 10 connections, 8 s', await autocannon({ url: origin, connections: 10, duration: 8, requests: [fixed('/v1/orbit', orbit)] }));
  row('orbit, uncached (new scenario each), 10 connections, 8 s', await autocannon({ url: origin, connections: 10, duration: 8, requests: [fresh('/v1/orbit', (n) => ({ centralBody: 'earth', elements: elements(n) }))] }));
  row('track 10,000 samples, uncached, 4 connections, 10 s', await autocannon({ url: origin, connections: 4, duration: 10, requests: [fresh('/v1/track', trackBody(10_000))] }));
  row('passes 1 day x 3 stations, uncached, 2 connections, 10 s', await autocannon({ url: origin, connections: 2, duration: 10, timeout: 60, requests: [fresh('/v1/passes', passBody(1, 3))] }));
  // /healthz while heavy work runs: 100,000-sample tracks on 2 connections and one 31-day, 100-station pass search.
  const heavyTracks = autocannon({ url: origin, connections: 2, duration: 15, timeout: 60, requests: [fresh('/v1/track', trackBody(100_000))] });
  const tPass = performance.now();
  const bigPasses = fetch(`${origin}/v1/passes`, { method: 'POST', headers: JSON_HEADERS, body: JSON.stringify(passBody(31, 100)(++counter)) })
    .then(async (res) => ({ status: res.status, bytes: (await res.arrayBuffer()).byteLength, ms: performance.now() - tPass }), () => ({ status: 0, bytes: 0, ms: performance.now() - tPass }));
  await new Promise((resolve) => setTimeout(resolve, 500));
  row('healthz, 1 connection, 12 s, while the heavy work below runs (client in its own process)', await autocannonAlone({ url: `${origin}/healthz`, connections: 1, duration: 12 }));
  row('  track 100,000 samples, uncached, 2 connections, 15 s (background)', await heavyTracks);
  const passes = await bigPasses;
  const passLine = `| passes 31 days x 100 stations, one request (background) | | | ${passes.ms.toFixed(0)} | | 1 | | ${passes.status === 200 ? 0 : 1} (status ${passes.status}, ${passes.bytes} bytes) |`;
  rows.push(passLine);
  console.log(passLine);
} finally {
  await stop();
}
