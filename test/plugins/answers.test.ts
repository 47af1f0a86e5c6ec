// inTurns (src/plugins/answers.ts): a streamed answer is read in slices with a turn of the event
// loop between them, so the main thread answers other requests while a big answer is formatted.
// The clock is a fake one advanced by the chunk generator: one millisecond per chunk formatted.
import { describe, expect, it } from 'vitest';
import { concatInTurns, inTurns, jsonAnswer, jsonAnswerInTurns, Slices } from '../../src/plugins/answers.js';
import { ProblemError } from '../../src/errors.js';

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

// jsonAnswerInTurns must give the bytes of jsonAnswer (JSON.stringify of the whole answer) and
// refuse the same non-finite number with the same path. Invented answer shapes.
describe('jsonAnswerInTurns', () => {
  const item = (i: number) => ({ id: `site-${i % 3}`, aos: `2026-12-0${1 + (i % 5)}T00:00:00Z`, maxElevation: 10 + i / 7, pointing: i % 4 ? [] : [{ az: i * 1.25, el: -0.5 }] });
  const head = (extra: Record<string, unknown> = {}) => ({ scenarioHash: 'abc', window: { start: 'a', stop: 'b' }, passes: [] as unknown[], skipped: undefined, diagnostics: { n: 3, note: 'é "q"' }, ...extra });
  /** A clock for which every slice is due: a turn after every item. */
  const everyItem = () => { let t = 0; return new Slices(1, () => (t += 1)); };

  it.each([0, 1, 2, 250])('the same bytes as jsonAnswer for %i items, with a turn of the loop after every item or none', async (count) => {
    const whole = jsonAnswer({ ...head(), passes: Array.from({ length: count }, (_, i) => item(i)) });
    for (const slices of [everyItem(), new Slices(Infinity)]) {
      const sliced = await jsonAnswerInTurns(head(), 'passes', count, item, slices);
      expect(sliced.contentType).toBe(whole.contentType);
      expect(sliced.body.equals(whole.body)).toBe(true);
    }
  });

  const problemPath = async (make: () => unknown): Promise<string> => {
    try {
      await make();
    } catch (error) {
      if (error instanceof ProblemError) return JSON.stringify(error.errors ?? error.message);
      throw error;
    }
    return 'no problem';
  };

  it.each<[string, object, (i: number) => unknown]>([
    ['an item', head(), (i: number) => ({ ...item(i), maxElevation: i === 7 ? Number.NaN : 1 })],
    ['the head after the list', head({ diagnostics: { n: Infinity } }), item],
    ['the head before the list, and an item', { coarse: -Infinity, ...head() }, (i: number) => ({ x: i === 2 ? Number.NaN : i })],
  ])('refuses a non-finite number in %s naming the path jsonAnswer names', async (_, h, make) => {
    const expected = await problemPath(() => jsonAnswer({ ...h, passes: Array.from({ length: 10 }, (_, i) => make(i)) }));
    expect(expected).toMatch(/answer\./);
    expect(await problemPath(() => jsonAnswerInTurns(h, 'passes', 10, make, everyItem()))).toBe(expected);
  });
});

describe('concatInTurns', () => {
  it('gives Buffer.concat of the chunks, with a turn after every chunk or none', async () => {
    const chunks = Array.from({ length: 40 }, (_, i) => Buffer.from(`chunk ${i} `.repeat(i)));
    const size = chunks.reduce((n, c) => n + c.length, 0);
    let t = 0;
    for (const slices of [new Slices(1, () => (t += 1)), new Slices(Infinity)]) {
      expect((await concatInTurns(chunks, size, slices)).equals(Buffer.concat(chunks, size))).toBe(true);
    }
  });
});
