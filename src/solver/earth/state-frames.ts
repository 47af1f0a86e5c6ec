// States given in other frames, brought to GCRF (and back), for orbit inputs and ephemeris nodes.
//   gcrf, icrf  the service's inertial frame (ICRF axes with the Earth's centre as origin: GCRF)
//   eme2000     J2000 mean equator and equinox: r_GCRF = B^T r_EME2000 with the frame bias B
//               (IERS Conventions 2010 sec. 5.4.4; 23 mas, 0.75 m at 7000 km)
//   itrf        Earth-fixed, velocity relative to the rotating Earth (as GNSS receivers give it),
//               converted at the state's own epoch by frames.ts
//   teme        true equator, mean equinox (the frame of SGP4 output), through PEF by teme.ts
// Accelerations (ephemeris nodes): inertial frames rotate them like positions; from ITRF
// a_GCRF = M (a - w^2 r_perp) + 2 dM/dt v, with M the ITRF -> GCRF rotation, w the Earth rotation
// rate and r_perp the position's part normal to the rotation axis (the centripetal and Coriolis
// terms of the rotating frame; Vallado 4th ed. sec. 3.7, from memory). The axis is taken as the
// ITRF z axis there: polar motion (< 3e-6 rad) changes that term by < 1e-10 km/s^2.

import type { Vec3 } from '../core/vec3.js';
import { EARTH_ROTATION_RATE_RAD_S, FRAME_BIAS, gcrfToItrf, itrfToGcrf, itrfToGcrfTabled, orientationTable, type FrameOptions, type Mat3, type StateVectors } from './frames.js';
import { gcrfToTeme, temeOrientationTable, temeToGcrf, temeToGcrfTabled } from './teme.js';

export const STATE_FRAMES = ['gcrf', 'icrf', 'eme2000', 'itrf', 'teme'] as const;
export type StateFrame = (typeof STATE_FRAMES)[number];

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

/** A state in `frame` at TT epoch `tt` -> GCRF. */
export function stateToGcrf(frame: StateFrame, tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  switch (frame) {
    case 'gcrf':
    case 'icrf':
      return { r, v };
    case 'eme2000':
      return { r: applyT(FRAME_BIAS, r), v: applyT(FRAME_BIAS, v) };
    case 'itrf':
      return itrfToGcrf(tt, r, v, opts);
    case 'teme':
      return temeToGcrf(tt, r, v, opts);
  }
}

/** A GCRF state -> `frame` at TT epoch `tt`; the inverse of stateToGcrf. */
export function stateFromGcrf(frame: StateFrame, tt: number, r: Vec3, v: Vec3, opts: FrameOptions = {}): StateVectors {
  switch (frame) {
    case 'gcrf':
    case 'icrf':
      return { r, v };
    case 'eme2000':
      return { r: apply(FRAME_BIAS, r), v: apply(FRAME_BIAS, v) };
    case 'itrf':
      return gcrfToItrf(tt, r, v, opts);
    case 'teme':
      return gcrfToTeme(tt, r, v, opts);
  }
}

/** An acceleration (km/s^2) at a state in `frame` -> GCRF. */
export function accelerationToGcrf(frame: StateFrame, tt: number, r: Vec3, v: Vec3, a: Vec3, opts: FrameOptions = {}): Vec3 {
  // Inertial and quasi-inertial frames (TEME turns with precession-nutation only) rotate it like a position.
  if (frame !== 'itrf') return stateToGcrf(frame, tt, a, [0, 0, 0], opts).r;
  const w2 = EARTH_ROTATION_RATE_RAD_S * EARTH_ROTATION_RATE_RAD_S;
  // itrfToGcrf maps (x, y) to (M x, M y + dM/dt x): with x = 2 v, y = a - w^2 r_perp its second part is the answer.
  return itrfToGcrf(tt, [2 * v[0], 2 * v[1], 2 * v[2]], [a[0] - w2 * r[0], a[1] - w2 * r[1], a[2]], opts).v;
}

/** Frames of ephemeris nodes: the state frames (an operator's OEM may be in any of them). */
export type NodeFrame = StateFrame;

/**
 * Many states (6 per epoch) and optional accelerations (3 per epoch) in `frame` -> GCRF, each at its
 * own epoch. ITRF and TEME go through an orientation table of frames.ts over the nodes' span (Q, W
 * and UT1 interpolated between hourly nodes: sub-mm, measured there), so a file of 100,000 nodes
 * costs no nutation series per node. TEME accelerations are rotated like positions (TEME turns
 * with precession-nutation only, < 1e-11 rad/s: its frame terms are far below 1e-12 km/s^2).
 */
export function nodesToGcrf(
  frame: NodeFrame, epochsTT: Float64Array, states: Float64Array, accelerations: Float64Array | null, opts: FrameOptions = {},
): { states: Float64Array; accelerations: Float64Array | null } {
  if (frame === 'gcrf' || frame === 'icrf') return { states, accelerations };
  const n = epochsTT.length;
  if (states.length !== 6 * n || (accelerations && accelerations.length !== 3 * n)) throw new RangeError('6 state numbers (and 3 accelerations) per epoch');
  const out = new Float64Array(states.length);
  const acc = accelerations ? new Float64Array(accelerations.length) : null;
  if (n === 0) return { states: out, accelerations: acc };
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of epochsTT) { lo = Math.min(lo, t); hi = Math.max(hi, t); }
  const table = frame === 'itrf' ? orientationTable(lo, hi, opts) : frame === 'teme' ? temeOrientationTable(lo, hi, opts) : undefined;
  const w2 = EARTH_ROTATION_RATE_RAD_S * EARTH_ROTATION_RATE_RAD_S;
  for (let k = 0; k < n; k++) {
    const o = 6 * k;
    const tt = epochsTT[k]!;
    const r: Vec3 = [states[o]!, states[o + 1]!, states[o + 2]!];
    const v: Vec3 = [states[o + 3]!, states[o + 4]!, states[o + 5]!];
    const a: Vec3 | undefined = accelerations ? [accelerations[3 * k]!, accelerations[3 * k + 1]!, accelerations[3 * k + 2]!] : undefined;
    let g: StateVectors;
    let ag: Vec3 | undefined;
    if (frame === 'eme2000') {
      g = { r: applyT(FRAME_BIAS, r), v: applyT(FRAME_BIAS, v) };
      ag = a && applyT(FRAME_BIAS, a);
    } else if (frame === 'itrf') {
      g = itrfToGcrfTabled(table!, tt, r, v);
      // As accelerationToGcrf: (x, y) -> (M x, M y + dM/dt x) with x = 2 v, y = a - w^2 r_perp.
      ag = a && itrfToGcrfTabled(table!, tt, [2 * v[0], 2 * v[1], 2 * v[2]], [a[0] - w2 * r[0], a[1] - w2 * r[1], a[2]]).v;
    } else {
      g = temeToGcrfTabled(table!, tt, r, v, opts);
      ag = a && temeToGcrfTabled(table!, tt, a, [0, 0, 0], opts).r;
    }
    out.set(g.r, o);
    out.set(g.v, o + 3);
    if (acc && ag) acc.set(ag, 3 * k);
  }
  return { states: out, accelerations: acc };
}
