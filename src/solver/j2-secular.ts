// Model 'j2-secular': Keplerian motion whose node, argument of periapsis and mean anomaly drift at
// the first-order secular J2 rates (Vallado 4th ed. sec. 9.6 and eq. 9-41; from memory).
// The osculating elements at the epoch are taken as the mean elements: the short-period J2 terms
// (amplitude of order J2 (R/a)^2 a, a few km in LEO) are neither removed at the epoch nor added
// back along the track, so this model is good for the slow drift of the orbit plane and of the
// periapsis over days, not for metre-level positions.

import type { CentralBody } from './bodies.js';
import { elementsToState, isClosed, stateToElements } from './elements.js';
import { j2SecularRates } from './j2.js';
import { failure, success, type Outcome } from './result.js';
import type { Vec3 } from './vec3.js';

export function propagateJ2Secular(body: CentralBody, r0: Vec3, v0: Vec3, epochTT: number, epochsTT: Float64Array): Outcome<Float64Array> {
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
  const a = el.semiMajorAxis;
  const rates = j2SecularRates(a, el.eccentricity, el.inclination, mu, j2, radius);
  const n = Math.sqrt(mu / (a * a * a));
  // Undefined angles (elements.ts conventions): on a circular orbit the anomaly is measured from the
  // node, so it takes the periapsis rate too; on an equatorial orbit the periapsis is measured from
  // the x axis, so it takes the node rate too.
  const anomalyRate = n + rates.meanAnomalyRate + (el.argPeriapsisDefined ? 0 : rates.argPeriapsisRate);
  const periapsisRate = el.argPeriapsisDefined ? rates.argPeriapsisRate + (el.raanDefined ? 0 : rates.raanRate) : 0;
  const raanRate = el.raanDefined ? rates.raanRate : 0;
  const out = new Float64Array(6 * epochsTT.length);
  for (let k = 0; k < epochsTT.length; k++) {
    const dt = epochsTT[k]! - epochTT;
    const state = elementsToState({
      semiMajorAxis: a,
      eccentricity: el.eccentricity,
      inclination: el.inclination,
      raan: el.raan + raanRate * dt,
      argPeriapsis: el.argPeriapsis + periapsisRate * dt,
      meanAnomaly: el.meanAnomaly + anomalyRate * dt,
    }, mu);
    if (!state.ok) return state;
    out.set(state.value.r, 6 * k);
    out.set(state.value.v, 6 * k + 3);
  }
  return success(out);
}
