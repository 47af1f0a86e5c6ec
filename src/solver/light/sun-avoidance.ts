// The Sun in the beam: where on a pass does the angle between the antenna boresight (the
// geometric direction from the station to the spacecraft) and the Sun's direction from the station
// fall below a limit? The Sun's noise then enters the main lobe.
// - Directions in the Earth-fixed frame: the spacecraft from the pass's propagator, the apparent
//   Sun (light/sun.ts); angle by atan2(|u x w|, u . w), accurate near 0.
// - Search: the pass is sampled at steps over which the boresight turns by at most a quarter of
//   the limit (at most 10 s; the Sun's direction turns 0.004 deg/s), so a step holds at most one
//   minimum of the angle; "limit - angle" is searched for its positive intervals with
//   numerics/positive-intervals.ts (crossings to 0.01 s, a minimum inside a step found), so an
//   incursion shorter than a step is not missed. Rates by a central difference over +-0.05 s.

import { BODIES } from '../bodies/bodies.js';
import { failure, success, type Outcome } from '../core/result.js';
import { cross, dot, norm, sub, type Vec3 } from '../core/vec3.js';
import { gcrfToItrfTabled, orientationTable, type FrameOptions } from '../earth/frames.js';
import { goldenSectionMax } from '../numerics/golden-section.js';
import { positiveIntervals } from '../numerics/positive-intervals.js';
import { PropagationStopped, gcrfStateAt, type StateAt } from '../propagation/state-source.js';
import type { Pass, PassStation } from '../stations/passes.js';
import { stationFromGeodetic } from '../stations/topocentric.js';
import { apparentSunCache } from './sun.js';

const MAX_STEP_S = 10;
const MIN_STEP_S = 0.05;
const TOLERANCE_S = 0.01;
const RATE_DT_S = 0.05;

export interface SunAvoidance {
  /** Least boresight-Sun angle over the pass, rad, and when (TT s). */
  readonly minAngle: number;
  readonly minAt: number;
  /** Where the angle is below the limit, TT s, in time order (clipped to the pass). */
  readonly intervals: readonly { readonly start: number; readonly stop: number }[];
  /** The angle at each pointing sample of the pass, rad (absent without a pointing track). */
  readonly pointingAngles?: Float64Array;
}

const angleBetween = (u: Vec3, w: Vec3): number => Math.atan2(norm(cross(u, w)), dot(u, w));

/** Sun avoidance on each pass (same order as `passes`) for a limit in rad, 0 < limit < pi. */
export function sunAvoidance(
  passes: readonly Pass[],
  stations: readonly PassStation[],
  stateAt: StateAt,
  startTT: number,
  stopTT: number,
  limit: number,
  opts: FrameOptions = {},
): Outcome<SunAvoidance[]> {
  if (!(limit > 0 && limit < Math.PI)) return failure('invalid-parameter', `sun avoidance angle ${limit} rad: it must lie in (0, pi)`);
  const table = orientationTable(startTT, stopTT, opts);
  const sun = apparentSunCache(startTT);
  const sites = new Map(stations.map((s) => [s.id, stationFromGeodetic(s.latitude, s.longitude, s.height).position]));
  const angleAt = (site: Vec3, tt: number): number => {
    const s = gcrfStateAt(stateAt, tt);
    const sc = gcrfToItrfTabled(table, tt, s.r, s.v).r;
    const sn = sun(tt);
    const sunFixed = gcrfToItrfTabled(table, tt, sn.r, sn.v).r;
    return angleBetween(sub(sc, site), sub(sunFixed, site));
  };
  try {
    return success(passes.map((p) => {
      const site = sites.get(p.station);
      if (!site) throw new TypeError(`pass of unknown station ${p.station}`);
      return onePass(p, (tt) => angleAt(site, tt), (tt) => boresightRate(stateAt, table, site, tt), limit);
    }));
  } catch (e) {
    if (e instanceof PropagationStopped) return e.failure;
    throw e;
  }
}

/** Turn rate of the boresight, rad/s: |u x u'| of the unit vector from the station to the spacecraft (Earth-fixed). */
function boresightRate(stateAt: StateAt, table: ReturnType<typeof orientationTable>, site: Vec3, tt: number): number {
  const s = gcrfStateAt(stateAt, tt);
  const fixed = gcrfToItrfTabled(table, tt, s.r, s.v);
  const d = sub(fixed.r, site);
  return norm(cross(d, fixed.v)) / dot(d, d);
}

function onePass(p: Pass, angle: (tt: number) => number, turnRate: (tt: number) => number, limit: number): SunAvoidance {
  const times: number[] = [p.aos];
  for (let t = p.aos; t < p.los;) {
    const dt = Math.min(MAX_STEP_S, Math.max(MIN_STEP_S, (0.25 * limit) / Math.max(turnRate(t) + BODIES.earth.rotationRateRadS!, 1e-9)));
    t = p.los - (t + dt) < MIN_STEP_S ? p.los : t + dt;
    times.push(t);
  }
  interface Sample { readonly t: number; readonly a: number }
  const at = (t: number): Sample => ({ t, a: angle(t) });
  const samples = times.map(at);
  const rateOf = (x: Sample): number => {
    const [lo, hi] = [Math.max(p.aos, x.t - RATE_DT_S), Math.min(p.los, x.t + RATE_DT_S)];
    return hi > lo ? -(angle(hi) - angle(lo)) / (hi - lo) : 0;
  };
  const intervals = times.length < 2 ? [] : positiveIntervals<Sample>({
    times,
    sample: (k) => samples[k]!,
    at,
    value: (x) => limit - x.a,
    rate: rateOf,
    edges: { startsBefore: false, endsAfter: false },
    rootTolS: TOLERANCE_S,
    peakTolS: TOLERANCE_S,
  }).map(({ start, stop }) => ({ start, stop }));
  // The least angle: around the least sample, refined.
  let k = 0;
  for (let i = 1; i < samples.length; i++) if (samples[i]!.a < samples[k]!.a) k = i;
  const [lo, hi] = [times[Math.max(0, k - 1)]!, times[Math.min(times.length - 1, k + 1)]!];
  const best = hi - lo > TOLERANCE_S ? goldenSectionMax((t) => -angle(t), lo, hi, TOLERANCE_S) : { t: times[k]!, value: -samples[k]!.a };
  const [minAt, minAngle] = -best.value < samples[k]!.a ? [best.t, -best.value] : [times[k]!, samples[k]!.a];
  return {
    minAngle,
    minAt,
    intervals,
    ...(p.pointing ? { pointingAngles: Float64Array.from(p.pointing, (s) => angle(s.tt)) } : {}),
  };
}
