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
});
