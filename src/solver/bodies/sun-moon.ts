// Geocentric positions of the Sun and the Moon for perturbation models, from astronomy-engine
// 2.1.19: the Earth's heliocentric state from its truncated VSOP87 series, the Moon from its
// version of Brown's lunar theory (both in its J2000 mean equator frame EQJ, which differs from
// GCRF by the 23 mas frame bias: 17 km at the Sun, 44 m at the Moon, both negligible as sources
// of gravity). The tests compare it with the low-precision formulas of the Astronomical Almanac.
// - Time: our epochs are TT; AstroTime.FromTerrestrialTime takes TT days directly, so the
//   library's own Delta-T model only sets its UT label, which these positions do not use.
// - The Sun is geometric, minus the Earth's heliocentric state (the same as the library's
//   GeoVector(Sun) without aberration): the pull acts from where the Sun is, not from where it is
//   seen (aberration would move it by ~20", ~15 000 km).
// - Calls cost ~25-40 us each, too slow for every right-hand-side evaluation: ephemerisCache
//   fills nodes every `spacing` seconds on demand and interpolates with cubic Hermite polynomials.

import { AstroTime, Body, GeoMoonState, HelioState } from 'astronomy-engine';
import { SECONDS_PER_DAY } from '../core/math.js';
import type { Vec3 } from '../core/vec3.js';
import { cubicHermiteWeights } from '../numerics/hermite.js';

/** Astronomical unit, km: IAU 2012 Resolution B2, 149 597 870 700 m exactly. */
export const AU_KM = 149_597_870.7;
const KM_S_PER_AU_DAY = AU_KM / SECONDS_PER_DAY;

export type ThirdBody = 'sun' | 'moon';

export interface ThirdBodyState {
  /** Geocentric position, km, J2000 equator (EQJ ~ GCRF). */
  readonly r: Vec3;
  /** Geocentric velocity, km/s. */
  readonly v: Vec3;
}

/** Geocentric state of the Sun or the Moon at a TT epoch (s since J2000), straight from astronomy-engine. */
export function thirdBodyState(body: ThirdBody, tt: number): ThirdBodyState {
  const time = AstroTime.FromTerrestrialTime(tt / SECONDS_PER_DAY);
  // The Sun as seen from the Earth is minus the Earth's heliocentric state.
  const s = body === 'sun' ? HelioState(Body.Earth, time) : GeoMoonState(time);
  const k = body === 'sun' ? -1 : 1;
  return {
    r: [k * s.x * AU_KM, k * s.y * AU_KM, k * s.z * AU_KM],
    v: [k * s.vx * KM_S_PER_AU_DAY, k * s.vy * KM_S_PER_AU_DAY, k * s.vz * KM_S_PER_AU_DAY],
  };
}

/** Default node spacing of an ephemeris cache, s (interpolation error measured over +-30 days: Moon 0.3 m, Sun 1.2 cm). */
export const EPHEMERIS_NODE_SPACING_S = 7200;

/** Position (km) at a TT epoch; one interpolator per propagation, never shared across calls. */
export type PositionAt = (tt: number) => Vec3;

/**
 * A cache of one body's geocentric positions: nodes at originTT + k spacing, computed the first time
 * a neighbouring epoch is asked for and kept; between nodes the cubic Hermite polynomial through
 * the two node positions and velocities (numerics/hermite.ts). Each call to ephemerisCache makes a fresh cache (no module state).
 */
export function ephemerisCache(body: ThirdBody, originTT: number, spacing = EPHEMERIS_NODE_SPACING_S): PositionAt {
  if (!(Number.isFinite(originTT) && spacing > 0 && Number.isFinite(spacing))) {
    throw new RangeError(`ephemerisCache needs a finite origin and a positive spacing, got ${originTT}, ${spacing}`);
  }
  const nodes = new Map<number, ThirdBodyState>();
  const node = (k: number): ThirdBodyState => {
    let n = nodes.get(k);
    if (!n) {
      n = thirdBodyState(body, originTT + k * spacing);
      nodes.set(k, n);
    }
    return n;
  };
  const w = new Float64Array(8);
  return (tt: number): Vec3 => {
    const x = (tt - originTT) / spacing;
    const k = Math.floor(x);
    const s = x - k;
    const a = node(k);
    const b = node(k + 1);
    cubicHermiteWeights(s, spacing, w);
    return [
      w[0]! * a.r[0] + w[1]! * a.v[0] + w[2]! * b.r[0] + w[3]! * b.v[0],
      w[0]! * a.r[1] + w[1]! * a.v[1] + w[2]! * b.r[1] + w[3]! * b.v[1],
      w[0]! * a.r[2] + w[1]! * a.v[2] + w[2]! * b.r[2] + w[3]! * b.v[2],
    ];
  };
}
