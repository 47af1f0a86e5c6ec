// A track: the orbit propagated to many epochs with a chosen model (propagator.ts), as flat typed
// arrays, with the drift of the model's conserved quantities and the check that it stays above the
// surface.

import { isClosed, stateToElements } from '../conic/elements.js';
import { TWO_PI } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';
import { ephemerisStates, type InterpolationReport } from './ephemeris.js';
import { MODELS, statesAt, type PropagationSpec } from './propagator.js';
import { conservationDrift, type ConservationDrift } from '../conic/universal.js';
import type { Vec3 } from '../core/vec3.js';
import { bodySpinAxis, spanMiddle } from './numerical.js';
import { temeToGcrfBatch } from '../earth/teme.js';
import { sgp4StatesTeme } from './sgp4.js';

export const TRACK_MODELS = MODELS;

export interface TrackInput extends PropagationSpec {
  /** Sample epochs, TT seconds since J2000, any order. */
  readonly epochsTT: Float64Array;
  /** Propagate even below the body radius (default: such a track is refused with 'impact'). */
  readonly passThroughBody?: boolean;
}

export interface Track {
  readonly epochsTT: Float64Array;
  /** x, y, z (km), vx, vy, vz (km/s) per sample, GCRF. */
  readonly states: Float64Array;
  /** What the model conserves and how far the samples drift from it (see Conservation). */
  readonly conservation: Conservation;
  /** The ephemeris model: how it interpolated and its error estimate (absent for the other models). */
  readonly interpolation?: InterpolationReport;
  /** The sgp4 model: the method's own TEME states (6 per sample), before their rotation to GCRF. */
  readonly teme?: Float64Array;
}

/** `into`: memory for the states where the model can use it (statesAt); the track's states are then a view of it. */
export function propagateTrack(input: TrackInput, into?: Float64Array): Outcome<Track> {
  const { body, epochsTT } = input;
  let interpolation: InterpolationReport | undefined;
  let states: Float64Array;
  let teme: Float64Array | undefined;
  if (input.model === 'sgp4') {
    if (!input.sgp4) throw new TypeError('the sgp4 model needs input.sgp4');
    const run = sgp4StatesTeme(input.sgp4, epochsTT);
    if (!run.ok) return run;
    teme = run.value;
    states = temeToGcrfBatch(epochsTT, teme);
  } else if (input.model === 'ephemeris') {
    if (!input.ephemeris) throw new TypeError('the ephemeris model needs input.ephemeris');
    const run = ephemerisStates(input.ephemeris, epochsTT);
    if (!run.ok) return run;
    ({ states, interpolation } = run.value);
  } else {
    const run = statesAt(input, epochsTT, into);
    if (!run.ok) return run;
    states = run.value;
  }
  // The numerical model watches the surface while it integrates; the analytic ones are checked here.
  if (!input.passThroughBody && body.radius !== undefined && input.model !== 'numerical') {
    const hit = surfaceCrossing(input, states);
    if (hit) return hit;
  }
  const conservation = conservationOf(input, states);
  if (teme) return success({ epochsTT, states, conservation, teme });
  return success(interpolation ? { epochsTT, states, conservation, interpolation } : { epochsTT, states, conservation });
}

/**
 * The integrals of the motion a model's dynamics conserve:
 * - 'two-body': energy v^2/2 - mu/r and the angular momentum vector r x v (two-body gravity);
 * - 'j2': the J2 energy integral v^2/2 - mu/r + mu J2 R^2 (3 z^2/r^2 - 1) / (2 r^3) and the
 *   angular momentum about the spin axis, (r x v).k, z = r.k (J2-only gravity is static and
 *   symmetric about k; Vallado 4th ed. sec. 8.6.1 for the potential, from memory);
 * - 'none': drag, third bodies and radiation pressure change the energy and the angular momentum
 *   (and an ephemeris has no dynamics of its own), so there is nothing to check.
 */
export type ConservedQuantity = 'two-body' | 'j2' | 'none';

export interface Conservation {
  readonly quantity: ConservedQuantity;
  /** Drift across the samples relative to the first (null for 'none'); for 'j2' angularMomentum is the axial component's. */
  readonly drift: ConservationDrift | null;
  /** What the drift measures for this model, or why there is none. */
  readonly meaning: string;
}

function conservationOf(input: TrackInput, states: Float64Array): Conservation {
  const { body, model } = input;
  const forces = input.forces ?? [];
  if (model === 'sgp4') return { quantity: 'none', drift: null, meaning: 'SGP4 mean elements with drag and (deep space) lunar-solar terms: no conserved quantity, so no drift is reported' };
  if (model === 'ephemeris') return { quantity: 'none', drift: null, meaning: 'interpolated from the given ephemeris: no dynamics of the service\'s own to conserve anything' };
  if (model === 'two-body') return { quantity: 'two-body', drift: conservationDrift({ states }, body.gm), meaning: 'exact invariants of Keplerian motion: the drift is rounding' };
  if (model === 'numerical' && forces.length === 0) {
    return { quantity: 'two-body', drift: conservationDrift({ states }, body.gm), meaning: 'conserved by two-body gravity: the drift is integration error' };
  }
  if (model === 'numerical' && forces.some((f) => f.kind !== 'j2')) {
    const kinds = [...new Set(forces.filter((f) => f.kind !== 'j2').map((f) => f.kind))].join(', ');
    return { quantity: 'none', drift: null, meaning: `no conserved quantity: ${kinds} change the orbital energy and angular momentum, so no drift is reported` };
  }
  // J2-only dynamics: numerical with J2, j2-secular (about the z axis) and j2-analytic (about the numerical model's axis).
  const axis: Vec3 = model === 'j2-secular' ? [0, 0, 1] : bodySpinAxis(body, spanMiddle(input.epochTT, input.epochsTT));
  const drift = j2IntegralsDrift(states, body.gm, body.j2!, body.radius!, axis);
  return {
    quantity: 'j2',
    drift,
    meaning: model === 'numerical'
      ? 'conserved by J2-only gravity: the drift is integration error'
      : `integrals of J2-only gravity, which the ${model} model approximates: the drift measures the terms it leaves out (${model === 'j2-secular' ? 'the short-period terms' : 'second-order terms'}), not an integration error`,
  };
}

/** Drift of the J2 energy integral and of the axial angular momentum across a table of states (see ConservedQuantity). */
export function j2IntegralsDrift(s: Float64Array, mu: number, j2: number, radius: number, k: Vec3): ConservationDrift {
  const n = Math.floor(s.length / 6);
  if (n === 0) return { energy: 0, energyVsPotential: 0, angularMomentum: 0, angularMomentumVector: 0 };
  const c = mu * j2 * radius * radius;
  const energyAt = (o: number): number => {
    const r2 = s[o]! ** 2 + s[o + 1]! ** 2 + s[o + 2]! ** 2;
    const r = Math.sqrt(r2);
    const z = s[o]! * k[0] + s[o + 1]! * k[1] + s[o + 2]! * k[2];
    return 0.5 * (s[o + 3]! ** 2 + s[o + 4]! ** 2 + s[o + 5]! ** 2) - mu / r + (c * (3 * (z * z) / r2 - 1)) / (2 * r2 * r);
  };
  const axialAt = (o: number): number =>
    (s[o + 1]! * s[o + 5]! - s[o + 2]! * s[o + 4]!) * k[0] + (s[o + 2]! * s[o + 3]! - s[o]! * s[o + 5]!) * k[1] + (s[o]! * s[o + 4]! - s[o + 1]! * s[o + 3]!) * k[2];
  const e0 = energyAt(0);
  const hz0 = axialAt(0);
  const h0 = Math.hypot(s[1]! * s[5]! - s[2]! * s[4]!, s[2]! * s[3]! - s[0]! * s[5]!, s[0]! * s[4]! - s[1]! * s[3]!);
  let de = 0;
  let dh = 0;
  for (let o = 6; o < 6 * n; o += 6) {
    de = Math.max(de, Math.abs(energyAt(o) - e0));
    dh = Math.max(dh, Math.abs(axialAt(o) - hz0));
  }
  const potential0 = mu / Math.hypot(s[0]!, s[1]!, s[2]!);
  const dhRel = dh === 0 ? 0 : dh / h0;
  return { energy: de === 0 ? 0 : de / Math.abs(e0), energyVsPotential: de / potential0, angularMomentum: dhRel, angularMomentumVector: dhRel };
}

/**
 * Does the conic pass below the body radius R within the sampled span? Between two apsides r(t)
 * is monotonic, so on a span without a periapsis passage the least radius is at a sample; with a
 * passage it is the periapsis radius (common practice, no source). The j2-secular model keeps a
 * and e, so the same periapsis radius holds; its passages drift by the small J2 mean-motion term,
 * which the sample check covers on any reasonable grid. The j2-analytic model moves the periapsis
 * radius by its short-period terms (km), which the sample check covers likewise.
 */
function surfaceCrossing(input: TrackInput, states: Float64Array): Outcome<never> | undefined {
  const { body, r0, v0, epochTT, epochsTT } = input;
  const radius = body.radius!;
  const radius2 = radius * radius;
  for (let i = 0; i < epochsTT.length; i++) {
    const o = 6 * i;
    const x = states[o]!;
    const y = states[o + 1]!;
    const z = states[o + 2]!;
    if (x * x + y * y + z * z < radius2) {
      return failure('impact', `the trajectory is below the ${body.name} radius (${radius} km) at sample ${i}; set passThroughBody to propagate it as a point mass anyway`);
    }
  }
  // Given states, and SGP4 (whose mean elements are no conic; it reports decay itself): the samples are all there is to check.
  if (input.model === 'ephemeris' || input.model === 'sgp4') return undefined;
  const el = stateToElements(r0, v0, body.gm);
  if (!el.ok) return el;
  const { semiLatusRectum: p, eccentricity: e, semiMajorAxis: a, meanAnomaly: m0, orbitType } = el.value;
  const rp = p / (1 + e);
  if (rp >= radius || epochsTT.length === 0) return undefined;
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of epochsTT) { lo = Math.min(lo, t); hi = Math.max(hi, t); }
  // Mean motion as in orbit.ts: sqrt(mu/|a|^3), or 2 sqrt(mu/p^3) for the parabola.
  const n = a === null ? 2 * Math.sqrt(body.gm / p ** 3) : Math.sqrt(body.gm / Math.abs(a) ** 3);
  let passage = epochTT - m0 / n; // a periapsis passage (the only one when unbound)
  if (isClosed(orbitType)) {
    const period = TWO_PI / n;
    passage += Math.ceil((lo - passage) / period) * period; // first passage at or after lo
  }
  if (passage >= lo && passage <= hi) {
    return failure('impact', `the periapsis radius ${rp.toFixed(3)} km is below the ${body.name} radius (${radius} km) and the track passes periapsis within its span; set passThroughBody to propagate it as a point mass anyway`);
  }
  return undefined;
}
