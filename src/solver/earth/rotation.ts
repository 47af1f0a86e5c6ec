// Earth rotation: the Earth rotation angle, Greenwich mean and apparent sidereal time (IAU 2006),
// and the equation of the equinoxes. Coefficients as in the project's shared reference README
// (earth-orientation), with the publications named per formula.

import { TWO_PI, SECONDS_PER_DAY, wrapTwoPi } from '../core/math.js';
import { ARCSEC } from './precession.js';

/** Earth rotation rate, rad/s of UT1: the time derivative of ERA, 2 pi x 1.00273781191135448 / day (IERS Conventions 2010 eq. 5.15). */
export const EARTH_ROTATION_RATE_RAD_S = (TWO_PI * 1.002_737_811_911_354_6) / SECONDS_PER_DAY; // 1.00273781191135448 to double precision

/** Earth rotation angle (rad, [0, 2pi)) from UT1 days since J2000 (JD_UT1 - 2451545.0); IERS Conventions 2010 eq. 5.15. */
export function earthRotationAngle(ut1Days: number): number {
  const frac = ut1Days - Math.floor(ut1Days); // split off whole days first: keeps ~1e-16 day resolution
  return wrapTwoPi(TWO_PI * (frac + 0.779_057_273_264 + 0.002_737_811_911_354_48 * ut1Days));
}

const GMST_POLY = [0.014506, 4612.156534, 1.3915817, -0.00000044, -0.000029956, -0.0000000368];

/** GMST - ERA, rad, at t TT Julian centuries (IAU 2006; Capitaine et al., A&A 432, 355 (2005); IERS Conventions 2010 eq. 5.32). */
export function gmstMinusEra(t: number): number {
  let s = 0;
  for (let i = GMST_POLY.length - 1; i >= 0; i--) s = s * t + GMST_POLY[i]!;
  return s * ARCSEC;
}

/** Greenwich mean sidereal time (IAU 2006), rad [0, 2pi): ERA of UT1 plus the polynomial in TT. */
export const gmst2006 = (ut1Days: number, t: number): number => wrapTwoPi(earthRotationAngle(ut1Days) + gmstMinusEra(t));

/**
 * Equation of the equinoxes, rad: dpsi cos(eps_A) plus the two largest complementary terms
 * (IERS Conventions 2010 eq. 5.30 and Table 5.2e; within ~0.1 mas of the full series).
 * `om`: the Moon's ascending node (Delaunay Om), rad.
 */
export function equationOfEquinoxes(dpsi: number, epsA: number, om: number): number {
  return dpsi * Math.cos(epsA) + (0.002_640_96 * Math.sin(om) + 0.000_063_52 * Math.sin(2 * om)) * ARCSEC;
}
