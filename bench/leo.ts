// Shared by the search benches (passes, eclipses): an invented LEO spacecraft on a closed-form
// circular orbit (no propagator file needed), and the bare Earth-fixed track of a window at a
// given step (propagate + GCRF -> ITRF), the baseline those benches measure against.

import { gcrfToItrfBatch } from '../src/solver/earth/frames.js';
import type { StateAt } from '../src/solver/propagation/state-source.js';
import type { Vec3 } from '../src/solver/core/vec3.js';

const DEG = Math.PI / 180;
const MU = 398_600.4418;

/** Circular orbit 520 km up at the inclination (deg), RAAN 0.8 rad, argument of latitude 0 at t0. */
export function circularLeo(t0: number, inclinationDeg: number): StateAt {
  const a = 6378.137 + 520;
  const n = Math.sqrt(MU / a ** 3);
  const inc = inclinationDeg * DEG;
  const raan = 0.8;
  const p: Vec3 = [Math.cos(raan), Math.sin(raan), 0];
  const q: Vec3 = [-Math.sin(raan) * Math.cos(inc), Math.cos(raan) * Math.cos(inc), Math.sin(inc)];
  return (t) => {
    const u = n * (t - t0);
    const [c, s] = [Math.cos(u), Math.sin(u)];
    return {
      r: [a * (c * p[0] + s * q[0]), a * (c * p[1] + s * q[1]), a * (c * p[2] + s * q[2])],
      v: [a * n * (-s * p[0] + c * q[0]), a * n * (-s * p[1] + c * q[1]), a * n * (-s * p[2] + c * q[2])],
    };
  };
}

/** The bare Earth-fixed track of [t0, t0 + windowS] every stepS; returns a number of it (kept from being optimised away). */
export function bareEarthFixedTrack(stateAt: StateAt, t0: number, windowS: number, stepS: number): number {
  const count = Math.ceil(windowS / stepS) + 1;
  const epochs = new Float64Array(count);
  const states = new Float64Array(6 * count);
  for (let k = 0; k < count; k++) {
    const t = Math.min(t0 + k * stepS, t0 + windowS);
    epochs[k] = t;
    const s = stateAt(t) as { r: Vec3; v: Vec3 };
    states.set(s.r, 6 * k);
    states.set(s.v, 6 * k + 3);
  }
  return gcrfToItrfBatch(epochs, states)[6 * count - 6]!;
}
