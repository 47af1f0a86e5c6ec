// Kepler's-equation solves per second against the common baseline loop (one Math.sin + one
// Math.cos per iteration), interleaved in one run with fixed iteration counts.
import { solveKeplerElliptic, solveKeplerHyperbolic } from '../src/solver/conic/kepler.js';
import { baselineLoop } from './baseline.js';
import type { BenchResult } from './types.js';

const N = 200_000;
const ROUNDS = 7;

/** A fixed spread of (M, e): e from 0 to 0.99 and M over the whole turn (invented, deterministic). */
function cases(n: number, eMax: number, eMin = 0): { m: Float64Array; e: Float64Array } {
  const m = new Float64Array(n);
  const e = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    m[i] = ((i * 0.618_033_988_75) % 1) * 2 * Math.PI - Math.PI;
    e[i] = eMin + ((i * 0.414_213_562_37) % 1) * (eMax - eMin);
  }
  return { m, e };
}

function ellipticLoop(m: Float64Array, e: Float64Array): number {
  let sink = 0;
  for (let i = 0; i < m.length; i++) {
    const r = solveKeplerElliptic(m[i]!, e[i]!);
    if (r.ok) sink += r.value;
  }
  return sink;
}

function hyperbolicLoop(m: Float64Array, e: Float64Array): number {
  let sink = 0;
  for (let i = 0; i < m.length; i++) {
    const r = solveKeplerHyperbolic(m[i]! * 10, e[i]!);
    if (r.ok) sink += r.value;
  }
  return sink;
}

const timeNs = (fn: () => number): { ns: number; sink: number } => {
  const t0 = process.hrtime.bigint();
  const sink = fn();
  return { ns: Number(process.hrtime.bigint() - t0), sink };
};

export async function benchKepler(): Promise<BenchResult[]> {
  const ell = cases(N, 0.99);
  const hyp = cases(N, 5, 1.0001);
  let base = Infinity;
  let elliptic = Infinity;
  let hyperbolic = Infinity;
  let sink = 0;
  for (let r = 0; r < ROUNDS; r++) {
    // Interleaved: each round times every alternative once; the best round of each is kept.
    const b = timeNs(() => baselineLoop(N));
    const e = timeNs(() => ellipticLoop(ell.m, ell.e));
    const h = timeNs(() => hyperbolicLoop(hyp.m, hyp.e));
    base = Math.min(base, b.ns / N);
    elliptic = Math.min(elliptic, e.ns / N);
    hyperbolic = Math.min(hyperbolic, h.ns / N);
    sink += b.sink + e.sink + h.sink;
  }
  const note = `sink ${sink.toExponential(3)}`;
  return [
    { name: 'baseline: sin + cos', opsPerSecond: 1e9 / base, ratioToBaseline: 1 },
    { name: 'Kepler elliptic solve (e 0..0.99)', opsPerSecond: 1e9 / elliptic, ratioToBaseline: elliptic / base, note },
    { name: 'Kepler hyperbolic solve (e 1.0001..5)', opsPerSecond: 1e9 / hyperbolic, ratioToBaseline: hyperbolic / base },
  ];
}
