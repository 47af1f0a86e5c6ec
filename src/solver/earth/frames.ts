// GCRF <-> ITRF, equinox-based: r_ITRF = W R3(GAST) N P B r_GCRF (IERS Conventions 2010 ch. 5,
// sec. 5.4-5.6; Vallado 4th ed. ch. 3, from memory):
// - N P B from the IAU 2006 Fukushima-Williams angles (precession.ts, frame bias included) with
//   IAU 2000B nutation (nutation.ts); GAST = ERA + the IAU 2006 GMST polynomial + the equation of
//   the equinoxes (rotation.ts). IAU 2000B is within ~1 mas of IAU 2000A (McCarthy & Luzum 2003):
//   0.03 m at 7000 km, 0.2 m at GEO; the tests measure this path against an independent CIO-based
//   implementation and Vallado 4th ed. Example 3-15 (docs/accuracy.md).
// - Celestial pole offsets dX, dY (finals2000A, w.r.t. IAU 2006/2000A) move the pole of the
//   intermediate frame in GCRS by (dX, dY) (IERS Conventions 2010 eq. 5.26); applied on top of
//   IAU 2000B when given.
// - R3(GAST) N P B = R3(ERA) Q with Q = R3(GAST - ERA) N P B slowly varying and a function of TT
//   only: ERA per sample from UT1 (IERS Conventions 2010 eq. 5.15), Q from a table of hourly
//   nodes, interpolated linearly, for long tracks.
// - Polar motion W^T = R1(-yp) R2(-xp) R3(s'), s' = -47 uas t (IERS Conventions 2010 eq. 5.3, 5.13).
// - Earth orientation: explicit `dut1` / `polarMotion` / `poleOffsets` win; otherwise the values
//   come from `eop` (an IERS table, time/eop.ts) where it covers the epoch; otherwise 0 (UT1 = UTC:
//   |UT1-UTC| < 0.9 s costs up to 0.45 km along-track at LEO radius and 2.8 km at GEO).
// - Velocity: v_ITRF = W (R3(ERA) v_CIRS - omega x r_TIRS) with omega the ERA rate; the slow
//   rotation of Q and W (< 1e-11 rad/s) is neglected: < 0.5 mm/s at GEO.

import { wrapPi, wrapTwoPi } from '../core/math.js';
import { julianCenturiesTT, taiMinusUtc, TT_MINUS_TAI_S, ttFromUtc, utcFromTt } from '../time/time.js';
import { eopAt, type EopTable } from '../time/eop.js';
import type { Vec3 } from '../core/vec3.js';
import { apply, applyT, lerp, multiply, rot1, rot2, rot3, transpose, type Mat3 } from './mat3.js';
import { biasPrecessionNutation, fukushimaWilliams, ARCSEC } from './precession.js';
import { delaunayArguments, nutationFor2006 } from './nutation.js';
import { EARTH_ROTATION_RATE_RAD_S, earthRotationAngle, equationOfEquinoxes, gmstMinusEra } from './rotation.js';

export type { Mat3 } from './mat3.js';
export { EARTH_ROTATION_RATE_RAD_S, earthRotationAngle } from './rotation.js';

export interface FrameOptions {
  /** UT1 - UTC, s; wins over `eop`. Default: from `eop`, else 0. */
  readonly dut1?: number;
  /** Pole coordinates xp, yp in rad (IERS convention: yp positive toward 90 deg W); wins over `eop`. Default: from `eop`, else 0. */
  readonly polarMotion?: { readonly xp: number; readonly yp: number };
  /** Celestial pole offsets dX, dY in rad (w.r.t. IAU 2006/2000A); wins over `eop`. Default: from `eop`, else 0. */
  readonly poleOffsets?: { readonly dX: number; readonly dY: number };
  /** Earth orientation table (IERS finals2000A, time/eop.ts), interpolated at each epoch it covers. */
  readonly eop?: EopTable;
  /** Include the GCRS frame bias (default true: it is part of the IAU 2006 angles); false treats GCRF as J2000 mean. */
  readonly frameBias?: boolean;
}

export interface StateVectors {
  readonly r: Vec3;
  readonly v: Vec3;
}

const SECONDS_PER_DAY = 86_400;

/** Frame bias angles; IERS Conventions 2010 sec. 5.4.4 (xi0, eta0, dalpha0; shared reference README). */
const XI0 = -0.016_617 * ARCSEC;
const ETA0 = -0.006_819_2 * ARCSEC;
const DALPHA0 = -0.0146 * ARCSEC;

/** GCRS -> J2000 mean equator and equinox: B = R1(-eta0) R2(xi0) R3(dalpha0); IERS Conventions 2010 sec. 5.4.4. */
export const FRAME_BIAS: Mat3 = multiply(multiply(rot1(-ETA0), rot2(XI0)), rot3(DALPHA0));

/** s' = -47 microarcseconds per century of TT (IERS Conventions 2010 eq. 5.13), rad. */
export const tioLocator = (t: number): number => -47e-6 * ARCSEC * t;

/** TIRS (PEF) -> ITRF: W^T = R1(-yp) R2(-xp) R3(s'); IERS Conventions 2010 eq. 5.3. */
export const polarMotionMatrix = (xp: number, yp: number, sPrime = 0): Mat3 => multiply(multiply(rot1(-yp), rot2(-xp)), rot3(sPrime));

/** The Earth orientation in force at one epoch: explicit options first, then the table, else none (see the header). */
interface EarthOrientation {
  /** UT1 - TT, s. */
  readonly ut1MinusTT: number;
  readonly poleOffsets: { readonly dX: number; readonly dY: number } | undefined;
  /** TIRS -> ITRF, or undefined when polar motion is neglected. */
  readonly w: Mat3 | undefined;
}

function earthOrientationAt(tt: number, opts: FrameOptions): EarthOrientation {
  const e = opts.eop ? eopAt(opts.eop, tt) : undefined;
  const ut1 = opts.dut1 !== undefined || !e
    ? (opts.dut1 ?? 0) - taiMinusUtc(utcFromTt(tt).utcDay) - TT_MINUS_TAI_S
    : e.ut1MinusTai - TT_MINUS_TAI_S;
  const covered = e?.covered === true;
  const pm = opts.polarMotion ?? (covered ? { xp: e.xp, yp: e.yp } : undefined);
  return {
    ut1MinusTT: ut1,
    poleOffsets: opts.poleOffsets ?? (covered ? { dX: e.dX, dY: e.dY } : undefined),
    w: pm ? polarMotionMatrix(pm.xp, pm.yp, tioLocator(julianCenturiesTT(tt))) : undefined,
  };
}

/** UT1 - TT (s) at a TT epoch under the options (see the header for which value wins). */
export const ut1MinusTT = (tt: number, opts: FrameOptions = {}): number => earthOrientationAt(tt, opts).ut1MinusTT;

/** Days of UT1 since J2000.0 (JD_UT1 - 2451545.0) at a TT epoch. */
export const ut1Days = (tt: number, opts: FrameOptions = {}): number => (tt + ut1MinusTT(tt, opts)) / SECONDS_PER_DAY;

/** Greenwich mean sidereal time (IAU 2006), rad [0, 2pi); IERS Conventions 2010 eq. 5.32. */
export function greenwichMeanSiderealTime(tt: number, dut1 = 0): number {
  return wrapTwoPi(earthRotationAngle(ut1Days(tt, { dut1 })) + gmstMinusEra(julianCenturiesTT(tt)));
}

/** Greenwich apparent sidereal time (IAU 2006/2000B), rad [0, 2pi): GMST + the equation of the equinoxes; IERS Conventions 2010 eq. 5.30. */
export function greenwichApparentSiderealTime(tt: number, dut1 = 0): number {
  const t = julianCenturiesTT(tt);
  const a = delaunayArguments(t);
  const n = nutationFor2006(t, a);
  return wrapTwoPi(greenwichMeanSiderealTime(tt, dut1) + equationOfEquinoxes(n.dpsi, fukushimaWilliams(t).epsA, a.om));
}

/**
 * Q = R3(GAST - ERA) N P B: GCRF -> true equator of date with its origin moved from the equinox to
 * the CIO (GAST - ERA is minus the equation of the origins; IERS Conventions 2010 sec. 5.5), i.e.
 * the celestial-to-intermediate rotation. A function of TT (and the pole offsets) only; R3(ERA) Q
 * is the full GCRF -> TIRS rotation. Rows: the intermediate axes in GCRF, the third is the pole.
 */
export function celestialToIntermediate(tt: number, opts: FrameOptions = {}): Mat3 {
  return intermediateWith(tt, opts, opts.poleOffsets ?? (opts.eop ? earthOrientationAt(tt, opts).poleOffsets : undefined));
}

function intermediateWith(tt: number, opts: FrameOptions, d: { readonly dX: number; readonly dY: number } | undefined): Mat3 {
  const t = julianCenturiesTT(tt);
  const a = delaunayArguments(t);
  const n = nutationFor2006(t, a);
  const fw = fukushimaWilliams(t);
  let npb = biasPrecessionNutation(fw, n.dpsi, n.deps);
  if (opts.frameBias === false) npb = multiply(npb, transpose(FRAME_BIAS));
  // The pole moves by (dX, dY) in GCRS, the CIO stays (first order; IERS Conventions 2010 eq. 5.26).
  if (d) npb = multiply(npb, multiply(rot2(d.dX), rot1(-d.dY)));
  return multiply(rot3(wrapPi(gmstMinusEra(t) + equationOfEquinoxes(n.dpsi, fw.epsA, a.om))), npb);
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
  // Transport theorem: v_TIRS = R3(ERA) v_CIRS - omega x r_TIRS; Vallado 4th ed. ch. 3 (from memory).
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

function orientationAt(tt: number, opts: FrameOptions): Orientation {
  const e = earthOrientationAt(tt, opts);
  return { q: intermediateWith(tt, opts, e.poleOffsets), era: earthRotationAngle((tt + e.ut1MinusTT) / SECONDS_PER_DAY), w: e.w };
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
/** A step in UT1 - TT larger than this between two nodes is a leap second of UTC + constant dut1: such samples are computed exactly. */
const UT1_JUMP_S = 0.5;

/**
 * Q, W and UT1 - TT at evenly spaced nodes covering [startTT, stopTT], for many samples of one
 * track: per sample Q and W are interpolated linearly (sub-mm at LEO with 1 h spacing, measured
 * in the tests: 0.21 mm at LEO, 1.3 mm at GEO over 7 days), UT1 - TT too (nodes fall on whole UTC
 * hours, so the daily IERS rows are nodes and their linear pieces are kept), and only ERA is computed. Epochs outside the covered span are extrapolated from the end nodes.
 */
export interface OrientationTable {
  readonly startTT: number;
  readonly spacing: number;
  readonly nodes: readonly Mat3[];
  /** Polar-motion matrix per node; empty when polar motion is neglected. */
  readonly polar: readonly Mat3[];
  /** UT1 - TT per node, s. */
  readonly ut1MinusTT: Float64Array;
  readonly options: FrameOptions;
}

export function orientationTable(fromTT: number, stopTT: number, opts: FrameOptions = {}, spacing = ORIENTATION_NODE_SPACING_S): OrientationTable {
  if (!(stopTT >= fromTT) || !(spacing > 0)) throw new RangeError('orientationTable needs startTT <= stopTT and spacing > 0');
  // Nodes on whole hours of UTC when the spacing divides a day: the daily EOP rows (at 0h UTC) are
  // then nodes too, so their piecewise-linear values are reproduced exactly between nodes.
  let startTT = fromTT;
  if (SECONDS_PER_DAY % spacing === 0) {
    const midnight = ttFromUtc(utcFromTt(fromTT).utcDay, 0);
    startTT = midnight + Math.floor((fromTT - midnight) / spacing) * spacing;
  }
  const count = Math.max(2, Math.ceil((stopTT - startTT) / spacing) + 1);
  const nodes: Mat3[] = [];
  const polar: Array<Mat3 | undefined> = [];
  const ut1 = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const t = startTT + i * spacing;
    const e = earthOrientationAt(t, opts);
    nodes.push(intermediateWith(t, opts, e.poleOffsets));
    polar.push(e.w);
    ut1[i] = e.ut1MinusTT;
  }
  // A table whose epochs leave the EOP coverage part way has polar motion at some nodes only:
  // the others take xp = yp = 0, the documented fallback there.
  const some = polar.some((w) => w !== undefined);
  const full = some ? polar.map((w, i) => w ?? polarMotionMatrix(0, 0, tioLocator(julianCenturiesTT(startTT + i * spacing)))) : [];
  return { startTT, spacing, nodes, polar: full, ut1MinusTT: ut1, options: opts };
}

function interpolated(table: OrientationTable, tt: number): Orientation {
  const { nodes, spacing, startTT, polar } = table;
  const x = (tt - startTT) / spacing;
  const i = Math.min(Math.max(Math.floor(x), 0), nodes.length - 2);
  const f = x - i;
  const ua = table.ut1MinusTT[i]!;
  const ub = table.ut1MinusTT[i + 1]!;
  const du = Math.abs(ub - ua) > UT1_JUMP_S ? ut1MinusTT(tt, table.options) : ua + f * (ub - ua);
  return {
    q: lerp(nodes[i]!, nodes[i + 1]!, f),
    era: earthRotationAngle((tt + du) / SECONDS_PER_DAY),
    w: polar.length > 0 ? lerp(polar[i]!, polar[i + 1]!, f) : undefined,
  };
}

/** gcrfToItrf through a table (fast path). */
export const gcrfToItrfTabled = (table: OrientationTable, tt: number, r: Vec3, v: Vec3): StateVectors =>
  forward(interpolated(table, tt), r, v);

/**
 * gcrfToItrfTabled without a new array or object: the ITRF state of (r0..r2, v0..v2) written to
 * out[o..o+5]. The same operations in the same order as interpolated() + forward(), so the same
 * bits (test/solver/earth/frames-into.test.ts compares them); for searches that convert tens of
 * thousands of single states.
 */
export function gcrfToItrfTabledInto(
  table: OrientationTable, tt: number,
  r0: number, r1: number, r2: number, v0: number, v1: number, v2: number,
  out: Float64Array, o: number,
): void {
  const { nodes, spacing, startTT, polar } = table;
  const x = (tt - startTT) / spacing;
  const i = Math.min(Math.max(Math.floor(x), 0), nodes.length - 2);
  const f = x - i;
  const ua = table.ut1MinusTT[i]!;
  const ub = table.ut1MinusTT[i + 1]!;
  const du = Math.abs(ub - ua) > UT1_JUMP_S ? ut1MinusTT(tt, table.options) : ua + f * (ub - ua);
  const a = nodes[i]!;
  const b = nodes[i + 1]!;
  // lerp(a, b, f) element by element (mat3.ts), then forward().
  const q0 = a[0] + f * (b[0] - a[0]), q1 = a[1] + f * (b[1] - a[1]), q2 = a[2] + f * (b[2] - a[2]);
  const q3 = a[3] + f * (b[3] - a[3]), q4 = a[4] + f * (b[4] - a[4]), q5 = a[5] + f * (b[5] - a[5]);
  const q6 = a[6] + f * (b[6] - a[6]), q7 = a[7] + f * (b[7] - a[7]), q8 = a[8] + f * (b[8] - a[8]);
  const era = earthRotationAngle((tt + du) / SECONDS_PER_DAY);
  const c = Math.cos(era);
  const s = Math.sin(era);
  const qr0 = q0 * r0 + q1 * r1 + q2 * r2;
  const qr1 = q3 * r0 + q4 * r1 + q5 * r2;
  const qr2 = q6 * r0 + q7 * r1 + q8 * r2;
  const qv0 = q0 * v0 + q1 * v1 + q2 * v2;
  const qv1 = q3 * v0 + q4 * v1 + q5 * v2;
  const qv2 = q6 * v0 + q7 * v1 + q8 * v2;
  const rp0 = c * qr0 + s * qr1;
  const rp1 = -s * qr0 + c * qr1;
  const rp2 = qr2;
  const om = EARTH_ROTATION_RATE_RAD_S;
  const vp0 = c * qv0 + s * qv1 + om * rp1;
  const vp1 = -s * qv0 + c * qv1 - om * rp0;
  const vp2 = qv2;
  if (polar.length === 0) {
    out[o] = rp0;
    out[o + 1] = rp1;
    out[o + 2] = rp2;
    out[o + 3] = vp0;
    out[o + 4] = vp1;
    out[o + 5] = vp2;
    return;
  }
  const pa = polar[i]!;
  const pb = polar[i + 1]!;
  const w0 = pa[0] + f * (pb[0] - pa[0]), w1 = pa[1] + f * (pb[1] - pa[1]), w2 = pa[2] + f * (pb[2] - pa[2]);
  const w3 = pa[3] + f * (pb[3] - pa[3]), w4 = pa[4] + f * (pb[4] - pa[4]), w5 = pa[5] + f * (pb[5] - pa[5]);
  const w6 = pa[6] + f * (pb[6] - pa[6]), w7 = pa[7] + f * (pb[7] - pa[7]), w8 = pa[8] + f * (pb[8] - pa[8]);
  // apply(w, rp), apply(w, vp) (mat3.ts).
  out[o] = w0 * rp0 + w1 * rp1 + w2 * rp2;
  out[o + 1] = w3 * rp0 + w4 * rp1 + w5 * rp2;
  out[o + 2] = w6 * rp0 + w7 * rp1 + w8 * rp2;
  out[o + 3] = w0 * vp0 + w1 * vp1 + w2 * vp2;
  out[o + 4] = w3 * vp0 + w4 * vp1 + w5 * vp2;
  out[o + 5] = w6 * vp0 + w7 * vp1 + w8 * vp2;
}

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
