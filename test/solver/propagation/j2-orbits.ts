// Test orbits for the J2 models, all at the epoch 2027-04-10T00:00:00Z, and the reference they are
// measured against: the numerical model with J2 only, about the same axis as the analytic model.
// (That integration was checked on its own: against universal variables to < 1 m over a day and for
// the J2 energy integral to 1e-9 over 10 days, test/solver/propagation/numerical.test.ts.)
import { BODIES } from '../../../src/solver/bodies/bodies.js';
import { elementsToState } from '../../../src/solver/conic/elements.js';
import type { Vec3 } from '../../../src/solver/core/vec3.js';
import { propagateNumerical } from '../../../src/solver/propagation/numerical.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';

export const DEG = Math.PI / 180;
export const DAY = 86_400;
export const earth = BODIES.earth;

const epoch = parseUtcIso('2027-04-10T00:00:00Z');
if (!epoch.ok) throw new Error(epoch.message);
export const EPOCH_TT = epoch.value;

export interface TestOrbit { a: number; e: number; i: number; raan: number; argp: number; nu: number }

/** km and degrees. Molniya-like and GTO start at periapsis, where the short-period terms are largest. */
export const J2_ORBITS: Record<'leo' | 'sso' | 'molniya' | 'gto' | 'polar' | 'equatorial', TestOrbit> = {
  leo: { a: 6778, e: 0.001, i: 51.6, raan: 30, argp: 40, nu: 10 },
  sso: { a: 7078.137, e: 0.001, i: 98.19, raan: 100, argp: 90, nu: 0 }, // 700 km sun-synchronous
  molniya: { a: 26_554, e: 0.74, i: 63.4, raan: 250, argp: 270, nu: 0 },
  gto: { a: 24_396, e: 0.7306, i: 27, raan: 10, argp: 178, nu: 0 }, // about 190 km x 35,840 km
  polar: { a: 7178, e: 0.005, i: 90, raan: 60, argp: 30, nu: 45 },
  equatorial: { a: 7378, e: 0.01, i: 0, raan: 0, argp: 20, nu: 0 },
};
export const ECCENTRIC = new Set(['molniya', 'gto']);

export function startState(el: TestOrbit): { r: Vec3; v: Vec3 } {
  const s = elementsToState({ semiMajorAxis: el.a, eccentricity: el.e, inclination: el.i * DEG, raan: el.raan * DEG, argPeriapsis: el.argp * DEG, trueAnomaly: el.nu * DEG }, earth.gm);
  if (!s.ok) throw new Error(s.message);
  return { r: s.value.r, v: s.value.v };
}

/** Numerical J2-only states at the epochs (spinAxis: the axis J2 acts about; default the model's own). */
export function numericalJ2(s: { r: Vec3; v: Vec3 }, epochsTT: Float64Array, spinAxis?: Vec3): Float64Array {
  const run = propagateNumerical({ body: earth, forces: [{ kind: 'j2' }], r0: s.r, v0: s.v, epochTT: EPOCH_TT, epochsTT, ...(spinAxis ? { spinAxis } : {}) });
  if (!run.ok) throw new Error(run.message);
  return run.value.states;
}

/** Largest position difference between two state tables, km. */
export function worstPositionDifference(a: Float64Array, b: Float64Array): number {
  let worst = 0;
  for (let o = 0; o < a.length; o += 6) worst = Math.max(worst, Math.hypot(a[o]! - b[o]!, a[o + 1]! - b[o + 1]!, a[o + 2]! - b[o + 2]!));
  return worst;
}
