// The summary of one Keplerian orbit about a central body: elements, apsides, period, energy,
// angular momentum, flight-path angle and, where the body has J2, the secular J2 rates.

import { TWO_PI, wrapTwoPi } from '../core/math.js';
import { success, type Outcome } from '../core/result.js';
import { cross, dot, norm, type Vec3 } from '../core/vec3.js';
import type { CentralBody } from '../bodies/bodies.js';
import { eccentricityVector, elementsToState, isClosed, stateToElements, type ClassicalElements, type ElementsInput } from './elements.js';
import { isSunSynchronous, j2SecularRates, sunSynchronousInclination } from './j2.js';

export interface ApsisSummary {
  radius: number; // km
  altitude: number | null; // km above body.radius; null when the body has no radius
  speed: number; // km/s
  secondsToNextPassage: number | null; // 0 when exactly at it; null when none lies ahead or it is undefined
}

export interface OrbitSolution {
  elements: ClassicalElements;
  apsides: { periapsis: ApsisSummary; apoapsis: ApsisSummary | null }; // apoapsis null when unbound
  periodS: number | null; // null when unbound
  /** rad/s: sqrt(mu/a^3) (ellipse), sqrt(mu/(-a)^3) (hyperbola), 2 sqrt(mu/p^3) (parabola, so that M_p = n (t - T)). */
  meanMotion: number;
  specificEnergy: number; // km^2/s^2, vis-viva
  specificAngularMomentum: Vec3; // km^2/s
  specificAngularMomentumMagnitude: number;
  eccentricityVector: Vec3;
  flightPathAngle: number; // rad, velocity above the local horizontal
  radius: number; // km, at epoch
  speed: number; // km/s, at epoch
  j2?: {
    raanRateRadS: number;
    argPeriapsisRateRadS: number;
    meanAnomalyRateRadS: number; // correction added to meanMotion
    sunSynchronous: boolean;
    sunSynchronousInclination: number | null;
  };
  position: Vec3; // km, the state at epoch
  velocity: Vec3; // km/s
}

export type OrbitInput = { r: Vec3; v: Vec3 } | { elements: ElementsInput };

/** Solve one orbit about `body` from a state or from elements (angles and units as in elements.ts). */
export function solveOrbit(body: CentralBody, input: OrbitInput): Outcome<OrbitSolution> {
  const mu = body.gm;
  let r: Vec3;
  let v: Vec3;
  let el: ClassicalElements;
  if ('elements' in input) {
    const s = elementsToState(input.elements, mu);
    if (!s.ok) return s;
    ({ r, v, elements: el } = s.value);
  } else {
    const s = stateToElements(input.r, input.v, mu);
    if (!s.ok) return s;
    ({ r, v } = input);
    el = s.value;
  }

  const radius = norm(r);
  const speed = norm(v);
  const h = cross(r, v);
  const hMag = norm(h);
  const rv = dot(r, v);
  const energy = (speed * speed) / 2 - mu / radius; // vis-viva, Curtis 3rd ed. eq. 2.80 (from memory)
  const { eccentricity: e, semiLatusRectum: p, semiMajorAxis: a, orbitType } = el;
  const closed = isClosed(orbitType);
  const meanMotion = a === null ? 2 * Math.sqrt(mu / (p * p * p)) : Math.sqrt(mu / Math.abs(a * a * a));
  const M = el.meanAnomaly;
  const altitude = (rad: number): number | null => (body.radius === undefined ? null : rad - body.radius);

  // Apsides from the conic equation at nu = 0, pi; speeds from h = r v at an apsis (Curtis 3rd ed. sec. 2.7).
  const rp = p / (1 + e);
  const circular = orbitType === 'circular';
  let toPeriapsis: number | null;
  if (circular) toPeriapsis = null;
  else if (closed) toPeriapsis = M === 0 ? 0 : (TWO_PI - M) / meanMotion;
  else toPeriapsis = M < 0 ? -M / meanMotion : M === 0 ? 0 : null;
  const periapsis: ApsisSummary = { radius: rp, altitude: altitude(rp), speed: hMag / rp, secondsToNextPassage: toPeriapsis };
  let apoapsis: ApsisSummary | null = null;
  if (closed) {
    const ra = p / (1 - e);
    const toApoapsis = circular ? null : wrapTwoPi(Math.PI - M) / meanMotion;
    apoapsis = { radius: ra, altitude: altitude(ra), speed: hMag / ra, secondsToNextPassage: toApoapsis };
  }

  const solution: OrbitSolution = {
    elements: el,
    apsides: { periapsis, apoapsis },
    periodS: closed ? TWO_PI / meanMotion : null, // T = 2 pi sqrt(a^3 / mu), Curtis 3rd ed. eq. 2.83 (from memory)
    meanMotion,
    specificEnergy: energy,
    specificAngularMomentum: h,
    specificAngularMomentumMagnitude: hMag,
    eccentricityVector: eccentricityVector(r, v, mu),
    flightPathAngle: Math.atan2(rv, hMag), // sin = r.v / (r v), cos = h / (r v); Curtis 3rd ed. sec. 2.6
    radius,
    speed,
    position: r,
    velocity: v,
  };
  if (closed && a !== null && Number.isFinite(body.j2) && body.radius !== undefined && body.radius > 0) {
    const rates = j2SecularRates(a, e, el.inclination, mu, body.j2 as number, body.radius);
    solution.j2 = {
      ...rates,
      sunSynchronous: isSunSynchronous(rates.raanRateRadS, body),
      sunSynchronousInclination: sunSynchronousInclination(a, e, body),
    };
  }
  return success(solution);
}
