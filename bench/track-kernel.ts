// Track kernel against the common baseline loop (bench/baseline.ts: one Math.sin + one Math.cos per
// iteration), interleaved in one run with fixed iteration counts.
// Ratio = time per sample (or per call) / baseline time per iteration, each the best of the rounds.

import { cpus } from 'node:os';
import { performance } from 'node:perf_hooks';
import { propagate, propagateGrid } from '../src/solver/conic/universal.js';
import { baselineLoop } from './baseline.js';
import type { BenchResult } from './types.js';

const MU = 398_600.4418; // Earth GM, km^3/s^2 (common practice, no source)
const R0 = [6778.137, 0, 0] as const;
const INCLINATION = (51.6 * Math.PI) / 180;
const V0 = [0.005, 7.6686 * Math.cos(INCLINATION), 7.6686 * Math.sin(INCLINATION)] as const; // invented near-circular LEO
const SAMPLES_PER_ORBIT = 10_000;
const ORBITS = 10;
const BASELINE_ITERATIONS = 1_000_000;
const PROPAGATE_SAMPLES = 20_000;
const ROUNDS = 15;

function periodS(): number {
  const r = Math.hypot(...R0);
  const a = 1 / (2 / r - (V0[0] ** 2 + V0[1] ** 2 + V0[2] ** 2) / MU);
  return 2 * Math.PI * Math.sqrt((a * a * a) / MU);
}

function grid(dt: Float64Array, out: Float64Array): number {
  const result = propagateGrid(R0, V0, MU, dt, out);
  if (!result.ok) throw new Error(result.message);
  return out[out.length - 6]! + out[3]!;
}

function perSample(dt: Float64Array): number {
  let sink = 0;
  const stride = Math.floor(dt.length / PROPAGATE_SAMPLES);
  for (let k = 0; k < PROPAGATE_SAMPLES; k++) {
    const result = propagate(R0, V0, MU, dt[k * stride]!);
    if (!result.ok) throw new Error(result.message);
    sink += result.value.r[0];
  }
  return sink;
}

/** Best of the rounds: the figure least disturbed by other work on a shared machine. */
const best = (xs: number[]): number => Math.min(...xs);

export async function benchTrackKernel(): Promise<BenchResult[]> {
  const n = SAMPLES_PER_ORBIT * ORBITS;
  const period = periodS();
  const sorted = new Float64Array(n);
  for (let i = 0; i < n; i++) sorted[i] = (i * period) / SAMPLES_PER_ORBIT;
  // A fixed shuffle (linear congruential, invented seed) for the unsorted case.
  const shuffled = sorted.slice();
  let seed = 12_345;
  for (let i = n - 1; i > 0; i--) {
    seed = (seed * 1_103_515_245 + 12_345) >>> 0;
    const j = seed % (i + 1);
    [shuffled[i], shuffled[j]] = [shuffled[j]!, shuffled[i]!];
  }
  const out = new Float64Array(6 * n);
  const times = { baseline: [] as number[], grid: [] as number[], shuffled: [] as number[], propagate: [] as number[] };
  let sink = 0;
  for (let round = -1; round < ROUNDS; round++) {
    // Round -1 warms the JIT and is not recorded.
    let t = performance.now();
    sink += baselineLoop(BASELINE_ITERATIONS);
    const tb = performance.now() - t;
    t = performance.now();
    sink += grid(sorted, out);
    const tg = performance.now() - t;
    t = performance.now();
    sink += grid(shuffled, out);
    const ts = performance.now() - t;
    t = performance.now();
    sink += perSample(sorted);
    const tp = performance.now() - t;
    if (round >= 0) {
      times.baseline.push(tb / BASELINE_ITERATIONS);
      times.grid.push(tg / n);
      times.shuffled.push(ts / n);
      times.propagate.push(tp / PROPAGATE_SAMPLES);
    }
  }
  const base = best(times.baseline);
  const machine = `${cpus()[0]?.model ?? 'unknown cpu'} x${cpus().length}, node ${process.version}`;
  const row = (name: string, perOpMs: number, note: string): BenchResult => ({
    name,
    opsPerSecond: 1000 / perOpMs,
    ratioToBaseline: perOpMs / base,
    note,
  });
  return [
    row('baseline: Math.sin + Math.cos', base, `${machine}; best of ${ROUNDS} interleaved rounds; sink ${sink.toPrecision(6)}`),
    row('propagateGrid, LEO, sorted times', best(times.grid), `${SAMPLES_PER_ORBIT} samples/orbit x ${ORBITS} orbits, per sample`),
    row('propagateGrid, LEO, shuffled times', best(times.shuffled), 'same grid in a fixed random order (walked as given)'),
    row('propagate, one call per sample', best(times.propagate), `${PROPAGATE_SAMPLES} calls`),
  ];
}
