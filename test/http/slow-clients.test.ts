import { spawn } from 'node:child_process';
import { connect, type Socket } from 'node:net';
import { once } from 'node:events';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/app.js';

// Slow and stalled clients over a real socket (listen on port 0). Expected behaviour: RFC 9110
// sec. 15.5.9 (408 Request Timeout: the server closes the connection), RFC 9457 problem body.

/** Send raw bytes and collect everything the server answers until it closes the connection. */
async function rawExchange(port: number, head: string, body: string, waitMs: number): Promise<{ text: string; closedAfterMs: number }> {
  const socket: Socket = connect(port, '127.0.0.1');
  await once(socket, 'connect');
  const t0 = Date.now();
  socket.write(head + body);
  let text = '';
  socket.on('data', (d) => { text += d.toString(); });
  const closed = once(socket, 'close');
  const timer = new Promise((resolve) => setTimeout(resolve, waitMs));
  await Promise.race([closed, timer]);
  const closedAfterMs = socket.destroyed ? Date.now() - t0 : Infinity;
  socket.destroy();
  return { text, closedAfterMs };
}

describe('stalled uploads', () => {
  let app: FastifyInstance;
  let port: number;
  beforeAll(async () => {
    app = await buildApp({ logger: false, config: { BODY_TIMEOUT_S: 1, HEADERS_TIMEOUT_S: 2 } });
    await app.listen({ port: 0, host: '127.0.0.1' });
    port = (app.server.address() as { port: number }).port;
  });
  afterAll(async () => { await app.close(); });

  it('a body that declares more bytes than it sends gets 408 request-timeout as a problem, and the connection closes', async () => {
    const head = 'POST /v1/orbit HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: 1000\r\n\r\n';
    const { text, closedAfterMs } = await rawExchange(port, head, '{"centralBody":', 8000);
    expect(text).toMatch(/^HTTP\/1.1 408/);
    expect(text).toMatch(/content-type: application\/problem\+json/i);
    expect(text).toContain('"type":"/problems/request-timeout"');
    expect(closedAfterMs).toBeLessThan(6000);
  }, 15_000);

  it('headers that never finish get 408 within the header limit and the connection closes', async () => {
    const { text, closedAfterMs } = await rawExchange(port, 'GET /healthz HTTP/1.1\r\nHost: x\r\n', 'X-Slow: ', 10_000);
    expect(text).toMatch(/^HTTP\/1.1 408/);
    expect(text).toContain('/problems/request-timeout');
    expect(closedAfterMs).toBeLessThan(8000);
  }, 15_000);

  it('400 stalled uploads at once (800 descriptors in this one process, under a 1024 ulimit): every one gets 408 and is closed within the limit, and the server answers meanwhile', async () => {
    const head = 'POST /v1/orbit HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: 1000\r\n\r\n';
    const pending = Array.from({ length: 400 }, () => rawExchange(port, head, '{"centralBody":', 12_000));
    const res = await fetch(`http://127.0.0.1:${port}/healthz`);
    expect(res.status).toBe(200);
    const all = await Promise.all(pending);
    expect(all.filter((r) => !/^HTTP\/1.1 408/.test(r.text)).length).toBe(0);
    // BODY_TIMEOUT_S is 1 s and Node checks it every second: closed within a few seconds, never left open.
    expect(Math.max(...all.map((r) => r.closedAfterMs))).toBeLessThan(10_000);
  }, 30_000);

  it('the server still answers afterwards', async () => {
    const res = await fetch(`http://127.0.0.1:${port}/healthz`);
    expect(res.status).toBe(200);
  });
});

describe('shutdown', () => {
  it('SIGTERM with a stalled upload in hand exits within SHUTDOWN_DEADLINE_S', async () => {
    const env: NodeJS.ProcessEnv = { ...process.env, PORT: '0', LOG_LEVEL: 'info', SHUTDOWN_DEADLINE_S: '2', BODY_TIMEOUT_S: '120', HEADERS_TIMEOUT_S: '120' };
    delete env.REDIS_URL;
    const child = spawn(process.execPath, ['--import', 'tsx', 'src/server.ts'], {
      env,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (d) => { out += d.toString(); });
    child.stderr.on('data', (d) => { out += d.toString(); });
    const port = await new Promise<number>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no listen line: ${out}`)), 60_000);
      child.stdout.on('data', () => {
        const m = /listening at http:\/\/127\.0\.0\.1:(\d+)/.exec(out) ?? /"port":(\d+)/.exec(out);
        if (m) { clearTimeout(timer); resolve(Number(m[1])); }
      });
    });
    const socket = connect(port, '127.0.0.1');
    await once(socket, 'connect');
    socket.write('POST /v1/orbit HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: 1000\r\n\r\n{');
    socket.on('error', () => {});
    await new Promise((resolve) => setTimeout(resolve, 300));
    const t0 = Date.now();
    child.kill('SIGTERM');
    const [code] = await once(child, 'exit') as [number | null];
    const tookMs = Date.now() - t0;
    socket.destroy();
    expect(tookMs).toBeLessThan(2000 + 3000);
    expect(code).not.toBeNull();
    expect(out).toMatch(/closing/);
  }, 90_000);

  it('SIGTERM with a /v1/batch in flight: the items in hand finish, the rest are 503 shutting-down lines, the stream ends whole, and the process exits', async () => {
    // No event-loop refusal: on a loaded machine the fresh server's first request could answer 503
    // overloaded, a right answer but not the one under test (the refusal has its own test in edge.test.ts).
    const env: NodeJS.ProcessEnv = { ...process.env, PORT: '0', LOG_LEVEL: 'info', SHUTDOWN_DEADLINE_S: '30', BATCH_CONCURRENCY: '1', WORKER_THREADS: '1', RATE_LIMIT_PER_MIN: '0', RATE_LIMIT_HEAVY_PER_MIN: '0', MAX_EVENT_LOOP_DELAY_MS: '0' };
    delete env.REDIS_URL;
    const child = spawn(process.execPath, ['--import', 'tsx', 'src/server.ts'], { env, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (d) => { out += d.toString(); });
    child.stderr.on('data', (d) => { out += d.toString(); });
    const exited = once(child, 'exit') as Promise<[number | null]>;
    const port = await new Promise<number>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no listen line: ${out}`)), 60_000);
      child.stdout.on('data', () => {
        const m = /listening at http:\/\/127\.0\.0\.1:(\d+)/.exec(out);
        if (m) { clearTimeout(timer); resolve(Number(m[1])); }
      });
    });
    // 30 distinct pass searches of 3 days over 3 stations (invented sites), one at a time: seconds of work.
    const stations = [
      { id: 'korrin-hill', latitude: 61.2, longitude: 24.9, altitude: 0.21 },
      { id: 'vell-mesa', latitude: -23.4, longitude: 133.8, altitude: 0.6 },
      { id: 'tarn-ridge', latitude: 45.1, longitude: -110.2, altitude: 1.2 },
    ];
    const items = Array.from({ length: 30 }, (_, i) => ({
      id: `p${i}`, kind: 'passes',
      request: {
        centralBody: 'earth',
        elements: { semiMajorAxis: 6928.14 + i, eccentricity: 0.001, inclination: 97.6, raan: 10 + i, argPeriapsis: 0, trueAnomaly: 0, epoch: '2026-12-01T00:00:00Z' },
        window: { start: '2026-12-01T00:00:00Z', stop: '2026-12-04T00:00:00Z' },
        stations,
      },
    }));
    const res = await fetch(`http://127.0.0.1:${port}/v1/batch`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ items }) });
    if (res.status !== 200) expect.fail(`batch answered ${res.status}: ${await res.text()}`);
    const reader = res.body!.getReader();
    let text = '';
    let signalled = false;
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      text += Buffer.from(value).toString();
      if (!signalled && text.includes('\n')) {
        signalled = true;
        child.kill('SIGTERM');
      }
    }
    const [code] = await exited;
    expect(text.endsWith('\n')).toBe(true);
    const lines = text.trim().split('\n').map((l) => JSON.parse(l) as { index: number; status: number; problem?: { type: string; detail: string } });
    expect(lines.map((l) => l.index)).toEqual(items.map((_, i) => i));
    const done = lines.filter((l) => l.status === 200).length;
    const notRun = lines.filter((l) => l.status === 503);
    expect(done).toBeGreaterThanOrEqual(1);
    expect(notRun.length).toBeGreaterThan(0);
    expect(done + notRun.length).toBe(items.length);
    // The answered lines come first, then only shutting-down lines naming the range not run.
    expect(lines.slice(done).every((l) => l.status === 503 && l.problem?.type === '/problems/shutting-down')).toBe(true);
    expect(notRun[0]!.problem!.detail).toContain(`items ${done} to ${items.length - 1}`);
    expect(code).toBe(0);
  }, 120_000);
});
