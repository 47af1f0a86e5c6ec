// Output chunks, and the arenas a solver thread writes a long track's last records into, are
// reused from one streamed answer to the next (src/formats/chunk-pool.ts): a chunk goes back only
// once its response has finished on a real socket, an arena once every response that streamed it has. Proven here
// by answers that would show any early reuse: different scenarios streamed at once over real
// sockets (plain and gzip, cache off and on), each compared byte for byte with the same answer
// taken alone through inject (which never gives chunks back). The orbits are invented demo data;
// the check is the service against itself.
import { request } from 'node:http';
import type { AddressInfo } from 'node:net';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { ChunkPool, OUTPUT_CHUNKS, TAIL_ARENAS } from '../../src/formats/chunk-pool.js';
import { postJson, testApp } from '../helpers/app.js';

const scenario = (i: number, format: 'csv' | 'json', long = false) => ({
  centralBody: 'earth', format,
  elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6878 + 150 * i, eccentricity: 0.001 * (i + 1), inclination: 40 + 17 * i, raan: 33 * i, argPeriapsis: 90, trueAnomaly: 12 * i },
  // 8,000 samples: several 64 KiB chunks each, under SPLIT_MIN_SAMPLES (all records written here);
  // long: 21,000 samples, the last 55 % of the records written by the solver thread into an arena.
  grid: { start: '2026-12-01T00:00:00Z', stop: long ? '2026-12-01T05:49:59Z' : '2026-12-01T02:13:19Z', step: 1 },
});

function post(port: number, body: unknown, gzip: boolean): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, path: '/v1/track', method: 'POST', headers: { 'content-type': 'application/json', ...(gzip ? { 'accept-encoding': 'gzip' } : {}) } }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (c: Buffer) => parts.push(c));
      res.on('end', () => {
        if (res.statusCode !== 200) return reject(new Error(`status ${res.statusCode}`));
        const raw = Buffer.concat(parts);
        resolve(res.headers['content-encoding'] === 'gzip' ? gunzipSync(raw) : raw);
      });
    });
    req.on('error', reject);
    req.end(JSON.stringify(body));
  });
}

describe('the chunk pool', () => {
  it('hands out chunks of its size, takes back only its own chunks, once, and keeps at most maxChunks', () => {
    const pool = new ChunkPool(8192 + 1, 2);
    const [a, b, c] = [pool.acquire(), pool.acquire(), pool.acquire()];
    expect(a.length).toBe(8193);
    expect(pool.owns(a.subarray(0, 10))).toBe(true);
    pool.release([a.subarray(0, 10), Buffer.alloc(9000), a]); // a twice (only once counts), foreign memory ignored
    expect(pool.size).toBe(1);
    expect(pool.owns(a)).toBe(false);
    pool.release([b, c]);
    expect(pool.size).toBe(2); // bounded: c is left to the garbage collector
    expect(pool.acquire().buffer).toBe(b.buffer); // reused, last in first out
    expect(() => new ChunkPool(4096, 1)).toThrow(RangeError);
  });
});

// The same answers taken alone, through inject (its responses never give chunks back), cache off.
// The long ones twice each in a round: two requests of one computation share the thread's bytes.
let alone: Buffer[];
const short = [0, 1, 2].flatMap((i) => (['csv', 'json'] as const).map((f) => scenario(i, f)));
// The long ones: two-body (its states written into the arena too), J2 (the same), and an
// Earth-fixed frame (the printed numbers are the thread's own ITRF array, the states in the arena).
const long = [
  ...[0, 1].flatMap((i) => (['csv', 'json'] as const).map((f) => scenario(i, f, true))),
  { ...scenario(2, 'json', true), model: 'j2-analytic' },
  { ...scenario(3, 'csv', true), model: 'j2-secular', frame: 'itrf' },
];
const bodies = [...short, ...long, ...long];
beforeAll(async () => {
  const reference = await testApp({ config: { CACHE_MAX_BYTES: 0 } });
  alone = [];
  for (const b of bodies) alone.push((await postJson(reference, '/v1/track', b)).rawPayload);
  await reference.close();
});

for (const cacheBytes of [0, 64 * 2 ** 20]) {
  describe(`answers streamed at once over sockets reuse chunks and stay exact (cache ${cacheBytes ? 'on' : 'off'})`, () => {
    let app: FastifyInstance;
    let port: number;
    beforeAll(async () => {
      app = await testApp({ config: { CACHE_MAX_BYTES: cacheBytes } });
      await app.listen({ host: '127.0.0.1', port: 0 });
      port = (app.server.address() as AddressInfo).port;
    });
    afterAll(async () => { await app.close(); });

    it('twelve different tracks (six long ones asked twice), CSV and JSON, plain and gzip, three rounds: every answer the bytes of the same answer alone', async () => {
      // Empty the pools first (held here), so that what is in them after the first round came from it.
      const held: Buffer[] = [];
      while (OUTPUT_CHUNKS.size > 0) held.push(OUTPUT_CHUNKS.acquire());
      const heldArenas: Buffer[] = [];
      while (TAIL_ARENAS.size > 0) heldArenas.push(TAIL_ARENAS.acquire());
      for (let round = 0; round < 3; round++) {
        const answers = await Promise.all(bodies.map((b, i) => post(port, b, (i + round) % 2 === 0)));
        answers.forEach((a, i) => expect(a.equals(alone[i]!), `round ${round}, answer ${i}`).toBe(true));
        // The path is exercised: the first round's chunks came back once its responses finished
        // (with the cache on, the first round stores the answers and the later ones are served from the store).
        if (round === 0) {
          expect(OUTPUT_CHUNKS.size).toBeGreaterThan(0);
          expect(TAIL_ARENAS.size).toBeGreaterThan(0);
        }
      }
      OUTPUT_CHUNKS.release(held);
      TAIL_ARENAS.release(heldArenas);
    });
  });
}

describe('an arena still being read by a slow client is not lent to the next computation', () => {
  // 100,000-sample JSON answers (14 MB; the thread's 7.7 MB, more than the socket buffers hold):
  // the first client reads one chunk and pauses while three other tracks are computed and
  // streamed; then it reads the rest, which must be its own answer to the byte.
  const big = (i: number) => ({ ...scenario(i, 'json'), grid: { start: '2026-12-01T00:00:00Z', stop: '2026-12-02T03:46:39Z', step: 1 } });
  let app: FastifyInstance;
  let port: number;
  const reference: Buffer[] = [];
  beforeAll(async () => {
    const one = await testApp({ config: { CACHE_MAX_BYTES: 0 } });
    for (let i = 0; i < 4; i++) reference.push((await postJson(one, '/v1/track', big(i))).rawPayload);
    await one.close();
    app = await testApp({ config: { CACHE_MAX_BYTES: 0 } });
    await app.listen({ host: '127.0.0.1', port: 0 });
    port = (app.server.address() as AddressInfo).port;
  });
  afterAll(async () => { await app.close(); });

  it('the paused answer and the three others are each their own bytes', async () => {
    let resume!: () => void;
    const paused = new Promise<Buffer>((resolve, reject) => {
      const req = request({ host: '127.0.0.1', port, path: '/v1/track', method: 'POST', headers: { 'content-type': 'application/json' } }, (res) => {
        const parts: Buffer[] = [];
        res.on('data', (c: Buffer) => {
          parts.push(c);
          if (!resume) { res.pause(); resume = () => res.resume(); }
        });
        res.on('end', () => resolve(Buffer.concat(parts)));
      });
      req.on('error', reject);
      req.end(JSON.stringify(big(0)));
    });
    while (!resume) await new Promise((r) => setTimeout(r, 10));
    // Time for its records to be written (tens of ms), then the others one after the other: each
    // would take the paused answer's arena if it had gone back too early.
    await new Promise((r) => setTimeout(r, 500));
    const others: Buffer[] = [];
    for (const i of [1, 2, 3]) others.push(await post(port, big(i), false));
    others.forEach((a, i) => expect(a.equals(reference[i + 1]!), `answer ${i + 1}`).toBe(true));
    resume();
    expect((await paused).equals(reference[0]!)).toBe(true);
  });
});
