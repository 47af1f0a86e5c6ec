// Secular rates of the node, periapsis and mean anomaly under J2 (first order, bound orbits), and
// the sun-synchronous condition. The elements must be referred to the body's equator (z = spin axis).

import { DEG, SECONDS_PER_DAY } from '../core/math.js';
import type { CentralBody } from '../bodies/bodies.js';

export interface J2Rates {
  readonly raanRateRadS: number; // rad/s
  readonly argPeriapsisRateRadS: number; // rad/s
  /** rad/s: the J2 correction ADDED to the Keplerian mean motion sqrt(mu/a^3), not the total rate. */
  readonly meanAnomalyRateRadS: number;
}

/** Common factor n J2 (R/p)^2 of the three rates, n = sqrt(mu/a^3). */
function j2Factor(a: number, e: number, mu: number, j2: number, radius: number): number {
  if (!(a > 0 && e >= 0 && e < 1 && mu > 0 && radius > 0) || ![a, e, mu, j2, radius].every(Number.isFinite)) {
    throw new RangeError(`J2 secular rates need a bound orbit (a > 0, 0 <= e < 1), mu > 0 and radius > 0; got a=${a}, e=${e}, mu=${mu}, radius=${radius}`);
  }
  const p = a * (1 - e) * (1 + e);
  const ratio = radius / p;
  return Math.sqrt(mu / (a * a * a)) * j2 * ratio * ratio;
}

/**
 * First-order secular J2 rates (Vallado 4th ed. eq. 9-41; Curtis 3rd ed. eqs. 4.52 and 4.53; eq.
 * numbers from memory):
 *   dRAAN/dt = -3/2 n J2 (R/p)^2 cos i
 *   domega/dt = 3/4 n J2 (R/p)^2 (4 - 5 sin^2 i)
 *   dM/dt - n = 3/4 n J2 (R/p)^2 sqrt(1 - e^2) (2 - 3 sin^2 i)
 * Throws RangeError for an unbound orbit (a programmer error: callers check the orbit is bound).
 */
export function j2SecularRates(a: number, e: number, i: number, mu: number, j2: number, radius: number): J2Rates {
  const k = j2Factor(a, e, mu, j2, radius);
  const s2 = Math.sin(i) ** 2;
  return {
    raanRateRadS: -1.5 * k * Math.cos(i),
    argPeriapsisRateRadS: 0.75 * k * (4 - 5 * s2),
    meanAnomalyRateRadS: 0.75 * k * Math.sqrt((1 - e) * (1 + e)) * (2 - 3 * s2),
  };
}

/**
 * |raanRateRadS - heliocentric mean motion| within this counts as sun-synchronous: 0.01 deg/day, i.e.
 * the orbit plane drifts 3.65 deg (about 15 min of local time) a year against the mean Sun, the
 * order of a yearly station-keeping budget (common practice, no source).
 */
export const SUN_SYNCHRONOUS_TOLERANCE = (0.01 * DEG) / SECONDS_PER_DAY;

/**
 * Inclination (rad) whose J2 node rate equals the body's heliocentric mean motion:
 * cos i = -n_sun / (3/2 n J2 (R/p)^2), the node rate above solved for i (Curtis 3rd ed. sec. 4.7, from memory).
 * Null when the body lacks J2, radius or heliocentric motion, the orbit is unbound, or |cos i| > 1
 * (J2 too weak at this size of orbit).
 */
export function sunSynchronousInclination(a: number, e: number, body: CentralBody): number | null {
  const { j2, radius, heliocentricMeanMotionRadS: nSun } = body;
  if (j2 === undefined || radius === undefined || nSun === undefined || j2 === 0) return null;
  if (!(a > 0 && e >= 0 && e < 1 && radius > 0 && body.gm > 0) || ![a, j2, radius, body.gm].every(Number.isFinite)) return null;
  const cosI = -nSun / (1.5 * j2Factor(a, e, body.gm, j2, radius));
  return Math.abs(cosI) <= 1 ? Math.acos(cosI) : null;
}

/** True when a node rate (rad/s) matches the body's heliocentric mean motion within SUN_SYNCHRONOUS_TOLERANCE. */
export function isSunSynchronous(raanRateRadS: number, body: CentralBody): boolean {
  const nSun = body.heliocentricMeanMotionRadS;
  return nSun !== undefined && Math.abs(raanRateRadS - nSun) <= SUN_SYNCHRONOUS_TOLERANCE;
}
