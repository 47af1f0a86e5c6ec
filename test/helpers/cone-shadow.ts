// An independent conical Earth shadow for the eclipse tests, written from the cone geometry (not
// the apparent-disc angles of src/solver/light/shadow.ts), with the Sun straight from
// astronomy-engine. Reference code for tests only.
import { AstroTime, Body, GeoMoon, GeoVector } from 'astronomy-engine';
import { dot, norm, sub, type Vec3 } from '../../src/solver/core/vec3.js';

export const MU_EARTH = 398_600.4418; // Earth GM, km^3/s^2 (NIMA TR8350.2 Table 3.1, from memory)
export const R_EARTH = 6378.137; // WGS-84 semi-major axis, km (NIMA TR8350.2 defining parameters)
export const R_SUN = 695_700; // IAU 2015 Resolution B3 nominal solar radius, km
export const AU_KM = 149_597_870.7; // IAU 2012 Resolution B2
export const R_MOON = 1737.4; // IAU WGCCRE 2015 mean lunar radius, km, from memory
const C_KM_S = 299_792.458; // SI definition of the metre
const DAY = 86_400;

export const unit = (a: Vec3): Vec3 => [a[0] / norm(a), a[1] / norm(a), a[2] / norm(a)];

/** The apparent geocentric Sun (light-time and aberration) straight from astronomy-engine, km, at TT seconds since J2000. */
export function sunAt(tt: number): Vec3 {
  const v = GeoVector(Body.Sun, AstroTime.FromTerrestrialTime(tt / DAY), true);
  return [v.x * AU_KM, v.y * AU_KM, v.z * AU_KM];
}

/** The geometric geocentric Moon from astronomy-engine, km. */
export function moonAt(tt: number): Vec3 {
  const v = GeoMoon(AstroTime.FromTerrestrialTime(tt / DAY));
  return [v.x * AU_KM, v.y * AU_KM, v.z * AU_KM];
}

/** The total solar eclipse of 2026-08-12, greatest eclipse near 17:46 UTC (from memory): the point 250 000 km behind the Moon on the Sun-Moon axis at TT tm. */
export function behindTheMoon(tm: number): Vec3 {
  const m = moonAt(tm);
  const axis = unit(sub(m, sunAt(tm)));
  return [m[0] + 250_000 * axis[0], m[1] + 250_000 * axis[1], m[2] + 250_000 * axis[2]];
}

/** The Moon's shadow region at geocentric r: the Moon where the light now reaching r passed it (one light-time iteration), the Sun relative to it. */
export function moonShadowRegion(r: Vec3, tt: number): number {
  const mt = moonAt(tt - norm(sub(moonAt(tt), r)) / C_KM_S);
  return coneRegion(sub(r, mt), sub(sunAt(tt), mt), R_MOON);
}

/**
 * Region of the point r (km, from the occulter's centre; the Earth unless another radius is
 * given) with the Sun at s (from the same centre): 2 umbra, 1 penumbra, 0 lit. The penumbra cone has its apex toward the Sun at L_p = R D / (R_sun + R) from the Earth's
 * centre and half-angle asin((R_sun + R) / D); the umbra cone its apex behind the Earth at
 * L_u = R D / (R_sun - R) and half-angle asin((R_sun - R) / D) (the cones tangent to both
 * spheres; Montenbruck & Gill 2000 sec. 3.4.2 draw them). Both regions lie behind the Earth
 * (x > 0 along the anti-Sun axis): the cones touch the Earth within 30 km of its terminator plane,
 * where a spacecraft above 100 km is farther from the axis than either cone.
 */
export function coneRegion(r: Vec3, s: Vec3, radius = R_EARTH): number {
  const d = norm(s);
  const toSun = unit(s);
  const x = -dot(r, toSun); // along the anti-Sun axis
  const y = norm(sub(r, [-x * toSun[0], -x * toSun[1], -x * toSun[2]])); // distance from the axis
  const lp = (radius * d) / (R_SUN + radius);
  const alphaP = Math.asin((R_SUN + radius) / d);
  if (!(x > 0 && y < (x + lp) * Math.tan(alphaP))) return 0;
  const lu = (radius * d) / (R_SUN - radius);
  const alphaU = Math.asin((R_SUN - radius) / d);
  return y < (lu - x) * Math.tan(alphaU) ? 2 : 1;
}

/** A change of region: from 0 to 1 is penumbra entry, 1 to 2 umbra entry, and back. */
export interface RegionChange { readonly t: number; readonly from: number; readonly to: number }

/** Brute force: region(t) every `step` s; each change of "region >= 1" and of "region = 2" bisected to 1 ms. */
export function regionChanges(region: (t: number) => number, start: number, stop: number, step: number): RegionChange[] {
  const out: RegionChange[] = [];
  let prev = region(start);
  for (let t = start + step; t <= stop; t += step) {
    const now = region(t);
    for (const level of [1, 2]) {
      const was = prev >= level;
      if (was === now >= level) continue;
      let [lo, hi] = [t - step, t];
      while (hi - lo > 1e-3) {
        const mid = (lo + hi) / 2;
        if (region(mid) >= level === was) lo = mid;
        else hi = mid;
      }
      out.push({ t: (lo + hi) / 2, from: was ? level : level - 1, to: was ? level - 1 : level });
    }
    prev = now;
  }
  return out.sort((x, y) => x.t - y.t);
}

/** The Earth's shadow along a geocentric trajectory, by brute force (regionChanges). */
export const earthShadowChanges = (positionAt: (t: number) => Vec3, start: number, stop: number, step: number): RegionChange[] =>
  regionChanges((t) => coneRegion(positionAt(t), sunAt(t)), start, stop, step);

/** The region changes an eclipse list reports, in time order ([start, umbraStart, umbraStop, stop] as numbers). */
export function reportedChanges(eclipses: readonly { start: number; stop: number; umbraStart: number | null; umbraStop: number | null }[]): RegionChange[] {
  return eclipses.flatMap((x) => x.umbraStart === null || x.umbraStop === null
    ? [{ t: x.start, from: 0, to: 1 }, { t: x.stop, from: 1, to: 0 }]
    : [{ t: x.start, from: 0, to: 1 }, { t: x.umbraStart, from: 1, to: 2 }, { t: x.umbraStop, from: 2, to: 1 }, { t: x.stop, from: 1, to: 0 }]);
}

/** Umbra and penumbra durations (s) of a circular orbit of radius a with the Sun in its plane (beta 0), at Sun distance d.
 * Closed form derived here (plane geometry of the tangent cones; common practice, no source): in the orbit plane through the
 * shadow axis the umbra boundary is the line from the cone's apex at L_u = R D / (R_sun - R) behind the Earth at half-angle
 * alpha_u, sin alpha_u = (R_sun - R) / D. A point at radius r and angle theta from the anti-Sun axis lies on it when
 * r sin(theta + alpha_u) = L_u sin alpha_u = R, so theta_u = asin(R / r) - alpha_u: the cylindrical half-angle asin(R / r)
 * (the cylindrical shadow, the simpler model beside the conical one in Montenbruck & Gill 2000 sec. 3.4.2, from memory)
 * shortened by the cone. The penumbra likewise gives
 * theta_p = asin(R / r) + alpha_p, sin alpha_p = (R_sun + R) / D. The orbit turns against the Sun's direction at
 * n - omega_sun, so the umbra lasts 2 theta_u / (n - omega_sun). */
export function betaZeroDurations(a: number, d: number, omegaSunRadS: number): { umbraS: number; penumbraS: number; cylinderS: number } {
  const n = Math.sqrt(MU_EARTH / a ** 3);
  const alphaU = Math.asin((R_SUN - R_EARTH) / d);
  const alphaP = Math.asin((R_SUN + R_EARTH) / d);
  const rate = n - omegaSunRadS;
  return {
    umbraS: (2 * (Math.asin(R_EARTH / a) - alphaU)) / rate,
    penumbraS: (2 * (Math.asin(R_EARTH / a) + alphaP)) / rate,
    cylinderS: (2 * Math.asin(R_EARTH / a)) / rate,
  };
}
