// A track: the orbit propagated to many epochs with a chosen model (propagator.ts), as flat typed
// arrays, with the drift of the two-body integrals and the check that it stays above the surface.

import { isClosed, stateToElements } from '../conic/elements.js';
import { TWO_PI } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';
import { ephemerisStates, type InterpolationReport } from './ephemeris.js';
import { MODELS, statesAt, type PropagationSpec } from './propagator.js';
import { conservationDrift, type ConservationDrift } from '../conic/universal.js';

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
  readonly drift: ConservationDrift;
  /** The ephemeris model: how it interpolated and its error estimate (absent for the other models). */
  readonly interpolation?: InterpolationReport;
}

export function propagateTrack(input: TrackInput): Outcome<Track> {
  const { body, epochsTT } = input;
  let interpolation: InterpolationReport | undefined;
  let states: Float64Array;
  if (input.model === 'ephemeris') {
    if (!input.ephemeris) throw new TypeError('the ephemeris model needs input.ephemeris');
    const run = ephemerisStates(input.ephemeris, epochsTT);
    if (!run.ok) return run;
    ({ states, interpolation } = run.value);
  } else {
    const run = statesAt(input, epochsTT);
    if (!run.ok) return run;
    states = run.value;
  }
  // The numerical model watches the surface while it integrates; the analytic ones are checked here.
  if (!input.passThroughBody && body.radius !== undefined && input.model !== 'numerical') {
    const hit = surfaceCrossing(input, states);
    if (hit) return hit;
  }
  const drift = conservationDrift({ states }, body.gm);
  return success(interpolation ? { epochsTT, states, drift, interpolation } : { epochsTT, states, drift });
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
  if (input.model === 'ephemeris') return undefined; // given states: the samples are all there is to check
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
