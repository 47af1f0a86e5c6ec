// TEME (true equator, mean equinox): the frame the SGP4 method produces its states in, and its
// conversions to ITRF and GCRF (Vallado, Crawford, Hujsak & Kelso, "Revisiting Spacetrack Report
// #3", AIAA 2006-6753, sec. on TEME; Vallado 4th ed. sec. 3.7, from memory):
// - TEME -> PEF (pseudo Earth-fixed) is a rotation about the true pole by GMST of the IAU 1982
//   definition (Aoki et al. 1982; Vallado 4th ed. eq. 3-47), the angle the method itself uses:
//   r_PEF = R3(GMST82) r_TEME, v_PEF = R3(GMST82) v_TEME - omega x r_PEF.
// - PEF -> ITRF by polar motion (frames.ts W), so TEME <-> ITRF needs no nutation theory: this
//   is the route the paper recommends, and its accuracy is that of UT1 and polar motion.
// - TEME <-> GCRF goes through PEF, treated as the TIRS of the IAU 2006/2000B chain in frames.ts.
//   PEF and TIRS share the pole and differ only in the nutation theory behind it: the 1980
//   nutation the element sets were fitted under and IAU 2000 differ by tens of mas, well below
//   the ~1 km error of the SGP4 method itself (Vallado et al. 2006 discuss the same ambiguity of
//   TEME; common practice, no source). Measured on Vallado 4th ed. Ex. 3-15 in the tests.
// - omega: the Earth rotation rate of frames.ts (7.292115146706979e-5 rad/s, the value Vallado's
//   TEME conversion uses, from memory); the slow turn of TEME itself (precession, < 1e-11 rad/s)
//   is neglected, as in frames.ts: < 0.5 mm/s at GEO.

import { SECONDS_PER_DAY, TWO_PI } from '../core/math.js';
import type { Vec3 } from '../core/vec3.js';
import { julianCenturiesTT } from '../time/time.js';
import { eopAt } from '../time/eop.js';
import {
  EARTH_ROTATION_RATE_RAD_S, gcrfToItrf, itrfToGcrf, itrfToGcrfBatch, itrfToGcrfTabled, gcrfToItrfBatch, orientationTable, polarMotionMatrix,
  tioLocator, ut1MinusTT, type BatchOptions, type FrameOptions, type OrientationTable, type StateVectors,
} from './frames.js';
import { apply, applyT } from './mat3.js';

/**
 * Greenwich mean sidereal time of the IAU 1982 definition, rad [0, 2pi), from UT1 days since
 * J2000.0 (JD_UT1 - 2451545.0): 67310.54841 s + (876600 h + 8640184.812866 s) T + 0.093104 s T^2
 * - 6.2e-6 s T^3, T in Julian centuries of UT1 (Vallado 4th ed. eq. 3-47, from memory). The
 * 876600 h T term is 86400 s per day: taken as the fraction of the day, so no digits are lost.
 */
export function gmst1982(ut1Days: number): number {
  const t = ut1Days / 36_525;
  const frac = ut1Days - Math.floor(ut1Days);
  const seconds = 67_310.548_41 + SECONDS_PER_DAY * frac + t * (8_640_184.812_866 + t * (0.093_104 - 6.2e-6 * t));
  const turns = seconds / SECONDS_PER_DAY;
  return TWO_PI * (turns - Math.floor(turns));
}

/** GMST 1982 (rad) at a TT epoch, UT1 from the options as frames.ts takes it (dut1, else the EOP table, else UT1 = UTC). */
export const gmst1982At = (tt: number, opts: FrameOptions = {}): number => gmst1982((tt + ut1MinusTT(tt, opts)) / SECONDS_PER_DAY);

/** TEME -> PEF at sidereal angle theta (rad): R3(theta) and the transport term. */
export function temeToPef(theta: number, r: Vec3, v: Vec3): StateVectors {
  const c = Math.cos(theta);
  const s = Math.sin(theta);
  const om = EARTH_ROTATION_RATE_RAD_S;
  const rp: Vec3 = [c * r[0] + s * r[1], -s * r[0] + c * r[1], r[2]];
  return { r: rp, v: [c * v[0] + s * v[1] + om * rp[1], -s * v[0] + c * v[1] - om * rp[0], v[2]] };
}

/** PEF -> TEME at sidereal angle theta (rad): the exact inverse of temeToPef. */
export function pefToTeme(theta: number, r: Vec3, v: Vec3): StateVectors {
  const c = Math.cos(theta);
  const s = Math.sin(theta);
  const om = EARTH_ROTATION_RATE_RAD_S;
  const vt0 = v[0] - om * r[1];
  const vt1 = v[1] + om * r[0];
  return { r: [c * r[0] - s * r[1], s * r[0] + c * r[1], r[2]], v: [c * vt0 - s * vt1, s * vt0 + c * vt1, v[2]] };
}

/** The polar-motion matrix W (PEF -> ITRF) at tt, chosen as frames.ts chooses it: `polarMotion`, else the EOP table where it covers tt, else none. */
function polarMotionAt(tt: number, opts: FrameOptions): ReturnType<typeof polarMotionMatrix> | undefined {
  const e = !opts.polarMotion && opts.eop ? eopAt(opts.eop, tt) : undefined;
  const pm = opts.polarMotion ?? (e?.covered === true ? { xp: e.xp, yp: e.yp } : undefined);
  return pm ? polarMotionMatrix(pm.xp, pm.yp, tioLocator(julianCenturiesTT(tt))) : undefined;
}

/** Options for the GCRF side: polar motion pinned to zero, so frames.ts's ITRF is our PEF (up to s', a few um). */
const pefOptions = <T extends FrameOptions>(opts: T): T => ({ ...opts, polarMotion: { xp: 0, yp: 0 } });

/** R3(s') with s' the TIO locator: what frames.ts applies between TIRS and ITRF when polar motion is zero. */
const tioMatrix = (tt: number) => polarMotionMatrix(0, 0, tioLocator(julianCenturiesTT(tt)));

/** TEME -> ITRF at a TT epoch (velocity relative to the rotating Earth). Polar motion from `polarMotion` when given, else neglected (~10 m at LEO). */
export function temeToItrf(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  const p = temeToPef(gmst1982At(tt, opts), r, v);
  const w = polarMotionAt(tt, opts);
  return w ? { r: apply(w, p.r), v: apply(w, p.v) } : p;
}

/** ITRF -> TEME; the exact inverse of temeToItrf. */
export function itrfToTeme(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  const w = polarMotionAt(tt, opts);
  const p = w ? { r: applyT(w, r), v: applyT(w, v) } : { r, v };
  return pefToTeme(gmst1982At(tt, opts), p.r, p.v);
}

/** TEME -> GCRF at a TT epoch: through PEF and the IAU 2006/2000B chain of frames.ts (see the header). */
export function temeToGcrf(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  const p = temeToPef(gmst1982At(tt, opts), r, v);
  const s = tioMatrix(tt);
  return itrfToGcrf(tt, apply(s, p.r), apply(s, p.v), pefOptions(opts));
}

/** GCRF -> TEME; the inverse of temeToGcrf. */
export function gcrfToTeme(tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  const e = gcrfToItrf(tt, r, v, pefOptions(opts));
  const s = tioMatrix(tt);
  return pefToTeme(gmst1982At(tt, opts), applyT(s, e.r), applyT(s, e.v));
}

/** An orientation table of frames.ts for temeToGcrfTabled over [startTT, stopTT]. */
export const temeOrientationTable = (startTT: number, stopTT: number, opts: FrameOptions = {}): OrientationTable =>
  orientationTable(startTT, stopTT, pefOptions(opts));

/** temeToGcrf through a table made by temeOrientationTable with the same options (fast path for many epochs). */
export function temeToGcrfTabled(table: OrientationTable, tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  const p = temeToPef(gmst1982At(tt, opts), r, v);
  const s = tioMatrix(tt);
  return itrfToGcrfTabled(table, tt, apply(s, p.r), apply(s, p.v));
}

function eachState(states: Float64Array, f: (k: number, r: Vec3, v: Vec3) => StateVectors): Float64Array {
  const out = new Float64Array(states.length);
  for (let k = 0, o = 0; o < states.length; k++, o += 6) {
    const s = f(k, [states[o]!, states[o + 1]!, states[o + 2]!], [states[o + 3]!, states[o + 4]!, states[o + 5]!]);
    out[o] = s.r[0]; out[o + 1] = s.r[1]; out[o + 2] = s.r[2];
    out[o + 3] = s.v[0]; out[o + 4] = s.v[1]; out[o + 5] = s.v[2];
  }
  return out;
}

/** Many TEME states (6 per epoch) -> GCRF, through an orientation table of frames.ts (sub-mm, see there). */
export function temeToGcrfBatch(epochs: Float64Array, states: Float64Array, opts: BatchOptions = {}): Float64Array {
  if (states.length !== 6 * epochs.length) throw new RangeError('states must hold 6 numbers per epoch');
  const pef = eachState(states, (k, r, v) => {
    const p = temeToPef(gmst1982At(epochs[k]!, opts), r, v);
    const s = tioMatrix(epochs[k]!);
    return { r: apply(s, p.r), v: apply(s, p.v) };
  });
  return itrfToGcrfBatch(epochs, pef, pefOptions(opts));
}

/** Many GCRF states -> TEME; the inverse of temeToGcrfBatch (same table). */
export function gcrfToTemeBatch(epochs: Float64Array, states: Float64Array, opts: BatchOptions = {}): Float64Array {
  const e = gcrfToItrfBatch(epochs, states, pefOptions(opts));
  return eachState(e, (k, r, v) => {
    const s = tioMatrix(epochs[k]!);
    return pefToTeme(gmst1982At(epochs[k]!, opts), applyT(s, r), applyT(s, v));
  });
}
