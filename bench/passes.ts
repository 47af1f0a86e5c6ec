// Pass search for one LEO spacecraft over 10 stations and 7 days, measured against the bare
// Earth-fixed track of the same window at the search's coarse step (propagate + GCRF -> ITRF),
// in the same run, interleaved, fixed iteration counts, best round kept.
// The spacecraft moves on a closed-form circular orbit (invented; no propagator file needed).

import { gcrfToItrfBatch } from '../src/solver/earth/frames.js';
import { coarseStepFor, findPasses, type PassStation, type StateAt } from '../src/solver/stations/passes.js';
import { parseUtcIso } from '../src/solver/time/time.js';
import type { Vec3 } from '../src/solver/core/vec3.js';
import type { BenchResult } from './types.js';

const DEG = Math.PI / 180;
const MU = 398_600.4418;
const WINDOW_S = 7 * 86_400;
const ROUNDS = 5;
const TRACKS_PER_ROUND = 10;
const SEARCHES_PER_ROUND = 2;

function circularOrbit(t0: number): StateAt {
  const a = 6378.137 + 520;
  const n = Math.sqrt(MU / a ** 3);
  const inc = 97.5 * DEG;
  const raan = 0.8;
  const p: Vec3 = [Math.cos(raan), Math.sin(raan), 0];
  const q: Vec3 = [-Math.sin(raan) * Math.cos(inc), Math.cos(raan) * Math.cos(inc), Math.sin(inc)];
  return (t) => {
    const u = n * (t - t0);
    const [c, s] = [Math.cos(u), Math.sin(u)];
    return {
      r: [a * (c * p[0] + s * q[0]), a * (c * p[1] + s * q[1]), a * (c * p[2] + s * q[2])],
      v: [a * n * (-s * p[0] + c * q[0]), a * n * (-s * p[1] + c * q[1]), a * n * (-s * p[2] + c * q[2])],
    };
  };
}

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
  const stateAt = circularOrbit(t0);
  const first = stateAt(t0) as { r: Vec3; v: Vec3 };
  const { stepS } = coarseStepFor(first.r, first.v);
  const count = Math.ceil(WINDOW_S / stepS) + 1;

  const bareTrack = (): number => {
    const epochs = new Float64Array(count);
    const states = new Float64Array(6 * count);
    for (let k = 0; k < count; k++) {
      const t = Math.min(t0 + k * stepS, t0 + WINDOW_S);
      epochs[k] = t;
      const s = stateAt(t) as { r: Vec3; v: Vec3 };
      states.set(s.r, 6 * k);
      states.set(s.v, 6 * k + 3);
    }
    return gcrfToItrfBatch(epochs, states)[6 * count - 6]!;
  };
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
