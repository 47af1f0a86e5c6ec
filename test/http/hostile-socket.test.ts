// Hostile and careless clients against the built server (tsc output, `node .build-test/src/server.js`)
// over real sockets: generated bodies, paths and headers plus the cases of issue 13, each sent with
// a time bound. Never a 5xx, never a hang, every error a problem document, healthy afterwards with
// bounded memory. Expected behaviour: RFC 9110 (status classes), RFC 9457 (problem documents).
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { connect } from 'node:net';
import { rmSync } from 'node:fs';
import { promisify } from 'node:util';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GOOD } from '../helpers/batch.js';
import { DEMO_ORBIT, EPOCH } from '../helpers/demo.js';

const OUT = '.build-test';
const REQUEST_BOUND_MS = 15_000;
let child: ChildProcess;
let origin = '';
let port = 0;
let log = '';

beforeAll(async () => {
  rmSync(OUT, { recursive: true, force: true });
  await promisify(execFile)('npx', ['tsc', '-p', 'tsconfig.build.json', '--outDir', OUT]);
  // A loaded test machine would otherwise answer 503 overloaded: a right answer, but not the one
  // under test here (the overload refusal has its own test, test/http/overload.test.ts).
  const env: NodeJS.ProcessEnv = { ...process.env, PORT: '0', LOG_LEVEL: 'warn', RATE_LIMIT_PER_MIN: '0', RATE_LIMIT_HEAVY_PER_MIN: '0', MAX_EVENT_LOOP_DELAY_MS: '0', BODY_TIMEOUT_S: '2', HEADERS_TIMEOUT_S: '2', WORKER_THREADS: '1' };
  delete env.REDIS_URL;
  delete env.API_KEYS;
  child = spawn(process.execPath, [`${OUT}/src/server.js`], { env: { ...env, LOG_LEVEL: 'info' }, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stderr!.on('data', (d) => { log += d.toString(); });
  port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no listen line: ${log}`)), 60_000);
    child.stdout!.on('data', (d) => {
      log += d.toString();
      const m = /listening at http:\/\/127\.0\.0\.1:(\d+)/.exec(log);
      if (m) { clearTimeout(timer); resolve(Number(m[1])); }
    });
  });
  origin = `http://127.0.0.1:${port}`;
}, 120_000);

afterAll(async () => {
  if (child && child.exitCode === null) {
    child.kill('SIGTERM');
    await once(child, 'exit');
  }
  rmSync(OUT, { recursive: true, force: true });
});

interface Sent { method: string; path: string; headers?: Record<string, string>; body?: string | Buffer }

/** Send one request with a time bound; resolves with the status, media type and body text. */
async function send(r: Sent): Promise<{ status: number; type: string; text: string }> {
  const res = await fetch(origin + r.path, { method: r.method, headers: r.headers, body: r.body, signal: AbortSignal.timeout(REQUEST_BOUND_MS) });
  return { status: res.status, type: res.headers.get('content-type') ?? '', text: await res.text() };
}

function expectSane(r: Sent, res: { status: number; type: string; text: string }) {
  const what = `${r.method} ${r.path.slice(0, 80)}: ${res.status} ${res.text.slice(0, 200)}`;
  expect(res.status, what).toBeLessThan(500);
  if (res.status >= 400) {
    expect(res.type, what).toMatch(/^application\/problem\+json/);
    const problem = JSON.parse(res.text) as { type: string; status: number };
    expect(problem.status, what).toBe(res.status);
    expect(problem.type, what).toMatch(/^\/problems\/[a-z-]+$/);
    expect(res.text.length, what).toBeLessThan(20_000);
  }
}

const ENDPOINTS = ['/v1/orbit', '/v1/track', '/v1/passes', '/v1/two-body', '/v1/central-force', '/v1/batch', '/v1/jobs'];

/** Any JSON value, with some strings holding lone surrogates, control characters or a lot of text. */
const nastyString = fc.oneof(fc.string(), fc.constantFrom('\ud800', 'a\udfffb', '\u0000', 'x'.repeat(5000), '../../etc', '%00', '<svg>'));
const nastyJson = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: 'small' },
    fc.constantFrom(null, true, false, 0, -0, 1e308, -1e308, 5e-324, Number.MAX_SAFE_INTEGER + 2), fc.double(), nastyString,
    fc.array(tie('value'), { maxLength: 5 }), fc.dictionary(fc.oneof(fc.string(), fc.constantFrom('__proto__', 'constructor', 'elements', 'grid')), tie('value'), { maxKeys: 5 })),
})).value;

/** A known request with one field replaced by something hostile. */
const mutated = fc.tuple(fc.constantFrom(...(Object.keys(GOOD) as (keyof typeof GOOD)[])), nastyJson, fc.nat(20)).map(([kind, v, at]) => {
  const good = JSON.parse(JSON.stringify(GOOD[kind])) as Record<string, unknown>;
  const keys = Object.keys(good);
  good[keys[at % keys.length]!] = v;
  return { method: 'POST', path: `/v1/${kind}`, headers: { 'content-type': 'application/json' }, body: JSON.stringify(good) } satisfies Sent;
});

const randomBody = fc.tuple(fc.constantFrom(...ENDPOINTS), nastyJson).map(([path, v]) => ({ method: 'POST', path, headers: { 'content-type': 'application/json' }, body: JSON.stringify(v) ?? 'null' }) satisfies Sent);
const rawBytes = fc.tuple(fc.constantFrom(...ENDPOINTS), fc.uint8Array({ maxLength: 300 }), fc.constantFrom('application/json', 'text/plain', 'application/x-www-form-urlencoded', 'application/json; charset=latin1'))
  .map(([path, bytes, type]) => ({ method: 'POST', path, headers: { 'content-type': type }, body: Buffer.from(bytes) }) satisfies Sent);
const oddPath = fc.oneof(fc.webPath(), fc.string({ maxLength: 50 }).map((s) => `/v1/results/${encodeURIComponent(s)}`), fc.constantFrom('/v1/jobs/%', '/v1/%zz', `/v1/results/${'a'.repeat(10_000)}`, '/v1/jobs/../../x', '/v1//orbit', '/docs/../metrics'))
  .map((path) => ({ method: 'GET', path: path.startsWith('/') ? path : `/${path}`, headers: { 'x-request-id': 'r'.repeat(10_000) } }) satisfies Sent);

/** The cases the issue names, each once. */
const NAMED: Sent[] = [
  { method: 'POST', path: '/v1/track', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ ...DEMO_ORBIT, grid: { times: Array.from({ length: 500_000 }, () => 'x') } }) },
  { method: 'POST', path: '/v1/batch', headers: { 'content-type': 'application/json' }, body: `{"items":[{"kind":"orbit","request":${'['.repeat(10_000)}${']'.repeat(10_000)}}]}` },
  { method: 'POST', path: '/v1/jobs', headers: { 'content-type': 'application/json' }, body: `{"items":[{"kind":"orbit","request":${'{"a":'.repeat(10_000)}1${'}'.repeat(10_000)}}]}` },
  { method: 'POST', path: '/v1/batch', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ items: [{ kind: 'passes', request: { ...GOOD.passes, stations: [{ ...GOOD.passes.stations[0], id: '\ud800' }] } }] }) },
  { method: 'POST', path: '/v1/track', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ ...DEMO_ORBIT, model: 'numerical', grid: { start: EPOCH, stop: '2125-12-01T00:00:00Z', step: 31_000_000 } }) },
  { method: 'GET', path: `/v1/results/${'f'.repeat(10_000)}` },
  { method: 'GET', path: '/v1/%' },
  { method: 'POST', path: '/v1/batch', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ items: Array.from({ length: 200_000 }, () => ({})) }) },
];

describe('hostile clients against the built server over sockets', () => {
  it('the named cases of issue 13: never a 5xx, each a bounded problem or answer', async () => {
    for (const r of NAMED) expectSane(r, await send(r));
  }, 120_000);

  it('generated bodies, bytes, paths and headers: never a 5xx, never a hang', async () => {
    await fc.assert(fc.asyncProperty(fc.oneof(mutated, randomBody, rawBytes, oddPath), async (r) => { expectSane(r, await send(r)); }), { numRuns: 150, seed: 20_261_202 });
  }, 240_000);

  it('a stalled upload and broken HTTP on raw sockets get their 4xx and a closed connection', async () => {
    for (const bytes of ['POST /v1/orbit HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: 500\r\n\r\n{"a":', 'GARBAGE\r\n\r\n', 'GET / HTTP/1.1\r\nHost: x\r\nBad Header\r\n\r\n']) {
      const socket = connect(port, '127.0.0.1');
      await once(socket, 'connect');
      let text = '';
      socket.on('data', (d) => { text += d.toString(); });
      socket.on('error', () => {});
      socket.write(bytes);
      const closed = once(socket, 'close');
      await Promise.race([closed, new Promise((resolve) => setTimeout(resolve, 8000))]);
      expect(socket.destroyed || socket.readableEnded, bytes).toBe(true);
      socket.destroy();
      expect(text, bytes).toMatch(/^HTTP\/1\.1 4\d\d/);
    }
  }, 60_000);

  it('healthy afterwards, with bounded memory', async () => {
    expect((await send({ method: 'GET', path: '/healthz' })).status).toBe(200);
    expect((await send({ method: 'GET', path: '/readyz' })).status).toBe(200);
    const ok = await send({ method: 'POST', path: '/v1/orbit', headers: { 'content-type': 'application/json' }, body: JSON.stringify(GOOD.orbit) });
    expect(ok.status).toBe(200);
    const metrics = (await send({ method: 'GET', path: '/metrics' })).text;
    const rss = Number(/^process_resident_memory_bytes (\S+)$/m.exec(metrics)?.[1]);
    expect(rss).toBeGreaterThan(0);
    expect(rss).toBeLessThan(1.5 * 1024 ** 3);
    expect(child.exitCode).toBeNull();
  }, 30_000);
});
