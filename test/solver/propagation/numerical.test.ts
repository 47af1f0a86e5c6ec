import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { exponentialDensity } from '../../../src/solver/propagation/atmosphere.js';
import { BODIES, type CentralBody } from '../../../src/solver/bodies/bodies.js';
import { elementsToState, stateToElements } from '../../../src/solver/conic/elements.js';
import { thirdBodyState } from '../../../src/solver/bodies/sun-moon.js';
import { celestialToIntermediate } from '../../../src/solver/earth/frames.js';
import { j2SecularRates } from '../../../src/solver/conic/j2.js';
import { DEG, TWO_PI } from '../../../src/solver/core/math.js';
import { propagateNumerical, type NumericalInput } from '../../../src/solver/propagation/numerical.js';
import type { Force } from '../../../src/solver/propagation/perturbations.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { propagateGrid } from '../../../src/solver/conic/universal.js';
import { cross, dot, norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';

const earth = BODIES.earth;
const MU = earth.gm;
const R = earth.radius!;
const EPOCH = (() => {
  const t = parseUtcIso('2026-12-01T00:00:00Z');
  if (!t.ok) throw new Error(t.message);
  return t.value;
})();

/** Invented demo orbits. */
function stateOf(a: number, e: number, iDeg: number, raan = 0.7, argp = 0.4, nu = 0.2): { r: Vec3; v: Vec3 } {
  const s = elementsToState({ semiMajorAxis: a, eccentricity: e, inclination: iDeg * DEG, raan, argPeriapsis: argp, trueAnomaly: nu }, MU);
  if (!s.ok) throw new Error(s.message);
  return { r: s.value.r, v: s.value.v };
}
const LEO = stateOf(6778, 0.001, 51.6);

const grid = (fromS: number, toS: number, stepS: number): Float64Array => {
  const n = Math.floor((toS - fromS) / stepS) + 1;
  return Float64Array.from({ length: n }, (_, i) => EPOCH + fromS + i * stepS);
};
const at = (states: Float64Array, i: number): { r: Vec3; v: Vec3 } => ({
  r: [states[6 * i]!, states[6 * i + 1]!, states[6 * i + 2]!],
  v: [states[6 * i + 3]!, states[6 * i + 4]!, states[6 * i + 5]!],
});
const semiMajorAxis = (r: Vec3, v: Vec3): number => 1 / (2 / norm(r) - dot(v, v) / MU); // vis-viva

function run(input: Partial<NumericalInput> & { epochsTT: Float64Array }): Float64Array {
  const out = propagateNumerical({ body: earth, forces: [], r0: LEO.r, v0: LEO.v, epochTT: EPOCH, ...input });
  if (!out.ok) throw new Error(`${out.code}: ${out.message}`);
  return out.value.states;
}

/** Largest position difference (km) from universal-variable propagation at the same epochs. */
function worstVsKepler(r0: Vec3, v0: Vec3, epochs: Float64Array, states: Float64Array): number {
  const ref = new Float64Array(states.length);
  const done = propagateGrid(r0, v0, MU, epochs.map((t) => t - EPOCH), ref);
  if (!done.ok) throw new Error(done.message);
  let worst = 0;
  for (let i = 0; i < epochs.length; i++) worst = Math.max(worst, norm(sub(at(states, i).r, at(ref, i).r)));
  return worst;
}

describe('propagateNumerical without forces', () => {
  it('matches universal-variable propagation (propagateGrid) to < 1 m over a day of LEO, samples on both sides of the epoch in shuffled order (independent method; Curtis 3rd ed. Alg. 3.4, from memory)', () => {
    const epochs = grid(-43_200, 43_200, 60);
    for (let i = epochs.length - 1; i > 0; i--) {
      const j = (i * 7919) % (i + 1); // a fixed shuffle
      [epochs[i], epochs[j]] = [epochs[j]!, epochs[i]!];
    }
    const states = run({ epochsTT: epochs });
    expect(worstVsKepler(LEO.r, LEO.v, epochs, states)).toBeLessThan(1e-3);
  });

  it('matches propagateGrid to < 1 m over 6 h for random bound orbits, perigee above 200 km, e up to 0.7 (fast-check; independent method)', () => {
    fc.assert(fc.property(
      fc.double({ min: 6800, max: 45_000, noNaN: true }), fc.double({ min: 0, max: 0.7, noNaN: true }), fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: 0, max: TWO_PI, noNaN: true }),
      (a, e, i, nu) => {
        fc.pre(a * (1 - e) > R + 200);
        const s = stateOf(a, e, i, 1, 2, nu);
        const epochs = grid(-3 * 3600, 3 * 3600, 300);
        const states = run({ r0: s.r, v0: s.v, epochsTT: epochs });
        expect(worstVsKepler(s.r, s.v, epochs, states)).toBeLessThan(1e-3);
      },
    ), { numRuns: 25 });
  });

  it('returns the initial state exactly at the epoch and an empty table for no epochs', () => {
    const states = run({ epochsTT: Float64Array.from([EPOCH]) });
    expect(Array.from(states)).toEqual([...LEO.r, ...LEO.v]);
    expect(run({ epochsTT: new Float64Array(0) }).length).toBe(0);
  });
});

describe('propagateNumerical with J2', () => {
  const j2Only: Force[] = [{ kind: 'j2' }];
  const tenDays = grid(0, 10 * 86_400, 600);

  it('regresses the node at the first-order secular rate of j2.ts within 1% over 10 days (Vallado 4th ed. eq. 9-41; Curtis 3rd ed. eq. 4.52; from memory)', () => {
    const states = run({ forces: j2Only, spinAxis: [0, 0, 1], epochsTT: tenDays });
    // Least-squares slope of the unwrapped RAAN against time.
    const t: number[] = [];
    const raan: number[] = [];
    for (let i = 0; i < tenDays.length; i++) {
      const el = stateToElements(at(states, i).r, at(states, i).v, MU);
      if (!el.ok) throw new Error(el.message);
      let w = el.value.raan;
      if (raan.length) w += TWO_PI * Math.round((raan[raan.length - 1]! - w) / TWO_PI);
      t.push(tenDays[i]! - EPOCH);
      raan.push(w);
    }
    const tm = t.reduce((s, x) => s + x, 0) / t.length;
    const wm = raan.reduce((s, x) => s + x, 0) / raan.length;
    const slope = t.reduce((s, x, k) => s + (x - tm) * (raan[k]! - wm), 0) / t.reduce((s, x) => s + (x - tm) ** 2, 0);
    const el0 = stateToElements(LEO.r, LEO.v, MU);
    if (!el0.ok) throw new Error(el0.message);
    const expected = j2SecularRates(el0.value.semiMajorAxis!, el0.value.eccentricity, el0.value.inclination, MU, earth.j2!, R).raanRateRadS;
    expectRelClose(slope, expected, 0.01, 'dRAAN/dt');
  });

  it('conserves the energy with the J2 potential, v^2/2 - mu/r + mu J2 R^2 (3 z^2/r^2 - 1) / (2 r^3), to 1e-9 over 10 days (a time-independent conservative force; Vallado 4th ed. sec. 8.6.1, potential from memory)', () => {
    const states = run({ forces: j2Only, spinAxis: [0, 0, 1], epochsTT: tenDays });
    const energy = (i: number): number => {
      const { r, v } = at(states, i);
      const rn = norm(r);
      return dot(v, v) / 2 - MU / rn + (MU * earth.j2! * R * R * (3 * (r[2] / rn) ** 2 - 1)) / (2 * rn ** 3);
    };
    const e0 = energy(0);
    for (let i = 0; i < tenDays.length; i++) expectRelClose(energy(i), e0, 1e-9, `energy at sample ${i}`);
  });

  it('by default turns the orbit about the Earth\'s celestial intermediate pole: h.pole is conserved to 1e-10, h.z of GCRF is not (axial symmetry; common practice, no source)', () => {
    const epochs = grid(0, 5 * 86_400, 3600);
    const states = run({ forces: j2Only, epochsTT: epochs });
    const q = celestialToIntermediate(EPOCH + 2.5 * 86_400);
    const pole: Vec3 = [q[6], q[7], q[8]];
    const h = (i: number): Vec3 => cross(at(states, i).r, at(states, i).v);
    const h0 = h(0);
    let driftPole = 0;
    let driftZ = 0;
    for (let i = 1; i < epochs.length; i++) {
      driftPole = Math.max(driftPole, Math.abs(dot(h(i), pole) - dot(h0, pole)) / norm(h0));
      driftZ = Math.max(driftZ, Math.abs(h(i)[2] - h0[2]) / norm(h0));
    }
    expect(driftPole).toBeLessThan(1e-10);
    expect(driftZ).toBeGreaterThan(1e-5);
  });
});

describe('propagateNumerical with drag', () => {
  const equatorial = stateOf(R + 300, 0, 0, 0, 0, 0);
  const a0 = R + 300;
  const period = TWO_PI * Math.sqrt(a0 ** 3 / MU);
  const B = 100;

  /** Osculating a at the start of each of `revs` revolutions and at the end. */
  function decayPerRev(body: CentralBody, revs: number): number[] {
    const epochs = Float64Array.from({ length: revs + 1 }, (_, k) => EPOCH + k * period);
    const out = propagateNumerical({ body, forces: [{ kind: 'drag', ballisticCoefficient: B }], r0: equatorial.r, v0: equatorial.v, epochTT: EPOCH, epochsTT: epochs, spinAxis: [0, 0, 1] });
    if (!out.ok) throw new Error(out.message);
    return Array.from({ length: revs + 1 }, (_, k) => semiMajorAxis(at(out.value.states, k).r, at(out.value.states, k).v));
  }

  it('lowers a circular orbit by 2 pi rho a^2 / B per revolution in a still atmosphere, within 1% (King-Hele, Satellite Orbits in an Atmosphere, 1987; Vallado 4th ed. sec. 9.6; both from memory)', () => {
    const a = decayPerRev({ ...earth, rotationRateRadS: 0, flattening: 0 }, 5);
    for (let k = 0; k < 5; k++) {
      const mid = (a[k]! + a[k + 1]!) / 2;
      const rhoPerKm = (exponentialDensity(mid - R) / B) * 1000;
      expectRelClose(a[k + 1]! - a[k]!, -TWO_PI * rhoPerKm * mid * mid, 0.01, `decay in revolution ${k + 1} (km)`);
    }
  });

  it('lowers it by 2 pi rho a^2 / B (1 - omega a / v)^2 in the co-rotating atmosphere, within 1% (the same with v_rel = v - omega a for a prograde equatorial orbit; Gauss\'s equation da/dt = 2 a^2 v a_T / mu, Vallado 4th ed. sec. 9.3, from memory)', () => {
    const a = decayPerRev({ ...earth, flattening: 0 }, 5);
    for (let k = 0; k < 5; k++) {
      const mid = (a[k]! + a[k + 1]!) / 2;
      const rhoPerKm = (exponentialDensity(mid - R) / B) * 1000;
      const factor = (1 - (earth.rotationRateRadS! * mid) / Math.sqrt(MU / mid)) ** 2;
      expectRelClose(a[k + 1]! - a[k]!, -TWO_PI * rhoPerKm * mid * mid * factor, 0.01, `decay in revolution ${k + 1} (km)`);
    }
  });

  it('with J2 as well, the orbit-averaged semi-major axis falls every revolution over two days (common practice, no source)', () => {
    const s = stateOf(R + 350, 0.002, 51.6);
    const n = Math.floor(2 * 86_400 / 30);
    const epochs = Float64Array.from({ length: n }, (_, i) => EPOCH + i * 30);
    const states = run({ r0: s.r, v0: s.v, forces: [{ kind: 'j2' }, { kind: 'drag', ballisticCoefficient: 50 }], epochsTT: epochs });
    const perRev = Math.round(TWO_PI * Math.sqrt((R + 350) ** 3 / MU) / 30);
    const means: number[] = [];
    for (let k = 0; (k + 1) * perRev <= n; k++) {
      let sum = 0;
      for (let i = k * perRev; i < (k + 1) * perRev; i++) sum += semiMajorAxis(at(states, i).r, at(states, i).v);
      means.push(sum / perRev);
    }
    expect(means.length).toBeGreaterThan(25);
    for (let k = 1; k < means.length; k++) expect(means[k]!, `mean a in revolution ${k + 1}`).toBeLessThan(means[k - 1]!);
  });
});

describe('propagateNumerical with the Sun and the Moon', () => {
  it('matches a fixed-step RK4 integration of the direct form (Montenbruck & Gill 2000 eq. 3.37) with uncached ephemeris to < 1 m over a day at GEO (classical RK4, Burden & Faires 9th ed. sec. 5.4, from memory; independent method, no cache)', () => {
    const geo = stateOf(42_164, 0.0002, 0.05, 1, 1, 1);
    const forces: Force[] = [{ kind: 'third-body', body: 'sun' }, { kind: 'third-body', body: 'moon' }];
    const states = run({ r0: geo.r, v0: geo.v, forces, epochsTT: Float64Array.from([EPOCH + 86_400]) });
    const accel = (t: number, r: Vec3): Vec3 => {
      const a: [number, number, number] = [0, 0, 0];
      const add = (v: Vec3, k: number): void => { a[0] += k * v[0]; a[1] += k * v[1]; a[2] += k * v[2]; };
      add(r, -MU / norm(r) ** 3);
      for (const body of ['sun', 'moon'] as const) {
        const s = thirdBodyState(body, EPOCH + t).r;
        const d = sub(s, r);
        add(d, BODIES[body].gm / norm(d) ** 3);
        add(s, -BODIES[body].gm / norm(s) ** 3);
      }
      return a;
    };
    const f = (t: number, y: number[]): number[] => [y[3]!, y[4]!, y[5]!, ...accel(t, [y[0]!, y[1]!, y[2]!])];
    let y = [...geo.r, ...geo.v];
    const h = 60;
    for (let t = 0; t < 86_400; t += h) {
      const k1 = f(t, y);
      const k2 = f(t + h / 2, y.map((x, i) => x + (h / 2) * k1[i]!));
      const k3 = f(t + h / 2, y.map((x, i) => x + (h / 2) * k2[i]!));
      const k4 = f(t + h, y.map((x, i) => x + h * k3[i]!));
      y = y.map((x, i) => x + (h / 6) * (k1[i]! + 2 * k2[i]! + 2 * k3[i]! + k4[i]!));
    }
    expect(norm(sub(at(states, 0).r, [y[0]!, y[1]!, y[2]!]))).toBeLessThan(1e-3);
  });

  it('comes back to its initial state (< 1 m) when a day of LEO with J2, drag, Sun, Moon and SRP is run forwards and then backwards (round trip)', () => {
    const forces: Force[] = [{ kind: 'j2' }, { kind: 'drag', ballisticCoefficient: 60 }, { kind: 'third-body', body: 'sun' }, { kind: 'third-body', body: 'moon' }, { kind: 'srp', areaToMass: 0.015, reflectivity: 0.4 }];
    const there = run({ forces, epochsTT: Float64Array.from([EPOCH + 86_400]) });
    const end = at(there, 0);
    const back = propagateNumerical({ body: earth, forces, r0: end.r, v0: end.v, epochTT: EPOCH + 86_400, epochsTT: Float64Array.from([EPOCH]) });
    if (!back.ok) throw new Error(back.message);
    expect(norm(sub(at(back.value.states, 0).r, LEO.r))).toBeLessThan(1e-3);
  });
});

describe('propagateNumerical failures', () => {
  // A ballistic arc from 100 km: up, then down into the ground.
  const arc = { r0: [R + 100, 0, 0] as Vec3, v0: [2.0, 3.0, 0] as Vec3 };
  /** Time from the epoch where the Kepler arc first reaches radius R going one way: a 10 s scan, then bisection on propagateGrid (independent method). */
  function keplerCrossing(direction: 1 | -1): number {
    const radiusAt = (dt: number): number => {
      const out = new Float64Array(6);
      const done = propagateGrid(arc.r0, arc.v0, MU, Float64Array.from([dt]), out);
      if (!done.ok) throw new Error(done.message);
      return Math.hypot(out[0]!, out[1]!, out[2]!);
    };
    let above = 0;
    while (radiusAt(above + 10 * direction) >= R) above += 10 * direction;
    let below = above + 10 * direction;
    for (let i = 0; i < 60; i++) {
      const mid = (above + below) / 2;
      if (radiusAt(mid) < R) below = mid;
      else above = mid;
    }
    return (above + below) / 2;
  }
  const impactSeconds = (message: string): number => Number(/([-\d.]+) s from the epoch/.exec(message)?.[1]);

  it('reports an impact with its time, within 0.01 s of the Kepler arc\'s crossing, forwards and backwards', () => {
    const forwards = propagateNumerical({ body: earth, forces: [], ...arc, epochTT: EPOCH, epochsTT: grid(0, 3600, 60) });
    expect(forwards.ok).toBe(false);
    if (forwards.ok) return;
    expect(forwards.code).toBe('impact');
    expect(forwards.message).toMatch(/2026-12-01T\d\d:\d\d:\d\d/);
    expectClose(impactSeconds(forwards.message), keplerCrossing(1), 0.01, 'impact time forwards (s)');
    // One far sample: the fall is seen at a step end instead of at a sample.
    const sparse = propagateNumerical({ body: earth, forces: [], ...arc, epochTT: EPOCH, epochsTT: Float64Array.from([EPOCH + 7200]) });
    expect(!sparse.ok && sparse.code).toBe('impact');
    if (sparse.ok) return;
    expectClose(impactSeconds(sparse.message), keplerCrossing(1), 0.01, 'impact time, one sample (s)');

    const backwards = propagateNumerical({ body: earth, forces: [], ...arc, epochTT: EPOCH, epochsTT: grid(-3600, 0, 60) });
    expect(!backwards.ok && backwards.code).toBe('impact');
    if (backwards.ok) return;
    expectClose(impactSeconds(backwards.message), keplerCrossing(-1), 0.01, 'impact time backwards (s)');
  });

  it('propagates through the body when passThroughBody is set, and refuses that with drag', () => {
    const through = propagateNumerical({ body: earth, forces: [], ...arc, epochTT: EPOCH, epochsTT: grid(0, 1800, 60), passThroughBody: true });
    expect(through.ok).toBe(true);
    const withDrag = propagateNumerical({ body: earth, forces: [{ kind: 'drag', ballisticCoefficient: 50 }], ...arc, epochTT: EPOCH, epochsTT: grid(0, 60, 60), passThroughBody: true });
    expect(!withDrag.ok && withDrag.code).toBe('invalid-parameter');
  });

  it('reports the re-entry of a decaying orbit as an impact', () => {
    const low = stateOf(R + 140, 0, 30);
    const out = propagateNumerical({ body: earth, forces: [{ kind: 'drag', ballisticCoefficient: 20 }], r0: low.r, v0: low.v, epochTT: EPOCH, epochsTT: grid(0, 86_400, 600) });
    expect(!out.ok && out.code).toBe('impact');
  });

  it('stops at the step budget with integration-failed instead of running on', () => {
    const out = propagateNumerical({ body: earth, forces: [], r0: LEO.r, v0: LEO.v, epochTT: EPOCH, epochsTT: grid(-86_400, 86_400, 600), maxSteps: 40 });
    expect(!out.ok && out.code).toBe('integration-failed');
    expect(!out.ok && out.message).toMatch(/step limit/);
  });

  it('ends a fall into the centre (passThroughBody) with integration-failed, not a hang', () => {
    const out = propagateNumerical({ body: earth, forces: [], r0: [7000, 0, 0], v0: [0, 0, 0], epochTT: EPOCH, epochsTT: grid(0, 3600, 60), passThroughBody: true });
    expect(!out.ok && out.code).toBe('integration-failed');
  });

  it('refuses forces the body cannot carry and malformed input with invalid-parameter', () => {
    const base = { r0: LEO.r, v0: LEO.v, epochTT: EPOCH, epochsTT: grid(0, 60, 60) };
    const noJ2: CentralBody = { name: 'custom', gm: MU, radius: R, sources: {} };
    const cases: Array<[NumericalInput, RegExp]> = [
      [{ body: noJ2, forces: [{ kind: 'j2' }], ...base }, /j2/],
      [{ body: BODIES.mars, forces: [{ kind: 'third-body', body: 'sun' }], ...base }, /Earth-centred/],
      [{ body: earth, forces: [], ...base, epochsTT: Float64Array.from([NaN]) }, /not finite/],
      [{ body: earth, forces: [], ...base, maxSteps: 0 }, /maxSteps/],
      [{ body: earth, forces: [], ...base, spinAxis: [0, 0, 0] }, /spinAxis/],
    ];
    for (const [input, text] of cases) {
      const out = propagateNumerical(input);
      expect(!out.ok && out.code).toBe('invalid-parameter');
      expect(!out.ok && out.message).toMatch(text);
    }
  });

  it('refuses a start below the surface as an impact', () => {
    const out = propagateNumerical({ body: earth, forces: [], r0: [6000, 0, 0], v0: [0, 8, 0], epochTT: EPOCH, epochsTT: grid(0, 60, 60) });
    expect(!out.ok && out.code).toBe('impact');
  });
});
