// Classical orbital elements from a position and velocity, and back.
// Conventions for angles that the geometry leaves undefined (applied the same way both ways):
// - equatorial (i < EQUATORIAL_INCLINATION or i > pi - EQUATORIAL_INCLINATION): raan = 0,
//   raanDefined = false, and the x axis stands in for the ascending node: argPeriapsis is the
//   angle from the x axis to periapsis, measured in the direction of motion (so for a retrograde
//   equatorial orbit it runs clockwise seen from +z). Input elements are mapped to this form with
//   omega' = omega + raan (prograde) or omega - raan (retrograde).
// - circular (e < CIRCULAR_ECCENTRICITY): argPeriapsis = 0, argPeriapsisDefined = false, and
//   trueAnomaly is the argument of latitude (from the node), or the true longitude (from the x
//   axis, in the direction of motion) when also equatorial. Input elements map to nu' = omega' + nu.
// - parabolic (|1 - e| < PARABOLIC_ECCENTRICITY): semiMajorAxis = null, eccentricAnomaly is the
//   parabolic anomaly B = tan(nu/2) (dimensionless), meanAnomaly is M_p = B + B^3/3 (see kepler.ts).
// Ranges: raan, argPeriapsis, argLatitude, trueLongitude, longitudeOfPeriapsis in [0, 2pi).
// Closed orbits: trueAnomaly, eccentricAnomaly, meanAnomaly in [0, 2pi). Open orbits: signed,
// negative before periapsis, |trueAnomaly| < acos(-1/e).

import { RAD, wrapPi, wrapTwoPi } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';
import { combine, cross, dot, isFiniteVec, norm, scale, type Vec3 } from '../core/vec3.js';
import {
  eccentricFromTrue,
  meanFromEccentric,
  meanFromHyperbolic,
  meanFromParabolic,
  parabolicFromTrue,
  solveBarker,
  solveKeplerElliptic,
  solveKeplerHyperbolic,
  trueFromEccentric,
  trueFromHyperbolic,
  trueFromParabolic,
} from './kepler.js';

export type OrbitType = 'circular' | 'elliptic' | 'parabolic' | 'hyperbolic';

export interface ClassicalElements {
  readonly orbitType: OrbitType;
  readonly semiMajorAxis: number | null; // km; negative for hyperbola; null for parabola
  readonly semiLatusRectum: number; // km, p = h^2/mu
  readonly eccentricity: number;
  readonly inclination: number; // rad, [0, pi]
  readonly raan: number; // rad, [0, 2pi)
  readonly argPeriapsis: number; // rad, [0, 2pi)
  readonly trueAnomaly: number; // rad
  readonly eccentricAnomaly: number; // rad: E (ellipse), H (hyperbola), B = tan(nu/2) (parabola, dimensionless)
  readonly meanAnomaly: number; // rad: M, hyperbolic M_h, or parabolic M_p
  readonly argLatitude: number; // rad, u = omega + nu (measured from the node)
  readonly trueLongitude: number; // rad, raan + omega + nu
  readonly longitudeOfPeriapsis: number; // rad, raan + omega
  readonly raanDefined: boolean; // false when equatorial
  readonly argPeriapsisDefined: boolean; // false when circular
}

export interface ElementsInput {
  semiMajorAxis?: number; // km; give this or semiLatusRectum, not both
  semiLatusRectum?: number; // km; required for a parabola
  eccentricity: number;
  inclination: number; // rad, [0, pi]
  raan: number; // rad
  argPeriapsis: number; // rad
  trueAnomaly?: number; // rad; give exactly one of trueAnomaly, meanAnomaly
  meanAnomaly?: number; // rad
}

/** e below this is circular. A double state gives e to a few 1e-16 (rounding of v^2 r / mu), so at
 * 1e-9 the periapsis direction is still good to ~1e-6 rad; below it the direction is noise, and the
 * apsides differ by 2 a e < 2e-9 a (1.4 cm in low Earth orbit). */
export const CIRCULAR_ECCENTRICITY = 1e-9;
/** i (or pi - i) below this is equatorial, rad. The node direction (-h_y, h_x, 0) keeps ~1e-7 rad
 * at i = 1e-9 (inclination is taken with atan2, not acos, so it is resolved that far). */
export const EQUATORIAL_INCLINATION = 1e-9;
/** |1 - e| below this is parabolic: far above the ~1e-15 rounding of e computed from a state, far
 * below e = 0.9999 / 1.0001, which keep their own classes. There |a| > 5e9 p. */
export const PARABOLIC_ECCENTRICITY = 1e-10;
/** |r x v| <= this * |r| |v| is rectilinear: the orbit plane is lost in the rounding of r x v
 * (~1e-16 |r| |v|) beyond 1e-6 rad. */
export const RECTILINEAR_SINE = 1e-10;

export function orbitTypeOf(e: number): OrbitType {
  if (Math.abs(1 - e) < PARABOLIC_ECCENTRICITY) return 'parabolic';
  if (e < CIRCULAR_ECCENTRICITY) return 'circular';
  return e < 1 ? 'elliptic' : 'hyperbolic';
}

export const isEquatorial = (inclination: number): boolean =>
  inclination < EQUATORIAL_INCLINATION || inclination > Math.PI - EQUATORIAL_INCLINATION;

export const isClosed = (type: OrbitType): boolean => type === 'circular' || type === 'elliptic';

/** True anomaly of the asymptote, acos(-1/e), for e >= 1 (pi for the parabola; Curtis 3rd ed. sec. 2.10, from memory). */
export const asymptoteAnomaly = (e: number, type: OrbitType): number => (type === 'parabolic' ? Math.PI : Math.acos(-1 / e));

/**
 * Eccentric-type and mean anomaly of true anomaly nu on an orbit of this type. `pOverR` = 1 + e cos nu
 * may be given (from a state) to spare the hyperbola the cancellation of 1 + e cos nu near its asymptote.
 */
export function anomaliesFromTrue(nu: number, e: number, type: OrbitType, pOverR = 1 + e * Math.cos(nu)): { eccentricAnomaly: number; meanAnomaly: number } {
  if (type === 'parabolic') {
    const B = parabolicFromTrue(nu);
    return { eccentricAnomaly: B, meanAnomaly: meanFromParabolic(B) };
  }
  if (type === 'hyperbolic') {
    const H = Math.asinh((Math.sqrt((e - 1) * (e + 1)) * Math.sin(nu)) / pOverR); // as hyperbolicFromTrue in kepler.ts
    return { eccentricAnomaly: H, meanAnomaly: meanFromHyperbolic(H, e) };
  }
  const E = eccentricFromTrue(nu, e);
  return { eccentricAnomaly: wrapTwoPi(E), meanAnomaly: wrapTwoPi(meanFromEccentric(E, e)) };
}

/** True anomaly from the mean anomaly (M, M_h or M_p) on an orbit of this type. */
export function trueFromMean(M: number, e: number, type: OrbitType): Outcome<number> {
  if (type === 'parabolic') return success(trueFromParabolic(solveBarker(M)));
  if (type === 'hyperbolic') {
    const H = solveKeplerHyperbolic(M, e);
    return H.ok ? success(trueFromHyperbolic(H.value, e)) : H;
  }
  const E = solveKeplerElliptic(M, e);
  return E.ok ? success(trueFromEccentric(E.value, e)) : E;
}

/** Everything derived from the canonical angles. */
function describe(
  type: OrbitType, a: number | null, p: number, e: number, i: number, raan: number, argp: number, nu: number,
  pOverR?: number,
): ClassicalElements {
  const closed = isClosed(type);
  const trueAnomaly = closed ? wrapTwoPi(nu) : wrapPi(nu);
  return {
    orbitType: type,
    semiMajorAxis: a,
    semiLatusRectum: p,
    eccentricity: e,
    inclination: i,
    raan,
    argPeriapsis: argp,
    trueAnomaly,
    ...anomaliesFromTrue(trueAnomaly, e, type, pOverR),
    argLatitude: wrapTwoPi(argp + trueAnomaly),
    trueLongitude: wrapTwoPi(raan + argp + trueAnomaly),
    longitudeOfPeriapsis: wrapTwoPi(raan + argp),
    raanDefined: !isEquatorial(i),
    argPeriapsisDefined: type !== 'circular',
  };
}

const badMu = (mu: number): boolean => !(mu > 0 && Number.isFinite(mu));

/** Eccentricity vector ((v^2 - mu/r) r - (r.v) v) / mu, pointing to periapsis (Vallado 4th ed. Alg. 9). */
export function eccentricityVector(r: Vec3, v: Vec3, mu: number): Vec3 {
  return scale(combine(r, dot(v, v) - mu / norm(r), v, -dot(r, v)), 1 / mu);
}

/** Classical elements of a state (Vallado 4th ed. Alg. 9 RV2COE; Curtis 3rd ed. Alg. 4.2), angles by atan2. */
export function stateToElements(r: Vec3, v: Vec3, mu: number): Outcome<ClassicalElements> {
  if (!isFiniteVec(r) || !isFiniteVec(v)) return failure('invalid-parameter', 'position and velocity must be finite numbers');
  if (badMu(mu)) return failure('invalid-parameter', `the gravitational parameter must be a positive finite number, got ${mu}`);
  const rMag = norm(r);
  if (rMag === 0) return failure('zero-position', 'the position is at the centre of the body: no orbit is defined');
  const h = cross(r, v); // specific angular momentum
  const hMag = norm(h);
  if (hMag <= RECTILINEAR_SINE * rMag * norm(v)) {
    return failure('rectilinear-motion', 'velocity is parallel to the position (angular momentum is zero): the motion is a straight line with no orbital plane');
  }
  const eVec = eccentricityVector(r, v, mu);
  const e = norm(eVec);
  const p = (hMag * hMag) / mu; // Vallado 4th ed. Alg. 9
  const type = orbitTypeOf(e);
  const a = type === 'parabolic' ? null : p / ((1 - e) * (1 + e)); // p = a (1 - e^2), Curtis 3rd ed. sec. 2.7 (from memory)
  const inclination = Math.atan2(Math.hypot(h[0], h[1]), h[2]);
  const equatorial = isEquatorial(inclination);
  // Node vector k x h; the x axis stands in for it when equatorial.
  const node: Vec3 = equatorial ? [1, 0, 0] : [-h[1], h[0], 0];
  const hHat = scale(h, 1 / hMag);
  // Angle from a to b in the orbit plane, positive in the direction of motion.
  const angle = (from: Vec3, to: Vec3): number => Math.atan2(dot(hHat, cross(from, to)), dot(from, to));
  const raan = equatorial ? 0 : wrapTwoPi(Math.atan2(h[0], -h[1]));
  const circular = type === 'circular';
  const argp = circular ? 0 : wrapTwoPi(angle(node, eVec));
  const nu = circular ? angle(node, r) : angle(eVec, r);
  return success(describe(type, a, p, e, inclination, raan, argp, nu, p / rMag));
}

/** Position and velocity from classical elements (Vallado 4th ed. Alg. 10 COE2RV; Curtis 3rd ed. Alg. 4.5),
 * with the elements restated in the conventions above. */
export function elementsToState(el: ElementsInput, mu: number): Outcome<{ r: Vec3; v: Vec3; elements: ClassicalElements }> {
  if (badMu(mu)) return failure('invalid-parameter', `the gravitational parameter must be a positive finite number, got ${mu}`);
  const e = el.eccentricity;
  if (!(e >= 0 && Number.isFinite(e))) return failure('eccentricity-out-of-range', `eccentricity must be a finite number >= 0, got ${e}`);
  const { inclination: i, raan, argPeriapsis } = el;
  if (![i, raan, argPeriapsis].every(Number.isFinite)) return failure('invalid-parameter', 'inclination, raan and argPeriapsis must be finite numbers');
  if (i < 0 || i > Math.PI) return failure('invalid-parameter', `inclination must lie in [0, 180] deg, got ${i * RAD} deg`);
  const hasA = el.semiMajorAxis !== undefined;
  const hasP = el.semiLatusRectum !== undefined;
  if (hasA === hasP) return failure('invalid-parameter', 'give exactly one of semiMajorAxis and semiLatusRectum');
  const hasNu = el.trueAnomaly !== undefined;
  if (hasNu === (el.meanAnomaly !== undefined)) return failure('invalid-parameter', 'give exactly one of trueAnomaly and meanAnomaly');
  const anomaly = (hasNu ? el.trueAnomaly : el.meanAnomaly) as number;
  if (!Number.isFinite(anomaly)) return failure('invalid-parameter', `the anomaly must be a finite number, got ${anomaly}`);
  const type = orbitTypeOf(e);

  let p: number;
  let a: number | null = null;
  if (hasP) {
    p = el.semiLatusRectum as number;
    if (!(p > 0 && Number.isFinite(p))) return failure('invalid-parameter', `semiLatusRectum must be a positive finite number, got ${p}`);
    if (type !== 'parabolic') a = p / ((1 - e) * (1 + e));
  } else {
    a = el.semiMajorAxis as number;
    if (!Number.isFinite(a) || a === 0) return failure('invalid-parameter', `semiMajorAxis must be a non-zero finite number, got ${a}`);
    if (type === 'parabolic') {
      return failure('semi-major-axis-sign', `e = ${e} is parabolic (|1 - e| < ${PARABOLIC_ECCENTRICITY}): the semi-major axis is infinite; give semiLatusRectum instead`);
    }
    if ((e < 1) !== (a > 0)) {
      return failure('semi-major-axis-sign', e < 1
        ? `an ellipse (e = ${e} < 1) needs a positive semi-major axis, got ${a}`
        : `a hyperbola (e = ${e} > 1) needs a negative semi-major axis, got ${a}`);
    }
    p = a * (1 - e) * (1 + e); // p = a (1 - e^2), Curtis 3rd ed. sec. 2.7 (from memory)
  }

  let nu: number;
  if (hasNu) {
    nu = isClosed(type) ? anomaly : wrapPi(anomaly);
    // At the asymptote to rounding: 1 + e cos nu no larger than its own rounding error.
    if (!isClosed(type) && (Math.abs(nu) >= asymptoteAnomaly(e, type) || 1 + e * Math.cos(nu) <= 4 * Number.EPSILON * (1 + e))) {
      const limit = asymptoteAnomaly(e, type) * RAD;
      return failure('anomaly-beyond-asymptote', `true anomaly ${nu * RAD} deg lies at or beyond the asymptote of this ${type} trajectory: |nu| must stay below acos(-1/e) = ${limit} deg`);
    }
  } else {
    const solved = trueFromMean(anomaly, e, type);
    if (!solved.ok) return solved;
    nu = solved.value;
  }

  // Perifocal P (to periapsis) and Q (90 deg ahead) in the inertial frame: R3(-raan) R1(-i) R3(-omega)
  // (Vallado 4th ed. Alg. 10; Curtis 3rd ed. eq. 4.49, from memory).
  const [cO, sO, ci, si, cw, sw] = [Math.cos(raan), Math.sin(raan), Math.cos(i), Math.sin(i), Math.cos(argPeriapsis), Math.sin(argPeriapsis)];
  const P: Vec3 = [cO * cw - sO * sw * ci, sO * cw + cO * sw * ci, sw * si];
  const Q: Vec3 = [-cO * sw - sO * cw * ci, -sO * sw + cO * cw * ci, cw * si];
  const pOverR = 1 + e * Math.cos(nu);
  const radius = p / pOverR; // conic equation r = p / (1 + e cos nu), Curtis 3rd ed. eq. 2.45 (from memory)
  const vScale = Math.sqrt(mu / p);
  const r = combine(P, radius * Math.cos(nu), Q, radius * Math.sin(nu)); // perifocal position, Curtis 3rd ed. eq. 4.45 (from memory)
  const v = combine(P, -vScale * Math.sin(nu), Q, vScale * (e + Math.cos(nu))); // perifocal velocity, Curtis 3rd ed. eq. 4.46 (from memory)

  // Restate the angles in the conventions of this file.
  const equatorial = isEquatorial(i);
  let argp = equatorial ? (i < Math.PI / 2 ? argPeriapsis + raan : argPeriapsis - raan) : argPeriapsis;
  let nuOut = nu;
  if (type === 'circular') {
    nuOut = argp + nu;
    argp = 0;
  }
  const elements = describe(type, a, p, e, i, equatorial ? 0 : wrapTwoPi(raan), wrapTwoPi(argp), nuOut, type === 'circular' ? undefined : pOverR);
  return success({ r, v, elements });
}
