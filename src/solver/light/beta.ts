// The orbit plane and the Sun: the beta angle, the local time of the ascending node, and the
// sun-synchronous test.
// - beta = asin(h_hat . s_hat): the Sun's elevation above the orbit plane (common practice, no source).
// - Local mean solar time of the ascending node: the node's longitude on the Earth's true equator
//   (the ITRF node of the orbit plane) plus UT1: LMT = UT1 + lambda / (15 deg/h) (UT1 is mean
//   solar time at Greenwich; Vallado 4th ed. sec. 3.5, from memory). The apparent solar time
//   differs from it by the equation of time (up to ~16 min).

import { BODIES } from '../bodies/bodies.js';
import { isSunSynchronous, j2SecularRates } from '../conic/j2.js';
import { asinClamped } from '../core/math.js';
import { cross, dot, norm, type Vec3 } from '../core/vec3.js';
import { gcrfToItrf, type FrameOptions } from '../earth/frames.js';
import { ut1DaysSinceJ2000 } from '../time/time.js';

/** Beta angle (rad, [-pi/2, pi/2]) of the orbit through r, v with the Sun at s (any common frame). */
export function betaAngle(r: Vec3, v: Vec3, s: Vec3): number {
  const h = cross(r, v);
  return asinClamped(dot(h, s) / (norm(h) * norm(s)));
}

/** The orbit's angular momentum in the Earth-fixed frame (its z axis the true pole), km^2/s. */
function earthFixedMomentum(tt: number, r: Vec3, v: Vec3, opts: FrameOptions): Vec3 {
  return gcrfToItrf(tt, cross(r, v), [0, 0, 0], opts).r;
}

/** Local mean solar time of the ascending node at tt, hours in [0, 24). */
export function ascendingNodeLocalTime(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): number {
  const h = earthFixedMomentum(tt, r, v, opts);
  const nodeLongitude = Math.atan2(h[0], -h[1]); // node direction z x h = (-h_y, h_x, 0)
  const days = ut1DaysSinceJ2000(tt, opts.dut1 ?? 0);
  const ut1Hours = ((days - Math.floor(days)) * 24 + 12) % 24; // J2000.0 is at 12:00
  const hours = (ut1Hours + (nodeLongitude * 12) / Math.PI) % 24;
  return hours < 0 ? hours + 24 : hours;
}

/**
 * True when the osculating orbit's first-order J2 node rate matches the Sun's mean motion within
 * SUN_SYNCHRONOUS_TOLERANCE (conic/j2.ts). The inclination is taken on the GCRF equator, as
 * /v1/orbit does, so both answers agree (the true equator of date differs by up to ~0.15 deg in
 * 2026, which moves the node rate by up to 2 %). False for unbound orbits.
 */
export function isSunSynchronousOrbit(r: Vec3, v: Vec3): boolean {
  const earth = BODIES.earth;
  const mu = earth.gm;
  const energy = dot(v, v) / 2 - mu / norm(r);
  if (!(energy < 0)) return false;
  const a = -mu / (2 * energy);
  const h = cross(r, v);
  const hn = norm(h);
  const e = Math.sqrt(Math.max(0, 1 - (hn * hn) / (mu * a))); // p = h^2 / mu = a (1 - e^2)
  if (!(e < 1)) return false;
  const inclination = Math.acos(Math.max(-1, Math.min(1, h[2] / hn)));
  return isSunSynchronous(j2SecularRates(a, e, inclination, mu, earth.j2!, earth.radius!).raanRateRadS, earth);
}
