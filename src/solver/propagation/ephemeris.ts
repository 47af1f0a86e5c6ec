// The ephemeris model: states interpolated from given nodes (an operator's ephemeris file), one
// segment at a time, never across segments and never outside their coverage.
// - Lagrange of degree n: the polynomial through the n + 1 nodes nearest the epoch, applied to each
//   position and velocity component (numerics/lagrange.ts).
// - Hermite: positions matched with their velocities (and accelerations where given) at the
//   nearest ceil((n + 1) / m) nodes (m = 2, or 3 with accelerations), the velocity being the
//   polynomial's derivative (numerics/hermite.ts). The degree is rounded up to what whole nodes give.
// - Error estimate: the last term of Newton's form with the nodes ordered nearest first, i.e. the
//   change made by the farthest node (data): it estimates the error of the interpolant one node
//   smaller and so overstates that of the one used (Burden & Faires, Numerical Analysis, 9th ed.,
//   sec. 3.3, from memory). It says nothing of the errors already in the nodes.

import { failure, success, type Outcome } from '../core/result.js';
import type { Vec3 } from '../core/vec3.js';
import { hermiteCoefficients } from '../numerics/confluent-hermite.js';
import { newtonCoefficients, newtonEvaluate } from '../numerics/lagrange.js';
import { formatUtcIso } from '../time/time.js';

export const INTERPOLATION_METHODS = ['lagrange', 'hermite'] as const;
export type InterpolationMethod = (typeof INTERPOLATION_METHODS)[number];

/** Epochs this close to a coverage end (s) count as inside it: printed epochs round. */
export const COVERAGE_SLACK_S = 1e-6;

export interface EphemerisSegment {
  /** Node epochs, TT seconds since J2000, strictly increasing. */
  readonly epochsTT: Float64Array;
  /** x, y, z (km), vx, vy, vz (km/s) per node, GCRF. */
  readonly states: Float64Array;
  /** ax, ay, az (km/s^2) per node, GCRF, or null. */
  readonly accelerations: Float64Array | null;
  readonly method: InterpolationMethod;
  /** Degree asked for (>= 1). */
  readonly degree: number;
  /** Where the segment may be used (within its first and last node; TT s). */
  readonly startTT: number;
  readonly stopTT: number;
}

export interface Ephemeris {
  /** In priority order: an epoch covered by several segments is taken from the first. */
  readonly segments: readonly EphemerisSegment[];
}

export interface SegmentInterpolation {
  readonly method: InterpolationMethod;
  readonly degreeAsked: number;
  /** The degree interpolated with (fewer nodes than asked, or Hermite rounded up to whole nodes). */
  readonly degree: number;
  readonly nodesPerSample: number;
  readonly usesAccelerations: boolean;
  readonly startTT: number;
  readonly stopTT: number;
}

export interface InterpolationReport {
  readonly segments: readonly SegmentInterpolation[];
  /** Largest position error estimate over the epochs asked for, km (0 when none was asked). */
  readonly maxPositionErrorKm: number;
}

/** Nodes per sample and degree of a segment. */
function plan(s: EphemerisSegment): { nodes: number; orders: number; degree: number } {
  const count = s.epochsTT.length;
  if (s.method === 'lagrange') {
    const nodes = Math.min(s.degree + 1, count);
    return { nodes, orders: 1, degree: nodes - 1 };
  }
  const orders = s.accelerations ? 3 : 2;
  const nodes = Math.min(Math.ceil((s.degree + 1) / orders), count);
  return { nodes, orders, degree: nodes * orders - 1 };
}

/** Check the segments (programmer errors throw) and describe how each is interpolated. */
export function describeEphemeris(e: Ephemeris): SegmentInterpolation[] {
  if (e.segments.length === 0) throw new RangeError('an ephemeris needs at least one segment');
  return e.segments.map((s, i) => {
    const n = s.epochsTT.length;
    if (n === 0 || s.states.length !== 6 * n || (s.accelerations && s.accelerations.length !== 3 * n)) throw new RangeError(`segment ${i}: 6 state numbers (and 3 accelerations) per node`);
    if (!(s.degree >= 1 && Number.isInteger(s.degree))) throw new RangeError(`segment ${i}: degree must be a positive integer`);
    if (!(s.startTT >= s.epochsTT[0]! - COVERAGE_SLACK_S && s.stopTT <= s.epochsTT[n - 1]! + COVERAGE_SLACK_S && s.stopTT >= s.startTT)) {
      throw new RangeError(`segment ${i}: its coverage must lie within its nodes`);
    }
    const p = plan(s);
    return { method: s.method, degreeAsked: s.degree, degree: p.degree, nodesPerSample: p.nodes, usesAccelerations: s.method === 'hermite' && s.accelerations !== null, startTT: s.startTT, stopTT: s.stopTT };
  });
}

/** The coverage as text for messages: "A to B, C to D" in UTC. */
export function coverageText(e: Ephemeris): string {
  const spans = e.segments.map((s) => `${formatUtcIso(s.startTT)} to ${formatUtcIso(s.stopTT)}`);
  return spans.length > 5 ? `${spans.slice(0, 5).join(', ')} and ${spans.length - 5} more segments` : spans.join(', ');
}

const outside = (e: Ephemeris, tt: number): Outcome<never> =>
  failure('outside-coverage', `epoch ${formatUtcIso(tt)} is outside the ephemeris coverage (${coverageText(e)})`);

/** Index of the first segment covering tt, or -1. */
function segmentAt(e: Ephemeris, tt: number): number {
  for (let i = 0; i < e.segments.length; i++) {
    const s = e.segments[i]!;
    if (tt >= s.startTT - COVERAGE_SLACK_S && tt <= s.stopTT + COVERAGE_SLACK_S) return i;
  }
  return -1;
}

/** Is all of [startTT, stopTT] covered (segments may chain end to end)? A failure names where the coverage stops. */
export function checkCoverage(e: Ephemeris, startTT: number, stopTT: number): Outcome<true> {
  let t = startTT;
  for (let guard = 0; guard <= e.segments.length; guard++) {
    let reach = -Infinity; // the farthest coverage end reached from t
    for (const s of e.segments) if (t >= s.startTT - COVERAGE_SLACK_S && t <= s.stopTT + COVERAGE_SLACK_S) reach = Math.max(reach, s.stopTT);
    if (reach === -Infinity) return outside(e, t);
    if (reach >= stopTT - COVERAGE_SLACK_S) return success(true);
    if (guard > 0 && reach <= t) break;
    t = reach;
  }
  return failure('outside-coverage', `${formatUtcIso(startTT)} to ${formatUtcIso(stopTT)} is not covered: the ephemeris stops at ${formatUtcIso(t)} (coverage ${coverageText(e)})`);
}

/** Scratch space of one interpolator (no allocation per sample). */
interface Scratch {
  idx: Int32Array;
  x: Float64Array;
  y: Float64Array;
  d1: Float64Array;
  d2: Float64Array;
  z: Float64Array;
  c: Float64Array;
  out: Float64Array;
}

const scratch = (size: number): Scratch => ({
  idx: new Int32Array(size), x: new Float64Array(size), y: new Float64Array(size), d1: new Float64Array(size), d2: new Float64Array(size),
  z: new Float64Array(3 * size), c: new Float64Array(3 * size), out: new Float64Array(3),
});

/** Index of the last node at or before tt (0 when tt is before the first). */
function nodeBefore(epochs: Float64Array, tt: number): number {
  let lo = 0;
  let hi = epochs.length - 1;
  if (tt >= epochs[hi]!) return hi;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (epochs[mid]! <= tt) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * Interpolate segment s at tt into out[o..o+6); returns the position error estimate, km. The nodes
 * are the `nodes` nearest tt, taken nearest first; abscissae are node epoch minus tt.
 */
function interpolate(s: EphemerisSegment, nodes: number, orders: number, tt: number, w: Scratch, out: Float64Array, o: number): number {
  const epochs = s.epochsTT;
  const count = epochs.length;
  const k = nodeBefore(epochs, tt);
  const frac = k + 1 < count ? (tt - epochs[k]!) / (epochs[k + 1]! - epochs[k]!) : 0;
  const lo = Math.min(Math.max(Math.floor(k + frac + 1 - nodes / 2), 0), count - nodes);
  // Nearest first (insertion sort of a few nodes by distance).
  const idx = w.idx;
  for (let j = 0; j < nodes; j++) {
    const n = lo + j;
    const d = Math.abs(epochs[n]! - tt);
    let m = j;
    while (m > 0 && Math.abs(epochs[idx[m - 1]!]! - tt) > d) { idx[m] = idx[m - 1]!; m--; }
    idx[m] = n;
  }
  for (let j = 0; j < nodes; j++) w.x[j] = epochs[idx[j]!]! - tt;
  let err2 = 0;
  if (orders === 1) {
    if (nodes === 1) { // one node: that state (coverage is that instant)
      out.set(s.states.subarray(6 * idx[0]!, 6 * idx[0]! + 6), o);
      return 0;
    }
    for (let c = 0; c < 6; c++) {
      for (let j = 0; j < nodes; j++) w.y[j] = s.states[6 * idx[j]! + c]!;
      newtonCoefficients(w.x, w.y, nodes, w.c);
      newtonEvaluate(w.x, w.c, nodes, 0, w.out);
      out[o + c] = w.out[0]!;
      if (c < 3) err2 += w.out[2]! * w.out[2]!;
    }
    return Math.sqrt(err2);
  }
  const derivs = orders === 3 ? [w.y, w.d1, w.d2] : [w.y, w.d1];
  const size = nodes * orders;
  for (let c = 0; c < 3; c++) {
    for (let j = 0; j < nodes; j++) {
      const n = idx[j]!;
      w.y[j] = s.states[6 * n + c]!;
      w.d1[j] = s.states[6 * n + 3 + c]!;
      if (orders === 3) w.d2[j] = s.accelerations![3 * n + c]!;
    }
    hermiteCoefficients(w.x, derivs, nodes, w.z, w.c);
    newtonEvaluate(w.z, w.c, size, 0, w.out);
    out[o + c] = w.out[0]!;
    out[o + 3 + c] = w.out[1]!;
    err2 += w.out[2]! * w.out[2]!;
  }
  return Math.sqrt(err2);
}

/** A reusable interpolator: state at tt into out[o..o+6), or a failure outside the coverage; tracks the largest error estimate. */
export interface EphemerisInterpolator {
  readonly at: (tt: number, out: Float64Array, o: number) => Outcome<true>;
  readonly report: () => InterpolationReport;
}

export function ephemerisInterpolator(e: Ephemeris): EphemerisInterpolator {
  const segments = describeEphemeris(e);
  const plans = e.segments.map(plan);
  const w = scratch(Math.max(...plans.map((p) => p.nodes)) + 1);
  let maxErr = 0;
  const ok = success(true as const);
  return {
    at: (tt, out, o) => {
      const i = segmentAt(e, tt);
      if (i < 0) return outside(e, tt);
      const s = e.segments[i]!;
      const p = plans[i]!;
      const t = Math.min(Math.max(tt, s.startTT), s.stopTT); // inside the slack: at the coverage end
      const err = interpolate(s, p.nodes, p.orders, t, w, out, o);
      if (err > maxErr) maxErr = err;
      return ok;
    },
    report: () => ({ segments, maxPositionErrorKm: maxErr }),
  };
}

/** States at many epochs (x, y, z, vx, vy, vz each) with the interpolation report. */
export function ephemerisStates(e: Ephemeris, epochsTT: Float64Array): Outcome<{ states: Float64Array; interpolation: InterpolationReport }> {
  const f = ephemerisInterpolator(e);
  const states = new Float64Array(6 * epochsTT.length);
  for (let k = 0; k < epochsTT.length; k++) {
    const r = f.at(epochsTT[k]!, states, 6 * k);
    if (!r.ok) return r;
  }
  return success({ states, interpolation: f.report() });
}

/**
 * A state function over [startTT, stopTT] for searches (refused when the span is not covered), and
 * the interpolation report of the epochs it was asked for so far.
 */
export function ephemerisStateFunction(e: Ephemeris, startTT: number, stopTT: number): Outcome<{ at: (tt: number) => Outcome<{ r: Vec3; v: Vec3 }>; report: () => InterpolationReport }> {
  const covered = checkCoverage(e, startTT, stopTT);
  if (!covered.ok) return covered;
  const f = ephemerisInterpolator(e);
  const out = new Float64Array(6);
  return success({
    at: (tt) => {
      const r = f.at(tt, out, 0);
      return r.ok ? success({ r: [out[0]!, out[1]!, out[2]!], v: [out[3]!, out[4]!, out[5]!] }) : r;
    },
    report: f.report,
  });
}

/** The first node's state and epoch (the ephemeris's "initial state"). */
export function firstNode(e: Ephemeris): { r: Vec3; v: Vec3; epochTT: number } {
  const s = e.segments[0]!;
  const x = s.states;
  return { r: [x[0]!, x[1]!, x[2]!], v: [x[3]!, x[4]!, x[5]!], epochTT: s.epochsTT[0]! };
}
