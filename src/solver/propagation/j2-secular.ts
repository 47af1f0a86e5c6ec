// Model 'j2-secular': Keplerian motion in mean elements whose node, argument of periapsis and mean
// anomaly drift at the first-order secular J2 rates (Vallado 4th ed. sec. 9.6 and eq. 9-41; from
// memory).
// Mean elements: the osculating elements of the given state carry short-period J2 terms (in LEO
// the osculating a differs from its mean by up to ~10 km), and a mean motion taken from the
// osculating a drifts along track by ~1000 km a day in LEO (measured). So the mean elements are
// the averages of the osculating ones over one revolution of J2-perturbed motion, integrated
// numerically from the given state (angles averaged after removing their secular drift).
// The short-period terms are not added back: positions carry them as a bounded error (a few km
// to ~10 km in LEO), and the first sample differs from the given state by as much; against an
// integrated J2 orbit the along-track error after a day is ~1 km in LEO (measured).

import type { CentralBody } from '../bodies/bodies.js';
import { elementsToState, isClosed, stateToElements } from '../conic/elements.js';
import { j2SecularRates } from '../conic/j2.js';
import { wrapPi } from '../core/math.js';
import { propagateNumerical } from './numerical.js';
import { failure, success, type Outcome } from '../core/result.js';
import type { Vec3 } from '../core/vec3.js';

/** The state at any epoch under the model (elements and rates computed once). */
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
 * J2-perturbed motion (J2 about the frame's z axis, as the secular rates assume). Angles are
 * unwrapped against the first sample and their secular drift at the first-order rates is removed
 * before averaging; the node and the argument of latitude are averaged (the argument of periapsis
 * is ill-defined near e = 0 and is kept osculating).
 */
function meanElements(body: CentralBody, r0: Vec3, v0: Vec3, a0: number, j2: number, radius: number): Outcome<MeanElements> {
  const mu = body.gm;
  const period = 2 * Math.PI * Math.sqrt(a0 ** 3 / mu);
  const times = Float64Array.from({ length: MEAN_ELEMENT_SAMPLES }, (_, k) => (k * period) / MEAN_ELEMENT_SAMPLES);
  const run = propagateNumerical({ body, forces: [{ kind: 'j2' }], r0, v0, epochTT: 0, epochsTT: times, spinAxis: [0, 0, 1], passThroughBody: true });
  if (!run.ok) return run;
  const s = run.value.states;
  const first = stateToElements(r0, v0, mu);
  if (!first.ok) return first;
  const el0 = first.value;
  const rough = j2SecularRates(a0, el0.eccentricity, el0.inclination, mu, j2, radius);
  const n0 = Math.sqrt(mu / a0 ** 3);
  const unwrap = (angle: number, reference: number): number => reference + wrapPi(angle - reference);
  let a = 0;
  let e = 0;
  let i = 0;
  let raan = 0;
  let lat = 0;
  const lat0 = el0.argPeriapsis + el0.meanAnomaly;
  for (let k = 0; k < MEAN_ELEMENT_SAMPLES; k++) {
    const t = times[k]!;
    const o = 6 * k;
    const el = stateToElements([s[o]!, s[o + 1]!, s[o + 2]!], [s[o + 3]!, s[o + 4]!, s[o + 5]!], mu);
    if (!el.ok) return el;
    const x = el.value;
    a += x.semiMajorAxis ?? a0;
    e += x.eccentricity;
    i += x.inclination;
    raan += unwrap(x.raan - rough.raanRateRadS * t, el0.raan);
    lat += unwrap(x.argPeriapsis + x.meanAnomaly - (n0 + rough.meanAnomalyRateRadS + rough.argPeriapsisRateRadS) * t, lat0);
  }
  const count = MEAN_ELEMENT_SAMPLES;
  const meanLat = lat / count;
  return success({ a: a / count, e: e / count, i: i / count, raan: raan / count, argPeriapsis: el0.argPeriapsis, meanAnomaly: meanLat - el0.argPeriapsis });
}
