// Job completion callbacks: POSTed to hosts in JOB_CALLBACK_HOSTS only, signed with HMAC-SHA256
// (RFC 2104; the signature is recomputed here with node:crypto from the documented recipe
// "sha256=" + hex HMAC(secret, "<timestamp>.<body>"), not with the service's code), retried with
// backoff, redirects never followed. The receivers are test servers on 127.0.0.1.
import { createHmac } from 'node:crypto';
import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { FastifyInstance } from 'fastify';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { JobAnswer } from '../../src/schemas/batch.js';
import { postJson, testApp } from '../helpers/app.js';
import { GOOD, until } from '../helpers/batch.js';

const SECRET = 'a test secret of some length';

interface Received { headers: IncomingMessage['headers']; body: string }

/** A receiver answering the statuses in `answers` in turn (then 200), recording every request. */
async function receiver(answers: number[] = [], location?: string): Promise<{ server: Server; port: number; got: Received[] }> {
  const got: Received[] = [];
  const server = createServer((req, res) => {
    let body = '';
    req.on('data', (c: Buffer) => { body += c.toString('utf8'); });
    req.on('end', () => {
      got.push({ headers: req.headers, body });
      const status = answers.shift() ?? 200;
      if (location) res.setHeader('location', location);
      res.writeHead(status).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, port: (server.address() as AddressInfo).port, got };
}

const servers: Server[] = [];
const apps: FastifyInstance[] = [];
afterEach(async () => {
  for (const a of apps.splice(0)) await a.close();
  for (const s of servers.splice(0)) await new Promise((resolve) => s.close(resolve));
});

async function appFor(hosts: string, extra: object = {}) {
  const app = await testApp({ config: { JOB_CALLBACK_HOSTS: hosts, JOB_CALLBACK_SECRET: SECRET, JOB_CALLBACK_BACKOFF_MS: 10, JOB_CALLBACK_ATTEMPTS: 3, ...extra } });
  apps.push(app);
  return app;
}

async function finishedJob(app: FastifyInstance, body: object): Promise<string> {
  const res = await postJson(app, '/v1/jobs', body);
  expect(res.statusCode, res.body).toBe(202);
  const id = res.json().id as string;
  await until('job finished', async () => JobAnswer.parse((await app.inject({ url: `/v1/jobs/${id}` })).json()).status === 'done');
  await app.jobCallbacks.idle();
  return id;
}

describe('job completion callbacks', () => {
  it('a done job POSTs its status to an allowed host, signed; the signature verifies with the shared secret', async () => {
    const r = await receiver();
    servers.push(r.server);
    const app = await appFor(`127.0.0.1:${r.port}`);
    const url = `http://127.0.0.1:${r.port}/hooks/apsides`;
    const id = await finishedJob(app, { items: [{ id: 'a', kind: 'orbit', request: GOOD.orbit }], callbackUrl: url });
    expect(r.got).toHaveLength(1);
    const [call] = r.got;
    const status = JobAnswer.parse(JSON.parse(call!.body));
    expect(status).toMatchObject({ id, status: 'done', callbackUrl: url, counts: { items: 1, done: 1, failed: 0 } });
    const timestamp = String(call!.headers['apsides-signature-timestamp']);
    expect(Math.abs(Number(timestamp) - Date.now() / 1000)).toBeLessThan(120);
    const expected = `sha256=${createHmac('sha256', SECRET).update(`${timestamp}.${call!.body}`).digest('hex')}`;
    expect(call!.headers['apsides-signature']).toBe(expected);
    expect(call!.headers['content-type']).toBe('application/json');
    // A forged body does not verify under the same signature.
    expect(createHmac('sha256', SECRET).update(`${timestamp}.${call!.body.replace('done', 'fail')}`).digest('hex')).not.toBe(expected.slice(7));
  });

  it('a failing receiver is retried with the same delivery id until it answers 2xx', async () => {
    const r = await receiver([500, 503]);
    servers.push(r.server);
    const app = await appFor(`127.0.0.1:${r.port}`);
    await finishedJob(app, { items: [{ kind: 'orbit', request: GOOD.orbit }], callbackUrl: `http://127.0.0.1:${r.port}/` });
    expect(r.got).toHaveLength(3);
    expect(new Set(r.got.map((g) => g.headers['apsides-delivery'])).size).toBe(1);
  });

  it('gives up after JOB_CALLBACK_ATTEMPTS; a redirect is a failed attempt and is never followed', async () => {
    const elsewhere = await receiver();
    const r = await receiver([302, 302, 302], `http://127.0.0.1:${elsewhere.port}/`);
    servers.push(r.server, elsewhere.server);
    const app = await appFor(`127.0.0.1:${r.port}`);
    await finishedJob(app, { items: [{ kind: 'orbit', request: GOOD.orbit }], callbackUrl: `http://127.0.0.1:${r.port}/` });
    expect(r.got).toHaveLength(3);
    expect(elsewhere.got).toHaveLength(0);
  });

  it('a host outside JOB_CALLBACK_HOSTS, another port, a non-http scheme, credentials, or callbacks off: 422 callback-not-allowed, nothing called', async () => {
    const r = await receiver();
    servers.push(r.server);
    const app = await appFor(`127.0.0.1:${r.port}`);
    for (const callbackUrl of [
      `http://localhost:${r.port}/`, `http://127.0.0.1:${r.port + 1}/`, `ftp://127.0.0.1:${r.port}/`, `http://user:pw@127.0.0.1:${r.port}/`, 'not a url',
    ]) {
      const res = await postJson(app, '/v1/jobs', { items: [{ kind: 'orbit', request: GOOD.orbit }], callbackUrl });
      expect(res.statusCode, callbackUrl).toBe(422);
      expect(res.json().type).toBe('/problems/callback-not-allowed');
    }
    const off = await testApp();
    apps.push(off);
    const res = await postJson(off, '/v1/jobs', { items: [{ kind: 'orbit', request: GOOD.orbit }], callbackUrl: `http://127.0.0.1:${r.port}/` });
    expect(res.statusCode).toBe(422);
    expect(res.json().detail).toMatch(/JOB_CALLBACK_HOSTS/);
    expect(r.got).toHaveLength(0);
  });
});

describe('callbacks of cancelled jobs', () => {
  let r: Awaited<ReturnType<typeof receiver>>;
  beforeAll(async () => { r = await receiver(); });
  afterAll(async () => { await new Promise((resolve) => r.server.close(resolve)); });

  it('a job cancelled while queued calls back with status cancelled', async () => {
    const app = await appFor(`127.0.0.1:${r.port}`);
    const many = Array.from({ length: 300 }, () => ({ kind: 'passes', request: GOOD.passes }));
    const first = (await postJson(app, '/v1/jobs', { items: many })).json().id as string; // keeps the in-process queue busy
    const second = (await postJson(app, '/v1/jobs', { items: [{ kind: 'orbit', request: GOOD.orbit }], callbackUrl: `http://127.0.0.1:${r.port}/` })).json().id as string;
    const cancelled = await app.inject({ method: 'DELETE', url: `/v1/jobs/${second}` });
    expect(cancelled.json().status).toBe('cancelled');
    await app.inject({ method: 'DELETE', url: `/v1/jobs/${first}` });
    await app.jobCallbacks.idle();
    expect(r.got.map((g) => JSON.parse(g.body).status)).toEqual(['cancelled']);
  });
});
