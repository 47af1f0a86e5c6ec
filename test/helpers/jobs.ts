// Helpers for the BullMQ queue tests: a key prefix per run (deleted after, never a flush) and a
// runner whose lines can be held back.
import { randomUUID } from 'node:crypto';
import type { Redis } from 'ioredis';
import type { LineOut, RunLines } from '../../src/jobs/queue.js';

/** A prefix no other run uses: `apsides:test:<uuid>:<tag>:`. */
export const runPrefix = (tag: string) => `apsides:test:${randomUUID()}:${tag}:`;

/** Delete every key under the prefix (SCAN + DEL: never FLUSHDB on the shared Redis). */
export async function deleteKeys(redis: Redis, prefix: string): Promise<void> {
  let cursor = '0';
  do {
    const [next, keys] = await redis.scan(cursor, 'MATCH', `${prefix}*`, 'COUNT', 1000);
    if (keys.length > 0) await redis.del(...keys);
    cursor = next;
  } while (cursor !== '0');
}

/** The first `after` lines pass at once; the rest wait until `release()` (or until the run is aborted). */
export function stalling(inner: RunLines, after: number) {
  let release: () => void = () => {};
  const released = new Promise<void>((resolve) => { release = resolve; });
  const run: RunLines = async function* (job, from, signal): AsyncGenerator<LineOut> {
    let n = from;
    for await (const out of inner(job, from, signal)) {
      if (n++ >= after) {
        await Promise.race([released, new Promise<void>((resolve) => signal.addEventListener('abort', () => resolve(), { once: true }))]);
        if (signal.aborted) return;
      }
      yield out;
    }
  };
  return { run, release: () => release() };
}
