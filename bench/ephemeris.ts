// Ephemeris interpolation per sample (src/solver/propagation/ephemeris.ts): a day of 60 s nodes of a
// LEO two-body orbit (propagated by the service's universal-variable kernel, only to make nodes),
// sampled 100,000 times between them by Lagrange degree 7 (the default), Hermite degree 5 with
// velocities, and Hermite degree 5 with accelerations; interleaved in one run with the sin+cos
// baseline (bench/baseline.ts). Ratio = time per sample / baseline time per iteration, best of the rounds.

import { cpus } from 'node:os';
import { performance } from 'node:perf_hooks';
import { ephemerisStates, type EphemerisSegment } from '../src/solver/propagation/ephemeris.js';
import { propagateGrid } from '../src/solver/conic/universal.js';
import { baselineLoop } from './baseline.js';
import type { BenchResult } from './types.js';

const MU = 398_600.4418;
const NODES = 1441; // one day at 60 s
const SAMPLES = 100_000;
const START_TT = 849_000_000; // late 2026
const BASELINE_ITERATIONS = 1_000_000;
const ROUNDS = 7;
const best = (xs: number[]): number => Math.min(...xs);

export async function benchEphemeris(): Promise<BenchResult[]> {
  const dt = Float64Array.from({ length: NODES }, (_, i) => 60 * i);
  const states = new Float64Array(6 * NODES);
  const done = propagateGrid([6878.137, 0, 0], [0, 4.8, 5.9], MU, dt, states);
  if (!done.ok) throw new Error(done.message);
  const epochsTT = Float64Array.from(dt, (t) => START_TT + t);
  const accelerations = new Float64Array(3 * NODES);
  for (let i = 0; i < NODES; i++) {
    const [x, y, z] = [states[6 * i]!, states[6 * i + 1]!, states[6 * i + 2]!];
    const k = -MU / Math.hypot(x, y, z) ** 3;
    accelerations.set([k * x, k * y, k * z], 3 * i);
  }
  const segment = (method: 'lagrange' | 'hermite', degree: number, acc: boolean): EphemerisSegment =>
    ({ epochsTT, states, accelerations: acc ? accelerations : null, method, degree, startTT: epochsTT[0]!, stopTT: epochsTT[NODES - 1]! });
  // Sample epochs spread over the day, none on a node (a prime step in ms).
  const samples = Float64Array.from({ length: SAMPLES }, (_, k) => START_TT + ((k * 863.417) % (60 * (NODES - 1))));
  const run = (s: EphemerisSegment) => (): number => {
    const r = ephemerisStates({ segments: [s] }, samples);
    if (!r.ok) throw new Error(r.message);
    return r.value.states[7]!;
  };
  const cases: Array<[string, () => number, number]> = [
    ['baseline', () => baselineLoop(BASELINE_ITERATIONS), BASELINE_ITERATIONS],
    ['lagrange 7', run(segment('lagrange', 7, false)), SAMPLES],
    ['hermite 5', run(segment('hermite', 5, false)), SAMPLES],
    ['hermite 5 + acc', run(segment('hermite', 5, true)), SAMPLES],
    ['two-body kernel', () => { const out = new Float64Array(6 * SAMPLES); propagateGrid([6878.137, 0, 0], [0, 4.8, 5.9], MU, samples.map((t) => t - START_TT), out); return out[7]!; }, SAMPLES],
  ];
  const times = new Map<string, number[]>(cases.map(([name]) => [name, []]));
  let sink = 0;
  for (let round = -1; round < ROUNDS; round++) {
    for (const [name, f, count] of cases) {
      const t = performance.now();
      sink += f();
      if (round >= 0) times.get(name)!.push((performance.now() - t) / count);
    }
  }
  const base = best(times.get('baseline')!);
  const row = (label: string, name: string, note: string): BenchResult => {
    const perOp = best(times.get(name)!);
    return { name: label, opsPerSecond: 1000 / perOp, ratioToBaseline: perOp / base, note };
  };
  const machine = `${cpus()[0]?.model ?? 'unknown cpu'} x${cpus().length}, node ${process.version}`;
  return [
    row('baseline: Math.sin + Math.cos', 'baseline', `${machine}; best of ${ROUNDS} interleaved rounds; sink ${sink.toPrecision(6)}`),
    row('ephemeris, Lagrange degree 7 (8 nodes)', 'lagrange 7', `${SAMPLES} samples of a day of 60 s nodes, per sample`),
    row('ephemeris, Hermite degree 5 (3 nodes, r and v)', 'hermite 5', 'per sample'),
    row('ephemeris, Hermite degree 5 (2 nodes, r, v, a)', 'hermite 5 + acc', 'per sample'),
    row('two-body grid kernel at the same epochs (for scale)', 'two-body kernel', 'per sample'),
  ];
}
