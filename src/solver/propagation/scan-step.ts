// The coarse step of a search that scans an orbit for events (passes, eclipses), from one
// osculating state. The direction of the spacecraft seen from the central body's centre turns at
// most at h / rp^2 (fastest at periapsis); relative to a reference direction that itself turns at
// `referenceRateRadS` (the Earth's rotation for a station, the Sun's apparent motion for a
// shadow), at most at w = h / rp^2 + referenceRateRadS. The angle between a point running along a
// great circle and a fixed point has one minimum and one maximum per turn, half a turn apart, so
// extrema of such an angle are at least pi / w apart. With the step pi / (8 w), clamped to
// [10 s, 600 s], each step holds at most one extremum; the factor 8 leaves room for the slower
// changes of the other terms (distances, mask limits). 333 s at 500 km altitude for passes.

import { cross, dot, norm, type Vec3 } from '../core/vec3.js';

const MAX_STEP_S = 600;
const MIN_STEP_S = 10;

export interface ScanStep {
  /** The coarse step, s. */
  readonly stepS: number;
  /** Upper bound of the direction's turn rate relative to the reference, rad/s. */
  readonly turnRateRadS: number;
  /** Osculating eccentricity and specific angular momentum (km^2/s) of the state. */
  readonly eccentricity: number;
  readonly angularMomentum: number;
}

/** The coarse step of an event search for the orbit through r, v (km, km/s) about a body of GM gm. */
export function scanStep(r: Vec3, v: Vec3, gm: number, referenceRateRadS: number): ScanStep {
  const rMag = norm(r);
  const h = norm(cross(r, v));
  const energy = dot(v, v) / 2 - gm / rMag;
  const e = Math.sqrt(Math.max(0, 1 + (2 * energy * h * h) / (gm * gm)));
  // Periapsis radius p / (1 + e), p = h^2 / gm (Vallado 4th ed. Alg. 9, from memory).
  const rp = h > 0 ? (h * h) / gm / (1 + e) : rMag;
  const turnRate = (h > 0 ? h / (rp * rp) : norm(v) / rMag) + referenceRateRadS;
  const stepS = Math.min(MAX_STEP_S, Math.max(MIN_STEP_S, Math.PI / (8 * turnRate)));
  return { stepS, turnRateRadS: turnRate, eccentricity: e, angularMomentum: h };
}
