// The big-answer formatters make no JavaScript object a sample once they are optimised: the bytes
// go into the output chunks and nothing else is left for the garbage collector (a sample of a
// 100,000-sample track made 97 bytes of heap garbage before, 16 bytes for each number passed to a
// call that was not inlined, on the main thread and on the solver thread alike). Measured with
// V8's sampling heap profiler (node:inspector, HeapProfiler.startSampling, every 1 kB allocated
// sampled, collected objects counted). The table is an invented circular orbit (demo data); what
// is checked is the service's own property (common practice, no source), not a published value.
import { Session } from 'node:inspector/promises';
import { describe, expect, it } from 'vitest';
import { csvChunks } from '../../src/formats/csv.js';
import { STATE_FIELDS, trackJsonChunks } from '../../src/formats/track-json.js';
import { oemChunks } from '../../src/formats/oem.js';

const SAMPLES = 50_000;
const epochsTT = Float64Array.from({ length: SAMPLES }, (_, i) => 848_000_000 + 0.25 * i);
const states = new Float64Array(6 * SAMPLES);
for (let i = 0; i < SAMPLES; i++) {
  const u = 0.0011 * i;
  states.set([6928 * Math.cos(u), 692.8 * Math.sin(u), 6928 * Math.sin(u), -7.58 * Math.sin(u), 0.758 * Math.cos(u), 7.58 * Math.cos(u)], 6 * i);
}
const table = { epochsTT, states };
const META = { creationEpochTT: 848_000_000, originator: 'APSIDES TEST', objectName: 'LANTERN-3', objectId: '2026-900A', centerName: 'EARTH', refFrame: 'GCRF' };

/** Reads every chunk (a byte of each summed, so that nothing is optimised away). */
function drain(chunks: Iterable<Buffer>): number {
  let sink = 0;
  for (const c of chunks) sink += c[c.length >> 1]!;
  return sink;
}

/** JS heap bytes allocated a sample by format(), after warming it up (the interpreter boxes every number). */
async function heapBytesPerSample(format: () => number): Promise<number> {
  for (let i = 0; i < 12; i++) format();
  const session = new Session();
  session.connect();
  try {
    await session.post('HeapProfiler.startSampling', { samplingInterval: 1024, includeObjectsCollectedByMajorGC: true, includeObjectsCollectedByMinorGC: true } as never);
    const rounds = 3;
    for (let i = 0; i < rounds; i++) format();
    const { profile } = await session.post('HeapProfiler.stopSampling');
    let bytes = 0;
    const walk = (node: typeof profile.head): void => {
      bytes += node.selfSize;
      node.children.forEach(walk);
    };
    walk(profile.head);
    return bytes / rounds / SAMPLES;
  } finally {
    session.disconnect();
  }
}

describe('big-answer formatters on the JavaScript heap', () => {
  // The chunks themselves are memory outside the heap; what remains a sample is the chunk objects
  // (one per 64 KiB) and the profiler's own sampling error. 16 bytes is one boxed number a sample.
  const LIMIT = 16;
  it.each([
    ['CSV', () => drain(csvChunks(table))],
    ['JSON', () => drain(trackJsonChunks({ scenarioHash: 'test' }, epochsTT, states, STATE_FIELDS))],
    ['CCSDS OEM', () => drain(oemChunks(table, META))],
  ])('%s: under one boxed number a sample', async (_name, format) => {
    expect(await heapBytesPerSample(format)).toBeLessThan(LIMIT);
  }, 60_000);
});
