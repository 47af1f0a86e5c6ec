// Eclipse search (Earth's shadow, and with the Moon's) over 7 days of one LEO spacecraft, measured
// against the pass bench's baseline: the bare Earth-fixed track of the same window at the pass
// search's coarse step (propagate + GCRF -> ITRF), in the same run, interleaved, fixed iteration
// counts, best round kept. The spacecraft moves on a closed-form circular orbit (invented; bench/leo.ts).

import { findEclipses } from '../src/solver/light/eclipses.js';
import { coarseStepFor } from '../src/solver/stations/passes.js';
import { parseUtcIso } from '../src/solver/time/time.js';
import type { Vec3 } from '../src/solver/core/vec3.js';
import { bareEarthFixedTrack, circularLeo } from './leo.js';
import type { BenchResult } from './types.js';

const WINDOW_S = 7 * 86_400;
const ROUNDS = 5;
const TRACKS_PER_ROUND = 10;
const SEARCHES_PER_ROUND = 4;

export async function benchEclipses(): Promise<BenchResult[]> {
  const start = parseUtcIso('2026-12-01T00:00:00Z');
  if (!start.ok) throw new Error(start.message);
  const t0 = start.value;
  const stateAt = circularLeo(t0, 51.6);
  const first = stateAt(t0) as { r: Vec3; v: Vec3 };
  const { stepS } = coarseStepFor(first.r, first.v);
  const count = Math.ceil(WINDOW_S / stepS) + 1;

  const bareTrack = (): number => bareEarthFixedTrack(stateAt, t0, WINDOW_S, stepS);

  const stats = { earth: { eclipses: 0, calls: 0 }, moon: { eclipses: 0, calls: 0 } };
  const search = (moon: boolean) => (): number => {
    const r = findEclipses({ stateAt, startTT: t0, stopTT: t0 + WINDOW_S, options: { moon } });
    if (!r.ok) throw new Error(r.message);
    stats[moon ? 'moon' : 'earth'] = { eclipses: r.value.eclipses.length + (r.value.moonEclipses?.length ?? 0), calls: r.value.evaluations };
    return r.value.eclipses.reduce((acc, e) => acc + e.durationS, 0);
  };
  const [earthOnly, withMoon] = [search(false), search(true)];

  let sink = bareTrack() + earthOnly() + withMoon(); // warm-up
  let [bestTrack, bestEarth, bestMoon] = [Infinity, Infinity, Infinity];
  const timed = (f: () => number, n: number): number => {
    const t = performance.now();
    for (let i = 0; i < n; i++) sink += f();
    return (performance.now() - t) / n;
  };
  for (let round = 0; round < ROUNDS; round++) {
    bestTrack = Math.min(bestTrack, timed(bareTrack, TRACKS_PER_ROUND));
    bestEarth = Math.min(bestEarth, timed(earthOnly, SEARCHES_PER_ROUND));
    bestMoon = Math.min(bestMoon, timed(withMoon, SEARCHES_PER_ROUND));
  }
  if (!Number.isFinite(sink)) throw new Error('benchmark result was not finite');

  return [
    {
      name: 'earth-fixed track, LEO, 7 days at the coarse step (baseline)',
      opsPerSecond: 1000 / bestTrack,
      ratioToBaseline: 1,
      note: `${count} samples every ${stepS.toFixed(1)} s; ${bestTrack.toFixed(2)} ms per track`,
    },
    {
      name: 'eclipse search, LEO, 7 days, Earth\'s shadow',
      opsPerSecond: 1000 / bestEarth,
      ratioToBaseline: bestEarth / bestTrack,
      note: `${stats.earth.eclipses} eclipses, ${stats.earth.calls} propagator calls; ${bestEarth.toFixed(1)} ms per search`,
    },
    {
      name: 'eclipse search, LEO, 7 days, Earth\'s and Moon\'s shadows',
      opsPerSecond: 1000 / bestMoon,
      ratioToBaseline: bestMoon / bestTrack,
      note: `${stats.moon.eclipses} eclipses, ${stats.moon.calls} propagator calls; ${bestMoon.toFixed(1)} ms per search`,
    },
  ];
}
