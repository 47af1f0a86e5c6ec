import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { JobAccepted, JobAnswer } from '../../src/schemas/batch.js';
import { Problem } from '../../src/schemas/common.js';
import { postJson, testApp } from '../helpers/app.js';
import { answerBytes, GOOD, parseLines, rawLines, until } from '../helpers/batch.js';
import { DEMO_ORBIT } from '../helpers/demo.js';

// The in-process queue (no REDIS_URL): jobs run one at a time on the same app.
let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const ITEMS = [
  { id: 'plover-7', kind: 'orbit', request: GOOD.orbit },
  { id: 'bad', kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, eccentricity: 1.5 } } },
  { id: 'track', kind: 'track', request: GOOD.track },
  { id: 'pair', kind: 'two-body', request: GOOD['two-body'] },
];

async function status(server: FastifyInstance, id: string): Promise<JobAnswer> {
  const res = await server.inject({ url: `/v1/jobs/${id}` });
  expect(res.statusCode, res.body).toBe(200);
  return JobAnswer.parse(res.json());
}

async function submit(server: FastifyInstance, body: unknown): Promise<string> {
  const res = await postJson(server, '/v1/jobs', body);
  expect(res.statusCode, res.body).toBe(202);
  const accepted = JobAccepted.parse(res.json());
  expect(res.headers.location).toBe(`/v1/jobs/${accepted.id}`);
  expect(accepted.links.results).toBe(`/v1/jobs/${accepted.id}/results`);
  return accepted.id;
}

describe('jobs in process', () => {
  it('POST /v1/jobs answers 202 with a Location; the job runs to done; its results are the batch\'s lines', async () => {
    const id = await submit(app, { label: 'nightly recalculation', items: ITEMS });
    await until('job done', async () => (await status(app, id)).status === 'done');
    const job = await status(app, id);
    expect(job).toMatchObject({ id, label: 'nightly recalculation', status: 'done', counts: { items: 4, done: 4, failed: 1 }, attempts: 1, error: null });
    for (const t of [job.createdAt, job.startedAt!, job.finishedAt!]) expect(new Date(t).toISOString()).toBe(t);
    expect(Date.parse(job.finishedAt!)).toBeGreaterThanOrEqual(Date.parse(job.startedAt!));

    const results = await app.inject({ url: `/v1/jobs/${id}/results` });
    expect(results.statusCode).toBe(200);
    expect(results.headers['content-type']).toBe('application/x-ndjson');
    const lines = parseLines(results.rawPayload);
    expect(lines.map((l) => [l.index, l.id, l.status])).toEqual([[0, 'plover-7', 200], [1, 'bad', 422], [2, 'track', 200], [3, 'pair', 200]]);
    // The same answers, byte for byte, as the synchronous batch (problems differ only in their request id).
    const batch = await postJson(app, '/v1/batch', { items: ITEMS });
    const [jobRaw, batchRaw] = [rawLines(results.rawPayload), rawLines(batch.rawPayload)];
    for (const i of [0, 2, 3]) expect(jobRaw[i]!.equals(batchRaw[i]!), `line ${i}`).toBe(true);
    expect(answerBytes(jobRaw[0]!).equals((await postJson(app, '/v1/orbit', GOOD.orbit)).rawPayload)).toBe(true);
    expect(lines[1]!.problem?.requestId).toBe(`job-${id}/1`);
  });

  it('an unknown or malformed id is a 404 job-not-found problem', async () => {
    for (const id of ['00000000-0000-4000-8000-000000000000', 'not-a-job', '..%2F..%2Fqueue']) {
      for (const url of [`/v1/jobs/${id}`, `/v1/jobs/${id}/results`]) {
        const res = await app.inject({ url });
        expect(res.statusCode, url).toBe(404);
        expect(Problem.parse(res.json()).type).toBe('/problems/job-not-found');
      }
    }
  });

  it('results of a job not yet done are a 409 job-not-done with Retry-After; the job is queued behind the running one', async () => {
    // The first job's 200 items take many turns of the event loop; the second waits behind it.
    const many = Array.from({ length: 200 }, (_, i) => ({ kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, raan: i + Math.random() } } }));
    const first = await submit(app, { items: many });
    const second = await submit(app, { items: ITEMS });
    expect((await status(app, second)).status).toBe('queued');
    const early = await app.inject({ url: `/v1/jobs/${second}/results` });
    expect(early.statusCode).toBe(409);
    expect(early.headers['retry-after']).toBe('10');
    expect(Problem.parse(early.json()).type).toBe('/problems/job-not-done');
    await until('both jobs done', async () => (await status(app, second)).status === 'done');
    const firstJob = await status(app, first);
    expect(firstJob).toMatchObject({ status: 'done', counts: { items: 200, done: 200, failed: 0 } });
    expect(Date.parse(firstJob.finishedAt!)).toBeLessThanOrEqual(Date.parse((await status(app, second)).startedAt!));
    expect(parseLines((await app.inject({ url: `/v1/jobs/${first}/results` })).rawPayload).map((l) => l.index)).toEqual(many.map((_, i) => i));
  });

  it('the body is checked like a batch: 400 for a bad envelope, 422 over BATCH_MAX_ITEMS', async () => {
    const bad = await postJson(app, '/v1/jobs', { label: 'x', items: [{ kind: 'nope', request: {} }] });
    expect(bad.statusCode).toBe(400);
    const small = await testApp({ config: { BATCH_MAX_ITEMS: 2 } });
    const over = await postJson(small, '/v1/jobs', { items: ITEMS });
    expect(over.statusCode).toBe(422);
    expect(over.json().type).toBe('/problems/limit-exceeded');
    await small.close();
  });

  it('keeps at most JOBS_MAX_KEPT jobs: a full queue of unfinished jobs answers 503 queue-unavailable; later the oldest finished job is dropped', async () => {
    const two = await testApp({ config: { JOBS_MAX_KEPT: 2 } });
    const many = Array.from({ length: 100 }, (_, i) => ({ kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, inclination: 10 + i * 0.5 } } }));
    const a = await submit(two, { items: many });
    const b = await submit(two, { items: ITEMS });
    const full = await postJson(two, '/v1/jobs', { items: ITEMS });
    expect(full.statusCode).toBe(503);
    expect(Number(full.headers['retry-after'])).toBeGreaterThan(0);
    expect(Problem.parse(full.json()).type).toBe('/problems/queue-unavailable');
    await until('both done', async () => (await status(two, b)).status === 'done');
    const c = await submit(two, { items: ITEMS });
    expect((await two.inject({ url: `/v1/jobs/${a}` })).statusCode).toBe(404); // the oldest finished one went
    expect((await status(two, b)).status).toBe('done');
    await until('third done', async () => (await status(two, c)).status === 'done');
    await two.close();
  });
});

describe('jobs in process bounded in bytes (JOBS_MAX_BYTES)', () => {
  it('a job whose items alone are larger than the bound answers 422 limit-exceeded without Retry-After (a retry could never succeed)', async () => {
    const small = await testApp({ config: { JOBS_MAX_BYTES: 2048 } });
    try {
      const items = Array.from({ length: 16 }, (_, i) => ({ id: `plover-${i}`, kind: 'orbit', request: GOOD.orbit }));
      const res = await postJson(small, '/v1/jobs', { items });
      expect(res.statusCode, res.body).toBe(422);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(Problem.parse(res.json())).toMatchObject({ type: '/problems/limit-exceeded' });
      expect(res.json().detail).toMatch(/JOBS_MAX_BYTES/);
      expect(res.headers['retry-after']).toBeUndefined();
      // One item fits.
      expect((await postJson(small, '/v1/jobs', { items: items.slice(0, 1) })).statusCode).toBe(202);
    } finally {
      await small.close();
    }
  });
});
