// The GCRF -> ITRF path as it was before IAU 2006/2000B (astronomy-engine 2.1.19's precession-nutation
// and sidereal time), kept here for bench/frames.ts only: the new conversion is measured against it in
// the same run. Not used by the service. Copied from src/solver/earth/frames.ts at SOLVER_VERSION 1.0.0,
// trimmed to the batch path.

import { AstroTime, Rotation_EQJ_EQD, SiderealTime, e_tilt } from 'astronomy-engine';
import { TWO_PI, SECONDS_PER_DAY, wrapTwoPi, wrapPi } from '../src/solver/core/math.js';
import { ut1DaysSinceJ2000 } from '../src/solver/time/time.js';
import type { Vec3 } from '../src/solver/core/vec3.js';

/** Row-major 3x3 matrix. */
export type Mat3 = readonly [number, number, number, number, number, number, number, number, number];

export interface FrameOptions {
  /** UT1 - UTC, s (default 0). */
  readonly dut1?: number;
  /** Pole coordinates xp, yp in rad (IERS convention: yp positive toward 90 deg W). Default: neglected. */
  readonly polarMotion?: { readonly xp: number; readonly yp: number };
  /** Apply the constant GCRS -> J2000 frame bias (default false: neglected). */
  readonly frameBias?: boolean;
}

export interface StateVectors {
  readonly r: Vec3;
  readonly v: Vec3;
}

/** Earth rotation rate, rad/s of UT1: the time derivative of ERA, 2 pi x 1.00273781191135448 / day (IERS Conventions 2010 eq. 5.15). */
export const EARTH_ROTATION_RATE_RAD_S = (TWO_PI * 1.002_737_811_911_354_6) / SECONDS_PER_DAY;

const ARCSEC = Math.PI / 648_000;
/** Frame bias angles; IERS Conventions 2010 sec. 5.4.4 (xi0, eta0, dalpha0). */
const XI0 = -0.016_617 * ARCSEC;
const ETA0 = -0.006_819_2 * ARCSEC;
const DALPHA0 = -0.0146 * ARCSEC;

/** Earth rotation angle (rad, [0, 2pi)) from UT1 days since J2000; IERS Conventions 2010 eq. 5.15. */
export function earthRotationAngle(ut1Days: number): number {
  const frac = ut1Days - Math.floor(ut1Days); // split off whole days first: keeps ~1e-16 day resolution
  return wrapTwoPi(TWO_PI * (frac + 0.779_057_273_264 + 0.002_737_811_911_354_48 * ut1Days));
}

/** Greenwich apparent sidereal time, rad [0, 2pi) (astronomy-engine: ERA + P03 polynomial + equation of the equinoxes). */
export function greenwichApparentSiderealTime(tt: number, dut1 = 0): number {
  return (SiderealTime(new AstroTime(ut1DaysSinceJ2000(tt, dut1))) * Math.PI) / 12;
}

/** Greenwich mean sidereal time, rad [0, 2pi): GAST minus the equation of the equinoxes (astronomy-engine `e_tilt().ee`, in seconds of time). */
export function greenwichMeanSiderealTime(tt: number, dut1 = 0): number {
  const time = new AstroTime(ut1DaysSinceJ2000(tt, dut1));
  return wrapTwoPi(((SiderealTime(time) - e_tilt(time).ee / 3600) * Math.PI) / 12);
}

const multiply = (a: Mat3, b: Mat3): Mat3 => {
  const m = new Array<number>(9);
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) m[3 * i + j] = a[3 * i]! * b[j]! + a[3 * i + 1]! * b[3 + j]! + a[3 * i + 2]! * b[6 + j]!;
  }
  return m as unknown as Mat3;
};

// Frame (passive) rotations about x, y, z; Vallado 4th ed. ch. 3 ROT1/ROT2/ROT3 (from memory).
const rot1 = (t: number): Mat3 => [1, 0, 0, 0, Math.cos(t), Math.sin(t), 0, -Math.sin(t), Math.cos(t)];
const rot2 = (t: number): Mat3 => [Math.cos(t), 0, -Math.sin(t), 0, 1, 0, Math.sin(t), 0, Math.cos(t)];
const rot3 = (t: number): Mat3 => [Math.cos(t), Math.sin(t), 0, -Math.sin(t), Math.cos(t), 0, 0, 0, 1];

/** GCRS -> J2000 mean equator and equinox: B = R1(-eta0) R2(xi0) R3(dalpha0); IERS Conventions 2010 sec. 5.4.4. */
export const FRAME_BIAS: Mat3 = multiply(multiply(rot1(-ETA0), rot2(XI0)), rot3(DALPHA0));

/** PEF (TIRS) -> ITRF: W^T = R1(-yp) R2(-xp), s' neglected; IERS Conventions 2010 sec. 5.4.1 (from memory). */
export const polarMotionMatrix = (xp: number, yp: number): Mat3 => multiply(rot1(-yp), rot2(-xp));

/**
 * Q = R3(GAST - ERA) N P [B]: GCRF -> true equator of date with its origin moved from the equinox
 * to the CIO (GAST - ERA is minus the equation of the origins; IERS Conventions 2010 sec. 5.5,
 * from memory), i.e. the celestial-to-intermediate rotation. Slowly varying; R3(ERA) Q is the
 * full GCRF -> PEF rotation.
 */
export function celestialToIntermediate(tt: number, opts: FrameOptions = {}): Mat3 {
  const time = new AstroTime(ut1DaysSinceJ2000(tt, opts.dut1 ?? 0));
  const rot = Rotation_EQJ_EQD(time).rot; // stored transposed: out_j = sum_i rot[i][j] in_i
  const np: Mat3 = [0, 1, 2].flatMap((j) => [rot[0]![j]!, rot[1]![j]!, rot[2]![j]!]) as unknown as Mat3;
  const gastMinusEra = wrapPi((SiderealTime(time) * Math.PI) / 12 - earthRotationAngle(time.ut));
  const q = multiply(rot3(gastMinusEra), np);
  return opts.frameBias ? multiply(q, FRAME_BIAS) : q;
}

/** Everything needed to rotate at one instant: Q, ERA and the optional polar-motion matrix. */
interface Orientation {
  readonly q: Mat3;
  readonly era: number;
  readonly w: Mat3 | undefined;
}

function forward(o: Orientation, r: Vec3, v: Vec3): StateVectors {
  const { q, era, w } = o;
  const c = Math.cos(era);
  const s = Math.sin(era);
  const qr0 = q[0] * r[0] + q[1] * r[1] + q[2] * r[2];
  const qr1 = q[3] * r[0] + q[4] * r[1] + q[5] * r[2];
  const qr2 = q[6] * r[0] + q[7] * r[1] + q[8] * r[2];
  const qv0 = q[0] * v[0] + q[1] * v[1] + q[2] * v[2];
  const qv1 = q[3] * v[0] + q[4] * v[1] + q[5] * v[2];
  const qv2 = q[6] * v[0] + q[7] * v[1] + q[8] * v[2];
  const rp: Vec3 = [c * qr0 + s * qr1, -s * qr0 + c * qr1, qr2];
  // Transport theorem: v_PEF = R3(ERA) v_TOD - omega x r_PEF; Vallado 4th ed. ch. 3 (from memory).
  const om = EARTH_ROTATION_RATE_RAD_S;
  const vp: Vec3 = [c * qv0 + s * qv1 + om * rp[1], -s * qv0 + c * qv1 - om * rp[0], qv2];
  return w ? { r: apply(w, rp), v: apply(w, vp) } : { r: rp, v: vp };
}

function inverse(o: Orientation, r: Vec3, v: Vec3): StateVectors {
  const { q, era, w } = o;
  const rp = w ? applyT(w, r) : r;
  const vp = w ? applyT(w, v) : v;
  const om = EARTH_ROTATION_RATE_RAD_S;
  const vt0 = vp[0] - om * rp[1];
  const vt1 = vp[1] + om * rp[0];
  const c = Math.cos(era);
  const s = Math.sin(era);
  const rt: Vec3 = [c * rp[0] - s * rp[1], s * rp[0] + c * rp[1], rp[2]];
  const vt: Vec3 = [c * vt0 - s * vt1, s * vt0 + c * vt1, vp[2]];
  return { r: applyT(q, rt), v: applyT(q, vt) };
}

const apply = (m: Mat3, x: Vec3): Vec3 => [
  m[0] * x[0] + m[1] * x[1] + m[2] * x[2],
  m[3] * x[0] + m[4] * x[1] + m[5] * x[2],
  m[6] * x[0] + m[7] * x[1] + m[8] * x[2],
];
const applyT = (m: Mat3, x: Vec3): Vec3 => [
  m[0] * x[0] + m[3] * x[1] + m[6] * x[2],
  m[1] * x[0] + m[4] * x[1] + m[7] * x[2],
  m[2] * x[0] + m[5] * x[1] + m[8] * x[2],
];

const polar = (opts: FrameOptions): Mat3 | undefined =>
  opts.polarMotion ? polarMotionMatrix(opts.polarMotion.xp, opts.polarMotion.yp) : undefined;

function orientationAt(tt: number, opts: FrameOptions): Orientation {
  return { q: celestialToIntermediate(tt, opts), era: earthRotationAngle(ut1DaysSinceJ2000(tt, opts.dut1 ?? 0)), w: polar(opts) };
}

/** GCRF state (km, km/s) at TT epoch `tt` -> ITRF state (velocity relative to the rotating Earth). */
export function gcrfToItrf(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  return forward(orientationAt(tt, opts), r, v);
}

/** ITRF state -> GCRF state; the exact inverse of gcrfToItrf. */
export function itrfToGcrf(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  return inverse(orientationAt(tt, opts), r, v);
}

/** Default node spacing of an orientation table, s. */
export const ORIENTATION_NODE_SPACING_S = 3600;

/**
 * Q at evenly spaced nodes covering [startTT, stopTT], for many samples of one track: per
 * sample only ERA is computed and Q is interpolated linearly (0.15 mm at LEO with 1 h spacing,
 * measured in the tests). Epochs outside the covered span are extrapolated from the end nodes.
 */
export interface OrientationTable {
  readonly startTT: number;
  readonly spacing: number;
  readonly nodes: readonly Mat3[];
  readonly options: FrameOptions;
  readonly w: Mat3 | undefined;
}

export function orientationTable(startTT: number, stopTT: number, opts: FrameOptions = {}, spacing = ORIENTATION_NODE_SPACING_S): OrientationTable {
  if (!(stopTT >= startTT) || !(spacing > 0)) throw new RangeError('orientationTable needs startTT <= stopTT and spacing > 0');
  const count = Math.max(2, Math.ceil((stopTT - startTT) / spacing) + 1);
  const nodes: Mat3[] = [];
  for (let i = 0; i < count; i++) nodes.push(celestialToIntermediate(startTT + i * spacing, opts));
  return { startTT, spacing, nodes, options: opts, w: polar(opts) };
}

function interpolated(table: OrientationTable, tt: number): Orientation {
  const { nodes, spacing, startTT } = table;
  const x = (tt - startTT) / spacing;
  const i = Math.min(Math.max(Math.floor(x), 0), nodes.length - 2);
  const f = x - i;
  const a = nodes[i]!;
  const b = nodes[i + 1]!;
  const q = a.map((ai, k) => ai + f * (b[k]! - ai)) as unknown as Mat3;
  return { q, era: earthRotationAngle(ut1DaysSinceJ2000(tt, table.options.dut1 ?? 0)), w: table.w };
}

/** gcrfToItrf through a table (fast path). */
export const gcrfToItrfTabled = (table: OrientationTable, tt: number, r: Vec3, v: Vec3): StateVectors =>
  forward(interpolated(table, tt), r, v);

/** itrfToGcrf through a table (fast path). */
export const itrfToGcrfTabled = (table: OrientationTable, tt: number, r: Vec3, v: Vec3): StateVectors =>
  inverse(interpolated(table, tt), r, v);

export interface BatchOptions extends FrameOptions {
  /** Node spacing of the orientation table, s (default 3600). */
  readonly nodeSpacingS?: number;
}

function batch(
  epochs: Float64Array,
  states: Float64Array,
  opts: BatchOptions,
  step: (table: OrientationTable, tt: number, r: Vec3, v: Vec3) => StateVectors,
): Float64Array {
  if (states.length !== 6 * epochs.length) throw new RangeError('states must hold 6 numbers per epoch');
  const out = new Float64Array(states.length);
  if (epochs.length === 0) return out;
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of epochs) {
    lo = Math.min(lo, t);
    hi = Math.max(hi, t);
  }
  const table = orientationTable(lo, hi, opts, opts.nodeSpacingS ?? ORIENTATION_NODE_SPACING_S);
  for (let k = 0; k < epochs.length; k++) {
    const o = 6 * k;
    const s = step(table, epochs[k]!, [states[o]!, states[o + 1]!, states[o + 2]!], [states[o + 3]!, states[o + 4]!, states[o + 5]!]);
    out.set(s.r, o);
    out.set(s.v, o + 3);
  }
  return out;
}

/** Many GCRF states (x, y, z, vx, vy, vz per epoch) -> ITRF, through an orientation table. */
export const gcrfToItrfBatch = (epochs: Float64Array, states: Float64Array, opts: BatchOptions = {}): Float64Array =>
  batch(epochs, states, opts, gcrfToItrfTabled);

/** Many ITRF states -> GCRF, through an orientation table. */
export const itrfToGcrfBatch = (epochs: Float64Array, states: Float64Array, opts: BatchOptions = {}): Float64Array =>
  batch(epochs, states, opts, itrfToGcrfTabled);
