import { setImmediate as nextTurn } from 'node:timers/promises';
import { describe, expect, it } from 'vitest';
import { MemoryJobQueue } from '../../src/jobs/memory-queue.js';
import { JobTooLargeError, QueueUnavailableError, type LineOut, type RunLines } from '../../src/jobs/queue.js';
import type { BatchItem } from '../../src/schemas/batch.js';

const items = (n: number): BatchItem[] => Array.from({ length: n }, (_, i) => ({ id: `i${i}`, kind: 'orbit', request: {} }));

/** A runner whose lines are released by the test one at a time: no timing involved. */
function gatedRunner() {
  const started: string[] = [];
  let release: () => void = () => {};
  const run: RunLines = async function* (job, from, signal): AsyncGenerator<LineOut> {
    started.push(job.id);
    for (let i = from; i < job.items.length; i++) {
      await new Promise<void>((resolve) => {
        release = resolve;
        signal.addEventListener('abort', () => resolve(), { once: true });
      });
      if (signal.aborted) return;
      yield { line: Buffer.from(`{"index":${i}}\n`), failed: i % 2 === 1 };
    }
  };
  return { run, started, step: async () => { release(); await nextTurn(); } };
}

async function collect(lines: AsyncIterable<Buffer>): Promise<string> {
  let text = '';
  for await (const line of lines) text += line.toString();
  return text;
}

describe('MemoryJobQueue', () => {
  it('runs jobs one at a time in submission order, counting done and failed lines', async () => {
    const gate = gatedRunner();
    const queue = new MemoryJobQueue(gate.run, { maxKept: 10, ttlS: 60 });
    const a = await queue.enqueue({ label: 'a', items: items(2) });
    const b = await queue.enqueue({ items: items(1) });
    expect(a).toMatchObject({ status: 'queued', items: 2, done: 0, label: 'a' });
    expect(gate.started).toEqual([a.id]);
    expect((await queue.get(a.id))?.status).toBe('running');
    expect((await queue.get(b.id))?.status).toBe('queued');
    await gate.step();
    expect(await queue.get(a.id)).toMatchObject({ done: 1, failed: 0 });
    await gate.step();
    expect(await queue.get(a.id)).toMatchObject({ status: 'done', done: 2, failed: 1 });
    expect(gate.started).toEqual([a.id, b.id]);
    await gate.step();
    expect((await queue.get(b.id))?.status).toBe('done');
    expect(await collect(queue.results(a.id))).toBe('{"index":0}\n{"index":1}\n');
    await queue.close();
  });

  it('refuses a job when every kept job is unfinished, then drops the oldest finished one first', async () => {
    const gate = gatedRunner();
    const queue = new MemoryJobQueue(gate.run, { maxKept: 2, ttlS: 60 });
    const a = await queue.enqueue({ items: items(1) });
    const b = await queue.enqueue({ items: items(1) });
    await expect(queue.enqueue({ items: items(1) })).rejects.toBeInstanceOf(QueueUnavailableError);
    await gate.step(); // a done
    const c = await queue.enqueue({ items: items(1) });
    expect(await queue.get(a.id)).toBeUndefined();
    expect((await queue.get(b.id))?.status).toBe('running');
    expect((await queue.get(c.id))?.status).toBe('queued');
    await queue.close();
  });

  it('drops finished jobs JOB_RESULT_TTL_S after their last progress (never unfinished ones)', async () => {
    let now = Date.parse('2026-12-01T00:00:00Z');
    const gate = gatedRunner();
    const queue = new MemoryJobQueue(gate.run, { maxKept: 10, ttlS: 60, now: () => now });
    const a = await queue.enqueue({ items: items(1) });
    const b = await queue.enqueue({ items: items(1) });
    await gate.step(); // a done at t0
    now += 61_000;
    expect(await queue.get(a.id)).toBeUndefined();
    expect((await queue.get(b.id))?.status).toBe('running'); // running for longer than the TTL: kept
    expect((await queue.get(b.id))?.createdAt).toBe('2026-12-01T00:00:00.000Z');
    await queue.close();
  });

  it('stop() ends the running job as failed with the reason, never leaves it running, and takes no new job', async () => {
    const gate = gatedRunner();
    const queue = new MemoryJobQueue(gate.run, { maxKept: 10, ttlS: 60 });
    const a = await queue.enqueue({ items: items(3) });
    await gate.step();
    await queue.stop();
    const stopped = await queue.get(a.id);
    expect(stopped).toMatchObject({ status: 'failed', done: 1 });
    expect(stopped?.error).toMatch(/stopped after 1 of 3 items/);
    await expect(queue.enqueue({ items: items(1) })).rejects.toBeInstanceOf(QueueUnavailableError);
  });

  it('an unknown or malformed id is undefined', async () => {
    const queue = new MemoryJobQueue(gatedRunner().run, { maxKept: 1, ttlS: 60 });
    expect(await queue.get('00000000-0000-4000-8000-000000000000')).toBeUndefined();
    expect(await queue.get('__proto__')).toBeUndefined();
    expect(() => new MemoryJobQueue(gatedRunner().run, { maxKept: 0, ttlS: 60 })).toThrow(RangeError);
  });

  it('keeps the submitting caller as the job\'s owner (null when open)', async () => {
    const queue = new MemoryJobQueue(gatedRunner().run, { maxKept: 10, ttlS: 60 });
    const mine = await queue.enqueue({ items: items(1), owner: 'key-a' });
    const open = await queue.enqueue({ items: items(1) });
    expect(mine.owner).toBe('key-a');
    expect((await queue.get(mine.id))?.owner).toBe('key-a');
    expect((await queue.get(open.id))?.owner).toBeNull();
    await expect(queue.ping()).resolves.toBeUndefined();
    await queue.close();
    await expect(queue.ping()).rejects.toBeInstanceOf(QueueUnavailableError);
  });
});

describe('MemoryJobQueue bounded in bytes (JOBS_MAX_BYTES)', () => {
  const LINE = 1000;
  /** Every line is LINE bytes (a newline-terminated JSON string). */
  const fixedRunner: RunLines = async function* (job, from): AsyncGenerator<LineOut> {
    for (let i = from; i < job.items.length; i++) {
      await nextTurn();
      yield { line: Buffer.from(`"${'x'.repeat(LINE - 3)}"\n`), failed: false };
    }
  };
  const settle = async (queue: MemoryJobQueue, id: string) => {
    for (let i = 0; i < 1000 && !['done', 'failed', 'cancelled'].includes((await queue.get(id))!.status); i++) await nextTurn();
    return (await queue.get(id))!;
  };

  it('drops the oldest finished jobs to make room, and counts their bytes back', async () => {
    const queue = new MemoryJobQueue(fixedRunner, { maxKept: 100, ttlS: 60, maxBytes: 12_000 });
    const a = await queue.enqueue({ items: items(5) });
    expect((await settle(queue, a.id)).status).toBe('done');
    const b = await queue.enqueue({ items: items(5) });
    expect((await settle(queue, b.id)).status).toBe('done');
    expect(queue.bytes).toBe(10 * LINE); // items are let go once run; the lines stay
    const c = await queue.enqueue({ items: items(5) });
    expect((await settle(queue, c.id)).status).toBe('done');
    expect(await queue.get(a.id)).toBeUndefined();
    expect(await queue.get(b.id)).toBeDefined();
    expect(queue.bytes).toBe(10 * LINE);
  });

  it('refuses a new job when only unfinished jobs hold the bytes', async () => {
    const gate = gatedRunner();
    const big = Array.from({ length: 4 }, (_, i) => ({ id: `i${i}`, kind: 'orbit' as const, request: { note: 'y'.repeat(600) } }));
    const queue = new MemoryJobQueue(gate.run, { maxKept: 100, ttlS: 60, maxBytes: 3000 });
    await queue.enqueue({ items: big });
    const refused = queue.enqueue({ items: big });
    await expect(refused).rejects.toBeInstanceOf(QueueUnavailableError);
    await expect(refused).rejects.toThrow(/JOBS_MAX_BYTES/);
    await expect(refused).rejects.toMatchObject({ retryAfterS: 30 });
    await queue.stop();
  });

  it('a job whose items alone pass the bound is refused as too large (not retryable), and drops nothing to make room', async () => {
    const queue = new MemoryJobQueue(fixedRunner, { maxKept: 100, ttlS: 60, maxBytes: 3000 });
    const kept = await queue.enqueue({ items: items(2) });
    expect((await settle(queue, kept.id)).status).toBe('done');
    const huge = Array.from({ length: 4 }, (_, i) => ({ id: `i${i}`, kind: 'orbit' as const, request: { note: 'y'.repeat(1000) } }));
    const refused = queue.enqueue({ items: huge });
    await expect(refused).rejects.toBeInstanceOf(JobTooLargeError);
    await expect(refused).rejects.toThrow(/JOBS_MAX_BYTES/);
    expect(await queue.get(kept.id)).toBeDefined();
    await queue.stop();
  });

  it('a running job whose lines would pass the bound fails, with the lines written kept within it', async () => {
    const queue = new MemoryJobQueue(fixedRunner, { maxKept: 100, ttlS: 60, maxBytes: 3500 });
    const job = await queue.enqueue({ items: items(10) });
    const end = await settle(queue, job.id);
    expect(end.status).toBe('failed');
    expect(end.error).toMatch(/JOBS_MAX_BYTES/);
    expect(end.done).toBe(3);
    expect(queue.bytes).toBe(3 * LINE);
    expect((await queue.line(job.id, 2))?.length).toBe(LINE);
  });
});
