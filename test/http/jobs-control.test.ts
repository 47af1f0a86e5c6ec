// Job control on the in-process queue (the BullMQ queue runs the same checks in
// test/jobs/bullmq-queue.test.ts): list, cancel, Idempotency-Key, deadline, one line by index, and
// what changed against an earlier job.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { JobAnswer, JobList, type BatchLine } from '../../src/schemas/batch.js';
import { Problem } from '../../src/schemas/common.js';
import { postJson, testApp } from '../helpers/app.js';
import { GOOD, parseLines, rawLines, until } from '../helpers/batch.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const status = async (id: string) => JobAnswer.parse((await app.inject({ url: `/v1/jobs/${id}` })).json());
async function submit(body: unknown, headers: Record<string, string> = {}): Promise<string> {
  const res = await postJson(app, '/v1/jobs', body, headers);
  expect(res.statusCode, res.body).toBe(202);
  return res.json().id as string;
}
const many = (n: number) => Array.from({ length: n }, (_, i) => ({ id: `o-${i}`, kind: 'orbit', request: { centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, raan: i + Math.random() } } }));

describe('job control (in-process queue)', () => {
  it('GET /v1/jobs: newest first, paged with a cursor; progress and an estimated finish while running', async () => {
    const ids = [await submit({ items: many(300) }), await submit({ items: many(2) }), await submit({ items: many(2) })];
    await until('first lines', async () => (await status(ids[0]!)).counts.done > 0);
    const running = await status(ids[0]!);
    expect(running.status).toBe('running'); // 300 items take many turns of the event loop
    expect(running.progress.fraction).toBe(running.counts.done / 300);
    expect(Date.parse(running.progress.estimatedFinishAt!)).toBeGreaterThan(Date.parse(running.startedAt!));
    const first = JobList.parse((await app.inject({ url: '/v1/jobs?limit=2' })).json());
    expect(first.jobs.map((j) => j.id)).toEqual([ids[2], ids[1]]);
    const second = JobList.parse((await app.inject({ url: `/v1/jobs?limit=2&cursor=${first.next}` })).json());
    expect(second.jobs[0]!.id).toBe(ids[0]);
    expect((await app.inject({ url: '/v1/jobs?cursor=abc' })).statusCode).toBe(400);
    await until('all done', async () => (await status(ids[2]!)).status === 'done');
    expect((await status(ids[0]!)).progress).toEqual({ fraction: 1, estimatedFinishAt: null });
  });

  it('DELETE /v1/jobs/{id}: a running job stops with its lines readable, a queued one never starts, a finished one answers 409', async () => {
    const running = await submit({ items: many(400) });
    const queued = await submit({ items: many(3) });
    await until('some lines', async () => (await status(running)).counts.done > 5);
    const a = await app.inject({ method: 'DELETE', url: `/v1/jobs/${queued}` });
    expect(JobAnswer.parse(a.json())).toMatchObject({ status: 'cancelled', counts: { done: 0 }, error: 'cancelled by the caller' });
    const b = await app.inject({ method: 'DELETE', url: `/v1/jobs/${running}` });
    const stopped = JobAnswer.parse(b.json());
    expect(stopped.status).toBe('cancelled');
    expect(stopped.counts.done).toBeLessThan(400);
    const lines = parseLines((await app.inject({ url: `/v1/jobs/${running}/results` })).rawPayload);
    expect(lines.map((l) => l.index)).toEqual(Array.from({ length: stopped.counts.done }, (_, i) => i));
    expect((await status(queued)).attempts).toBe(0);
    const again = await app.inject({ method: 'DELETE', url: `/v1/jobs/${running}` });
    expect(again.statusCode).toBe(409);
    expect(Problem.parse(again.json()).type).toBe('/problems/job-finished');
  });

  it('Idempotency-Key: the same key and body answer the same job, another body 409; keys of 201 characters are refused', async () => {
    const key = randomUUID();
    const body = { items: many(2) };
    const first = await submit(body, { 'idempotency-key': key });
    expect(await submit(body, { 'idempotency-key': key })).toBe(first);
    const other = await postJson(app, '/v1/jobs', { items: many(2) }, { 'idempotency-key': key });
    expect(other.statusCode).toBe(409);
    expect(Problem.parse(other.json()).type).toBe('/problems/idempotency-conflict');
    expect(await submit(body, { 'idempotency-key': `${key}-2` })).not.toBe(first);
    expect((await postJson(app, '/v1/jobs', body, { 'idempotency-key': 'k'.repeat(201) })).statusCode).toBe(400);
  });

  it('a deadline that passes stops the job as failed with the reason; a deadline too far ahead is 422', async () => {
    const id = await submit({ items: many(1000), deadline: new Date(Date.now() + 300).toISOString() });
    await until('failed', async () => (await status(id)).status === 'failed');
    const job = await status(id);
    expect(job.error).toMatch(/^deadline .* passed with \d+ of 1000 items done$/);
    expect(job.counts.done).toBeLessThan(1000);
    if (job.counts.done > 0) expect((await app.inject({ url: `/v1/jobs/${id}/results/0` })).statusCode).toBe(200);
    const far = await postJson(app, '/v1/jobs', { items: many(1), deadline: '2199-01-01T00:00:00Z' });
    expect(far.statusCode).toBe(422);
  });

  it('GET /v1/jobs/{id}/results/{index}: the item\'s line alone, byte for byte', async () => {
    const id = await submit({ items: [{ id: 'a', kind: 'orbit', request: GOOD.orbit }, { id: 'b', kind: 'track', request: GOOD.track }] });
    await until('done', async () => (await status(id)).status === 'done');
    const all = rawLines((await app.inject({ url: `/v1/jobs/${id}/results` })).rawPayload);
    for (const i of [0, 1]) {
      const one = await app.inject({ url: `/v1/jobs/${id}/results/${i}` });
      expect(one.headers['content-type']).toMatch(/^application\/json/);
      expect(one.rawPayload.equals(all[i]!)).toBe(true);
    }
    expect((await app.inject({ url: `/v1/jobs/${id}/results/2` })).statusCode).toBe(404);
  });
});

describe('job metrics', () => {
  it('/metrics counts jobs by state and their duration; batch and job items are not counted as requests to their endpoints', async () => {
    const own = await testApp();
    const id = (await postJson(own, '/v1/jobs', { items: many(3) })).json().id as string;
    await until('done', async () => JobAnswer.parse((await own.inject({ url: `/v1/jobs/${id}` })).json()).status === 'done');
    expect((await postJson(own, '/v1/batch', { items: many(2) })).statusCode).toBe(200);
    const metrics = (await own.inject({ url: '/metrics' })).body;
    expect(metrics).toMatch(/^apsides_jobs\{state="completed"\} 1$/m);
    expect(metrics).toMatch(/^apsides_jobs\{state="queued"\} 0$/m);
    expect(metrics).toMatch(/^apsides_job_duration_seconds_count 1$/m);
    expect(metrics).not.toMatch(/route="\/v1\/orbit"/);
    expect(metrics).toMatch(/^apsides_http_requests_total\{method="POST",route="\/v1\/batch",status="200"\} 1$/m);
    // A request of the client's own to the endpoint is counted, even with a forged marker header.
    await postJson(own, '/v1/orbit', GOOD.orbit, { 'x-apsides-item': 'guess' });
    expect((await own.inject({ url: '/metrics' })).body).toMatch(/^apsides_http_requests_total\{method="POST",route="\/v1\/orbit",status="200"\} 1$/m);
    await own.close();
  });
});

// What changed: the second job's orbit has a semi-major axis 0.5 km larger, so its passes drift
// later by about 1.5 * T * da / a per orbit (Kepler's third law, dT/T = 1.5 da/a): a few seconds
// over a day. The expected moves are computed here from the two jobs' own answers.
interface P { station: string; aos: string; tca: string; los: string; maxElevation: number }
describe('what changed (compareTo)', () => {
  const window = { start: EPOCH, stop: '2026-12-02T00:00:00Z' };
  const itemsFor = (semiMajorAxis: number) => [
    { id: 'plover-7-passes', kind: 'passes', request: { ...DEMO_ORBIT, elements: { ...DEMO_ORBIT.elements, semiMajorAxis }, window, stations: DEMO_STATIONS } },
    { id: 'plover-7-track', kind: 'track', request: { ...GOOD.track, elements: { ...DEMO_ORBIT.elements, semiMajorAxis } } },
    { id: 'only-today', kind: 'orbit', request: GOOD.orbit },
  ];

  it('lists per station the passes that moved by more than the thresholds, and the largest track difference, as the test computes them', async () => {
    const a = DEMO_ORBIT.elements.semiMajorAxis;
    const yesterday = await submit({ items: itemsFor(a).slice(0, 2) });
    await until('first done', async () => (await status(yesterday)).status === 'done');
    const thresholdSeconds = 3;
    const today = await submit({ items: itemsFor(a + 0.5), compareTo: yesterday, thresholdSeconds, thresholdDegrees: 0.5 });
    await until('second done', async () => (await status(today)).status === 'done');
    const [old, next] = (await Promise.all([yesterday, today].map(async (id) => parseLines((await app.inject({ url: `/v1/jobs/${id}/results` })).rawPayload)))) as [BatchLine[], BatchLine[]];
    const res = await app.inject({ url: `/v1/jobs/${today}/changes` });
    expect(res.statusCode, res.body).toBe(200);
    const changes = rawLines(res.rawPayload).map((l) => JSON.parse(l.toString()));
    expect(changes.map((c) => [c.index, c.id, c.change])).toEqual([[0, 'plover-7-passes', 'passes'], [1, 'plover-7-track', 'track'], [2, 'only-today', 'new-item']]);

    // Passes: pair each new pass with the old one of the same station whose interval overlaps it.
    const before = (old[0]!.answer as { passes: P[] }).passes;
    const after = (next[0]!.answer as { passes: P[] }).passes;
    const t = (s: string) => Date.parse(s) / 1000;
    const expected: Record<string, string[]> = {};
    let pairedAll = true;
    for (const p of after) {
      const q = before.filter((o) => o.station === p.station && t(o.aos) <= t(p.los) && t(p.aos) <= t(o.los));
      if (q.length !== 1) { pairedAll = false; continue; }
      const d = Math.max(Math.abs(t(p.aos) - t(q[0]!.aos)), Math.abs(t(p.tca) - t(q[0]!.tca)), Math.abs(t(p.los) - t(q[0]!.los)));
      if (d > thresholdSeconds || Math.abs(p.maxElevation - q[0]!.maxElevation) > 0.5) (expected[p.station] ??= []).push(p.tca);
    }
    expect(pairedAll, 'every pass has exactly one overlapping pass the day before').toBe(true);
    const got: Record<string, string[]> = {};
    for (const s of changes[0].stations) {
      if (s.moved.length > 0) got[s.station] = s.moved.map((m: { after: P }) => m.after.tca);
      expect(s.appeared).toEqual([]);
      expect(s.vanished).toEqual([]);
    }
    expect(got).toEqual(expected);
    const movedCount = Object.values(expected).flat().length;
    expect(movedCount, 'some passes moved more than the threshold').toBeGreaterThan(0);
    expect(movedCount, 'and some less').toBeLessThan(after.length);

    // Track: the largest distance between the two positions at the same epoch.
    type S = { epoch: string; position: number[] };
    const s0 = (old[1]!.answer as { samples: S[] }).samples;
    const s1 = (next[1]!.answer as { samples: S[] }).samples;
    const largest = Math.max(...s1.map((s, i) => Math.hypot(s.position[0]! - s0[i]!.position[0]!, s.position[1]! - s0[i]!.position[1]!, s.position[2]! - s0[i]!.position[2]!)));
    expect(changes[1].commonSamples).toBe(s1.length);
    expect(changes[1].maxPositionDifferenceKm).toBeCloseTo(largest, 9);
    expect(largest).toBeGreaterThan(0.1);
  });

  it('lists the eclipses that moved by more than thresholdSeconds, as the test pairs them', async () => {
    interface E { start: string; stop: string; umbraStart: string | null; umbraStop: string | null }
    const a = DEMO_ORBIT.elements.semiMajorAxis;
    const eclipseItem = (semiMajorAxis: number) => [{ id: 'plover-7-shadow', kind: 'eclipses', request: { ...DEMO_ORBIT, elements: { ...DEMO_ORBIT.elements, semiMajorAxis }, window } }];
    const yesterday = await submit({ items: eclipseItem(a) });
    await until('first done', async () => (await status(yesterday)).status === 'done');
    const thresholdSeconds = 2;
    const today = await submit({ items: eclipseItem(a + 0.5), compareTo: yesterday, thresholdSeconds });
    await until('second done', async () => (await status(today)).status === 'done');
    const [old, next] = (await Promise.all([yesterday, today].map(async (id) => parseLines((await app.inject({ url: `/v1/jobs/${id}/results` })).rawPayload)))) as [BatchLine[], BatchLine[]];
    const [line] = rawLines((await app.inject({ url: `/v1/jobs/${today}/changes` })).rawPayload).map((l) => JSON.parse(l.toString()));
    expect(line).toMatchObject({ index: 0, id: 'plover-7-shadow', kind: 'eclipses', change: 'eclipses', thresholdSeconds });

    // Pair each new eclipse with the one of the day before whose interval overlaps it; moved when
    // an entry or exit (penumbra or umbra) differs by more than the threshold.
    const before = (old[0]!.answer as { eclipses: E[] }).eclipses;
    const after = (next[0]!.answer as { eclipses: E[] }).eclipses;
    const t = (s: string | null) => (s === null ? 0 : Date.parse(s) / 1000);
    const expected: string[] = [];
    for (const e of after) {
      const q = before.filter((o) => t(o.start) <= t(e.stop) && t(e.start) <= t(o.stop));
      expect(q, `one eclipse the day before overlaps ${e.start}`).toHaveLength(1);
      const d = Math.max(...(['start', 'stop', 'umbraStart', 'umbraStop'] as const).map((k) => Math.abs(t(e[k]) - t(q[0]![k]))));
      if (d > thresholdSeconds) expected.push(e.start);
    }
    const earth = line.shadows.find((c: { shadow: string }) => c.shadow === 'earth');
    expect(earth.appeared).toEqual([]);
    expect(earth.vanished).toEqual([]);
    expect(earth.moved.map((m: { after: E }) => m.after.start)).toEqual(expected);
    expect(expected.length, 'some eclipses moved more than the threshold').toBeGreaterThan(0);
    expect(expected.length, 'and some less').toBeLessThan(after.length);
    const first = earth.moved[0];
    const pair = before.find((o) => t(o.start) <= t(first.after.stop) && t(first.after.start) <= t(o.stop))!;
    expect(first.deltaStartS).toBeCloseTo(t(first.after.start) - t(pair.start), 3);
  });

  it('compareTo an unknown job is 422 job-not-comparable; changes of a job without compareTo too', async () => {
    const res = await postJson(app, '/v1/jobs', { items: many(1), compareTo: randomUUID() });
    expect(res.statusCode).toBe(422);
    expect(Problem.parse(res.json()).type).toBe('/problems/job-not-comparable');
    const id = await submit({ items: many(1) });
    await until('done', async () => (await status(id)).status === 'done');
    expect((await app.inject({ url: `/v1/jobs/${id}/changes` })).statusCode).toBe(422);
  });
});
