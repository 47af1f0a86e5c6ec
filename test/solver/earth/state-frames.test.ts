import { describe, expect, it } from 'vitest';
import { gcrfToItrf } from '../../../src/solver/earth/frames.js';
import { temeToGcrf } from '../../../src/solver/earth/teme.js';
import { earthFixedToGeodetic } from '../../../src/solver/earth/geodetic.js';
import { accelerationToGcrf, nodesToGcrf, stateFromGcrf, stateToGcrf } from '../../../src/solver/earth/state-frames.js';
import type { Vec3 } from '../../../src/solver/core/vec3.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { expectClose, expectVecClose } from '../../helpers/approx.js';

const tt = (iso: string): number => {
  const r = parseUtcIso(iso);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const T = tt('2026-12-01T06:30:00Z');
const MU = 398_600.4418;
const ARCSEC = Math.PI / 648_000;
const norm = (x: readonly number[]): number => Math.hypot(x[0]!, x[1]!, x[2]!);

describe('state frames -> GCRF', () => {
  it('Vallado 4th ed. Example 3-3 (from memory): the Earth-fixed position given as itrf comes back at 34.352496 N, 46.446417 E, 5085.22 km', () => {
    const rItrf: Vec3 = [6524.834, 6862.875, 6448.296];
    const g = stateToGcrf('itrf', T, rItrf, [0, 0, 0]);
    const back = stateFromGcrf('itrf', T, g.r, g.v);
    const geo = earthFixedToGeodetic(back.r);
    expectClose(geo.latitude * 180 / Math.PI, 34.352496, 1e-6, 'latitude deg');
    expectClose(geo.longitude * 180 / Math.PI, 46.446417, 1e-6, 'longitude deg');
    expectClose(geo.height, 5085.22, 0.005, 'height km');
  });

  it('itrf -> gcrf -> itrf gives the state back to 1 mm and 1 um/s, and the GCRF state is a rotation of it (same radius)', () => {
    const r: Vec3 = [-4400.594, 1932.870, 4760.712];
    const v: Vec3 = [-1.5, -6.9, 1.3]; // relative to the rotating Earth (invented GNSS fix)
    for (const t of [T, T + 43_200, tt('2030-06-15T00:00:00Z')]) {
      const g = stateToGcrf('itrf', t, r, v, { dut1: 0.1 });
      expectClose(norm(g.r), norm(r), 1e-9, 'radius');
      const back = stateFromGcrf('itrf', t, g.r, g.v, { dut1: 0.1 });
      expectVecClose(back.r, r, 1e-6, 'r');
      expectVecClose(back.v, v, 1e-9, 'v');
    }
  });

  it('an Earth-fixed velocity of zero is the inertial speed w x r of the ground (w = 7.292115e-5 rad/s; IERS Conventions 2010 eq. 5.15)', () => {
    const r: Vec3 = [6378.137, 0, 0];
    const g = stateToGcrf('itrf', T, r, [0, 0, 0]);
    expectClose(norm(g.v), 7.292_115_146_7e-5 * 6378.137, 1e-6, 'ground speed km/s');
  });

  it('eme2000 -> gcrf undoes the frame bias: to first order the small rotation by xi0 = -0.0166170", eta0 = -0.0068192", da0 = -0.01460" (IERS Conventions 2003 sec. 5.4.4)', () => {
    const [xi0, eta0, da0] = [-0.016617 * ARCSEC, -0.0068192 * ARCSEC, -0.0146 * ARCSEC];
    // B ~ I + [[0, da0, -xi0], [-da0, 0, -eta0], [xi0, eta0, 0]] (small-angle rotation R1(-eta0) R2(xi0) R3(da0)), GCRF -> EME2000.
    const bias = (x: readonly number[]): Vec3 => [x[0]! + da0 * x[1]! - xi0 * x[2]!, -da0 * x[0]! + x[1]! - eta0 * x[2]!, xi0 * x[0]! + eta0 * x[1]! + x[2]!];
    const rG: Vec3 = [42_164, 0, 0];
    const e = stateFromGcrf('eme2000', T, rG, [0, 3.0746, 0]);
    expectVecClose(e.r, bias(rG), 1e-9, 'r EME2000');
    expect(norm([e.r[0] - rG[0], e.r[1] - rG[1], e.r[2] - rG[2]])).toBeGreaterThan(0.004); // ~4.5 m at GEO
    const back = stateToGcrf('eme2000', T, e.r, e.v);
    expectVecClose(back.r, rG, 1e-9, 'back');
    expect(stateToGcrf('icrf', T, rG, [0, 1, 0]).r).toEqual(rG);
  });

  it('an acceleration given in ITRF (found here by differencing ITRF velocities of a two-body orbit) comes back as -mu r / r^3 in GCRF', () => {
    const r0: Vec3 = [7000, 300, -1200];
    const v0: Vec3 = [0.4, 6.2, 4.1];
    // Two-body motion near t = 0 by its Taylor expansion r(t) = r0 + v0 t + a0 t^2 / 2 + j0 t^3 / 6 (jerk j0 = -mu (v0 / r^3 - 3 (r.v) r / r^5)).
    const rr = norm(r0);
    const a0: Vec3 = [0, 1, 2].map((i) => -MU * r0[i]! / rr ** 3) as unknown as Vec3;
    const rv = r0[0] * v0[0] + r0[1] * v0[1] + r0[2] * v0[2];
    const j0 = r0.map((x, i) => -MU * (v0[i]! / rr ** 3 - (3 * rv * x) / rr ** 5));
    const at = (t: number) => ({
      r: r0.map((x, i) => x + v0[i]! * t + a0[i]! * t * t / 2 + j0[i]! * t ** 3 / 6) as unknown as Vec3,
      v: v0.map((x, i) => x + a0[i]! * t + j0[i]! * t * t / 2) as unknown as Vec3,
    });
    const h = 0.5;
    const plus = gcrfToItrf(T + h, at(h).r, at(h).v);
    const minus = gcrfToItrf(T - h, at(-h).r, at(-h).v);
    const mid = gcrfToItrf(T, r0, v0);
    const aItrf = [0, 1, 2].map((i) => (plus.v[i]! - minus.v[i]!) / (2 * h)) as unknown as Vec3;
    const aG = accelerationToGcrf('itrf', T, mid.r, mid.v, aItrf);
    expectVecClose(aG, a0, 2e-9, 'a GCRF');
    // without the rotating-frame terms it would be off by ~2 w v ~ 1e-3 km/s^2
    const naive = stateToGcrf('itrf', T, aItrf, [0, 0, 0]).r;
    expect(norm([naive[0] - a0[0], naive[1] - a0[1], naive[2] - a0[2]])).toBeGreaterThan(1e-4);
  });

  it('nodesToGcrf converts each node at its own epoch and leaves GCRF nodes alone', () => {
    const epochs = Float64Array.of(T, T + 3600);
    const states = Float64Array.of(6524.834, 6862.875, 6448.296, 0, 0, 0, 6524.834, 6862.875, 6448.296, 0, 0, 0);
    const out = nodesToGcrf('itrf', epochs, states, null);
    expect(out.states).not.toBe(states);
    expect(out.states[0]).not.toBeCloseTo(out.states[6]!, 0); // the Earth turned 15 deg
    expect(nodesToGcrf('gcrf', epochs, states, null).states).toBe(states);
  });

  it('nodesToGcrf through its orientation table agrees with the exact conversion of each node to 1 mm, 1 um/s and 1e-12 km/s^2 over a day (itrf, teme; accelerations too)', () => {
    const n = 97;
    const epochs = Float64Array.from({ length: n }, (_, i) => T + 900 * i);
    const states = new Float64Array(6 * n);
    const acc = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      const u = 0.001 * i;
      states.set([7000 * Math.cos(u), 7000 * Math.sin(u), 1200, -0.8, 7.1, 1.9], 6 * i);
      acc.set([-0.0081 * Math.cos(u), -0.0081 * Math.sin(u), -0.0014], 3 * i);
    }
    for (const frame of ['itrf', 'teme'] as const) {
      const out = nodesToGcrf(frame, epochs, states, acc, { dut1: 0.2 });
      for (let i = 0; i < n; i++) {
        const r: Vec3 = [states[6 * i]!, states[6 * i + 1]!, states[6 * i + 2]!];
        const v: Vec3 = [states[6 * i + 3]!, states[6 * i + 4]!, states[6 * i + 5]!];
        const a: Vec3 = [acc[3 * i]!, acc[3 * i + 1]!, acc[3 * i + 2]!];
        const exact = frame === 'itrf' ? stateToGcrf('itrf', epochs[i]!, r, v, { dut1: 0.2 }) : temeToGcrf(epochs[i]!, r, v, { dut1: 0.2 });
        const ae = frame === 'itrf' ? accelerationToGcrf('itrf', epochs[i]!, r, v, a, { dut1: 0.2 }) : temeToGcrf(epochs[i]!, a, [0, 0, 0], { dut1: 0.2 }).r;
        expectVecClose([...out.states.subarray(6 * i, 6 * i + 3)], exact.r, 1e-6, `${frame} r ${i}`);
        expectVecClose([...out.states.subarray(6 * i + 3, 6 * i + 6)], exact.v, 1e-9, `${frame} v ${i}`);
        expectVecClose([...out.accelerations!.subarray(3 * i, 3 * i + 3)], ae, 1e-12, `${frame} a ${i}`);
      }
    }
  });
});
