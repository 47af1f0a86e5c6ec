// The SGP4/SDP4 method: mean elements of a catalogue element set (two-line set or CCSDS OMM with
// MEAN_ELEMENT_THEORY = SGP4) -> TEME states (Hoots & Roehrich, Spacetrack Report No. 3, 1980;
// Vallado, Crawford, Hujsak & Kelso, "Revisiting Spacetrack Report #3", AIAA 2006-6753, with the
// WGS-72 constants the method prescribes and its 'improved' operation mode). The core computation
// is the registry library satellite.js (a port of the paper's reference code), checked against
// the paper's whole verification set in test/solver/propagation/sgp4-verification.test.ts; the
// element parsing (src/formats/tle.ts, omm.ts), the time scales, the frames (earth/teme.ts) and
// the error reporting are ours.
// Time: the method's time since epoch is elapsed time, taken here as the difference of TT epochs
// (across a leap second that is the physical interval, not the UTC clock difference).

import { json2satrec, sgp4, twoline2satrec, type OMMJsonObject, type SatRec } from 'satellite.js';
import { failure, success, type Outcome } from '../core/result.js';
import type { Vec3 } from '../core/vec3.js';
import { formatUtcIso } from '../time/time.js';
import type { BatchOptions, FrameOptions } from '../earth/frames.js';
import { temeOrientationTable, temeToGcrf, temeToGcrfBatch, temeToGcrfTabled } from '../earth/teme.js';

/** The fields of an OMM that SGP4 reads, as numbers (the standard's keywords and units: rev/day, deg, 1/earth radii). */
export interface Sgp4OmmFields {
  readonly OBJECT_NAME: string;
  readonly OBJECT_ID: string;
  /** ISO 8601 UTC to the millisecond (the library's initialisation reads no finer; see sgp4Init). */
  readonly EPOCH: string;
  readonly MEAN_MOTION: number;
  readonly ECCENTRICITY: number;
  readonly INCLINATION: number;
  readonly RA_OF_ASC_NODE: number;
  readonly ARG_OF_PERICENTER: number;
  readonly MEAN_ANOMALY: number;
  readonly NORAD_CAT_ID: number;
  readonly ELEMENT_SET_NO: number;
  readonly BSTAR: number;
  readonly MEAN_MOTION_DOT: number;
  readonly MEAN_MOTION_DDOT: number;
}

/** Plain data (it crosses to worker threads): where the mean elements come from, and their exact epoch. */
export interface Sgp4ElementSet {
  /** A verified two-line set (src/formats/tle.ts), or the OMM fields (src/formats/omm.ts). */
  readonly source: { readonly tle: { readonly line1: string; readonly line2: string } } | { readonly omm: Sgp4OmmFields };
  /** The element epoch, TT seconds since J2000 (exact: the time since epoch is measured from it). */
  readonly epochTT: number;
}

/** The method's error codes (Vallado et al. 2006, sgp4 return codes) and what they mean. */
export const SGP4_ERRORS: Readonly<Record<number, string>> = {
  1: 'mean eccentricity out of range [0, 1) (error 1)',
  2: 'mean motion below zero (error 2)',
  3: 'perturbed eccentricity out of range [0, 1] (error 3)',
  4: 'semi-latus rectum below zero (error 4)',
  5: 'epoch elements are sub-orbital (error 5)',
  6: 'satellite has decayed: the position is below the Earth radius (error 6)',
};

/** The method's state: initialised once per element set (Vallado et al. 2006, sgp4init). */
export function sgp4Init(set: Sgp4ElementSet): SatRec {
  // A TLE goes to the library's reader as the lines themselves (their columns are verified by
  // src/formats/tle.ts first): exactly the reference initialisation. An OMM goes as its numbers;
  // the library reads EPOCH to the millisecond, which moves only the epoch-dependent deep-space
  // initialisation (Sun and Moon, sidereal angle at epoch) by < 0.5 ms; the time since epoch is
  // measured from the exact epochTT.
  if ('tle' in set.source) return twoline2satrec(set.source.tle.line1, set.source.tle.line2);
  const o = set.source.omm;
  return json2satrec({ ...o, NORAD_CAT_ID: o.NORAD_CAT_ID, EPOCH: o.EPOCH } as unknown as OMMJsonObject, 'i');
}

/** Earth radius of the method's WGS-72 constants, km (Vallado et al. 2006, getgravconst wgs72). */
export const SGP4_EARTH_RADIUS_KM = 6378.135;

/** What the method derives from the mean elements at initialisation: the Brouwer mean semi-major axis (un-Kozai'd mean motion), and the regime. */
export function sgp4MeanOrbit(set: Sgp4ElementSet): { semiMajorAxisKm: number; regime: 'near-earth' | 'deep-space' } {
  const satrec = sgp4Init(set);
  return { semiMajorAxisKm: satrec.a * SGP4_EARTH_RADIUS_KM, regime: sgp4Regime(satrec) };
}

/** 'near-earth' (SGP4, period < 225 min) or 'deep-space' (SDP4), as the method chose at initialisation. */
export const sgp4Regime = (satrec: SatRec): 'near-earth' | 'deep-space' => (satrec.method === 'd' ? 'deep-space' : 'near-earth');

/**
 * TEME state at `tsinceMin` minutes from the element epoch, written to out[offset..offset+5]
 * (km, km/s). Returns 0, or the method's error code (SGP4_ERRORS); out is then untouched.
 */
export function sgp4Teme(satrec: SatRec, tsinceMin: number, out: Float64Array, offset = 0): number {
  const pv = sgp4(satrec, tsinceMin);
  if (!pv) return satrec.error || 1;
  out[offset] = pv.position.x;
  out[offset + 1] = pv.position.y;
  out[offset + 2] = pv.position.z;
  out[offset + 3] = pv.velocity.x;
  out[offset + 4] = pv.velocity.y;
  out[offset + 5] = pv.velocity.z;
  return 0;
}

/** The failure of the method at one epoch: coded, naming the epoch and the reason. */
export function sgp4Failure(code: number, tt: number, set: Sgp4ElementSet): Outcome<never> {
  const minutes = (tt - set.epochTT) / 60;
  return failure('sgp4-failed', `SGP4 stopped at ${formatUtcIso(tt)} (${minutes.toFixed(3)} min from the element epoch): ${SGP4_ERRORS[code] ?? `error ${code}`}`);
}

/** TEME states (6 per epoch, km, km/s) at TT epochs; the first epoch where the method fails ends it with 'sgp4-failed'. */
export function sgp4StatesTeme(set: Sgp4ElementSet, epochsTT: Float64Array, satrec: SatRec = sgp4Init(set)): Outcome<Float64Array> {
  const out = new Float64Array(6 * epochsTT.length);
  for (let k = 0; k < epochsTT.length; k++) {
    const tt = epochsTT[k]!;
    const code = sgp4Teme(satrec, (tt - set.epochTT) / 60, out, 6 * k);
    if (code !== 0) return sgp4Failure(code, tt, set);
  }
  return success(out);
}

/** GCRF states at TT epochs: SGP4 in TEME, then TEME -> GCRF through an orientation table (earth/teme.ts). */
export function sgp4StatesGcrf(set: Sgp4ElementSet, epochsTT: Float64Array, opts: BatchOptions = {}): Outcome<Float64Array> {
  const teme = sgp4StatesTeme(set, epochsTT);
  return teme.ok ? success(temeToGcrfBatch(epochsTT, teme.value, opts)) : teme;
}

/** The GCRF state at the element epoch (tsince 0): where the other models start from a catalogue orbit. Mean elements are not osculating. */
export function sgp4EpochState(set: Sgp4ElementSet, opts: FrameOptions = {}): Outcome<{ r: Vec3; v: Vec3; teme: { r: Vec3; v: Vec3 } }> {
  const out = new Float64Array(6);
  const code = sgp4Teme(sgp4Init(set), 0, out);
  if (code !== 0) return sgp4Failure(code, set.epochTT, set);
  const r: Vec3 = [out[0]!, out[1]!, out[2]!];
  const v: Vec3 = [out[3]!, out[4]!, out[5]!];
  const g = temeToGcrf(set.epochTT, r, v, opts);
  return success({ r: g.r, v: g.v, teme: { r, v } });
}

/** Where the method first fails in [startTT, stopTT]: the last good epoch (to 1 ms) and the failure; undefined when it never does. */
export interface Sgp4Stop {
  /** The last epoch where the method answers, TT (startTT when it fails at once). */
  readonly goodUntilTT: number;
  readonly failure: Outcome<never> & { readonly ok: false };
  /** TT epoch of the failure. */
  readonly failedTT: number;
}

/**
 * Scan [startTT, stopTT] every `stepS` seconds for the first epoch where SGP4 fails, then bisect
 * to 1 ms. A failure shorter than the step can be missed: a search that meets it then stops
 * with the failure itself (no passes listed), never with a wrong state.
 */
export function sgp4FirstStop(set: Sgp4ElementSet, startTT: number, stopTT: number, stepS = 30): Sgp4Stop | undefined {
  const satrec = sgp4Init(set);
  const out = new Float64Array(6);
  const codeAt = (tt: number): number => sgp4Teme(satrec, (tt - set.epochTT) / 60, out);
  let code = codeAt(startTT);
  if (code !== 0) return { goodUntilTT: startTT, failedTT: startTT, failure: sgp4Failure(code, startTT, set) as Sgp4Stop['failure'] };
  let good = startTT;
  while (good < stopTT) {
    const next = Math.min(stopTT, good + stepS);
    code = codeAt(next);
    if (code !== 0) {
      let bad = next;
      let badCode = code;
      while (bad - good > 1e-3) {
        const mid = 0.5 * (good + bad);
        const c = codeAt(mid);
        if (c === 0) good = mid;
        else { bad = mid; badCode = c; }
      }
      return { goodUntilTT: good, failedTT: bad, failure: sgp4Failure(badCode, bad, set) as Sgp4Stop['failure'] };
    }
    good = next;
  }
  return undefined;
}

/** A GCRF state at any epoch of [startTT, stopTT] (for the pass and eclipse searches), rotated through one orientation table. */
export function sgp4StateFunction(set: Sgp4ElementSet, startTT: number, stopTT: number, opts: FrameOptions = {}): (tt: number) => Outcome<{ r: Vec3; v: Vec3 }> {
  const satrec = sgp4Init(set);
  const table = temeOrientationTable(Math.min(startTT, stopTT), Math.max(startTT, stopTT), opts);
  const out = new Float64Array(6);
  return (tt) => {
    const code = sgp4Teme(satrec, (tt - set.epochTT) / 60, out);
    if (code !== 0) return sgp4Failure(code, tt, set);
    return success(temeToGcrfTabled(table, tt, [out[0]!, out[1]!, out[2]!], [out[3]!, out[4]!, out[5]!], opts));
  };
}
