// Conical shadow of a spherical occulting body (the Earth, of its equatorial radius) lit by a
// spherical Sun: Montenbruck & Gill, Satellite Orbits (2000), sec. 3.4.2, "conical shadow model".
// Seen from the spacecraft at r (from the occulter's centre), with the Sun at s:
//   a = asin(R_sun / |s - r|)        apparent radius of the Sun
//   b = asin(R_occ / |r|)            apparent radius of the occulting body
//   c = angle between -r and s - r   apparent separation of the two centres
// Regions: c >= a + b lit; b - a < c < a + b penumbra (partial); c <= b - a umbra (total, needs
// b > a); c <= a - b antumbra (annular: the whole occulter inside the solar disc, a > b). The
// boundaries are exactly the cones tangent to both spheres. The hidden fraction of the solar disc
// (partial phase) is the overlap of two flat discs of radii a and b at distance c, over pi a^2:
//   x = (c^2 + a^2 - b^2) / (2 c),  y = sqrt(a^2 - x^2),
//   A = a^2 acos(x / a) + b^2 acos((c - x) / b) - c y
// (the same section; a uniformly bright disc: no limb darkening, no atmosphere of the occulter).

import { acosClamped } from '../core/math.js';
import { cross, dot, norm, type Vec3 } from '../core/vec3.js';

/** Nominal solar radius, km: IAU 2015 Resolution B3, R_N = 695 700 km. */
export const SUN_RADIUS_KM = 695_700;

export interface ShadowAngles {
  /** Apparent radius of the Sun, rad. */
  readonly a: number;
  /** Apparent radius of the occulting body, rad. */
  readonly b: number;
  /** Apparent separation of their centres, rad. */
  readonly c: number;
}

/** The apparent angles of M&G sec. 3.4.2 and their time derivatives (rad, rad/s). */
export interface ShadowGeometry extends ShadowAngles {
  readonly aRate: number;
  readonly bRate: number;
  readonly cRate: number;
}

/** Angle between two vectors, accurate near 0 and pi (atan2 of |u x w| and u . w). */
const angleBetween = (u: Vec3, w: Vec3): number => Math.atan2(norm(cross(u, w)), dot(u, w));

/**
 * Shadow angles at spacecraft position r (km, from the occulter's centre) with the Sun at s, and
 * their rates from the spacecraft velocity v and the Sun's velocity vs (same frame, km/s).
 * Rates: d/dt asin(R / d) = -R d' / (d sqrt(d^2 - R^2)); the separation rate from the derivatives
 * of the two unit vectors, du/dt = (x' - u (u . x')) / |x| (common practice, no source).
 */
export function shadowGeometry(r: Vec3, v: Vec3, s: Vec3, vs: Vec3, occulterRadius: number, sunRadius = SUN_RADIUS_KM): ShadowGeometry {
  const rn = norm(r);
  const d: Vec3 = [s[0] - r[0], s[1] - r[1], s[2] - r[2]];
  const dn = norm(d);
  const dRate: Vec3 = [vs[0] - v[0], vs[1] - v[1], vs[2] - v[2]];
  const a = Math.asin(Math.min(1, sunRadius / dn));
  const b = Math.asin(Math.min(1, occulterRadius / rn));
  const down: Vec3 = [-r[0] / rn, -r[1] / rn, -r[2] / rn];
  const sunward: Vec3 = [d[0] / dn, d[1] / dn, d[2] / dn];
  const c = angleBetween(down, sunward);
  const rnRate = -dot(down, v); // d|r|/dt
  const dnRate = dot(sunward, dRate);
  const aRate = dn > sunRadius ? (-sunRadius * dnRate) / (dn * Math.sqrt(dn * dn - sunRadius * sunRadius)) : 0;
  const bRate = rn > occulterRadius ? (-occulterRadius * rnRate) / (rn * Math.sqrt(rn * rn - occulterRadius * occulterRadius)) : 0;
  // d(-r/|r|)/dt = -(v - r_hat (r_hat . v)) / |r|; d(d/|d|)/dt = (d' - u (u . d')) / |d|.
  const downRate: Vec3 = [(-v[0] - down[0] * rnRate) / rn, (-v[1] - down[1] * rnRate) / rn, (-v[2] - down[2] * rnRate) / rn];
  const sunwardRate: Vec3 = [(dRate[0] - sunward[0] * dnRate) / dn, (dRate[1] - sunward[1] * dnRate) / dn, (dRate[2] - sunward[2] * dnRate) / dn];
  const sinC = Math.sin(c);
  const cRate = sinC > 1e-12 ? -(dot(downRate, sunward) + dot(down, sunwardRate)) / sinC : 0;
  return { a, b, c, aRate, bRate, cRate };
}

/** Fraction of the solar disc hidden by the occulter, 0 (lit) to 1 (umbra); M&G sec. 3.4.2. */
export function hiddenFraction({ a, b, c }: ShadowAngles): number {
  if (c >= a + b) return 0;
  if (c <= b - a) return 1;
  if (c <= a - b) return (b * b) / (a * a);
  const x = (c * c + a * a - b * b) / (2 * c);
  const y = Math.sqrt(Math.max(0, a * a - x * x));
  const area = a * a * acosClamped(x / a) + b * b * acosClamped((c - x) / b) - c * y;
  return Math.min(1, Math.max(0, area / (Math.PI * a * a)));
}

/** Positive inside the penumbra or umbra (rad): a + b - c. */
export const penumbraMargin = (g: ShadowAngles): number => g.a + g.b - g.c;
export const penumbraMarginRate = (g: ShadowGeometry): number => g.aRate + g.bRate - g.cRate;
/** Positive inside the umbra (rad): b - a - c. */
export const umbraMargin = (g: ShadowAngles): number => g.b - g.a - g.c;
export const umbraMarginRate = (g: ShadowGeometry): number => g.bRate - g.aRate - g.cRate;
/** True when the centre of the solar disc is in view (not behind the occulter's disc): c > b. */
export const sunCentreVisible = (g: ShadowAngles): boolean => g.c > g.b;
