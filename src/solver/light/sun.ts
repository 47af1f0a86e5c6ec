// The Sun as the Earth's shadow sees it: the apparent geocentric direction, i.e. the direction from
// which sunlight arrives at the Earth in a frame moving with the Earth.
// - Positions: astronomy-engine's geometric Sun (bodies/sun-moon.ts), cached on 2 h nodes.
// - Light-time: in the heliocentric frame the Sun is at rest at the origin, so the light that
//   reaches the Earth now left from where the Sun is now: no light-time correction of the
//   direction (the Sun's barycentric motion over the 499 s light-time, ~6 km, is 0.01" and neglected).
// - Aberration: the Earth's heliocentric velocity v turns the incoming light by |v|/c (~20.5");
//   first-order stellar aberration u' = unit(u + v/c) (Explanatory Supplement to the Astronomical
//   Almanac, 1992, sec. 3.252, from memory). Second-order terms (~1e-8 rad^2) are neglected.
//   The spacecraft's own velocity does not enter: being in shadow is the same event in any frame.
// - Distance: the geometric distance (it only sets the Sun's apparent radius).
// Tested against astronomy-engine's GeoVector(Sun, aberration = true).

import { ephemerisCache, type PositionAt, type ThirdBodyState } from '../bodies/sun-moon.js';
import { SPEED_OF_LIGHT_KM_S } from '../core/constants.js';
import { combine, norm, type Vec3 } from '../core/vec3.js';

export interface SunState {
  /** Apparent geocentric position, km, GCRF (J2000 equator within the 23 mas frame bias). */
  readonly r: Vec3;
  /** Geocentric velocity, km/s (the aberration's own slow change, ~1e-11 rad/s, neglected). */
  readonly v: Vec3;
}

/** Geometric geocentric Sun -> apparent (aberrated) geocentric Sun, same distance. */
export function aberrated(geometric: ThirdBodyState): SunState {
  const d = norm(geometric.r);
  // The Earth moves with -v relative to the Sun: u' = unit(u - v_sun / c).
  const shifted = combine(geometric.r, 1 / d, geometric.v, -1 / SPEED_OF_LIGHT_KM_S);
  const k = d / norm(shifted);
  return { r: [shifted[0] * k, shifted[1] * k, shifted[2] * k], v: geometric.v };
}

/** Apparent Sun at any TT epoch, from a fresh ephemeris cache with nodes counted from originTT. */
export function apparentSunCache(originTT: number): (tt: number) => SunState {
  const geometric = withVelocity(ephemerisCache('sun', originTT));
  return (tt) => aberrated(geometric(tt));
}

/** Position and velocity of a body. */
export type BodyStateAt = (tt: number) => ThirdBodyState;

/** Velocity by a central difference of the cached positions over +-1 s (the cubic's error over 2 s: < 1e-9 relative). */
export function withVelocity(at: PositionAt): BodyStateAt {
  return (tt) => {
    const [a, b] = [at(tt - 1), at(tt + 1)];
    return { r: at(tt), v: [(b[0] - a[0]) / 2, (b[1] - a[1]) / 2, (b[2] - a[2]) / 2] };
  };
}
