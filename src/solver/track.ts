// A track: the orbit propagated to many epochs with a chosen model, as flat typed arrays.
// Models: 'two-body' (universal variables, exact Keplerian motion).

import type { CentralBody } from './bodies.js';
import { isClosed, stateToElements } from './elements.js';
import { TWO_PI } from './math.js';
import { failure, success, type Outcome } from './result.js';
import { conservationDrift, propagateGrid, type ConservationDrift } from './universal.js';
import type { Vec3 } from './vec3.js';

export const TRACK_MODELS = ['two-body'] as const;
export type TrackModel = (typeof TRACK_MODELS)[number];

export interface TrackInput {
  readonly body: CentralBody;
  readonly model: TrackModel;
  /** Initial state (GCRF, km, km/s) at epochTT. */
  readonly r0: Vec3;
  readonly v0: Vec3;
  readonly epochTT: number;
  /** Sample epochs, TT seconds since J2000, any order. */
  readonly epochsTT: Float64Array;
  /** Propagate as a point mass even below the body radius (default: such a track is refused). */
  readonly passThroughBody?: boolean;
}

export interface Track {
  readonly epochsTT: Float64Array;
  /** x, y, z (km), vx, vy, vz (km/s) per sample, GCRF. */
  readonly states: Float64Array;
  readonly drift: ConservationDrift;
}

export function propagateTrack(input: TrackInput): Outcome<Track> {
  const { body, r0, v0, epochTT, epochsTT } = input;
  const n = epochsTT.length;
  const dt = new Float64Array(n);
  for (let i = 0; i < n; i++) dt[i] = epochsTT[i]! - epochTT;
  const states = new Float64Array(6 * n);
  const done = propagateGrid(r0, v0, body.gm, dt, states);
  if (!done.ok) return done;
  if (!input.passThroughBody && body.radius !== undefined) {
    const hit = surfaceCrossing(input, states);
    if (hit) return hit;
  }
  return success({ epochsTT, states, drift: conservationDrift({ states }, body.gm) });
}

/**
 * Does the conic pass below the body radius R within the sampled span? Between two apsides r(t)
 * is monotonic, so on a span without a periapsis passage the least radius is at a sample; with a
 * passage it is the periapsis radius (common practice, no source).
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
