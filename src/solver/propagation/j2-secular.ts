// Model 'j2-secular': Keplerian motion in mean elements whose node, argument of periapsis and mean
// anomaly drift at the first-order secular J2 rates (Vallado 4th ed. sec. 9.6 and eq. 9-41; from
// memory).
// Mean elements: the osculating elements of the given state carry short-period J2 terms (in LEO
// the osculating a differs from its mean by up to ~10 km, at the periapsis of a Molniya orbit by
// 130 km), and a mean motion taken from the osculating a drifts along track by ~1000 km a day in
// LEO (measured). So the mean elements are the averages of the osculating ones over one
// anomalistic period of the mean orbit of J2-perturbed motion, integrated numerically from the
// given state (angles averaged after removing the secular drift of the mean orbit).
// The short-period terms are not added back: positions carry them as a bounded error, and the
// first sample differs from the given state by as much. Measured against numerical J2 (docs/accuracy.md):
// first sample 1.4 to 3.3 km from the given state for LEO, sun-synchronous, polar, Molniya and GTO
// orbits, 8.9 km for an equatorial one (its forced eccentricity); within 4 to 22 km over a day.

import type { CentralBody } from '../bodies/bodies.js';
import { elementsToState, isClosed, stateToElements, type ClassicalElements } from '../conic/elements.js';
import { j2SecularRates } from '../conic/j2.js';
import { wrapPi } from '../core/math.js';
import { propagateNumerical } from './numerical.js';
import { failure, success, type Outcome } from '../core/result.js';
import type { Vec3 } from '../core/vec3.js';

/** Samples of one revolution used to average the osculating elements. */
export const MEAN_ELEMENT_SAMPLES = 256;

interface MeanElements {
  a: number;
  e: number;
  i: number;
  raan: number;
  argPeriapsis: number;
  meanAnomaly: number;
}

/** The state at any epoch under the model (mean elements and rates computed once). */
export function j2SecularPropagator(body: CentralBody, r0: Vec3, v0: Vec3, epochTT: number): Outcome<(tt: number) => Outcome<{ r: Vec3; v: Vec3 }>> {
  const { j2, radius, gm: mu } = body;
  if (j2 === undefined || radius === undefined) {
    return failure('invalid-parameter', `model j2-secular needs a body with j2 and radius; ${body.name} has ${j2 === undefined ? 'no j2' : 'no radius'}`);
  }
  const start = stateToElements(r0, v0, mu);
  if (!start.ok) return start;
  const el = start.value;
  if (!isClosed(el.orbitType) || el.semiMajorAxis === null) {
    return failure('invalid-parameter', `model j2-secular averages over a revolution: it needs a bound orbit, this one is ${el.orbitType}`);
  }
  const mean = meanElements(body, r0, v0, el.semiMajorAxis, j2, radius);
  if (!mean.ok) return mean;
  const m = mean.value;
  if (!(m.a > 0 && m.e >= 0 && m.e < 1 && Number.isFinite(m.raan + m.meanAnomaly))) {
    return failure('invalid-parameter', `model j2-secular found no bound mean orbit (mean a ${m.a} km, mean e ${m.e}): the orbit is too close to or inside the body for J2 averaging; use the numerical model`);
  }
  const rates = j2SecularRates(m.a, m.e, m.i, mu, j2, radius);
  const n = Math.sqrt(mu / (m.a * m.a * m.a));
  // Undefined angles (elements.ts conventions): on a circular orbit the anomaly is measured from the
  // node, so it takes the periapsis rate too; on an equatorial orbit the periapsis is measured from
  // the x axis, so it takes the node rate too.
  const anomalyRate = n + rates.meanAnomalyRateRadS + (el.argPeriapsisDefined ? 0 : rates.argPeriapsisRateRadS);
  const periapsisRate = el.argPeriapsisDefined ? rates.argPeriapsisRateRadS + (el.raanDefined ? 0 : rates.raanRateRadS) : 0;
  const raanRateRadS = el.raanDefined ? rates.raanRateRadS : 0;
  return success((tt: number) => {
    const dt = tt - epochTT;
    const state = elementsToState({
      semiMajorAxis: m.a,
      eccentricity: m.e,
      inclination: m.i,
      raan: m.raan + raanRateRadS * dt,
      argPeriapsis: m.argPeriapsis + periapsisRate * dt,
      meanAnomaly: m.meanAnomaly + anomalyRate * dt,
    }, mu);
    return state.ok ? success({ r: state.value.r, v: state.value.v }) : state;
  });
}

/**
 * Mean elements at the epoch: averages over one revolution of the osculating elements of the
 * J2-perturbed motion (J2 about the frame's z axis, as the secular rates assume), taken in forms
 * that stay defined on near-circular and near-equatorial orbits: a; the eccentricity vector in the
 * plane, e (cos omega, sin omega), turned back by the periapsis drift; the orbit normal, turned
 * back by the node drift; and omega + M (the mean argument of latitude, or the mean longitude when
 * equatorial) with its drift removed.
 * The window is one anomalistic period of the MEAN orbit and the drifts are those of the mean orbit
 * (mean motion of the mean a plus the J2 rates of the mean elements), so the mean elements are
 * found by fixed-point iteration from the osculating ones. Taking the window and the mean motion
 * from the osculating a instead biases the mean anomaly by dn T / 2 (dn the difference of the two
 * mean motions): -1.33 deg, 1,595 km at periapsis, for a Molniya orbit started at periapsis, whose
 * osculating a there is 130 km below the mean (measured).
 */
function meanElements(body: CentralBody, r0: Vec3, v0: Vec3, a0: number, j2: number, radius: number): Outcome<MeanElements> {
  const mu = body.gm;
  const first = stateToElements(r0, v0, mu);
  if (!first.ok) return first;
  const el0 = first.value;
  let mean: MeanElements = { a: a0, e: el0.eccentricity, i: el0.inclination, raan: el0.raan, argPeriapsis: el0.argPeriapsis, meanAnomaly: el0.meanAnomaly };
  for (let pass = 0; pass < MEAN_ELEMENT_PASSES; pass++) {
    const next = averagedElements(body, r0, v0, el0, mean, j2, radius);
    if (!next.ok) return next;
    const change = Math.abs(next.value.a - mean.a);
    mean = next.value;
    if (!(mean.a > 0 && mean.e < 1)) return success(mean); // the caller refuses it
    if (change < MEAN_A_TOLERANCE_KM) break;
  }
  return success(mean);
}

/** Fixed-point passes of the mean-element average at most: each shrinks the change of the mean a ~200-fold (measured), so 3 to 4 reach the tolerance from a Molniya periapsis. */
const MEAN_ELEMENT_PASSES = 5;
/** The passes stop when the mean a moves by less than this, km: 0.1 m of a is ~13 m a day along track in LEO. */
const MEAN_A_TOLERANCE_KM = 1e-4;

/** One pass: the averages over one anomalistic period of the mean orbit `guess`, drifts removed at its rates. */
function averagedElements(
  body: CentralBody, r0: Vec3, v0: Vec3, el0: ClassicalElements, guess: MeanElements, j2: number, radius: number,
): Outcome<MeanElements> {
  const mu = body.gm;
  const rates = j2SecularRates(guess.a, guess.e, guess.i, mu, j2, radius);
  const n = Math.sqrt(mu / guess.a ** 3);
  // With the conventions of elements.ts the periapsis of an equatorial orbit is measured from the
  // x axis, so it turns at the periapsis rate plus the node rate.
  const periapsisRate = rates.argPeriapsisRateRadS + (el0.raanDefined ? 0 : rates.raanRateRadS);
  const latitudeRate = n + rates.meanAnomalyRateRadS + periapsisRate;
  const period = (2 * Math.PI) / (n + rates.meanAnomalyRateRadS);
  const times = Float64Array.from({ length: MEAN_ELEMENT_SAMPLES }, (_, k) => (k * period) / MEAN_ELEMENT_SAMPLES);
  const run = propagateNumerical({ body, forces: [{ kind: 'j2' }], r0, v0, epochTT: 0, epochsTT: times, spinAxis: [0, 0, 1], passThroughBody: true });
  if (!run.ok) return run;
  const s = run.value.states;
  const unwrap = (angle: number, reference: number): number => reference + wrapPi(angle - reference);
  let a = 0;
  let ex = 0;
  let ey = 0;
  let wx = 0;
  let wy = 0;
  let wz = 0;
  let lat = 0;
  const lat0 = el0.argPeriapsis + el0.meanAnomaly;
  for (let k = 0; k < MEAN_ELEMENT_SAMPLES; k++) {
    const t = times[k]!;
    const o = 6 * k;
    const el = stateToElements([s[o]!, s[o + 1]!, s[o + 2]!], [s[o + 3]!, s[o + 4]!, s[o + 5]!], mu);
    if (!el.ok) return el;
    const x = el.value;
    a += x.semiMajorAxis ?? guess.a;
    const argp = x.argPeriapsis - periapsisRate * t;
    ex += x.eccentricity * Math.cos(argp);
    ey += x.eccentricity * Math.sin(argp);
    // Orbit normal (sin i sin raan, -sin i cos raan, cos i) with the node turned back.
    const raan = x.raan - (el0.raanDefined ? rates.raanRateRadS * t : 0);
    wx += Math.sin(x.inclination) * Math.sin(raan);
    wy -= Math.sin(x.inclination) * Math.cos(raan);
    wz += Math.cos(x.inclination);
    lat += unwrap(x.argPeriapsis + x.meanAnomaly - latitudeRate * t, lat0);
  }
  const count = MEAN_ELEMENT_SAMPLES;
  const e = Math.hypot(ex, ey) / count;
  const argPeriapsis = el0.argPeriapsisDefined ? Math.atan2(ey, ex) : el0.argPeriapsis;
  const inclination = Math.atan2(Math.hypot(wx, wy), wz);
  const raan = el0.raanDefined ? Math.atan2(wx, -wy) : el0.raan;
  return success({ a: a / count, e, i: inclination, raan, argPeriapsis, meanAnomaly: lat / count - argPeriapsis });
}
