// Two bodies -> the relative orbit with the reduced mass, and back. Masses enter as GM = G m
// (km^3/s^2), so nothing here needs G. Sources: Goldstein, Classical Mechanics, 3rd ed., sec. 3.1
// (reduction to the equivalent one-body problem); Curtis, Orbital Mechanics for Engineering
// Students, 3rd ed., ch. 2 (two-body equations relative to the barycentre). From memory.
//
// Energies and angular momenta of the pair come multiplied by G: G E in km^5/s^4 and G L in
// km^5/s^3. Divide by G (km^3 kg^-1 s^-2) for kg km^2/s^2 and kg km^2/s.

import { failure, success, type Outcome } from '../core/result.js';
import { add, cross, dot, scale, sub, type Vec3 } from '../core/vec3.js';

/** One body: gm = G m in km^3/s^2, position km, velocity km/s, in one inertial frame. */
export interface BodyState {
  gm: number;
  r: Vec3;
  v: Vec3;
}

export interface PositionVelocity {
  readonly r: Vec3;
  readonly v: Vec3;
}

export interface TwoBodyReduction {
  /** mu = G (m1 + m2), km^3/s^2: the gravitational parameter of the relative orbit. */
  readonly totalGm: number;
  /** G m1 m2 / (m1 + m2), km^3/s^2: G times the reduced mass. */
  readonly reducedGm: number;
  /** m1/M and m2/M. */
  readonly massFraction1: number;
  readonly massFraction2: number;
  /** Barycentre at the epoch and its constant velocity: r_cm(t) = r + v t. */
  readonly barycentre: PositionVelocity;
  /** Body 2 seen from body 1: r = r2 - r1, v = v2 - v1. */
  readonly relative: PositionVelocity;
  /** Body 1 about the barycentre: r1' = -(m2/M) r, v1' = -(m2/M) v. */
  readonly body1: PositionVelocity;
  /** Body 2 about the barycentre: r2' = (m1/M) r, v2' = (m1/M) v. */
  readonly body2: PositionVelocity;
  /** Specific energy v^2/2 - mu/|r| of the relative orbit, km^2/s^2. */
  readonly specificEnergy: number;
  /** Specific angular momentum r x v of the relative orbit, km^2/s. */
  readonly specificAngularMomentum: Vec3;
  /** Semi-major axes (km) of the relative orbit and of each body about the barycentre (a1 = a m2/M, a2 = a m1/M); null unless bound. */
  readonly semiMajorAxes: { readonly relative: number; readonly body1: number; readonly body2: number } | null;
  /** Common period of all three ellipses, 2 pi sqrt(a^3/mu) s; null unless bound. */
  readonly periodS: number | null;
  /**
   * G E about the barycentre (km^5/s^4), from the two bodies (sum of gm_i |v_i'|^2 / 2 minus
   * gm1 gm2 / |r|) and from the relative motion (reducedGm times the specific energy).
   */
  readonly energyTimesG: { readonly direct: number; readonly fromRelative: number };
  /** G L about the barycentre (km^5/s^3): sum of gm_i r_i' x v_i', and reducedGm times r x v. */
  readonly angularMomentumTimesG: { readonly direct: Vec3; readonly fromRelative: Vec3 };
}

const isFiniteVec = (a: Vec3): boolean => Number.isFinite(a[0]) && Number.isFinite(a[1]) && Number.isFinite(a[2]);

/** Barycentre, relative state and the integrals of two bodies (Goldstein 3rd ed. sec. 3.1). */
export function reduceTwoBody(b1: BodyState, b2: BodyState): Outcome<TwoBodyReduction> {
  for (const [name, b] of [['first', b1], ['second', b2]] as const) {
    if (!(b.gm > 0 && b.gm < Infinity)) return failure('invalid-parameter', `the ${name} body's GM must be positive and finite, got ${b.gm}`);
    if (!isFiniteVec(b.r) || !isFiniteVec(b.v)) return failure('invalid-parameter', `the ${name} body's position and velocity must be finite`);
  }
  const r = sub(b2.r, b1.r);
  const v = sub(b2.v, b1.v);
  const distance = Math.sqrt(dot(r, r));
  if (!(distance > 0)) return failure('zero-position', 'the two bodies are at the same place: their relative position is zero');

  const mu = b1.gm + b2.gm;
  const f1 = b1.gm / mu;
  const f2 = b2.gm / mu;
  const reducedGm = (b1.gm * b2.gm) / mu;
  // Barycentre: r_cm = (m1 r1 + m2 r2)/M, moving uniformly (no external force).
  const barycentre = { r: add(scale(b1.r, f1), scale(b2.r, f2)), v: add(scale(b1.v, f1), scale(b2.v, f2)) };
  const body1 = { r: scale(r, -f2), v: scale(v, -f2) };
  const body2 = { r: scale(r, f1), v: scale(v, f1) };

  const specificEnergy = 0.5 * dot(v, v) - mu / distance; // vis-viva form, Curtis 3rd ed. ch. 2
  const h = cross(r, v);
  const a = specificEnergy < 0 ? -mu / (2 * specificEnergy) : null;

  // The same integrals straight from the bodies about the barycentre (r_i - r_cm, v_i - v_cm), so the two routes are independent.
  const r1c = sub(b1.r, barycentre.r);
  const v1c = sub(b1.v, barycentre.v);
  const r2c = sub(b2.r, barycentre.r);
  const v2c = sub(b2.v, barycentre.v);
  const directEnergy = 0.5 * b1.gm * dot(v1c, v1c) + 0.5 * b2.gm * dot(v2c, v2c) - (b1.gm * b2.gm) / distance;
  const directMomentum = add(scale(cross(r1c, v1c), b1.gm), scale(cross(r2c, v2c), b2.gm));

  return success({
    totalGm: mu,
    reducedGm,
    massFraction1: f1,
    massFraction2: f2,
    barycentre,
    relative: { r, v },
    body1,
    body2,
    specificEnergy,
    specificAngularMomentum: h,
    semiMajorAxes: a === null ? null : { relative: a, body1: a * f2, body2: a * f1 },
    periodS: a === null ? null : 2 * Math.PI * Math.sqrt((a * a * a) / mu),
    energyTimesG: { direct: directEnergy, fromRelative: reducedGm * specificEnergy },
    angularMomentumTimesG: { direct: directMomentum, fromRelative: scale(h, reducedGm) },
  });
}

/** Epochs and states (x, y, z, vx, vy, vz per sample); structurally the same as the track table of src/formats. */
export interface StateTable {
  readonly epochsTT: Float64Array;
  readonly states: Float64Array;
}

/**
 * Both bodies' tracks about the barycentre from a table of the relative motion (body 2 from
 * body 1): r1' = -(m2/M) r, r2' = (m1/M) r, and the same for velocities. The epochs array is
 * shared with the input, not copied. Add r_cm + v_cm t for inertial tracks.
 */
export function bodyTracksAboutBarycentre(reduction: TwoBodyReduction, relativeTable: StateTable): { body1: StateTable; body2: StateTable } {
  const s = relativeTable.states;
  const s1 = new Float64Array(s.length);
  const s2 = new Float64Array(s.length);
  const k1 = -reduction.massFraction2;
  const k2 = reduction.massFraction1;
  for (let i = 0; i < s.length; i++) {
    s1[i] = k1 * s[i]!;
    s2[i] = k2 * s[i]!;
  }
  return { body1: { epochsTT: relativeTable.epochsTT, states: s1 }, body2: { epochsTT: relativeTable.epochsTT, states: s2 } };
}
