// GCRF -> ITRF per sample: the IAU 2006/2000B conversion (src/solver/earth/frames.ts) against the
// astronomy-engine path it replaced (bench/legacy-frames.ts), without and with an IERS table, and
// the one-epoch form; interleaved in one run with the sin+cos baseline (bench/baseline.ts).
// Ratio = time per sample (or per call) / baseline time per iteration, best of the rounds.

import { readFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { performance } from 'node:perf_hooks';
import * as next from '../src/solver/earth/frames.js';
import { parseFinals2000A } from '../src/solver/time/eop.js';
import * as legacy from './legacy-frames.js';
import { baselineLoop } from './baseline.js';
import type { BenchResult } from './types.js';

const SAMPLES = 100_000;
const STEP_S = 6; // 100 000 samples x 6 s: about 7 days
const START_TT = 849_000_000; // late 2026 (inside the EOP excerpt)
const SINGLE_CALLS = 5_000;
const BASELINE_ITERATIONS = 1_000_000;
const ROUNDS = 9;
const A_KM = 6878; // invented circular LEO
const best = (xs: number[]): number => Math.min(...xs);

export async function benchFrames(): Promise<BenchResult[]> {
  const eop = parseFinals2000A(readFileSync(new URL('../test/fixtures/finals2000A-2025-2027.txt', import.meta.url), 'utf8'));
  if (!eop.ok) throw new Error(eop.message);
  const epochs = new Float64Array(SAMPLES);
  const states = new Float64Array(6 * SAMPLES);
  const n = Math.sqrt(398_600.4418 / A_KM ** 3);
  for (let k = 0; k < SAMPLES; k++) {
    const t = k * STEP_S;
    epochs[k] = START_TT + t;
    const u = n * t;
    states.set([A_KM * Math.cos(u), A_KM * Math.sin(u) * 0.6, A_KM * Math.sin(u) * 0.8, -A_KM * n * Math.sin(u), A_KM * n * Math.cos(u) * 0.6, A_KM * n * Math.cos(u) * 0.8], 6 * k);
  }
  const single = (f: (t: number, r: [number, number, number], v: [number, number, number]) => { r: readonly number[] }): number => {
    let s = 0;
    for (let k = 0; k < SINGLE_CALLS; k++) s += f(epochs[k * 20]!, [states[120 * k]!, states[120 * k + 1]!, states[120 * k + 2]!], [0, 7, 1]).r[0]!;
    return s;
  };
  const cases: Array<[string, () => number, number]> = [
    ['baseline', () => baselineLoop(BASELINE_ITERATIONS), BASELINE_ITERATIONS],
    ['legacy batch', () => legacy.gcrfToItrfBatch(epochs, states, { dut1: 0.1 })[7]!, SAMPLES],
    ['new batch', () => next.gcrfToItrfBatch(epochs, states, { dut1: 0.1 })[7]!, SAMPLES],
    ['new batch + eop', () => next.gcrfToItrfBatch(epochs, states, { eop: eop.value })[7]!, SAMPLES],
    ['legacy single', () => single((t, r, v) => legacy.gcrfToItrf(t, r, v, { dut1: 0.1 })), SINGLE_CALLS],
    ['new single', () => single((t, r, v) => next.gcrfToItrf(t, r, v, { dut1: 0.1 })), SINGLE_CALLS],
    ['new single + eop', () => single((t, r, v) => next.gcrfToItrf(t, r, v, { eop: eop.value })), SINGLE_CALLS],
  ];
  const times = new Map<string, number[]>(cases.map(([name]) => [name, []]));
  let sink = 0;
  for (let round = -1; round < ROUNDS; round++) {
    for (const [name, run, count] of cases) {
      const t = performance.now();
      sink += run();
      if (round >= 0) times.get(name)!.push((performance.now() - t) / count);
    }
  }
  const base = best(times.get('baseline')!);
  const row = (label: string, name: string, note: string): BenchResult => {
    const perOp = best(times.get(name)!);
    return { name: label, opsPerSecond: 1000 / perOp, ratioToBaseline: perOp / base, note };
  };
  const ratio = (a: string, b: string): string => (best(times.get(a)!) / best(times.get(b)!)).toFixed(2);
  const machine = `${cpus()[0]?.model ?? 'unknown cpu'} x${cpus().length}, node ${process.version}`;
  return [
    row('baseline: Math.sin + Math.cos', 'baseline', `${machine}; best of ${ROUNDS} interleaved rounds; sink ${sink.toPrecision(6)}`),
    row('gcrfToItrfBatch, astronomy-engine path (before)', 'legacy batch', `${SAMPLES} LEO samples over ~7 days, per sample`),
    row('gcrfToItrfBatch, IAU 2006/2000B', 'new batch', `${ratio('new batch', 'legacy batch')} x before`),
    row('gcrfToItrfBatch, IAU 2006/2000B + finals2000A table', 'new batch + eop', `${ratio('new batch + eop', 'legacy batch')} x before`),
    row('gcrfToItrf one epoch, astronomy-engine path (before)', 'legacy single', `${SINGLE_CALLS} calls`),
    row('gcrfToItrf one epoch, IAU 2006/2000B', 'new single', `${ratio('new single', 'legacy single')} x before`),
    row('gcrfToItrf one epoch, IAU 2006/2000B + table', 'new single + eop', `${ratio('new single + eop', 'legacy single')} x before`),
  ];
}
