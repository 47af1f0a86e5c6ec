// Pass search for one LEO spacecraft over 10 stations and 7 days, measured against the bare
// Earth-fixed track of the same window at the search's coarse step (propagate + GCRF -> ITRF),
// in the same run, interleaved, fixed iteration counts, best round kept.
// The spacecraft moves on a closed-form circular orbit (invented; bench/leo.ts).

import { coarseStepFor, findPasses, type PassStation } from '../src/solver/stations/passes.js';
import { parseUtcIso } from '../src/solver/time/time.js';
import type { Vec3 } from '../src/solver/core/vec3.js';
import { bareEarthFixedTrack, circularLeo } from './leo.js';
import type { BenchResult } from './types.js';

const DEG = Math.PI / 180;
const WINDOW_S = 7 * 86_400;
const ROUNDS = 5;
const TRACKS_PER_ROUND = 10;
const SEARCHES_PER_ROUND = 2;

// Ten invented stations spread over latitudes -70..75 deg; two carry horizon masks.
const STATIONS: PassStation[] = Array.from({ length: 10 }, (_, i) => ({
  id: `site-${i}`,
  latitude: (-70 + 16 * i) * DEG,
  longitude: (-175 + 37 * i) * DEG,
  height: 0.2 + 0.1 * i,
  minElevation: (i % 3) * 5 * DEG,
  ...(i % 5 === 2
    ? { mask: [{ azimuth: 0, elevation: 6 * DEG }, { azimuth: 120 * DEG, elevation: 12 * DEG }, { azimuth: 240 * DEG, elevation: 3 * DEG }] }
    : {}),
}));

export async function benchPasses(): Promise<BenchResult[]> {
  const start = parseUtcIso('2026-12-01T00:00:00Z');
  if (!start.ok) throw new Error(start.message);
  const t0 = start.value;
  const stateAt = circularLeo(t0, 97.5);
  const first = stateAt(t0) as { r: Vec3; v: Vec3 };
  const { stepS } = coarseStepFor(first.r, first.v);
  const count = Math.ceil(WINDOW_S / stepS) + 1;

  const bareTrack = (): number => bareEarthFixedTrack(stateAt, t0, WINDOW_S, stepS);

  let passCount = 0;
  let calls = 0;
  const search = (): number => {
    const r = findPasses({ stateAt, startTT: t0, stopTT: t0 + WINDOW_S, stations: STATIONS });
    if (!r.ok) throw new Error(r.message);
    passCount = r.value.passes.length;
    calls = r.value.evaluations;
    return r.value.passes.reduce((acc, p) => acc + p.maxElevation, 0);
  };

  let sink = 0;
  let bestTrack = Infinity;
  let bestSearch = Infinity;
  sink += bareTrack() + search(); // warm-up
  for (let round = 0; round < ROUNDS; round++) {
    let t = performance.now();
    for (let i = 0; i < TRACKS_PER_ROUND; i++) sink += bareTrack();
    bestTrack = Math.min(bestTrack, (performance.now() - t) / TRACKS_PER_ROUND);
    t = performance.now();
    for (let i = 0; i < SEARCHES_PER_ROUND; i++) sink += search();
    bestSearch = Math.min(bestSearch, (performance.now() - t) / SEARCHES_PER_ROUND);
  }
  if (!Number.isFinite(sink)) throw new Error('benchmark result was not finite');

  const trackOps = 1000 / bestTrack;
  const searchOps = 1000 / bestSearch;
  return [
    {
      name: 'earth-fixed track, LEO, 7 days at the coarse step (baseline)',
      opsPerSecond: trackOps,
      ratioToBaseline: 1,
      note: `${count} samples every ${stepS.toFixed(1)} s; ${bestTrack.toFixed(2)} ms per track`,
    },
    {
      name: 'pass search, LEO, 10 stations (2 masked), 7 days',
      opsPerSecond: searchOps,
      ratioToBaseline: bestSearch / bestTrack, // time ratio, like every other bench: how many bare tracks one search costs
      note: `${passCount} passes, ${calls} propagator calls; ${bestSearch.toFixed(1)} ms per search`,
    },
  ];
}
