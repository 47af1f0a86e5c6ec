// SGP4 samples per second for a near-Earth and a deep-space element set, against the sin+cos
// baseline loop of the same run, and a pass search from a two-line set over 10 stations and 7
// days against the bare Earth-fixed track of the same orbit (as bench/passes.ts measures it).
// The element sets are invented (test data stays in the tests).

import { baselineLoop, nsPerIteration } from './baseline.js';
import { readTle } from '../src/formats/tle.js';
import { sgp4Init, sgp4Regime, sgp4StateFunction, sgp4Teme } from '../src/solver/propagation/sgp4.js';
import { coarseStepFor, findPasses, type PassStation } from '../src/solver/stations/passes.js';
import type { Vec3 } from '../src/solver/core/vec3.js';
import { bareEarthFixedTrack } from './leo.js';
import type { BenchResult } from './types.js';

const DEG = Math.PI / 180;
const N = 200_000;
const WINDOW_S = 7 * 86_400;

/** A two-line set with its checksums, from fields (columns of Spacetrack Report No. 3). */
function tle(inclination: number, ecc: string, meanMotion: number): { line1: string; line2: string } {
  const sum = (s: string): string => String([...s].reduce((n, c) => n + (c === '-' ? 1 : /\d/.test(c) ? Number(c) : 0), 0) % 10);
  const l1 = '1 99901U 26900A   26335.00000000  .00000100  00000-0  12345-4 0  999';
  const l2 = `2 99901 ${inclination.toFixed(4).padStart(8)}  40.0000 ${ecc}  90.0000  10.0000 ${meanMotion.toFixed(8).padStart(11)}  123`;
  return { line1: l1 + sum(l1), line2: l2 + sum(l2) };
}

const SETS = [
  ['near-earth (invented LEO, 15.2 rev/day)', tle(97.6, '0012000', 15.2)],
  ['deep-space (invented Molniya-like, 2.006 rev/day, e 0.72)', tle(63.4, '7200000', 2.006)],
] as const;

const STATIONS: PassStation[] = Array.from({ length: 10 }, (_, i) => ({
  id: `site-${i}`, latitude: (-70 + 16 * i) * DEG, longitude: (-175 + 37 * i) * DEG, height: 0.2 + 0.1 * i, minElevation: (i % 3) * 5 * DEG,
}));

export async function benchSgp4(): Promise<BenchResult[]> {
  const base = nsPerIteration((n) => baselineLoop(n), N);
  const out: BenchResult[] = [{ name: 'sin + cos (baseline)', opsPerSecond: 1e9 / base.ns, ratioToBaseline: 1 }];
  let sink = base.sink;
  for (const [label, lines] of SETS) {
    const read = readTle(lines.line1, lines.line2);
    if (!read.ok) throw new Error(JSON.stringify(read.issues));
    const satrec = sgp4Init(read.value.sgp4);
    const state = new Float64Array(6);
    const r = nsPerIteration((n) => {
      let acc = 0;
      for (let i = 0; i < n; i++) {
        if (sgp4Teme(satrec, (i % 14_400) * 0.7, state) !== 0) throw new Error('sgp4 failed in the bench');
        acc += state[0]!;
      }
      return acc;
    }, N);
    sink += r.sink;
    out.push({ name: `SGP4 sample, ${label}`, opsPerSecond: 1e9 / r.ns, ratioToBaseline: r.ns / base.ns, note: `${sgp4Regime(satrec)}, TEME state per call` });
  }

  // Pass search from the near-Earth set over 10 stations x 7 days (GCRF from TEME through one orientation table).
  const read = readTle(SETS[0][1].line1, SETS[0][1].line2);
  if (!read.ok) throw new Error('bench TLE');
  const t0 = read.value.epochTT;
  const stateAt = sgp4StateFunction(read.value.sgp4, t0, t0 + WINDOW_S);
  const first = stateAt(t0);
  if (!first.ok) throw new Error(first.message);
  const { stepS } = coarseStepFor(first.value.r as Vec3, first.value.v as Vec3);
  const plain = (tt: number): { r: Vec3; v: Vec3 } => {
    const s = stateAt(tt);
    if (!s.ok) throw new Error(s.message);
    return s.value;
  };
  const bare = (): number => bareEarthFixedTrack(plain, t0, WINDOW_S, stepS);
  let passes = 0;
  const search = (): number => {
    const res = findPasses({ stateAt, startTT: t0, stopTT: t0 + WINDOW_S, stations: STATIONS });
    if (!res.ok) throw new Error(res.message);
    passes = res.value.passes.length;
    return res.value.passes.length;
  };
  sink += bare() + search();
  let bestBare = Infinity;
  let bestSearch = Infinity;
  for (let round = 0; round < 3; round++) {
    let t = performance.now();
    sink += bare();
    bestBare = Math.min(bestBare, performance.now() - t);
    t = performance.now();
    sink += search();
    bestSearch = Math.min(bestSearch, performance.now() - t);
  }
  if (!Number.isFinite(sink)) throw new Error('benchmark result was not finite');
  // As bench/passes.ts: the search against the bare Earth-fixed track of the same orbit and window.
  out.push({ name: 'earth-fixed SGP4 track, LEO, 7 days at the coarse step (baseline of the next line)', opsPerSecond: 1000 / bestBare, ratioToBaseline: 1, note: `${bestBare.toFixed(1)} ms per track` });
  out.push({ name: 'pass search from a TLE, 10 stations, 7 days', opsPerSecond: 1000 / bestSearch, ratioToBaseline: bestSearch / bestBare, note: `${passes} passes; ${bestSearch.toFixed(0)} ms per search` });
  return out;
}
