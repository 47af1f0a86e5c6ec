// A long CSV or JSON track is written in two parts at once (src/formats/track-output.ts): the
// first records here, the last ones by a TailWriter (a solver thread). The answer must be the same
// bytes as written in one piece, whoever writes the tail, and whether or not the tail can be
// written elsewhere. The states are an invented circular orbit (demo data); the checks compare
// the service with itself (one piece against two), and the HTTP check reads the records back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { SPLIT_MIN_SAMPLES, trackProduct, type TailWriter, type TrackFormat, type TrackFrame, type TrackProductInput } from '../../src/formats/track-output.js';
import { runJob } from '../../src/workers/jobs.js';
import { SolverPool } from '../../src/workers/pool.js';
import { parseUtcIso } from '../../src/solver/time/time.js';
import { postJson, testApp } from '../helpers/app.js';

const N = SPLIT_MIN_SAMPLES + 1234;
const T0 = (() => {
  const r = parseUtcIso('2026-12-01T00:00:00Z');
  if (!r.ok) throw new Error(r.message);
  return r.value;
})();

function input(format: TrackFormat, frame: TrackFrame): TrackProductInput {
  const epochsTT = Float64Array.from({ length: N }, (_, i) => T0 + 7.25 * i);
  const states = new Float64Array(6 * N);
  const geodeticDeg = new Float64Array(3 * N);
  const n = Math.sqrt(398_600.4418 / 6928 ** 3);
  for (let i = 0; i < N; i++) {
    const [c, s] = [Math.cos(n * 7.25 * i), Math.sin(n * 7.25 * i)];
    states.set([6928 * c, -0.1 * 6928 * s, 6928 * s, -7.58 * s, 0.758 * c, 7.58 * c], 6 * i);
    geodeticDeg.set([80 * s, ((i * 0.37) % 360) - 180, 550 + c], 3 * i);
  }
  return {
    format, frame, epochsTT, states, geodeticDeg,
    head: { scenarioHash: 'test', object: { name: 'Kestrel-9 ü', id: 'K9' }, sampleCount: N },
    object: { name: 'Kestrel-9 ü', id: 'K9' },
    oem: { creationEpochTT: T0, centerName: 'EARTH', comments: [] },
  };
}

async function bytesOf(t: TrackProductInput, tail?: TailWriter): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const c of trackProduct(t, tail).chunks) parts.push(typeof c === 'string' ? Buffer.from(c) : c);
  return Buffer.concat(parts);
}

/** The tail as the solver thread writes it (runJob is what the thread runs), here. */
const inline: TailWriter = async (spec, epochsTT, values, from) => {
  const width = values.length / epochsTT.length;
  return Buffer.from(runJob({ kind: 'records', spec, epochsTT: epochsTT.slice(from), values: values.slice(width * from) }));
};

let pool: SolverPool;
beforeAll(() => { pool = new SolverPool({ threads: 1, queueLimit: 2 }); });
afterAll(async () => { await pool.close(); });

describe('a long track written in two parts', () => {
  const cases: Array<[TrackFormat, TrackFrame]> = [['csv', 'gcrf'], ['json', 'gcrf'], ['csv', 'geodetic'], ['json', 'geodetic']];
  it.each(cases)('%s, frame %s: the same bytes as in one piece, with the tail written here, on a thread, or refused', async (format, frame) => {
    const t = input(format, frame);
    const whole = await bytesOf(t);
    const onThread: TailWriter = async (spec, epochsTT, values, from) => {
      const width = values.length / epochsTT.length;
      const u = await pool.inWorker({ kind: 'records', spec, epochsTT: epochsTT.slice(from), values: values.slice(width * from) });
      return Buffer.from(u.buffer, u.byteOffset, u.byteLength);
    };
    let asked = 0;
    const refused: TailWriter = async () => { asked++; throw new Error('no thread free'); };
    expect((await bytesOf(t, inline)).equals(whole)).toBe(true);
    expect((await bytesOf(t, onThread)).equals(whole)).toBe(true);
    expect((await bytesOf(t, refused)).equals(whole)).toBe(true);
    expect(asked).toBe(1); // the tail was asked for, refused, and written here
    if (format === 'json') expect(JSON.parse(whole.toString()).samples).toHaveLength(N);
    else expect(whole.toString().split('\r\n')).toHaveLength(N + 2); // header, N records, the empty string after the last CRLF
  });

  it('a short track is written in one piece: the tail writer is not asked', async () => {
    const t = input('csv', 'gcrf');
    const short = { ...t, epochsTT: t.epochsTT.subarray(0, 100), states: t.states.subarray(0, 600) };
    let asked = 0;
    await bytesOf(short, async () => { asked++; return Buffer.alloc(0); });
    expect(asked).toBe(0);
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
