// A cached POST /v1/orbit against the service's own GET /healthz, over loopback sockets, in the
// same run: the server runs in this process (rate limits and event-loop refusals off, open service,
// no Redis), the load comes from autocannon in its own process (so its work does not load the
// server's thread). Rounds alternate /healthz and the orbit; the best rate of each is kept and the
// figure is their ratio (goal: cached orbit >= 0.8 x healthz). A second pair runs with an API key
// and rate limits on (budgets too large to be reached): both checks stay in front of the cached path.
import { spawn } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import { buildApp } from '../src/app.js';
import { newKey } from '../src/auth/keys.js';
import type { BenchResult } from './types.js';

const ROUNDS = 4;
const SECONDS = 3;
const CONNECTIONS = 10;

// Invented demo spacecraft (demo data only).
const ORBIT = JSON.stringify({ centralBody: 'earth', elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 } });

// The client: one autocannon run, printing "<requests/s> <non-2xx> <errors>".
const CLIENT = `
const autocannon = require(${JSON.stringify(new URL('../node_modules/autocannon/autocannon.js', import.meta.url).pathname)});
const [url, seconds, connections, method, body, auth] = process.argv.slice(1);
const headers = { 'content-type': 'application/json', accept: 'application/json', ...(auth ? { authorization: 'Bearer ' + auth } : {}) };
autocannon({ url, duration: Number(seconds), connections: Number(connections), method, headers, ...(body ? { body } : {}) }, (err, r) => {
  if (err) { console.error(err); process.exit(1); }
  console.log(r.requests.average + ' ' + r.non2xx + ' ' + r.errors);
});
`;

function load(url: string, method: 'GET' | 'POST', body: string, key: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['-e', CLIENT, url, String(SECONDS), String(CONNECTIONS), method, body, key], { stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.on('data', (c: Buffer) => { out += c.toString(); });
    child.on('error', reject);
    child.on('close', (code) => {
      const [rate, non2xx, errors] = out.trim().split(' ').map(Number);
      if (code !== 0 || non2xx !== 0 || errors !== 0) reject(new Error(`autocannon ${method} ${url}: exit ${code}, ${non2xx} non-2xx, ${errors} errors`));
      else resolve(rate!);
    });
  });
}

async function pair(label: string, config: Record<string, unknown>, key: string): Promise<BenchResult[]> {
  const app = await buildApp({ logger: false, config: { RATE_LIMIT_PER_MIN: 0, RATE_LIMIT_HEAVY_PER_MIN: 0, MAX_EVENT_LOOP_DELAY_MS: 0, ...config } });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const origin = `http://127.0.0.1:${(app.server.address() as AddressInfo).port}`;
  const first = await fetch(`${origin}/v1/orbit`, { method: 'POST', headers: { 'content-type': 'application/json', ...(key ? { authorization: `Bearer ${key}` } : {}) }, body: ORBIT });
  if (first.status !== 200) throw new Error(`orbit answered ${first.status}`);
  let health = 0;
  let orbit = 0;
  try {
    for (let r = 0; r < ROUNDS; r++) {
      health = Math.max(health, await load(`${origin}/healthz`, 'GET', '', ''));
      orbit = Math.max(orbit, await load(`${origin}/v1/orbit`, 'POST', ORBIT, key));
    }
  } finally {
    await app.close();
  }
  return [
    { name: `GET /healthz${label} (baseline)`, opsPerSecond: health, ratioToBaseline: 1, note: `${CONNECTIONS} connections, best of ${ROUNDS} x ${SECONDS} s` },
    // A rate ratio: cached orbit requests per /healthz request (>= 0.8 is the goal).
    { name: `POST /v1/orbit, cached${label} (rate / healthz rate)`, opsPerSecond: orbit, ratioToBaseline: orbit / health, note: 'ratio of rates: higher is better' },
  ];
}

export async function benchCachedOrbit(): Promise<BenchResult[]> {
  const open = await pair('', {}, '');
  // The same without the request memo: every repeat is parsed, validated and hashed before the cache answers.
  const [, unmemoised] = await pair(', request memo off', { REQUEST_MEMO_MAX_BYTES: 0 }, '');
  // A key made for this run only.
  const { key, entry } = await newKey('bench');
  const keyed = await pair(', API key + rate limits', { API_KEYS: entry, RATE_LIMIT_PER_MIN: 10_000_000, RATE_LIMIT_HEAVY_PER_MIN: 10_000_000 }, key);
  return [...open, unmemoised!, ...keyed];
}
