// inTurns (src/plugins/answers.ts): a streamed answer is read in slices with a turn of the event
// loop between them, so the main thread answers other requests while a big answer is formatted.
// The clock is a fake one advanced by the chunk generator: one millisecond per chunk formatted.
import { describe, expect, it } from 'vitest';
import { inTurns } from '../../src/plugins/answers.js';

/** Counts turns of the event loop: a setImmediate callback that schedules itself again. */
function loopTurns(): { readonly count: () => number; stop: () => void } {
  let turns = 0;
  let timer: NodeJS.Immediate = setImmediate(function tick() { turns++; timer = setImmediate(tick); });
  return { count: () => turns, stop: () => clearImmediate(timer) };
}

/** Reads `count` chunks through inTurns with slices of sliceMs; notes the loop turns seen when each chunk was formatted. */
async function read(count: number, sliceMs: number): Promise<{ text: string; turnsAt: number[] }> {
  let clock = 0;
  const turns = loopTurns();
  const turnsAt: number[] = [];
  function* chunks(): Generator<string | Buffer> {
    for (let i = 0; i < count; i++) {
      turnsAt.push(turns.count());
      clock += 1; // formatting this chunk took 1 ms
      yield i % 2 ? Buffer.from(`b${i};`) : `s${i};`;
    }
  }
  const parts: Buffer[] = [];
  try {
    for await (const b of inTurns(chunks(), sliceMs, () => clock)) parts.push(b);
  } finally {
    turns.stop();
  }
  return { text: Buffer.concat(parts).toString(), turnsAt };
}

describe('inTurns', () => {
  it('gives every chunk, strings as bytes, in order', async () => {
    const { text } = await read(7, 3);
    expect(text).toBe('s0;b1;s2;b3;s4;b5;s6;');
  });

  it('lets the event loop turn after each slice of 3 ms, and not within a slice', async () => {
    const { turnsAt } = await read(9, 3);
    // Chunks 0-2 are the first slice, 3-5 the second, 6-8 the third.
    for (const slice of [[0, 1, 2], [3, 4, 5], [6, 7, 8]]) {
      expect(new Set(slice.map((i) => turnsAt[i])).size).toBe(1);
    }
    expect(turnsAt[3]!).toBeGreaterThan(turnsAt[2]!);
    expect(turnsAt[6]!).toBeGreaterThan(turnsAt[5]!);
  });

  it('without a slice limit the whole answer is read in one turn (what a fast socket used to allow)', async () => {
    const { turnsAt } = await read(9, Infinity);
    expect(new Set(turnsAt).size).toBe(1);
  });
});
