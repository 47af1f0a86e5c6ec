// The orbit as searches see it (passes, eclipses): a GCRF state at any TT epoch, from any model.
// A propagator may report an expected failure (impact...); searches stop on the first one and
// return it as their outcome.

import { failure, type Failure, type Outcome } from '../core/result.js';
import type { Vec3 } from '../core/vec3.js';

export interface GcrfState {
  readonly r: Vec3;
  readonly v: Vec3;
}
/** Propagator: GCRF state (km, km/s) at a TT epoch; may report an expected failure (impact...). */
export type StateAt = (tt: number) => GcrfState | Outcome<GcrfState>;
/** Optional batch propagator: 6 numbers (r, v) per epoch. */
export type StateBatch = (epochs: Float64Array) => Float64Array | Outcome<Float64Array>;

/** Thrown inside a search when the propagator reports a failure; the search catches it and returns the failure. */
export class PropagationStopped {
  constructor(readonly failure: Failure) {}
}

/** The value of a propagator answer; throws PropagationStopped on a failure. */
export function unwrapState<T>(x: T | Outcome<T>, what: string): T {
  if (typeof x === 'object' && x !== null && 'ok' in x) {
    if (!x.ok) throw new PropagationStopped(x);
    return x.value;
  }
  if (x === undefined || x === null) throw new TypeError(`propagator returned nothing for ${what}`);
  return x as T;
}

/** A finite GCRF state at tt, or PropagationStopped. */
export function gcrfStateAt(stateAt: StateAt, tt: number): GcrfState {
  const x = stateAt(tt);
  // unwrapState written out: its description of the epoch would be a new string on every call.
  // The failures are thrown from functions of their own: a template string here makes this
  // function too large to inline, and the propagator's answer then escapes to the heap (about
  // 90 ns per call, measured; searches call this tens of thousands of times).
  let s: GcrfState;
  if (typeof x === 'object' && x !== null && 'ok' in x) {
    if (!x.ok) throw new PropagationStopped(x);
    s = x.value;
  } else if (x === undefined || x === null) {
    return nothingReturned(tt);
  } else {
    s = x;
  }
  const { r, v } = s;
  // Written out (no array per call).
  if (!(Number.isFinite(r[0]) && Number.isFinite(r[1]) && Number.isFinite(r[2]) && Number.isFinite(v[0]) && Number.isFinite(v[1]) && Number.isFinite(v[2]))) {
    return nonFinite(tt);
  }
  return s;
}

function nothingReturned(tt: number): never {
  throw new TypeError(`propagator returned nothing for epoch ${tt}`);
}

function nonFinite(tt: number): never {
  throw new PropagationStopped(failure('invalid-parameter', `the propagator returned a non-finite state at TT ${tt} s`));
}
