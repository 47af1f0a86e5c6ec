// Model 'j2-analytic': the first-order J2 theory of Brouwer (1959), "Solution of the problem of
// artificial satellite theory without drag", Astron. J. 64, 378, with the short-period terms in the
// form of Lyddane (1963), "Small eccentricities or inclinations in the Brouwer theory of the
// artificial satellite", Astron. J. 68, 555, which stays regular as e -> 0 and i -> 0.
// - Mean elements drift at Brouwer's secular rates: first order in J2 plus his second-order J2^2
//   terms (J4 and higher zonals left out: a J2-only model).
// - Osculating = mean + the first-order short-period J2 terms in a, e, i, node, periapsis and mean
//   anomaly, as Schaub & Junkins, Analytical Mechanics of Space Systems, write Brouwer's mean <->
//   osculating mapping in Lyddane's variables (appendix; from memory), with Brouwer's long-period
//   terms left out: they carry 1 / (1 - 5 cos^2 i), singular at the critical inclination
//   (63.43 deg), and turn with 2 omega, so over days they change little.
// - Osculating -> mean: the mean -> osculating map is inverted by fixed-point iteration on
//   equinoctial elements (common practice, no source), so the model gives back the given state at
//   its epoch to rounding.
// - Mean motion: the inversion leaves an O(J2^2) error in the mean a (the second-order
//   short-period terms are not in the theory), 10 to 30 m in LEO, which would grow along track by
//   ~20 km a week (measured). So the rates take the mean a at which Brouwer's mean Hamiltonian to
//   second order equals the given state's J2 energy integral (conserved exactly by J2-only
//   gravity): its error is then O(J2^3).
// - J2 acts about the body's spin axis, as in the numerical model (for the Earth the celestial
//   intermediate pole at the middle of the span): the elements are referred to that equator.
// Left out: second-order short-period terms (tens of metres in LEO), the long-period terms above,
// every other force. Near e = 1 the short-period terms grow like (1 - e)^-3 at periapsis: mean
// eccentricities from J2_ANALYTIC_MAX_ECCENTRICITY up are refused, as are orbits whose mean
// periapsis is inside the body, and states whose inversion does not converge.
// Measured against numerical J2 about the same axis over 7 days (docs/accuracy.md): LEO 24 to 99 m,
// Molniya-like and GTO orbits started at periapsis 1.3 to 1.5 km.

import type { CentralBody } from '../bodies/bodies.js';
import { elementsToState, isClosed, stateToElements, trueFromMean } from '../conic/elements.js';
import { TWO_PI, wrapPi } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';
import { cross, dot, norm, scale, type Vec3 } from '../core/vec3.js';

/** Mean or osculating classical elements, angles in rad, referred to the body's equator. */
export interface J2Elements {
  readonly a: number;
  readonly e: number;
  readonly i: number;
  readonly raan: number;
  readonly argp: number;
  readonly meanAnomaly: number;
}

/** Largest mean eccentricity the model takes: beyond it the short-period terms at periapsis (x (1 - e)^-3) and the iteration degrade. */
export const J2_ANALYTIC_MAX_ECCENTRICITY = 0.95;
/** Iterations of the osculating -> mean inversion at most (3 to 6 are used: measured). */
const INVERSION_ITERATIONS = 50;
/** The inversion stops when every equinoctial element is reproduced to this (relative for a). */
const INVERSION_TOLERANCE = 1e-14;

/**
 * Osculating elements of mean elements m: Brouwer's first-order short-period J2 terms in Lyddane's
 * form (long-period terms left out, see the header). gamma2 = J2/2 (R/a)^2, gamma2' = gamma2 / eta^4.
 */
export function meanToOsculating(m: J2Elements, j2: number, radius: number): Outcome<J2Elements> {
  const { a, e, i, raan, argp, meanAnomaly: M } = m;
  const nu = trueFromMean(M, e, e < 1e-9 ? 'circular' : 'elliptic');
  if (!nu.ok) return nu;
  const f = nu.value;
  const eta2 = (1 - e) * (1 + e);
  const eta = Math.sqrt(eta2);
  const g2 = 0.5 * j2 * (radius / a) ** 2;
  const g2p = g2 / (eta2 * eta2);
  const c = Math.cos(i);
  const c2 = c * c;
  const s2 = 1 - c2;
  const cf = Math.cos(f);
  const sf = Math.sin(f);
  const ar = (1 + e * cf) / eta2; // a / r
  const ar3 = ar * ar * ar;
  const w = argp;
  const c2wf2 = Math.cos(2 * w + 2 * f);
  const s2wf2 = Math.sin(2 * w + 2 * f);
  const c2wf = Math.cos(2 * w + f);
  const s2wf = Math.sin(2 * w + f);
  const c2wf3 = Math.cos(2 * w + 3 * f);
  const s2wf3 = Math.sin(2 * w + 3 * f);
  // f - M + e sin f: the equation of the centre plus e sin f.
  const centre = wrapPi(f - M) + e * sf;
  const poly = 3 * cf + 3 * e * cf * cf + e * e * cf * cf * cf; // ((1 + e cos f)^3 - 1) / e
  const eta6 = eta2 * eta2 * eta2;

  // Semi-major axis (Brouwer 1959 eq. for a'; Schaub & Junkins, from memory).
  const aOsc = a + a * g2 * ((3 * c2 - 1) * (ar3 - 1 / (eta2 * eta)) + 3 * s2 * ar3 * c2wf2);
  // Eccentricity.
  const de = (eta2 / 2) * (
    g2 * ((3 * c2 - 1) / eta6 * (e * eta + e / (1 + eta) + poly) + (3 * s2) / eta6 * (e + poly) * c2wf2)
    - g2p * s2 * (3 * c2wf + c2wf3));
  // Inclination.
  const di = (g2p / 2) * c * Math.sqrt(s2) * (3 * c2wf2 + 3 * e * c2wf + e * c2wf3);
  // Mean longitude M + omega + node.
  const swirl = 3 * s2wf2 + 3 * e * s2wf + e * s2wf3;
  const dNode = -(g2p / 2) * c * (6 * centre - swirl);
  const dLongitude = (g2p / 4) * (-6 * (1 - 5 * c2) * centre + (3 - 5 * c2) * swirl) + dNode;
  // e times the mean anomaly.
  const q = ar * eta;
  const eDM = -(g2p / 4) * eta2 * eta * (
    2 * (3 * c2 - 1) * (q * q + ar + 1) * sf
    + 3 * s2 * ((-q * q - ar + 1) * s2wf + (q * q + ar + 1 / 3) * s2wf3));

  // Lyddane's recombination: e and M from (e + de, e dM); i and the node from (sin(i/2) + cos(i/2) di/2, sin(i/2) dNode).
  const d1 = (e + de) * Math.sin(M) + eDM * Math.cos(M);
  const d2 = (e + de) * Math.cos(M) - eDM * Math.sin(M);
  const mOsc = Math.atan2(d1, d2);
  const eOsc = Math.hypot(d1, d2);
  const sh = Math.sin(i / 2);
  const ch = Math.cos(i / 2);
  const d3 = (sh + (ch * di) / 2) * Math.sin(raan) + sh * dNode * Math.cos(raan);
  const d4 = (sh + (ch * di) / 2) * Math.cos(raan) - sh * dNode * Math.sin(raan);
  const raanOsc = Math.atan2(d3, d4);
  const iOsc = 2 * Math.asin(Math.min(1, Math.hypot(d3, d4)));
  const longitude = M + argp + raan + dLongitude;
  return success({ a: aOsc, e: eOsc, i: iOsc, raan: raanOsc, argp: longitude - mOsc - raanOsc, meanAnomaly: mOsc });
}

/** Brouwer's secular rates (rad/s) of the mean anomaly, periapsis and node, J2 to second order (J4 = 0). */
export function brouwerRates(m: J2Elements, mu: number, j2: number, radius: number): { meanAnomaly: number; argp: number; raan: number } {
  const n0 = Math.sqrt(mu / m.a ** 3);
  const eta2 = (1 - m.e) * (1 + m.e);
  const eta = Math.sqrt(eta2);
  const g2p = (0.5 * j2 * (radius / m.a) ** 2) / (eta2 * eta2);
  const t = Math.cos(m.i);
  const t2 = t * t;
  const t4 = t2 * t2;
  // Brouwer 1959, secular part (from memory): l, g, h rates.
  const l = n0 * (1 + 1.5 * g2p * eta * (3 * t2 - 1)
    + (3 / 32) * g2p * g2p * eta * (-15 + 16 * eta + 25 * eta2 + (30 - 96 * eta - 90 * eta2) * t2 + (105 + 144 * eta + 25 * eta2) * t4));
  const g = n0 * (1.5 * g2p * (5 * t2 - 1)
    + (3 / 32) * g2p * g2p * (-35 + 24 * eta + 25 * eta2 + (90 - 192 * eta - 126 * eta2) * t2 + (385 + 360 * eta + 45 * eta2) * t4));
  const h = n0 * (-3 * g2p * t + (3 / 8) * g2p * g2p * ((-5 + 12 * eta + 9 * eta2) * t + (-35 - 36 * eta - 5 * eta2) * t2 * t));
  return { meanAnomaly: l, argp: g, raan: h };
}

/**
 * Brouwer's mean Hamiltonian (energy per unit mass, km^2/s^2) to second order in J2:
 *   K0 = -mu / (2a),  K1 = -mu J2 R^2 (3 cos^2 i - 1) / (4 a^3 eta^3)  (the orbit average of the J2 term of the energy),
 *   K2 = 3/128 mu J2^2 R^4 / (a^5 eta^7) [5 - 4 eta - 5 eta^2 + 2 (-5 + 12 eta + 9 eta^2) cos^2 i + (-35 - 36 eta - 5 eta^2) cos^4 i].
 * K2 was integrated for this code from Brouwer's second-order rates (brouwerRates): they are its
 * derivatives in the Delaunay momenta L, G, H, which the tests check.
 */
export function meanHamiltonian(a: number, e: number, i: number, mu: number, j2: number, radius: number): number {
  const eta2 = (1 - e) * (1 + e);
  const eta = Math.sqrt(eta2);
  const t2 = Math.cos(i) ** 2;
  const k1 = (-mu * j2 * radius * radius * (3 * t2 - 1)) / (4 * a ** 3 * eta2 * eta);
  const k2 = ((3 / 128) * mu * j2 * j2 * radius ** 4) / (a ** 5 * eta ** 7)
    * (5 - 4 * eta - 5 * eta2 + 2 * (-5 + 12 * eta + 9 * eta2) * t2 + (-35 - 36 * eta - 5 * eta2) * t2 * t2);
  return -mu / (2 * a) + k1 + k2;
}

/** The energy integral of J2-only gravity, v^2/2 - mu/r + mu J2 R^2 (3 z^2/r^2 - 1) / (2 r^3), z along the spin axis (Vallado 4th ed. sec. 8.6.1, potential from memory). */
export function j2Energy(r: Vec3, v: Vec3, mu: number, j2: number, radius: number): number {
  const rn = norm(r);
  return dot(v, v) / 2 - mu / rn + (mu * j2 * radius * radius * (3 * (r[2] / rn) ** 2 - 1)) / (2 * rn ** 3);
}

/** The mean a whose mean Hamiltonian (with mean e and i) equals the energy: Newton's method from a0. */
function meanAxisFromEnergy(energy: number, a0: number, e: number, i: number, mu: number, j2: number, radius: number): number {
  let a = a0;
  for (let k = 0; k < 20; k++) {
    const h = 1e-6 * a;
    const f = meanHamiltonian(a, e, i, mu, j2, radius) - energy;
    const df = (meanHamiltonian(a + h, e, i, mu, j2, radius) - meanHamiltonian(a - h, e, i, mu, j2, radius)) / (2 * h);
    const step = f / df;
    a -= step;
    if (Math.abs(step) < 1e-12 * a) break;
  }
  return a;
}

/** Equinoctial elements with the retrograde factor I (+1 for i <= 90 deg, -1 beyond): a, k, h (e along, across the longitude of periapsis), q, p (node vector), longitude. */
type Equinoctial = [a: number, k: number, h: number, q: number, p: number, lambda: number];

function toEquinoctial(x: J2Elements, I: 1 | -1): Equinoctial {
  const lp = x.argp + I * x.raan;
  const half = I === 1 ? Math.sin(x.i / 2) : Math.cos(x.i / 2);
  return [x.a, x.e * Math.cos(lp), x.e * Math.sin(lp), half * Math.cos(x.raan), half * Math.sin(x.raan), x.meanAnomaly + lp];
}

function fromEquinoctial(q: Equinoctial, I: 1 | -1): J2Elements {
  const [a, k, h, qq, pp, lambda] = q;
  const e = Math.hypot(k, h);
  const lp = Math.atan2(h, k);
  const raan = Math.atan2(pp, qq);
  const half = 2 * Math.asin(Math.min(1, Math.hypot(pp, qq)));
  return { a, e, i: I === 1 ? half : Math.PI - half, raan, argp: lp - I * raan, meanAnomaly: lambda - lp };
}

/** Mean elements whose osculating elements are `osc` (fixed-point iteration of meanToOsculating). */
export function osculatingToMean(osc: J2Elements, j2: number, radius: number): Outcome<J2Elements> {
  const I: 1 | -1 = osc.i <= Math.PI / 2 ? 1 : -1;
  const target = toEquinoctial(osc, I);
  const mean = target.slice() as Equinoctial;
  for (let k = 0; k < INVERSION_ITERATIONS; k++) {
    const m = fromEquinoctial(mean, I);
    if (!(m.a > 0 && m.e < J2_ANALYTIC_MAX_ECCENTRICITY)) break;
    const o = meanToOsculating(m, j2, radius);
    if (!o.ok) return o;
    const got = toEquinoctial(o.value, I);
    let worst = 0;
    for (let j = 0; j < 6; j++) {
      const d = j === 5 ? wrapPi(target[j]! - got[j]!) : target[j]! - got[j]!;
      mean[j] = mean[j]! + d;
      worst = Math.max(worst, Math.abs(j === 0 ? d / target[0] : d));
    }
    if (worst <= INVERSION_TOLERANCE) return success(fromEquinoctial(mean, I));
  }
  return failure('invalid-parameter', `model j2-analytic found no mean orbit for this state (the osculating -> mean inversion of the J2 theory did not converge): its eccentricity ${osc.e} or its periapsis is outside the theory's range; use the numerical model`);
}

/** Rotation to the body's equator: rows x', y', z' = the unit spin axis. */
function equatorFrame(axis: Vec3): [Vec3, Vec3, Vec3] {
  const z = scale(axis, 1 / norm(axis));
  const x0: Vec3 = [1 - z[0] * z[0], -z[0] * z[1], -z[0] * z[2]]; // the frame's x axis projected on the equator
  const x = scale(x0, 1 / norm(x0));
  return [x, cross(z, x), z];
}
const apply = (m: readonly Vec3[], v: Vec3): Vec3 => [dot(m[0]!, v), dot(m[1]!, v), dot(m[2]!, v)];
const applyTransposed = (m: readonly Vec3[], v: Vec3): Vec3 => [
  m[0]![0] * v[0] + m[1]![0] * v[1] + m[2]![0] * v[2],
  m[0]![1] * v[0] + m[1]![1] * v[1] + m[2]![1] * v[2],
  m[0]![2] * v[0] + m[1]![2] * v[1] + m[2]![2] * v[2],
];

/** The state at any epoch under the model (mean elements and rates computed once); J2 about `spinAxis` (input frame). */
export function j2AnalyticPropagator(body: CentralBody, r0: Vec3, v0: Vec3, epochTT: number, spinAxis: Vec3 = [0, 0, 1]): Outcome<(tt: number) => Outcome<{ r: Vec3; v: Vec3 }>> {
  const { j2, radius, gm: mu } = body;
  if (j2 === undefined || radius === undefined) {
    return failure('invalid-parameter', `model j2-analytic needs a body with j2 and radius; ${body.name} has ${j2 === undefined ? 'no j2' : 'no radius'}`);
  }
  const frame = equatorFrame(spinAxis);
  const start = stateToElements(apply(frame, r0), apply(frame, v0), mu);
  if (!start.ok) return start;
  const el = start.value;
  if (!isClosed(el.orbitType) || el.semiMajorAxis === null) {
    return failure('invalid-parameter', `model j2-analytic needs a bound orbit, this one is ${el.orbitType}`);
  }
  if (el.eccentricity >= J2_ANALYTIC_MAX_ECCENTRICITY) {
    return failure('invalid-parameter', `model j2-analytic takes eccentricities below ${J2_ANALYTIC_MAX_ECCENTRICITY} (its short-period terms grow like (1 - e)^-3 at periapsis); this orbit has e = ${el.eccentricity}: use the numerical model`);
  }
  const osc: J2Elements = { a: el.semiMajorAxis, e: el.eccentricity, i: el.inclination, raan: el.raan, argp: el.argPeriapsis, meanAnomaly: el.meanAnomaly };
  const found = osculatingToMean(osc, j2, radius);
  if (!found.ok) return found;
  const m0 = found.value;
  if (m0.a * (1 - m0.e) <= radius) {
    return failure('invalid-parameter', `model j2-analytic: the mean periapsis radius ${(m0.a * (1 - m0.e)).toFixed(3)} km is inside the ${body.name} radius (${radius} km); use the numerical model`);
  }
  const energy = j2Energy(apply(frame, r0), apply(frame, v0), mu, j2, radius);
  const aRates = meanAxisFromEnergy(energy, m0.a, m0.e, m0.i, mu, j2, radius);
  const rates = brouwerRates({ ...m0, a: aRates }, mu, j2, radius);
  return success((tt: number) => {
    const dt = tt - epochTT;
    const m: J2Elements = {
      ...m0,
      raan: (m0.raan + rates.raan * dt) % TWO_PI,
      argp: (m0.argp + rates.argp * dt) % TWO_PI,
      meanAnomaly: (m0.meanAnomaly + rates.meanAnomaly * dt) % TWO_PI,
    };
    const o = meanToOsculating(m, j2, radius);
    if (!o.ok) return o;
    const x = o.value;
    const s = elementsToState({ semiMajorAxis: x.a, eccentricity: x.e, inclination: x.i, raan: x.raan, argPeriapsis: x.argp, meanAnomaly: x.meanAnomaly }, mu);
    if (!s.ok) return s;
    return success({ r: applyTransposed(frame, s.value.r), v: applyTransposed(frame, s.value.v) });
  });
}
