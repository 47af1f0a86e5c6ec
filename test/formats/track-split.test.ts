// A long CSV or JSON track is written in two parts at once (src/formats/track-output.ts): the
// first records here, the last ones by the solver thread that computed the track, after it has
// sent the track on (SolverPool.trackWithTail). The answer must be the same bytes as written in
// one piece, whoever writes the last records, and the track must arrive whatever happens to them.
// The orbit is an invented 550 km circular one (demo data); the checks compare the service with
// itself (one piece against two, the thread against this thread), and the HTTP check reads the
// records back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { SPLIT_MIN_SAMPLES, TailBytes, trackProduct, trackTail, type TrackFormat, type TrackFrame, type TrackProductInput } from '../../src/formats/track-output.js';
import { ChunkPool } from '../../src/formats/chunk-pool.js';
import { BODIES } from '../../src/solver/bodies/bodies.js';
import { geodeticDegrees, printedStates, runJob, type TrackJob, type TrackJobResult } from '../../src/workers/jobs.js';
import { SolverPool, WorkerFailedError } from '../../src/workers/pool.js';
import { parseUtcIso } from '../../src/solver/time/time.js';
import { postJson, testApp } from '../helpers/app.js';

const N = SPLIT_MIN_SAMPLES + 1234;
const T0 = (() => {
  const r = parseUtcIso('2026-12-01T00:00:00Z');
  if (!r.ok) throw new Error(r.message);
  return r.value;
})();
const EARTH = BODIES.earth;
const A = 6928.137;
const SPEED = Math.sqrt(EARTH.gm / A);
const INCLINATION = (97.6 * Math.PI) / 180;

/** The track job of a frame; its own grid each time (the grid's buffer moves to the thread). */
function jobFor(frame: TrackFrame, input: Partial<TrackJob['input']> = {}): TrackJob {
  const earthFixed = frame === 'itrf' || frame === 'geodetic';
  return {
    kind: 'track',
    input: {
      body: EARTH, model: 'two-body', r0: [A, 0, 0], v0: [0, SPEED * Math.cos(INCLINATION), SPEED * Math.sin(INCLINATION)], epochTT: T0,
      epochsTT: Float64Array.from({ length: N }, (_, i) => T0 + 7.25 * i), ...input,
    },
    earthFixed: earthFixed ? { dut1: 0.2 } : null,
    geodetic: frame === 'geodetic',
    teme: frame === 'teme',
    ...(frame === 'teme' ? { temeFrame: { dut1: 0.2 } } : {}),
  };
}

function productInput(format: TrackFormat, frame: TrackFrame, r: TrackJobResult): TrackProductInput {
  return {
    format, frame, epochsTT: r.track.epochsTT, states: printedStates(r, frame === 'teme'), geodeticDeg: r.geodetic ? geodeticDegrees(r.geodetic) : null,
    head: { scenarioHash: 'test', object: { name: 'Kestrel-9 ü', id: 'K9' }, sampleCount: N },
    object: { name: 'Kestrel-9 ü', id: 'K9' },
    oem: { creationEpochTT: T0, centerName: 'EARTH', comments: [] },
  };
}

async function bytesOf(t: TrackProductInput, tail?: TailBytes): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const c of trackProduct(t, tail).chunks) parts.push(typeof c === 'string' ? Buffer.from(c) : c);
  return Buffer.concat(parts);
}

function solved(r: ReturnType<typeof runJob<TrackJob>>): TrackJobResult {
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

let pool: SolverPool;
beforeAll(() => { pool = new SolverPool({ threads: 1, queueLimit: 2 }); });
afterAll(async () => { await pool.close(); });

describe('a long track written in two parts', () => {
  const cases: Array<[TrackFormat, TrackFrame]> = [['csv', 'gcrf'], ['json', 'gcrf'], ['csv', 'geodetic'], ['json', 'geodetic'], ['csv', 'itrf'], ['json', 'teme']];
  it.each(cases)('%s, frame %s: the same bytes as in one piece, with the last records from the thread or written here', async (format, frame) => {
    const whole = await bytesOf(productInput(format, frame, solved(runJob(jobFor(frame)))));
    const plan = trackTail(format, frame, N)!;
    expect(plan.from).toBeGreaterThan(0);
    expect(plan.from).toBeLessThan(N);
    const onThread = pool.trackWithTail(jobFor(frame), plan);
    const fromThread = productInput(format, frame, solved(await onThread.result));
    expect((await bytesOf(fromThread, new TailBytes(onThread.tail))).equals(whole)).toBe(true);
    // Into an arena of shared memory: the same bytes; the states at the arena's start (the
    // two-body model writes them there), the thread's part of the records right after them.
    const arena = Buffer.from(new SharedArrayBuffer(12 * 2 ** 20));
    arena.fill(0x5a); // not zero: every state must be written
    const inArena = pool.trackWithTail(jobFor(frame), plan, arena.buffer as SharedArrayBuffer);
    const parts = await inArena.tail;
    const inArenaResult = solved(await inArena.result);
    const states = inArenaResult.track.states;
    expect(states.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Buffer.compare(Buffer.from(states.buffer, states.byteOffset, states.byteLength), arena.subarray(0, 48 * N))).toBe(0);
    expect(Array.from(states)).toEqual(Array.from(solved(runJob(jobFor(frame))).track.states));
    expect(parts[0]!.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Buffer.compare(parts[0]!, arena.subarray(48 * N, 48 * N + parts[0]!.length))).toBe(0);
    const tailInArena = new TailBytes(inArena.tail);
    tailInArena.holds(states);
    expect((await bytesOf(productInput(format, frame, inArenaResult), tailInArena)).equals(whole)).toBe(true);
    // The thread could not write them (stopped, died): they are written here, the same bytes.
    const again = productInput(format, frame, solved(runJob(jobFor(frame))));
    expect((await bytesOf(again, new TailBytes(Promise.reject(new Error('the thread stopped'))))).equals(whole)).toBe(true);
    if (format === 'json') expect(JSON.parse(whole.toString()).samples).toHaveLength(N);
    else expect(whole.toString().split('\r\n')).toHaveLength(N + 2); // header, N records, the empty string after the last CRLF
  });

  it('the grid at the arena\'s start (as the route writes it): the states after it, the records after them, the same bytes', async () => {
    for (const format of ['csv', 'json'] as const) {
      const whole = await bytesOf(productInput(format, 'gcrf', solved(runJob(jobFor('gcrf')))));
      const arena = Buffer.from(new SharedArrayBuffer(12 * 2 ** 20));
      arena.fill(0x5a);
      const job = jobFor('gcrf');
      const grid = new Float64Array(arena.buffer, 0, N);
      grid.set(job.input.epochsTT);
      const lent: TrackJob = { ...job, input: { ...job.input, epochsTT: grid } };
      const run = pool.trackWithTail(lent, trackTail(format, 'gcrf', N)!, arena.buffer as SharedArrayBuffer);
      const parts = await run.tail;
      const r = solved(await run.result);
      // Shared, not moved: the route's grid is still there, and the track's grid is the same memory.
      expect(grid.length).toBe(N);
      expect(Array.from(r.track.epochsTT)).toEqual(Array.from(grid));
      expect(r.track.epochsTT.buffer).toBeInstanceOf(SharedArrayBuffer);
      expect(r.track.states.byteOffset).toBe(8 * N);
      expect(Buffer.compare(Buffer.from(r.track.states.buffer, r.track.states.byteOffset, 48 * N), arena.subarray(8 * N, 56 * N))).toBe(0);
      expect(Buffer.compare(parts[0]!, arena.subarray(56 * N, 56 * N + parts[0]!.length))).toBe(0);
      const tail = new TailBytes(run.tail);
      tail.holds(r.track.epochsTT, r.track.states);
      expect((await bytesOf(productInput(format, 'gcrf', r), tail)).equals(whole), format).toBe(true);
    }
  });

  it('one thread, tracks of other lengths and widths in turn (its scratch reused): the same bytes as in one piece', async () => {
    for (const [frame, count] of [['gcrf', N], ['geodetic', SPLIT_MIN_SAMPLES + 3], ['teme', N - 999], ['geodetic', N]] as const) {
      const job = (): TrackJob => { const j = jobFor(frame); return { ...j, input: { ...j.input, epochsTT: j.input.epochsTT.slice(0, count) } }; };
      const whole = await bytesOf(productInput('csv', frame, solved(runJob(job()))));
      const onThread = pool.trackWithTail(job(), trackTail('csv', frame, count)!);
      expect((await bytesOf(productInput('csv', frame, solved(await onThread.result)), new TailBytes(onThread.tail))).equals(whole), `${frame} ${count}`).toBe(true);
    }
  });

  it('the arena goes back once every answer that took the bytes was delivered, never after a failure or an answer not delivered', async () => {
    const arenas = new ChunkPool(8192 + 1, 4, (n) => new SharedArrayBuffer(n));
    const make = (bytes: Promise<readonly Buffer[]>): TailBytes => new TailBytes(bytes, arenas.acquire(), arenas);
    const ok = make(Promise.resolve([Buffer.from('x')]));
    expect(ok.take()).not.toBeNull();
    expect(ok.take()).not.toBeNull();
    ok.settled(true);
    expect(arenas.size).toBe(0); // one answer still streaming
    ok.settled(true);
    expect(arenas.size).toBe(1);
    expect(ok.take()).toBeNull(); // gone back: a later answer writes the records itself
    const cut = make(Promise.resolve([Buffer.from('x')])); // takes the arena just given back
    expect(arenas.size).toBe(0);
    cut.take();
    cut.take();
    cut.settled(false);
    cut.settled(true);
    expect(arenas.size).toBe(0); // an answer cut short (or not on a socket): kept out of the pool
    const failed = make(Promise.reject(new Error('the thread died')));
    failed.take();
    await new Promise((r) => setImmediate(r));
    failed.settled(true);
    expect(arenas.size).toBe(0); // the thread may still be writing it
    // An answer formatted after the arena went back: the same bytes, all written here.
    const t = productInput('csv', 'gcrf', solved(runJob(jobFor('gcrf'))));
    expect((await bytesOf(t, ok)).equals(await bytesOf(t))).toBe(true);
    // ... unless the track's states were in the arena: then no answer can be made from them.
    const held = make(Promise.resolve([Buffer.from('x')]));
    held.holds(new Float64Array(new SharedArrayBuffer(48)));
    expect(held.take()).not.toBeNull();
    held.settled(true);
    expect(arenas.size).toBe(1);
    expect(() => held.take()).toThrow(/given back/);
    // States of the thread's own memory (a model that makes its own array) do not count.
    const own = make(Promise.resolve([Buffer.from('x')]));
    own.holds(new Float64Array(6));
    own.take();
    own.settled(true);
    expect(own.take()).toBeNull();
  });

  it('a short track, OEM, GeoJSON and SVG are written in one piece', () => {
    expect(trackTail('csv', 'gcrf', SPLIT_MIN_SAMPLES - 1)).toBeNull();
    expect(trackTail('csv', 'gcrf', SPLIT_MIN_SAMPLES)).not.toBeNull();
    for (const format of ['oem', 'geojson', 'svg'] as const) expect(trackTail(format, 'gcrf', N)).toBeNull();
  });

  it('a track that fails is the result, and its tail rejects (nothing to write)', async () => {
    // Periapsis inside the Earth: 7000 km at 3 km/s (the impact failure of propagateTrack).
    const solving = pool.trackWithTail(jobFor('gcrf', { v0: [0, 3, 0] }), trackTail('csv', 'gcrf', N)!);
    const r = await solving.result;
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.code).toBe('impact');
    await expect(solving.tail).rejects.toThrow(/no records/);
  });

  it('records that fail on the thread after the track was sent: the track still arrives, the tail rejects', async () => {
    // A three-column CSV spec over six-column states: the formatter throws once the track is sent.
    const solving = pool.trackWithTail(jobFor('gcrf'), { ...trackTail('csv', 'geodetic', N)!, geodetic: false });
    expect(solved(await solving.result).track.epochsTT).toHaveLength(N);
    await expect(solving.tail).rejects.toBeInstanceOf(WorkerFailedError);
  });

  it('a thread that throws before it sends the track: the result rejects (no wait for a message that never comes)', async () => {
    // Geodetic records asked of a job that computes none: a programmer error before the send.
    const solving = pool.trackWithTail(jobFor('gcrf'), trackTail('csv', 'geodetic', N)!);
    await expect(solving.result).rejects.toBeInstanceOf(WorkerFailedError);
    await expect(solving.tail).rejects.toBeInstanceOf(WorkerFailedError);
  });
});

describe('POST /v1/track of more than SPLIT_MIN_SAMPLES samples', () => {
  let app: FastifyInstance;
  beforeAll(async () => { app = await testApp({ config: { CACHE_MAX_BYTES: 0 } }); });
  afterAll(async () => { await app.close(); });

  it.each(['csv', 'json'] as const)('%s: every sample once, in order, on the grid (no record lost or doubled where the parts meet)', async (format) => {
    const count = SPLIT_MIN_SAMPLES + 777;
    const stop = new Date(Date.parse('2026-12-01T00:00:00Z') + (count - 1) * 2000).toISOString();
    const res = await postJson(app, '/v1/track', {
      centralBody: 'earth', format,
      elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 },
      grid: { start: '2026-12-01T00:00:00Z', stop, step: 2 },
    });
    expect(res.statusCode).toBe(200);
    const epochs = format === 'json'
      ? (res.json() as { samples: Array<{ epoch: string }> }).samples.map((s) => s.epoch)
      : res.body.split('\r\n').slice(1, -1).map((line) => line.split(',')[0]!);
    expect(epochs).toHaveLength(count);
    epochs.forEach((e, i) => expect(Date.parse(e) - Date.parse('2026-12-01T00:00:00Z')).toBe(2000 * i));
  });
});

describe('numbers that cannot be printed are refused before anything streams', () => {
  const small = (): TrackProductInput => {
    const t = productInput('json', 'gcrf', solved(runJob(jobFor('gcrf'))));
    return { ...t, epochsTT: t.epochsTT.subarray(0, 10), states: t.states.slice(0, 60) };
  };
  const refusal = (t: TrackProductInput): { code: string; message: string } => {
    try {
      trackProduct(t);
    } catch (error) {
      return error as { code: string; message: string };
    }
    throw new Error('not refused');
  };
  it('a NaN: 422 non-finite-result naming the sample and column; a huge number: limit-exceeded; both: the non-finite one first', () => {
    const nan = small();
    nan.states[6 * 3 + 4] = Number.NaN;
    expect(refusal(nan)).toMatchObject({ code: 'non-finite-result', message: expect.stringMatching(/^answer\.samples\.3\.velocity\.1 /) });
    const huge = small();
    huge.states[6 * 2] = 1e22;
    expect(refusal(huge)).toMatchObject({ code: 'limit-exceeded', message: expect.stringMatching(/^sample 2 reaches 1e\+22 /) });
    const both = small();
    both.states[6 * 2] = -1e22;
    both.states[6 * 5 + 1] = Number.POSITIVE_INFINITY;
    expect(refusal(both)).toMatchObject({ code: 'non-finite-result', message: expect.stringMatching(/^answer\.samples\.5\.position\.1 /) });
    expect(() => trackProduct(small())).not.toThrow();
  });
});
