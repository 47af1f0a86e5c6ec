import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { stumpffC, stumpffS } from '../../../src/solver/conic/stumpff.js';
import { conservationDrift, propagate, propagateGrid } from '../../../src/solver/conic/universal.js';
import type { Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';
import { ellipseReference, hyperbolaReference, parabolaReference, stateFromElements } from '../../helpers/two-body-reference.js';

const MU_CURTIS = 398_600; // Curtis 3rd ed. uses 398 600 km^3/s^2 in its examples
const MU_EARTH = 398_600.4418; // WGS-84 / EGM-96 value (common practice, no source)

const norm = (a: ArrayLike<number>, o = 0): number => Math.hypot(a[o]!, a[o + 1]!, a[o + 2]!);
const state = (r0: Vec3, v0: Vec3, mu: number, dt: number): { r: Vec3; v: Vec3 } => {
  const out = propagate(r0, v0, mu, dt);
  if (!out.ok) throw new Error(`${out.code}: ${out.message}`);
  return out.value;
};
/** Largest component difference of position and velocity, each relative to its vector's size. */
function relativeError(got: { r: ArrayLike<number>; v: ArrayLike<number> }, want: { r: ArrayLike<number>; v: ArrayLike<number> }): number {
  let worst = 0;
  for (let c = 0; c < 3; c++) {
    worst = Math.max(worst, Math.abs(got.r[c]! - want.r[c]!) / norm(want.r), Math.abs(got.v[c]! - want.v[c]!) / norm(want.v));
  }
  return worst;
}
const periodOf = (r0: Vec3, v0: Vec3, mu: number): number => {
  const a = 1 / (2 / norm(r0) - (v0[0] ** 2 + v0[1] ** 2 + v0[2] ** 2) / mu);
  return 2 * Math.PI * Math.sqrt((a * a * a) / mu);
};

// An invented low orbit: 400 km altitude, slightly eccentric, inclined.
const LEO_R: Vec3 = [6778.137, 0, 0];
const LEO_V: Vec3 = [0.012, 7.6686 * Math.cos(0.9), 7.6686 * Math.sin(0.9)];

describe('Stumpff functions', () => {
  it('C(0) = 1/2 and S(0) = 1/6 (Curtis 3rd ed. sec. 3.7, series)', () => {
    expect(stumpffC(0)).toBe(0.5);
    expect(stumpffS(0)).toBe(1 / 6);
  });

  it('near z = 0 they match the first four series terms to 2 ulp (Curtis 3rd ed. sec. 3.7 series, from memory)', () => {
    for (const z of [1e-3, -1e-3, 1e-6, -1e-6, 3e-4, -7e-4]) {
      // C = 1/2 - z/24 + z^2/720 - z^3/40320; S = 1/6 - z/120 + z^2/5040 - z^3/362880 (next terms < 3e-19 here)
      expectRelClose(stumpffC(z), 1 / 2 - z / 24 + (z * z) / 720 - (z * z * z) / 40_320, 4.5e-16, `C(${z})`);
      expectRelClose(stumpffS(z), 1 / 6 - z / 120 + (z * z) / 5040 - (z * z * z) / 362_880, 4.5e-16, `S(${z})`);
    }
  });

  it('agree with the closed forms (Curtis 3rd ed. eqs. 3.52-3.53, from memory) away from zero, both signs, across the series switch', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 400, noNaN: true }), fc.boolean(), (mag, negative) => {
        const z = negative ? -mag : mag;
        const x = Math.sqrt(mag);
        const c = negative ? (Math.cosh(x) - 1) / mag : (1 - Math.cos(x)) / z;
        const s = negative ? (Math.sinh(x) - x) / (mag * x) : (x - Math.sin(x)) / (z * x);
        expectRelClose(stumpffC(z), c, 1e-14, `C(${z})`);
        expectRelClose(stumpffS(z), s, 1e-14, `S(${z})`);
      }),
    );
  });

  it('satisfy 1 - z C(z) = cos sqrt z (cosh sqrt(-z) for z < 0) (Battin rev. ed. ch. 4, from memory)', () => {
    fc.assert(
      fc.property(fc.double({ min: -60, max: 60, noNaN: true }), (z) => {
        const want = z >= 0 ? Math.cos(Math.sqrt(z)) : Math.cosh(Math.sqrt(-z));
        expectClose(1 - z * stumpffC(z), want, 4e-15 * Math.max(1, Math.abs(want)), `z = ${z}`);
      }),
    );
  });
});

describe('propagate(r0, v0, mu, dt)', () => {
  it('Curtis 3rd ed. Example 3.7 (from memory): r0 = (7000, -12124, 0) km, v0 = (2.6679, 4.6210, 0) km/s, 60 min later', () => {
    const { r, v } = state([7000, -12_124, 0], [2.6679, 4.621, 0], MU_CURTIS, 3600);
    // Book: r = (-3297.8, 7413.4, 0) km, printed to 0.1 km.
    expectClose(r[0], -3297.8, 0.05, 'x');
    expectClose(r[1], 7413.4, 0.05, 'y');
    expectClose(r[2], 0, 1e-9, 'z');
    // Book: v = (-8.2977, -0.96309, 0) km/s. Its f, g are rounded to ~5 figures, so the printed v is
    // itself off by ~1e-3 km/s (it changes |h| by 4e-5 relative); allow 2e-3 km/s.
    expectClose(v[0], -8.2977, 2e-3, 'vx');
    expectClose(v[1], -0.96309, 2e-3, 'vy');
  });

  it('Curtis 3rd ed. Example 3.6 (from memory): r0 = 10 000 km, v0 = 10 km/s, vr0 = 3.0752 km/s -> after 1 h, theta = 100.04 deg and chi = 128.5 km^0.5', () => {
    const vr = 3.0752;
    const r0: Vec3 = [10_000, 0, 0];
    const v0: Vec3 = [vr, Math.sqrt(100 - vr * vr), 0];
    const { r } = state(r0, v0, MU_CURTIS, 3600);
    // True anomaly from the orbit's own eccentricity and h (Curtis ch. 2-3 relations), not from the code.
    const h = r0[0] * v0[1];
    const alpha = 2 / 10_000 - 100 / MU_CURTIS;
    const e = Math.sqrt(1 - (alpha * h * h) / MU_CURTIS);
    const theta0 = Math.acos((h * h / (MU_CURTIS * 10_000) - 1) / e); // ~30 deg: vr > 0, so outbound
    const theta = theta0 + Math.atan2(r[1], r[0]);
    expectClose((theta * 180) / Math.PI, 100.04, 0.005, 'theta (deg)');
    // chi = sqrt(-a) (F - F0), tanh(F/2) = sqrt((e-1)/(e+1)) tan(theta/2) (Curtis 3rd ed. eqs. 3.44, 3.57, from memory).
    const F = (th: number): number => 2 * Math.atanh(Math.sqrt((e - 1) / (e + 1)) * Math.tan(th / 2));
    const chi = Math.sqrt(-1 / alpha) * (F(theta) - F(theta0));
    expectClose(chi, 128.5, 0.05, 'chi (km^0.5)');
  });

  it('Vallado 4th ed. Example 2-4 KEPLER (from memory): 40 min from r = (1131.340, -2282.343, 6672.423) km, v = (-5.64305, 4.30333, 2.42879) km/s', () => {
    const { r, v } = state([1131.34, -2282.343, 6672.423], [-5.64305, 4.30333, 2.42879], MU_EARTH, 40 * 60);
    // Book: r = (-4219.7527, 4363.0292, -3958.7666) km, v = (3.689866, -1.916735, -6.112511) km/s; half a printed digit allowed.
    const wantR = [-4219.7527, 4363.0292, -3958.7666];
    const wantV = [3.689866, -1.916735, -6.112511];
    for (let c = 0; c < 3; c++) {
      expectClose(r[c]!, wantR[c]!, 5e-5, `r[${c}]`);
      expectClose(v[c]!, wantV[c]!, 5e-7, `v[${c}]`);
    }
  });

  it('agrees with Kepler\'s equation in classical elements for random ellipses and hyperbolas, forwards and backwards (Vallado 4th ed. sec. 2.2-2.3)', () => {
    const orbit = fc.record({
      rp: fc.double({ min: 6600, max: 60_000, noNaN: true }),
      e: fc.oneof(fc.double({ min: 0.01, max: 0.9, noNaN: true }), fc.double({ min: 1.1, max: 4, noNaN: true })),
      inc: fc.double({ min: 0, max: Math.PI, noNaN: true }),
      raan: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
      argp: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
      nuFraction: fc.double({ min: -0.9, max: 0.9, noNaN: true }),
      dtFraction: fc.double({ min: -5, max: 5, noNaN: true }),
    });
    fc.assert(
      fc.property(orbit, ({ rp, e, inc, raan, argp, nuFraction, dtFraction }) => {
        const nuMax = e < 1 ? Math.PI : Math.acos(-1 / e);
        const s0 = stateFromElements(rp, e, inc, raan, argp, nuFraction * nuMax, MU_EARTH);
        const scaleS = 2 * Math.PI * Math.sqrt((rp / Math.abs(1 - e)) ** 3 / MU_EARTH);
        const dt = dtFraction * scaleS;
        const got = state(s0.r, s0.v, MU_EARTH, dt);
        const want = e < 1 ? ellipseReference(s0.r, s0.v, MU_EARTH, dt) : hyperbolaReference(s0.r, s0.v, MU_EARTH, dt);
        expect(relativeError(got, want)).toBeLessThan(1e-9);
      }),
    );
  });

  it('conserves energy and angular momentum to 1e-12 relative (two-body integrals; Curtis 3rd ed. ch. 2)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 6600, max: 40_000, noNaN: true }),
        fc.oneof(fc.double({ min: 0, max: 0.95, noNaN: true }), fc.double({ min: 1.05, max: 5, noNaN: true })),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        (rp, e, dt) => {
          const s0 = stateFromElements(rp, e, 0.7, 1.1, 2.3, 0.4, MU_EARTH);
          const s1 = state(s0.r, s0.v, MU_EARTH, dt);
          const drift = conservationDrift({ states: Float64Array.from([...s0.r, ...s0.v, ...s1.r, ...s1.v]) }, MU_EARTH);
          expect(drift.energy).toBeLessThan(1e-12);
          expect(drift.angularMomentum).toBeLessThan(1e-12);
          expect(drift.angularMomentumVector).toBeLessThan(1e-12);
        },
      ),
    );
  });

  it('moves a circular orbit by the angle n dt (uniform circular motion, common practice)', () => {
    const r = 7000;
    const v = Math.sqrt(MU_EARTH / r);
    const n = v / r;
    for (const dt of [-1e6, -3000, 1, 1234.5, 5e5]) {
      const got = state([r, 0, 0], [0, v * Math.cos(0.3), v * Math.sin(0.3)], MU_EARTH, dt);
      const angle = n * dt;
      const want = {
        r: [r * Math.cos(angle), r * Math.sin(angle) * Math.cos(0.3), r * Math.sin(angle) * Math.sin(0.3)],
        v: [-v * Math.sin(angle), v * Math.cos(angle) * Math.cos(0.3), v * Math.cos(angle) * Math.sin(0.3)],
      };
      // The error grows like eps * n dt (about 1e-16 of the angle travelled).
      expect(relativeError(got, want)).toBeLessThan(1e-13 * Math.max(1, Math.abs(angle)));
    }
  });

  it('composes: propagating t1 then t2 equals propagating t1 + t2 (property of the flow, common practice)', () => {
    fc.assert(
      fc.property(fc.double({ min: -2e4, max: 2e4, noNaN: true }), fc.double({ min: -2e4, max: 2e4, noNaN: true }), (t1, t2) => {
        const mid = state(LEO_R, LEO_V, MU_EARTH, t1);
        const twoSteps = state(mid.r, mid.v, MU_EARTH, t2);
        expect(relativeError(twoSteps, state(LEO_R, LEO_V, MU_EARTH, t1 + t2))).toBeLessThan(1e-10);
      }),
    );
  });

  it('returns to the initial state within 1 mm after 100 LEO orbits forward and back', () => {
    const span = 100 * periodOf(LEO_R, LEO_V, MU_EARTH);
    const out = state(LEO_R, LEO_V, MU_EARTH, span);
    const back = state(out.r, out.v, MU_EARTH, -span);
    for (let c = 0; c < 3; c++) {
      expectClose(back.r[c]!, LEO_R[c]!, 1e-6, `r[${c}] (km)`);
      expectClose(back.v[c]!, LEO_V[c]!, 1e-9, `v[${c}] (km/s)`);
    }
  });

  it('matches Barker\'s equation on an exact parabola (Curtis 3rd ed. eqs. 3.30-3.32, from memory), both directions', () => {
    const rp = 7000;
    const vp = Math.sqrt((2 * MU_EARTH) / rp);
    for (const t of [-86_400, -3600, -60, 1, 600, 3600, 86_400, 1e7]) {
      expect(relativeError(state([rp, 0, 0], [0, vp, 0], MU_EARTH, t), parabolaReference(rp, MU_EARTH, t))).toBeLessThan(1e-12);
    }
  });

  it('handles near-parabolic orbits (|1 - e| < 1e-6) smoothly on both sides of e = 1', () => {
    const rp = 7000;
    for (const de of [-9e-7, -1e-7, -1e-9, 1e-9, 1e-7, 9e-7]) {
      // Periapsis speed for e = 1 + de: v^2 = mu (1 + e)/rp (vis-viva at periapsis).
      const v0: Vec3 = [0, Math.sqrt((MU_EARTH * (2 + de)) / rp), 0];
      for (const t of [-7200, 600, 7200, 86_400]) {
        const got = state([rp, 0, 0], v0, MU_EARTH, t);
        // The orbit differs from the parabola by O(|1 - e|) over a day.
        expect(relativeError(got, parabolaReference(rp, MU_EARTH, t))).toBeLessThan(1e-5);
        const back = state(got.r, got.v, MU_EARTH, -t);
        expectClose(back.r[0], rp, 1e-6, `back to periapsis, de = ${de}, t = ${t}`);
        const drift = conservationDrift({ states: Float64Array.from([rp, 0, 0, ...v0, ...got.r, ...got.v]) }, MU_EARTH);
        expect(drift.energyVsPotential).toBeLessThan(1e-13);
        expect(drift.angularMomentum).toBeLessThan(1e-12);
      }
    }
  });

  it('agrees with an independent numerical integration (odex 2.0.4, Gragg-Bulirsch-Stoer) for a hyperbola and a near-parabola', () => {
    interface Odex {
      Solver: new (n: number) => {
        absoluteTolerance: number;
        relativeTolerance: number;
        maxSteps: number;
        solve(f: (x: number, y: number[]) => number[], x0: number, y0: number[], x1: number): { y: number[]; outcome: number };
      };
    }
    const odex = createRequire(import.meta.url)('odex') as Odex;
    const rhs = (_t: number, y: number[]): number[] => {
      const r3 = Math.hypot(y[0]!, y[1]!, y[2]!) ** 3;
      return [y[3]!, y[4]!, y[5]!, (-MU_EARTH * y[0]!) / r3, (-MU_EARTH * y[1]!) / r3, (-MU_EARTH * y[2]!) / r3];
    };
    const cases = [stateFromElements(7000, 1.8, 0.5, 0.3, 1.0, -0.8, MU_EARTH), stateFromElements(7000, 1 - 5e-7, 1.2, 2.0, 0.3, -1.5, MU_EARTH)];
    for (const s0 of cases) {
      const solver = new odex.Solver(6);
      solver.absoluteTolerance = 1e-13;
      solver.relativeTolerance = 1e-13;
      solver.maxSteps = 100_000;
      const result = solver.solve(rhs, 0, [...s0.r, ...s0.v], 20_000);
      expect(result.outcome).toBe(0);
      const want = { r: result.y.slice(0, 3), v: result.y.slice(3, 6) };
      expect(relativeError(state(s0.r, s0.v, MU_EARTH, 20_000), want)).toBeLessThan(1e-8);
    }
  });

  it('gives the initial state back unchanged for dt = 0', () => {
    const { r, v } = state(LEO_R, LEO_V, MU_EARTH, 0);
    expect([...r, ...v]).toEqual([...LEO_R, ...LEO_V]);
  });

  it('names the reason when it cannot propagate', () => {
    const code = (r: Vec3, v: Vec3, mu: number, dt: number): string => {
      const out = propagate(r, v, mu, dt);
      return out.ok ? 'ok' : out.code;
    };
    expect(code([0, 0, 0], [1, 0, 0], MU_EARTH, 10)).toBe('zero-position');
    expect(code([7000, 0, 0], [3, 0, 0], MU_EARTH, 10)).toBe('rectilinear-motion');
    expect(code([7000, 0, 0], [0, 0, 0], MU_EARTH, 10)).toBe('rectilinear-motion');
    expect(code([7000, 0, 0], [0, 7.5, 0], 0, 10)).toBe('invalid-parameter');
    expect(code([7000, 0, 0], [0, 7.5, 0], -1, 10)).toBe('invalid-parameter');
    expect(code([7000, 0, 0], [0, 7.5, 0], MU_EARTH, Number.NaN)).toBe('invalid-parameter');
    expect(code([7000, Number.NaN, 0], [0, 7.5, 0], MU_EARTH, 10)).toBe('invalid-parameter');
    // A hyperbola over 1.7e308 s: the state no longer fits in a double.
    expect(code([7000, 0, 0], [0, 12, 0], MU_EARTH, 1.7e308)).toBe('no-convergence');
  });
});

describe('propagateGrid(r0, v0, mu, dt, out)', () => {
  const gridOf = (r0: Vec3, v0: Vec3, mu: number, dt: Float64Array): Float64Array => {
    const out = new Float64Array(6 * dt.length);
    const result = propagateGrid(r0, v0, mu, dt, out);
    if (!result.ok) throw new Error(`${result.code}: ${result.message}`);
    return out;
  };
  const expectGridMatchesPropagate = (r0: Vec3, v0: Vec3, mu: number, dt: Float64Array, out: Float64Array, stride = 1): void => {
    let worst = 0;
    for (let i = 0; i < dt.length; i += stride) {
      const want = state(r0, v0, mu, dt[i]!);
      worst = Math.max(worst, relativeError({ r: out.subarray(6 * i, 6 * i + 3), v: out.subarray(6 * i + 3, 6 * i + 6) }, want));
    }
    expect(worst).toBeLessThan(1e-9);
  };
  const leoPeriod = periodOf(LEO_R, LEO_V, MU_EARTH);
  const uniform = (n: number, from: number, to: number): Float64Array => Float64Array.from({ length: n }, (_, i) => from + ((to - from) * i) / (n - 1));

  it('equals per-sample propagate to 1e-9 on a LEO grid of 10 000 samples per orbit over 10 orbits', () => {
    const dt = uniform(100_001, 0, 10 * leoPeriod);
    expectGridMatchesPropagate(LEO_R, LEO_V, MU_EARTH, dt, gridOf(LEO_R, LEO_V, MU_EARTH, dt), 97);
  });

  it('conserves energy and angular momentum over that grid to 1e-12 (conservationDrift)', () => {
    const drift = conservationDrift({ states: gridOf(LEO_R, LEO_V, MU_EARTH, uniform(100_001, 0, 10 * leoPeriod)) }, MU_EARTH);
    expect(drift.energy).toBeLessThan(1e-12);
    expect(drift.angularMomentum).toBeLessThan(1e-12);
    expect(drift.angularMomentumVector).toBeLessThan(1e-12);
  });

  it('gives the same states for shuffled and reversed times (any order is walked as given)', () => {
    const dt = uniform(5001, -3 * leoPeriod, 3 * leoPeriod);
    const sorted = gridOf(LEO_R, LEO_V, MU_EARTH, dt);
    const reversed = gridOf(LEO_R, LEO_V, MU_EARTH, dt.slice().reverse());
    const perm = Array.from({ length: dt.length }, (_, i) => (i * 7919) % dt.length); // 7919 is prime: a permutation
    const shuffled = gridOf(LEO_R, LEO_V, MU_EARTH, Float64Array.from(perm, (i) => dt[i]!));
    for (let k = 0; k < dt.length; k++) {
      for (let c = 0; c < 6; c++) {
        const want = sorted[6 * k + c]!;
        const scale = c < 3 ? 7000 : 8;
        expectClose(reversed[6 * (dt.length - 1 - k) + c]!, want, 1e-13 * scale, `reversed ${k}.${c}`);
        expectClose(shuffled[6 * perm.indexOf(k) + c]!, want, 1e-13 * scale, `shuffled ${k}.${c}`);
      }
    }
  });

  it('equals propagate for eccentric, sparse, near-parabolic and hyperbolic grids', () => {
    const cases: Array<[string, { r: Vec3; v: Vec3 }, Float64Array]> = [
      ['e = 0.7', stateFromElements(7000, 0.7, 1, 2, 3, 0.5, MU_EARTH), uniform(20_001, -2e5, 4e5)],
      ['e = 0.97, 40 samples per orbit', stateFromElements(7000, 0.97, 1, 2, 3, -0.5, MU_EARTH), uniform(401, 0, 10 * 1.35e6)],
      ['e = 0.9995 (solves chi per sample)', stateFromElements(7000, 0.9995, 1, 2, 3, 0.1, MU_EARTH), uniform(2001, -1e5, 1e5)],
      ['e = 1 - 1e-7', stateFromElements(7000, 1 - 1e-7, 0.3, 0.2, 0.1, 0, MU_EARTH), uniform(2001, -1e5, 1e5)],
      ['e = 1 + 1e-7', stateFromElements(7000, 1 + 1e-7, 0.3, 0.2, 0.1, 0, MU_EARTH), uniform(2001, -1e5, 1e5)],
      ['e = 2.5', stateFromElements(7000, 2.5, 0.3, 0.2, 0.1, -1, MU_EARTH), uniform(2001, -1e5, 1e6)],
      ['LEO, 7 samples per orbit', { r: LEO_R, v: LEO_V }, uniform(71, 0, 10 * leoPeriod)],
    ];
    for (const [label, s0, dt] of cases) {
      const out = gridOf(s0.r, s0.v, MU_EARTH, dt);
      expect(out.every(Number.isFinite), label).toBe(true);
      expectGridMatchesPropagate(s0.r, s0.v, MU_EARTH, dt, out);
    }
  });

  it('returns to the initial state within 1 mm after 100 LEO orbits forward and back', () => {
    const n = 100_001;
    const forward = gridOf(LEO_R, LEO_V, MU_EARTH, uniform(n, 0, 100 * leoPeriod));
    const o = 6 * (n - 1);
    const end: Vec3 = [forward[o]!, forward[o + 1]!, forward[o + 2]!];
    const endV: Vec3 = [forward[o + 3]!, forward[o + 4]!, forward[o + 5]!];
    const backward = gridOf(end, endV, MU_EARTH, uniform(n, 0, -100 * leoPeriod));
    for (let c = 0; c < 3; c++) {
      expectClose(backward[o + c]!, LEO_R[c]!, 1e-6, `r[${c}] (km)`);
      expectClose(backward[o + 3 + c]!, LEO_V[c]!, 1e-9, `v[${c}] (km/s)`);
    }
  });

  it('refuses a bad time offset with a code and a short output array by throwing', () => {
    const result = propagateGrid(LEO_R, LEO_V, MU_EARTH, Float64Array.from([0, Number.POSITIVE_INFINITY]), new Float64Array(12));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.code).toBe('invalid-parameter');
    expect(() => propagateGrid(LEO_R, LEO_V, MU_EARTH, new Float64Array(3), new Float64Array(17))).toThrow(RangeError);
    const radial = propagateGrid(LEO_R, [1, 0, 0], MU_EARTH, new Float64Array(1), new Float64Array(6));
    expect(radial.ok ? 'ok' : radial.code).toBe('rectilinear-motion');
  });
});

describe('conservationDrift(table, mu)', () => {
  it('reports a known change of speed as energy drift 2 dv/v and h drift dv/v (vis-viva, by hand)', () => {
    const r = 7000;
    const v = Math.sqrt(MU_EARTH / r);
    const k = 1 + 1e-6;
    const drift = conservationDrift({ states: Float64Array.from([r, 0, 0, 0, v, 0, r, 0, 0, 0, v * k, 0]) }, MU_EARTH);
    // eps0 = -v^2/2 on a circle; eps1 - eps0 = v^2 (k^2 - 1)/2, so the relative drift is k^2 - 1.
    expectRelClose(drift.energy, k * k - 1, 1e-8, 'energy');
    expectRelClose(drift.energyVsPotential, (k * k - 1) / 2, 1e-8, 'energy vs potential');
    expectRelClose(drift.angularMomentum, 1e-6, 1e-8, 'h');
    expect(conservationDrift({ states: new Float64Array(0) }, MU_EARTH).energy).toBe(0);
  });
});
